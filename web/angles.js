// Transmittance against the angle of incidence at one wavelength, for the shown material: the server sweeps a
// collimated beam from square on (0°) to 89° (GET /api/samples/{id}/angles) and gives the effective transmittance
// under three spread sources beside it; this module draws the sweep and lists the rest. No number is computed
// here (docs/oblique-incidence.md).
import uPlot from './webjars/uplot/dist/uPlot.esm.js';
import * as api from './api.js';
import * as fmt from './format.js';

/** The UV-A line most curing rigs are built around: the first question asked of a window. */
export const DEFAULT_NM = 365;
// Okabe–Ito colours (as the compare chart), each series with its own dash so colour is never the only cue.
const SERIES = [
  { key: 'transmittance', label: 'unpolarised', stroke: '#0072b2', width: 2.25 },
  { key: 's', label: 's-polarised', stroke: '#d55e00', width: 1.5, dash: [8, 4] },
  { key: 'p', label: 'p-polarised', stroke: '#009e73', width: 1.5, dash: [2, 3] },
];
const BREWSTER_COLOUR = '#6b5b95';
// Angles listed in the table beside the chart (every angle is in the chart's legend on hover).
const TABLE_ANGLES = [0, 10, 20, 30, 40, 45, 50, 60, 70, 80, 85, 89];

const el = (id) => document.getElementById(id);

/** A dashed vertical line at Brewster's angle, labelled, drawn over the series' background. */
function brewsterMarker(angleDeg) {
  return (u) => {
    if (!Number.isFinite(angleDeg)) return;
    const { ctx, bbox } = u;
    const x = u.valToPos(angleDeg, 'x', true);
    ctx.save();
    ctx.strokeStyle = BREWSTER_COLOUR;
    ctx.lineWidth = 1.5 * devicePixelRatio;
    ctx.setLineDash([5 * devicePixelRatio, 4 * devicePixelRatio]);
    ctx.beginPath();
    ctx.moveTo(x, bbox.top);
    ctx.lineTo(x, bbox.top + bbox.height);
    ctx.stroke();
    ctx.setLineDash([]);
    ctx.fillStyle = BREWSTER_COLOUR;
    ctx.font = `${Math.round(11 * devicePixelRatio)}px system-ui, sans-serif`;
    const label = `Brewster ${fmt.number(angleDeg, 1)}°`;
    // low on the line: the p curve peaks near the top there
    ctx.fillText(label, x + 4 * devicePixelRatio, bbox.top + bbox.height - 8 * devicePixelRatio);
    ctx.restore();
  };
}

/** Draws the sweep into `container`; returns the uPlot instance. */
function drawSweep(container, answer) {
  container.replaceChildren();
  const bound = (i) => answer.upperBound?.[i] === true;
  const data = [answer.anglesDeg, ...SERIES.map((s) => (answer[s.key] || []).map((t) => (Number.isFinite(t) ? t * 100 : null)))];
  const width = Math.max(240, container.clientWidth || 640);
  const options = {
    width,
    height: Math.round(Math.min(320, Math.max(220, width * 0.4))),
    scales: { x: { time: false, range: [0, 90] }, y: { range: [0, 100] } },
    axes: [
      { label: 'Angle of incidence (°)', stroke: '#3b4448', grid: { stroke: '#e4e7e3' }, ticks: { stroke: '#cfd4cf' } },
      { label: 'Transmittance (%)', stroke: '#3b4448', grid: { stroke: '#e4e7e3' }, ticks: { stroke: '#cfd4cf' }, size: 56 },
    ],
    series: [
      { label: 'θ', value: (u, v) => (v == null ? '—' : `${v}°`) },
      ...SERIES.map((s) => ({
        label: s.label,
        stroke: s.stroke,
        width: s.width,
        dash: s.dash,
        value: (u, v, si, i) => (v == null ? '—' : `${i !== null && bound(i) ? '≤ ' : ''}${v.toFixed(2)} %`),
      })),
    ],
    hooks: { draw: [brewsterMarker(answer.brewsterDeg)] },
  };
  return new uPlot(options, data, container);
}

/** "≤ 12.3 %" for an upper bound, "12.3 %" for a value. */
function percentText(fraction, upperBound) {
  return `${upperBound ? '≤ ' : ''}${fmt.percent(fraction)}`;
}

/**
 * Wires the "T against angle" section. `ui.showProblem(problem, context)` is the page's message area. Returns
 * `showMaterial(material)` for the detail view.
 */
