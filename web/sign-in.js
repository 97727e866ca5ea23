// The sign-in page of server mode: posts the form with fetch (the CSRF token read from the XSRF-TOKEN cookie
// goes back as a header) and shows the server's words when it refuses: a wrong name or password, or a pause
// after too many wrong passwords (with how long to wait).

// read here rather than imported from api.js: only this page's own files are served before sign-in
function csrfHeaders() {
  const cookie = document.cookie.split('; ').find((c) => c.startsWith('XSRF-TOKEN='));
  return cookie ? { 'X-XSRF-TOKEN': decodeURIComponent(cookie.slice('XSRF-TOKEN='.length)) } : {};
}

const form = document.getElementById('sign-in-form');
const message = document.getElementById('sign-in-message');

function say(text) {
  message.textContent = text;
  message.hidden = !text;
}

form.addEventListener('submit', async (event) => {
  event.preventDefault();
  say('');
  const body = new URLSearchParams(new FormData(form));
  let response;
  try {
    response = await fetch('sign-in', {
      method: 'POST',
      headers: { Accept: 'application/json, application/problem+json', ...csrfHeaders() },
      body,
    });
  } catch (networkError) {
    say(`The server cannot be reached: ${networkError.message}`);
    return;
  }
  if (response.ok) {
    window.location.assign('./');
    return;
  }
  let problem = null;
  try {
    problem = await response.json();
  } catch {
    problem = null;
  }
  if (response.status === 403 && !problem?.detail) {
    say('The page was open too long; reload it and sign in again.');
    return;
  }
  say(problem?.detail ? `${problem.title}: ${problem.detail}` : `Sign-in failed (${response.status}).`);
});
