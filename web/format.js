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
    case 'unusable':
      // a stored model today's checks refuse (docs/validation.md): shown as stored, never used
      return `cannot be used: ${model.stored} (${model.reason})`;
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

/** A material state as the requirement names it: "as supplied", "printed black", "after 1000 h". */
export function stateWords(state) {
  if (!state || state.kind === 'asSupplied') return 'as supplied';
  if (state.kind === 'printed') return 'printed black';
  return Number.isFinite(state.hours) ? `after ${number(state.hours)} h`
    : `after ${number(state.doseJPerCm2)} J/cm² at ${number(state.doseNm, 1)} nm`;
}

/** A level relative to the same candidate: "T(380 nm) ≤ 1 % of T(550 nm)", "printed black ≤ 0.1 % of as supplied, 350–420 nm". */
function relativeSummary(clause) {
  const side = clause.direction === 'pass' ? '≥' : '≤';
  const share = thresholdPercent(clause.share);
  if (Number.isFinite(clause.referenceNm)) {
    const state = clause.state?.kind === 'asSupplied' ? '' : `${stateWords(clause.state)}: `;
    const at = clause.fromNm === clause.toNm ? `T(${number(clause.fromNm, 1)} nm)` : `T ${band(clause.fromNm, clause.toNm)}`;
    return `${state}${at} ${side} ${share} of T(${number(clause.referenceNm, 1)} nm)`;
  }
  return `${stateWords(clause.state)} ${side} ${share} of ${stateWords(clause.referenceState)} ${band(clause.fromNm, clause.toNm)}`;
}

/** One structured clause as the server understood it: "T ≥ 80 % at 365 nm", "OD ≥ 3 (T ≤ 0.1 %) over …". */
export function clauseSummary(clause) {
  if (clause.type === 'relative') return relativeSummary(clause);
  if (clause.type === 'inState') return `${stateWords(clause.state)}: ${clauseSummary(clause.clause)}`;
  if (clause.type === 'cutoff') {
    return `cutoff (T = ${thresholdPercent(clause.levelT)}) within ${number(clause.fromNm, 1)}–${number(clause.toNm, 1)} nm`;
  }
  const pass = clause.direction === 'pass';
  const mean = clause.aggregate === 'mean' ? 'mean ' : '';
  const where = band(clause.fromNm, clause.toNm);
  const t = clause.thresholdT;
  // "… with 95% confidence": the clause meets only when that sure
  const sure = Number.isFinite(clause.confidencePercent) ? ` with ≥ ${number(clause.confidencePercent, 1)} % confidence` : '';
  if (clause.unit === 'opticalDensity') {
    // Passing "to OD x" means absorbing at most that much; blocking means at least.
    return `${mean}OD ${pass ? '≤' : '≥'} ${opticalDensity(t)} (T ${pass ? '≥' : '≤'} ${thresholdPercent(t)}) ${where}${sure}`;
  }
  const threshold = clause.unit === 'fraction' ? number(t, 6) : thresholdPercent(t);
  return `${mean}T ${pass ? '≥' : '≤'} ${threshold} ${where}${sure}`;
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
  if (clause?.type === 'inState') return clauseValue(result, clause.clause);
  const bound = result.valueIsBound;
  if (clause?.type === 'relative') return `${bound ? '≤ ' : ''}${percent(v)} of the reference`;
  if (clause?.unit === 'opticalDensity') {
    if (v <= 0) return 'T = 0';
    return `OD ${bound ? '≥ ' : ''}${opticalDensity(v)}`;
  }
  const text = clause?.unit === 'fraction' ? number(v, 6) : percent(v);
  return bound ? `≤ ${text}` : text;
}

/**
 * A clause's confidence (the probability, 0–1, that the true value meets the threshold) as shown beside
 * its verdict: "97.3 % confidence it holds", rounded DOWN to 0.1 % so it never reads surer than the
 * server computed (94.96 % is not shown as a met 95 % demand); "confidence unknown" for null.
 */
