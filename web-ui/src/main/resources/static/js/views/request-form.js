// The new-request form: target, exposure plan, constraints, window, repeats and their spacing, priority, program;
// a live preview of the nights and hours observable at each site; field errors beside fields;
// the Sun caution for solar targets. The target is a fixed position or one of the server's target kinds
// (GET /api/plugins, targetKinds: a planet, a comet), whose parameters are asked for with their help.
import {
  addDays, all, api, ApiError, clear, clearFieldErrors, el, field, hours, priorityLabel, say, session, showFieldErrors, siteClock, siteToday, timeEl,
} from '../api.js';
import { separationDeg, sunPosition } from '../sky-sketch.js';

const PREVIEW_NIGHTS = 30;

export async function render(main) {
  const [programs, sites, plugins] = await Promise.all([all('/api/programs', { sort: 'code', active: true }), all('/api/sites', { sort: 'name' }),
    api('/api/plugins').catch(() => ({ targetKinds: [] }))]);
  const kinds = plugins.targetKinds || [];
  const input = (name, attrs = {}) => el('input', { name, ...attrs });
  const program = el('select', { name: 'programId', required: true },
    el('option', { value: '' }, 'choose…'), programs.map(p => el('option', { value: p.id }, `${p.code} — ${p.title}`)));
  if (programs.length === 1) program.value = programs[0].id;
  const darkness = el('select', { name: 'darkness' }, ['astronomical', 'nautical', 'civil'].map(d => el('option', { value: d }, d)));
  const priority = el('select', { name: 'priority' }, [1, 2, 3, 4, 5].map(p => el('option', { value: p, selected: p === 3 }, priorityLabel(p))));
  const owner = input('owner', { value: session.user ? session.user.username : '', readonly: session.user ? true : null });
  const exposures = el('div', { id: 'exposures' });
  const caution = el('div', { id: 'sun-caution', 'aria-live': 'polite' });
  const kind = el('select', { name: 'targetKind' }, el('option', { value: 'fixed' }, 'fixed position (RA and Dec)'),
    kinds.map(k => el('option', { value: k.kind }, `${k.kind} — ${k.description}`)));
  const coordinates = el('div', { class: 'grid2', id: 'target-coordinates' },
    field('Right ascension', input('ra', { required: true, placeholder: '05:35:17.3 or 83.82' }), 'hours as h:m:s (05:35:17.3, 5h35m17.3s) or decimal degrees'),
    field('Declination', input('dec', { required: true, placeholder: '-05:23:28 or -5.391' }), 'degrees as d:m:s (-05:23:28, -5d23m28s) or decimal degrees'));
  const parameters = el('div', { class: 'grid2', id: 'target-parameters' });
  const chosenKind = () => kinds.find(k => k.kind === kind.value) || null;
  // A moving target's position comes from its kind's parameters; the coordinates give way to them.
  function showKind() {
    const k = chosenKind();
    coordinates.hidden = k !== null;
    coordinates.style.display = k !== null ? 'none' : ''; // the grid's display would override hidden
    clear(parameters, k === null ? null : Object.entries(k.parameters).map(([name, help]) =>
      field(name, input(`targetParameters.${name}`, { autocomplete: 'off' }), help)));
  }
  kind.addEventListener('change', () => { showKind(); schedulePreview(); });
  const preview = el('div', { id: 'preview', 'aria-live': 'polite' });
  const summary = el('p', { class: 'error', role: 'alert', id: 'form-summary' });

  const form = el('form', { id: 'request-form', novalidate: true },
    el('section', { class: 'card' }, el('h2', {}, 'Target'),
      el('div', { class: 'grid2' },
        field('Target name', input('targetName', { required: true, maxlength: 100, autocomplete: 'off' })),
        field('Kind of target', kind, kinds.length ? 'a fixed position, or one the server computes (from its plugins)' : 'this server computes no moving targets')),
      coordinates, parameters, caution),
    el('section', { class: 'card' }, el('h2', {}, 'Exposure plan'), exposures,
      el('button', { type: 'button', class: 'secondary', onclick: () => addExposure() }, 'Add an exposure line')),
    el('section', { class: 'card' }, el('h2', {}, 'Constraints and window'),
      el('div', { class: 'grid2' },
        field('Minimum altitude (°)', input('minAltitudeDeg', { type: 'number', step: 'any', value: 30 })),
        field('Darkness', darkness, 'the Sun below −18°, −12° or −6°'),
        field('Minimum Moon separation (°)', input('minMoonSeparationDeg', { type: 'number', step: 'any' }), 'empty: no limit'),
        field('Maximum Moon illumination (0–1)', input('maxMoonIllumination', { type: 'number', step: 'any' }), 'applies only while the Moon is up'),
        field('Earliest night', input('earliestNight', { type: 'date' })),
        field('Latest night', input('latestNight', { type: 'date' })),
        field('Repeats', input('repeats', { type: 'number', min: 1, max: 100, value: 1 }), 'how many visits, each the whole exposure plan'),
        field('Repeat interval (hours)', input('repeatIntervalHours', { type: 'number', step: 'any', min: 0 }),
          'least time between the starts of two visits; needed with more than one repeat (24: one visit a night)'),
        field('Repeat tolerance (hours)', input('repeatToleranceHours', { type: 'number', step: 'any', min: 0 }),
          'how much sooner a repeat may still start; empty: 0, and less than the interval'),
        field('Priority', priority, '1 lowest, 5 highest: higher priorities are placed first'))),
    el('section', { class: 'card' }, el('h2', {}, 'Program'),
      el('div', { class: 'grid2' }, field('Program', program), field('Owner', owner))),
    el('section', { class: 'card' }, el('h2', {}, 'Where and when it is observable'), preview),
    summary,
    el('div', { class: 'actions' },
      el('button', { type: 'submit', name: '_submit', value: 'queue' }, 'Queue the request'),
      el('button', { type: 'submit', name: '_submit', value: 'draft', class: 'secondary' }, 'Save as draft')));

  let rows = 0;
  function addExposure(filter = 'V', seconds = 60, count = 1) {
    const i = rows++;
    const line = el('div', { class: 'row exposure', dataset: { index: i } },
      field('Filter', input(`exposures[${i}].filter`, { value: filter, size: 6 })),
      field('Seconds', input(`exposures[${i}].seconds`, { type: 'number', step: 'any', value: seconds, size: 6 })),
      field('Count', input(`exposures[${i}].count`, { type: 'number', value: count, size: 4 })),
      el('button', { type: 'button', class: 'link', onclick: () => { line.remove(); schedulePreview(); } }, 'Remove'));
    exposures.append(line);
  }
  addExposure();

  const value = name => { const x = form.elements[name]; return x ? x.value.trim() : ''; };
  const number = name => value(name) === '' ? null : Number(value(name));
  const body = () => ({
    programId: program.value ? Number(program.value) : null,
    owner: value('owner'),
    targetName: value('targetName'),
    ra: chosenKind() ? null : value('ra'), dec: chosenKind() ? null : value('dec'),
    targetKind: kind.value,
    targetParameters: chosenKind() ? Object.fromEntries(Object.keys(chosenKind().parameters)
      .map(name => [name, value(`targetParameters.${name}`)]).filter(([, v]) => v !== '')) : null,
    exposures: [...exposures.querySelectorAll('.exposure')].map(line => {
      const i = line.dataset.index;
      return { filter: value(`exposures[${i}].filter`), seconds: number(`exposures[${i}].seconds`), count: number(`exposures[${i}].count`) };
    }),
    minAltitudeDeg: number('minAltitudeDeg'), darkness: darkness.value,
    minMoonSeparationDeg: number('minMoonSeparationDeg'), maxMoonIllumination: number('maxMoonIllumination'),
    earliestNight: value('earliestNight') || null, latestNight: value('latestNight') || null,
    repeats: number('repeats'), repeatIntervalHours: number('repeatIntervalHours'),
    repeatToleranceHours: number('repeatToleranceHours'), priority: Number(priority.value),
  });

  // Error numbers of the live preview belong to fields too: the compute endpoint names its parameter.
  const paramToField = { ra: 'ra', dec: 'dec', minAltitude: 'minAltitudeDeg', minMoonSeparation: 'minMoonSeparationDeg',
    maxMoonIllumination: 'maxMoonIllumination', from: 'earliestNight', to: 'latestNight' };

  let timer = null, generation = 0;
  function schedulePreview() { clearTimeout(timer); timer = setTimeout(updatePreview, 400); }
  async function updatePreview() {
    const mine = ++generation;
    const b = body();
    const moving = chosenKind() !== null;
    const ra = moving ? null : parseRa(b.ra), dec = moving ? null : parseDec(b.dec);
    showSunCaution(caution, [b.targetName, ...Object.values(b.targetParameters || {})].join(' '), ra, dec);
    if (moving && Object.keys(b.targetParameters).length === 0) {
      clear(preview, el('p', { class: 'muted' }, 'Enter the target’s parameters to see when it is observable.')); return;
    }
    if (!moving && (ra === null || dec === null)) { clear(preview, el('p', { class: 'muted' }, 'Enter the coordinates to see when the target is observable.')); return; }
    const target = moving ? { targetKind: b.targetKind,
      ...Object.fromEntries(Object.entries(b.targetParameters).map(([n, v]) => [`targetParameters.${n}`, v])) } : { ra, dec };
    if (!sites.length) { clear(preview, el('p', { class: 'muted' }, 'No sites yet.')); return; }
    const results = await Promise.all(sites.map(async site => {
      const clock = siteClock(site);
      const from = b.earliestNight || siteToday(clock);
      const to = b.latestNight || addDays(from, PREVIEW_NIGHTS - 1);
      try {
        const v = await api('/api/visibility', { query: {
          ...target, lat: site.latitudeDeg, lon: site.longitudeDeg, elevation: site.elevationM, tz: site.timeZone, from, to,
          minAltitude: b.minAltitudeDeg, darkness: b.darkness, minMoonSeparation: b.minMoonSeparationDeg, maxMoonIllumination: b.maxMoonIllumination,
        } });
        return { site, clock, from, to, windows: v.windows };
      } catch (e) { return { site, error: e }; }
    }));
    if (mine !== generation) return;
    const bad = results.find(r => r.error instanceof ApiError && r.error.problem.parameter);
    if (bad) {
      const p = bad.error.problem.parameter;
      clear(preview, el('p', { class: 'error' }, `Preview: ${paramToField[p] || p} ${bad.error.message}`));
      return;
    }
    clear(preview, el('table', { class: 'stack', id: 'preview-table' },
      el('caption', { class: 'muted' }, 'From the server’s visibility windows for the request’s constraints.'),
      el('thead', {}, el('tr', {}, ['Site', 'Nights', 'Observable nights', 'Hours', 'First window'].map(h => el('th', {}, h)))),
      el('tbody', {}, results.map(r => r.error
        ? el('tr', {}, el('td', {}, r.site.name), el('td', { colspan: 4, class: 'error' }, r.error.message))
        : el('tr', {},
          el('td', { 'data-label': 'Site' }, r.site.name),
          el('td', { 'data-label': 'Nights' }, `${r.from} – ${r.to}`),
          el('td', { 'data-label': 'Observable nights', class: 'num' }, new Set(r.windows.map(w => w.night)).size),
          el('td', { 'data-label': 'Hours', class: 'num' }, hours(r.windows.reduce((s, w) => s + Date.parse(w.end) - Date.parse(w.start), 0))),
          el('td', { 'data-label': 'First window' }, r.windows.length ? timeEl(r.windows[0].start, r.clock, true) : el('span', { class: 'muted' }, 'none')))))));
  }
  form.addEventListener('input', schedulePreview);

  form.addEventListener('submit', async ev => {
    ev.preventDefault();
    const queue = !ev.submitter || ev.submitter.value === 'queue';
    summary.textContent = '';
    clearFieldErrors(form);
    try {
      let r = await api('/api/requests', { method: 'POST', body: body() });
      if (queue) r = await api(`/api/requests/${r.id}/submit`, { method: 'POST', query: { version: r.version } });
      say(`Request “${r.targetName}” saved, now ${r.state}.`, 'ok');
      location.hash = '#/queue';
    } catch (e) {
      if (!(e instanceof ApiError)) { summary.textContent = e.message; return; }
      const orphans = showFieldErrors(form, e);
      summary.textContent = Object.keys(e.fields).length
        ? `Please correct the marked fields.${orphans.length ? ' ' + orphans.join(' ') : ''}`
        : e.message;
      const first = form.querySelector('[aria-invalid="true"]');
      if (first) first.focus();
    }
  });

  clear(main, el('h1', {}, 'New request'), form);
  await updatePreview();
}