export function initAngles(ui) {
  const dom = {
    section: el('angle-sweep'),
    form: el('angle-controls'),
    sample: el('angle-sample'),
    nm: el('angle-nm'),
    status: el('angle-status'),
    chart: el('angle-chart'),
    references: el('angle-references'),
    brewster: el('angle-brewster'),
    model: el('angle-model'),
    table: el('angle-values'),
  };
  const state = { request: 0, material: null, plot: null };

  function clear(reason, stateName) {
    if (state.plot) state.plot.destroy();
    state.plot = null;
    dom.chart.replaceChildren();
    dom.references.replaceChildren();
    dom.brewster.textContent = '';
    dom.model.textContent = '';
    dom.table.hidden = true;
    dom.section.dataset.state = stateName;
    dom.status.textContent = reason;
  }

  function renderReferences(answer) {
    dom.references.replaceChildren(...(answer.references || []).flatMap((r) => {
      const term = document.createElement('dt');
      const described = r.light?.description || 'a spread source';
      term.textContent = described.charAt(0).toUpperCase() + described.slice(1);
      const value = document.createElement('dd');
      value.dataset.kind = r.light?.kind || '';
      value.className = 'num';
      value.textContent = percentText(r.transmittance, r.upperBound);
      const error = document.createElement('span');
      error.className = 'hint';
      const errorPercent = r.errorBound * 100;
      error.textContent = ` (integration error ${errorPercent < 0.0001 ? 'under 0.0001' : `at most ${fmt.number(errorPercent, 4)}`} %)`;
      value.title = r.light?.integration || '';
      value.append(error);
      return [term, value];
    }));
  }

  function renderTable(answer) {
    const body = dom.table.querySelector('tbody');
    body.replaceChildren(...TABLE_ANGLES.filter((a) => a < answer.anglesDeg.length).map((a) => {
      const tr = document.createElement('tr');
      const head = document.createElement('th');
      head.scope = 'row';
      head.textContent = `${a}°`;
      tr.append(head, ...SERIES.map((s) => {
        const td = document.createElement('td');
        td.className = 'num';
        td.textContent = percentText(answer[s.key]?.[a], answer.upperBound?.[a] === true);
        return td;
      }));
      return tr;
    }));
    dom.table.hidden = false;
  }

  function render(answer) {
    if (state.plot) state.plot.destroy();
    state.plot = drawSweep(dom.chart, answer);
    const t = answer.transmittance || [];
    const last = t.length - 1;
    dom.chart.setAttribute('aria-label', `Transmittance against the angle of incidence at ${fmt.number(answer.wavelengthNm)} nm:`
      + ` ${percentText(t[0], answer.upperBound?.[0])} square on, ${percentText(t[45], answer.upperBound?.[45])} at 45°,`
      + ` ${percentText(t[last], answer.upperBound?.[last])} at ${answer.anglesDeg?.[last]}°; values in the table below`);
    renderReferences(answer);
    renderTable(answer);
    dom.brewster.textContent = `Brewster angle ${fmt.number(answer.brewsterDeg, 2)}° (tan θ = n, n = `
      + `${fmt.number(answer.index, 4)} at ${fmt.number(answer.wavelengthNm)} nm): p-polarised light is not reflected there.`;
    dom.model.textContent = `Model: ${answer.model}.`;
    const bounded = (answer.upperBound || []).some(Boolean);
    dom.status.textContent = `${fmt.number(answer.thicknessMm)} mm${answer.rescaled ? ' (rescaled)' : ''} at `
      + `${fmt.number(answer.wavelengthNm)} nm: ${percentText(t[0], answer.upperBound?.[0])} square on, `
      + `${percentText(t[last], answer.upperBound?.[last])} at ${answer.anglesDeg?.[last]}°`
      + (bounded ? '; “≤”: below the detection limit, an upper bound.' : '.');
    dom.section.dataset.state = 'shown';
  }

  async function refresh() {
    const sampleId = dom.sample.value;
    if (!sampleId) {
      state.request += 1;
      clear('No sample to sweep.', 'empty');
      return;
    }
    const raw = dom.nm.value.trim();
    const nm = raw === '' ? DEFAULT_NM : Number(raw);
    if (!Number.isFinite(nm)) {
      state.request += 1;
      clear(`“${raw}” is not a wavelength in nm.`, 'error');
      return;
    }
    const request = ++state.request;
    dom.section.dataset.state = 'loading';
    dom.status.textContent = 'Sweeping the angle…';
    dom.chart.setAttribute('aria-busy', 'true');
    try {
      const answer = await api.getAngles(sampleId, { nm });
      if (request !== state.request) return;
      render(answer);
    } catch (problem) {
      if (request !== state.request) return;
      // a refused wavelength or a sample with no figure at an angle: said here, beside the controls
      clear(`No sweep: ${problem.detail || problem.title || 'the server did not answer'}`, 'error');
      if (problem.status >= 500 || problem.status === 0) ui.showProblem(problem, 'Sweeping the angle of incidence');
    } finally {
      if (request === state.request) dom.chart.removeAttribute('aria-busy');
    }
  }

  dom.form.addEventListener('submit', (event) => {
    event.preventDefault();
    refresh();
  });
  dom.sample.addEventListener('change', refresh);
  dom.nm.addEventListener('change', refresh);
  new ResizeObserver(() => {
    if (state.plot && dom.chart.clientWidth > 0 && Math.abs(state.plot.width - dom.chart.clientWidth) > 4) {
      state.plot.setSize({ width: dom.chart.clientWidth, height: state.plot.height });
    }
  }).observe(dom.chart);

  return {
    /** A newly opened material: its samples offered (those the server can sweep first), the first one swept. */
    async showMaterial(material) {
      state.material = material;
      const samples = material.samples || [];
      dom.sample.replaceChildren(...samples.map((s) => {
        const o = document.createElement('option');
        o.value = String(s.id);
        o.textContent = `${fmt.number(s.thicknessMm)} mm ${s.geometry || ''}`.trim();
        return o;
      }));
      dom.sample.disabled = !samples.length;
      // a bulk material's sample that is not rescaled (diffuse, scattering) has no sweep: start from one that has
      const sweepable = samples.find((s) => material.scaling !== 'fixed' && s.rescalable !== false);
      if (sweepable) dom.sample.value = String(sweepable.id);
      await refresh();
    },
  };
}
