// Curves shaped alike (docs/similar-curves-page.md): the stored samples whose curves look like the open
// sample's, and "identify a measured curve" for a file the user uploads (read, compared, never stored).
// The server ranks and explains every hit; this module only asks, lays out and formats.
import * as api from './api.js';
import * as fmt from './format.js';

const DEFAULT_METRIC = 'centred-euclidean';
// Dashed colours for curves overlaid from hits, apart from the samples' solid ones and the rescaled orange.
const OVERLAY_COLOURS = ['#b03a6f', '#5b6b00', '#6a4fb3', '#00796b'];
const MAX_OVERLAYS = OVERLAY_COLOURS.length;

// What a distance means, per comparison (docs/similar-curves.md "The two metrics").
const METRIC_ABOUT = {
  'centred-euclidean': 'Shape and depth: RMS difference of the absorbance curves at the compared sample\'s '
    + 'thickness, a constant offset (surface reflection) removed. A paler or darker stock of the same shape is '
    + 'farther away. Best when the thickness is known.',
  correlation: 'Shape only: 1 − r, r the correlation of the absorbance curves (0 = same shape, up to 2). Blind to '
    + 'thickness and offset, so a faint absorber can match a strong one of the same shape. Best when the '
    + 'thickness is unknown or the piece is a coating.',
};

const el = (id) => document.getElementById(id);

/** The band fields as the API's "FROM-TO", '' when both are empty, or a problem to show. */
function bandOf(fromInput, toInput) {
  const from = fromInput.value.trim();
  const to = toInput.value.trim();
  if (from === '' && to === '') return { band: '' };
  const a = Number(from);
  const b = Number(to);
  if (from === '' || to === '' || !Number.isFinite(a) || !Number.isFinite(b) || a <= 0 || b <= a) {
    return { problem: { title: 'Invalid band', detail: `Give both ends of the band in nm, the first below the second `
      + `(got “${from || '…'}” to “${to || '…'}”), or leave both empty to compare the whole common range.` } };
  }
  return { band: `${fmt.number(a, 1)}-${fmt.number(b, 1)}` };
}

function limitOf(input) {
  const raw = input.value.trim() || '10';
  const n = Number(raw);
  if (!Number.isInteger(n) || n < 1 || n > 50) {
    return { problem: { title: 'Invalid number of hits', detail: `“${raw}” is not a whole number from 1 to 50.` } };
  }
  return { limit: n };
}

/** A problem shown where it happened: its title, HTTP status and the server's detail. */
function showProblemIn(box, problem, context) {
  const heading = document.createElement('strong');
  heading.textContent = `${context}: ${problem.title || 'something went wrong'}${problem.status ? ` (${problem.status})` : ''}`;
  const detail = document.createElement('p');
  detail.textContent = problem.detail || problem.message || '';
  const parts = [heading, detail];
  const parameter = problem.properties?.parameter || problem.properties?.field;
  if (typeof parameter === 'string') {
    const where = document.createElement('p');
    where.textContent = `Concerns: ${parameter}`;
    parts.push(where);
  }
  if (problem.status === 404 || problem.status === 405) {
    const hint = document.createElement('p');
    hint.className = 'hint';
    hint.textContent = 'This server may not offer this comparison yet; the comparison of stored samples still works.';
    parts.push(hint);
  }
  box.replaceChildren(...parts);
  box.hidden = false;
}

function hideProblem(box) {
  box.hidden = true;
  box.replaceChildren();
}

function cell(text, className, title) {
  const td = document.createElement('td');
  td.textContent = text;
  if (className) td.className = className;
  if (title) td.title = title;
  return td;
}

