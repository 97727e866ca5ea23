// Bring transmittance curves into the library from the page (docs/curve-import-page.md): every file chosen
// or dropped is read by the server without storing (POST /api/imports/preview) and shown — its curve, what
// was detected, every warning — beside a form for what the file cannot say (material, thickness, …); only
// "Store" keeps it (POST /api/imports). A zip with a manifest.csv goes whole to POST /api/imports/batch.
// Every name, note and message is set as text, never as HTML.
import { ApiProblem, csrfHeaders, listMaterials } from './api.js';
import * as fmt from './format.js';
import { drawCurves, followWidth } from './chart.js';

const BASE = 'api';
const CURVE_COLOUR = '#1d6a86';
const KNOWN_CLASSES = ['window glass', 'optical glass', 'fused silica', 'plastic sheet', 'film', 'coating',
  'resin-tank sheet', 'mask film', 'laminate', 'other'];
// Read options the preview and the import both take (ImportController's ReadForm, KeepForm, AxisForm).
const READ_FIELDS = ['format', 'yKind', 'xUnit', 'decimalMark', 'block', 'from', 'to', 'uncertainty'];
// What the import adds (StoreForm), sent only when filled.
const STORE_FIELDS = ['thicknessMm', 'geometry', 'provenance', 'instrument', 'measuredOn', 'lot', 'notes'];
const NEW_MATERIAL_FIELDS = ['materialName', 'materialClass', 'scaling', 'indexN', 'description', 'stockThicknesses'];
// A file stored as a sample's curve in another state (POST /api/samples/{id}/states, docs/material-states.md):
// the state's fields, and of the sample fields only the thickness and notes.
const STATE_FIELDS = ['state', 'hours', 'source', 'doseJPerCm2', 'doseNm', 'inkLoadPercent', 'statedDensity'];
const STATE_SAMPLE_FIELDS = ['thicknessMm', 'notes'];
const Y_KIND_WORDS = {
  transmittance_fraction: 'transmittance (fraction)',
  transmittance_percent: 'transmittance (%)',
  absorbance: 'absorbance (−log₁₀ T)',
};
const X_UNIT_WORDS = {
  nanometre: 'nm',
  micrometre: 'µm (converted to nm)',
  angstrom: 'Å (converted to nm)',
  wavenumber_per_cm: 'wavenumber, cm⁻¹ (converted to nm)',
};
// The form's own words for the fields a problem may name (the API's parameter names mean nothing on the page).
const FIELD_LABELS = {
  materialId: 'Material', materialName: 'Name', materialClass: 'Class', scaling: 'Scaling', indexN: 'Refractive index',
  description: 'Description', stockThicknesses: 'Stock thicknesses', madeRange: 'Stock thicknesses',
  thicknessMm: 'Thickness', geometry: 'Geometry', provenance: 'Provenance', instrument: 'Instrument',
  measuredOn: 'Measured on', lot: 'Lot', notes: 'Notes', format: 'Format', yKind: 'Values are',
  xUnit: 'Wavelength unit', decimalMark: 'Decimal mark', block: 'JCAMP-DX block', eachBlock: 'Every block',
  from: 'Keep from', to: 'Keep to', uncertainty: 'Instrument uncertainty',
  stateSample: 'Sample', state: 'State', hours: 'Hours', source: 'Under', doseJPerCm2: 'Dose (J/cm²)', doseNm: 'at (nm)',
  inkLoadPercent: 'Ink load (%)', statedDensity: 'Stated density',
};
const OUTCOME_WORDS = { STORED: 'stored', DUPLICATE: 'already stored', REFUSED: 'refused' };

let nextCard = 0;

// ---------- HTTP: multipart posts whose failures become ApiProblems ----------

