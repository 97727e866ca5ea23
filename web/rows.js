// What a shortlist row says about the sample behind it (docs/result-rows.md): the thickness that sample was
// measured at, and whether the row's curve is that measurement or the server's rescaling of it; and the binding
// clause with its confidence when the data give one. The page only words what the search answer states.
import * as fmt from './format.js';

/**
 * Whether the row was judged on a rescaled curve: true or false as the server says, null when it cannot be
 * said (no clause judged, a thickness not recorded, or an answer without the field).
 */
export function rowRescaled(result) {
  return typeof result.rescaled === 'boolean' ? result.rescaled : null;
}

/**
 * "measured at 3 mm" (the row's curve is the measurement itself) or "rescaled from 2 mm" (the measurement at
 * 2 mm, rescaled to the row's thickness); "sample measured at 2 mm" when no curve was judged. Null when the
 * answer names no measured thickness.
 */
export function sampleUsedNote(result) {
  if (!Number.isFinite(result.measuredMm)) return null;
  const rescaled = rowRescaled(result);
  const measured = `${fmt.number(result.measuredMm)} mm`;
  const note = document.createElement('div');
  note.className = 'sample-used';
  note.dataset.rescaled = rescaled === null ? 'unknown' : String(rescaled);
  if (rescaled === true) {
    note.textContent = `rescaled from ${measured}`;
    note.title = `judged on the sample measured at ${measured}, rescaled to ${fmt.number(result.thicknessMm)} mm `
      + '(surface reflection kept, absorption scaled with path length)';
  } else if (rescaled === false) {
    note.textContent = `measured at ${measured}`;
    note.title = `judged on the curve measured at ${measured}, not rescaled`;
  } else {
    note.textContent = `sample measured at ${measured}`;
    note.title = 'no clause could be judged on this sample at the thickness asked';
  }
  return note;
}

/** The binding clause (the one the row's margin comes from) and, when known, how sure its verdict is. */
export function bindingCell(result) {
  const td = document.createElement('td');
  td.className = result.bindingClause ? 'binding' : 'muted';
  td.textContent = result.bindingClause || '—';
  if (result.bindingClause && Number.isFinite(result.bindingClauseConfidence)) {
    const sure = document.createElement('div');
    sure.className = 'row-confidence';
    sure.textContent = fmt.confidence(result.bindingClauseConfidence);
    sure.title = 'the binding clause\'s confidence, from the measurement uncertainty stored with the curve; '
      + 'each clause\'s own is under Details';
    td.append(sure);
  }
  return td;
}
