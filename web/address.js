// The page's state in its address, so that any view can be shared as a link and Back/Forward step
// between views (docs/shareable-address.md). This module only translates between the address and a plain
// state object; app.js decides when to write (push for a deliberate step, replace for a small change) and
// what to do when the address changes under it (popstate).
//
// The address reads, for example:
//   ?q=passes over 80% at 365 nm&cmp=12,15&cmp.add=31&cmp.axis=od&material=12&from=31&mm=5&axis=od&fig.response=flat
//   &words=acryl&f.class=plastic sheet&f.class=film
// Every key is optional; an absent key means the page's default. Older links of the form `#material=ID`
// are read too, and rewritten to the form above once the page has opened them.

/** The weighted-figures choices kept in the address, by key (after the `fig.` prefix). */
export const FIGURE_KEYS = ['sample', 'emitter', 'response', 'convention', 'behind', 'behindMm', 'solar', 'light'];

const FIGURE_PREFIX = 'fig.';
const FACET_PREFIX = 'f.';

/**
 * The state the address holds: `{ q, material, from, mm, axis, words, facets: {dimension: [values]},
 * figures: {key: value} }`; absent keys are null (or empty).
 */
export function readAddress(where = window.location) {
  const params = new URLSearchParams(where.search);
  const text = (key) => {
    const value = params.get(key);
    return value === null || value.trim() === '' ? null : value;
  };
  const facets = {};
  const figures = {};
  for (const [key, value] of params) {
    if (key.startsWith(FACET_PREFIX) && value !== '') {
      const dimension = key.slice(FACET_PREFIX.length);
      (facets[dimension] ||= []).push(value);
    } else if (key.startsWith(FIGURE_PREFIX) && FIGURE_KEYS.includes(key.slice(FIGURE_PREFIX.length)) && value !== '') {
      figures[key.slice(FIGURE_PREFIX.length)] = value;
    }
  }
  const mm = Number(text('mm'));
  return {
    q: text('q'),
    // the older `#material=ID` links still open their material
    material: text('material') ?? legacyMaterial(where.hash),
    from: text('from'),
    mm: Number.isFinite(mm) && mm > 0 ? mm : null,
    axis: text('axis'),
    words: text('words'),
    // the compared materials (compare.js), ids in drawing order; validated by compare.js against the library
    cmp: idList(text('cmp')),
    cmpAdd: idList(text('cmp.add')),
    cmpAxis: text('cmp.axis'),
    facets,
    figures,
  };
}

/** The address (path, query, no fragment) that holds `state`; keys in a fixed order, empty ones left out. */
export function addressOf(state, where = window.location) {
  const params = new URLSearchParams();
  const put = (key, value) => {
    if (value !== null && value !== undefined && String(value).trim() !== '') params.append(key, String(value));
  };
  put('q', state.q);
  // the overlay belongs to the shortlist of the requirement searched: without it, nothing to compare
  if (state.q && (state.cmp?.length || state.cmpAdd?.length)) {
    put('cmp', (state.cmp || []).join(','));
    put('cmp.add', (state.cmpAdd || []).join(','));
    put('cmp.axis', state.cmpAxis);
  }
  put('material', state.material);
  if (state.material !== null && state.material !== undefined && state.mm) {
    put('from', state.from);
    put('mm', state.mm);
  }
  put('axis', state.axis);
  if (state.material !== null && state.material !== undefined) {
    for (const key of FIGURE_KEYS) put(FIGURE_PREFIX + key, state.figures?.[key]);
  }
  put('words', state.words);
  for (const [dimension, values] of Object.entries(state.facets || {})) {
    for (const value of values || []) put(FACET_PREFIX + dimension, value);
  }
  const query = params.toString();
  return where.pathname + (query ? `?${query}` : '');
}

/**
 * Writes `state` into the address: `push` adds a history entry (a search run, a material opened), otherwise
 * the current entry is replaced (typing, ticking, a changed choice). Nothing is written when the address
 * would not change, so a restore does not add entries.
 */
export function writeAddress(state, { push = false } = {}) {
  const next = addressOf(state);
  const current = window.location.pathname + window.location.search;
  if (next === current && !window.location.hash) return false;
  if (push && next !== current) history.pushState(null, '', next);
  else history.replaceState(null, '', next);
  return true;
}

/** Calls `handler(state)` whenever Back or Forward changes the address. */
export function onAddressChange(handler) {
  window.addEventListener('popstate', () => handler(readAddress()));
}

/** "12, 15,,31" → ["12", "15", "31"]: a comma-separated list of ids, blanks dropped (checked by compare.js). */
function idList(value) {
  return (value ?? '').split(',').map((id) => id.trim()).filter((id) => id !== '');
}

function legacyMaterial(hash) {
  const match = /(?:^#|&)material=([^&]+)/.exec(hash || '');
  return match ? decodeURIComponent(match[1]) : null;
}
