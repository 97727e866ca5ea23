// Keyboard use of the Find view (docs/accessibility.md). A material opened from a result row (Enter or Space on
// its name) takes the focus to the material's heading, so that the next Tab goes on inside the material view
// instead of down the shortlist; "Back to the results", or Escape anywhere in the material view, returns the
// focus to the name it was opened from (looked up again: a later search may have redrawn the rows).

const detail = document.getElementById('material-detail');
const heading = document.getElementById('detail-name');
const results = document.getElementById('results-table');
const back = document.createElement('button');
let openedFrom = null; // the material id of the result row whose name opened the material view
let waiting = 0;

back.type = 'button';
back.id = 'back-to-results';
back.className = 'quiet small';
back.textContent = 'Back to the results';
back.hidden = true;
heading?.parentElement.append(back);

results?.addEventListener('click', (event) => {
  const link = event.target.closest('button.material-link');
  const row = link?.closest('tr[data-result-material-id]');
  if (!row) return;
  openedFrom = row.dataset.resultMaterialId;
  focusHeadingOnceShown(link.textContent, ++waiting);
});

back.addEventListener('click', returnToResults);
detail?.addEventListener('keydown', (event) => {
  if (event.key !== 'Escape' || back.hidden) return;
  event.preventDefault();
  returnToResults();
});

/** Waits (a few seconds at most) for the material view to show `name`, then focuses its heading. */
function focusHeadingOnceShown(name, turn, deadline = performance.now() + 5000) {
  if (turn !== waiting) return; // another result was opened meanwhile
  if (!detail.hidden && heading.textContent === name) {
    back.hidden = false;
    heading.tabIndex = -1; // focusable by script only: not an extra Tab stop
    heading.focus({ preventScroll: true }); // the page has already scrolled the view in
    return;
  }
  if (performance.now() < deadline) requestAnimationFrame(() => focusHeadingOnceShown(name, turn, deadline));
}

function returnToResults() {
  const link = openedFrom === null ? null
    : results.querySelector(`tr[data-result-material-id="${CSS.escape(openedFrom)}"] button.material-link`);
  back.hidden = true;
  if (!link || results.closest('[hidden]')) return;
  link.scrollIntoView({ block: 'center' });
  link.focus({ preventScroll: true });
}
