// Sites and equipment (coordinators and admins): sites with a horizon-profile editor drawn as
// you type, and each site's telescopes, instruments and filters.
import { all, api, ApiError, clear, clearFieldErrors, el, field, isReviewer, say, showFieldErrors } from '../api.js';

export async function render(main, { params }) {
  const sites = await all('/api/sites', { sort: 'name' });
  const selected = sites.find(s => String(s.id) === params[0]) || null;
  clear(main, el('h1', {}, 'Sites and equipment'),
    isReviewer() ? null : el('p', { class: 'muted' }, 'Only coordinators and admins can change these.'),
    el('div', { class: 'scroll' }, el('table', { class: 'stack', id: 'sites-table' },
      el('thead', {}, el('tr', {}, ['Site', 'Latitude', 'Longitude', 'Elevation', 'Time zone', ''].map(h => el('th', {}, h)))),
      el('tbody', {}, sites.map(s => el('tr', {},
        el('td', { 'data-label': 'Site' }, s.name),
        el('td', { 'data-label': 'Latitude', class: 'num' }, s.latitudeDeg.toFixed(4) + '°'),
        el('td', { 'data-label': 'Longitude', class: 'num' }, s.longitudeDeg.toFixed(4) + '°'),
        el('td', { 'data-label': 'Elevation', class: 'num' }, s.elevationM + ' m'),
        el('td', { 'data-label': 'Time zone' }, s.timeZone || 'local mean solar time'),
        el('td', {}, el('a', { href: `#/sites/${s.id}` }, 'Edit'))))))),
    el('p', {}, el('a', { href: '#/sites/new' }, 'Add a site')),
    params[0] ? siteForm(selected) : null,
    selected ? await equipment(selected) : null);
}

function siteForm(site) {
  const s = site || { name: '', latitudeDeg: '', longitudeDeg: '', elevationM: 0, timeZone: '', darkSkyZenithVMag: '', horizon: [] };
  const input = (name, value, attrs = {}) => el('input', { name, value: value ?? '', ...attrs });
  const horizon = el('textarea', { name: 'horizon', rows: 8, cols: 24, spellcheck: 'false' },
    (s.horizon || []).map(p => `${p.azimuthDeg} ${p.altitudeDeg}`).join('\n'));
  const drawing = el('div', { id: 'horizon-drawing' });
  const summary = el('p', { class: 'error', role: 'alert' });
  const form = el('form', { class: 'card', id: 'site-form', novalidate: true },
    el('h2', {}, site ? `Edit ${site.name}` : 'New site'),
    el('div', { class: 'grid2' },
      field('Name', input('name', s.name, { required: true })),
      field('Latitude (°, north positive)', input('latitudeDeg', s.latitudeDeg, { type: 'number', step: 'any' })),
      field('Longitude (°, east positive)', input('longitudeDeg', s.longitudeDeg, { type: 'number', step: 'any' })),
      field('Elevation (m)', input('elevationM', s.elevationM, { type: 'number', step: 'any' })),
      field('Time zone (IANA)', input('timeZone', s.timeZone, { placeholder: 'Europe/Madrid' }), 'empty: local mean solar time'),
      field('Dark-sky zenith brightness (V mag/arcsec²)', input('darkSkyZenithVMag', s.darkSkyZenithVMag, { type: 'number', step: 'any' }), '15 to 23; empty for the default')),
    el('div', { class: 'grid2' },
      field('Horizon profile', horizon, 'one “azimuth altitude” pair a line, degrees, azimuth east of north'),
      el('div', {}, el('h3', {}, 'Profile as drawn'), drawing)),
    summary,
    el('button', { type: 'submit', disabled: !isReviewer() }, site ? 'Save the site' : 'Add the site'));

  const redraw = () => clear(drawing, drawHorizon(parseHorizon(horizon.value)));
  horizon.addEventListener('input', redraw);
  redraw();

  form.addEventListener('submit', async ev => {
    ev.preventDefault();
    clearFieldErrors(form);
    summary.textContent = '';
    const h = parseHorizon(horizon.value);
    if (h.bad.length) {
      showFieldErrors(form, { fields: { horizon: [`line ${h.bad.join(', ')}: not two numbers`] } });
      return;
    }
    const v = n => form.elements[n].value.trim();
    const num = n => v(n) === '' ? null : Number(v(n));
    const body = { version: site ? site.version : null, name: v('name'), latitudeDeg: num('latitudeDeg'), longitudeDeg: num('longitudeDeg'),
      elevationM: num('elevationM'), timeZone: v('timeZone') || null, darkSkyZenithVMag: num('darkSkyZenithVMag'), horizon: h.points };
    try {
      const saved = site ? await api(`/api/sites/${site.id}`, { method: 'PUT', body }) : await api('/api/sites', { method: 'POST', body });
      say(`Site “${saved.name}” saved.`, 'ok');
      location.hash = `#/sites/${saved.id}`;
    } catch (e) {
      if (!(e instanceof ApiError)) throw e;
      const orphans = showFieldErrors(form, e);
      summary.textContent = e.status === 409 ? `Someone changed this site meanwhile; reload to see their version. ${e.message}` : [e.message, ...orphans].join(' ');
    }
  });
  return form;
}

