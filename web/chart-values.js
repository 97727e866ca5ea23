// The charts' text alternative (docs/chart-values-table.md): a "Show values as a table" disclosure under a chart
// that lists the plotted values (one row per wavelength, one column per drawn curve, units in the headers), and an
// aria-label on the chart's canvas that says what is drawn and points to the table. The table is built only when
// opened (a 1,000-point curve makes a long table) and from textContent only.
import { AXIS_MODES } from './chart.js';

/** More rows than this is a wall of numbers, not an alternative to a chart: longer curves are thinned. */
export const MAX_ROWS = 200;

/**
 * Keeps `details` (a <details> element with a <summary>) ready to show `series` as a table.
 *
 * @param details  the disclosure under the chart
 * @param series   [{ label, curve }] in drawing order; curve as the API sends it (transmittance as a fraction,
 *                 belowDetection per point, detectionLimit)
 * @param modeKey  'linear' (T in %) or 'od' (optical density), as the chart's axis
 */
export function offerValues(details, series, modeKey) {
  details.hidden = series.length === 0;
  details.valuesSource = { series, modeKey };
  if (!details.dataset.wired) {
    details.dataset.wired = 'true';
    details.addEventListener('toggle', () => {
      if (details.open) render(details);
    });
  }
  if (details.open) render(details);
  else body(details).replaceChildren();
}

/**
 * Says on the chart's canvas what is drawn: the curves by label, their wavelength range and the axis, and where
 * the values are as text. A container with role="img" (the compare chart) gets the same words.
 */
export function describeChart(container, series, modeKey, tableName = 'Show values as a table') {
  const axis = modeKey === 'od' ? 'optical density' : 'transmittance in %';
  const curves = series.map(({ label, curve }) => {
    const xs = curve.wavelengthsNm || [];
    return xs.length ? `${label} (${num(xs[0])}–${num(xs[xs.length - 1])} nm)` : label;
  });
  const text = series.length
    ? `Chart of ${series.length === 1 ? '1 curve' : `${series.length} curves`}, ${axis} against wavelength: `
      + `${curves.join('; ')}. The plotted values are listed under “${tableName}” below the chart.`
    : 'No curve drawn.';
  const canvas = container.querySelector('canvas');
  if (canvas) {
    canvas.setAttribute('role', 'img');
    canvas.setAttribute('aria-label', text);
  }
  if (container.getAttribute('role') === 'img') container.setAttribute('aria-label', text);
  container.dataset.description = text;
}

function body(details) {
  let holder = details.querySelector('.values-body');
  if (!holder) {
    holder = document.createElement('div');
    holder.className = 'values-body';
    details.append(holder);
  }
  return holder;
}

function render(details) {
  const { series, modeKey } = details.valuesSource || { series: [], modeKey: 'linear' };
  const holder = body(details);
  if (!series.length) {
    holder.replaceChildren();
    return;
  }
  const { rows, total, step } = tableRows(series);
  const od = modeKey === 'od';
  const unit = od ? 'OD' : 'T (%)';

  const note = document.createElement('p');
  note.className = 'hint values-note';
  note.textContent = (step > 1
    ? `${rows.length} of ${total} wavelengths shown: every ${step}th, with the first and the last; `
      + 'the CSV download of a curve has every point. '
    : `All ${total} wavelengths. `)
    + `“${od ? '>' : '<'} x”: below the detection limit, the ${od ? 'optical density is above' : 'transmittance is below'} x `
    + '(a bound, not a measurement); “—”: not measured there.';

  const table = document.createElement('table');
  table.className = 'values-table';
  table.dataset.rows = String(rows.length);
  table.dataset.totalRows = String(total);
  table.dataset.axisMode = od ? 'od' : 'linear';
  const head = table.createTHead().insertRow();
  head.append(th('Wavelength (nm)'));
  for (const s of series) head.append(th(`${s.label} — ${unit}`));
  const tbody = table.createTBody();
  for (const nm of rows) {
    const tr = tbody.insertRow();
    const rowHead = th(num(nm));
    rowHead.scope = 'row';
    tr.append(rowHead);
    for (const s of series) {
      const td = tr.insertCell();
      td.className = 'num';
      td.textContent = valueAt(s.curve, nm, od);
    }
  }
  const scroll = document.createElement('div');
  scroll.className = 'table-scroll';
  scroll.append(table);
  holder.replaceChildren(note, scroll);
}

/**
 * The wavelengths listed: every wavelength of any drawn curve, ascending; above MAX_ROWS every step-th of them,
 * the first and the last always kept (so the ends of the range stay readable).
 */
export function tableRows(series) {
  const all = [...new Set(series.flatMap((s) => s.curve.wavelengthsNm || []))].sort((a, b) => a - b);
  const step = Math.max(1, Math.ceil(all.length / MAX_ROWS));
  if (step === 1) return { rows: all, total: all.length, step };
  const rows = all.filter((nm, i) => i % step === 0);
  if (rows[rows.length - 1] !== all[all.length - 1]) {
    if (rows.length >= MAX_ROWS) rows.pop();
    rows.push(all[all.length - 1]);
  }
  return { rows, total: all.length, step };
}

/** The plotted value at `nm` as text: T in % or OD, "< x" / "> x" for a detection-limit bound, "—" where unmeasured. */
function valueAt(curve, nm, od) {
  const i = indexOf(curve, nm);
  if (i < 0) return '—';
  const below = curve.belowDetection?.[i] === true;
  let t = curve.transmittance[i];
  if (below && Number.isFinite(curve.detectionLimit) && curve.detectionLimit > 0) t = curve.detectionLimit;
  if (!Number.isFinite(t)) return '—';
  const mode = od ? AXIS_MODES.od : { value: (v) => v * 100 };
  const v = mode.value(t);
  if (v == null) return below ? '> (no finite OD)' : 'T = 0 (no finite OD)';
  const text = od ? v.toFixed(3) : sig(v);
  return below ? `${od ? '>' : '<'} ${text}` : text;
}

function indexOf(curve, nm) {
  const xs = curve.wavelengthsNm || [];
  if (!curve.indexByNm || curve.indexByNm.size !== xs.length) {
    // cached on the curve object: a 200-row table over 20 curves looks up 4,000 values
    Object.defineProperty(curve, 'indexByNm', { value: new Map(xs.map((x, i) => [x, i])), configurable: true });
  }
  return curve.indexByNm.get(nm) ?? -1;
}

/** Four significant figures, without trailing zeros: 87.5, 0.0123. */
function sig(v) {
  return v === 0 ? '0' : String(Number(v.toPrecision(4)));
}

function num(v) {
  return Number.isFinite(v) ? String(Number(v.toPrecision(6))) : String(v);
}

function th(text) {
  const cell = document.createElement('th');
  cell.scope = 'col';
  cell.textContent = text;
  return cell;
}

/** The material chart's table and canvas label (app.js calls this after each redraw). */
export function showChartValues(chart, curves, modeKey) {
  const series = curves.map((curve) => ({ label: curve.label, curve }));
  offerValues(document.getElementById('curve-values'), series, modeKey);
  describeChart(chart, series, modeKey);
}
