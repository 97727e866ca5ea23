// Compare: the shortlist's candidates (and any material the user adds) overlaid on one chart, each at the
// thickness its row was judged at (the server rescales: GET /api/samples/{id}/curve?thicknessMm=), with the
// requirement drawn over them. The page only fetches and draws; every curve and every threshold is the API's.
import uPlot from './webjars/uplot/dist/uPlot.esm.js';
import * as api from './api.js';
import * as fmt from './format.js';
import { AXIS_MODES } from './chart.js';
import { downloadRow, saveChartPng } from './export.js';
import { offerValues, describeChart } from './chart-values.js';

/** More curves than this turn one chart into a tangle; the picker says so instead of adding more. */
export const MAX_SERIES = 20;

// Okabe–Ito palette (Okabe & Ito, "Color Universal Design", 2008; also Wong, Nature Methods 8:441, 2011),
// chosen so the colours stay apart for the common colour-vision deficiencies. Yellow last: it is faint on white.
export const OKABE_ITO = [
  { name: 'blue', hex: '#0072B2' },
  { name: 'vermillion', hex: '#D55E00' },
  { name: 'bluish green', hex: '#009E73' },
  { name: 'reddish purple', hex: '#CC79A7' },
  { name: 'orange', hex: '#E69F00' },
  { name: 'sky blue', hex: '#56B4E9' },
  { name: 'black', hex: '#000000' },
  { name: 'yellow', hex: '#F0E442' },
];

// Five dash patterns beside eight colours: 40 distinct pairs, so colour is never the only cue.
const DASHES = [
  { name: 'solid', dash: [] },
  { name: 'long dash', dash: [10, 4] },
  { name: 'dot', dash: [2, 3] },
  { name: 'dash-dot', dash: [10, 3, 2, 3] },
  { name: 'short dash', dash: [5, 5] },
];

/** The look of the i-th series: its colour and dash, each with a name for the text legend. */
export function seriesStyle(i) {
  return { colour: OKABE_ITO[i % OKABE_ITO.length], dash: DASHES[i % DASHES.length] };
}

const REQUIREMENT_INK = '#3a3340';
const FORBIDDEN_FILL = 'rgba(58, 51, 64, 0.10)';
const EMITTER_FILL = 'rgba(86, 180, 233, 0.14)';

const el = (id) => document.getElementById(id);

/**
 * Wires the Compare section. `ui.showProblem(problem, context)` is the page's message area. The shortlist
 * arrives as the `shortlist` event on #search-results (detail: the search answer).
 */