async function postForm(path, form) {
  let response;
  try {
    response = await fetch(`${BASE}/${path}`, {
      method: 'POST', body: form, headers: { Accept: 'application/json, application/problem+json', ...csrfHeaders() },
    });
  } catch (networkError) {
    throw new ApiProblem({ status: 0, title: 'Server not reachable', detail: networkError.message });
  }
  let body = null;
  try {
    body = await response.json();
  } catch {
    body = null; // the status line below still says what happened
  }
  if (!response.ok) {
    throw new ApiProblem({
      status: body?.status ?? response.status,
      title: body?.title || response.statusText || 'The server refused the file',
      detail: body?.detail || 'The server gave no reason.',
      type: body?.type,
      properties: body && typeof body === 'object' ? body : {},
    });
  }
  return body;
}

function formWith(file, values) {
  const form = new FormData();
  form.set('file', file, file.name);
  for (const [key, value] of Object.entries(values)) {
    if (value !== undefined && value !== null && String(value).trim() !== '') form.set(key, String(value).trim());
  }
  return form;
}

// ---------- small DOM helpers ----------

function node(tag, className, text) {
  const e = document.createElement(tag);
  if (className) e.className = className;
  if (text !== undefined && text !== null) e.textContent = text;
  return e;
}

/** A labelled control: `<label class="field"><span>Label</span><input name=…></label>`. */
function field(label, control, { wide = false, hint } = {}) {
  const wrap = node('label', `field${wide ? ' wide' : ''}`);
  wrap.append(node('span', null, label), control);
  if (hint) {
    const small = node('small', 'hint', hint);
    wrap.append(small);
  }
  return wrap;
}

function input(name, { type = 'text', placeholder, size, list, step, min } = {}) {
  const e = document.createElement('input');
  e.type = type;
  e.name = name;
  e.autocomplete = 'off';
  e.spellcheck = false;
  if (placeholder) e.placeholder = placeholder;
  if (size) e.size = size;
  if (list) e.setAttribute('list', list);
  if (step) e.step = step;
  if (min !== undefined) e.min = min;
  if (type === 'number') e.inputMode = 'decimal';
  return e;
}

function select(name, options) {
  const e = document.createElement('select');
  e.name = name;
  for (const [value, label] of options) {
    const o = document.createElement('option');
    o.value = value;
    o.textContent = label;
    e.append(o);
  }
  return e;
}

/**
 * A problem as one short sentence for the person who chose the file: where (line, column or form field)
 * and what. No status code: the place and the reason are what can be acted on.
 */
export function problemText(problem) {
  const p = problem?.properties || {};
  const where = [];
  if (Number.isFinite(p.line) && p.line > 0) where.push(`line ${p.line}`);
  if (p.field) where.push(`column “${p.field}”`);
  if (p.parameter) where.push(`field “${FIELD_LABELS[p.parameter] || p.parameter}”`);
  let what = p.problem || problem?.detail || problem?.message || 'the server refused it';
  if (!p.problem && p.parameter) what = what.replace(/^parameter\s+\S+:?\s*/, '');
  return where.length ? `${capitalise(where.join(', '))}: ${what}` : capitalise(what);
}

function capitalise(text) {
  return text ? text.charAt(0).toUpperCase() + text.slice(1) : text;
}

function range(pair, unit = 'nm') {
  return Array.isArray(pair) && pair.length === 2 ? `${fmt.number(pair[0], 2)}–${fmt.number(pair[1], 2)} ${unit}` : '—';
}

// ---------- the panel ----------

/**
 * Wires the import panel. `ui.libraryChanged()` reloads the library list (awaited after each store);
 * `ui.openMaterial(id)` opens a material's detail.
 */
