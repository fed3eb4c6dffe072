// Shared module: calls to the REST API, problem documents, DOM building that never parses HTML,
// and times shown in a site's zone with UTC on hover.

/** An API answer that was not 2xx; `problem` is the RFC 9457 document when the server sent one. */
export class ApiError extends Error {
  constructor(status, problem) {
    super((problem && (problem.detail || problem.title)) || `HTTP ${status}`);
    this.status = status;
    this.problem = problem || {};
    /** field name -> list of messages, from the problem's `errors` */
    this.fields = {};
    for (const e of this.problem.errors || []) {
      (this.fields[e.field] ||= []).push(e.message);
    }
    if (this.problem.parameter && !this.problem.errors) {
      this.fields[this.problem.parameter] = [this.problem.detail || 'invalid'];
    }
  }
}

function cookie(name) {
  const hit = document.cookie.split('; ').find(c => c.startsWith(name + '='));
  return hit ? decodeURIComponent(hit.slice(name.length + 1)) : null;
}

/** Makes sure the session has a CSRF cookie; the server writes it on the sign-in page. */
export async function ensureCsrf() {
  if (!cookie('XSRF-TOKEN')) {
    await fetch('/login', { credentials: 'same-origin', headers: { Accept: 'text/html' } }).catch(() => {});
  }
  return cookie('XSRF-TOKEN');
}

/**
 * Calls the API. `query` entries that are null, undefined or '' are left out.
 * Resolves to the parsed JSON (or null for 204); rejects with ApiError.
 */
