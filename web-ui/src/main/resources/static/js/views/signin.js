// Sign-in: a session cookie from the server's form login, CSRF token from its cookie.
import { clear, el, ensureCsrf, field, markSignedIn, say, session } from '../api.js';

export async function render(main, { refreshShell }) {
  if (!session.auth) {
    clear(main, el('h1', {}, 'Sign in'), el('p', {}, 'This server has no accounts: everything is open.'),
      el('p', {}, el('a', { href: '#/tonight' }, 'Go to Tonight')));
    return;
  }
  const user = el('input', { name: 'username', autocomplete: 'username', required: true });
  const pass = el('input', { name: 'password', type: 'password', autocomplete: 'current-password', required: true });
  const problem = el('p', { class: 'error', role: 'alert' });
  const form = el('form', { class: 'card', id: 'signin-form', style: 'max-width: 360px' },
    field('User name', user), field('Password', pass), problem,
    el('button', { type: 'submit' }, 'Sign in'));
  form.addEventListener('submit', async ev => {
    ev.preventDefault();
    problem.textContent = '';
    const token = await ensureCsrf();
    const body = new URLSearchParams({ username: user.value, password: pass.value });
    if (token) body.set('_csrf', token);
    const res = await fetch('/login', {
      method: 'POST', credentials: 'same-origin', body,
      headers: token ? { 'X-XSRF-TOKEN': token } : {},
    });
    if (!res.ok || res.url.includes('error')) {
      problem.textContent = 'User name or password not recognised.';
      pass.value = '';
      pass.focus();
      return;
    }
    markSignedIn(true);
    await refreshShell();
    if (!session.user) { problem.textContent = 'Signed in, but the server did not confirm the session.'; return; }
    say(`Signed in as ${session.user.username}.`, 'ok');
    location.hash = '#/tonight';
  });
  clear(main, el('h1', {}, 'Sign in'),
    session.demo ? el('p', { class: 'caution' }, 'This server runs in demo mode: the data is invented and the demo accounts share the password “demo”. Do not enter real observations here.') : null,
    form);
  user.focus();
}
