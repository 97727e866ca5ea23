// The library page: find materials for a requirement, list and filter materials, show one material's
// samples, curves and weighted figures, rescale a bulk sample to another thickness. All numbers come from
// the API; nothing is computed here.
import * as api from './api.js';
import * as fmt from './format.js';
import { drawCurves, followWidth } from './chart.js';
import { showRescaleProblem, clearRescaleProblem } from './polish.js';
import { initSearch } from './search.js';
import { initFigures } from './figures.js';
import { initFacets } from './facets.js';
import { initSimilar } from './similar.js';
import { initImport } from './import.js';
import { initCompare } from './compare.js';
import { showDownloads, initChartPng } from './export.js';
import { initCuration, renderMaterialRecord, renderRetiredSamples, sampleControls } from './curation.js';
import { readAddress, writeAddress, onAddressChange } from './address.js';
import { showChartValues } from './chart-values.js';
import { initStates } from './states.js';
import { initAngles } from './angles.js';

const SAMPLE_COLOURS = ['#1d6a86', '#8a5a2b', '#4d7a37', '#7a3e6e', '#3d4f9a', '#9c4545', '#3c7f7a', '#6b6b2a'];
const RESCALED_COLOUR = '#c2700f';
const FILTER_DELAY_MS = 250;
// The most /api/library lists at once; a larger library shows the best ones and says how many match.
const LIST_LIMIT = 200;

const el = (id) => document.getElementById(id);
const dom = {
  message: el('message'),
  filterText: el('filter-text'),
  facets: el('facets'),
  count: el('material-count'),
  materialRows: el('material-table').tBodies[0],
  detail: el('material-detail'),
  placeholder: el('detail-placeholder'),
  name: el('detail-name'),
  meta: el('detail-meta'),
  description: el('detail-description'),
  tags: el('detail-tags'),
  index: el('detail-index'),
  made: el('detail-made'),
  sampleRows: el('sample-table').tBodies[0],
  record: el('detail-record'),
  retiredSamples: el('retired-samples'),
  axisMode: el('axis-mode'),
  rescaleForm: el('rescale-form'),
  rescaleFrom: el('rescale-from'),
  rescaleMm: el('rescale-mm'),
  rescaleApply: el('rescale-apply'),
  rescaleClear: el('rescale-clear'),
  rescaleNote: el('rescale-note'),
  chart: el('curve-chart'),
};

const state = {
  listRequest: 0,       // later answers win; an older answer arriving late is dropped
  detailRequest: 0,
  rescaleRequest: 0,
  catalogue: null,      // Map id -> material (with samples) of the whole library, for the table's columns
  material: null,
  curves: [],           // measured curves of the shown material, in sample order
  rescaled: null,       // { curve, fromSample, thicknessMm } or null
  overlays: [],         // curves of look-alike hits drawn over the shown material's (similar.js)
  stateCurves: [],      // a sample's curves in other states plotted beside its own (states.js)
  plot: null,
};

let search = null;     // the requirement search's view (search.js), for the address
let compare = null;    // the compare overlay (compare.js), for the address (cmp=)
let restoring = false; // true while a view is restored from the address: nothing is written back meanwhile

// ---------- messages: every API failure is shown, never swallowed ----------

function showProblem(problem, context) {
  console.error(context, problem);
  const title = problem.title || 'Something went wrong';
  const status = ''; // HTTP status codes mean nothing to a reader; title and detail say what went wrong
  const detail = problem.detail || problem.message || '';
  dom.message.replaceChildren();
  const text = document.createElement('div');
  const heading = document.createElement('strong');
  heading.textContent = `${context}: ${title}${status}`;
  text.append(heading);
  if (detail) {
    const p = document.createElement('p');
    p.textContent = detail;
    text.append(p);
  }
  const close = document.createElement('button');
  close.type = 'button';
  close.className = 'quiet';
  close.textContent = 'Dismiss';
  close.addEventListener('click', clearMessage);
  dom.message.append(text, close);
  dom.message.hidden = false;
}

