// Requirement search: the user writes what a part must do in plain words; the server reads it
// (shown back clause by clause while typing), ranks the library against it and explains each verdict.
// The page only formats; every number and every verdict comes from the API.
import * as api from './api.js';
import * as fmt from './format.js';
import { bindingCell, rowRescaled, sampleUsedNote } from './rows.js';

const PARSE_DELAY_MS = 300;

// Presets as users word them (the trade's own requirements, PRACTICE.md §5), each checked against the
// parser. The title says what the requirement is for.
const EXAMPLES = [
  { text: 'passes over 80% at 365 nm and blocks under 1% at 405 nm, thickness 1 to 6 mm',
    use: 'keeps a 365 nm exposure free of violet; thickness left for the search to choose' },
  { text: 'passes over 85% from 380 to 410 nm', use: 'window for a 395 nm LED curing head' },
  { text: 'passes over 80% at 254 nm', use: 'germicidal lamp window or sleeve' },
  { text: 'passes over 85% from 350 to 420 nm', use: 'exposure-unit glass for screen printing' },
  { text: 'blocks to OD 3 or more from 350 to 420 nm', use: 'printed black of a film positive' },
  { text: 'blocks under 1% from 300 to 500 nm and passes over 20% at 600 nm',
    use: 'see-through lid for a 405 nm resin printer' },
  { text: 'blocks under 0.1% from 380 to 420 nm', use: 'viewing window on a 385–405 nm LED curing box' },
  { text: 'blocks under 1% at 405 nm and passes over 30% at 550 nm',
    use: 'eyewear for work next to 405 nm printers' },
  { text: 'passes over 85% of led 395, thickness 1 to 6 mm', use: 'cover for a 395 nm LED head, by the LED\'s own light' },
  { text: 'blocks under 1% at 405 nm and luminous over 70%, behind 4 mm clear float glass',
    use: 'film for a window onto a 405 nm print room that keeps the view bright' },
];

const VERDICTS = {
  meets: { symbol: '✓', word: 'meets' },
  unverified: { symbol: '?', word: 'unverified' },
  misses: { symbol: '✗', word: 'misses' },
};

const el = (id) => document.getElementById(id);

/**
 * Wires the search area. `ui.showProblem(problem, context)` / `ui.clearMessage()` are the page's message
 * area; `ui.openMaterial(id, { sampleId, thicknessMm })` opens the material detail.
 */