export async function api(path, { method = 'GET', body, query, signal } = {}) {
  const url = new URL(path, location.origin);
  for (const [k, v] of Object.entries(query || {})) {
    if (v !== null && v !== undefined && v !== '') url.searchParams.set(k, v);
  }
  // X-Requested-With marks a script's call, so that a server can answer 401 without the
  // WWW-Authenticate challenge that would open the browser's own password dialog.
  const headers = { Accept: 'application/json, application/problem+json', 'X-Requested-With': 'XMLHttpRequest' };
  if (body !== undefined) headers['Content-Type'] = 'application/json';
  if (method !== 'GET' && method !== 'HEAD') {
    const token = await ensureCsrf();
    if (token) headers['X-XSRF-TOKEN'] = token;
  }
  const res = await fetch(url, {
    method, headers, signal, credentials: 'same-origin',
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const text = await res.text();
  let data = null;
  if (text) {
    try { data = JSON.parse(text); } catch { data = null; }
  }
  if (res.status === 401 && !path.startsWith('/api/accounts/me')) {
    // the session ended: back to the sign-in page
    markSignedIn(false);
    location.hash = '#/signin';
  }
  if (!res.ok) throw new ApiError(res.status, data);
  return data;
}

/** Like api(), but answers `null` when the endpoint is not there (404/405) instead of failing. */
export async function apiIfPresent(path, options) {
  try {
    return await api(path, options);
  } catch (e) {
    if (e instanceof ApiError && (e.status === 404 || e.status === 405) && !e.problem.errors) return null;
    throw e;
  }
}

/** Reads every page of a list endpoint (bounded, for reference data such as sites). */
export async function all(path, query = {}) {
  const items = [];
  for (let page = 0; page < 20; page++) {
    const p = await api(path, { query: { ...query, page, size: 500 } });
    items.push(...p.items);
    if (page + 1 >= p.totalPages) break;
  }
  return items;
}

// ---- DOM: text only, never innerHTML with data ----

/**
 * el('td', {class: 'x', title: 't', onclick: f}, 'text', child...) builds an element.
 * Strings become text nodes, so user text can never turn into markup.
 */
export function el(tag, attrs = {}, ...children) {
  const node = tag.includes(':')
    ? document.createElementNS('http://www.w3.org/2000/svg', tag.split(':')[1])
    : document.createElement(tag);
  for (const [k, v] of Object.entries(attrs || {})) {
    if (v === null || v === undefined || v === false) continue;
    if (k.startsWith('on') && typeof v === 'function') node.addEventListener(k.slice(2), v);
    else if (k === 'dataset') Object.assign(node.dataset, v);
    else node.setAttribute(k, v === true ? '' : String(v));
  }
  append(node, children);
  return node;
}

function append(node, children) {
  for (const c of children.flat(Infinity)) {
    if (c === null || c === undefined || c === false) continue;
    node.append(c instanceof Node ? c : document.createTextNode(String(c)));
  }
}

export function clear(node, ...children) {
  node.replaceChildren();
  append(node, children);
  return node;
}

/** A labelled form field; the error slot beside it is filled by showFieldErrors. */
export function field(label, input, help) {
  const id = input.id || (input.id = 'f-' + (input.name || Math.random().toString(36).slice(2)).replace(/[^\w-]/g, '_'));
  const err = el('span', { class: 'field-error', id: id + '-error', 'aria-live': 'polite' });
  input.setAttribute('aria-describedby', id + '-error');
  // A message about the old value goes as soon as the value is changed; the next answer says whether it is right.
  const fixed = () => { err.textContent = ''; input.removeAttribute('aria-invalid'); };
  input.addEventListener('input', fixed);
  input.addEventListener('change', fixed);
  return el('div', { class: 'field', dataset: { field: input.name || '' } },
    el('label', { for: id }, label), input, help ? el('small', { class: 'help' }, help) : null, err);
}

/**
 * Shows an ApiError's field messages beside the fields of `form` (matched by `name`, and by the
 * longest name that prefixes the error's field, so `exposures[0].seconds` finds its row).
 * Answers the messages that found no field, for a summary.
 */
export function showFieldErrors(form, error) {
  for (const slot of form.querySelectorAll('.field-error')) slot.textContent = '';
  for (const input of form.querySelectorAll('[aria-invalid]')) input.removeAttribute('aria-invalid');
  const orphans = [];
  for (const [name, messages] of Object.entries(error.fields || {})) {
    const input = form.querySelector(`[name="${CSS.escape(name)}"]`) || prefixMatch(form, name);
    if (!input) { orphans.push(`${name}: ${messages.join('; ')}`); continue; }
    input.setAttribute('aria-invalid', 'true');
    const slot = form.querySelector('#' + CSS.escape(input.id + '-error'));
    if (slot) slot.textContent = messages.join('; ');
    else orphans.push(`${name}: ${messages.join('; ')}`);
  }
  return orphans;
}

function prefixMatch(form, name) {
  let best = null;
  for (const input of form.querySelectorAll('[name]')) {
    if (name.startsWith(input.name) && (!best || input.name.length > best.name.length)) best = input;
  }
  return best;
}

export function clearFieldErrors(form) {
  showFieldErrors(form, { fields: {} });
}

// ---- times ----

const formatters = new Map();

function formatter(zone, withDate) {
  const key = zone + '|' + withDate;
  if (!formatters.has(key)) {
    formatters.set(key, new Intl.DateTimeFormat('en-GB', {
      timeZone: zone, hour: '2-digit', minute: '2-digit', hourCycle: 'h23',
      ...(withDate ? { day: 'numeric', month: 'short' } : {}),
    }));
  }
  return formatters.get(key);
}

/**
 * A site's clock: its IANA zone, or local mean solar time (UTC + longitude/15 h) when it has none,
 * as the server's night boundaries do.
 */
export function siteClock(site) {
  if (site && site.timeZone) return { zone: site.timeZone, offsetMs: 0, label: site.timeZone };
  const offsetMs = Math.round(((site ? site.longitudeDeg : 0) / 15) * 3600e3);
  return { zone: 'UTC', offsetMs, label: 'local mean solar time' };
}

/** 'HH:MM' (or 'd Mon HH:MM') in the site's clock. */
export function localTime(iso, clock, withDate = false) {
  if (!iso) return '—';
  const t = new Date(new Date(iso).getTime() + (clock ? clock.offsetMs : 0));
  return formatter(clock ? clock.zone : 'UTC', withDate).format(t);
}

export function utcText(iso) {
  return iso ? new Date(iso).toISOString().replace('T', ' ').replace(/:\d\d\.\d{3}Z$/, ' UTC') : '';
}

/** A <time> showing the site's local time, with UTC in its title. */
export function timeEl(iso, clock, withDate = false) {
  if (!iso) return el('span', { class: 'absent', title: 'does not happen this night' }, 'none');
  return el('time', { datetime: iso, title: utcText(iso), tabindex: 0 }, localTime(iso, clock, withDate));
}

/** Today's calendar date in the site's clock, YYYY-MM-DD. */
export function siteToday(clock, plusDays = 0) {
  const t = new Date(Date.now() + clock.offsetMs + plusDays * 86400e3);
  return new Intl.DateTimeFormat('en-CA', { timeZone: clock.zone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(t);
}

/** The UTC instant (ISO) of a wall-clock time 'YYYY-MM-DDTHH:MM' read in the site's clock. */
export function siteWallToUtc(wall, clock) {
  const guess = Date.parse(wall + ':00Z') - clock.offsetMs;
  const offset = zoneOffsetMs(clock.zone, new Date(guess));
  return new Date(guess - offset).toISOString();
}

/** The offset of an IANA zone from UTC at an instant, from Intl (no library needed). */
export function zoneOffsetMs(zone, at) {
  const parts = new Intl.DateTimeFormat('en-US', { timeZone: zone, hourCycle: 'h23', year: 'numeric', month: '2-digit',
    day: '2-digit', hour: '2-digit', minute: '2-digit', second: '2-digit' }).formatToParts(at);
  const p = Object.fromEntries(parts.map(x => [x.type, x.value]));
  return Date.UTC(p.year, p.month - 1, p.day, p.hour, p.minute, p.second) - Math.floor(at.getTime() / 1000) * 1000;
}

export function addDays(ymd, days) {
  const d = new Date(ymd + 'T12:00:00Z');
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
}

export function hours(ms) {
  return (ms / 3600e3).toFixed(1);
}

export function deg(x, digits = 1) {
  return x === null || x === undefined ? '—' : `${Number(x).toFixed(digits)}°`;
}

/** Right ascension in degrees as h:m:s text. */
export function raText(raDeg) {
  const h = ((raDeg / 15) % 24 + 24) % 24;
  const hh = Math.floor(h), mm = Math.floor((h - hh) * 60), ss = ((h - hh) * 60 - mm) * 60;
  return `${String(hh).padStart(2, '0')}h${String(mm).padStart(2, '0')}m${ss.toFixed(1).padStart(4, '0')}s`;
}

export function decText(decDeg) {
  const s = decDeg < 0 ? '−' : '+';
  const a = Math.abs(decDeg), d = Math.floor(a), m = Math.floor((a - d) * 60), sec = ((a - d) * 60 - m) * 60;
  return `${s}${d}°${String(m).padStart(2, '0')}′${sec.toFixed(0).padStart(2, '0')}″`;
}

// ---- who is signed in ----

/** The session: `{username, role}` or null; `auth` false when the server has no sign-in at all. */
export const session = { user: null, auth: true, demo: false };

// The server answers a signed-out call with 401; without the X-Requested-With mark it adds
// `WWW-Authenticate: Basic`, on which browsers open their own password dialog. Every call here is
// marked, and the dashboard still asks who is signed in only when it signed someone in itself (a
// marker, no secret, in localStorage), which saves a call on every page load of a signed-out visitor.
const SIGNED_IN = 'skyrota.signedIn';

export function markSignedIn(on) {
  if (on) localStorage.setItem(SIGNED_IN, '1');
  else localStorage.removeItem(SIGNED_IN);
}

export async function loadSession() {
  session.user = null;
  session.auth = true;
  session.demo = false;
  try {
    const about = await api('/api/about');
    session.demo = Boolean(about && about.demo);
  } catch (e) {
    // A server without accounts has no /api/about either: everything is open.
    if (e instanceof ApiError && e.status === 404) session.auth = false;
  }
  if (session.auth && localStorage.getItem(SIGNED_IN)) {
    try {
      session.user = await api('/api/accounts/me');
    } catch {
      markSignedIn(false);
    }
  }
  return session;
}

export function isReviewer() {
  if (!session.auth) return true;
  return Boolean(session.user && (session.user.role === 'coordinator' || session.user.role === 'admin'));
}

export function isAdmin() {
  if (!session.auth) return true;
  return Boolean(session.user && session.user.role === 'admin');
}

/** Sets the page's status line (aria-live) for outcomes of actions. */
let saidAt = 0;
export function say(text, kind = 'info') {
  const s = document.getElementById('status');
  if (!s) return;
  s.className = 'status ' + kind;
  s.textContent = text;
  saidAt = Date.now();
}

/** Clears the status line on navigation, unless an action just set it (then it outlives the move). */
export function sayStale() {
  if (Date.now() - saidAt > 1500) say('');
}

/** The text for a view that needs an endpoint the server does not have yet. */
export function notYet(what) {
  return el('p', { class: 'not-yet' }, `${what}: not available yet on this server.`);
}

// ---- the plan (endpoints proposed to the server; null while they are absent) ----

/**
 * `kind` is 'published' or 'draft'. Answers
 * {revision, publishedAt, visits:[{id, requestId, targetName, raDeg, decDeg, telescopeId, night,
 * start, end, pinned, programId, owner}], closedNights:[{telescopeId, night}], unplaced:[...]}
 * or null when the server has no plan endpoints yet.
 */
export function loadPlan(kind, from, to, siteId) {
  return apiIfPresent(`/api/plans/${kind}`, { query: { from, to, siteId } });
}

/** The signed-in person's published visits as an iCalendar feed (proposed endpoint). */
export const CALENDAR_PATH = '/api/calendar/mine.ics';

/** Whether a GET of `path` answers 2xx (for links to feeds the server may not have yet). */
export async function exists(path) {
  try {
    const r = await fetch(path, { credentials: 'same-origin', headers: { 'X-Requested-With': 'XMLHttpRequest' } });
    return r.ok;
  } catch { return false; }
}

/** 1 is the lowest priority and 5 the highest, as the planner counts. */
export function priorityLabel(p) {
  return p === 1 ? '1 (lowest)' : p === 5 ? '5 (highest)' : String(p);
}

/** A request's repeats as a person reads them: "×3, at least 24 h apart, tolerance 2 h". */
export function repeatsText(r) {
  if (r.repeats <= 1) return '×1';
  if (r.repeatIntervalHours == null) return `×${r.repeats}, no spacing asked`;
  const tolerance = r.repeatToleranceHours || 0;
  return `×${r.repeats}, at least ${r.repeatIntervalHours} h apart` + (tolerance > 0 ? `, tolerance ${tolerance} h` : '');
}