function clearMessage() {
  dom.message.hidden = true;
  dom.message.replaceChildren();
}

/** Whether the message shown is one given with this context, so its owner may clear it once resolved. */
function messageStartsWith(context) {
  return !dom.message.hidden && dom.message.textContent.startsWith(context);
}

// A sample's curves in other states (aged, printed) listed under the sample table and plotted on demand (states.js).
const states = initStates({
  container: el('state-curves'),
  sampleLabel,
  sampleColour: (sample) => SAMPLE_COLOURS[Math.max(0, state.material?.samples.indexOf(sample) ?? 0) % SAMPLE_COLOURS.length],
  changed(curves) {
    state.stateCurves = curves;
    redraw();
  },
  problem: (p, context) => showProblem(p, context),
});
const figures = initFigures({ showProblem, clearMessage, messageStartsWith, changed: () => rememberView() });
const facets = initFacets(dom.facets, () => loadMaterials());
// T against the angle of incidence at one wavelength, for the shown material (angles.js)
const angles = initAngles({ showProblem });
const similar = initSimilar({
  showProblem,
  clearMessage,
  openMaterial(id, rescaleTo) {
    selectMaterial(id, { ...rescaleTo, reveal: true });
  },
  setOverlays(curves) {
    state.overlays = curves;
    redraw();
  },
});

// ---------- library table ----------

function renderMaterials(materials, total) {
  const rows = materials.map((m) => {
    const tr = document.createElement('tr');
    tr.dataset.materialId = m.id;
    tr.dataset.scaling = m.scaling;
    tr.tabIndex = 0;
    tr.setAttribute('aria-selected', String(state.material?.id === m.id));
    const name = document.createElement('td');
    name.className = 'name';
    name.textContent = m.name;
    const cls = document.createElement('td');
    cls.textContent = m.materialClass;
    const thick = document.createElement('td');
    thick.className = 'num';
    thick.textContent = fmt.thicknesses(m.samples);
    tr.append(name, cls, thick);
    return tr;
  });
  dom.materialRows.replaceChildren(...rows);
  const n = materials.length;
  const count = total === 1 ? '1 material' : `${total} materials`;
  dom.count.textContent = n < total ? `${count}, the best ${n} shown` : count;
  if (n === 0) {
    const tr = document.createElement('tr');
    const td = document.createElement('td');
    td.colSpan = 3;
    td.className = 'empty';
    td.textContent = 'No material matches these words and ticks.';
    tr.append(td);
    dom.materialRows.append(tr);
  }
}

/** The whole library with its samples: the table's thickness column and the figures' part pickers need it. */
async function loadCatalogue() {
  const materials = await api.listMaterials();
  state.catalogue = new Map(materials.map((m) => [String(m.id), m]));
  figures.offerParts(materials); // the whole library, before any words or ticks narrow the list
  // one request for the whole library, shared: print.js takes each sample's provenance from it
  document.dispatchEvent(new CustomEvent('sieve:catalogue', { detail: materials }));
}

async function loadMaterials({ refresh = false } = {}) {
  const request = ++state.listRequest;
  dom.count.textContent = 'Loading…';
  try {
    const [answer] = await Promise.all([
      api.searchLibrary({ text: dom.filterText.value.trim(), facets: facets.chosen(), limit: LIST_LIMIT }),
      refresh || !state.catalogue ? loadCatalogue() : null,
    ]);
    if (request !== state.listRequest) return;
    // The index follows the library's change counter; a hit newer than the catalogue means it moved.
    if (answer.hits.some((h) => !state.catalogue.has(String(h.materialId)))) await loadCatalogue();
    if (request !== state.listRequest) return;
    const materials = answer.hits.map((h) => state.catalogue.get(String(h.materialId))).filter(Boolean);
    facets.show(answer.facets);
    renderMaterials(materials, answer.total);
  } catch (problem) {
    if (request !== state.listRequest) return;
    dom.count.textContent = 'The library could not be loaded.';
    showProblem(problem, 'Loading the library');
  }
}