export function initCompare(ui) {
  const dom = {
    section: el('compare'),
    rows: el('compare-rows'),
    top3: el('compare-top3'),
    none: el('compare-none'),
    pick: el('compare-pick'),
    pickChoices: el('compare-pick-choices'),
    add: el('compare-add'),
    axis: el('compare-axis'),
    status: el('compare-status'),
    chart: el('compare-chart'),
    key: el('compare-key'),
    clauses: el('compare-clauses'),
    downloads: el('compare-downloads'),
    png: el('compare-png'),
    values: el('compare-values'),
    addressNote: el('compare-address-note'),
  };
  const state = {
    answer: null, // the search answer whose rows are offered
    picked: [], // materials added by name: { materialId, name, sampleId, thicknessMm, measuredMm, geometry }
    curves: new Map(), // key → fetched curve (keyed by sample and thickness, so a redraw does not refetch)
    materials: null,
    plot: null,
    request: 0,
  };

  // ---------- the candidates ----------

  function showShortlist(answer) {
    state.answer = answer;
    state.picked = [];
    const rows = answer.results.filter((r) => Number.isFinite(r.sampleId));
    dom.section.hidden = rows.length === 0 && !state.picked.length;
    dom.rows.replaceChildren(...rows.map((row, i) => {
      const li = document.createElement('li');
      const label = document.createElement('label');
      const box = document.createElement('input');
      box.type = 'checkbox';
      box.value = String(i);
      box.dataset.sampleId = row.sampleId;
      box.addEventListener('change', redraw);
      box.addEventListener('change', () => changed()); // a single tick replaces the address entry
      const text = document.createElement('span');
      text.textContent = `${row.rank}. ${row.materialName} · ${rowThickness(row, answer.requirement)} · ${row.verdict}`;
      label.append(box, text);
      li.append(label);
      return li;
    }));
    redraw();
  }

  function candidates() {
    const chosen = [];
    const rows = state.answer ? state.answer.results.filter((r) => Number.isFinite(r.sampleId)) : [];
    for (const box of dom.rows.querySelectorAll('input[type=checkbox]:checked')) {
      const row = rows[Number(box.value)];
      if (row) chosen.push(fromRow(row, state.answer.requirement));
    }
    return [...chosen, ...state.picked];
  }

  function fromRow(row, requirement) {
    // a row searched at a thickness is drawn at that thickness; "as measured" rows at their own
    const rescale = requirement.thickness?.kind !== 'asMeasured' && Number.isFinite(row.thicknessMm);
    return {
      materialId: row.materialId,
      name: row.materialName,
      sampleId: row.sampleId,
      thicknessMm: rescale ? row.thicknessMm : null,
      geometry: row.geometry,
      origin: `rank ${row.rank}`,
      // a row that names its sample's measured thickness spares a request
      measuredMm: Number.isFinite(row.measuredMm) ? row.measuredMm : null,
    };
  }

  // ---------- adding a material by name ----------

  async function loadMaterialNames() {
    if (state.materials) return state.materials;
    const answer = await api.listMaterials();
    const list = Array.isArray(answer) ? answer : answer.materials || [];
    state.materials = list;
    dom.pickChoices.replaceChildren(...list.map((m) => {
      const option = document.createElement('option');
      option.value = m.name;
      return option;
    }));
    return list;
  }

  async function addPicked() {
    const name = dom.pick.value.trim();
    if (!name) return;
    try {
      const list = await loadMaterialNames();
      const match = list.find((m) => m.name.toLowerCase() === name.toLowerCase());
      if (!match) {
        say(`No material is named “${name}”; choose one of the suggestions.`);
        return;
      }
      if (candidates().length >= MAX_SERIES) {
        say(`At most ${MAX_SERIES} curves fit on one chart; untick one first.`);
        return;
      }
      const material = await api.getMaterial(match.id);
      const picked = pickedFrom(material);
      if (!picked) {
        say(`${material.name} has no sample to draw.`);
        return;
      }
      state.picked.push(picked);
      dom.pick.value = '';
      dom.section.hidden = false;
      redraw();
      changed({ push: true }); // adding a material is a step Back returns from
    } catch (problem) {
      ui.showProblem(problem, 'Adding a material to the comparison');
    }
  }

  /** A material added by name (or by the address) as a curve to draw; null when it has no sample to draw. */
  function pickedFrom(material) {
    const sample = preferredSample(material.samples || []);
    if (!sample) return null;
    const fixed = state.answer?.requirement?.thickness?.kind === 'fixed' ? state.answer.requirement.thickness.mm : null;
    return {
      materialId: material.id,
      name: material.name,
      sampleId: sample.id,
      // a picked material follows a fixed thickness the requirement names; otherwise as measured
      thicknessMm: fixed,
      geometry: sample.geometry,
      measuredMm: Number.isFinite(sample.thicknessMm) ? sample.thicknessMm : null,
      origin: 'added',
    };
  }

  // ---------- the address (address.js: cmp=ID,ID,…, cmp.axis) ----------

  function changed(how = {}) {
    dom.addressNote.hidden = true; // a note about a link's unknown ids is about the view the link opened
    ui.changed?.(how);
  }

  /** The compared materials' ids in drawing order (ticked rows in shortlist order, then those added). */
  function chosenIds() {
    return candidates().map((c) => String(c.materialId));
  }

  /** The overlay as the address keeps it: `cmp` the ticked rows' materials, `added` those added by name. */
  function chosen() {
    const all = candidates();
    return {
      cmp: all.filter((c) => c.origin !== 'added').map((c) => String(c.materialId)),
      added: all.filter((c) => c.origin === 'added').map((c) => String(c.materialId)),
    };
  }

  /**
   * Shows the overlay an address names: ticks the shortlist rows of those materials, adds the others as by
   * name, and says once, beside the chart, which ids are not materials of the library (the rest are drawn).
   */
  async function choose(ids, addedIds, axis) {
    const rowIds = [...new Set((ids || []).map(String))];
    const added = [...new Set((addedIds || []).map(String))].filter((id) => !rowIds.includes(id));
    const wanted = [...rowIds, ...added];
    const axisValue = axis === 'od' ? 'od' : 'linear';
    const axisChanged = dom.axis.value !== axisValue;
    dom.axis.value = axisValue;
    const now = chosen();
    if (sameList(now.cmp, rowIds) && sameList(now.added, added)) {
      if (axisChanged) await redraw();
      return;
    }
    const rows = state.answer ? state.answer.results.filter((r) => Number.isFinite(r.sampleId)) : [];
    const boxes = [...dom.rows.querySelectorAll('input[type=checkbox]')];
    boxes.forEach((box) => { box.checked = false; });
    state.picked = [];
    const unknown = [];
    for (const id of wanted) {
      // a `cmp` id ticks its shortlist row; one added by name (or no longer in the shortlist) is added again
      const i = added.includes(id) ? -1 : rows.findIndex((r) => String(r.materialId) === id);
      if (i >= 0 && boxes[i]) {
        boxes[i].checked = true;
        continue;
      }
      if (!/^[1-9][0-9]{0,17}$/.test(id)) {
        unknown.push(id);
        continue;
      }
      try {
        const picked = pickedFrom(await api.getMaterial(id));
        if (picked) state.picked.push(picked);
        else unknown.push(id);
      } catch (problem) {
        if (problem.status === 404 || problem.status === 400) unknown.push(id);
        else ui.showProblem(problem, 'Adding a material to the comparison');
      }
    }
    if (unknown.length) {
      dom.addressNote.textContent = `The link names ${unknown.length === 1 ? 'a material' : 'materials'} this library `
        + `does not have (${unknown.join(', ')}); `
        + `${{ 0: 'nothing is drawn', 1: 'the other one is drawn' }[wanted.length - unknown.length] ?? 'the others are drawn'}.`;
    }
    dom.addressNote.hidden = !unknown.length;
    if (state.picked.length) dom.section.hidden = false;
    await redraw();
  }

  // ---------- drawing ----------

  async function redraw() {
    const request = ++state.request;
    let chosen = candidates();
    const left = Math.max(0, chosen.length - MAX_SERIES);
    if (left) chosen = chosen.slice(0, MAX_SERIES);
    if (!chosen.length) {
      destroy();
      dom.chart.dataset.series = '0';
      dom.key.replaceChildren();
      dom.downloads.replaceChildren();
      offerValues(dom.values, [], 'linear');
      renderClauseList([]);
      say('Tick rows of the shortlist, or add a material, to compare their curves.');
      return;
    }
    say(`Drawing ${chosen.length === 1 ? '1 curve' : `${chosen.length} curves`}…`);
    const fetched = await Promise.all(chosen.map(fetchCurve));
    if (request !== state.request) return;
    const drawn = [];
    const problems = [];
    fetched.forEach((f, i) => (f.curve
      ? drawn.push({ ...chosen[i], curve: f.curve, note: f.note, measuredMm: f.measuredMm ?? chosen[i].measuredMm })
      : problems.push(f)));
    draw(drawn);
    const words = `${drawn.length === 1 ? '1 curve' : `${drawn.length} curves`} compared`
      + (left ? ` (the first ${MAX_SERIES}; ${left} more ticked but not drawn)` : '');
    say(problems.length ? `${words}; not drawn: ${problems.map((p) => p.problem).join('; ')}` : words);
  }

  async function fetchCurve(c) {
    const key = `${c.sampleId}@${c.thicknessMm ?? 'measured'}`;
    if (state.curves.has(key)) return state.curves.get(key);
    let result;
    try {
      result = { curve: await api.getCurve(c.sampleId, c.thicknessMm ?? undefined) };
    } catch (problem) {
      if (c.thicknessMm == null || problem.status !== 400) return { problem: `${c.name}: ${problem.detail || problem.title}` };
      // a film or coating cannot be rescaled: draw it as measured and say so beside it
      try {
        result = { curve: await api.getCurve(c.sampleId), note: `not rescaled: ${problem.detail || problem.title}` };
      } catch (again) {
        return { problem: `${c.name}: ${again.detail || again.title}` };
      }
    }
    if (result.curve.rescaled) result.measuredMm = c.measuredMm ?? await measuredThickness(c.sampleId);
    state.curves.set(key, result);
    return result;
  }

  /** The thickness the sample was measured at: its curve asked without a thickness. */
  async function measuredThickness(sampleId) {
    try {
      return (await api.getCurve(sampleId)).thicknessMm;
    } catch {
      return null; // the legend then names the sample instead of its thickness
    }
  }

  function destroy() {
    if (state.plot) state.plot.destroy();
    state.plot = null;
    dom.chart.replaceChildren();
  }

  function draw(drawn) {
    destroy();
    const modeKey = dom.axis.value === 'od' ? 'od' : 'linear';
    const mode = AXIS_MODES[modeKey];
    const requirement = state.answer?.requirement || null;
    const tables = drawn.map((d) => seriesColumns(d.curve, mode));
    const data = uPlot.join(tables.map((t) => [t.xs, t.values]));
    const unit = modeKey === 'od' ? (v) => `OD ${v.toFixed(2)}` : (v) => `${v.toFixed(1)} %`;
    const series = [{ label: 'λ', value: (u, v) => (v == null ? '—' : `${v} nm`) }];
    drawn.forEach((d, i) => {
      const style = seriesStyle(i);
      series.push({
        label: `${i + 1}. ${d.name}`,
        stroke: style.colour.hex,
        width: 2,
        dash: style.dash.dash,
        value: (u, v) => (v == null ? '—' : unit(v)),
      });
    });
    const width = Math.max(300, dom.chart.clientWidth || 720);
    const clauses = requirement ? drawableClauses(requirement, modeKey) : [];
    state.plot = new uPlot({
      width,
      height: Math.round(Math.min(440, Math.max(260, width * 0.5))),
      scales: { x: { time: false }, y: { range: mode.range } },
      axes: [
        { label: 'Wavelength (nm)', stroke: '#3b4448', grid: { stroke: '#e4e7e3' }, ticks: { stroke: '#cfd4cf' } },
        { label: mode.label, stroke: '#3b4448', grid: { stroke: '#e4e7e3' }, ticks: { stroke: '#cfd4cf' }, size: 56 },
      ],
      series,
      cursor: { drag: { x: true, y: false } },
      // the requirement is drawn over the curves, so a marker stays visible where a curve crosses it
      hooks: { draw: [(u) => drawRequirement(u, clauses, modeKey), () => performance.mark('sieve:compare-drawn')] },
    }, data, dom.chart);
    dom.chart.dataset.series = String(drawn.length);
    dom.chart.dataset.axisMode = modeKey;
    renderKey(drawn, tables);
    renderClauseList(clauses);
    const shown = drawn.map((d, i) => ({ label: `${i + 1}. ${d.name}, ${fmt.number(d.curve.thicknessMm)} mm`, curve: d.curve }));
    offerValues(dom.values, shown, modeKey);
    describeChart(dom.chart, shown, modeKey);
    renderDownloads(drawn);
  }

  /** A CSV and JCAMP-DX per curve drawn, at the thickness it is drawn at (export.js writes the row). */
  function renderDownloads(drawn) {
    dom.downloads.replaceChildren(...drawn.map((d, i) => {
      const c = d.curve;
      const li = downloadRow(`${i + 1}. ${d.name}, ${thicknessWords(d)}`, c.sampleId ?? d.sampleId,
        c.rescaled ? c.thicknessMm : null);
      li.dataset.sampleId = d.sampleId;
      li.dataset.thicknessMm = String(c.thicknessMm);
      return li;
    }));
  }

  /** A text legend: each series' colour and dash by name, the thickness drawn and where it comes from. */
  function renderKey(drawn, tables) {
    dom.key.replaceChildren(...drawn.map((d, i) => {
      const style = seriesStyle(i);
      const li = document.createElement('li');
      li.dataset.sampleId = d.sampleId;
      li.append(swatch(style));
      const name = document.createElement('span');
      name.className = 'compare-name';
      name.textContent = `${i + 1}. ${d.name}`;
      const about = document.createElement('span');
      about.className = 'compare-about';
      const bounds = tables[i].boundPoints;
      about.textContent = ` — ${thicknessWords(d)}${d.geometry ? `, ${d.geometry} transmittance` : ''}; ${d.origin}`
        + `; ${style.colour.name}, ${style.dash.name}`
        + (bounds ? `; ${bounds} points below the detection limit drawn at the limit (T at most that)` : '')
        + (d.note ? `; ${d.note}` : '');
      li.append(name, about);
      return li;
    }));
  }

  function renderClauseList(clauses) {
    dom.clauses.replaceChildren(...clauses.map((c) => {
      const li = document.createElement('li');
      li.dataset.clauseKind = c.kind;
      if (c.direction) li.dataset.direction = c.direction;
      li.textContent = `R${c.index}: ${c.summary} — ${c.drawnAs}`;
      return li;
    }));
  }

  function say(text) {
    dom.status.textContent = text;
  }

  // ---------- wiring ----------

  el('search-results').addEventListener('shortlist', (event) => showShortlist(event.detail));
  dom.top3.addEventListener('click', () => {
    const boxes = [...dom.rows.querySelectorAll('input[type=checkbox]')];
    boxes.forEach((box, i) => { box.checked = i < 3; });
    redraw();
    changed({ push: true });
  });
  dom.none.addEventListener('click', () => {
    dom.rows.querySelectorAll('input[type=checkbox]').forEach((box) => { box.checked = false; });
    state.picked = [];
    redraw();
    changed({ push: true });
  });
  dom.png.addEventListener('click', () => saveChartPng(dom.chart, `compared-${chosenIds().length}-curves`));
  dom.add.addEventListener('click', addPicked);
  dom.pick.addEventListener('keydown', (event) => {
    if (event.key === 'Enter') {
      event.preventDefault();
      addPicked();
    }
  });
  dom.pick.addEventListener('focus', () => loadMaterialNames().catch((p) => ui.showProblem(p, 'Listing materials')), { once: true });
  dom.axis.addEventListener('change', redraw);
  dom.axis.addEventListener('change', () => changed());
  new ResizeObserver(() => {
    if (state.plot && dom.chart.clientWidth > 0 && Math.abs(state.plot.width - dom.chart.clientWidth) > 4) {
      state.plot.setSize({ width: dom.chart.clientWidth, height: state.plot.height });
    }
  }).observe(dom.chart);

  return { showShortlist, redraw, chosen, choose, axis: () => dom.axis.value };
}

