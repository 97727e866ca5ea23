// The library panel's facet groups: one fieldset of checkboxes per dimension of GET /api/library, each value
// with its count. The server counts drill-sideways (docs/library-search.md), so ticking a value leaves the
// other values of its own group with their counts and narrows the other groups; the page only shows them.

/**
 * Values listed in a fixed order, not by count, so the list does not jump as counts change: thickness
 * bands as a workshop shelves stock; the spectral summaries (read from each sample's stored curve,
 * docs/library-search.md) short to long, dark to clear, then what a curve cannot say.
 */
const AT_ORDER = ['passes', 'partly', 'blocks', 'not covered', 'not determined'];
const ORDER = {
  thickness: ['under 1 mm', '1-3 mm', '3-6 mm', '6 mm and over'],
  edge: ['under 300 nm', '300-340 nm', '340-380 nm', '380-420 nm', '420 nm and over', 'no edge in range'],
  luminous: ['under 10 %', '10-50 %', '50-80 %', '80 % and over', 'not covered', 'not determined'],
  at254: AT_ORDER,
  at365: AT_ORDER,
  at405: AT_ORDER,
};

/** Groups the page's HTML may not hold: created here, with a legend and a tooltip saying how they are read. */
const SPECTRAL_GROUPS = {
  edge: ['UV edge', 'Where T rises through 50 % (cutoff wavelength), on each sample\'s curve as stored'],
  luminous: ['τv', 'Luminous transmittance (D65, photopic eye) of each sample\'s curve; needs 380-780 nm'],
  at254: ['At 254 nm', 'T at the sample\'s own thickness: passes 50 % and over, partly 1-50 %, blocks under 1 %'],
  at365: ['At 365 nm', 'T at the sample\'s own thickness: passes 50 % and over, partly 1-50 %, blocks under 1 %'],
  at405: ['At 405 nm', 'T at the sample\'s own thickness: passes 50 % and over, partly 1-50 %, blocks under 1 %'],
};

export const DIMENSIONS = ['class', 'geometry', 'provenance', 'thickness', ...Object.keys(SPECTRAL_GROUPS)];

/**
 * @param {HTMLElement} root the element holding one `fieldset.facet[data-dimension]` per dimension
 * @param {() => void} onChange called when a box is ticked or cleared
 */
export function initFacets(root, onChange) {
  // Every value seen since the page opened, per dimension, in first-seen order: a value the current
  // words leave no material for stays in place with "(0)" instead of vanishing under the pointer.
  const known = Object.fromEntries(DIMENSIONS.map((d) => [d, []]));
  for (const [d, [legend, how]] of Object.entries(SPECTRAL_GROUPS)) {
    if (!root.querySelector(`fieldset[data-dimension="${d}"]`)) root.append(group(d, legend, how));
  }
  const groups = Object.fromEntries(DIMENSIONS.map((d) => [d, root.querySelector(`fieldset[data-dimension="${d}"]`)]));

  root.addEventListener('change', (event) => {
    if (event.target.matches('input[type="checkbox"]')) onChange();
  });

  // Ticks asked for by the address (address.js) before the boxes exist; the next answer's boxes take them.
  let pending = null;

  /** The ticked values, as { class: [...], geometry: [...], ... }. */
  function chosen() {
    if (pending) return Object.fromEntries(DIMENSIONS.map((d) => [d, [...(pending[d] || [])]]));
    return Object.fromEntries(DIMENSIONS.map((d) => [d,
      [...groups[d].querySelectorAll('input:checked')].map((box) => box.value)]));
  }

  /** Shows the counts of one answer's `facets`; ticked boxes stay ticked. */
  function show(facets) {
    const picked = chosen();
    pending = null;
    for (const d of DIMENSIONS) {
      for (const value of picked[d]) if (!known[d].includes(value)) known[d].push(value);
      const counts = new Map((facets?.[d] || []).map((f) => [f.value, f.count]));
      for (const value of counts.keys()) if (!known[d].includes(value)) known[d].push(value);
      if (ORDER[d]) known[d].sort((a, b) => rank(d, a) - rank(d, b));
      renderGroup(d, counts, new Set(picked[d]));
    }
  }

  function renderGroup(dimension, counts, picked) {
    const list = groups[dimension].querySelector('.facet-values');
    const focused = document.activeElement?.closest?.('.facet-values') === list ? document.activeElement.value : null;
    const items = known[dimension].map((value) => {
      const count = counts.get(value) ?? 0;
      const label = document.createElement('label');
      label.className = 'facet-value';
      label.dataset.value = value;
      const box = document.createElement('input');
      box.type = 'checkbox';
      box.name = dimension;
      box.value = value;
      box.checked = picked.has(value);
      // A value nothing would match cannot narrow anything; it stays ticked-able only if ticked already.
      box.disabled = count === 0 && !box.checked;
      const name = document.createElement('span');
      name.textContent = value;
      const number = document.createElement('span');
      number.className = 'facet-count';
      number.textContent = `(${count})`;
      label.append(box, ' ', name, ' ', number);
      if (count === 0) label.classList.add('empty');
      return label;
    });
    if (!items.length) {
      const none = document.createElement('span');
      none.className = 'facet-none';
      none.textContent = 'none in the library';
      items.push(none);
    }
    list.replaceChildren(...items);
    // Re-rendering replaces the boxes; keep the keyboard where the user was.
    if (focused !== null) list.querySelector(`input[value="${CSS.escape(focused)}"]`)?.focus();
  }

  /** Ticks exactly these values ({ dimension: [values] }) with the next answer shown. */
  function choose(values) {
    pending = values || {};
  }

  return { chosen, show, choose };
}

function rank(dimension, value) {
  const i = ORDER[dimension].indexOf(value);
  return i < 0 ? ORDER[dimension].length : i;
}

function group(dimension, legendText, how) {
  const fieldset = document.createElement('fieldset');
  fieldset.className = 'facet';
  fieldset.dataset.dimension = dimension;
  const legend = document.createElement('legend');
  legend.textContent = legendText;
  legend.title = how;
  const values = document.createElement('div');
  values.className = 'facet-values';
  fieldset.append(legend, values);
  return fieldset;
}