let filterTimer = 0;
function scheduleFilter() {
  clearTimeout(filterTimer);
  filterTimer = setTimeout(() => loadMaterials(), FILTER_DELAY_MS);
}

function markSelectedRow(id) {
  for (const tr of dom.materialRows.querySelectorAll('tr[data-material-id]')) {
    tr.setAttribute('aria-selected', String(tr.dataset.materialId === String(id)));
  }
}

// ---------- material detail ----------

function cell(text, className, title) {
  const td = document.createElement('td');
  td.textContent = text;
  if (className) td.className = className;
  if (title) td.title = title;
  return td;
}

function sampleLabel(sample) {
  return `${fmt.number(sample.thicknessMm)} mm ${sample.geometry}`;
}

function transmittanceCell(sample, wl) {
  const t = sample.transmittanceAt?.[wl];
  if (t === null || t === undefined) return cell('—', 'num muted', `${wl} nm is outside the measured range`);
  if (sample.belowDetectionAt?.[wl]) {
    const bound = Number.isFinite(sample.detectionLimit) ? sample.detectionLimit : t;
    return cell(`≤ ${fmt.percentNumber(bound)}`, 'num bound', 'below the detection limit: an upper bound, not a value');
  }
  return cell(fmt.percentNumber(t), 'num');
}

/**
 * The UV absorption edge at a level (where T rises through it out of the absorbing UV), followed by the end
 * of that pass band for a band-pass sample: "309–386" for UV-pass black glass at 50 %.
 */
function edgeCell(sample, level) {
  const edge = sample.cutoffsNm?.[level];
  const end = sample.passBandEndsNm?.[level];
  if (edge === null || edge === undefined) {
    return cell('—', 'num muted', `T does not rise through ${level} % out of an absorbing region in the measured range`);
  }
  if (end === null || end === undefined) {
    return cell(fmt.nanometres(edge), 'num', `UV absorption edge: T rises through ${level} % here and stays over it`);
  }
  return cell(`${fmt.nanometres(edge)}–${fmt.nanometres(end)}`, 'num band-pass',
    `pass band: T rises through ${level} % at ${fmt.nanometres(edge)} nm (UV absorption edge) `
    + `and falls back under it at ${fmt.nanometres(end)} nm`);
}

function renderSamples(material) {
  const columns = 3 + fmt.CUTOFF_LEVELS.length + fmt.REPORT_WAVELENGTHS_NM.length + 2;
  const rows = material.samples.flatMap((s, i) => {
    const tr = document.createElement('tr');
    tr.dataset.sampleId = s.id;
    const thick = cell(`${fmt.number(s.thicknessMm)} mm`, 'num');
    const swatch = document.createElement('span');
    swatch.className = 'swatch';
    swatch.style.background = SAMPLE_COLOURS[i % SAMPLE_COLOURS.length];
    thick.prepend(swatch);
    tr.append(thick, cell(s.geometry), cell(s.provenance, `provenance ${s.provenance}`));
    for (const level of fmt.CUTOFF_LEVELS) tr.append(edgeCell(s, level));
    for (const wl of fmt.REPORT_WAVELENGTHS_NM) tr.append(transmittanceCell(s, wl));
    const link = document.createElement('a');
    link.href = api.curveCsvUrl(s.id);
    link.textContent = 'CSV';
    link.setAttribute('download', `${material.slug || 'sample'}-${fmt.number(s.thicknessMm)}mm-${s.id}.csv`);
    link.className = 'csv-link';
    const data = document.createElement('td');
    data.append(link);
    tr.append(data);
    const { controls, formRow } = sampleControls(material, s, columns);
    const record = document.createElement('td');
    record.className = 'record-cell';
    if (s.revision > 1) {
      const revision = document.createElement('span');
      revision.className = 'revision';
      revision.textContent = `rev. ${s.revision} `;
      revision.title = `revision ${s.revision} of this sample's metadata; earlier revisions are kept`;
      record.append(revision);
    }
    record.append(...controls);
    tr.append(record);

    // Where the numbers come from, on a line of its own so the table stays narrow.
    const about = [
      s.instrument && `instrument: ${s.instrument}`,
      s.lot && `lot: ${s.lot}`,
      Array.isArray(s.rangeNm) && s.rangeNm.length === 2
        && `measured ${fmt.number(s.rangeNm[0], 0)}–${fmt.number(s.rangeNm[1], 0)} nm`,
      Number.isFinite(s.detectionLimit) && s.detectionLimit > 0
        && `detection limit ${fmt.percent(s.detectionLimit)}`,
      s.notes,
      s.revision > 1 && `revision ${s.revision} of its metadata (corrected; earlier revisions kept)`,
    ].filter(Boolean).join(' · ');
    if (!about) return [tr, formRow];
    tr.classList.add('has-about');
    const aboutRow = document.createElement('tr');
    aboutRow.className = 'sample-about';
    const aboutCell = cell(about);
    aboutCell.colSpan = columns;
    aboutRow.append(aboutCell);
    return [tr, aboutRow, formRow];
  });
  dom.sampleRows.replaceChildren(...rows);
}

