// Plan review (coordinators): nights × telescopes across the horizon, a visit's details and
// altitude chart, pin / unpin / move / unplace, lock or close a night, planner runs with progress
// from server-sent events, the draft compared with the published plan, and publishing.
// Built on the plan endpoints proposed to the server (see the dashboard's report); while they are
// absent the view says so.
import uPlot from '/webjars/uplot/dist/uPlot.esm.js';
import {
  addDays, all, api, apiIfPresent, ApiError, clear, el, ensureCsrf, field, isReviewer, loadPlan, localTime, notYet, say,
  siteClock, siteToday, timeEl, utcText,
} from '../api.js';
import { altitudeDeg, moonAltitudeDeg } from '../sky-sketch.js';

const MAX_NIGHTS = 30;

export async function render(main) {
  const [sites, telescopes] = await Promise.all([all('/api/sites', { sort: 'name' }), all('/api/telescopes', { sort: 'name' })]);
  const from = el('input', { type: 'date', name: 'from', value: siteToday(siteClock(sites[0] || null)) });
  const nights = el('input', { type: 'number', name: 'nights', min: 1, max: MAX_NIGHTS, value: 7 });
  const gridBox = el('div', { class: 'scroll', id: 'plan-grid-box' });
  const details = el('section', { class: 'card', id: 'visit-details', 'aria-live': 'polite' }, el('p', { class: 'muted' }, 'Select a visit to see its details.'));
  const runBox = el('section', { class: 'card', id: 'planner-run' });
  const compareBox = el('section', { class: 'card', id: 'plan-compare' });
  const controls = el('form', { class: 'row card' }, field('First night', from), field('Nights', nights),
    el('button', { type: 'submit' }, 'Show'));
  controls.addEventListener('submit', e => { e.preventDefault(); load(); });
  clear(main, el('h1', {}, 'Plan review'),
    isReviewer() ? null : el('p', { class: 'muted' }, 'Only coordinators and admins can change the plan.'),
    controls, runBox, gridBox, details, compareBox);

  const ctx = { sites, telescopes, gridBox, details, runBox, compareBox, reload: load };
  async function load() {
    const f = from.value, n = Math.min(MAX_NIGHTS, Math.max(1, Number(nights.value) || 7));
    const t = addDays(f, n - 1);
    const started = performance.now();
    const [draft, published] = await Promise.all([loadPlan('draft', f, t), loadPlan('published', f, t).catch(() => null)]);
    if (!draft) {
      clear(gridBox, notYet('The draft plan'));
      ctx.details.hidden = true;
      clear(runBox, el('h2', {}, 'Planner run'), notYet('Planner runs'));
      clear(compareBox, el('h2', {}, 'Draft and published plan'), notYet('The published plan'));
      return;
    }
    ctx.details.hidden = false;
    showPlan(ctx, draft, published, f, n);
    window.__planRenderMs = performance.now() - started;
  }
  await load();
}

/** Draws everything from plan documents; exported so the browser test can time the grid alone. */
export function showPlan(ctx, draft, published, firstNight, nightCount) {
  const { gridBox, runBox, compareBox } = ctx;
  clear(gridBox, grid(ctx, draft, firstNight, nightCount));
  clear(runBox, runPanel(ctx, draft));
  clear(compareBox, compare(ctx, draft, published));
  gridBox.dataset.ready = String(draft.visits.length);
}

function grid(ctx, draft, firstNight, nightCount) {
  const { telescopes, sites } = ctx;
  const siteOf = t => sites.find(s => s.id === t.siteId);
  const cells = new Map();
  for (const v of draft.visits) {
    const key = v.night + '|' + v.telescopeId;
    if (!cells.has(key)) cells.set(key, []);
    cells.get(key).push(v);
  }
  const closed = new Map((draft.closedNights || []).map(c => [c.night + '|' + c.telescopeId, c.state || 'closed']));
  const head = el('tr', {}, el('th', { scope: 'col' }, 'Night'),
    telescopes.map(t => el('th', { scope: 'col' }, t.name, el('div', { class: 'muted' }, (siteOf(t) || {}).name || ''))));
  const body = document.createDocumentFragment();
  for (let i = 0; i < nightCount; i++) {
    const night = addDays(firstNight, i);
    const tr = el('tr', {}, el('th', { scope: 'row' }, night));
    for (const t of telescopes) {
      const key = night + '|' + t.id;
      const state = closed.get(key);
      const visits = (cells.get(key) || []).sort((a, b) => a.start.localeCompare(b.start));
      const clock = siteClock(siteOf(t));
      const td = el('td', { class: state === 'closed' ? 'closed' : null, dataset: { night, telescope: t.id } },
        state ? el('div', { class: 'muted' }, state) : null,
        visits.map(v => el('button', { type: 'button', class: 'cell-visit' + (v.pinned ? ' pinned' : ''), title: `${utcText(v.start)} – ${utcText(v.end)}`,
          dataset: { visit: v.id }, onclick: () => showVisit(ctx, v, draft) },
          `${localTime(v.start, clock)} ${v.targetName}${v.pinned ? ' (pinned)' : ''}`)),
        isReviewer() ? nightMenu(ctx, t, night, state) : null);
      tr.append(td);
    }
    body.append(tr);
  }
  return el('table', { class: 'plan-grid', id: 'plan-grid' }, el('caption', { class: 'muted' },
    `Draft revision ${draft.revision ?? '—'}: ${draft.visits.length} visits; ${(draft.unplaced || []).length} not placed.`),
  el('thead', {}, head), el('tbody', {}, body));
}