/** Parses the text area; answers the points and the numbers of lines that are not two numbers. */
export function parseHorizon(text) {
  const points = [], bad = [];
  text.split('\n').forEach((line, i) => {
    const t = line.trim();
    if (!t) return;
    const parts = t.split(/[\s,;]+/).map(Number);
    if (parts.length !== 2 || parts.some(x => !Number.isFinite(x))) bad.push(i + 1);
    else points.push({ azimuthDeg: parts[0], altitudeDeg: parts[1] });
  });
  return { points, bad };
}

/** Altitude against azimuth, 0° to 360°, the obstructed sky filled; the text area is its text equivalent. */
function drawHorizon({ points, bad }) {
  const W = 360, H = 120, top = 45; // degrees of altitude shown
  const x = az => az, y = alt => H - (Math.max(-5, Math.min(top, alt)) + 5) * H / (top + 5);
  const sorted = [...points].filter(p => p.azimuthDeg >= 0 && p.azimuthDeg < 360).sort((a, b) => a.azimuthDeg - b.azimuthDeg);
  const svg = el('svg:svg', { viewBox: `-30 -10 ${W + 40} ${H + 30}`, class: 'drawing', role: 'img',
    'aria-label': `Horizon profile with ${sorted.length} points` });
  for (const alt of [0, 15, 30, 45]) {
    svg.append(el('svg:line', { x1: 0, x2: W, y1: y(alt), y2: y(alt), stroke: '#d5d1c7', 'stroke-width': 0.5 }),
      el('svg:text', { x: -4, y: y(alt) + 3, 'font-size': 8, 'text-anchor': 'end', fill: '#5b6470' }, `${alt}°`));
  }
  for (const az of [0, 90, 180, 270, 360]) {
    svg.append(el('svg:text', { x: x(az), y: H + 12, 'font-size': 8, 'text-anchor': 'middle', fill: '#5b6470' },
      { 0: 'N', 90: 'E', 180: 'S', 270: 'W', 360: 'N' }[az]));
  }
  if (sorted.length) {
    // The profile wraps around north: interpolate across 360°/0°.
    const first = sorted[0], last = sorted[sorted.length - 1];
    const span = first.azimuthDeg + 360 - last.azimuthDeg;
    const atNorth = span === 0 ? first.altitudeDeg : last.altitudeDeg + (first.altitudeDeg - last.altitudeDeg) * (360 - last.azimuthDeg) / span;
    const line = [{ azimuthDeg: 0, altitudeDeg: atNorth }, ...sorted, { azimuthDeg: 360, altitudeDeg: atNorth }];
    const d = line.map((p, i) => `${i ? 'L' : 'M'}${x(p.azimuthDeg)},${y(p.altitudeDeg)}`).join(' ');
    svg.append(el('svg:path', { d: `${d} L${W},${H} L0,${H} Z`, fill: '#6d6a5f', opacity: 0.55 }),
      el('svg:path', { d, fill: 'none', stroke: '#1d232b', 'stroke-width': 1 }));
    for (const p of sorted) svg.append(el('svg:circle', { cx: x(p.azimuthDeg), cy: y(p.altitudeDeg), r: 1.6, fill: '#1f5f6b' }));
  }
  svg.append(el('svg:line', { x1: 0, x2: W, y1: y(0), y2: y(0), stroke: '#1d232b', 'stroke-width': 0.6 }));
  return [svg, bad.length ? el('p', { class: 'error' }, `Lines ${bad.join(', ')} are not “azimuth altitude”.`) : null];
}