// ---------- curves ----------

/**
 * One column per curve. A point below the detection limit is drawn at the limit (the true T is at most
 * that) and counted, so the legend can say so: a blocking candidate's curve would otherwise vanish.
 */
function seriesColumns(curve, mode) {
  const xs = curve.wavelengthsNm;
  const values = new Array(xs.length);
  let boundPoints = 0;
  for (let i = 0; i < xs.length; i++) {
    let t = curve.transmittance[i];
    if (curve.belowDetection?.[i] === true) {
      boundPoints++;
      if (Number.isFinite(curve.detectionLimit) && curve.detectionLimit > 0) t = curve.detectionLimit;
    }
    values[i] = Number.isFinite(t) ? mode.value(t) : null;
  }
  return { xs, values, boundPoints };
}

function sameList(a, b) {
  return a.length === b.length && a.every((x, i) => x === b[i]);
}

function preferredSample(samples) {
  const live = samples.filter((s) => !s.retiredAt);
  return live.find((s) => s.geometry === 'regular') || live[0] || null;
}

function rowThickness(row, requirement) {
  if (!Number.isFinite(row.thicknessMm)) return 'thickness —';
  return requirement.thickness?.kind === 'asMeasured'
    ? `${fmt.number(row.thicknessMm)} mm as measured`
    : `at ${fmt.number(row.thicknessMm)} mm`;
}

