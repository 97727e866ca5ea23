// Undo without loss on the page (docs/undo.md): retire and restore a material or a sample, correct a sample's
// metadata or a material's index and made thicknesses as a new revision. Nothing here deletes anything, and
// every refusal is the server's problem detail, shown as it is (it names the field to change).
import * as api from './api.js';
import * as fmt from './format.js';

let ui = null;

/** `deps`: { showProblem, clearMessage, reopen(materialId) } — reopen reloads the list and the material. */
export function initCuration(deps) {
  ui = deps;
  const retired = document.getElementById('retired-materials');
  retired?.addEventListener('toggle', () => {
    if (retired.open) loadRetiredMaterials();
  });
}

// In server mode, the role each control needs (docs/accounts-and-roles.md); accounts.css hides the control from
// a role below it. Opening a retired material is reading, so that button needs nothing.
const NEEDS = {
  Retire: 'editor', 'Retire material': 'editor', 'Correct…': 'editor', Restore: 'admin', 'Restore material': 'admin',
};

function button(text, title, onClick, className = 'quiet small') {
  const b = document.createElement('button');
  if (NEEDS[text]) b.dataset.needs = NEEDS[text];
  b.type = 'button';
  b.className = className;
  b.textContent = text;
  b.title = title;
  b.addEventListener('click', onClick);
  return b;
}

async function act(what, action, materialId) {
  ui.clearMessage();
  try {
    const answer = await action();
    await ui.reopen(materialId);
    if (answer?.note) ui.showProblem({ title: 'Note', detail: answer.note }, what);
    refreshRetiredMaterials();
  } catch (problem) {
    ui.showProblem(problem, what);
  }
}

function when(instant) {
  return instant ? new Date(instant).toLocaleString() : '';
}

/** The material's record line: revision, in use or retired, and its controls. */
export function renderMaterialRecord(container, material) {
  const status = document.createElement('span');
  status.className = material.retiredAt ? 'record-status retired' : 'record-status';
  status.textContent = material.retiredAt
    ? `Retired ${when(material.retiredAt)}: hidden from listings and searches, kept, restorable · revision ${material.revision}`
    : `In use · revision ${material.revision} of its index and made thicknesses`;
  const toggle = material.retiredAt
    ? button('Restore material', 'bring it and the samples it had in use back into listings and searches',
      () => act('Restoring the material', () => api.restore('materials', material.id), material.id))
    : button('Retire material', 'hide it and all its samples from listings and searches; kept and restorable',
      () => act('Retiring the material', () => api.retire('materials', material.id), material.id));
  const form = materialForm(material);
  const correct = button('Correct…', 'correct its refractive index or made thicknesses as a new revision', () => {
    form.hidden = !form.hidden;
    correct.setAttribute('aria-expanded', String(!form.hidden));
  }, 'quiet small toggle');
  correct.setAttribute('aria-expanded', 'false');
  container.replaceChildren(status, toggle, correct, form);
}

function field(label, name, { type = 'text', placeholder = '', size = 8, options = null } = {}) {
  const wrap = document.createElement('label');
  wrap.className = 'field';
  const span = document.createElement('span');
  span.textContent = label;
  let input;
  if (options) {
    input = document.createElement('select');
    for (const [value, text] of options) {
      const o = document.createElement('option');
      o.value = value;
      o.textContent = text;
      input.append(o);
    }
  } else {
    input = document.createElement('input');
    input.type = type;
    input.placeholder = placeholder;
    input.size = size;
    if (type === 'number') input.step = 'any';
  }
  input.name = name;
  wrap.append(span, input);
  return wrap;
}

function correctionForm(fields, submitText, onSubmit) {
  const form = document.createElement('form');
  form.className = 'correction';
  form.hidden = true;
  const reason = field('Reason (kept with the revision)', 'reason', { placeholder: 'why the values change', size: 30 });
  reason.classList.add('reason');
  const submit = document.createElement('button');
  submit.type = 'submit';
  submit.textContent = submitText;
  const hint = document.createElement('p');
  hint.className = 'hint';
  hint.textContent = 'Fields left empty stay as they are. The curve never changes: it is the measurement; '
    + 'earlier revisions stay readable.';
  form.append(...fields, reason, submit, hint);
  form.addEventListener('submit', (event) => {
    event.preventDefault();
    const body = {};
    for (const el of form.elements) {
      if (el.name && el.value.trim() !== '') body[el.name] = el.value.trim();
    }
    onSubmit(body);
  });
  return form;
}

