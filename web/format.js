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

// ---------- requirements and search results ----------

const MINUS = '\u2212';

function band(fromNm, toNm) {
  return fromNm === toNm ? `at ${number(fromNm, 1)} nm` : `over ${number(fromNm, 1)}–${number(toNm, 1)} nm`;
}

/** A threshold as the user wrote it: 0.8 → "80 %", 0.001 → "0.1 %" (no padding digits). */
function thresholdPercent(t) {
  return `${number(t * 100, 6)} %`;
}

function opticalDensity(t) {
  return number(-Math.log10(t), 2);
}

/** One structured clause as the server understood it: "T ≥ 80 % at 365 nm", "OD ≥ 3 (T ≤ 0.1 %) over …". */
export function clauseSummary(clause) {
  if (clause.type === 'cutoff') {
    return `cutoff (T = ${thresholdPercent(clause.levelT)}) within ${number(clause.fromNm, 1)}–${number(clause.toNm, 1)} nm`;
  }
  const pass = clause.direction === 'pass';
  const mean = clause.aggregate === 'mean' ? 'mean ' : '';
  const where = band(clause.fromNm, clause.toNm);
  const t = clause.thresholdT;
  if (clause.unit === 'opticalDensity') {
    // Passing "to OD x" means absorbing at most that much; blocking means at least.
    return `${mean}OD ${pass ? '≤' : '≥'} ${opticalDensity(t)} (T ${pass ? '≥' : '≤'} ${thresholdPercent(t)}) ${where}`;
  }
  const threshold = clause.unit === 'fraction' ? number(t, 6) : thresholdPercent(t);
  return `${mean}T ${pass ? '≥' : '≤'} ${threshold} ${where}`;
}

/** The thickness part of a requirement, always shown so the user sees what the search assumes. */
export function thicknessSummary(thickness) {
  switch (thickness?.kind) {
    case 'fixed':
      return `thickness: ${number(thickness.mm)} mm (bulk curves rescaled)`;
    case 'range':
      return `thickness: design variable ${number(thickness.minMm)}–${number(thickness.maxMm)} mm`;
    default:
      return 'thickness: as measured';
  }
}

/**
 * A clause's value as the clause was written: %T, plain fraction, OD, or a cutoff wavelength. A bound
 * (true T at most this) reads "≤ …" in T and "≥ …" in OD.
 */
export function clauseValue(result, clause) {
  const v = result.value;
  if (v === null || v === undefined || !Number.isFinite(v)) return DASH;
  if (clause?.type === 'cutoff') return `${number(v, 1)} nm`;
  const bound = result.valueIsBound;
  if (clause?.unit === 'opticalDensity') {
    if (v <= 0) return 'T = 0';
    return `OD ${bound ? '≥ ' : ''}${opticalDensity(v)}`;
  }
  const text = clause?.unit === 'fraction' ? number(v, 6) : percent(v);
  return bound ? `≤ ${text}` : text;
}

/** A margin in decades with its sign always written: "+0.061", "−0.088". */
export function signedDecades(value) {
  if (value === null || value === undefined || !Number.isFinite(value)) return DASH;
  const digits = Math.abs(value) < 1 ? 3 : 2;
  const text = Math.abs(value).toFixed(digits);
  if (Number(text) === 0) return `±${text}`;
  return `${value > 0 ? '+' : MINUS}${text}`;
}