export function initSearch(ui) {
  const dom = {
    form: el('search-form'),
    text: el('requirement-text'),
    limit: el('search-limit'),
    button: el('search-button'),
    examples: el('requirement-examples'),
    clauses: el('requirement-clauses'),
    error: el('requirement-error'),
    results: el('search-results'),
    caution: el('search-caution'),
    summary: el('search-summary'),
    light: el('search-light'),
    table: el('results-table'),
    rows: el('results-table').tBodies[0],
  };
  const state = { parseRequest: 0, searchRequest: 0, parseTimer: 0, messageIsOurs: false };

  // ---------- parsing while typing ----------

  function scheduleParse() {
    markStale();
    clearTimeout(state.parseTimer);
    state.parseTimer = setTimeout(parseNow, PARSE_DELAY_MS);
  }

  async function parseNow() {
    clearTimeout(state.parseTimer);
    const text = dom.text.value;
    const request = ++state.parseRequest;
    if (!text.trim()) {
      renderClauses(null);
      hideError();
      return;
    }
    try {
      const requirement = await api.parseRequirement(text);
      if (request !== state.parseRequest) return;
      renderClauses(requirement);
      hideError();
    } catch (problem) {
      if (request !== state.parseRequest) return;
      if (problem.status === 400) {
        renderClauses(null);
        showError(problem, text);
      } else {
        ui.showProblem(problem, 'Reading the requirement');
      }
    }
  }

  function renderClauses(requirement, words = requirement?.words) {
    if (!requirement) {
      dom.clauses.replaceChildren();
      dom.clauses.dataset.state = 'empty';
      return;
    }
    const items = [...requirement.clauses.map(clauseSummary), fmt.thicknessSummary(requirement.thickness)];
    // light at an angle changes every figure: shown beside the thickness (normal incidence stays on the light line)
    if (requirement.light && requirement.light.kind !== 'normal') items.push(`light: ${requirement.light.description}`);
    // words written before the clauses narrow the library first (docs/library-search.md)
    if (words?.text) items.push(`words: “${words.text}”${wordsAdmitted(words)}`);
    for (const p of words?.provenance || []) items.push(`provenance: ${p}`);
    if (requirement.materialClass) items.push(`class: ${requirement.materialClass}`);
    if (requirement.geometry) {
      items.push(requirement.geometry === 'any'
        ? 'geometry: regular or total (total transmittance accepted for seeing through)'
        : `geometry: ${requirement.geometry}${requirement.geometry === 'total' ? ' (total transmittance accepted)' : ''}`);
    }
    if (requirement.layer) items.push(layerSummary(requirement.layer));
    dom.clauses.replaceChildren(...items.map((text, i) => {
      const li = document.createElement('li');
      li.textContent = text;
      if (i < requirement.clauses.length) li.title = requirement.clauses[i].text;
      else li.className = 'setting';
      return li;
    }));
    dom.clauses.dataset.state = 'understood';
  }

  // Results shown for an earlier text stay readable but dimmed, so nobody takes them for the new one.
  function markStale() {
    const shown = dom.table.dataset.requirement;
    dom.results.classList.toggle('stale', shown !== undefined && shown !== dom.text.value);
  }

  // ---------- a requirement the server could not read ----------

  function hideError() {
    dom.error.hidden = true;
    dom.error.replaceChildren();
    dom.text.removeAttribute('aria-invalid');
  }

  function showError(problem, text) {
    const position = Number.isInteger(problem.properties.position) ? problem.properties.position : null;
    // a multi-word name (an emitter, a layer's material) comes with its length; otherwise the word there
    const length = Number.isInteger(problem.properties.length) && problem.properties.length > 0
      ? problem.properties.length : null;
    const suggestions = Array.isArray(problem.properties.suggestions)
      ? problem.properties.suggestions.filter((x) => typeof x === 'string').slice(0, 5)
      : typeof problem.properties.suggestion === 'string' ? [problem.properties.suggestion] : [];
    const detail = document.createElement('p');
    detail.className = 'error-detail';
    detail.textContent = conciseDetail(problem.detail || problem.title, suggestions.length > 0);
    const parts = [detail];
    if (position !== null) parts.push(markedText(text, position, length));
    if (suggestions.length && position !== null) {
      const fix = document.createElement('p');
      fix.className = 'fix';
      fix.append('Did you mean ');
      const shown = spanAt(text, position, length);
      suggestions.forEach((suggestion, i) => {
        const button = document.createElement('button');
        button.type = 'button';
        button.className = 'suggestion';
        button.dataset.suggestion = suggestion;
        button.textContent = suggestion;
        button.title = `replace “${shown}” with “${suggestion}” and search`;
        button.addEventListener('click', () => applySuggestion(position, shown.length, suggestion));
        if (i > 0) fix.append(i === suggestions.length - 1 ? ' or ' : ', ');
        fix.append(button);
      });
      fix.append('?');
      parts.push(fix);
    }
    dom.error.replaceChildren(...parts);
    dom.error.hidden = false;
    dom.text.setAttribute('aria-invalid', 'true');
  }

  // The text again, in the input's font, with the character at `position` marked (an empty mark after
  // the end when the server wanted more text), so the user sees where reading stopped.
  function markedText(text, position, span) {
    const line = document.createElement('p');
    line.className = 'marked-text';
    line.setAttribute('aria-label', `problem at character ${position + 1}`);
    const at = Math.min(position, text.length);
    const length = Math.max(1, spanAt(text, at, span).length);
    const mark = document.createElement('mark');
    mark.textContent = at < text.length ? text.slice(at, at + length) : '\u00a0';
    line.append(text.slice(0, at), mark, text.slice(at + length));
    return line;
  }

  function applySuggestion(position, length, suggestion) {
    const text = dom.text.value;
    dom.text.value = text.slice(0, position) + suggestion + text.slice(position + length);
    const caret = position + suggestion.length;
    dom.text.focus();
    dom.text.setSelectionRange(caret, caret);
    hideError();
    runSearch();
  }

  // ---------- searching ----------

  async function runSearch() {
    clearTimeout(state.parseTimer);
    const text = dom.text.value;
    if (!text.trim()) {
      dom.text.focus();
      parseNow();
      return;
    }
    const limit = Number(dom.limit.value || 20);
    if (!Number.isInteger(limit) || limit < 1 || limit > 500) {
      showOurProblem({ title: 'Invalid limit', detail: `“${dom.limit.value}” is not a whole number from 1 to 500.` },
        'Searching');
      return;
    }
    const request = ++state.searchRequest;
    ++state.parseRequest; // a parse still on its way would only repeat what the search answer says
    dom.button.disabled = true;
    dom.summary.textContent = 'Searching…';
    try {
      const answer = await api.search(text, limit);
      if (request !== state.searchRequest) return;
      if (state.messageIsOurs) {
        ui.clearMessage();
        state.messageIsOurs = false;
      }
      hideError();
      renderClauses(answer.requirement, answer.words);
      renderResults(answer, text);
      performance.mark('sieve:results-rendered'); // timed by the page speed benchmark (docs/page-speed.md)
      dom.results.dispatchEvent(new CustomEvent('shortlist', { detail: answer })); // compare.js listens
      ui.searched?.(text); // the address keeps the requirement searched (address.js)
    } catch (problem) {
      if (request !== state.searchRequest) return;
      dropResults(); // rows of an earlier requirement would pass for this one's
      if (problem.status === 400 && Number.isInteger(problem.properties.position)) {
        // shown once, beside the text it is about; a banner would only repeat it
        renderClauses(null); // the reading shown was of an earlier text
        showError(problem, text);
        if (state.messageIsOurs) ui.clearMessage();
        state.messageIsOurs = false;
      } else {
        showOurProblem(problem, 'Searching');
      }
    } finally {
      if (request === state.searchRequest) dom.button.disabled = false;
    }
  }

  /** What the words and terms written before the clauses admitted, in the page's words. */
  function wordsSummary(words) {
    const terms = [words.text ? `words “${words.text}”` : null, ...(words.provenance || []).map((p) => `provenance ${p}`)]
      .filter(Boolean).join(' and ');
    const n = words.admitted === 1 ? '1 material' : `${words.admitted} materials`;
    return words.admitted === 0 ? `${terms} admitted no material` : `${terms} admitted ${n}`;
  }

  /** After a failed search: no rows are left standing, and the summary says there are none. */
  function dropResults() {
    dom.rows.replaceChildren();
    delete dom.table.dataset.requirement;
    dom.results.classList.remove('stale');
    dom.table.hidden = true;
    dom.caution.hidden = true;
    dom.summary.textContent = 'No results: the search did not run.';
    dom.light.hidden = true;
    // the compare section offers the shortlist's rows: an empty answer takes the earlier ones away there too
    dom.results.dispatchEvent(new CustomEvent('shortlist', { detail: { results: [], requirement: null } }));
  }

  function showOurProblem(problem, context) {
    ui.showProblem(problem, context);
    state.messageIsOurs = true;
  }

  /** " (admit 7 materials)" once a search has counted them; nothing while only parsed. */
  function wordsAdmitted(words) {
    if (!Number.isInteger(words.admitted)) return '';
    return ` (admit ${words.admitted === 1 ? '1 material' : `${words.admitted} materials`})`;
  }

  function renderResults(answer, asked) {
    const requirement = answer.requirement;
    dom.results.hidden = false;
    dom.table.hidden = false; // hidden by a failed search before
    // the server adds a caution to answers with eye or skin safety figures; blocking light needs one too
    dom.caution.hidden = !(blocksLight(requirement) || typeof answer.caution === 'string');
    // the text as typed: with words, the requirement's own text is only its clauses
    dom.table.dataset.requirement = asked ?? requirement.text;
    const n = answer.results.length;
    dom.summary.textContent = `Evaluated ${answer.evaluatedSamples} samples in ${fmt.number(answer.tookMs, 1)} ms`
      // with each row's revisions, what the answer was computed from, to reproduce it later (docs/audit.md)
      + (Number.isInteger(answer.libraryGeneration) ? ` (library generation ${answer.libraryGeneration})` : '')
      + ` · ${n === 1 ? '1 result' : `${n} results`} for “${requirement.text}”`
      + (answer.layer ? ` · ${answer.layer.explanation}` : '')
      + (answer.words ? ` · ${wordsSummary(answer.words)}` : '');
    // every figure of the answer assumes a light; named every time, normal incidence included
    dom.light.textContent = answer.assumedLight ? `Light: ${answer.assumedLight}` : '';
    dom.light.hidden = !answer.assumedLight;
    // the rows come grouped (meets, unverified, misses, not judged); each group under the server's heading,
    // the same words the command line prints, so a row with nothing judged never reads as a candidate
    const headings = new Map((answer.groups || []).map((g) => [g.group, g.heading]));
    let group = null;
    const rows = answer.results.flatMap((result) => {
      const out = resultRows(result, requirement);
      if (result.group && result.group !== group) {
        group = result.group;
        out.unshift(groupRow(group, headings.get(group) || group));
      }
      return out;
    });
    if (!rows.length) {
      const tr = document.createElement('tr');
      const td = document.createElement('td');
      td.colSpan = 8;
      td.className = 'empty';
      td.textContent = answer.words?.admitted === 0
        ? `The words admit no material of the library, so nothing was judged: ${wordsSummary(answer.words)}.`
        : 'No sample in the library can be judged against this requirement.';
      tr.append(td);
      rows.push(tr);
    }
    dom.rows.replaceChildren(...rows);
    markStale();
  }

  function groupRow(group, heading) {
    const tr = document.createElement('tr');
    tr.className = 'result-group';
    tr.dataset.group = group;
    const th = document.createElement('th');
    th.scope = 'rowgroup';
    th.colSpan = 8;
    th.textContent = heading;
    tr.append(th);
    return tr;
  }

  function resultRows(result, requirement) {
    const tr = document.createElement('tr');
    tr.dataset.resultMaterialId = result.materialId;
    tr.dataset.sampleId = result.sampleId;
    tr.dataset.verdict = result.verdict;
    tr.dataset.group = result.group || '';
    // the revisions the row was judged on, always named (docs/audit.md); shown in the row once corrected
    if (Number.isInteger(result.sampleRevision)) tr.dataset.sampleRevision = result.sampleRevision;
    if (Number.isInteger(result.materialRevision)) tr.dataset.materialRevision = result.materialRevision;

    const open = document.createElement('button');
    open.type = 'button';
    open.className = 'link material-link';
    open.textContent = result.materialName;
    // rescaled only when the server judged a rescaled curve: a sample measured at the row's thickness opens as measured
    const recommended = requirement.thickness.kind !== 'asMeasured' && Number.isFinite(result.thicknessMm)
      && rowRescaled(result) !== false;
    open.title = recommended
      ? `open this material, with the rescale box set to ${fmt.number(result.thicknessMm)} mm`
      : 'open this material';
    open.addEventListener('click', () => ui.openMaterial(result.materialId, {
      sampleId: result.sampleId,
      thicknessMm: recommended ? result.thicknessMm : null,
    }));
    const material = document.createElement('td');
    material.className = 'name';
    material.append(open);
    if (Number.isInteger(result.sampleRevision)) {
      material.title = `sample ${result.sampleId}, revision ${result.sampleRevision}; `
        + `material revision ${result.materialRevision}`;
    }
    if (result.sampleRevision > 1 || result.materialRevision > 1) {
      // the row was judged on corrected metadata: say which revision (docs/undo.md)
      const revision = document.createElement('span');
      revision.className = 'revision';
      revision.textContent = ` rev. ${result.sampleRevision}/${result.materialRevision}`;
      revision.title = `judged on revision ${result.sampleRevision} of the sample's metadata and revision `
        + `${result.materialRevision} of the material's index and made thicknesses`;
      material.append(revision);
    }

    const toggle = document.createElement('button');
    toggle.type = 'button';
    toggle.className = 'quiet toggle';
    toggle.setAttribute('aria-expanded', 'false');
    toggle.textContent = 'Details';
    const details = clauseRow(result, requirement);
    toggle.addEventListener('click', () => {
      const show = details.hidden;
      details.hidden = !show;
      toggle.setAttribute('aria-expanded', String(show));
    });
    const toggleCell = document.createElement('td');
    toggleCell.append(toggle);

    tr.append(
      cell(String(result.rank), 'num'),
      material,
      verdictCell(result.verdict),
      thicknessCell(result),
      geometryCell(result.geometry),
      result.worstMarginIsBound
        ? cell(`≤ ${fmt.signedDecades(result.worstMarginDecades)}`, 'num margin bound',
          'shown only by a detection limit: the true miss may be larger')
        : cell(fmt.signedDecades(result.worstMarginDecades), 'num margin'),
      bindingCell(result),
      toggleCell,
    );
    return [tr, details];
  }

  function clauseRow(result, requirement) {
    const tr = document.createElement('tr');
    tr.className = 'result-clauses';
    tr.hidden = true;
    const td = document.createElement('td');
    td.colSpan = 8;
    const table = document.createElement('table');
    table.className = 'data-table clause-table';
    const head = document.createElement('thead');
    head.innerHTML = '<tr><th scope="col">Clause</th><th scope="col" class="num">Value</th>'
      + '<th scope="col" class="num">Margin (decades)</th><th scope="col">Verdict</th>'
      + '<th scope="col">Explanation</th></tr>';
    const body = document.createElement('tbody');
    result.clauses.forEach((c, i) => {
      const row = document.createElement('tr');
      row.append(
        cell(c.text),
        cell(clauseValue(c, requirement.clauses[i]), c.valueIsBound ? 'num bound' : 'num',
          c.valueIsBound ? 'at the detection limit: a bound, not a measurement' : ''),
        cell(fmt.signedDecades(c.marginDecades), 'num margin'),
        verdictCell(c.verdict, fmt.confidence(c.confidence)),
        cell(c.explanation, 'explanation'),
      );
      body.append(row);
    });
    table.append(head, body);
    td.append(table);
    tr.append(td);
    return tr;
  }

  // ---------- wiring ----------

  dom.examples.replaceChildren(...EXAMPLES.map((example) => {
    const li = document.createElement('li');
    const chip = document.createElement('button');
    chip.type = 'button';
    chip.className = 'chip';
    chip.textContent = example.text;
    chip.title = `Example: ${example.use}`;
    chip.dataset.example = example.text;
    chip.addEventListener('click', () => {
      dom.text.value = example.text;
      hideError();
      runSearch();
    });
    li.append(chip);
    return li;
  }));
  dom.text.addEventListener('input', scheduleParse);
  dom.form.addEventListener('submit', (event) => {
    event.preventDefault();
    runSearch();
  });
  renderClauses(null);

  return {
    /** The requirement last searched, or null (for the address). */
    searched: () => (dom.results.hidden ? null : dom.table.dataset.requirement ?? null),
    /** Shows the view of an address: searches `text` unless already shown; null empties the search. */
    async show(text) {
      if (text === null || text === undefined) {
        ++state.searchRequest;
        dom.text.value = '';
        dom.results.hidden = true;
        delete dom.table.dataset.requirement;
        dom.rows.replaceChildren();
        hideError();
        renderClauses(null);
        return;
      }
      if (!dom.results.hidden && dom.table.dataset.requirement === text && dom.text.value === text) return;
      dom.text.value = text;
      await runSearch();
    },
  };
}