function renderDetailHead(material) {
  dom.name.textContent = material.name;
  dom.meta.textContent = `${material.materialClass} · ${material.scaling === 'fixed'
    ? 'fixed layer (does not scale with thickness)' : 'bulk (scales with thickness)'}`;
  dom.description.textContent = material.description || '';
  dom.tags.replaceChildren(...(material.tags || []).map((t) => {
    const li = document.createElement('li');
    li.textContent = t;
    return li;
  }));
  dom.index.textContent = fmt.refractiveIndex(material.refractiveIndex);
  dom.made.textContent = fmt.madeThicknesses(material.madeThicknesses);
  renderMaterialRecord(dom.record, material);
  renderRetiredSamples(dom.retiredSamples, material);
}

/**
 * Opens a material. `rescaleTo` ({ sampleId, thicknessMm, reveal }) pre-fills the rescale box, e.g. with
 * the thickness a requirement search recommended, drawn at once so the user sees that curve; `reveal`
 * scrolls the detail into view (the search area sits above it).
 */
async function selectMaterial(id, rescaleTo = null) {
  const request = ++state.detailRequest;
  markSelectedRow(id);
  try {
    const material = await api.getMaterial(id);
    if (request !== state.detailRequest) return;
    state.material = material;
    state.rescaled = null;
    state.curves = [];
    state.overlays = [];
    state.stateCurves = [];
    renderDetailHead(material);
    renderSamples(material);
    states.showMaterial(material);
    setupRescale(material);
    clearRescaleProblem(); // a refusal belongs to the material it was asked for
    figures.showMaterial(material, rescaleTo?.sampleId); // a shortlist row's own sample (docs/result-rows.md)
    similar.showMaterial(material, rescaleTo?.sampleId);
    angles.showMaterial(material);
    const prefilled = prefillRescale(material, rescaleTo);
    // curves (and the row's rescaled one) asked before the layout and the address below: the server works meanwhile
    const curvesShown = Promise.all([loadCurves(material, request), prefilled ? applyRescale() : null]); // docs/page-speed.md
    dom.placeholder.hidden = true;
    dom.detail.hidden = false;
    rememberView({ push: true }); // opening a material is a step Back returns from (address.js)
    if (rescaleTo?.reveal) dom.detail.scrollIntoView({ block: 'start' });
    await curvesShown;
    if (request === state.detailRequest) performance.mark('sieve:material-shown'); // docs/page-speed.md
  } catch (problem) {
    if (request !== state.detailRequest) return;
    showProblem(problem, 'Loading the material');
  }
}