/** For the preview only (the server parses what is stored): RA in hours when sexagesimal, else degrees. */
export function parseRa(text) {
  const s = sexagesimal(text);
  if (s === null) return null;
  const d = s.sexagesimal ? s.value * 15 : s.value;
  return d >= 0 && d < 360 ? d : null;
}

export function parseDec(text) {
  const s = sexagesimal(text);
  return s !== null && Math.abs(s.value) <= 90 ? s.value : null;
}

function sexagesimal(text) {
  const t = (text || '').trim();
  if (/^[+-]?\d+(\.\d+)?$/.test(t)) return { value: Number(t), sexagesimal: false };
  const m = t.match(/^([+-−]?)(\d+)[:hd°\s]\s*(\d+)[:m′'\s]\s*(\d+(?:\.\d+)?)[s″"]?$/i);
  if (!m) return null;
  const v = Number(m[2]) + Number(m[3]) / 60 + Number(m[4]) / 3600;
  return { value: m[1] === '-' || m[1] === '−' ? -v : v, sexagesimal: true };
}

function showSunCaution(box, name, ra, dec) {
  const named = /\b(sun|solar)\b/i.test(name || '');
  let near = false;
  if (ra !== null && dec !== null) {
    const sun = sunPosition(Date.now());
    near = separationDeg(ra, dec, sun.raDeg, sun.decDeg) < 15;
  }
  clear(box, named || near ? el('p', { class: 'caution', role: 'alert' },
    el('strong', {}, 'Sun caution. '),
    near ? 'This position is near the Sun now. ' : '',
    'Never look at or near the Sun through unfiltered optics: it blinds in an instant and burns cameras and optics. ',
    'Solar targets go only to instruments with a certified solar filter fitted over the aperture, and the site’s own safety rules come first.') : null);
}
