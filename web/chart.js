// Curve chart on uPlot. Input curves are as the API sends them (transmittance as a fraction,
// belowDetection per point); this module only changes units for display.
import uPlot from './webjars/uplot/dist/uPlot.esm.js';

// CIE band limits (CIE S 017 International Lighting Vocabulary: UV-C 100–280, UV-B 280–315,
// UV-A 315–400 nm), shaded so a reader can place a cutoff at a glance.
const UV_BANDS = [
  { from: 100, to: 280, fill: 'rgba(96, 84, 140, 0.10)', label: 'UV-C' },
  { from: 280, to: 315, fill: 'rgba(96, 84, 140, 0.07)', label: 'UV-B' },
  { from: 315, to: 400, fill: 'rgba(96, 84, 140, 0.04)', label: 'UV-A' },
];


const OD_VIEW_MAX = 10;
// Room above the highest OD drawn, so a bound at the detection limit never lies on the frame.
const OD_HEADROOM = 0.4;

/** The linear axis' percent range: [0, 100] unless the user chose another (polish.js). */
export const LINEAR_DEFAULT_RANGE = [0, 100];
let linearRange = LINEAR_DEFAULT_RANGE;
export function setLinearRange(range) {
  linearRange = range;
}

export const AXIS_MODES = {
  linear: {
    label: 'Transmittance (%)',
    value: (t) => t * 100,
    range: () => [...linearRange],
    legend: (v) => `${v.toFixed(1)} %`,
  },
  od: {
    label: 'Optical density (−log₁₀ T)',
    // T = 0 has no finite OD; such a point is left out rather than drawn at an invented height.
    value: (t) => (t > 0 ? -Math.log10(t) : null),
    // A rescaled bound can reach OD in the hundreds; the view stops at OD_VIEW_MAX so the curves that
    // matter stay readable. Values are not changed: the legend still reads them.
    range: (u, min, max) => [0, Math.min(OD_VIEW_MAX, Math.max(1, Math.ceil(((max ?? 1) + OD_HEADROOM) * 2) / 2))],
    legend: (v) => `OD ${v.toFixed(2)}`,
  },
};

/**
 * One curve becomes up to two series: the measured values, and (if any point is at or below the
 * detection limit) a dotted "bound" series at the limit, because there T is only known to be ≤ it.
 */
function seriesTable(curve, mode) {
  const xs = curve.wavelengthsNm;
  const measured = new Array(xs.length);
  const bound = new Array(xs.length);
  let anyBound = false;
  for (let i = 0; i < xs.length; i++) {
    const t = curve.transmittance[i];
    const below = curve.belowDetection?.[i] === true;
    if (below) {
      const limit = Number.isFinite(curve.detectionLimit) && curve.detectionLimit > 0 ? curve.detectionLimit : t;
      bound[i] = Number.isFinite(limit) ? mode.value(limit) : null;
      measured[i] = null;
      anyBound = true;
    } else {
      bound[i] = null;
      measured[i] = Number.isFinite(t) ? mode.value(t) : null;
    }
  }
  return anyBound ? [xs, measured, bound] : [xs, measured];
}

function seriesOptions(curve, hasBound, modeKey) {
  const unit = (AXIS_MODES[modeKey] || AXIS_MODES.linear).legend;
  const line = {
    label: curve.label,
    stroke: curve.color,
    width: curve.dash ? 2 : 1.75,
    dash: curve.dash || undefined,
    value: (u, v) => (v == null ? '—' : unit(v)),
  };
  if (!hasBound) return [line];
  return [line, {
    label: `${curve.label} · bound, below detection (${modeKey === 'od' ? 'OD ≥' : 'T ≤'})`,
    stroke: curve.color,
    width: 1,
    dash: [1, 4],
    points: { show: true, size: 3, stroke: curve.color, fill: '#fff' },
    value: (u, v) => (v == null ? '—' : `${modeKey === 'od' ? '≥' : '≤'} ${unit(v)}`),
  }];
}

