// Weighted figures of one sample of the shown material: pick a source (emitter) and a response, the
// server integrates and answers with figures; this module lays them out. Every figure-shaped member of the
// answer is shown, those the page knows with a label and in their group, any other by its name, so a
// figure the server adds later appears without a change here. No number is computed on the page.
import * as api from './api.js';
import * as fmt from './format.js';

// A 365 nm UV LED: unweighted, the equal-energy source would integrate 100-1100 nm, wider than most
// stored curves, and leave the chosen pair "not available"; the curing lamp's share is what a rig designer
// asks first. Any other source is one choice away.
const DEFAULT_EMITTER = 'led-365';
// Unweighted (radiometric) first: a curing designer wants the lamp's power passed; eye and skin weightings
// are a choice away.
const DEFAULT_RESPONSE = 'flat';
const MESSAGE_CONTEXT = 'Computing weighted figures';
// The light choice whose phrase is typed in the text field beside it.
const LIGHT_IN_WORDS = 'in-words';
// Shown when an answer comes without its own caution: safety figures never appear without one.
const FALLBACK_CAUTION = 'Screening estimate from stored curves, not a certification; applicable standards, '
  + 'local codes and qualified safety professionals decide.';

// Groups in reading order, by the answer's member a figure came in.
const GROUPS = [
  { id: 'chosen', title: 'Chosen source × response', keys: ['effectiveTransmittance', 'protectionFactor'] },
  { id: 'screening', title: 'Eye and skin screening (fixed weightings)',
    keys: ['erythemalProtectionFactor', 'actinicUvProtectionFactor', 'luminousTransmittance', 'sunglassCategory', 'upf'] },
  { id: 'bands', title: 'Mean transmittance in the UV bands', keys: ['bandMeans'] },
  { id: 'edge', title: 'Absorption edge', keys: ['criticalWavelength'] },
  { id: 'lines', title: 'Optical density at lamp lines', keys: ['opticalDensities'] },
  { id: 'other', title: 'Other figures', keys: [] },
];

// Figures about eyes or skin (erythema, UV hazard, blue light, luminous / sunglass category, UPF): these
// carry the caution. Matched on the member, the figure's name and, for the chosen pair, the response.
const HAZARD = /erythem|actinic|hazard|blue|luminous|sunglass|categor|photopic|upf|skin|eye|retina/i;
const PAIR_KEYS = new Set(['effectiveTransmittance', 'protectionFactor']);

const el = (id) => document.getElementById(id);

/** Every figure in the answer with the member it came in; lists and one level of nested objects too. */
function collectFigures(answer) {
  const found = [];
  const category = sunglassFigure(answer?.sunglassCategory);
  if (category) found.push({ key: 'sunglassCategory', figure: category });
  const visit = (key, value, depth) => {
    if (fmt.isFigure(value)) {
      found.push({ key, figure: value });
    } else if (Array.isArray(value)) {
      value.filter(fmt.isFigure).forEach((figure) => found.push({ key, figure }));
    } else if (value && typeof value === 'object' && depth < 2) {
      Object.entries(value).forEach(([, inner]) => visit(key, inner, depth + 1));
    }
  };
  Object.entries(answer || {}).forEach(([key, value]) => visit(key, value, 0));
  return found;
}

/**
 * The sunglass category comes as its own object (category number, description, range); shown as a row
 * like the figures, with the range and the server's note as its note.
 */
function sunglassFigure(rating) {
  if (!rating || typeof rating !== 'object' || fmt.isFigure(rating)) return null;
  const known = Number.isFinite(rating.category);
  const what = known ? `${rating.description}, τv ${rating.range} (${rating.standard})` : '';
  return {
    name: 'sunglassCategory',
    value: known ? rating.category : null,
    unit: 'category',
    bound: rating.bound,
    available: known,
    // The server's note already names the category, its range and what was not checked.
    note: rating.note || what,
  };
}

function isHazard({ key, figure }, response) {
  return HAZARD.test(key) || HAZARD.test(figure.name) || (PAIR_KEYS.has(key) && HAZARD.test(response || ''));
}

function groupOf(entry, response) {
  const known = GROUPS.find((g) => g.keys.includes(entry.key));
  if (known) return known;
  return isHazard(entry, response) ? GROUPS[1] : GROUPS[GROUPS.length - 1];
}

/** "2 mm regular" or "rescaled to 5 mm (from 2 mm)": the choice values carry sample id and thickness. */
function choiceValue(sampleId, thicknessMm) {
  return thicknessMm === undefined || thicknessMm === null ? String(sampleId) : `${sampleId}@${thicknessMm}`;
}