// ---------- clauses the shared formatter does not know: weighted figures, critical wavelength, layer ----------

const WEIGHTED_NAMES = { erythemal: 'erythemal T', uvHazard: 'UV-hazard T', luminous: 'luminous τv' };

function weightedName(clause) {
  if (WEIGHTED_NAMES[clause.preset]) return WEIGHTED_NAMES[clause.preset];
  return clause.response ? `T of ${clause.emitter} × ${clause.response}` : `T of ${clause.emitter}`;
}

/** "T of led-365 ≥ 85 %", "erythemal T ≤ 1 %", "λc ≥ 370 nm"; other clauses as the shared formatter writes them. */
function clauseSummary(clause) {
  if (clause.type === 'inState' && (clause.clause.type === 'weighted' || clause.clause.type === 'criticalWavelength')) {
    return `${fmt.stateWords(clause.state)}: ${clauseSummary(clause.clause)}`;
  }
  if (clause.type === 'criticalWavelength') {
    return `critical wavelength λc ${clause.comparison === 'atLeast' ? '≥' : '≤'} ${fmt.number(clause.nm, 1)} nm`;
  }
  if (clause.type !== 'weighted') return fmt.clauseSummary(clause);
  const pass = clause.direction === 'pass';
  const t = clause.thresholdT;
  const threshold = clause.unit === 'opticalDensity'
    ? `OD ${pass ? '≤' : '≥'} ${fmt.number(-Math.log10(t), 2)}`
    : `${pass ? '≥' : '≤'} ${clause.unit === 'fraction' ? fmt.number(t, 6) : `${fmt.number(t * 100, 6)} %`}`;
  const range = Array.isArray(clause.rangeNm) ? ` (${fmt.number(clause.rangeNm[0], 0)}–${fmt.number(clause.rangeNm[1], 0)} nm)` : '';
  return `${weightedName(clause)} ${threshold}${range}`;
}