function shadeBands(u) {
  const { ctx, bbox } = u;
  const [xMin, xMax] = [u.scales.x.min, u.scales.x.max];
  ctx.save();
  ctx.font = `${Math.round(11 * devicePixelRatio)}px system-ui, sans-serif`;
  const rowEnds = [-Infinity, -Infinity, -Infinity]; // right edge of the last label on each row
  for (const band of UV_BANDS) {
    const from = Math.max(band.from, xMin);
    const to = Math.min(band.to, xMax);
    if (to <= from) continue;
    const x0 = u.valToPos(from, 'x', true);
    const x1 = u.valToPos(to, 'x', true);
    ctx.fillStyle = band.fill;
    ctx.fillRect(x0, bbox.top, x1 - x0, bbox.height);
    ctx.fillStyle = '#4f4a6e'; // band labels at 7:1 on their shading (WCAG AA, docs/accessibility.md)
    // A narrow band (UV-B on a wide axis) would print its label over its neighbour's: that label goes a
    // row lower instead.
    const x = x0 + 4 * devicePixelRatio;
    let row = rowEnds.findIndex((end) => x >= end + 4 * devicePixelRatio);
    if (row < 0) row = rowEnds.length - 1;
    ctx.fillText(band.label, x, bbox.top + 14 * (row + 1) * devicePixelRatio);
    rowEnds[row] = x + ctx.measureText(band.label).width;
  }
  ctx.restore();
}

/** Draws (or redraws) the chart into `container`; returns the uPlot instance. */
export function drawCurves(container, curves, modeKey) {
  const mode = AXIS_MODES[modeKey] || AXIS_MODES.linear;
  container.replaceChildren();
  if (!curves.length) {
    const empty = document.createElement('p');
    empty.className = 'hint';
    empty.textContent = 'No curve to draw.';
    container.append(empty);
    return null;
  }
  const tables = curves.map((c) => seriesTable(c, mode));
  const data = uPlot.join(tables);
  const series = [{ label: 'λ (nm)', value: (u, v) => (v == null ? '—' : `${v} nm`) }];
  tables.forEach((table, i) => series.push(...seriesOptions(curves[i], table.length === 3, modeKey)));

  const width = Math.max(240, container.clientWidth || 720); // 240: a 360 px window's chart fits
  const options = {
    width,
    height: Math.round(Math.min(420, Math.max(260, width * 0.5))),
    scales: {
      x: { time: false }, // uPlot defaults to a time axis; ours is wavelength
      y: { range: mode.range },
    },
    axes: [
      { label: 'Wavelength (nm)', stroke: '#3b4448', grid: { stroke: '#e4e7e3' }, ticks: { stroke: '#cfd4cf' } },
      { label: mode.label, stroke: '#3b4448', grid: { stroke: '#e4e7e3' }, ticks: { stroke: '#cfd4cf' }, size: 56 },
    ],
    series,
    cursor: { drag: { x: true, y: false } },
    hooks: { drawClear: [shadeBands] },
  };
  options.hooks.draw = [() => performance.mark('sieve:chart-drawn')]; // page speed benchmark (docs/page-speed.md)
  const plot = new uPlot(options, data, container);
  let highest = -Infinity;
  for (const column of data.slice(1)) {
    for (const v of column) if (Number.isFinite(v) && v > highest) highest = v;
  }
  if (modeKey === 'od' && highest > OD_VIEW_MAX) {
    const note = document.createElement('p');
    note.className = 'hint';
    note.textContent = `The axis stops at OD ${OD_VIEW_MAX}; some values lie above it `
      + `(up to OD ${highest.toFixed(0)}), readable in the legend.`;
    container.append(note);
  }
  return plot;
}

/** Keeps the chart as wide as its container. */
export function followWidth(container, getPlot) {
  const observer = new ResizeObserver(() => {
    const plot = getPlot();
    if (plot && container.clientWidth > 0 && Math.abs(plot.width - container.clientWidth) > 4) {
      plot.setSize({ width: container.clientWidth, height: plot.height });
    }
  });
  observer.observe(container);
  return observer;
}
