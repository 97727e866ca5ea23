// Display formatting only; no arithmetic on the data beyond unit changes.

export const REPORT_WAVELENGTHS_NM = ['254', '313', '365', '385', '395', '405', '450'];
export const CUTOFF_LEVELS = ['1', '10', '50'];

const DASH = '—';

/** A number with at most `maxDecimals` decimals and no trailing zeros: 3.0 → "3", 0.1750 → "0.175". */
export function number(value, maxDecimals = 3) {
  if (value === null || value === undefined || !Number.isFinite(value)) return DASH;
  return String(Number(value.toFixed(maxDecimals)));
}

/** Distinct sample thicknesses, ascending: "2 · 4 · 6 mm". */
export function thicknesses(samples) {
  const distinct = [...new Set((samples || []).map((s) => s.thicknessMm))]
    .filter((t) => Number.isFinite(t))
    .sort((a, b) => a - b);
  return distinct.length ? `${distinct.map((t) => number(t)).join(' · ')}\u00a0mm` : DASH;
}

/** A transmittance fraction as percent, with enough digits to tell small values apart. */
export function percent(fraction) {
  const text = percentNumber(fraction);
  return text === DASH ? text : `${text} %`;
}

/** As {@link percent} without the unit, for table columns whose header carries it. */
export function percentNumber(fraction) {
  if (fraction === null || fraction === undefined || !Number.isFinite(fraction)) return DASH;
  const p = fraction * 100;
  let text;
  if (p >= 10) text = p.toFixed(1);
  else if (p >= 0.1) text = p.toFixed(2);
  else if (p === 0) text = '0';
  else text = String(Number(p.toPrecision(2)));
  return text;
}

export function nanometres(value) {
  return value === null || value === undefined || !Number.isFinite(value) ? DASH : `${number(value, 1)}`;
}

/** A one-line, human description of the refractive-index model. */
export function refractiveIndex(model) {
  if (!model) return 'not given';
  switch (model.kind) {
    case 'constant':
      return `constant, n = ${number(model.n, 4)}`;
    case 'sellmeier': {
      const b = (model.b || []).map((v) => number(v, 6)).join(', ');
      const c = (model.c || []).map((v) => number(v, 6)).join(', ');
      const range = Number.isFinite(model.validFromNm) && Number.isFinite(model.validToNm)
        ? `, valid ${number(model.validFromNm, 0)}–${number(model.validToNm, 0)} nm`
        : '';
      return `Sellmeier dispersion, B = (${b}), C = (${c})${range}`;
    }
    case 'table': {
      const wl = model.wavelengthsNm || [];
      const n = (model.n || []).filter(Number.isFinite);
      if (!wl.length || !n.length) return 'tabulated (empty)';
      return `tabulated, ${wl.length} points from ${number(wl[0], 0)} to ${number(wl[wl.length - 1], 0)} nm, `
        + `n ${number(Math.min(...n), 4)}–${number(Math.max(...n), 4)}`;
    }
    default:
      return `unknown model “${model.kind}”`;
  }
}
