// Programs: hours granted, planned and observed per program, as bars with a table beside them.
import { all, apiIfPresent, clear, el, notYet } from '../api.js';

export async function render(main) {
  const programs = await all('/api/programs', { sort: 'code' });
  // Proposed endpoint: [{programId, grantedHours, plannedHours, observedHours}]
  const usage = await apiIfPresent('/api/programs/usage').catch(() => null);
  const byId = new Map((usage || []).map(u => [u.programId, u]));
  const rows = programs.map(p => {
    const u = byId.get(p.id);
    const granted = u ? u.grantedHours : p.grants.reduce((s, g) => s + g.hours, 0);
    return { p, granted, planned: u ? u.plannedHours : null, observed: u ? u.observedHours : null };
  });
  const max = Math.max(1, ...rows.flatMap(r => [r.granted, r.planned || 0, r.observed || 0]));
  const bar = (value, kind, label) => value === null ? el('span', { class: 'not-yet' }, 'not available yet')
    : el('div', { class: `bar ${kind}`, style: `width:${(100 * value / max).toFixed(1)}%`, title: `${label}: ${value.toFixed(1)} h`,
      role: 'img', 'aria-label': `${label} ${value.toFixed(1)} hours` });
  clear(main, el('h1', {}, 'Programs'),
    usage ? null : notYet('Planned and observed hours per program'),
    el('section', { class: 'card', 'aria-label': 'Hours per program, as bars' },
      el('p', { class: 'muted' }, usage ? 'Bars: granted (dark), planned (light), observed (amber); hover for the hours.'
        : 'Bars: hours granted; hover for the numbers.'),
      el('div', { class: 'bars', id: 'program-bars' }, rows.map(r => [
        el('span', {}, r.p.code),
        el('div', {}, bar(r.granted, '', 'granted'), usage ? bar(r.planned, 'planned', 'planned') : null, usage ? bar(r.observed, 'observed', 'observed') : null)]))),
    el('div', { class: 'scroll' }, el('table', { class: 'stack', id: 'programs-table' },
      el('thead', {}, el('tr', {}, ['Code', 'Title', 'Principal investigator', 'Active', 'Granted h', 'Planned h', 'Observed h'].map(h => el('th', {}, h)))),
      el('tbody', {}, rows.map(r => el('tr', {},
        el('td', { 'data-label': 'Code' }, r.p.code), el('td', { 'data-label': 'Title' }, r.p.title),
        el('td', { 'data-label': 'Principal investigator' }, r.p.principalInvestigator),
        el('td', { 'data-label': 'Active' }, r.p.active ? 'yes' : 'no'),
        el('td', { 'data-label': 'Granted h', class: 'num' }, r.granted.toFixed(1)),
        el('td', { 'data-label': 'Planned h', class: 'num' }, r.planned === null ? '—' : r.planned.toFixed(1)),
        el('td', { 'data-label': 'Observed h', class: 'num' }, r.observed === null ? '—' : r.observed.toFixed(1))))))));
}