function nightMenu(ctx, telescope, night, state) {
  const sel = el('select', { 'aria-label': `Night ${night} on ${telescope.name}`, class: 'night-state' },
    ['open', 'locked', 'closed'].map(s => el('option', { value: s, selected: (state || 'open') === s }, s)));
  sel.addEventListener('change', () => act(ctx, '/api/plans/draft/nights', { method: 'PUT', body: { telescopeId: telescope.id, night, state: sel.value } },
    `${telescope.name}, night ${night}: ${sel.value}.`));
  return sel;
}

async function act(ctx, path, options, done) {
  try {
    await api(path, options);
    say(done, 'ok');
    await ctx.reload();
  } catch (e) {
    say(e instanceof ApiError && e.status === 404 ? 'This change is not available yet on this server.' : e.message, 'error');
  }
}

async function showVisit(ctx, v, draft) {
  const { details, telescopes, sites } = ctx;
  const t = telescopes.find(x => x.id === v.telescopeId);
  const site = sites.find(s => t && s.id === t.siteId);
  const clock = siteClock(site);
  const chartBox = el('div', { class: 'chart', role: 'img', 'aria-label': `Altitude of ${v.targetName} on the night of ${v.night}; numbers on hover` });
  const candidates = el('div', {}, el('p', { class: 'muted' }, 'Loading the candidate placements…'));
  clear(details, el('h2', {}, v.targetName),
    el('dl', {},
      el('dt', {}, 'Telescope'), el('dd', {}, t ? t.name : `#${v.telescopeId}`),
      el('dt', {}, 'Night'), el('dd', {}, v.night),
      el('dt', {}, 'Start – end'), el('dd', {}, timeEl(v.start, clock), ' – ', timeEl(v.end, clock), ` (${clock.label})`),
      el('dt', {}, 'Request'), el('dd', {}, `#${v.requestId}${v.owner ? ', ' + v.owner : ''}`),
      el('dt', {}, 'Pinned'), el('dd', {}, v.pinned ? 'yes' : 'no')),
    isReviewer() ? el('div', { class: 'actions' },
      el('button', { type: 'button', onclick: () => act(ctx, `/api/visits/${v.id}/${v.pinned ? 'unpin' : 'pin'}`, { method: 'POST' },
        `${v.targetName} ${v.pinned ? 'unpinned' : 'pinned'}.`) }, v.pinned ? 'Unpin' : 'Pin'),
      el('button', { type: 'button', class: 'secondary', onclick: () => act(ctx, `/api/visits/${v.id}/unplace`, { method: 'POST' },
        `${v.targetName} taken out of the plan.`) }, 'Unplace')) : null,
    chartBox, el('h3', {}, 'Other placements'), candidates);
  if (site) drawVisitChart(chartBox, v, site, clock);
  const list = await apiIfPresent(`/api/visits/${v.id}/candidates`).catch(() => null);
  if (!list) { clear(candidates, notYet('Candidate placements')); return; }
  clear(candidates, el('table', { class: 'stack' },
    el('thead', {}, el('tr', {}, ['Telescope', 'Start', 'Score change', ''].map(h => el('th', {}, h)))),
    el('tbody', {}, list.map(c => {
      const ct = telescopes.find(x => x.id === c.telescopeId);
      const cs = sites.find(s => ct && s.id === ct.siteId);
      return el('tr', {}, el('td', {}, ct ? ct.name : `#${c.telescopeId}`), el('td', {}, timeEl(c.start, siteClock(cs), true)),
        el('td', { class: 'num' }, c.scoreDelta > 0 ? `+${c.scoreDelta}` : String(c.scoreDelta)),
        el('td', {}, isReviewer() ? el('button', { type: 'button', class: 'secondary', onclick: () => act(ctx, `/api/visits/${v.id}/move`,
          { method: 'POST', body: { telescopeId: c.telescopeId, start: c.start } }, `${v.targetName} moved.`) }, 'Move here') : null));
    }))));
}