async function loadCurves(material, request) {
  const results = await Promise.allSettled(material.samples.map((s) => api.getCurve(s.id)));
  if (request !== state.detailRequest) return;
  state.curves = [];
  results.forEach((result, i) => {
    const sample = material.samples[i];
    if (result.status === 'fulfilled') {
      state.curves.push({
        ...result.value,
        label: `${sampleLabel(sample)} (${sample.provenance})`,
        color: SAMPLE_COLOURS[i % SAMPLE_COLOURS.length],
      });
    } else {
      showProblem(result.reason, `Loading the curve of sample ${sampleLabel(sample)}`);
    }
  });
  redraw();
}

function redraw() {
  if (state.plot) state.plot.destroy();
  const curves = [...state.curves];
  curves.push(...state.stateCurves); // beside their samples' own curves, before a rescaled one or overlays
  if (state.rescaled) curves.push(state.rescaled.curve);
  curves.push(...state.overlays);
  state.plot = drawCurves(dom.chart, curves, dom.axisMode.value);
  dom.chart.dataset.axisMode = dom.axisMode.value; // lets readers and tests tell which axis is drawn
  showChartValues(dom.chart, curves, dom.axisMode.value); // chart-values.js: the chart's text alternative
  showDownloads(state.material, state.rescaled); // export.js: a download per curve drawn
  dom.detail.dispatchEvent(new CustomEvent('material-shown', { detail: { material: state.material, rescaled: state.rescaled } })); // print.js
}

// ---------- rescaling ----------

function setRescaleEnabled(enabled) {
  for (const control of [dom.rescaleFrom, dom.rescaleMm, dom.rescaleApply, dom.rescaleClear]) {
    control.disabled = !enabled;
  }
}

function setupRescale(material) {
  dom.rescaleFrom.replaceChildren(...material.samples.map((s) => {
    const option = document.createElement('option');
    option.value = s.id;
    // a diffuse or scattering sample of a bulk material is held at its measured thickness; the server says why
    option.disabled = material.scaling !== 'fixed' && s.rescalable === false;
    option.textContent = `from ${sampleLabel(s)}${option.disabled ? ' (not rescaled)' : ''}`;
    if (s.notRescaledReason) option.title = s.notRescaledReason;
    return option;
  }));
  dom.rescaleMm.value = '';
  dom.rescaleMm.title = '';
  const held = material.samples.find((s) => s.notRescaledReason);
  if (material.scaling !== 'fixed' && material.samples.length && !material.samples.some((s) => s.rescalable !== false)) {
    setRescaleEnabled(false);
    dom.rescaleNote.textContent = `Rescaling unavailable: ${held ? held.notRescaledReason : 'no sample can be rescaled'}.`;
    return;
  }
  if (material.scaling !== 'fixed' && material.samples.length) {
    const first = material.samples.find((s) => s.rescalable !== false);
    if (first) dom.rescaleFrom.value = String(first.id);
    setRescaleEnabled(true);
    dom.rescaleNote.textContent = 'Bulk material: the curve is rescaled by the server (surface reflection '
      + 'kept, absorption scaled with path length).'
      + (held ? ` Samples marked “not rescaled”: ${held.notRescaledReason}.` : '');
    return;
  }
  setRescaleEnabled(false);
  if (!material.samples.length) {
    dom.rescaleNote.textContent = 'No sample to rescale.';
    return;
  }
  dom.rescaleNote.textContent = 'Fixed layer: rescaling is not offered.';
  explainFixedLayer(material);
}

function prefillRescale(material, rescaleTo) {
  if (!rescaleTo || !Number.isFinite(rescaleTo.thicknessMm) || material.scaling === 'fixed') return false;
  const from = material.samples.find((s) => String(s.id) === String(rescaleTo.sampleId));
  if (from) dom.rescaleFrom.value = String(from.id);
  dom.rescaleMm.value = fmt.number(rescaleTo.thicknessMm);
  return true;
}

