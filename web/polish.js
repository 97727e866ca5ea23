// Small page-wide touches (docs/page-polish.md): a refused rescale shown beside its button, the chart's
// range, zoom hint and reset controls, and server numbers written the way the page writes numbers.
import { setLinearRange, LINEAR_DEFAULT_RANGE } from './chart.js';

const el = (id) => document.getElementById(id);

/**
 * Long binary fractions in a server's message ("0.9977272727272727 nm") written with at most four
 * significant digits; numbers of up to four decimals (wavelengths, thicknesses as typed) are left alone.
 */
export function tidyNumbers(text) {
  if (typeof text !== 'string') return text;
  return text.replace(/-?\d+\.\d{5,}(?:[eE][-+]?\d+)?/g, (raw) => {
    const value = Number(raw);
    if (!Number.isFinite(value)) return raw;
    return String(Number(value.toPrecision(Math.max(4, Math.ceil(Math.log10(Math.abs(value) || 1)) + 1))));
  });
}

// ---------- a refused rescale: beside the Draw button, gone after the next success ----------

export function showRescaleProblem(problem) {
  const box = el('rescale-error');
  if (!box) return;
  // the API's parameter name means nothing beside the page's own "to … mm" box
  const why = String(problem.detail || problem.title || 'the server did not answer').replace(/^parameter '[^']+':\s*/, '');
  box.textContent = `Not rescaled: ${tidyNumbers(why)}`;
  box.hidden = false;
  el('rescale-mm')?.setAttribute('aria-invalid', 'true');
}

export function clearRescaleProblem() {
  const box = el('rescale-error');
  if (!box) return;
  box.hidden = true;
  box.textContent = '';
  el('rescale-mm')?.removeAttribute('aria-invalid');
}

// ---------- the chart's view: linear range, zoom hint, reset ----------

/** Redraws the chart through the page's own axis handler, so no second drawing path exists. */
function redrawChart() {
  el('axis-mode')?.dispatchEvent(new Event('change'));
}

function wireChartView() {
  const from = el('range-from');
  const to = el('range-to');
  const error = el('range-error');
  const reset = el('chart-reset');
  const axis = el('axis-mode');
  if (!from || !to || !reset || !axis) return;
  const rangeBox = el('linear-range');

  const showRangeFor = () => { rangeBox.hidden = axis.value !== 'linear'; };
  axis.addEventListener('change', showRangeFor);
  showRangeFor();

  const applyRange = () => {
    const low = from.value.trim() === '' ? LINEAR_DEFAULT_RANGE[0] : Number(from.value);
    const high = to.value.trim() === '' ? LINEAR_DEFAULT_RANGE[1] : Number(to.value);
    if (!Number.isFinite(low) || !Number.isFinite(high) || low < 0 || high > 1000 || low >= high) {
      error.textContent = 'The range needs two numbers of percent, the lower first (e.g. 0 to 10).';
      error.hidden = false;
      return;
    }
    error.hidden = true;
    error.textContent = '';
    setLinearRange([low, high]);
    redrawChart();
  };
  from.addEventListener('change', applyRange);
  to.addEventListener('change', applyRange);
  for (const preset of document.querySelectorAll('[data-range-preset]')) {
    preset.addEventListener('click', () => {
      const [low, high] = preset.dataset.rangePreset.split('-');
      from.value = low;
      to.value = high;
      applyRange();
    });
  }
  // Reset: whole wavelength range and the full transmittance axis.
  reset.addEventListener('click', () => {
    from.value = '';
    to.value = '';
    error.hidden = true;
    setLinearRange(LINEAR_DEFAULT_RANGE);
    redrawChart();
  });
}

wireChartView();