function thicknessWords(d) {
  const c = d.curve;
  const mm = `${fmt.number(c.thicknessMm)} mm`;
  if (!c.rescaled) return `${mm}, measured`;
  const from = Number.isFinite(d.measuredMm) ? ` from ${fmt.number(d.measuredMm)} mm` : ` from sample ${c.sampleId}`;
  return `${mm}, rescaled${from}`;
}

// ---------- the requirement on the chart ----------

/**
 * The clauses that can be drawn, each with how: a point clause as a marker with an arrow toward the side the
 * curve must lie on, a band clause as its threshold over the band with the forbidden side shaded, a weighted
 * clause as its emitter's band, a cutoff as its window at its level, a critical wavelength as a line.
 */
export function drawableClauses(requirement, modeKey = 'linear') {
  const out = [];
  (requirement.clauses || []).forEach((c, i) => {
    const base = { index: i + 1, summary: clauseWords(c), direction: c.direction, clause: c };
    if (c.type === 'weighted') {
      if (Array.isArray(c.rangeNm)) out.push({ ...base, kind: 'weighted', drawnAs: `shaded emitter band ${fmt.number(c.rangeNm[0], 0)}–${fmt.number(c.rangeNm[1], 0)} nm` });
    } else if (c.type === 'cutoff') {
      out.push({ ...base, kind: 'cutoff', drawnAs: `window ${fmt.number(c.fromNm, 0)}–${fmt.number(c.toNm, 0)} nm at its level` });
    } else if (c.type === 'criticalWavelength') {
      out.push({ ...base, kind: 'critical', drawnAs: `vertical line at ${fmt.number(c.nm, 1)} nm` });
    } else if (Number.isFinite(c.fromNm) && Number.isFinite(c.thresholdT)) {
      const point = !Number.isFinite(c.toNm) || c.toNm === c.fromNm;
      const way = `${c.direction === 'pass' ? 'passes' : 'blocks'}: curve must lie on or ${pointsUp(c, modeKey) ? 'above' : 'below'}`;
      out.push(point
        ? { ...base, kind: 'point', drawnAs: `marker at ${fmt.number(c.fromNm, 1)} nm with an arrow ${pointsUp(c, modeKey) ? 'up' : 'down'} (${way})` }
        : { ...base, kind: 'band', drawnAs: `threshold over ${fmt.number(c.fromNm, 0)}–${fmt.number(c.toNm, 0)} nm, the side the curve must avoid shaded (${way})` });
    }
  });
  return out;
}

