// The queue: every request the signed-in person may see, with filters, search and paging;
// each row says when the request is next observable at the chosen site and, when the draft plan
// leaves it out, the planner's reason.
import {
  addDays, all, api, apiIfPresent, ApiError, CALENDAR_PATH, clear, el, exists, field, isReviewer, priorityLabel, repeatsText, say, session, siteClock, siteToday, timeEl,
} from '../api.js';

const STATES = ['draft', 'submitted', 'accepted', 'rejected', 'withdrawn'];
const PAGE_SIZE = 20;
const LOOKAHEAD_NIGHTS = 60;

export async function render(main) {
  const [programs, sites] = await Promise.all([all('/api/programs', { sort: 'code' }), all('/api/sites', { sort: 'name' })]);
  const programName = id => (programs.find(p => p.id === id) || {}).code || `#${id}`;
  const f = {
    programId: el('select', { name: 'programId' }, el('option', { value: '' }, 'all'), programs.map(p => el('option', { value: p.id }, p.code))),
    state: el('select', { name: 'state' }, el('option', { value: '' }, 'all'), STATES.map(s => el('option', { value: s }, s))),
    priority: el('select', { name: 'priority' }, el('option', { value: '' }, 'all'), [5, 4, 3, 2, 1].map(p => el('option', { value: p }, priorityLabel(p)))),
    site: el('select', { name: 'site' }, sites.map(s => el('option', { value: s.id }, s.name))),
    target: el('input', { name: 'target', type: 'search', placeholder: 'target name contains' }),
  };
  const table = el('div', { class: 'scroll' });
  const pager = el('div', { class: 'pager' });
  const note = el('p', { class: 'muted', 'aria-live': 'polite' });
  let page = 0;

  const filters = el('form', { class: 'row card', role: 'search' },
    field('Program', f.programId), field('Status', f.state), field('Priority', f.priority),
    field('Site (for “next observable”)', f.site), field('Search', f.target),
    el('button', { type: 'submit' }, 'Apply'));
  filters.addEventListener('submit', e => { e.preventDefault(); page = 0; load(); });
  for (const s of [f.programId, f.state, f.priority, f.site]) s.addEventListener('change', () => { page = 0; load(); });

  const calendar = el('p', { id: 'calendar-link' });
  clear(main, el('h1', {}, 'Queue'), calendar, filters, note, table, pager);
  exists(CALENDAR_PATH).then(ok => clear(calendar, ok
    ? el('a', { href: CALENDAR_PATH, download: 'skyrota-visits.ics' }, 'Your published visits as a calendar (iCalendar)')
    : el('span', { class: 'not-yet' }, 'A calendar feed of your visits: not available yet on this server.')));

  async function load() {
    const result = await api('/api/requests', { query: {
      page, size: PAGE_SIZE, sort: 'createdAt,desc', programId: f.programId.value, state: f.state.value,
      target: f.target.value.trim(), priority: f.priority.value,
    } });
    const items = result.items;
    note.textContent = '';
    const site = sites.find(s => String(s.id) === f.site.value);
    const rows = items.map(r => row(r, programName, site, load));
    clear(table, items.length === 0 ? el('p', {}, 'No requests match.') : el('table', { class: 'stack', id: 'queue-table' },
      el('thead', {}, el('tr', {}, ['Target', 'Program', 'Owner', 'Status', 'Priority', 'Nights', 'Next observable', 'Plan (latest draft)', ''].map(h => el('th', {}, h)))),
      el('tbody', {}, rows)));
    clear(pager,
      el('button', { type: 'button', class: 'secondary', disabled: page === 0, onclick: () => { page--; load(); } }, 'Previous'),
      el('span', {}, `Page ${result.totalPages ? page + 1 : 0} of ${result.totalPages} (${result.totalItems} requests)`),
      el('button', { type: 'button', class: 'secondary', disabled: page + 1 >= result.totalPages, onclick: () => { page++; load(); } }, 'Next'));
  }
  await load();
}

