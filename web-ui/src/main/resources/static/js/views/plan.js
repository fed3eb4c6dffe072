// Plan review (coordinators): nights × telescopes across the horizon, a visit's details and
// altitude chart, pin / unpin / move (with the score effect of a dry run first) / unplace, lock
// or close a night, planner runs with progress from server-sent events, cancel, the draft
// compared with the published plan, and publishing.
import uPlot from '/webjars/uplot/dist/uPlot.esm.js';
import {
  addDays, all, api, apiIfPresent, ApiError, clear, el, field, isReviewer, loadPlan, localTime, notYet, say,
  siteClock, siteToday, siteWallToUtc, timeEl, utcText,
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

  const ctx = { sites, telescopes, gridBox, details, runBox, compareBox, reload: load, lastRun: null };
  async function load() {
    const f = from.value, n = Math.min(MAX_NIGHTS, Math.max(1, Number(nights.value) || 7));
    const t = addDays(f, n - 1);
    const started = performance.now();
    const [draft, comparison] = await Promise.all([loadPlan('draft', f, t),
      apiIfPresent('/api/plans/compare', { query: { from: f, to: t } }).catch(() => null)]);
    if (!draft) {
      clear(gridBox, notYet('The draft plan'));
      details.hidden = true;
      clear(runBox, el('h2', {}, 'Planner run'), notYet('Planner runs'));
      clear(compareBox, el('h2', {}, 'Draft and published plan'), notYet('The published plan'));
      return;
    }
    details.hidden = false;
    ctx.draft = draft;
    showPlan(ctx, draft, comparison, f, n);
    window.__planRenderMs = performance.now() - started;
    // keep the selected visit's details in step with the new draft
    const again = ctx.selected && draft.visits.find(v => v.id === ctx.selected);
    if (again) await showVisit(ctx, again);
    else if (ctx.selected) clear(details, el('p', { class: 'muted' }, 'The selected visit is no longer placed in this draft.'));
  }
  await load();
}

/** Draws everything from the plan documents; exported so the browser test can time the grid alone. */
export function showPlan(ctx, draft, comparison, firstNight, nightCount) {
  ctx.draft = draft;
  clear(ctx.gridBox, grid(ctx, draft, firstNight, nightCount));
  clear(ctx.runBox, runPanel(ctx, draft, firstNight, addDays(firstNight, nightCount - 1)));
  clear(ctx.compareBox, compare(ctx, comparison));
  ctx.gridBox.dataset.ready = String(draft.visits.length);
}

const siteOfTelescope = (ctx, t) => ctx.sites.find(s => t && s.id === t.siteId);

function grid(ctx, draft, firstNight, nightCount) {
  const { telescopes } = ctx;
  const cells = new Map();
  for (const v of draft.visits) {
    const key = v.night + '|' + v.telescopeId;
    if (!cells.has(key)) cells.set(key, []);
    cells.get(key).push(v);
  }
  const closed = new Map((draft.closedNights || []).map(c => [c.night + '|' + c.telescopeId, c]));
  const head = el('tr', {}, el('th', { scope: 'col' }, 'Night'),
    telescopes.map(t => el('th', { scope: 'col' }, t.name, el('div', { class: 'muted' }, (siteOfTelescope(ctx, t) || {}).name || ''))));
  const body = document.createDocumentFragment();
  for (let i = 0; i < nightCount; i++) {
    const night = addDays(firstNight, i);
    const tr = el('tr', {}, el('th', { scope: 'row' }, night));
    for (const t of telescopes) {
      const key = night + '|' + t.id;
      const mark = closed.get(key);
      const visits = (cells.get(key) || []).sort((a, b) => a.start.localeCompare(b.start));
      const clock = siteClock(siteOfTelescope(ctx, t));
      tr.append(el('td', { class: mark && mark.state === 'closed' ? 'closed' : null, dataset: { night, telescope: t.id } },
        mark ? el('div', { class: 'muted' }, mark.state + (mark.reason ? `: ${mark.reason}` : '')) : null,
        visits.map(v => el('button', { type: 'button', class: 'cell-visit' + (v.pinned ? ' pinned' : ''), title: `${utcText(v.start)} – ${utcText(v.end)}`,
          dataset: { visit: v.id }, onclick: () => showVisit(ctx, v) },
          `${localTime(v.start, clock)} ${v.targetName}${v.pinned ? ' (pinned)' : ''}`)),
        isReviewer() ? nightMenu(ctx, t, night, mark ? mark.state : 'open') : null));
    }
    body.append(tr);
  }
  return el('table', { class: 'plan-grid', id: 'plan-grid' }, el('caption', { class: 'muted' },
    draft.revision == null ? 'No draft yet for these nights: start a planner run.'
      : `Draft revision ${draft.revision}, score ${draft.score ?? '—'}: ${draft.visits.length} visits placed, ${(draft.unplaced || []).length} not placed. Times in each site’s local time.`),
  el('thead', {}, head), el('tbody', {}, body));
}

