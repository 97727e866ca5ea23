// Who is signed in, in server mode (docs/accounts-and-roles.md): the header shows the name and role with a
// sign-out control, and the page hides the controls the role may not use (elements marked data-needs="editor"
// or "admin", hidden by the body's data-role through accounts.css). A refusal that happens anyway is the
// server's problem detail, shown like every other one. The embedded tool answers mode "embedded", and then
// nothing here shows.
import { csrfHeaders } from './api.js';

const ROLE_WORDS = {
  viewer: 'viewer — reads, searches, exports',
  editor: 'editor — also imports, corrects, retires',
  admin: 'admin — also restores and manages accounts',
};

async function loadSession() {
  let response;
  try {
    response = await fetch('api/session', { headers: { Accept: 'application/json, application/problem+json' } });
  } catch {
    return; // the page's own requests will say the server is unreachable
  }
  if (response.status === 401) {
    window.location.assign('sign-in.html'); // the session ended (signed out elsewhere, or the account disabled)
    return;
  }
  if (!response.ok) return;
  const session = await response.json();
  if (session.mode !== 'server' || !session.signedIn) return;
  document.body.dataset.role = session.role;
  showWhoIsSignedIn(session);
}

function showWhoIsSignedIn(session) {
  const bar = document.createElement('div');
  bar.className = 'signed-in';
  bar.id = 'signed-in';
  const who = document.createElement('span');
  who.textContent = `Signed in as ${session.name}, ${ROLE_WORDS[session.role] || session.role}`;
  const out = document.createElement('button');
  out.type = 'button';
  out.className = 'quiet small';
  out.textContent = 'Sign out';
  out.addEventListener('click', signOut);
  bar.append(who, ' ', out);
  document.querySelector('.site-header')?.append(bar);
}

async function signOut() {
  try {
    await fetch('sign-out', { method: 'POST', headers: csrfHeaders() });
  } finally {
    window.location.assign('sign-in.html');
  }
}

loadSession();