function materialForm(material) {
  return correctionForm([
    field('Refractive index n', 'indexN', { type: 'number', placeholder: fmt.number(material.refractiveIndex?.n ?? 1.5) }),
    field('Stock thicknesses', 'stockThicknesses', { placeholder: 'e.g. 2 3 6 or 25 50 um', size: 14 }),
    field('Made range', 'madeRange', { placeholder: 'e.g. 1 to 12', size: 10 }),
  ], 'Save as a new revision', (body) => act('Correcting the material',
    () => api.correct('materials', material.id, body), material.id));
}

/** The Data cell's controls for one sample in use, and the correction form row they open. */
export function sampleControls(material, sample, columns) {
  const retire = button('Retire', 'hide this sample from listings and searches; kept and restorable',
    () => act('Retiring the sample', () => api.retire('samples', sample.id), material.id));
  const formRow = document.createElement('tr');
  formRow.className = 'sample-correction';
  formRow.hidden = true;
  const td = document.createElement('td');
  td.colSpan = columns;
  const form = correctionForm([
    field('Thickness (mm)', 'thicknessMm', { type: 'number', placeholder: fmt.number(sample.thicknessMm) }),
    field('Geometry', 'geometry', { options: [['', `(${sample.geometry})`], ['regular', 'regular'], ['total', 'total']] }),
    field('Detection limit', 'detectionLimit', { type: 'number', placeholder: String(sample.detectionLimit) }),
    field('Instrument', 'instrument', { placeholder: sample.instrument || '', size: 14 }),
    field('Lot', 'lot', { placeholder: sample.lot || '', size: 8 }),
    field('Measured on', 'measuredOn', { type: 'date' }),
    field('Notes', 'notes', { placeholder: sample.notes || '', size: 20 }),
  ], 'Save as a new revision', (body) => act('Correcting the sample',
    () => api.correct('samples', sample.id, body), material.id));
  form.hidden = false;
  td.append(form);
  formRow.append(td);
  const correct = button('Correct…', `correct this sample's metadata as revision ${sample.revision + 1}`, () => {
    formRow.hidden = !formRow.hidden;
    correct.setAttribute('aria-expanded', String(!formRow.hidden));
  }, 'quiet small toggle');
  correct.setAttribute('aria-expanded', 'false');
  return { controls: [retire, correct], formRow };
}

/** The material's retired samples, each with a Restore button; empty when there are none. */
export function renderRetiredSamples(container, material) {
  const retired = material.retiredSamples || [];
  container.hidden = retired.length === 0;
  if (!retired.length) {
    container.replaceChildren();
    return;
  }
  const label = document.createElement('span');
  label.textContent = 'Retired samples (kept, hidden from listings and searches):';
  const list = document.createElement('ul');
  for (const s of retired) {
    const li = document.createElement('li');
    li.append(`${fmt.number(s.thicknessMm)} mm, ${s.geometry}, revision ${s.revision}, retired ${when(s.retiredAt)} `,
      button('Restore', 'bring this sample back into listings and searches',
        () => act('Restoring the sample', () => api.restore('samples', s.id), material.id)));
    list.append(li);
  }
  container.replaceChildren(label, list);
}

function refreshRetiredMaterials() {
  const retired = document.getElementById('retired-materials');
  if (retired?.open) loadRetiredMaterials();
}

async function loadRetiredMaterials() {
  const list = document.querySelector('#retired-materials ul');
  try {
    const materials = await api.listRetiredMaterials();
    if (!materials.length) {
      const li = document.createElement('li');
      li.textContent = 'none';
      list.replaceChildren(li);
      return;
    }
    list.replaceChildren(...materials.map(({ retiredAt, material }) => {
      const li = document.createElement('li');
      const open = button(material.name, 'open it (read-only until restored)', () => ui.reopen(material.id), 'link');
      li.append(open, ` · retired ${when(retiredAt)} `, button('Restore', 'bring it back into listings and searches',
        () => act('Restoring the material', () => api.restore('materials', material.id), material.id)));
      return li;
    }));
  } catch (problem) {
    ui.showProblem(problem, 'Listing the retired materials');
  }
}