function clauseValue(result, clause) {
  if (clause?.type === 'inState') return clauseValue(result, clause.clause);
  if (clause?.type === 'criticalWavelength') {
    return Number.isFinite(result.value) ? `${fmt.number(result.value, 1)} nm` : '—';
  }
  return fmt.clauseValue(result, clause?.type === 'weighted' ? { ...clause, type: 'transmittance' } : clause);
}

function layerSummary(layer) {
  return `light path: ${layer.placement} ${fmt.number(layer.thicknessMm)} mm ${layer.material}`;
}

/** Whether any clause asks for light to be kept out: then a safety caution belongs next to the results. */
function blocksLight(requirement) {
  return requirement.clauses.some((c) => c.direction === 'block' || c.unit === 'opticalDensity');
}

/** How the row's sample was measured: "regular" (direct beam, see-through) or "total" (scattered light included). */
function geometryCell(geometry) {
  const td = cell(geometry || '—', geometry === 'total' ? 'geometry diffuse' : 'geometry');
  if (geometry === 'total') {
    td.title = 'diffuse sample: total transmittance includes scattered light; not rescaled with thickness, '
      + 'and not see-through unless the requirement says “geometry any”';
  } else if (geometry === 'regular') {
    td.title = 'regular transmittance: the direct beam only';
  }
  return td;
}

