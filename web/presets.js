// Requirement presets beside the requirement box (docs/presets.md): pick one (built in, shared, mine), read its
// title, reason and source, and its text lands in the requirement box to edit before searching; save the box as
// a preset of one's own, change or delete one's own, copy a share link, export and import a presets file.
// A link /?preset=KEY opens the preset and runs its search. Loaded before app.js, so the address is read here
// before app.js rewrites it in its own form.
import {
  ApiProblem, listPresets, getPreset, savePreset, editPreset, deletePreset, importPresets, PRESETS_EXPORT_URL,
} from './api.js';

const el = (id) => document.getElementById(id);
const linked = new URLSearchParams(window.location.search).get('preset');

const GROUPS = [
  ['catalogue', 'Built in'],
  ['shared', 'Shared with everyone'],
  ['mine', 'My presets'],
];

const dom = {
  pick: el('preset-pick'),
  detail: el('preset-detail'),
  title: el('preset-title'),
  text: el('preset-text'),
  reason: el('preset-reason'),
  source: el('preset-source'),
  note: el('preset-note'),
  caution: el('preset-caution'),
  search: el('preset-search'),
  link: el('preset-link'),
  edit: el('preset-edit'),
  remove: el('preset-delete'),
  saveOpen: el('preset-save-open'),
  form: el('preset-form'),
  formName: el('preset-form-name'),
  formNote: el('preset-form-note'),
  formSubmit: el('preset-form-submit'),
  formCancel: el('preset-form-cancel'),
  exportLink: el('preset-export'),
  importFile: el('preset-import'),
  status: el('preset-status'),
  requirement: el('requirement-text'),
  searchForm: el('search-form'),
};

let presets = [];
let chosen = null;
let editing = null; // the preset the form changes; null: the form saves a new one

function say(text, problem = false) {
  dom.status.textContent = text;
  dom.status.classList.toggle('problem', problem);
  dom.status.hidden = !text;
}

function problemText(error) {
  if (!(error instanceof ApiProblem)) return String(error.message || error);
  const field = error.properties?.parameter;
  return `${error.title}${field ? ` (${field})` : ''}: ${error.detail}`;
}

function optionFor(p) {
  const option = document.createElement('option');
  option.value = p.key;
  // words, not colour alone, mark a safety preset
  option.textContent = p.safety ? `${p.title} — safety caution` : p.title;
  return option;
}

function fill() {
  const keep = chosen?.key;
  const placeholder = document.createElement('option');
  placeholder.value = '';
  placeholder.textContent = 'Choose a preset…';
  const groups = GROUPS.map(([origin, label]) => {
    const members = presets.filter((p) => p.origin === origin);
    if (!members.length) return null;
    const group = document.createElement('optgroup');
    group.label = label;
    group.append(...members.map(optionFor));
    return group;
  }).filter(Boolean);
  dom.pick.replaceChildren(placeholder, ...groups);
  dom.pick.value = presets.some((p) => p.key === keep) ? keep : '';
}

async function reload() {
  try {
    presets = (await listPresets()).presets;
    fill();
  } catch (error) {
    say(`Presets could not be listed. ${problemText(error)}`, true);
  }
}

function show(p) {
  chosen = p;
  dom.detail.hidden = !p;
  if (!p) return;
  const origin = GROUPS.find(([o]) => o === p.origin)?.[1] ?? p.origin;
  dom.title.textContent = `${p.title} (${origin.toLowerCase()})`;
  dom.text.textContent = p.text;
  dom.reason.textContent = p.reason ? `Why: ${p.reason}` : '';
  dom.reason.hidden = !p.reason;
  dom.source.textContent = p.source ? `Source: ${p.source}${p.job ? ` · serves ${p.job}` : ''}` : '';
  dom.source.hidden = !p.source;
  dom.note.textContent = p.note ? `Note: ${p.note}` : '';
  dom.note.hidden = !p.note;
  dom.caution.hidden = !p.caution;
  dom.caution.querySelector('span').textContent = p.caution ?? '';
  const mine = p.origin === 'mine';
  dom.edit.hidden = !mine;
  dom.remove.hidden = !mine;
}