export function confidence(fraction) {
  if (fraction === null || fraction === undefined || !Number.isFinite(fraction)) return 'confidence unknown';
  let text;
  if (fraction > 0.999) text = 'over 99.9';
  else if (fraction < 0.001) text = 'under 0.1';
  else text = String(Number((Math.floor(fraction * 1000 + 1e-9) / 10).toFixed(1)));
  return `${text} % confidence it holds`;
}

/** A margin in decades with its sign always written: "+0.061", "−0.088". */
export function signedDecades(value) {
  if (value === null || value === undefined || !Number.isFinite(value)) return DASH;
  const digits = Math.abs(value) < 1 ? 3 : 2;
  const text = Math.abs(value).toFixed(digits);
  if (Number(text) === 0) return `±${text}`;
  return `${value > 0 ? '+' : MINUS}${text}`;
}

// ---------- weighted figures ----------
// A figure as the API sends it: { name, value (null when not available), unit, bound, available, note }.

/** True for anything shaped like a figure; other members of an answer are left alone. */
export function isFigure(x) {
  return x !== null && typeof x === 'object' && !Array.isArray(x) && typeof x.name === 'string'
    && ('value' in x || 'available' in x);
}

/** A figure has a number to show only when the server says so and sent a finite value. */
export function figureAvailable(figure) {
  return figure.available !== false && Number.isFinite(figure.value);
}

// Labels for figures whose JSON member or name the page knows; any other figure is shown by its name.
const FIGURE_LABELS = {
  erythemalProtectionFactor: 'Erythemal protection factor, flat source',
  actinicUvProtectionFactor: 'UV hazard protection factor (actinic), flat source',
  criticalWavelength: 'Critical wavelength (90 % of UV absorbance reached)',
  luminousTransmittance: 'Luminous transmittance',
  sunglassCategory: 'Filter category by luminous transmittance',
  upf: 'UPF, solar-weighted',
};

/** "UVA" → "UV-A", as the chart's bands are written; anything else as sent. */
function bandLabel(band) {
  const match = /^UV[-_]?([ABC])(.*)$/i.exec(band);
  return match ? `UV-${match[1].toUpperCase()}${match[2].replace(/^[-_]/, ' ').replace(/^\((.*)\)$/, ' $1')}` : band;
}

/**
 * A reader's label for a figure. `key` is the answer's member the figure came in (for figures in a list,
 * the list's member); `pair` names the chosen emitter and response for the figures that depend on them.
 */
export function figureLabel(figure, key, { emitter, response } = {}) {
  const pair = emitter && response ? `${emitter} × ${response}` : 'chosen source × response';
  if (key === 'effectiveTransmittance') return `Effective transmittance, ${pair}`;
  if (key === 'protectionFactor') return `Protection factor, ${pair}`;
  const fixed = FIGURE_LABELS[key] || FIGURE_LABELS[figure.name];
  if (fixed) return fixed;
  const band = /^meanTransmittance[-_]?(.+)$/.exec(figure.name);
  if (band) return `Mean transmittance, ${bandLabel(band[1])}`;
  const line = /^opticalDensity[-_]?(\d+(?:\.\d+)?)$/.exec(figure.name);
  if (line) return `Optical density at ${line[1]} nm`;
  return figure.name;
}

const SUPERSCRIPT = { '-': '⁻', 0: '⁰', 1: '¹', 2: '²', 3: '³', 4: '⁴', 5: '⁵', 6: '⁶', 7: '⁷', 8: '⁸', 9: '⁹' };

/**
 * `digits` significant figures for a plain number: 1.0859 → "1.09", 824.3 → "824", 12 431 → "12 400"
 * (thin-space thousands from five digits on), 3.2e7 → "3.2 × 10⁷".
 */