function row(r, programName, site, reload) {
  const next = el('td', { 'data-label': 'Next observable', class: 'next' }, site ? '…' : 'no site');
  if (site) nextObservable(r, site).then(w => clear(next, w ? timeEl(w.start, siteClock(site), true) : el('span', { class: 'muted' }, `not in the next ${LOOKAHEAD_NIGHTS} nights`)))
    .catch(e => clear(next, el('span', { class: 'error' }, e.message)));
  const reason = el('td', { 'data-label': 'Plan (latest draft)', class: 'plan-status' },
    r.state === 'accepted' ? '…' : el('span', { class: 'muted' }, '—'));
  if (r.state === 'accepted') planStatus(r).then(text => clear(reason, text)).catch(e => clear(reason, el('span', { class: 'error' }, e.message)));
  return el('tr', { dataset: { id: r.id } },
    el('td', { 'data-label': 'Target', class: 'target' }, r.targetName),
    el('td', { 'data-label': 'Program' }, programName(r.programId)),
    el('td', { 'data-label': 'Owner' }, r.owner),
    el('td', { 'data-label': 'Status' }, el('span', { class: `state state-${r.state}` }, r.state),
      r.rejectionReason ? el('div', { class: 'muted' }, r.rejectionReason) : null),
    el('td', { 'data-label': 'Priority', class: 'num priority' }, priorityLabel(r.priority)),
    el('td', { 'data-label': 'Nights', class: 'nights' }, `${r.earliestNight || 'any'} – ${r.latestNight || 'any'}, ${repeatsText(r)}`),
    next,
    reason,
    el('td', { 'data-label': 'Actions' }, actions(r, reload)));
}

/** Where the latest draft has the request: its placed nights, or the planner's reasons. */
async function planStatus(r) {
  const status = await apiIfPresent(`/api/requests/${r.id}/plan-status`);
  if (!status) return el('span', { class: 'not-yet' }, 'not available yet');
  if (status.draftRevision == null) return el('span', { class: 'muted' }, 'no draft plan yet');
  const placed = status.visits.filter(v => v.status === 'placed' || v.status === 'pinned');
  const observed = status.visits.filter(v => v.status === 'observed');
  const reasons = [...new Set(status.visits.filter(v => v.status === 'unplaced').map(v => v.reason || 'not placed'))];
  return [placed.length ? el('div', { class: 'muted' }, `planned: ${placed.map(v => v.night).join(', ')}`) : null,
    observed.length ? el('div', { class: 'muted' }, `observed: ${observed.length}`) : null,
    reasons.map(t => el('div', {}, t))];
}

async function nextObservable(r, site) {
  const clock = siteClock(site);
  const today = siteToday(clock, -1);
  const from = r.earliestNight && r.earliestNight > today ? r.earliestNight : today;
  let to = addDays(from, LOOKAHEAD_NIGHTS - 1);
  if (r.latestNight && r.latestNight < to) to = r.latestNight;
  if (to < from) return null;
  // A moving target (a plugin's kind) is asked for by its kind and parameters, a fixed one by its position.
  const target = r.targetKind && r.targetKind !== 'fixed'
    ? { targetKind: r.targetKind, ...Object.fromEntries(Object.entries(r.targetParameters || {}).map(([n, v]) => [`targetParameters.${n}`, v])) }
    : { ra: r.raDeg, dec: r.decDeg };
  const answer = await api('/api/visibility', { query: {
    ...target, lat: site.latitudeDeg, lon: site.longitudeDeg, elevation: site.elevationM, tz: site.timeZone,
    from, to, minAltitude: r.minAltitudeDeg, darkness: r.darkness, minMoonSeparation: r.minMoonSeparationDeg,
    maxMoonIllumination: r.maxMoonIllumination,
  } });
  const now = Date.now();
  return answer.windows.find(w => Date.parse(w.end) > now) || null;
}

function actions(r, reload) {
  const mine = !session.auth || (session.user && session.user.username === r.owner);
  const act = (label, verb, body) => el('button', { type: 'button', class: 'secondary', dataset: { action: verb },
    onclick: async () => {
      try {
        const b = typeof body === 'function' ? body() : body;
        if (b === false) return;
        await api(`/api/requests/${r.id}/${verb}`, { method: 'POST', query: { version: r.version }, body: b });
        say(`${r.targetName}: ${verb} done.`, 'ok');
        await reload();
      } catch (e) {
        say(e instanceof ApiError && e.status === 409 ? `${r.targetName}: changed meanwhile, reloaded (${e.message}).` : e.message, 'error');
        await reload();
      }
    } }, label);
  const buttons = [];
  if (mine && r.state === 'draft') buttons.push(act('Submit', 'submit'));
  if (isReviewer() && r.state === 'submitted') {
    buttons.push(act('Accept', 'accept'));
    buttons.push(act('Reject', 'reject', () => {
      const reason = prompt(`Why is “${r.targetName}” rejected?`);
      return reason === null ? false : { reason };
    }));
  }
  if (mine && ['draft', 'submitted', 'accepted'].includes(r.state)) buttons.push(act('Withdraw', 'withdraw'));
  if (mine && r.state === 'rejected') buttons.push(act('Reopen', 'reopen'));
  return el('div', { class: 'actions' }, buttons);
}