// The server owns the rule; ask it once so the page shows its own words for why a fixed layer
// cannot be rescaled, instead of a second, possibly diverging, explanation written here.
// (Twice the thickness: at its own thickness the server simply returns the measured curve.)
async function explainFixedLayer(material) {
  const request = state.detailRequest;
  const sample = material.samples[0];
  try {
    await api.getCurve(sample.id, sample.thicknessMm * 2);
    if (request !== state.detailRequest) return;
    dom.rescaleNote.textContent = 'Fixed layer: its transmittance does not scale with thickness.';
  } catch (problem) {
    if (request !== state.detailRequest) return;
    if (problem.status === 400) {
      const reason = problem.detail || problem.title;
      dom.rescaleNote.textContent = `Rescaling unavailable: ${reason}`;
      dom.rescaleMm.title = reason;
    } else {
      showProblem(problem, 'Asking whether this layer can be rescaled');
    }
  }
}

async function applyRescale() {
  const material = state.material;
  if (!material || material.scaling === 'fixed') return;
  const raw = dom.rescaleMm.value.trim();
  if (raw === '') {
    clearRescale();
    return;
  }
  const thicknessMm = Number(raw);
  if (!Number.isFinite(thicknessMm) || thicknessMm <= 0) {
    showRescaleProblem({ title: 'Invalid thickness', detail: `“${raw}” is not a positive number of millimetres.` });
    return;
  }
  const sample = material.samples.find((s) => String(s.id) === dom.rescaleFrom.value) || material.samples[0];
  const request = ++state.rescaleRequest;
  const detailRequest = state.detailRequest;
  try {
    const curve = await api.getCurve(sample.id, thicknessMm);
    if (request !== state.rescaleRequest || detailRequest !== state.detailRequest) return;
    state.rescaled = {
      fromSample: sample,
      thicknessMm,
      curve: {
        ...curve,
        label: `rescaled to ${fmt.number(thicknessMm)} mm (from ${fmt.number(sample.thicknessMm)} mm)`,
        color: RESCALED_COLOUR,
        dash: [7, 4],
      },
    };
    clearRescaleProblem();
    redraw();
    rememberView();
    figures.showRescaled(state.rescaled);
  } catch (problem) {
    if (request !== state.rescaleRequest) return;
    showRescaleProblem(problem);
  }
}

function clearRescale() {
  dom.rescaleMm.value = '';
  clearRescaleProblem();
  if (state.rescaled) {
    state.rescaled = null;
    redraw();
    rememberView();
    figures.showRescaled(null);
  }
}

// ---------- wiring ----------

function wire() {
  dom.filterText.addEventListener('input', scheduleFilter);
  dom.materialRows.addEventListener('click', (event) => {
    const row = event.target.closest('tr[data-material-id]');
    if (row) selectMaterial(row.dataset.materialId);
  });
  dom.materialRows.addEventListener('keydown', (event) => {
    const row = event.target.closest('tr[data-material-id]');
    if (row && (event.key === 'Enter' || event.key === ' ')) {
      event.preventDefault();
      selectMaterial(row.dataset.materialId);
    }
  });
  dom.axisMode.addEventListener('change', redraw);
  dom.axisMode.addEventListener('change', () => rememberView());
  dom.filterText.addEventListener('input', () => rememberView());
  dom.facets.addEventListener('change', () => rememberView());
  dom.rescaleForm.addEventListener('submit', (event) => {
    event.preventDefault();
    applyRescale();
  });
  dom.rescaleClear.addEventListener('click', clearRescale);
  followWidth(dom.chart, () => state.plot);
}