/** One ranked hit as a table row; `extra(hit)` adds cells (the overlay toggle). */
function hitRow(hit, rank, { onOpen, extra }) {
  const tr = document.createElement('tr');
  tr.dataset.sampleId = hit.sampleId;
  tr.dataset.materialId = hit.materialId;
  const name = document.createElement('td');
  name.className = 'name';
  const open = document.createElement('button');
  open.type = 'button';
  open.className = 'link open-hit';
  open.textContent = hit.materialName;
  open.title = Number.isFinite(hit.matchingThicknessMm)
    ? `open ${hit.materialName}, its ${fmt.number(hit.thicknessMm)} mm sample rescaled to ${fmt.number(hit.matchingThicknessMm)} mm`
    : `open ${hit.materialName}`;
  open.addEventListener('click', () => onOpen(hit));
  const cls = document.createElement('span');
  cls.className = 'hit-class';
  cls.textContent = hit.materialClass || '—';
  name.append(open, cls);
  const band = hit.differingMost;
  const resolved = hit.resolvedPointsCompared;
  const points = cell(`${hit.pointsCompared} (${resolved})`, 'num',
    `${hit.pointsCompared} grid points compared, ${resolved} of them above the detection limit in both curves`);
  if (hit.pointsCompared > 0 && resolved < hit.pointsCompared / 4) points.classList.add('weak');
  tr.append(
    cell(String(rank), 'num'),
    name,
    cell(`${fmt.number(hit.thicknessMm)} mm`, 'num'),
    cell(fmt.significant(hit.distance, 3), 'num distance'),
    cell(band ? `${fmt.nanometres(band.fromNm)}–${fmt.nanometres(band.toNm)}` : '—', 'num'),
    Number.isFinite(hit.matchingThicknessMm)
      ? cell(`${fmt.number(hit.matchingThicknessMm, 2)} mm`, 'num matching')
      : cell('—', 'num muted matching', 'a fixed layer, or too little absorption to tell a thickness'),
    points,
  );
  if (extra) tr.append(...extra(hit));
  return tr;
}

function renderHits(tbody, hits, options) {
  if (!hits.length) {
    const tr = document.createElement('tr');
    const td = cell('No stored curve shares enough of the range to compare.', 'empty');
    td.colSpan = tbody.closest('table').tHead.rows[0].cells.length;
    tr.append(td);
    tbody.replaceChildren(tr);
    return;
  }
  tbody.replaceChildren(...hits.map((hit, i) => hitRow(hit, i + 1, options)));
}

/** The band the server applied, or a plain note that it compared the whole range although one was asked. */
function bandNote(answer, asked) {
  const applied = answer.band;
  if (applied && typeof applied === 'object' && Number.isFinite(applied.fromNm)) {
    return ` · within ${fmt.nanometres(applied.fromNm)}–${fmt.nanometres(applied.toNm)} nm`;
  }
  if (typeof applied === 'string' && applied) return ` · within ${applied.replace('-', '–')} nm`;
  if (asked) return ` · the band ${asked.replace('-', '–')} nm was not applied by this server: whole common range compared`;
  return ' · whole common range';
}

function metricWords(metric) {
  return metric === 'correlation' ? 'shape only (correlation)' : 'shape and depth (centred absorbance)';
}

function renderWarnings(list, warnings) {
  const items = (Array.isArray(warnings) ? warnings : []).filter((w) => typeof w === 'string' && w);
  list.replaceChildren(...items.map((w) => {
    const li = document.createElement('li');
    li.textContent = w;
    return li;
  }));
  list.hidden = items.length === 0;
}

/**
 * Wires both areas. `ui`: `showProblem`, `clearMessage` (the page's message area), `openMaterial(id,
 * { sampleId, thicknessMm })` (opens a material, rescale box pre-filled), `setOverlays(curves)` (extra
 * curves on the detail chart). Answers `{ showMaterial(material, sampleId) }` for the detail view.
 */