function thicknessText(result) {
  const t = Number.isFinite(result.thicknessMm) ? `${fmt.number(result.thicknessMm)} mm` : '—';
  const range = result.thicknessRangeMm;
  if (!Array.isArray(range) || range.length !== 2) return t;
  return `${t} (feasible ${fmt.number(range[0])}–${fmt.number(range[1])} mm)`;
}

/** The thickness judged, the feasible interval and, below them, which stock sizes to buy (server's words). */
function thicknessCell(result) {
  const td = cell(thicknessText(result));
  const used = sampleUsedNote(result); // rows.js: "measured at 3 mm" / "rescaled from 2 mm"
  if (used) td.append(used);
  const stock = result.stockThicknesses;
  if (stock && stock.explanation) {
    const note = document.createElement('div');
    note.className = 'stock-advice muted';
    note.dataset.stock = stock.meeting.length ? 'meeting' : 'closest-miss';
    note.textContent = stock.explanation;
    td.append(note);
  }
  return td;
}

/** The verdict badge; `confidence`, when given, is the clause's confidence text shown beside it. */
function verdictCell(verdict, confidence) {
  const known = VERDICTS[verdict] || { symbol: '•', word: verdict };
  const td = document.createElement('td');
  const badge = document.createElement('span');
  badge.className = `verdict verdict-${verdict}`;
  badge.dataset.verdict = verdict;
  const symbol = document.createElement('span');
  symbol.className = 'verdict-symbol';
  symbol.setAttribute('aria-hidden', 'true');
  symbol.textContent = known.symbol;
  badge.append(symbol, known.word);
  td.append(badge);
  if (confidence) {
    const sure = document.createElement('span');
    sure.className = 'verdict-confidence';
    sure.textContent = ` · ${confidence}`;
    td.append(sure);
  }
  return td;
}