wire();
initCuration({
  showProblem,
  clearMessage,
  async reopen(id) {
    await loadMaterials({ refresh: true });
    await selectMaterial(id);
  },
});
search = initSearch({
  showProblem,
  clearMessage,
  openMaterial(id, rescaleTo) {
    selectMaterial(id, { ...rescaleTo, reveal: true });
  },
  searched: () => rememberView({ push: true }), // a search run is a step Back returns from
});
// Curve import (import.js): a stored file shows in the library at once and can be opened from its card.
initImport({
  libraryChanged: () => loadMaterials({ refresh: true }),
  openMaterial(id) {
    selectMaterial(id, { reveal: true });
  },
});
// Compare (compare.js): listens for each shortlist before a restored address runs a search.
compare = initCompare({ showProblem, changed: (how) => rememberView(how) });
initChartPng(dom.chart, () => state.material?.name); // export.js
restoreView(readAddress());
onAddressChange(restoreView);

// ---------- the address: the whole view as a link (address.js, docs/shareable-address.md) ----------

/** The view as the address keeps it. */
function captureView() {
  return {
    q: search?.searched() ?? null,
    cmp: compare?.chosen().cmp ?? [],
    cmpAdd: compare?.chosen().added ?? [],
    cmpAxis: compare && compare.axis() !== 'linear' ? compare.axis() : null,
    material: state.material ? String(state.material.id) : null,
    from: state.rescaled ? String(state.rescaled.fromSample.id) : null,
    mm: state.rescaled?.thicknessMm ?? null,
    axis: dom.axisMode.value === dom.axisMode.options[0]?.value ? null : dom.axisMode.value,
    words: dom.filterText.value.trim() || null,
    facets: facets.chosen(),
    figures: state.material ? figures.choices() : {},
  };
}

/** Writes the view into the address; nothing while a view is being restored from it. */
function rememberView({ push = false } = {}) {
  if (restoring) return;
  writeAddress(captureView(), { push });
}

/** Shows the view an address describes: on load (also an older `#material=ID` link) and on Back/Forward. */
async function restoreView(view) {
  restoring = true;
  try {
    const axis = view.axis ?? dom.axisMode.options[0]?.value;
    if ([...dom.axisMode.options].some((o) => o.value === axis)) dom.axisMode.value = axis;
    let listed = null;
    if (!state.catalogue || listingKey(view.words, view.facets) !== listingKey(dom.filterText.value, facets.chosen())) {
      dom.filterText.value = view.words ?? '';
      facets.choose(view.facets);
      listed = loadMaterials();
    }
    const searched = search.show(view.q);
    if (view.material === null) {
      closeMaterial();
    } else if (isShown(view)) {
      redraw();
    } else {
      await selectMaterial(view.material, view.mm ? { sampleId: view.from, thicknessMm: view.mm } : null);
    }
    if (view.material !== null && state.material && Object.keys(view.figures).length) {
      await figures.choose(view.figures);
    }
    await Promise.allSettled([listed, searched]);
    await compare.choose(view.q ? view.cmp : [], view.q ? view.cmpAdd : [], view.cmpAxis); // after the shortlist: it ticks its rows
  } finally {
    restoring = false;
  }
  rememberView(); // an older `#material=` link now reads in the new form; no new history entry
}

/** Words and ticks as one comparable string: empty groups left out, groups and values in a fixed order. */
function listingKey(words, chosen) {
  const ticks = Object.entries(chosen || {}).filter(([, values]) => values?.length)
    .map(([dimension, values]) => [dimension, [...values].sort()]).sort(([a], [b]) => a.localeCompare(b));
  return JSON.stringify([(words ?? '').trim(), ticks]);
}

function isShown(view) {
  return state.material && String(state.material.id) === String(view.material)
    && (state.rescaled?.thicknessMm ?? null) === view.mm
    && (view.mm === null || String(state.rescaled.fromSample.id) === String(view.from ?? state.rescaled.fromSample.id));
}

function closeMaterial() {
  ++state.detailRequest;
  state.material = null;
  state.rescaled = null;
  state.curves = [];
  state.overlays = [];
  state.stateCurves = [];
  dom.detail.hidden = true;
  dom.placeholder.hidden = false;
  markSelectedRow(null);
}