/** Up the page for "passes" on the transmittance axis; the OD axis runs the other way. */
function pointsUp(clause, modeKey) {
  return (clause.direction === 'pass') === (modeKey !== 'od');
}

function clauseWords(c) {
  if (c.type === 'weighted') {
    // a preset (erythemal, UV hazard, luminous) is named by itself; otherwise the emitter and response named
    const named = { erythemal: 'erythemal', uvHazard: 'UV hazard', luminous: 'luminous' }[c.preset];
    const name = named || (c.response ? `${c.emitter} × ${c.response}` : c.emitter);
    return `weighted T of ${name} ${c.direction === 'pass' ? '≥' : '≤'} ${fmt.number(c.thresholdT * 100, 4)} %`;
  }
  if (c.type === 'criticalWavelength') return `critical wavelength ${c.comparison === 'atLeast' ? '≥' : '≤'} ${fmt.number(c.nm, 1)} nm`;
  return fmt.clauseSummary(c);
}

function drawRequirement(u, clauses, modeKey) {
  if (!clauses.length) return;
  const { ctx, bbox } = u;
  const dpr = devicePixelRatio || 1;
  const mode = AXIS_MODES[modeKey];
  const xMin = u.scales.x.min;
  const xMax = u.scales.x.max;
  const yAt = (t) => {
    let v = mode.value(t);
    if (v == null) v = u.scales.y.max; // T = 0 on the OD axis: beyond the top
    return Math.min(bbox.top + bbox.height, Math.max(bbox.top, u.valToPos(v, 'y', true)));
  };
  const xAt = (nm) => u.valToPos(nm, 'x', true);
  ctx.save();
  ctx.beginPath();
  ctx.rect(bbox.left, bbox.top, bbox.width, bbox.height);
  ctx.clip();
  ctx.font = `${Math.round(11 * dpr)}px system-ui, sans-serif`;
  // uPlot leaves the alignment of its last axis label behind
  ctx.textAlign = 'left';
  ctx.textBaseline = 'alphabetic';
  ctx.lineWidth = 1.5 * dpr;
  for (const c of clauses) {
    const tag = `R${c.index}`;
    const clause = c.clause;
    ctx.strokeStyle = REQUIREMENT_INK;
    ctx.fillStyle = REQUIREMENT_INK;
    ctx.setLineDash([]);
    if (c.kind === 'weighted') {
      const [from, to] = clause.rangeNm;
      if (to < xMin || from > xMax) continue;
      const x0 = xAt(Math.max(from, xMin));
      const x1 = xAt(Math.min(to, xMax));
      ctx.fillStyle = EMITTER_FILL;
      ctx.fillRect(x0, bbox.top, x1 - x0, bbox.height);
      ctx.fillStyle = REQUIREMENT_INK;
      ctx.fillText(`${tag} ${clause.emitter || ''}`, x0 + 3 * dpr, bbox.top + bbox.height - 6 * dpr);
    } else if (c.kind === 'critical') {
      if (clause.nm < xMin || clause.nm > xMax) continue;
      const x = xAt(clause.nm);
      ctx.setLineDash([6 * dpr, 4 * dpr]);
      ctx.beginPath();
      ctx.moveTo(x, bbox.top);
      ctx.lineTo(x, bbox.top + bbox.height);
      ctx.stroke();
      ctx.fillText(tag, x + 3 * dpr, bbox.top + 28 * dpr);
    } else if (c.kind === 'cutoff') {
      const y = yAt(clause.levelT);
      const x0 = xAt(Math.max(clause.fromNm, xMin));
      const x1 = xAt(Math.min(clause.toNm, xMax));
      if (x1 <= x0) continue;
      ctx.beginPath();
      ctx.moveTo(x0, y - 6 * dpr);
      ctx.lineTo(x0, y + 6 * dpr);
      ctx.moveTo(x0, y);
      ctx.lineTo(x1, y);
      ctx.moveTo(x1, y - 6 * dpr);
      ctx.lineTo(x1, y + 6 * dpr);
      ctx.stroke();
      ctx.fillText(tag, x0 + 3 * dpr, y - 6 * dpr);
    } else {
      const y = yAt(clause.thresholdT);
      const mustBeAbove = pointsUp(clause, modeKey);
      if (c.kind === 'point') {
        if (clause.fromNm < xMin || clause.fromNm > xMax) continue;
        const x = xAt(clause.fromNm);
        const half = 9 * dpr;
        ctx.lineWidth = 2.5 * dpr;
        ctx.beginPath();
        ctx.moveTo(x - half, y);
        ctx.lineTo(x + half, y);
        ctx.stroke();
        diamond(ctx, x, y, 4 * dpr);
        arrow(ctx, x, y, mustBeAbove ? -1 : 1, dpr, bbox);
        ctx.lineWidth = 1.5 * dpr;
        label(ctx, tag, x + half + 3 * dpr, y, bbox, dpr);
      } else {
        const from = Math.max(clause.fromNm, xMin);
        const to = Math.min(clause.toNm, xMax);
        if (to <= from) continue;
        const x0 = xAt(from);
        const x1 = xAt(to);
        // shade the side the curve must stay out of
        ctx.fillStyle = FORBIDDEN_FILL;
        if (mustBeAbove) ctx.fillRect(x0, y, x1 - x0, bbox.top + bbox.height - y);
        else ctx.fillRect(x0, bbox.top, x1 - x0, y - bbox.top);
        ctx.fillStyle = REQUIREMENT_INK;
        ctx.setLineDash([8 * dpr, 3 * dpr]);
        ctx.beginPath();
        ctx.moveTo(x0, y);
        ctx.lineTo(x1, y);
        ctx.stroke();
        ctx.setLineDash([]);
        arrow(ctx, (x0 + x1) / 2, y, mustBeAbove ? -1 : 1, dpr, bbox);
        label(ctx, tag, x0 + 3 * dpr, y, bbox, dpr);
      }
    }
  }
  ctx.restore();
}

