// Tonight at one site: the almanac from the server, a chart of the night (dark time shaded,
// the Moon's altitude, the planned targets), each telescope's plan as a timeline.
import uPlot from '/webjars/uplot/dist/uPlot.esm.js';
import {
  all, api, clear, deg, el, field, loadPlan, localTime, notYet, siteClock, zoneOffsetMs, siteToday, timeEl, utcText,
} from '../api.js';
import { altitudeDeg, moonAltitudeDeg } from '../sky-sketch.js';

const EVENTS = [
  ['sunset', 'Sunset'], ['civilDusk', 'Civil dusk (−6°)'], ['nauticalDusk', 'Nautical dusk (−12°)'],
  ['astronomicalDusk', 'Astronomical dusk (−18°)'], ['astronomicalDawn', 'Astronomical dawn (−18°)'],
  ['nauticalDawn', 'Nautical dawn (−12°)'], ['civilDawn', 'Civil dawn (−6°)'], ['sunrise', 'Sunrise'],
  ['moonrise', 'Moonrise'], ['moonset', 'Moonset'],
];

let chart = null;

export async function render(main, { params }) {
  const sites = await all('/api/sites', { sort: 'name' });
  if (!sites.length) {
    clear(main, el('h1', {}, 'Tonight'), el('p', {}, 'No sites yet. A coordinator adds them under Sites and equipment.'));
    return;
  }
  const siteSel = el('select', { name: 'site' }, sites.map(s => el('option', { value: s.id }, s.name)));
  if (params[0]) siteSel.value = params[0];
  const dateIn = el('input', { type: 'date', name: 'date' });
  const body = el('div', { id: 'tonight-body' });
  const controls = el('form', { class: 'row', onsubmit: e => e.preventDefault() },
    field('Site', siteSel), field('Night starting', dateIn, 'local noon to the next local noon'));
  clear(main, el('h1', {}, 'Tonight'), controls, body);

  const site = () => sites.find(s => String(s.id) === siteSel.value) || sites[0];
  const draw = () => showNight(body, site(), dateIn.value).catch(e => {
    clear(body, el('p', { class: 'error' }, e.message));
  });
  siteSel.addEventListener('change', () => { dateIn.value = siteToday(siteClock(site())); draw(); });
  dateIn.addEventListener('change', draw);
  dateIn.value = siteToday(siteClock(site()));
  await draw();
}

async function showNight(body, site, date) {
  const clock = siteClock(site);
  const almanac = await api('/api/almanac', {
    query: { lat: site.latitudeDeg, lon: site.longitudeDeg, elevation: site.elevationM, date, tz: site.timeZone },
  });
  const [telescopes, plan] = await Promise.all([
    all('/api/telescopes', { siteId: site.id }),
    loadPlan('published', date, date, site.id).catch(() => null),
  ]);
  const visits = plan ? plan.visits.filter(v => v.night === date && telescopes.some(t => t.id === v.telescopeId)) : [];

  const events = el('table', { class: 'events' },
    el('caption', { class: 'muted' }, `Times in ${clock.label}; UTC on hover.`),
    el('thead', {}, el('tr', {}, el('th', {}, 'Event'), el('th', {}, 'Time'))),
    el('tbody', {}, EVENTS.map(([k, label]) => el('tr', {}, el('td', {}, label), el('td', { dataset: { event: k } }, timeEl(almanac[k], clock)))),
      el('tr', {}, el('td', {}, 'Moon illuminated'), el('td', { dataset: { event: 'moonIllumination' } }, `${Math.round(almanac.moonIllumination * 100)} %`))));

  // The chart spans sunset to sunrise (or local noon to noon when the Sun does not set or rise).
  const noon = Date.parse(date + 'T12:00:00Z') - clock.offsetMs - zoneOffsetMs(clock.zone, new Date(date + 'T12:00:00Z'));
  const t0 = almanac.sunset ? Date.parse(almanac.sunset) - 3600e3 : noon;
  const t1 = almanac.sunrise ? Date.parse(almanac.sunrise) + 3600e3 : noon + 86400e3;
  const step = 10 * 60e3;
  const xs = [], moon = [];
  for (let t = t0; t <= t1; t += step) { xs.push(t / 1000); moon.push(moonAltitudeDeg(site.latitudeDeg, site.longitudeDeg, t)); }
  const targets = uniqueTargets(visits);
  // The sketch knows only fixed positions; a moving target's curve is left empty rather than drawn wrong.
  const curves = targets.map(v => xs.map(x => v.targetKind && v.targetKind !== 'fixed' ? null
    : altitudeDeg(v.raDeg, v.decDeg, site.latitudeDeg, site.longitudeDeg, x * 1000)));

  const chartBox = el('div', { class: 'chart', id: 'night-chart', role: 'img',
    'aria-label': 'Altitude chart of the night; the table below it gives the same numbers.' });
  const altTable = altitudeTable(xs, moon, targets, curves, clock);
  const timelines = el('div', { id: 'timelines' },
    !plan ? notYet('The published plan') : telescopes.length === 0 ? el('p', {}, 'No telescopes at this site.')
      : telescopes.map(t => timeline(t, visits.filter(v => v.telescopeId === t.id), almanac, t0, t1, clock)));

  clear(body,
    el('div', { class: 'grid2' },
      el('section', { class: 'card' }, el('h2', {}, `Events, ${site.name}`), events),
      el('section', { class: 'card' }, el('h2', {}, 'The night'), chartBox,
        el('details', {}, el('summary', {}, 'Altitudes as a table'), el('div', { class: 'scroll' }, altTable)),
        el('p', { class: 'muted' }, 'Curves are drawn from low-precision positions; event times come from the server.'))),
    el('section', { class: 'card' }, el('h2', {}, 'Telescope plans'), timelines));

  if (chart) chart.destroy();
  const series = [{ label: clock.label, value: (u, t) => t == null ? '—' : localTime(new Date(t * 1e3).toISOString(), clock) }, { label: 'Moon', stroke: '#8a8f98', width: 2, dash: [6, 4], value: (u, v) => v == null ? '—' : v.toFixed(1) + '°' }]
    .concat(targets.map((v, i) => ({ label: v.targetName, stroke: PALETTE[i % PALETTE.length], width: 2,
      value: (u, val) => val == null ? '—' : val.toFixed(1) + '°' })));
  const width = Math.max(280, chartBox.clientWidth || 600);
  chart = new uPlot({
    width, height: 260, series,
    scales: { y: { range: [-10, 90] } },
    axes: [{ stroke: '#5b6470', values: (u, ticks) => ticks.map(t => localTime(new Date(t * 1e3).toISOString(), clock)) }, { stroke: '#5b6470', label: 'Altitude (°)', values: (u, ticks) => ticks.map(t => t + '°') }],
    // ticks on the site's whole hours; labels and legend from the shared formatter
    tzDate: ts => uPlot.tzDate(new Date(ts * 1e3 + clock.offsetMs), clock.zone),
    hooks: { drawClear: [u => shadeDarkTime(u, almanac)] },
    legend: { live: true },
  }, [xs, moon, ...curves], chartBox);
}

