// The shell: who is signed in, the navigation, and one module per view loaded on demand.
import { api, clear, el, isReviewer, loadSession, markSignedIn, sayStale, session, ensureCsrf } from './api.js';

const views = {
  signin: './views/signin.js',
  tonight: './views/tonight.js',
  queue: './views/queue.js',
  new: './views/request-form.js',
  plan: './views/plan.js',
  programs: './views/programs.js',
  sites: './views/sites.js',
  audit: './views/audit.js',
};

const main = document.getElementById('view');

async function route() {
  const [name, ...rest] = (location.hash.replace(/^#\/?/, '') || 'tonight').split('/');
  if (session.auth && !session.user && name !== 'signin') {
    location.hash = '#/signin';
    return;
  }
  const key = views[name] ? name : 'tonight';
  for (const a of document.querySelectorAll('#nav a')) {
    if (a.getAttribute('href') === '#/' + key) a.setAttribute('aria-current', 'page');
    else a.removeAttribute('aria-current');
  }
  sayStale();
  clear(main, el('p', { class: 'loading' }, 'Loading…'));
  try {
    const view = await import(views[key]);
    await view.render(main, { params: rest, refreshShell });
  } catch (e) {
    clear(main, el('p', { class: 'error' }, 'This view failed to load: ' + e.message));
  }
  main.focus({ preventScroll: true });
}

async function signOut() {
  markSignedIn(false);
  const token = await ensureCsrf();
  await fetch('/logout', { method: 'POST', credentials: 'same-origin', headers: token ? { 'X-XSRF-TOKEN': token } : {} });
  await refreshShell();
  location.hash = '#/signin';
}

async function refreshShell() {
  await loadSession();
  document.getElementById('demo-notice').hidden = !session.demo;
  const who = document.getElementById('who');
  if (!session.auth) clear(who, 'No sign-in on this server');
  else if (session.user) {
    clear(who, el('span', {}, `${session.user.username} (${session.user.role})`), ' ',
      el('button', { type: 'button', class: 'link', onclick: signOut }, 'Sign out'));
  } else clear(who, el('a', { href: '#/signin' }, 'Sign in'));
  const reviewer = isReviewer();
  for (const li of document.querySelectorAll('#nav [data-role="reviewer"]')) li.hidden = !reviewer;
  document.getElementById('nav').hidden = session.auth && !session.user;
}

window.addEventListener('hashchange', route);
refreshShell().then(route);
// for the views: let them re-read the session after signing in
export { refreshShell, api };