function drawVisitChart(box, v, site, clock) {
  const mid = (Date.parse(v.start) + Date.parse(v.end)) / 2;
  const xs = [], target = [], moon = [];
  for (let t = mid - 6 * 3600e3; t <= mid + 6 * 3600e3; t += 10 * 60e3) {
    xs.push(t / 1000);
    target.push(altitudeDeg(v.raDeg, v.decDeg, site.latitudeDeg, site.longitudeDeg, t));
    moon.push(moonAltitudeDeg(site.latitudeDeg, site.longitudeDeg, t));
  }
  const fmt = (u, x) => x == null ? '—' : x.toFixed(1) + '°';
  new uPlot({
    width: Math.max(260, box.clientWidth || 480), height: 200,
    series: [{ label: clock.label, value: (u, t) => t == null ? '—' : localTime(new Date(t * 1e3).toISOString(), clock) }, { label: v.targetName, stroke: '#1f5f6b', width: 2, value: fmt }, { label: 'Moon', stroke: '#8a8f98', dash: [6, 4], value: fmt }],
    scales: { y: { range: [-10, 90] } },
    tzDate: ts => uPlot.tzDate(new Date(ts * 1e3 + clock.offsetMs), clock.zone),
    axes: [{ values: (u, ticks) => ticks.map(t => localTime(new Date(t * 1e3).toISOString(), clock)) }, {}],
    hooks: { drawClear: [u => {
      const x0 = u.valToPos(Date.parse(v.start) / 1000, 'x', true), x1 = u.valToPos(Date.parse(v.end) / 1000, 'x', true);
      u.ctx.fillStyle = 'rgba(31, 95, 107, 0.18)';
      u.ctx.fillRect(x0, u.bbox.top, x1 - x0, u.bbox.height);
    }] },
  }, [xs, target, moon], box);
}

function runPanel(ctx, draft) {
  const bar = el('progress', { max: 1, value: 0, id: 'run-progress', 'aria-label': 'Planner progress' });
  const text = el('p', { id: 'run-text', 'aria-live': 'polite' }, 'No run in progress.');
  const start = el('button', { type: 'button', id: 'run-start', disabled: !isReviewer() }, 'Run the planner');
  const cancel = el('button', { type: 'button', class: 'secondary', id: 'run-cancel', disabled: true }, 'Cancel the run');
  const publish = el('button', { type: 'button', id: 'publish', disabled: !isReviewer() }, 'Publish the draft');
  let run = null, events = null;
  start.addEventListener('click', async () => {
    try {
      run = await api('/api/planner/runs', { method: 'POST', body: { firstNight: draft.firstNight, lastNight: draft.lastNight } });
    } catch (e) {
      text.textContent = e instanceof ApiError && e.status === 404 ? 'Planner runs are not available yet on this server.' : e.message;
      return;
    }
    start.disabled = true; cancel.disabled = false;
    text.textContent = 'Run started.';
    events = new EventSource(`/api/planner/runs/${run.id}/events`, { withCredentials: true });
    const finish = async message => {
      events.close(); start.disabled = false; cancel.disabled = true;
      text.textContent = message;
      await ctx.reload();
      say(message, 'ok');
    };
    events.addEventListener('progress', e => {
      const p = JSON.parse(e.data);
      bar.value = p.fraction;
      text.textContent = `${Math.round(p.fraction * 100)} % — best score ${p.score ?? '—'}`;
    });
    events.addEventListener('done', e => { const p = JSON.parse(e.data); finish(`Run ${p.state}: score ${p.score ?? '—'}.`); });
    events.onerror = () => { if (events.readyState === EventSource.CLOSED) finish('The progress stream closed.'); };
  });
  cancel.addEventListener('click', async () => {
    if (run) await act(ctx, `/api/planner/runs/${run.id}`, { method: 'DELETE' }, 'Run cancelled.');
  });
  publish.addEventListener('click', () => act(ctx, '/api/plans/draft/publish', { method: 'POST', query: { revision: draft.revision } },
    `Draft revision ${draft.revision} published.`));
  return [el('h2', {}, 'Planner run'), el('div', { class: 'actions' }, start, cancel, publish), bar, text];
}

function compare(ctx, draft, published) {
  if (!published) return [el('h2', {}, 'Draft and published plan'), el('p', { class: 'muted' }, 'Nothing published for these nights yet.')];
  const before = new Map(published.visits.map(v => [v.id, v]));
  const after = new Map(draft.visits.map(v => [v.id, v]));
  const changes = [];
  for (const v of draft.visits) {
    const old = before.get(v.id);
    if (!old) changes.push(['added', v, null]);
    else if (old.start !== v.start || old.telescopeId !== v.telescopeId) changes.push(['moved', v, old]);
  }
  for (const v of published.visits) if (!after.has(v.id)) changes.push(['removed', v, null]);
  const tname = id => (ctx.telescopes.find(t => t.id === id) || {}).name || `#${id}`;
  return [el('h2', {}, `Draft and published plan (revision ${published.revision ?? '—'})`),
    changes.length === 0 ? el('p', {}, 'The draft equals the published plan.') : el('table', { class: 'stack', id: 'compare-table' },
      el('thead', {}, el('tr', {}, ['Change', 'Target', 'Published', 'Draft'].map(h => el('th', {}, h)))),
      el('tbody', {}, changes.map(([kind, v, old]) => el('tr', {}, el('td', {}, kind), el('td', {}, v.targetName),
        el('td', {}, kind === 'added' ? '—' : `${tname((old || v).telescopeId)} ${utcText((old || v).start)}`),
        el('td', {}, kind === 'removed' ? '—' : `${tname(v.telescopeId)} ${utcText(v.start)}`)))))];
}
