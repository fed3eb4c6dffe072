// Audit: the change log, filterable by who, what and when.
import { apiIfPresent, clear, el, field, notYet, utcText } from '../api.js';

export async function render(main) {
  const f = {
    actor: el('input', { name: 'actor', placeholder: 'user name' }),
    entity: el('select', { name: 'entity' }, ['', 'site', 'telescope', 'instrument', 'program', 'request', 'plan', 'account']
      .map(v => el('option', { value: v }, v || 'all'))),
    from: el('input', { name: 'from', type: 'date' }), to: el('input', { name: 'to', type: 'date' }),
  };
  const out = el('div', { class: 'scroll' });
  const form = el('form', { class: 'row card', role: 'search' }, field('Who', f.actor), field('What', f.entity),
    field('From', f.from), field('To', f.to), el('button', { type: 'submit' }, 'Apply'));
  let page = 0;
  const load = async () => {
    // Proposed endpoint: page of {id, at, actor, action, entity, entityId, summary}
    const result = await apiIfPresent('/api/audit', { query: { page, size: 50, sort: 'at,desc', actor: f.actor.value.trim(),
      entity: f.entity.value, from: f.from.value, to: f.to.value } });
    if (!result) { clear(out, notYet('The change log')); return; }
    clear(out, el('table', { class: 'stack', id: 'audit-table' },
      el('thead', {}, el('tr', {}, ['When (UTC)', 'Who', 'Action', 'What', 'Change'].map(h => el('th', {}, h)))),
      el('tbody', {}, result.items.map(a => el('tr', {},
        el('td', { 'data-label': 'When' }, utcText(a.at)), el('td', { 'data-label': 'Who' }, a.actor),
        el('td', { 'data-label': 'Action' }, a.action), el('td', { 'data-label': 'What' }, `${a.entity} ${a.entityId ?? ''}`),
        el('td', { 'data-label': 'Change' }, a.summary || ''))))),
    el('div', { class: 'pager' },
      el('button', { type: 'button', class: 'secondary', disabled: page === 0, onclick: () => { page--; load(); } }, 'Previous'),
      el('span', {}, `Page ${page + 1} of ${Math.max(1, result.totalPages)}`),
      el('button', { type: 'button', class: 'secondary', disabled: page + 1 >= result.totalPages, onclick: () => { page++; load(); } }, 'Next')));
  };
  form.addEventListener('submit', e => { e.preventDefault(); page = 0; load(); });
  clear(main, el('h1', {}, 'Audit'), form, out);
  await load();
}