function parseChoice(value) {
  if (!value) return null;
  const [id, mm] = value.split('@');
  return { sampleId: id, thicknessMm: mm === undefined ? undefined : Number(mm) };
}

/**
 * Wires the weighted-figures section. `ui.showProblem(problem, context)` / `ui.clearMessage()` are the
 * page's message area. Returns `showMaterial(material)` and `showRescaled(rescaled)` for the detail view.
 */
export function initFigures(ui) {
  const dom = {
    section: el('weighted-figures'),
    sample: el('figure-sample'),
    emitter: el('figure-emitter'),
    response: el('figure-response'),
    convention: el('figure-convention'),
    solar: el('figure-solar'),
    behind: el('figure-behind'),
    behindMm: el('figure-behind-mm'),
    light: el('figure-light'),
    lightText: el('figure-light-text'),
    lightTextField: el('figure-light-text-field'),
    emitterAbout: el('figure-emitter-about'),
    responseAbout: el('figure-response-about'),
    caution: el('figures-caution'),
    cautionText: el('figures-caution-text'),
    status: el('figures-status'),
    table: el('figures-table'),
  };
  // parts: lower-case material name -> slug, for the "seen behind" picker
  const state = { request: 0, material: null, descriptions: new Map(), parts: new Map(), partSent: '{}' };

  // ---------- pickers ----------

  /** Options from a catalogue; grouped by `origin` (built-in, imported, …) when the server sends one. */
  function fillPicker(select, items, fallback) {
    const previous = select.value || fallback;
    const option = (item) => {
      const o = document.createElement('option');
      o.value = item.name;
      o.textContent = item.name;
      if (item.description) o.title = item.description;
      state.descriptions.set(`${select.id}:${item.name}`, item.description || '');
      return o;
    };
    const origins = [...new Set(items.map((i) => i.origin).filter(Boolean))];
    if (origins.length) {
      const groups = origins.map((origin) => {
        const group = document.createElement('optgroup');
        group.label = origin;
        group.append(...items.filter((i) => i.origin === origin).map(option));
        return group;
      });
      select.replaceChildren(...items.filter((i) => !i.origin).map(option), ...groups);
    } else {
      select.replaceChildren(...items.map(option));
    }
    const names = items.map((i) => i.name);
    select.value = names.includes(previous) ? previous : names.includes(fallback) ? fallback : names[0] || '';
  }

  /**
   * Only the spectra the server marks as sunlight (`solar`: daylight D65, imported solar tables); none is
   * chosen until the user picks one.
   */
  function fillSolarPicker(all) {
    const items = all.filter((item) => item.solar === true);
    const previous = dom.solar.value;
    const none = document.createElement('option');
    none.value = '';
    none.textContent = 'none';
    dom.solar.replaceChildren(none, ...items.map((item) => {
      const o = document.createElement('option');
      o.value = item.name;
      o.textContent = item.name;
      if (item.description) o.title = item.description;
      return o;
    }));
    dom.solar.value = items.some((i) => i.name === previous) ? previous : '';
  }

  function describeChoices() {
    const describe = (select, what) => {
      // Descriptions come as sent, some cut short after a comma; end each with one full stop.
      const text = (state.descriptions.get(`${select.id}:${select.value}`) || '').replace(/[\s.,;:]+$/, '');
      return text ? `${what} ${select.value}: ${text}.` : '';
    };
    dom.emitterAbout.textContent = describe(dom.emitter, 'Source');
    dom.responseAbout.textContent = describe(dom.response, 'Response');
  }

  async function loadCatalogues() {
    const [emitters, responses] = await Promise.allSettled([api.listEmitters(), api.listResponses()]);
    if (emitters.status === 'fulfilled' && Array.isArray(emitters.value?.emitters)) {
      fillPicker(dom.emitter, emitters.value.emitters, DEFAULT_EMITTER);
      fillSolarPicker(emitters.value.emitters);
    } else if (emitters.status === 'rejected') {
      ui.showProblem(emitters.reason, 'Loading the light sources');
    }
    if (responses.status === 'fulfilled' && Array.isArray(responses.value?.responses)) {
      fillPicker(dom.response, responses.value.responses, DEFAULT_RESPONSE);
    } else if (responses.status === 'rejected') {
      ui.showProblem(responses.reason, 'Loading the response spectra');
    }
    describeChoices();
  }

  function sampleOption(sample) {
    const o = document.createElement('option');
    o.value = choiceValue(sample.id);
    o.textContent = `${fmt.number(sample.thicknessMm)} mm ${sample.geometry || ''}`.trim();
    return o;
  }

  // ---------- the table ----------

  function row({ key, figure }, hazard, answer) {
    const tr = document.createElement('tr');
    tr.dataset.figure = key;
    tr.dataset.name = figure.name;
    const head = document.createElement('th');
    head.scope = 'row';
    head.textContent = fmt.figureLabel(figure, key, answer);
    if (hazard) {
      tr.classList.add('hazard');
      const tag = document.createElement('span');
      tag.className = 'hazard-tag';
      tag.textContent = 'screening';
      tag.title = answer.caution || FALLBACK_CAUTION;
      head.append(' ', tag);
      head.setAttribute('aria-describedby', 'figures-caution');
    }
    const value = document.createElement('td');
    value.className = 'num value';
    const note = document.createElement('td');
    note.className = 'note';
    note.textContent = figure.note || '';
    const text = fmt.figureValue(figure, key);
    if (text === null) {
      tr.classList.add('unavailable');
      value.textContent = 'not available';
      value.title = figure.note || 'the server gave no value and no reason';
      note.textContent = figure.note ? `Not available: ${figure.note}` : 'Not available (no reason given).';
    } else {
      value.textContent = text;
      const meaning = figure.stated ? 'points below the detection limit taken at 0 and at their limit; the true'
        + ' value lies between' : fmt.boundMeaning(figure.bound);
      value.title = [meaning, figure.note].filter(Boolean).join('; ');
      if (figure.bound === 'at-most' || figure.bound === 'at-least') value.classList.add('bound');
      const caveats = fmt.figureCaveats(figure);
      if (caveats.length) {
        const strong = document.createElement('strong');
        strong.className = 'caveat';
        strong.textContent = caveats.join(' ');
        note.prepend(strong, ' ');
      }
    }
    tr.append(head, value, note);
    return tr;
  }

  function render(answer, choice) {
    const figures = collectFigures(answer);
    const byGroup = new Map(GROUPS.map((g) => [g, []]));
    for (const entry of figures) byGroup.get(groupOf(entry, answer.response)).push(entry);
    const bodies = [];
    for (const [group, entries] of byGroup) {
      if (!entries.length) continue;
      const body = document.createElement('tbody');
      body.dataset.group = group.id;
      const title = document.createElement('tr');
      title.className = 'group';
      const th = document.createElement('th');
      th.scope = 'rowgroup';
      th.colSpan = 3;
      th.textContent = group.title;
      title.append(th);
      body.append(title, ...entries.map((e) => row(e, isHazard(e, answer.response), answer)));
      bodies.push(body);
    }
    dom.table.querySelectorAll('tbody').forEach((b) => b.remove());
    dom.table.append(...bodies);
    dom.cautionText.textContent = answer.caution || FALLBACK_CAUTION;
    dom.section.dataset.state = 'shown';
    const thickness = Number.isFinite(answer.thicknessMm) ? `${fmt.number(answer.thicknessMm)} mm` : 'the sample';
    const how = (answer.rescaled ? ` (rescaled from the ${sampleThickness(choice)} sample)` : '')
      + (answer.layer ? `; ${answer.layer}` : '');
    // the light is named every time, normal incidence included: every figure assumes one
    const light = answer.light?.description ? `; light: ${answer.light.description}` : '';
    dom.status.textContent = figures.length
      ? `${figures.length} figure${figures.length === 1 ? '' : 's'} for ${thickness}${how}, ${answer.emitter || dom.emitter.value} × `
        + `${answer.response || dom.response.value}${light}.`
      : 'The server sent no figures for this sample.';
    dom.section.dataset.light = answer.light?.kind || '';
  }

  function sampleThickness(choice) {
    const sample = state.material?.samples.find((s) => String(s.id) === String(choice.sampleId));
    return sample ? `${fmt.number(sample.thicknessMm)} mm` : 'measured';
  }

  function showNothing(reason, stateName) {
    dom.table.querySelectorAll('tbody').forEach((b) => b.remove());
    dom.section.dataset.state = stateName;
    dom.status.textContent = reason;
  }

  // ---------- the part the sample is seen behind ----------

  /**
   * The part as the API takes it: a material's name picked from the suggestions becomes its slug; other
   * text goes as typed (the server reads words of a name). Both fields, or neither.
   */
  function partInFront() {
    const typed = dom.behind.value.trim();
    const mm = dom.behindMm.value.trim();
    if (!typed || !mm) return { name: undefined, mm: undefined };
    const known = state.parts.get(typed.toLowerCase());
    return { name: known || typed, mm };
  }

  function partChanged() {
    const inPair = document.activeElement === dom.behind || document.activeElement === dom.behindMm;
    const typed = dom.behind.value.trim();
    const mm = dom.behindMm.value.trim();
    const problem = el('figure-behind-problem');
    if (typed && !mm) {
      if (inPair) return; // still filling the pair in
      problem.textContent = 'Give the part’s thickness in mm; until then the figures leave the part out.';
    } else if (!typed && mm) {
      if (inPair) return;
      problem.textContent = 'Name the part (a material of the library); until then the figures leave it out.';
    } else if (mm && !(Number(mm) > 0)) {
      problem.textContent = 'The part’s thickness must be a positive number of millimetres.';
      problem.hidden = false;
      return;
    } else {
      problem.textContent = '';
    }
    problem.hidden = !problem.textContent;
    if (state.partSent !== JSON.stringify(partInFront())) refresh();
  }

  // ---------- how the light arrives ----------

  /**
   * The light as the API takes it: the chosen phrase, or the one typed when "described in words" is chosen
   * (the server reads it; empty means normal incidence).
   */
  function lightPhrase() {
    if (dom.light.value !== LIGHT_IN_WORDS) return dom.light.value || undefined;
    return dom.lightText.value.trim() || undefined;
  }

  function lightChanged() {
    const inWords = dom.light.value === LIGHT_IN_WORDS;
    dom.lightTextField.hidden = !inWords;
    if (inWords && !dom.lightText.value.trim()) {
      dom.lightText.focus();
      return; // nothing to send until a phrase is typed
    }
    refresh();
  }

  // ---------- fetching: later answers win ----------

  async function refresh() {
    const choice = parseChoice(dom.sample.value);
    if (!choice) {
      state.request += 1;
      showNothing('No sample to compute figures for.', 'empty');
      return;
    }
    const part = partInFront();
    const request = ++state.request;
    describeChoices();
    dom.table.setAttribute('aria-busy', 'true');
    dom.section.dataset.state = 'loading';
    dom.status.textContent = 'Computing figures…';
    try {
      const answer = await api.getFigures(choice.sampleId, {
        thicknessMm: choice.thicknessMm,
        emitter: dom.emitter.value || DEFAULT_EMITTER,
        response: dom.response.value || DEFAULT_RESPONSE,
        convention: dom.convention.value || undefined,
        solar: dom.solar.value || undefined,
        // a part in front of the sample: both fields or neither (the server says which one is missing)
        behind: part.name,
        behindMm: part.mm,
        light: lightPhrase(),
      });
      if (request !== state.request) return;
      state.partSent = JSON.stringify(part);
      if (ui.messageStartsWith(MESSAGE_CONTEXT)) ui.clearMessage();
      render(answer, choice);
    } catch (problem) {
      if (request !== state.request) return;
      showNothing(`No figures: ${problem.detail || problem.title || 'the server did not answer'}`, 'error');
      // a refused choice is told once, in the section's status line beside the pickers
      if (problem.status !== 400 && problem.status !== 422) ui.showProblem(problem, MESSAGE_CONTEXT);
      else if (ui.messageStartsWith(MESSAGE_CONTEXT)) ui.clearMessage();
    } finally {
      if (request === state.request) dom.table.removeAttribute('aria-busy');
    }
  }

  // ---------- importing a spectrum of one's own ----------

  async function importSpectrum() {
    const form = el('spectrum-import-form');
    const status = el('spectrum-import-status');
    const kind = el('spectrum-kind').value;
    const file = el('spectrum-file').files[0];
    const name = el('spectrum-name').value.trim();
    if (!name || !file) {
      status.textContent = !name ? 'Give the spectrum a name (lower-case letters and digits, words joined by single dashes).'
        : 'Choose the file to import.';
      return;
    }
    status.textContent = `Importing ${file.name}…`;
    try {
      const stored = await api.importSpectrum(kind, {
        name,
        file,
        valueColumn: el('spectrum-value-column').value.trim(),
        description: el('spectrum-description').value.trim(),
      });
      const range = Array.isArray(stored.rangeNm) ? `, ${fmt.number(stored.rangeNm[0])}–${fmt.number(stored.rangeNm[1])} nm` : '';
      const warnings = (stored.warnings || []).length ? ` Warnings: ${stored.warnings.join('; ')}` : '';
      status.textContent = `Imported ${kind === 'emitters' ? 'source' : 'response'} ${stored.name}`
        + ` (${stored.points} points${range}).${warnings}`;
      form.reset();
      el('spectrum-kind').value = kind;
      await loadCatalogues();
      (kind === 'emitters' ? dom.emitter : dom.response).value = stored.name;
      await refresh();
    } catch (problem) {
      status.textContent = `Not imported: ${problem.detail || problem.title || 'the server did not answer'}`;
    }
  }

  el('spectrum-import-form').addEventListener('submit', importSpectrum);

  for (const select of [dom.sample, dom.emitter, dom.response, dom.convention, dom.solar]) {
    select.addEventListener('change', refresh);
  }
  dom.light.addEventListener('change', lightChanged);
  // a typed phrase is sent when the field is left or Enter is pressed, not on each key
  dom.lightText.addEventListener('change', refresh);
  // The part and its thickness are one choice: judged when the user leaves the pair (change fires on
  // leaving a field), not on each key, so typing the part first never flashes a missing thickness.
  for (const field of [dom.behind, dom.behindMm]) {
    field.addEventListener('change', () => setTimeout(partChanged, 0));
  }
  // the address keeps the choices (address.js); listened to apart from the refresh above
  for (const control of [dom.sample, dom.emitter, dom.response, dom.convention, dom.solar, dom.behind, dom.behindMm,
    dom.light, dom.lightText]) {
    control.addEventListener('change', () => ui.changed?.());
  }
  const catalogues = loadCatalogues();
  const addressControls = () => ({
    sample: dom.sample, emitter: dom.emitter, response: dom.response, convention: dom.convention,
    behind: dom.behind, behindMm: dom.behindMm, solar: dom.solar,
  });

  return {
    /** The choices as the address keeps them: { sample, emitter, …, light } (empty ones left out). */
    choices() {
      return Object.fromEntries([...Object.entries(addressControls())
        .map(([key, control]) => [key, control.value.trim()]), ['light', lightPhrase() || '']]
        .filter(([, value]) => value !== ''));
    },

    /** Restores choices read from an address; a value the picker does not offer is ignored. */
    async choose(values) {
      await catalogues;
      for (const [key, control] of Object.entries(addressControls())) {
        const value = values?.[key] ?? '';
        if (control.tagName !== 'SELECT') control.value = value;
        else if (value && [...control.options].some((o) => o.value === value)) control.value = value;
      }
      // the light: one of the offered phrases, else typed in words
      const light = values?.light ?? '';
      const offered = [...dom.light.options].some((o) => o.value === light && o.value !== LIGHT_IN_WORDS);
      dom.light.value = offered ? light : LIGHT_IN_WORDS;
      dom.lightText.value = offered ? '' : light;
      dom.lightTextField.hidden = offered;
      await refresh();
    },

    /** Material names offered for the "seen behind" part; the name chosen is sent as its slug. */
    offerParts(materials) {
      const named = (materials || []).filter((m) => m.slug && m.name);
      state.parts = new Map(named.map((m) => [m.name.toLowerCase(), m.slug]));
      el('figure-behind-choices').replaceChildren(...named.map((m) => {
        const o = document.createElement('option');
        o.value = m.name;
        return o;
      }));
    },

    /**
     * A newly opened material: its samples in the picker, the first one chosen (or `sampleId`, the sample a
     * shortlist row was judged on, docs/result-rows.md), figures fetched.
     */
    async showMaterial(material, sampleId = null) {
      state.material = material;
      dom.sample.replaceChildren(...(material.samples || []).map(sampleOption));
      dom.sample.disabled = !material.samples?.length;
      if (sampleId !== null && sampleId !== undefined
        && material.samples?.some((s) => String(s.id) === String(sampleId))) dom.sample.value = choiceValue(sampleId);
      await catalogues; // the chosen emitter and response are known before the first fetch
      if (state.material === material) await refresh();
    },

    /**
     * The rescaled curve drawn in the chart ({ fromSample, thicknessMm }) or null when cleared: offered
     * as a choice of its own and chosen, so the figures follow the thickness the user asked for.
     */
    async showRescaled(rescaled) {
      const was = parseChoice(dom.sample.value);
      dom.sample.querySelectorAll('option[data-rescaled]').forEach((o) => o.remove());
      // Back to the sample it was rescaled from, not whichever option happens to come first.
      if (was) dom.sample.value = choiceValue(was.sampleId);
      if (rescaled) {
        const o = document.createElement('option');
        o.value = choiceValue(rescaled.fromSample.id, rescaled.thicknessMm);
        o.dataset.rescaled = 'true';
        o.textContent = `rescaled to ${fmt.number(rescaled.thicknessMm)} mm (from ${fmt.number(rescaled.fromSample.thicknessMm)} mm)`;
        dom.sample.append(o);
        dom.sample.value = o.value;
      } else if (!dom.sample.value && dom.sample.options.length) {
        dom.sample.selectedIndex = 0;
      }
      await refresh();
    },
  };
}
