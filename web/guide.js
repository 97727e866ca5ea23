// "How to write a requirement": the requirement language's guide, as the server reads it
// (GET /api/requirements/guide: clause forms with one example each, units and their ranges, and the names
// this library accepts). Loaded when first opened; an example's "Try" button puts it into the requirement
// box. Every text is set as textContent, never as HTML. Also links the API's OpenAPI document for scripts.

const GUIDE_URL = 'api/requirements/guide';

const el = (tag, text, className) => {
  const node = document.createElement(tag);
  if (text !== undefined) node.textContent = text;
  if (className) node.className = className;
  return node;
};

function heading(text) {
  return el('h3', text, 'guide-heading');
}

function formsTable(forms, onTry) {
  const table = el('table', undefined, 'data-table guide-forms');
  const head = table.createTHead().insertRow();
  for (const title of ['Clause', 'Example', 'Read as']) {
    const th = el('th', title);
    th.scope = 'col';
    head.appendChild(th);
  }
  const body = table.createTBody();
  for (const form of forms) {
    const row = body.insertRow();
    row.appendChild(el('td', form.name));
    const example = el('td', undefined, 'guide-example');
    example.appendChild(el('code', form.example));
    const tryIt = el('button', 'Try', 'guide-try');
    tryIt.type = 'button';
    tryIt.setAttribute('aria-label', `Try “${form.example}”: put it into the requirement box`); // the visible word first (WCAG 2.5.3)
    tryIt.addEventListener('click', () => onTry(form.example));
    example.appendChild(tryIt);
    row.appendChild(example);
    row.appendChild(el('td', form.meaning));
  }
  return table;
}

function unitsList(units) {
  const list = el('dl', undefined, 'guide-units');
  for (const unit of units) {
    list.appendChild(el('dt', unit.quantity));
    const dd = el('dd', `${unit.written}; ${unit.range} (e.g. `);
    dd.appendChild(el('code', unit.example));
    dd.appendChild(document.createTextNode(')'));
    list.appendChild(dd);
  }
  return list;
}

function namesList(guide) {
  const list = el('dl', undefined, 'guide-names');
  const add = (term, values, note) => {
    list.appendChild(el('dt', term));
    const dd = el('dd', values.length ? values.join(', ') : 'none in this library');
    if (note) dd.appendChild(el('span', ` — ${note}`, 'guide-note'));
    list.appendChild(dd);
  };
  add('Comparisons', guide.comparisons, 'over/at least: at least; under/at most: at most');
  add('Material classes (class …)', guide.materialClasses, "this library's classes");
  add('Emitters (… of NAME)', guide.emitters, `or described by name: ${guide.describedEmitters}`);
  add('Responses (weighted by NAME)', guide.responses);
  add('Provenance (provenance …)', guide.provenances);
  add('Geometry (geometry …)', guide.geometries);
  return list;
}

export function renderGuide(container, answer, onTry) {
  const guide = answer.guide;
  container.replaceChildren();
  container.appendChild(el('p', `${guide.joining}.`, 'guide-joining'));
  container.appendChild(heading('Clauses'));
  const scroll = el('div', undefined, 'table-scroll');
  scroll.appendChild(formsTable(guide.forms, onTry));
  container.appendChild(scroll);
  container.appendChild(heading('Numbers and units'));
  container.appendChild(unitsList(guide.units));
  container.appendChild(heading('Names you can use'));
  container.appendChild(namesList(guide));
  const api = el('p', 'Scripts: every endpoint of the HTTP API, with its parameters and error answers, is described in the ', 'guide-api');
  const link = el('a', 'OpenAPI document');
  link.href = answer.apiDescription.replace(/^\//, ''); // relative, as the page's other requests
  api.appendChild(link);
  api.appendChild(document.createTextNode('.'));
  container.appendChild(api);
}

async function load(body) {
  body.textContent = 'Loading the guide…';
  try {
    const response = await fetch(GUIDE_URL, { headers: { Accept: 'application/json, application/problem+json' } });
    const answer = await response.json();
    if (!response.ok) throw new Error(answer.detail || answer.title || `HTTP ${response.status}`);
    return answer;
  } catch (error) {
    body.textContent = `The guide could not be loaded: ${error.message}`;
    return null;
  }
}

export function initGuide({ details, body, requirementInput }) {
  if (!details || !body) return;
  let loaded = false;
  const onTry = (example) => {
    if (!requirementInput) return;
    requirementInput.value = example;
    requirementInput.dispatchEvent(new Event('input', { bubbles: true }));
    requirementInput.focus();
  };
  details.addEventListener('toggle', async () => {
    if (!details.open || loaded) return;
    const answer = await load(body);
    if (answer) {
      loaded = true;
      renderGuide(body, answer, onTry);
    }
  });
}

initGuide({
  details: document.getElementById('requirement-guide'),
  body: document.getElementById('requirement-guide-body'),
  requirementInput: document.getElementById('requirement-text'),
});