function nightMenu(ctx, telescope, night, state) {
  const sel = el('select', { 'aria-label': `Night ${night} on ${telescope.name}`, class: 'night-state' },
    ['open', 'locked', 'closed'].map(s => el('option', { value: s, selected: state === s }, s)));
  const send = reason => change(ctx, '/api/plans/draft/nights', { method: 'PUT',
    body: { telescopeId: telescope.id, night, state: sel.value, ...(reason ? { reason } : {}) } },
    `${telescope.name}, night ${night}: ${sel.value}${reason ? ` (${reason})` : ''}.`);
  // Closing asks why (weather, maintenance), so that the plan shows the reason to everyone who reads it.
  const reason = el('input', { type: 'text', class: 'night-reason', maxlength: 500, size: 12, placeholder: 'why (optional)',
    'aria-label': `Why night ${night} on ${telescope.name} is closed` });
  const confirm = el('button', { type: 'submit', class: 'secondary' }, 'Close the night');
  const ask = el('form', { class: 'night-close', hidden: true }, reason, confirm);
  ask.addEventListener('submit', e => { e.preventDefault(); send(reason.value.trim()); });
  sel.addEventListener('change', () => {
    if (sel.value === 'closed') {
      ask.hidden = false;
      reason.focus();
    } else {
      ask.hidden = true;
      send(null);
    }
  });
  return el('div', { class: 'night-menu' }, sel, ask);
}

/** Sends an override against the draft version read; a 409 means someone changed the plan meanwhile. */
async function change(ctx, path, options, done) {
  try {
    const effect = await api(path, { ...options, query: { ...(options.query || {}), version: ctx.draft.version } });
    say(`${done}${effect && effect.scoreAfter ? ` Score ${effect.scoreBefore} → ${effect.scoreAfter}.` : ''}`, 'ok');
    await ctx.reload();
  } catch (e) {
    say(e instanceof ApiError && e.status === 409 ? `The plan changed meanwhile; reloaded. ${e.message}` : e.message, 'error');
    await ctx.reload();
  }
}

async function showVisit(ctx, v) {
  const { details, telescopes } = ctx;
  ctx.selected = v.id;
  const t = telescopes.find(x => x.id === v.telescopeId);
  const site = siteOfTelescope(ctx, t);
  const clock = siteClock(site);
  const chartBox = el('div', { class: 'chart', role: 'img', 'aria-label': `Altitude of ${v.targetName} around the visit; numbers on hover` });
  clear(details, el('h2', {}, v.targetName),
    el('dl', {},
      el('dt', {}, 'Telescope'), el('dd', {}, t ? t.name : `#${v.telescopeId}`),
      el('dt', {}, 'Night'), el('dd', {}, v.night),
      el('dt', {}, 'Start – end'), el('dd', {}, timeEl(v.start, clock), ' – ', timeEl(v.end, clock), ` (${clock.label})`),
      el('dt', {}, 'Request'), el('dd', {}, `#${v.requestId}${v.owner ? ', ' + v.owner : ''}`),
      el('dt', {}, 'Pinned'), el('dd', {}, v.pinned ? 'yes' : 'no')),
    isReviewer() ? el('div', { class: 'actions' },
      el('button', { type: 'button', onclick: () => change(ctx, `/api/visits/${encodeURIComponent(v.id)}/${v.pinned ? 'unpin' : 'pin'}`, { method: 'POST' },
        `${v.targetName} ${v.pinned ? 'unpinned' : 'pinned'}.`) }, v.pinned ? 'Unpin' : 'Pin'),
      el('button', { type: 'button', class: 'secondary', onclick: () => change(ctx, `/api/visits/${encodeURIComponent(v.id)}/unplace`, { method: 'POST' },
        `${v.targetName} taken out of the plan.`) }, 'Unplace')) : null,
    chartBox,
    isReviewer() ? await movePanel(ctx, v, clock) : null);
  if (site) drawVisitChart(chartBox, v, site, clock);
}