export function significant(value, digits = 3) {
  if (value === null || value === undefined || !Number.isFinite(value)) return DASH;
  if (value === 0) return '0';
  const abs = Math.abs(value);
  if (abs >= 1e6 || abs < 1e-3) {
    let exponent = Math.floor(Math.log10(abs));
    let mantissa = Number((value / 10 ** exponent).toPrecision(digits));
    if (Math.abs(mantissa) >= 10) {
      mantissa /= 10;
      exponent += 1;
    }
    const power = String(exponent).replace(/[-0-9]/g, (c) => SUPERSCRIPT[c]);
    return `${String(mantissa).replace('-', MINUS)} × 10${power}`;
  }
  const text = String(Number(value.toPrecision(digits)));
  return abs >= 1e4 ? text.replace(/\B(?=(\d{3})+(?!\d))/g, '\u202f') : text;
}

function isProtectionFactor(figure, key) {
  return /protectionFactor/i.test(key || '') || /^protectionFactor/i.test(figure.name);
}

/**
 * A figure's value as text, its bound written in front ("≤ 0.12 %", "≥ 824×", "OD ≥ 3"), or null when the
 * figure is not available (the caller shows the reason instead). Units: fraction as %, protection factors
 * as "N×", UPF and other dimensionless figures as plain numbers, nm, OD; any other unit is appended.
 */
export function figureValue(figure, key) {
  if (!figureAvailable(figure)) return null;
  // A bounded transmittance comes with both ends stated by the server, worded as the search's explanations
  // word them ("79.6 %", "between 12.1 % and 13 %", "at most 0.1 %"), so the two never disagree in sign.
  if (typeof figure.stated === 'string' && figure.stated) return figure.stated;
  const v = figure.value;
  const sign = figure.bound === 'at-most' ? '≤ ' : figure.bound === 'at-least' ? '≥ ' : '';
  switch (figure.unit) {
    case 'fraction':
      return `${sign}${percent(v)}`;
    case '%':
      return `${sign}${number(v, 2)} %`;
    case 'nm':
      return `${sign}${number(v, 1)} nm`;
    case 'OD':
      return `OD ${sign}${number(v, 2)}`;
    default:
      break;
  }
  if (isProtectionFactor(figure, key)) {
    const text = significant(v);
    // "824×" reads as "824 times less"; a power of ten already carries a "×", so it stands alone.
    return `${sign}${text}${text.includes('×') ? '' : '×'}`;
  }
  if (/category/i.test(`${key || ''} ${figure.name} ${figure.unit || ''}`)) return `${sign}${number(v, 0)}`;
  const unit = figure.unit && figure.unit !== '1' ? ` ${figure.unit}` : '';
  return `${sign}${significant(v)}${unit}`;
}

/**
 * What the page must not let pass unnoticed about a figure: the share of the weighted power it left out
 * (outside the curve or the response's table) and a value capped at OD 12. Empty strings are left out.
 */
export function figureCaveats(figure) {
  const caveats = [];
  if (Number.isFinite(figure.outsideShare) && figure.outsideShare > 0) {
    caveats.push(`Leaves out ${significant(100 * figure.outsideShare, 2)} % of the weighted power (not extrapolated).`);
  }
  if (/capped/i.test(figure.note || '')) {
    caveats.push('Capped at OD 12: no transmittance measurement states more.');
  }
  return caveats;
}

/** What a bound means, for a tooltip beside the sign. */
export function boundMeaning(bound) {
  if (bound === 'at-most') return 'upper bound: some points lie below the detection limit, the true value is at most this';
  if (bound === 'at-least') return 'lower bound: some points lie below the detection limit, the true value is at least this';
  return '';
}

/**
 * The thicknesses a material exists in, as the server states them: "25–125 µm; stock 25, 50, 125 µm" for
 * a stated range, "stock 3 mm only", or the assumed rule in the server's words.
 */
export function madeThicknesses(made) {
  if (!made) return '—';
  const unit = made.unit === 'um' ? 'µm' : 'mm';
  const stock = (made.stock || []).map((v) => number(v)).join(', ');
  if (made.basis === 'stated') {
    const range = `${number(made.range[0])}–${number(made.range[1])} ${unit}`;
    return stock ? `${range}; stock ${stock} ${unit}` : range;
  }
  if (made.basis === 'stock only') return `stock ${stock} ${unit} only`;
  return made.rule || '—';
}