export function initImport(ui) {
  const root = document.getElementById('curve-import');
  if (!root) return null;
  const picker = root.querySelector('#import-files-input');
  const drop = root.querySelector('#import-drop');
  const list = root.querySelector('#import-list');
  const status = root.querySelector('#import-status');
  const materials = { byName: new Map(), loaded: null };
  const datalistId = 'import-material-names';
  const classListId = 'import-material-classes';

  const names = node('datalist');
  names.id = datalistId;
  const classes = node('datalist');
  classes.id = classListId;
  for (const c of KNOWN_CLASSES) {
    const o = document.createElement('option');
    o.value = c;
    classes.append(o);
  }
  root.append(names, classes);

  async function loadMaterialNames() {
    try {
      const all = await listMaterials();
      materials.byName = new Map(all.map((m) => [m.name.toLocaleLowerCase(), m]));
      names.replaceChildren(...all.map((m) => {
        const o = document.createElement('option');
        o.value = m.name;
        o.label = m.materialClass || '';
        return o;
      }));
    } catch (problem) {
      // The form still works with a new material; say why existing ones are not offered.
      status.textContent = `Existing materials could not be listed: ${problemText(problem)}`;
    }
  }
  materials.loaded = loadMaterialNames();

  function addFiles(files) {
    const chosen = [...files];
    if (!chosen.length) return;
    for (const file of chosen) {
      const card = /\.zip$/i.test(file.name) ? batchCard(file) : fileCard(file);
      list.append(card);
    }
    status.textContent = chosen.length === 1 ? `1 file added: ${chosen[0].name}.`
      : `${chosen.length} files added.`;
  }

  picker.addEventListener('change', () => {
    addFiles(picker.files);
    picker.value = ''; // choosing the same file again adds it again
  });
  for (const type of ['dragenter', 'dragover']) {
    drop.addEventListener(type, (event) => {
      event.preventDefault();
      drop.classList.add('dragging');
    });
  }
  for (const type of ['dragleave', 'drop']) {
    drop.addEventListener(type, () => drop.classList.remove('dragging'));
  }
  drop.addEventListener('drop', (event) => {
    event.preventDefault();
    addFiles(event.dataTransfer?.files || []);
  });

  async function afterStore() {
    await ui.libraryChanged();
    await loadMaterialNames();
  }

  // ---------- one curve file: preview, then store ----------

  function fileCard(file) {
    const id = `import-card-${++nextCard}`;
    const card = node('li', 'import-card');
    card.id = id;
    card.dataset.fileName = file.name;
    const head = node('div', 'import-card-head');
    const title = node('h3', 'import-file-name', file.name);
    title.id = `${id}-title`;
    card.setAttribute('aria-labelledby', title.id);
    const remove = node('button', 'quiet', 'Remove');
    remove.type = 'button';
    remove.setAttribute('aria-label', `Remove ${file.name}`);
    remove.addEventListener('click', () => card.remove());
    head.append(title, remove);

    const state = node('p', 'import-state');
    state.setAttribute('role', 'status');
    const problem = node('div', 'import-problem');
    problem.id = `${id}-problem`;
    problem.setAttribute('role', 'alert');
    problem.hidden = true;
    const preview = node('div', 'import-preview');
    preview.hidden = true;
    const facts = node('dl', 'import-facts');
    const chart = node('div', 'chart import-chart');
    const warnings = node('ul', 'import-warnings');
    warnings.setAttribute('aria-label', `warnings about ${file.name}`);
    const blocks = node('div', 'import-blocks');
    preview.append(chart, facts, warnings, blocks);

    const form = document.createElement('form');
    form.className = 'import-form';
    form.noValidate = true;
    form.addEventListener('submit', (event) => event.preventDefault());

    // How to read the file: the preview follows every change.
    const reading = node('fieldset', 'import-group');
    reading.append(node('legend', null, 'Reading (leave blank for what was detected)'));
    const blockSelect = select('block', [['', 'the first']]);
    const blockField = field('JCAMP-DX block', blockSelect);
    blockField.hidden = true;
    const eachBlock = input('eachBlock', { type: 'checkbox' });
    eachBlock.value = 'true';
    const eachBlockField = node('label', 'field inline check');
    eachBlockField.append(eachBlock, node('span', null, 'store every block as its own sample'));
    eachBlockField.hidden = true;
    reading.append(
      field('Format', select('format', [['', 'as detected'], ['delimited', 'delimited text'], ['jcamp-dx', 'JCAMP-DX'],
        ['raw-counts', 'raw counts (sample, dark, reference)'], ['datasheet-points', 'points read off a datasheet']])),
      field('Values are', select('yKind', [['', 'as detected'], ['percent', 'transmittance in %'],
        ['fraction', 'transmittance as a fraction'], ['absorbance', 'absorbance']])),
      field('Wavelength unit', select('xUnit', [['', 'as detected'], ['nm', 'nm'], ['um', 'µm'], ['angstrom', 'Å'],
        ['cm-1', 'wavenumber, cm⁻¹']])),
      field('Decimal mark', select('decimalMark', [['', 'as detected'], ['point', 'point (1.5)'], ['comma', 'comma (1,5)']])),
      field('Keep from (nm)', input('from', { type: 'number', step: 'any', min: 0, size: 6 })),
      field('to (nm)', input('to', { type: 'number', step: 'any', min: 0, size: 6 })),
      field('Instrument uncertainty', input('uncertainty', { placeholder: 'e.g. 0.5%T or 0.01A', size: 10 })),
      blockField, eachBlockField,
    );

    // Where it goes: an existing material by name, or a new one.
    const target = node('fieldset', 'import-group');
    target.append(node('legend', null, 'Material'));
    const choice = node('div', 'import-choice');
    const radios = {};
    for (const [value, label] of [['new', 'a new material'], ['existing', 'an existing material'],
      ['state', 'a state of a stored sample (aged or printed)']]) {
      const r = input(`${id}-target`, { type: 'radio' });
      r.value = value;
      r.checked = value === 'new';
      radios[value] = r;
      const l = node('label', 'field inline check');
      l.append(r, node('span', null, label));
      choice.append(l);
    }
    const existingName = input('existingName', { list: datalistId, placeholder: 'start typing a name', size: 28 });
    const existing = node('div', 'import-row');
    existing.append(field('Name', existingName, { wide: true }));
    const fresh = node('div', 'import-row');
    fresh.append(
      field('Name', input('materialName', { placeholder: 'e.g. Fernhollow amber sheet (illustrative)', size: 28 }), { wide: true }),
      field('Class', input('materialClass', { list: classListId, placeholder: 'e.g. plastic sheet', size: 14 })),
      field('Scaling', select('scaling', [['bulk', 'bulk (absorbs through its thickness)'],
        ['fixed', 'fixed layer (coating, film, laminate)']])),
      field('Refractive index', input('indexN', { type: 'number', step: 'any', min: 1, placeholder: 'optional', size: 6 })),
      field('Stock thicknesses', input('stockThicknesses', { placeholder: 'e.g. 2 3 6 or 25 50 um', size: 14 })),
      field('Description', input('description', { placeholder: 'optional', size: 28 }), { wide: true }),
    );
    existing.hidden = true;
    const showTarget = () => {
      const asState = radios.state?.checked === true;
      existing.hidden = !radios.existing.checked;
      fresh.hidden = radios.existing.checked || asState;
      stateRow.hidden = !asState;
      // a state curve takes the sample's own geometry, provenance and the rest; only its thickness and notes are its own
      for (const f of sampleOnlyFields) f.hidden = asState;
      const thicknessBox = form.elements.namedItem('thicknessMm');
      thicknessBox.placeholder = asState ? 'the sample’s own' : 'from the file';
      store.textContent = asState ? 'Store as a state of the sample' : 'Store in library';
    };
    // This file is a state of sample N: the sample's own curve is its as-supplied state (docs/material-states.md).
    const stateRow = node('div', 'import-row import-state-row');
    const stateSample = input('stateSample', { type: 'number', step: '1', min: 1, size: 8, placeholder: 'sample id' });
    const stateKind = select('state', [['aged', 'aged (after an exposure)'], ['printed', 'printed black (a film)']]);
    const agedFields = [
      field('Hours', input('hours', { type: 'number', step: 'any', min: 0, size: 7, placeholder: 'e.g. 2000' })),
      field('Under', input('source', { placeholder: 'e.g. lamp bank A', size: 18 })),
      field('or dose (J/cm²)', input('doseJPerCm2', { type: 'number', step: 'any', min: 0, size: 7 })),
      field('at (nm)', input('doseNm', { type: 'number', step: 'any', min: 0, size: 6 })),
    ];
    const printedFields = [
      field('Ink load (%)', input('inkLoadPercent', { type: 'number', step: 'any', min: 0, size: 6, placeholder: 'e.g. 100' })),
      field('Stated density', input('statedDensity', { type: 'number', step: 'any', min: 0, size: 6, placeholder: 'optional' })),
    ];
    stateRow.append(field('This file is a state of sample', stateSample), field('State', stateKind), ...agedFields,
      ...printedFields);
    const showStateFields = () => {
      for (const f of agedFields) f.hidden = stateKind.value !== 'aged';
      for (const f of printedFields) f.hidden = stateKind.value !== 'printed';
    };
    stateKind.addEventListener('change', showStateFields);
    showStateFields();
    stateRow.hidden = true;
    radios.new.addEventListener('change', showTarget);
    radios.existing.addEventListener('change', showTarget);
    radios.state.addEventListener('change', showTarget);
    target.append(choice, fresh, existing, stateRow);

    // What the sample is.
    const sample = node('fieldset', 'import-group');
    sample.append(node('legend', null, 'Sample'));
    const sampleOnlyFields = [
      field('Geometry', select('geometry', [['regular', 'regular (direct beam)'], ['total', 'total (scattered light included)']])),
      field('Provenance', select('provenance', [['', 'as the file says'], ['measured', 'measured'], ['datasheet', 'datasheet'],
        ['modelled', 'modelled']])),
      field('Instrument', input('instrument', { placeholder: 'optional', size: 16 })),
      field('Measured on', input('measuredOn', { type: 'date' })),
      field('Lot', input('lot', { placeholder: 'optional', size: 10 })),
    ];
    sample.append(
      field('Thickness (mm)', input('thicknessMm', { type: 'number', step: 'any', min: 0, size: 9,
        placeholder: 'from the file' })),
      ...sampleOnlyFields,
      field('Notes', input('notes', { placeholder: 'optional', size: 28 }), { wide: true }),
    );

    const actions = node('div', 'import-actions');
    const store = node('button', null, 'Store in library');
    store.type = 'submit';
    store.disabled = true;
    const outcome = node('div', 'import-outcome');
    outcome.setAttribute('role', 'status');
    actions.append(store, outcome);
    form.append(reading, target, sample, actions);
    card.append(head, state, problem, preview, form);

    let request = 0;
    let plot = null;
    followWidth(chart, () => plot);

    const value = (name) => {
      const e = form.elements.namedItem(name);
      return e ? e.value : '';
    };
    const readValues = () => Object.fromEntries(READ_FIELDS.map((k) => [k, value(k)]));

    function showProblem(p) {
      problem.replaceChildren(node('p', null, problemText(p)));
      problem.hidden = false;
      card.classList.add('refused');
      // The control the problem names is marked, so the message and its cause can be found together.
      const named = p?.properties?.parameter === 'materialId' ? existingName
        : radios.state.checked && p?.properties?.resource === 'sample' ? stateSample
          : form.elements.namedItem(p?.properties?.parameter || '');
      if (named instanceof HTMLElement) {
        named.setAttribute('aria-invalid', 'true');
        named.setAttribute('aria-describedby', problem.id);
      }
    }

    function clearProblem() {
      problem.hidden = true;
      problem.replaceChildren();
      card.classList.remove('refused');
      for (const e of form.querySelectorAll('[aria-invalid]')) {
        e.removeAttribute('aria-invalid');
        e.removeAttribute('aria-describedby');
      }
    }

    function localProblem(parameter, detail) {
      return new ApiProblem({ title: 'Incomplete form', detail, properties: { parameter, problem: detail } });
    }

    async function runPreview() {
      const mine = ++request;
      state.textContent = 'Reading the file…';
      store.disabled = true;
      try {
        const answer = await postForm('imports/preview', formWith(file, readValues()));
        if (mine !== request) return;
        clearProblem();
        showPreview(answer);
        state.textContent = `Read: ${answer.pointCount} points, ${range(answer.rangeNm)}. Nothing is stored yet.`;
        store.disabled = false;
      } catch (p) {
        if (mine !== request) return;
        preview.hidden = true;
        state.textContent = 'Not read; see why below, change the reading options or the file.';
        showProblem(p);
      }
    }

    function showPreview(answer) {
      preview.hidden = false;
      plot = drawCurves(chart, [{
        label: answer.fileName || file.name,
        color: CURVE_COLOUR,
        wavelengthsNm: answer.curve.wavelengthsNm,
        transmittance: answer.curve.transmittance,
        belowDetection: answer.curve.belowDetection,
        detectionLimit: answer.detectionLimit,
      }], 'linear');
      const rows = [
        ['Format', answer.format],
        ['Wavelength unit', X_UNIT_WORDS[answer.xUnit] || answer.xUnit],
        ['Quantity', Y_KIND_WORDS[answer.yKind] || answer.yKind],
        ['Points', String(answer.pointCount)],
        ['Range kept', range(answer.keep?.keptRangeNm || answer.rangeNm)],
        ['Detection limit', answer.detectionLimit > 0 ? fmt.percent(answer.detectionLimit) : 'none given'],
        ['Provenance', answer.provenance],
      ];
      const keep = answer.keep;
      if (keep && (keep.leftOutBelow || keep.leftOutAbove)) {
        rows.push(['Left out', `${keep.leftOutBelow} points below, ${keep.leftOutAbove} above (the stored original file keeps them)`]);
      }
      if (answer.uncertaintySource) rows.push(['Uncertainty', answer.uncertaintySource]);
      for (const [key, text] of Object.entries(answer.metadata || {})) rows.push([key, text]);
      facts.replaceChildren(...rows.flatMap(([k, v]) => [node('dt', null, k), node('dd', null, v)]));
      const noted = [...(answer.warnings || [])];
      for (const region of keep?.noiseRegions || []) noted.push(`noise region (${region.end} end) ${range(region.rangeNm)}: ${region.reason}`);
      warnings.replaceChildren(...noted.map((w) => node('li', null, w)));
      warnings.hidden = noted.length === 0;
      const fromBox = form.elements.namedItem('from');
      const toBox = form.elements.namedItem('to');
      if (keep?.suggestedFrom != null && !fromBox.value) fromBox.placeholder = `suggested ${fmt.number(keep.suggestedFrom, 2)}`;
      if (keep?.suggestedTo != null && !toBox.value) toBox.placeholder = `suggested ${fmt.number(keep.suggestedTo, 2)}`;
      showBlocks(answer.blocks || []);
      const thickness = answer.metadata?.thickness_mm;
      const thicknessBox = form.elements.namedItem('thicknessMm');
      if (thickness && !thicknessBox.value) thicknessBox.placeholder = `${thickness} (from the file)`;
    }

    function showBlocks(list) {
      blocks.replaceChildren();
      blockField.hidden = list.length < 2;
      eachBlockField.hidden = list.length < 2;
      if (list.length < 2) return;
      const chosen = blockSelect.value;
      blockSelect.replaceChildren(...[['', 'the first']].concat(list.map((b) => [String(b.number),
        `${b.number}: ${b.title || 'untitled'}`])).map(([v, l]) => {
        const o = document.createElement('option');
        o.value = v;
        o.textContent = l;
        return o;
      }));
      blockSelect.value = chosen;
      const table = node('table', 'data-table import-block-table');
      const caption = node('caption', null, `The file holds ${list.length} spectra`);
      const headRow = node('tr');
      for (const h of ['#', 'Title', 'Points', 'Range', 'Units', 'Read']) {
        const th = node('th', null, h);
        th.scope = 'col';
        headRow.append(th);
      }
      const thead = node('thead');
      thead.append(headRow);
      const tbody = node('tbody');
      for (const b of list) {
        const tr = node('tr');
        tr.append(node('td', 'num', String(b.number)), node('td', null, b.title || '—'), node('td', 'num', String(b.points)),
          node('td', null, range(b.rangeNm)), node('td', null, [b.xUnits, b.yUnits].filter(Boolean).join(' / ') || '—'),
          node('td', null, b.problem ? `cannot: ${b.problem}` : (b.taken ? 'this one' : '')));
        tbody.append(tr);
      }
      table.append(caption, thead, tbody);
      const scroll = node('div', 'table-scroll');
      scroll.append(table);
      blocks.append(scroll);
    }

    async function runStoreAsState() {
      const values = { ...readValues() };
      for (const k of [...STATE_FIELDS, ...STATE_SAMPLE_FIELDS]) values[k] = value(k);
      for (const k of (stateKind.value === 'aged' ? ['inkLoadPercent', 'statedDensity']
        : ['hours', 'source', 'doseJPerCm2', 'doseNm'])) delete values[k]; // hidden fields of the other state
      const sampleId = stateSample.value.trim();
      if (!/^[1-9][0-9]*$/.test(sampleId)) {
        showProblem(localProblem('stateSample', sampleId ? `“${sampleId}” is not a sample id (a whole number)`
          : 'give the id of the sample this file is a state of'));
        stateSample.focus();
        return;
      }
      store.disabled = true;
      state.textContent = 'Storing…';
      try {
        const answer = await postForm(`samples/${encodeURIComponent(sampleId)}/states`, formWith(file, values));
        showStoredState(answer);
        await afterStore();
      } catch (p) {
        state.textContent = 'Not stored; see why below.';
        showProblem(p);
        store.disabled = false;
      }
    }

    function showStoredState(answer) {
      card.classList.add('stored');
      state.textContent = answer.duplicate
        ? `Already in the library as state curve ${answer.state.id} of sample ${answer.sampleId} (${answer.state.description}).`
        : `Stored as state curve ${answer.state.id} of sample ${answer.sampleId}: ${answer.state.description}.`;
      const notes = node('ul', 'import-warnings');
      notes.replaceChildren(...(answer.warnings || []).map((w) => node('li', null, w)));
      notes.hidden = !(answer.warnings || []).length;
      const open = node('button', 'open-stored', 'Open the material');
      open.type = 'button';
      open.addEventListener('click', () => ui.openMaterial(String(answer.materialId)));
      outcome.replaceChildren(open, notes);
      for (const e of form.elements) e.disabled = true;
      open.disabled = false;
    }

    async function runStore() {
      clearProblem();
      outcome.replaceChildren();
      if (radios.state.checked) {
        await runStoreAsState();
        return;
      }
      const values = { ...readValues() };
      for (const k of STORE_FIELDS) values[k] = value(k);
      if (eachBlock.checked && !eachBlockField.hidden) values.eachBlock = 'true';
      if (radios.existing.checked) {
        await materials.loaded;
        const typed = existingName.value.trim();
        const found = materials.byName.get(typed.toLocaleLowerCase());
        if (!found) {
          showProblem(localProblem('materialId', typed
            ? `no material is named “${typed}”; choose one of the suggestions, or a new material`
            : 'type the name of an existing material, or choose a new material'));
          existingName.focus();
          return;
        }
        values.materialId = String(found.id);
      } else {
        for (const k of NEW_MATERIAL_FIELDS) values[k] = value(k);
        if (!values.materialName.trim()) {
          showProblem(localProblem('materialName', 'name the new material, or choose an existing one'));
          form.elements.namedItem('materialName').focus();
          return;
        }
      }
      store.disabled = true;
      state.textContent = 'Storing…';
      try {
        const answer = await postForm('imports', formWith(file, values));
        showStored(answer);
        await afterStore();
      } catch (p) {
        state.textContent = 'Not stored; see why below.';
        showProblem(p);
        store.disabled = false;
      }
    }

    function showStored(answer) {
      card.classList.add('stored');
      const samples = answer.samples?.length ? answer.samples : [{ sample: answer.sample, duplicate: answer.duplicate }];
      const ids = samples.map((s) => s.sample?.id).filter((x) => x !== undefined);
      const what = ids.length === 1 ? `sample ${ids[0]}` : `samples ${ids.join(', ')}`;
      state.textContent = answer.duplicate
        ? `Already in the library as ${what}: the same file was stored before for this material and thickness.`
        : `Stored as ${what} of ${answer.newMaterial ? 'the new material' : 'material'} ${answer.materialSlug}.`;
      const open = node('button', 'open-stored', 'Open the material');
      open.type = 'button';
      open.addEventListener('click', () => ui.openMaterial(String(answer.materialId)));
      outcome.replaceChildren(open);
      for (const e of form.elements) e.disabled = true;
      open.disabled = false;
    }

    form.addEventListener('submit', runStore);
    reading.addEventListener('change', (event) => {
      if (event.target === eachBlock) return; // storing choice, not a reading one
      runPreview();
    });
    runPreview();
    return card;
  }

  // ---------- a zip with manifest.csv: one answer, one row per file ----------

  function batchCard(zip) {
    const card = node('li', 'import-card import-batch');
    card.dataset.fileName = zip.name;
    const head = node('div', 'import-card-head');
    const title = node('h3', 'import-file-name', `${zip.name} (zip with manifest.csv)`);
    const remove = node('button', 'quiet', 'Remove');
    remove.type = 'button';
    remove.setAttribute('aria-label', `Remove ${zip.name}`);
    remove.addEventListener('click', () => card.remove());
    head.append(title, remove);
    const state = node('p', 'import-state', 'Each row of manifest.csv is stored on its own: a refused row leaves the others.');
    state.setAttribute('role', 'status');
    const problem = node('div', 'import-problem');
    problem.setAttribute('role', 'alert');
    problem.hidden = true;
    const progress = document.createElement('progress');
    progress.hidden = true;
    progress.setAttribute('aria-label', `import of ${zip.name}`);
    const table = node('table', 'data-table import-batch-table');
    table.hidden = true;
    const actions = node('div', 'import-actions');
    const go = node('button', null, 'Store every file of the zip');
    go.type = 'button';
    actions.append(go);
    const scroll = node('div', 'table-scroll');
    scroll.append(table);
    card.append(head, state, problem, actions, progress, scroll);

    go.addEventListener('click', async () => {
      go.disabled = true;
      problem.hidden = true;
      progress.hidden = false;
      progress.removeAttribute('value'); // indeterminate: the server answers once, for every row
      state.textContent = 'Storing the files of the zip…';
      try {
        const report = await postForm('imports/batch', formWith(zip, {}));
        showReport(report);
        await afterStore();
      } catch (p) {
        progress.hidden = true;
        state.textContent = 'The zip was not imported; see why below.';
        problem.replaceChildren(node('p', null, problemText(p)));
        problem.hidden = false;
        go.disabled = false;
      }
    });

    function showReport(report) {
      const files = report.files || [];
      const done = files.filter((f) => f.outcome !== 'REFUSED').length;
      // every row is answered at once: the bar is full, the line below says how many were stored
      progress.max = Math.max(1, files.length);
      progress.value = files.length;
      const refused = files.length - done;
      const extra = report.notInManifest?.length ? ` Not in the manifest, so not imported: ${report.notInManifest.join(', ')}.` : '';
      state.textContent = `${done} of ${files.length} files in the library${refused ? `, ${refused} refused` : ''}.${extra}`;
      const headRow = node('tr');
      for (const h of ['Row', 'File', 'Outcome', 'Material', 'Why, or warnings']) {
        const th = node('th', null, h);
        th.scope = 'col';
        headRow.append(th);
      }
      const thead = node('thead');
      thead.append(headRow);
      const tbody = node('tbody');
      for (const f of files) {
        const tr = node('tr', `outcome-${String(f.outcome).toLowerCase()}`);
        const materialCell = node('td');
        if (f.materialId != null) {
          const open = node('button', 'link-button', f.material || `material ${f.materialId}`);
          open.type = 'button';
          open.addEventListener('click', () => ui.openMaterial(String(f.materialId)));
          materialCell.append(open);
        } else {
          materialCell.textContent = f.material || '—';
        }
        const notes = f.message ? [f.message] : (f.warnings || []);
        const notesCell = node('td', 'notes');
        notesCell.append(...notes.map((n) => node('div', null, n)));
        tr.append(node('td', 'num', String(f.line)), node('td', null, f.file),
          node('td', null, OUTCOME_WORDS[f.outcome] || f.outcome), materialCell, notesCell);
        tbody.append(tr);
      }
      table.replaceChildren(thead, tbody);
      table.hidden = false;
    }
    return card;
  }

  return { addFiles };
}