const INSTRUMENT_FIELDS = [
  ['name', 'Name', 'text'], ['readoutSeconds', 'Readout (s)', 'number'], ['filterChangeSeconds', 'Filter change (s)', 'number'],
  ['filters', 'Filters, in wheel order', 'list'], ['certifiedSolarFilter', 'Certified solar filter fitted', 'checkbox']];
const TELESCOPE_FIELDS = [
  ['name', 'Name', 'text'], ['apertureMm', 'Aperture (mm)', 'number'], ['minAltitudeDeg', 'Lowest altitude (°)', 'number'],
  ['slewRateDegPerS', 'Slew rate (°/s)', 'number'], ['settleSeconds', 'Settle time (s)', 'number'],
  ['active', 'In use (planned)', 'checkbox'],
  ['mountKind', 'Mount', 'select:EQUATORIAL=Equatorial,ALT_AZIMUTH=Alt-azimuth'],
  ['needsMeridianFlip', 'Flips at the meridian (German equatorial)', 'checkbox'],
  ['eastHourAngleLimitDeg', 'East hour-angle limit (°, −180..0, empty for none)', 'number'],
  ['westHourAngleLimitDeg', 'West hour-angle limit (°, 0..180, empty for none)', 'number']];

async function equipment(site) {
  const telescopes = await all('/api/telescopes', { siteId: site.id });
  const instruments = new Map(await Promise.all(telescopes.map(async t => [t.id, await all('/api/instruments', { telescopeId: t.id })])));
  return el('section', { class: 'card' }, el('h2', {}, `Telescopes at ${site.name}`),
    telescopes.length ? null : el('p', { class: 'muted' }, 'None yet.'),
    telescopes.map(t => el('div', { class: 'card telescope', dataset: { telescope: t.id } },
      el('h3', {}, `${t.name}${t.active ? '' : ' (inactive)'}`),
      el('p', {}, `${t.apertureMm} mm aperture, lowest altitude ${t.minAltitudeDeg}°, slew ${t.slewRateDegPerS}°/s, settle ${t.settleSeconds} s`),
      el('p', {}, mountText(t)),
      simpleForm(`Edit ${t.name}`, '/api/telescopes', { siteId: site.id }, TELESCOPE_FIELDS, t),
      removeButton(`Delete ${t.name}`, '/api/telescopes', t),
      el('ul', {}, (instruments.get(t.id) || []).map(i => el('li', { class: 'instrument', dataset: { instrument: i.id } },
        `${i.name}: readout ${i.readoutSeconds} s, filter change ${i.filterChangeSeconds} s, filters ${i.filters.join(', ') || 'none'}`,
        i.certifiedSolarFilter ? ' — certified solar filter' : '',
        simpleForm(`Edit ${i.name}`, '/api/instruments', { telescopeId: t.id }, INSTRUMENT_FIELDS, i),
        removeButton(`Delete ${i.name}`, '/api/instruments', i)))),
      simpleForm(`Add an instrument to ${t.name}`, '/api/instruments', { telescopeId: t.id }, INSTRUMENT_FIELDS))),
    simpleForm('Add a telescope', '/api/telescopes', { siteId: site.id }, TELESCOPE_FIELDS, { active: true }));
}