/**
 * An arrow pointing up (sign −1) or down (+1) the page from the threshold at (x, y). Where the plot ends
 * within the arrow's length (a blocking threshold near T = 0), the arrow is drawn on the other side,
 * pointing at the threshold: the same direction, still inside the frame.
 */
function arrow(ctx, x, y, sign, dpr, bbox) {
  const length = 22 * dpr;
  const head = 6 * dpr;
  const roomy = sign < 0 ? y - length >= bbox.top : y + length <= bbox.top + bbox.height;
  const tail = roomy ? y : y - sign * length;
  const tip = roomy ? y + sign * length : y;
  ctx.beginPath();
  ctx.moveTo(x, tail);
  ctx.lineTo(x, tip);
  ctx.stroke();
  ctx.beginPath();
  ctx.moveTo(x, tip);
  ctx.lineTo(x - head, tip - sign * head);
  ctx.lineTo(x + head, tip - sign * head);
  ctx.closePath();
  ctx.fill();
}

function diamond(ctx, x, y, r) {
  ctx.beginPath();
  ctx.moveTo(x, y - r);
  ctx.lineTo(x + r, y);
  ctx.lineTo(x, y + r);
  ctx.lineTo(x - r, y);
  ctx.closePath();
  ctx.fill();
}

/** The clause's tag beside its mark, above the line unless that leaves the frame, on a pale halo. */
function label(ctx, text, x, y, bbox, dpr) {
  const above = y - 16 * dpr >= bbox.top;
  const baseline = above ? y - 5 * dpr : y + 14 * dpr;
  ctx.save();
  ctx.lineWidth = 3 * dpr;
  ctx.strokeStyle = 'rgba(255, 255, 255, 0.85)';
  ctx.setLineDash([]);
  ctx.strokeText(text, x, baseline);
  ctx.restore();
  ctx.fillText(text, x, baseline);
}

/** A small inline drawing of the series' line: its colour and its dash, as in the chart. */
function swatch(style) {
  const svgNs = 'http://www.w3.org/2000/svg';
  const svg = document.createElementNS(svgNs, 'svg');
  svg.setAttribute('width', '36');
  svg.setAttribute('height', '10');
  svg.setAttribute('aria-hidden', 'true');
  svg.classList.add('compare-swatch');
  const line = document.createElementNS(svgNs, 'line');
  line.setAttribute('x1', '1');
  line.setAttribute('y1', '5');
  line.setAttribute('x2', '35');
  line.setAttribute('y2', '5');
  line.setAttribute('stroke', style.colour.hex);
  line.setAttribute('stroke-width', '2.5');
  if (style.dash.dash.length) line.setAttribute('stroke-dasharray', style.dash.dash.join(' '));
  svg.append(line);
  return svg;
}
