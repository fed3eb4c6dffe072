// Audit: the server's change log (who, when, what, and the fields that changed), filterable.
import { apiIfPresent, clear, el, field, notYet, utcText } from '../api.js';

const KINDS = ['', 'site', 'telescope', 'instrument', 'program', 'request', 'account', 'plan'];
const BOOKKEEPING = new Set(['version', 'updatedAt', 'createdAt']);

export async function render(main) {
  const f = {
    actor: el('input', { name: 'actor', placeholder: 'exact user name' }),
    entityType: el('select', { name: 'entityType' }, KINDS.map(v => el('option', { value: v }, v || 'all'))),
    entityId: el('input', { name: 'entityId', type: 'number', min: 1, placeholder: 'any' }),
  };
  const out = el('div', { class: 'scroll' });
  const form = el('form', { class: 'row card', role: 'search' }, field('Who', f.actor), field('What', f.entityType),
    field('Number', f.entityId), el('button', { type: 'submit' }, 'Apply'));
  let page = 0;
  const load = async () => {
    const result = await apiIfPresent('/api/audit', { query: { page, size: 50, actor: f.actor.value.trim(),
      entityType: f.entityType.value, entityId: f.entityId.value } });
    if (!result) { clear(out, notYet('The change log')); return; }
    clear(out, el('table', { class: 'stack', id: 'audit-table' },
      el('thead', {}, el('tr', {}, ['When (UTC)', 'Who', 'Action', 'What', 'Fields changed'].map(h => el('th', {}, h)))),
      el('tbody', {}, result.items.map(a => el('tr', {},
        el('td', { 'data-label': 'When' }, utcText(a.at)), el('td', { 'data-label': 'Who' }, a.actor),
        el('td', { 'data-label': 'Action' }, a.action), el('td', { 'data-label': 'What' }, `${a.entityType} ${a.entityId}`),
        el('td', { 'data-label': 'Fields changed' }, changes(a)))))),
    el('div', { class: 'pager' },
      el('button', { type: 'button', class: 'secondary', disabled: page === 0, onclick: () => { page--; load(); } }, 'Previous'),
      el('span', {}, `Page ${page + 1} of ${Math.max(1, result.totalPages)} (${result.totalItems} changes)`),
      el('button', { type: 'button', class: 'secondary', disabled: page + 1 >= result.totalPages, onclick: () => { page++; load(); } }, 'Next')));
  };
  form.addEventListener('submit', e => { e.preventDefault(); page = 0; load(); });
  clear(main, el('h1', {}, 'Audit'), form, out);
  await load();
}

/** The fields whose values differ between the before and after views, as plain text. */
function changes(a) {
  if (!a.before || !a.after) return a.after ? 'created' : 'deleted';
  const keys = new Set([...Object.keys(a.before), ...Object.keys(a.after)]);
  const changed = [...keys].filter(k => !BOOKKEEPING.has(k) && JSON.stringify(a.before[k]) !== JSON.stringify(a.after[k]));
  if (!changed.length) return '—';
  return el('ul', {}, changed.map(k => el('li', {}, `${k}: ${short(a.before[k])} → ${short(a.after[k])}`)));
}

function short(v) {
  const t = v === null || v === undefined ? '—' : typeof v === 'string' ? v : JSON.stringify(v);
  return t.length > 60 ? t.slice(0, 57) + '…' : t;
}