function cell(text, className, title) {
  const td = document.createElement('td');
  td.textContent = text;
  if (className) td.className = className;
  if (title) td.title = title;
  return td;
}

/** The `span` characters at `position` when the server named them, else the word there. */
function spanAt(text, position, span) {
  return span ? text.slice(position, position + span) : wordAt(text, position);
}

/**
 * The server's words without what the page already shows: the position (the text is marked), the "did you
 * mean" (offered as buttons), and a list of more than three expected keywords (the found word is named).
 */
function conciseDetail(detail, suggestionsShown) {
  let text = String(detail || '').replace(/^at position \d+:\s*/, '');
  if (suggestionsShown) text = text.replace(/\s*—\s*did you mean .*\?$/s, '');
  const m = /^expected (.*), found (.*)$/s.exec(text);
  if (m && (m[1].match(/'[^']+'/g) || []).length > 3) return `Not understood here: found ${m[2]}.`;
  if (m) return `Expected ${m[1]}, found ${m[2]}.`;
  return text;
}

/** The word (letters, digits, "%" or ".") starting at `position`, or the one character there. */
function wordAt(text, position) {
  const match = /^[\p{L}\p{N}%.]+/u.exec(text.slice(position));
  return match ? match[0].replace(/\.$/, '') : text.slice(position, position + 1);
}