/** Deletes `current` after a confirmation in the page; a stale version or a thing still in use is said plainly. */
function removeButton(label, path, current) {
  const sure = el('button', { type: 'button', class: 'secondary', hidden: true }, `Yes, ${label.charAt(0).toLowerCase()}${label.slice(1)}`);
  const ask = el('button', { type: 'button', class: 'secondary', disabled: !isReviewer() }, label);
  ask.addEventListener('click', () => { sure.hidden = false; sure.focus(); });
  sure.addEventListener('click', async () => {
    try {
      await api(`${path}/${current.id}`, { method: 'DELETE', query: { version: current.version } });
      say(`${current.name} deleted.`, 'ok');
    } catch (e) {
      if (!(e instanceof ApiError)) throw e;
      say(e.status === 409 ? `${current.name} was not deleted: ${e.message}` : e.message, 'error');
    }
    window.dispatchEvent(new HashChangeEvent('hashchange'));
  });
  return el('span', { class: 'remove' }, ask, sure);
}

function mountText(t) {
  if (t.mountKind === 'ALT_AZIMUTH') return 'Alt-azimuth mount';
  const limits = t.eastHourAngleLimitDeg > -180 || t.westHourAngleLimitDeg < 180
    ? `, hour angles ${t.eastHourAngleLimitDeg}° to ${t.westHourAngleLimitDeg}°` : ', no hour-angle limits';
  return `Equatorial mount${t.needsMeridianFlip ? ' that flips at the meridian' : ''}${limits}`;
}

/**
 * A form for a new telescope or instrument, or, with `current` holding an `id`, for editing that one (sent with the
 * version read, so a stale edit is refused rather than overwriting someone else's).
 */
function simpleForm(title, path, fixed, fields, current = null) {
  const editing = current && current.id != null;
  const summary = el('p', { class: 'error', role: 'alert' });
  const value = name => current == null || current[name] == null ? null : current[name];
  const control = (name, kind) => {
    if (kind.startsWith('select:')) {
      return el('select', { name }, kind.slice(7).split(',').map(o => el('option', { value: o.split('=')[0], selected: value(name) === o.split('=')[0] }, o.split('=')[1])));
    }
    const v = value(name);
    return el('input', {
      name, type: kind === 'list' ? 'text' : kind, step: kind === 'number' ? 'any' : null,
      placeholder: kind === 'list' ? 'B, V, R' : null, checked: kind === 'checkbox' ? Boolean(v) : null,
      value: kind === 'checkbox' || v == null ? null : kind === 'list' ? v.join(', ') : String(v) });
  };
  const form = el('form', { class: 'equipment-form', novalidate: true },
    el('div', { class: 'row' }, fields.map(([name, label, kind]) => field(label, control(name, kind)))),
    fields.some(f => f[0] === 'certifiedSolarFilter')
      ? el('p', { class: 'caution' }, 'Tick the solar filter only for a certified full-aperture solar filter: solar requests go only to such instruments.') : null,
    summary, el('button', { type: 'submit', class: 'secondary', disabled: !isReviewer() }, editing ? 'Save' : title));
  form.addEventListener('submit', async ev => {
    ev.preventDefault();
    clearFieldErrors(form);
    const body = { ...fixed, ...(editing ? { version: current.version } : {}) };
    for (const [name, , kind] of fields) {
      const x = form.elements[name];
      body[name] = kind.startsWith('select:') ? x.value : kind === 'checkbox' ? x.checked : kind === 'number' ? (x.value === '' ? null : Number(x.value))
        : kind === 'list' ? x.value.split(/[\s,]+/).filter(Boolean) : x.value.trim();
    }
    try {
      if (editing) await api(`${path}/${current.id}`, { method: 'PUT', body });
      else await api(path, { method: 'POST', body });
      say(`${body.name} ${editing ? 'saved' : 'added'}.`, 'ok');
      window.dispatchEvent(new HashChangeEvent('hashchange'));
    } catch (e) {
      if (!(e instanceof ApiError)) throw e;
      summary.textContent = e.status === 409 && editing
        ? `Someone changed ${current.name} meanwhile; reload to see their version. ${e.message}`
        : [e.message, ...showFieldErrors(form, e)].join(' ');
    }
  });
  return el('details', {}, el('summary', {}, title), form);
}
