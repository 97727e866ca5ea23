// The change-log page (docs/audit.md): reads GET api/audit a page at a time, newest first, optionally about one
// sample or one material, and shows each entry with its values before and after. Text only, never markup: every
// value comes from the server as data.

const PAGE = 100;

const dom = {
  form: document.getElementById('audit-filter'),
  sample: document.getElementById('audit-sample'),
  material: document.getElementById('audit-material'),
  summary: document.getElementById('audit-summary'),
  rows: document.getElementById('audit-rows'),
  older: document.getElementById('audit-older'),
  message: document.getElementById('message'),
};

const state = { filter: {}, nextBefore: null, shown: 0 };

/** The address of one page: the filter, the page size and, for an older page, the cursor. */
export function pageUrl(filter, before) {
  const params = new URLSearchParams();
  params.set('limit', String(PAGE));
  if (filter.sampleId) params.set('sampleId', filter.sampleId);
  if (filter.materialId) params.set('materialId', filter.materialId);
  if (before) params.set('before', String(before));
  return `api/audit?${params}`;
}

async function fetchPage(url) {
  const response = await fetch(url, { headers: { Accept: 'application/json, application/problem+json' } });
  const type = response.headers.get('content-type') || '';
  const body = type.includes('json') ? await response.json() : null;
  if (!response.ok) {
    const why = body && (body.detail || body.title);
    throw new Error(why || `the server answered ${response.status} ${response.statusText}`);
  }
  return body;
}

function showMessage(text) {
  dom.message.textContent = text;
  dom.message.hidden = !text;
}

/** The keys whose values differ between before and after: marked in both columns. */
export function changedKeys(before, after) {
  if (!before || !after || typeof before !== 'object' || typeof after !== 'object') return new Set();
  const keys = new Set([...Object.keys(before), ...Object.keys(after)]);
  return new Set([...keys].filter((k) => JSON.stringify(before[k]) !== JSON.stringify(after[k])));
}

function valuesBlock(title, values, changed) {
  const box = document.createElement('div');
  const heading = document.createElement('h3');
  heading.textContent = title;
  const pre = document.createElement('pre');
  if (values === null || values === undefined) {
    pre.textContent = '—';
  } else if (typeof values === 'object' && !Array.isArray(values)) {
    for (const [key, value] of Object.entries(values)) {
      const line = document.createElement('span');
      line.textContent = `${key}: ${JSON.stringify(value)}\n`;
      if (changed.has(key)) line.className = 'audit-changed';
      pre.append(line);
    }
  } else {
    pre.textContent = JSON.stringify(values, null, 2);
  }
  box.append(heading, pre);
  return box;
}

function cell(text, className) {
  const td = document.createElement('td');
  td.textContent = text;
  if (className) td.className = className;
  return td;
}

function entryRow(entry) {
  const tr = document.createElement('tr');
  tr.dataset.entryId = entry.id;
  tr.dataset.action = entry.action;
  const subject = entry.subjectId === null ? entry.subjectKind : `${entry.subjectKind} ${entry.subjectId}`;
  const summary = document.createElement('td');
  summary.textContent = entry.summary;
  if (entry.before !== null || entry.after !== null) {
    const details = document.createElement('details');
    const open = document.createElement('summary');
    open.textContent = entry.before === null ? 'Values' : 'Before and after';
    const values = document.createElement('div');
    values.className = 'audit-values';
    const changed = changedKeys(entry.before, entry.after);
    values.append(valuesBlock('Before', entry.before, changed), valuesBlock('After', entry.after, changed));
    details.append(open, values);
    summary.append(details);
  }
  tr.append(cell(String(entry.id), 'num'), cell(entry.recordedAt.replace('T', ' ').replace('Z', '')),
    cell(entry.actor), cell(entry.action), cell(subject), summary);
  return tr;
}

async function show(before) {
  showMessage('');
  try {
    const page = await fetchPage(pageUrl(state.filter, before));
    const rows = page.entries.map(entryRow);
    if (before) {
      dom.rows.append(...rows);
    } else {
      dom.rows.replaceChildren(...rows);
      state.shown = 0;
    }
    state.shown += rows.length;
    state.nextBefore = page.nextBefore;
    dom.older.hidden = page.nextBefore === null;
    dom.summary.textContent = state.shown === 0 ? 'No change recorded for this choice.'
      : `${state.shown === 1 ? '1 change' : `${state.shown} changes`} shown, newest first`
        + (page.nextBefore === null ? '.' : '; older ones below.');
  } catch (error) {
    showMessage(`The change log could not be read: ${error.message}`);
  }
}

function readFilter() {
  const filter = {};
  if (dom.sample.value.trim()) filter.sampleId = dom.sample.value.trim();
  if (dom.material.value.trim()) filter.materialId = dom.material.value.trim();
  return filter;
}

if (dom.form) {
  // a link such as audit.html?sampleId=12 opens the log of that sample
  const asked = new URLSearchParams(window.location.search);
  dom.sample.value = asked.get('sampleId') || '';
  dom.material.value = asked.get('materialId') || '';
  dom.form.addEventListener('submit', () => {
    state.filter = readFilter();
    show(null);
  });
  dom.older.addEventListener('click', () => show(state.nextBefore));
  state.filter = readFilter();
  show(null);
}