/** Other placements: the server's candidates when it lists them, else a telescope and start to try, each with its score effect. */
async function movePanel(ctx, v, clock) {
  const id = encodeURIComponent(v.id);
  const dry = body => api(`/api/visits/${id}/move`, { method: 'POST', body, query: { dryRun: true, version: ctx.draft.version } });
  const effectText = e => `${e.scoreBefore} → ${e.scoreAfter}${e.hardBroken && e.hardBroken.length ? `; breaks: ${e.hardBroken.join(', ')}` : ''}`;
  const candidates = await apiIfPresent(`/api/visits/${id}/candidates`).catch(() => null);
  if (candidates) {
    return el('div', {}, el('h3', {}, 'Other placements'), el('table', { class: 'stack' },
      el('thead', {}, el('tr', {}, ['Telescope', 'Start', 'Score change', ''].map(h => el('th', {}, h)))),
      el('tbody', {}, candidates.map(c => {
        const ct = ctx.telescopes.find(x => x.id === c.telescopeId);
        return el('tr', {}, el('td', {}, ct ? ct.name : `#${c.telescopeId}`), el('td', {}, timeEl(c.start, siteClock(siteOfTelescope(ctx, ct)), true)),
          el('td', { class: 'num' }, String(c.scoreChange ?? c.scoreAfter ?? '')),
          el('td', {}, el('button', { type: 'button', class: 'secondary', onclick: () => change(ctx, `/api/visits/${id}/move`,
            { method: 'POST', body: { telescopeId: c.telescopeId, start: c.start } }, `${v.targetName} moved.`) }, 'Move here')));
      }))));
  }
  const scope = el('select', { name: 'moveTelescope' }, ctx.telescopes.map(t => el('option', { value: t.id, selected: t.id === v.telescopeId }, t.name)));
  const wall = new Date(Date.parse(v.start) + clock.offsetMs);
  const local = new Intl.DateTimeFormat('sv-SE', { timeZone: clock.zone, year: 'numeric', month: '2-digit', day: '2-digit',
    hour: '2-digit', minute: '2-digit' }).format(wall).replace(' ', 'T');
  const start = el('input', { type: 'datetime-local', name: 'moveStart', value: local });
  const effect = el('p', { 'aria-live': 'polite', id: 'move-effect' });
  const target = () => {
    const t = ctx.telescopes.find(x => String(x.id) === scope.value);
    return { telescopeId: Number(scope.value), start: siteWallToUtc(start.value, siteClock(siteOfTelescope(ctx, t))) };
  };
  const tryIt = async () => {
    try { effect.textContent = `Score if moved: ${effectText(await dry(target()))}`; } catch (e) { effect.textContent = e.message; }
  };
  scope.addEventListener('change', tryIt);
  start.addEventListener('change', tryIt);
  return el('div', {}, el('h3', {}, 'Move to another placement'),
    el('div', { class: 'row' }, field('Telescope', scope), field('Start (site’s local time)', start),
      el('button', { type: 'button', class: 'secondary', onclick: tryIt }, 'Score it'),
      el('button', { type: 'button', onclick: () => change(ctx, `/api/visits/${id}/move`, { method: 'POST', body: target() }, `${v.targetName} moved.`) }, 'Move')),
    effect);
}

function drawVisitChart(box, v, site, clock) {
  const mid = (Date.parse(v.start) + Date.parse(v.end)) / 2;
  const xs = [], target = [], moon = [];
  for (let t = mid - 6 * 3600e3; t <= mid + 6 * 3600e3; t += 10 * 60e3) {
    xs.push(t / 1000);
    // The sketch knows only fixed positions; a moving target's curve is left out rather than drawn wrong.
    target.push(v.targetKind && v.targetKind !== 'fixed' ? null : altitudeDeg(v.raDeg, v.decDeg, site.latitudeDeg, site.longitudeDeg, t));
    moon.push(moonAltitudeDeg(site.latitudeDeg, site.longitudeDeg, t));
  }
  const fmt = (u, x) => x == null ? '—' : x.toFixed(1) + '°';
  const timeText = t => localTime(new Date(t * 1e3).toISOString(), clock);
  new uPlot({
    width: Math.max(260, box.clientWidth || 480), height: 200,
    series: [{ label: clock.label, value: (u, t) => t == null ? '—' : timeText(t) },
      { label: v.targetName, stroke: '#1f5f6b', width: 2, value: fmt }, { label: 'Moon', stroke: '#8a8f98', dash: [6, 4], value: fmt }],
    scales: { y: { range: [-10, 90] } },
    tzDate: ts => uPlot.tzDate(new Date(ts * 1e3 + clock.offsetMs), clock.zone),
    axes: [{ values: (u, ticks) => ticks.map(timeText) }, { values: (u, ticks) => ticks.map(t => t + '°') }],
    hooks: { drawClear: [u => {
      const x0 = u.valToPos(Date.parse(v.start) / 1000, 'x', true), x1 = u.valToPos(Date.parse(v.end) / 1000, 'x', true);
      u.ctx.fillStyle = 'rgba(31, 95, 107, 0.25)';
      u.ctx.fillRect(x0, u.bbox.top, Math.max(2, x1 - x0), u.bbox.height);
    }] },
  }, [xs, target, moon], box);
}