/** The preset's text into the requirement box, where it may be edited before searching. */
function use(p) {
  dom.requirement.value = p.text;
  dom.requirement.dispatchEvent(new Event('input', { bubbles: true })); // search.js reads it as typed
}

function runSearch() {
  dom.searchForm.requestSubmit();
}

function openForm(preset) {
  editing = preset;
  dom.form.hidden = false;
  dom.formName.value = preset ? preset.name : '';
  dom.formNote.value = preset?.note ?? '';
  dom.formSubmit.textContent = preset ? 'Save changes' : 'Save as my preset';
  dom.formName.focus();
}

function closeForm() {
  dom.form.hidden = true;
  editing = null;
}

async function submitForm(event) {
  event.preventDefault();
  const body = { name: dom.formName.value, text: dom.requirement.value, note: dom.formNote.value };
  try {
    const stored = editing ? await editPreset(editing.key, body) : await savePreset(body);
    closeForm();
    await reload();
    dom.pick.value = stored.key;
    show(presets.find((p) => p.key === stored.key) ?? stored);
    say(`Saved “${stored.name}”.`);
  } catch (error) {
    const onText = error instanceof ApiProblem && error.properties?.parameter === 'text';
    say(onText ? `The requirement box does not read as a requirement yet. ${problemText(error)}` : problemText(error), true);
  }
}

async function remove() {
  if (!chosen || chosen.origin !== 'mine') return;
  if (!window.confirm(`Delete the preset “${chosen.name}”? It leaves your list; the library keeps a record.`)) return;
  try {
    await deletePreset(chosen.key);
    say(`Deleted “${chosen.name}”.`);
    show(null);
    await reload();
  } catch (error) {
    say(problemText(error), true);
  }
}

async function copyLink() {
  if (!chosen) return;
  const address = new URL(chosen.link, window.location.href).href;
  try {
    await navigator.clipboard.writeText(address);
    say(`Link copied: ${address}`);
  } catch {
    say(`Copy this link: ${address}`); // no clipboard (an insecure origin, a refused permission): show it
  }
}

async function importFile() {
  const file = dom.importFile.files[0];
  if (!file) return;
  try {
    const answer = await importPresets(JSON.parse(await file.text()));
    say(`Imported ${answer.imported} presets from ${file.name}.`);
    await reload();
  } catch (error) {
    say(error instanceof SyntaxError ? `${file.name} is not a presets file (not JSON).`
      : `Nothing imported from ${file.name}. ${problemText(error)}`, true);
  } finally {
    dom.importFile.value = '';
  }
}

function wire() {
  if (!dom.pick) return; // a page without the presets box
  dom.exportLink.href = PRESETS_EXPORT_URL;
  dom.pick.addEventListener('change', () => {
    const p = presets.find((x) => x.key === dom.pick.value) ?? null;
    show(p);
    if (p) {
      use(p);
      say(`The preset's text is in the requirement box: change it if you wish, then search.`);
    }
  });
  dom.search.addEventListener('click', () => {
    if (chosen) use(chosen);
    runSearch();
  });
  dom.link.addEventListener('click', copyLink);
  dom.edit.addEventListener('click', () => openForm(chosen));
  dom.remove.addEventListener('click', remove);
  dom.saveOpen.addEventListener('click', () => openForm(null));
  dom.formCancel.addEventListener('click', closeForm);
  dom.form.addEventListener('submit', submitForm);
  dom.importFile.addEventListener('change', importFile);
}

async function openLinked(key) {
  try {
    const p = await getPreset(key);
    show(p);
    dom.pick.value = presets.some((x) => x.key === p.key) ? p.key : '';
    use(p);
    runSearch();
  } catch (error) {
    // someone else's private preset answers "not found" like one that never was
    say(`The linked preset “${key}” cannot be opened. ${problemText(error)}`, true);
  }
}

wire();
if (dom.pick) {
  const listed = reload();
  if (linked) {
    // after app.js has restored the rest of the view, so its empty search does not clear this one
    listed.then(() => setTimeout(() => openLinked(linked), 0));
  }
}