const PALETTE = ['#1f5f6b', '#c0552b', '#6b4fa0', '#2d6a2d', '#a3261b', '#8a6d00'];

function uniqueTargets(visits) {
  const seen = new Map();
  for (const v of visits) if (!seen.has(v.requestId)) seen.set(v.requestId, v);
  return [...seen.values()];
}

function shadeDarkTime(u, a) {
  const band = (from, to, alpha) => {
    if (!from || !to) return;
    const x0 = u.valToPos(Date.parse(from) / 1000, 'x', true), x1 = u.valToPos(Date.parse(to) / 1000, 'x', true);
    u.ctx.save();
    u.ctx.fillStyle = `rgba(43, 53, 80, ${alpha})`;
    u.ctx.fillRect(x0, u.bbox.top, x1 - x0, u.bbox.height);
    u.ctx.restore();
  };
  band(a.sunset, a.sunrise, 0.08);
  band(a.nauticalDusk, a.nauticalDawn, 0.1);
  band(a.astronomicalDusk, a.astronomicalDawn, 0.2);
}

function altitudeTable(xs, moon, targets, curves, clock) {
  const rows = [];
  for (let i = 0; i < xs.length; i += 3) {
    const iso = new Date(xs[i] * 1000).toISOString();
    rows.push(el('tr', {}, el('td', {}, el('time', { datetime: iso, title: utcText(iso) }, localTime(iso, clock))),
      el('td', { class: 'num' }, deg(moon[i])), curves.map(c => el('td', { class: 'num' }, deg(c[i])))));
  }
  return el('table', { id: 'altitude-table' },
    el('thead', {}, el('tr', {}, el('th', {}, 'Time'), el('th', { class: 'num' }, 'Moon'), targets.map(t => el('th', { class: 'num' }, t.targetName)))),
    el('tbody', {}, rows));
}

function timeline(telescope, visits, almanac, t0, t1, clock) {
  const pct = ms => `${(100 * (ms - t0) / (t1 - t0)).toFixed(2)}%`;
  const span = (from, to) => `left:${pct(from)};width:calc(${pct(to)} - ${pct(from)})`;
  const band = el('div', { class: 'timeline', role: 'list', 'aria-label': `Plan of ${telescope.name}` });
  if (almanac.astronomicalDusk && almanac.astronomicalDawn) {
    band.append(el('div', { class: 'dark', style: span(Date.parse(almanac.astronomicalDusk), Date.parse(almanac.astronomicalDawn)) }));
  }
  for (const v of visits) {
    const label = `${v.targetName}, ${localTime(v.start, clock)}–${localTime(v.end, clock)}`;
    band.append(el('div', { class: 'visit', role: 'listitem', tabindex: 0, style: span(Date.parse(v.start), Date.parse(v.end)),
      title: `${v.targetName}: ${utcText(v.start)} to ${utcText(v.end)}`, 'aria-label': label }, v.targetName));
  }
  return el('div', {}, el('h3', {}, telescope.name + (telescope.active === false ? ' (inactive)' : '')),
    band, visits.length ? null : el('p', { class: 'muted' }, 'Nothing planned this night.'));
}