function runPanel(ctx, draft, firstNight, lastNight) {
  const bar = el('progress', { max: 1, value: ctx.lastRun ? 1 : 0, id: 'run-progress', 'aria-label': 'Planner progress' });
  const text = el('p', { id: 'run-text', 'aria-live': 'polite' }, ctx.lastRun || 'No run in progress.');
  const seconds = el('input', { type: 'number', name: 'runSeconds', min: 1, max: 600, value: 30, size: 4 });
  const start = el('button', { type: 'button', id: 'run-start', disabled: !isReviewer() }, 'Run the planner');
  const cancel = el('button', { type: 'button', class: 'secondary', id: 'run-cancel', disabled: true }, 'Cancel the run');
  const publish = el('button', { type: 'button', id: 'publish', disabled: !isReviewer() || draft.revision == null }, 'Publish the draft');
  const plugins = pluginSettings();
  let run = null, events = null;
  start.addEventListener('click', async () => {
    try {
      const weights = plugins.changedWeights();
      run = await api('/api/planner/runs', { method: 'POST', body: { firstNight, lastNight, seconds: Number(seconds.value) || 30,
        ...(Object.keys(weights).length ? { weights } : {}) } });
    } catch (e) {
      text.textContent = e.message;
      return;
    }
    start.disabled = true; cancel.disabled = false; bar.value = 0;
    text.textContent = `Run ${run.id} ${run.state}, nights ${firstNight} to ${lastNight}.`;
    events = new EventSource(`/api/planner/runs/${run.id}/events`, { withCredentials: true });
    let ended = false;
    const finish = async message => {
      if (ended) return;
      ended = true;
      events.close();
      ctx.lastRun = message;
      say(message, 'ok');
      await ctx.reload();
    };
    events.addEventListener('progress', e => {
      const p = JSON.parse(e.data);
      bar.value = p.fraction;
      text.textContent = `${Math.round(p.fraction * 100)} % — best score ${p.score ?? '—'}, ${p.placedVisits ?? '—'} visits placed`;
    });
    events.addEventListener('done', e => {
      const p = JSON.parse(e.data);
      finish(`Run ${p.state}: score ${p.score ?? '—'}${p.message ? ` (${p.message.replace(/\.$/, '')})` : ''}.`);
    });
    events.onerror = () => { if (events.readyState === EventSource.CLOSED) finish('The progress stream closed.'); };
  });
  cancel.addEventListener('click', async () => {
    if (!run) return;
    try { await api(`/api/planner/runs/${run.id}`, { method: 'DELETE' }); text.textContent = 'Cancelling…'; } catch (e) { text.textContent = e.message; }
  });
  publish.addEventListener('click', async () => {
    if (!window.confirm('Publish this draft? Telescopes and students will follow the published plan.')) return;
    const send = async (query) => {
      const p = await api('/api/plans/draft/publish', { method: 'POST', query });
      say(p.message || `Draft revision ${draft.revision} published.`, p.changed === false ? 'info' : 'ok');
    };
    try {
      await send({ revision: draft.revision });
    } catch (e) {
      const broken = e.problem && e.problem.broken;
      if (e.status === 409 && Array.isArray(broken) && broken.length) {
        // The draft breaks hard rules: name them, and publish only with the coordinator's stated reason.
        const list = broken.map(b => `${b.rule}${b.visits && b.visits.length ? ` (visits ${b.visits.join(', ')})` : ''}`
          + `${b.program ? ` (program ${b.program}: ${b.grant})` : ''}`).join('\n');
        const reason = window.prompt(`The draft breaks hard rules:\n${list}\n\nTo publish it all the same, say why:`);
        if (reason && reason.trim()) {
          try { await send({ revision: draft.revision, force: true, reason: reason.trim() }); } catch (e2) { say(e2.message, 'error'); }
        } else {
          say(e.message, 'error');
        }
      } else {
        say(e.message, 'error');
      }
    }
    await ctx.reload();
  });
  return [el('h2', {}, 'Planner run'),
    el('div', { class: 'row' }, field('Time limit (s)', seconds), el('div', { class: 'actions' }, start, cancel, publish)), bar, text,
    plugins.node];
}