export function initSimilar(ui) {
  const near = {
    form: el('look-alike-form'),
    sample: el('look-alike-sample'),
    metric: el('look-alike-metric'),
    metricAbout: el('look-alike-metric-about'),
    bandFrom: el('look-alike-band-from'),
    bandTo: el('look-alike-band-to'),
    limit: el('look-alike-limit'),
    button: el('look-alike-button'),
    status: el('look-alike-status'),
    problem: el('look-alike-problem'),
    table: el('look-alike-table'),
    rows: el('look-alike-table').tBodies[0],
  };
  const id = {
    form: el('identify-form'),
    file: el('identify-file'),
    mm: el('identify-mm'),
    bulk: el('identify-bulk'),
    metric: el('identify-metric'),
    bandFrom: el('identify-band-from'),
    bandTo: el('identify-band-to'),
    requirement: el('identify-requirement'),
    limit: el('identify-limit'),
    button: el('identify-button'),
    status: el('identify-status'),
    problem: el('identify-problem'),
    results: el('identify-results'),
    warnings: el('identify-warnings'),
    rows: el('identify-table').tBodies[0],
  };
  const state = { material: null, request: 0, identifyRequest: 0, overlays: new Map() };

  // ---------- the open sample's look-alikes ----------

  function describeMetric() {
    near.metricAbout.textContent = METRIC_ABOUT[near.metric.value] || '';
  }

  function showMaterial(material, preferredSampleId) {
    state.material = material;
    ++state.request;
    clearOverlays();
    near.sample.replaceChildren(...material.samples.map((s) => {
      const option = document.createElement('option');
      option.value = s.id;
      option.textContent = `${fmt.number(s.thicknessMm)} mm ${s.geometry}`;
      return option;
    }));
    const preferred = material.samples.find((s) => String(s.id) === String(preferredSampleId));
    if (preferred) near.sample.value = String(preferred.id);
    if (!material.samples.length) {
      near.rows.replaceChildren();
      near.status.textContent = 'No sample to compare.';
      near.button.disabled = true;
      return;
    }
    near.button.disabled = false;
    compare();
  }

  async function compare() {
    const material = state.material;
    if (!material || !near.sample.value) return;
    hideProblem(near.problem);
    const band = bandOf(near.bandFrom, near.bandTo);
    const limit = limitOf(near.limit);
    const invalid = band.problem || limit.problem;
    if (invalid) {
      showProblemIn(near.problem, invalid, 'Comparing curves');
      return;
    }
    const sampleId = near.sample.value;
    const request = ++state.request;
    clearOverlays();
    near.table.setAttribute('aria-busy', 'true');
    near.status.textContent = 'Comparing with the library…';
    try {
      const answer = await api.similarTo(sampleId, { limit: limit.limit, metric: near.metric.value, band: band.band });
      if (request !== state.request || material !== state.material) return;
      const hits = answer.hits || [];
      renderHits(near.rows, hits, { onOpen: openHit, extra: (hit) => [overlayCell(hit)] });
      near.table.dataset.metric = answer.metric;
      const warnings = (answer.warnings || []).filter((w) => typeof w === 'string');
      near.status.textContent = `${hits.length === 1 ? '1 look-alike' : `${hits.length} look-alikes`}, nearest first`
        + ` · ${metricWords(answer.metric)}${bandNote(answer, band.band)}`
        + (warnings.length ? ` · ${warnings.join(' · ')}` : '');
    } catch (problem) {
      if (request !== state.request) return;
      near.rows.replaceChildren();
      near.status.textContent = 'The comparison did not run.';
      showProblemIn(near.problem, problem, 'Comparing curves');
    } finally {
      if (request === state.request) near.table.removeAttribute('aria-busy');
    }
  }

  function openHit(hit) {
    ui.openMaterial(hit.materialId, {
      sampleId: hit.sampleId,
      thicknessMm: Number.isFinite(hit.matchingThicknessMm) ? hit.matchingThicknessMm : undefined,
    });
  }

  // ---------- overlays on the detail chart ----------

  function overlayCell(hit) {
    const td = document.createElement('td');
    const button = document.createElement('button');
    button.type = 'button';
    button.className = 'quiet small overlay-hit';
    button.textContent = 'Overlay';
    button.setAttribute('aria-pressed', String(state.overlays.has(String(hit.sampleId))));
    button.setAttribute('aria-label', `overlay the curve of ${hit.materialName} ${fmt.number(hit.thicknessMm)} mm on the chart`);
    button.addEventListener('click', () => toggleOverlay(hit, button));
    td.append(button);
    return td;
  }

  async function toggleOverlay(hit, button) {
    const key = String(hit.sampleId);
    if (state.overlays.has(key)) {
      state.overlays.delete(key);
      button.setAttribute('aria-pressed', 'false');
      pushOverlays();
      return;
    }
    if (state.overlays.size >= MAX_OVERLAYS) {
      showProblemIn(near.problem, { title: 'Too many overlays', detail: `At most ${MAX_OVERLAYS} hits are drawn `
        + 'at once; press a pressed “Overlay” to take one off.' }, 'Overlaying a curve');
      return;
    }
    const request = state.request; // a new comparison (or material) drops the hits this one belongs to
    button.disabled = true;
    try {
      const curve = await overlayCurve(hit);
      if (request !== state.request) return;
      const colour = OVERLAY_COLOURS.find((c) => ![...state.overlays.values()].some((o) => o.color === c));
      state.overlays.set(key, { ...curve, color: colour, dash: [3, 3] });
      button.setAttribute('aria-pressed', 'true');
      hideProblem(near.problem);
      pushOverlays();
    } catch (problem) {
      showProblemIn(near.problem, problem, `Loading the curve of ${hit.materialName}`);
    } finally {
      button.disabled = false;
    }
  }

  /**
   * The hit's curve at its matching thickness, rescaled by the server (Fresnel + Beer–Lambert); as stored when
   * there is no such thickness, or when the server will not rescale this sample (it says why, kept in the label).
   */
  async function overlayCurve(hit) {
    const stored = `${hit.materialName} ${fmt.number(hit.thicknessMm)} mm`;
    const to = hit.matchingThicknessMm;
    if (Number.isFinite(to) && Math.abs(to - hit.thicknessMm) > 1e-9) {
      try {
        const curve = await api.getCurve(hit.sampleId, to);
        return { ...curve, label: `look-alike: ${stored} rescaled to ${fmt.number(to, 2)} mm` };
      } catch (problem) {
        if (problem.status !== 400) throw problem;
        const curve = await api.getCurve(hit.sampleId);
        return { ...curve, label: `look-alike: ${stored} as stored (not rescaled: ${problem.detail || problem.title})` };
      }
    }
    const curve = await api.getCurve(hit.sampleId);
    return { ...curve, label: `look-alike: ${stored} as stored` };
  }

  function pushOverlays() {
    ui.setOverlays([...state.overlays.values()]);
  }

  function clearOverlays() {
    if (!state.overlays.size) return;
    state.overlays.clear();
    for (const b of near.rows.querySelectorAll('button.overlay-hit')) b.setAttribute('aria-pressed', 'false');
    pushOverlays();
  }

  // ---------- identify an uploaded capture ----------

  async function identify() {
    hideProblem(id.problem);
    const file = id.file.files?.[0];
    const band = bandOf(id.bandFrom, id.bandTo);
    const limit = limitOf(id.limit);
    const mmText = id.mm.value.trim();
    const mm = Number(mmText);
    let invalid = band.problem || limit.problem;
    if (!file) invalid = { title: 'No file chosen', detail: 'Choose a transmittance file to compare.' };
    else if (mmText !== '' && (!Number.isFinite(mm) || mm <= 0)) {
      invalid = { title: 'Invalid thickness', detail: `“${mmText}” is not a positive number of millimetres.` };
    }
    if (invalid) {
      showProblemIn(id.problem, invalid, 'Identifying the curve');
      if (!file) id.file.focus();
      return;
    }
    const requirement = id.requirement.value.trim();
    const request = ++state.identifyRequest;
    id.button.disabled = true;
    id.status.textContent = `Comparing ${file.name} with the library…`;
    try {
      const answer = await api.identifyCapture({
        file,
        thicknessMm: mmText === '' ? undefined : mm,
        bulk: id.bulk.value,
        band: band.band,
        metric: id.metric.value,
        limit: limit.limit,
        requirement,
      });
      if (request !== state.identifyRequest) return;
      showIdentified(answer, file, band.band, requirement);
    } catch (problem) {
      if (request !== state.identifyRequest) return;
      id.results.hidden = true;
      id.status.textContent = `${file.name} was not compared.`;
      showProblemIn(id.problem, problem, 'Identifying the curve');
    } finally {
      if (request === state.identifyRequest) id.button.disabled = false;
    }
  }

  function showIdentified(answer, file, askedBand, askedRequirement) {
    const hits = answer.hits || [];
    renderHits(id.rows, hits, { onOpen: openHit });
    renderWarnings(id.warnings, answer.warnings);
    const parts = [`${file.name} (not stored)`, metricWords(answer.metric)];
    const q = answer.query || {};
    if (Number.isFinite(q.thicknessMm)) parts.push(`measured at ${fmt.number(q.thicknessMm)} mm`);
    const found = hits.length === 1 ? '1 look-alike' : `${hits.length} look-alikes`;
    let text = `${found}, nearest first, for ${parts.join(' · ')}${bandNote(answer, askedBand)}`;
    const r = answer.requirement;
    if (r && typeof r === 'object') {
      text += ` · “${r.text}”: ${r.looked} look-alike${r.looked === 1 ? '' : 's'} looked at, ${r.met} meet${r.met === 1 ? 's' : ''} it`;
      if (Number.isFinite(r.admitted)) {
        text += r.admitted === 0 ? ', its words admit no material of the library'
          : `, among the ${r.admitted} material${r.admitted === 1 ? '' : 's'} its words admit`;
      }
    } else if (askedRequirement) {
      text += ' · the requirement was not applied by this server';
    }
    id.status.textContent = text;
    id.results.hidden = false;
  }

  // ---------- wiring ----------

  near.form.addEventListener('submit', (event) => {
    event.preventDefault();
    compare();
  });
  near.metric.addEventListener('change', () => {
    describeMetric();
    compare();
  });
  near.sample.addEventListener('change', compare);
  id.form.addEventListener('submit', (event) => {
    event.preventDefault();
    identify();
  });
  near.metric.value = DEFAULT_METRIC;
  id.metric.value = DEFAULT_METRIC;
  describeMetric();

  return { showMaterial };
}