/**
 * The loaded plugins and the score rules they add, each rule with its weight for the next run (the default until
 * changed here); only changed weights are sent, under the rule's name, as the server's `weights` expects.
 */
function pluginSettings() {
  const inputs = [];
  const body = el('div', { id: 'plugin-settings' }, el('p', { class: 'muted' }, 'Loading plugins…'));
  const node = el('details', { class: 'plugins' }, el('summary', {}, 'Plugins and their score rules'), body);
  api('/api/plugins').then(p => {
    const rules = p.scoreRules || [];
    clear(body,
      el('h3', {}, 'Score rules from plugins'),
      rules.length === 0 ? el('p', { class: 'muted' }, 'No plugin adds a score rule; the built-in rules keep their weights.')
        : el('div', { class: 'scroll' }, el('table', { class: 'stack', id: 'score-rule-weights' },
          el('thead', {}, el('tr', {}, ['Rule', 'What it does', 'Hard', 'Medium', 'Soft'].map(h => el('th', {}, h)))),
          el('tbody', {}, rules.map(r => {
            const cells = ['hard', 'medium', 'soft'].map(level => {
              const input = el('input', { type: 'number', min: 0, step: 1, size: 5, value: r.defaultWeight[level],
                'aria-label': `${r.rule}: ${level} weight` });
              inputs.push({ rule: r.rule, level, input, initial: r.defaultWeight[level] });
              return el('td', { 'data-label': level }, input);
            });
            return el('tr', {}, el('td', { 'data-label': 'Rule' }, r.rule), el('td', { 'data-label': 'What it does' }, r.description), cells);
          })))),
      rules.length ? el('p', { class: 'muted' }, 'A weight of zero at every level switches the rule off for the run.') : null,
      el('h3', {}, 'Loaded plugins'),
      el('ul', { id: 'plugin-list' }, (p.plugins || []).map(x => el('li', {}, `${x.name} ${x.version} (${x.kinds.join(', ')})`))),
      (p.problems || []).length ? el('p', { class: 'caution' }, `${p.problems.length} plugin problem(s): ${p.problems.map(x => x.problem).join('; ')}`) : null);
  }).catch(e => clear(body, el('p', { class: 'muted' }, `The plugin list is not available: ${e.message}`)));
  function changedWeights() {
    const out = {};
    const changed = new Set(inputs.filter(i => Number(i.input.value) !== i.initial).map(i => i.rule));
    for (const i of inputs) {
      if (!changed.has(i.rule)) continue;
      out[i.rule] = out[i.rule] || { hard: 0, medium: 0, soft: 0 };
      out[i.rule][i.level] = Math.max(0, Math.round(Number(i.input.value) || 0));
    }
    return out;
  }
  return { node, changedWeights };
}

function compare(ctx, c) {
  const title = el('h2', {}, 'Draft and published plan');
  if (!c) return [title, notYet('The comparison with the published plan')];
  const tname = id => id == null ? '—' : (ctx.telescopes.find(t => t.id === id) || {}).name || `#${id}`;
  const rows = [['placed', c.placed], ['moved', c.moved], ['dropped', c.dropped]]
    .flatMap(([kind, list]) => (list || []).map(x => [kind, x]));
  return [el('h2', {}, `Draft revision ${c.draftRevision ?? '—'} against published revision ${c.publishedRevision ?? '— (none)'}`),
    rows.length === 0 ? el('p', {}, 'The draft equals the published plan.') : el('div', { class: 'scroll' }, el('table', { class: 'stack', id: 'compare-table' },
      el('thead', {}, el('tr', {}, ['Change', 'Target', 'Published', 'Draft'].map(h => el('th', {}, h)))),
      el('tbody', {}, rows.map(([kind, x]) => el('tr', {}, el('td', { 'data-label': 'Change' }, kind), el('td', { 'data-label': 'Target' }, x.targetName),
        el('td', { 'data-label': 'Published' }, x.publishedStart ? `${tname(x.publishedTelescopeId)} ${utcText(x.publishedStart)}` : '—'),
        el('td', { 'data-label': 'Draft' }, x.start ? `${tname(x.telescopeId)} ${utcText(x.start)}` : '—'))))))];
}
