// The printable summary (docs/print-summary.md): a shortlist or a material on paper, black on white, with the
// page's address and the date so a printout leads back to its shareable link, the provenance of every sample,
// and the illustrative and screening notes where they apply. Built from what the page already holds (the
// search answer, the open material, the drawn chart, the figures table) into #print-summary just before
// printing; print.css shows only that section on paper. Every name and note goes in as text, never as HTML.
import * as api from './api.js';
import * as fmt from './format.js';

const el = (id) => document.getElementById(id);

const VERDICT_WORDS = { meets: '✓ meets', unverified: '? unverified', misses: '✗ misses' };

const seen = {
  shortlist: null,    // the last search answer (search.js's `shortlist` event)
  material: null,     // { material, rescaled } as last drawn (app.js's `material-shown` event)
  samples: new Map(), // sample id -> { provenance, thicknessMm, geometry } of the whole library, for the rows
  chosen: null,       // 'shortlist' | 'material' while a button's print runs; null: whatever is shown
  filled: undefined,  // the kind last filled, so a late provenance answer can fill it again
};

const summary = el('print-summary');

el('search-results').addEventListener('shortlist', (event) => {
  seen.shortlist = event.detail;
  learnSamples(event.detail);
});
el('material-detail').addEventListener('material-shown', (event) => {
  seen.material = event.detail;
});

// A print started from the browser's menu fills the summary too; so does print media switched on by a test.
window.addEventListener('beforeprint', () => fill(seen.chosen));
window.addEventListener('afterprint', () => { seen.chosen = null; });
window.matchMedia('print').addEventListener('change', (event) => { if (event.matches) fill(seen.chosen); });

addButton('print-shortlist', 'shortlist', 'a printable summary of this shortlist: requirement, rows, verdicts and notes',
  (button) => el('search-summary').after(button));
addButton('print-material', 'material', 'a printable summary of this material: samples, provenance, chart and figures',
  (button) => el('detail-meta').after(button));

function addButton(id, kind, title, place) {
  const button = document.createElement('button');
  button.type = 'button';
  button.id = id;
  button.className = 'quiet print-button';
  button.textContent = 'Print summary';
  button.title = `Print ${title}`;
  button.addEventListener('click', () => {
    seen.chosen = kind;
    fill(kind);
    window.print();
  });
  place(button);
}

/**
 * The rows carry only sample ids; the library list says each sample's provenance. It comes with the page's own
 * load of the whole library (app.js, `sieve:catalogue`), and is asked for again only for a row of a sample not
 * seen yet (imported since, or a search answered first); a summary already filled is filled again with it.
 */
function learnMaterials(materials) {
  for (const material of materials) {
    for (const s of material.samples || []) seen.samples.set(s.id, s);
  }
  if (seen.filled !== undefined) fill(seen.filled);
}
document.addEventListener('sieve:catalogue', (event) => learnMaterials(event.detail));

async function learnSamples(answer) {
  const unknown = (answer?.results || []).some((r) => !seen.samples.has(r.sampleId));
  if (!unknown) return;
  try {
    learnMaterials(await api.listMaterials());
  } catch (problem) {
    console.error('Provenance for the printable summary', problem); // the summary then says "not known"
  }
}

/** Rebuilds #print-summary for `kind`, or for every view shown when no button chose one. */
export function fill(kind = null) {
  seen.filled = kind;
  const shortlistShown = !el('search-results').hidden && seen.shortlist !== null;
  const materialShown = !el('material-detail').hidden && seen.material !== null;
  const parts = [];
  const what = [];
  if ((kind === 'shortlist' || kind === null) && shortlistShown) {
    parts.push(shortlistPart(seen.shortlist));
    what.push('a shortlist');
  }
  if ((kind === 'material' || kind === null) && materialShown) {
    parts.push(materialPart(seen.material));
    what.push('a material');
  }
  summary.dataset.kind = kind || (what.length === 2 ? 'both' : what.length ? (shortlistShown ? 'shortlist' : 'material') : 'none');
  summary.replaceChildren(
    heading(what.length ? `Spectral Sieve — summary of ${what.join(' and ')}` : 'Spectral Sieve', 'h1'),
    trace(),
    ...(parts.length ? parts.flat() : [paragraph('Nothing to summarise yet: run a search or open a material, then print.')]),
  );
}

// ---------- title: when and from where ----------

function trace() {
  const p = paragraph('', 'print-trace');
  const when = new Date().toISOString().slice(0, 16).replace('T', ' ');
  p.append(`Printed ${when} UTC from `);
  const address = document.createElement('span');
  address.className = 'print-address';
  address.textContent = window.location.href;
  p.append(address, ' — open this address to see the same view.');
  return p;
}

// ---------- a shortlist ----------

function shortlistPart(answer) {
  const out = [heading('Shortlist', 'h2')];
  const asked = el('results-table').dataset.requirement ?? answer.requirement.text;
  out.push(paragraph(`Requirement as written: “${asked}”`, 'print-requirement'));
  const understood = [...el('requirement-clauses').children].map((li) => li.textContent);
  if (understood.length) {
    out.push(paragraph('Understood as:', 'print-label'), list(understood, 'print-clauses'));
  }
  out.push(paragraph(el('search-summary').textContent, 'print-count'));
  const caution = shortlistCaution(answer);
  if (caution) out.push(note('Caution', caution, 'print-caution'));
  if (answer.results.some((r) => isIllustrative(seen.samples.get(r.sampleId)))) out.push(illustrativeNote());
  out.push(resultsTable(answer));
  const hint = el('search-results').querySelector('.hint');
  if (hint) out.push(paragraph(hint.textContent.replace(/\s+/g, ' ').trim(), 'print-hint'));
  return out;
}

/** The API's caution for eye or skin figures; else the page's own, which it shows when a requirement blocks light. */
function shortlistCaution(answer) {
  if (typeof answer.caution === 'string') return answer.caution;
  const shown = el('search-caution');
  return shown && !shown.hidden ? shown.textContent.replace(/^\s*Caution:\s*/, '').replace(/\s+/g, ' ').trim() : null;
}

function resultsTable(answer) {
  const table = document.createElement('table');
  table.className = 'print-table print-results';
  table.append(head(['Rank', 'Material', 'Verdict', 'Thickness', 'Geometry', 'Provenance', 'Worst margin (decades)',
    'Binding clause']));
  const headings = new Map((answer.groups || []).map((g) => [g.group, g.heading]));
  let group = null;
  const body = document.createElement('tbody');
  for (const r of answer.results) {
    if (r.group && r.group !== group) {
      group = r.group;
      body.append(spanningRow(headings.get(group) || group, 8, 'print-group', 'th'));
    }
    const sample = seen.samples.get(r.sampleId);
    const tr = row([
      String(r.rank),
      r.materialName,
      VERDICT_WORDS[r.verdict] || r.verdict,
      thicknessText(r),
      r.geometry || '—',
      sample?.provenance || 'not known',
      r.worstMarginIsBound ? `≤ ${fmt.signedDecades(r.worstMarginDecades)}` : fmt.signedDecades(r.worstMarginDecades),
      r.bindingClause || '—',
    ]);
    tr.children[6].className = 'print-value';
    tr.dataset.verdict = r.verdict;
    body.append(tr, spanningRow(clauseLines(r), 8, 'print-explanations'));
  }
  if (!answer.results.length) body.append(spanningRow('No sample in the library can be judged against this requirement.', 8));
  table.append(body);
  return table;
}

function thicknessText(r) {
  const t = Number.isFinite(r.thicknessMm) ? `${fmt.number(r.thicknessMm)} mm` : '—';
  const range = Array.isArray(r.thicknessRangeMm) && r.thicknessRangeMm.length === 2
    ? ` (feasible ${fmt.number(r.thicknessRangeMm[0])}–${fmt.number(r.thicknessRangeMm[1])} mm)` : '';
  const stock = r.stockThicknesses?.explanation ? `; ${r.stockThicknesses.explanation}` : '';
  return t + range + stock;
}

/** One line per clause: what it asks, the verdict in words, the margin and the server's explanation. */
function clauseLines(r) {
  const ul = document.createElement('ul');
  ul.className = 'print-clause-lines';
  for (const c of r.clauses || []) {
    const li = document.createElement('li');
    const confidence = c.confidence === null || c.confidence === undefined ? '' : `, ${fmt.confidence(c.confidence)}`;
    li.textContent = `${c.text} — ${VERDICT_WORDS[c.verdict] || c.verdict} (margin ${fmt.signedDecades(c.marginDecades)}`
      + ` decades${c.valueIsBound ? ', at the detection limit: a bound' : ''}${confidence}): ${c.explanation || ''}`;
    ul.append(li);
  }
  return ul;
}

// ---------- a material ----------

function materialPart({ material, rescaled }) {
  const out = [heading(material.name, 'h2')];
  out.push(paragraph(el('detail-meta').textContent, 'print-meta'));
  if (material.description) out.push(paragraph(material.description, 'print-description'));
  out.push(facts([
    ['Refractive index', el('detail-index').textContent],
    ['Made in', el('detail-made').textContent],
    ['Provenance', [...new Set(material.samples.map((s) => s.provenance).filter(Boolean))].join(', ') || 'not given'],
  ]));
  if (material.samples.some(isIllustrative)) out.push(illustrativeNote());
  out.push(heading('Samples', 'h3'), samplesTable(material));
  out.push(...chartPart(material, rescaled));
  out.push(...figuresPart());
  return out;
}

function samplesTable(material) {
  const table = document.createElement('table');
  table.className = 'print-table print-samples';
  table.append(head(['Measured thickness', 'Geometry', 'Provenance', 'Where the numbers come from']));
  const body = document.createElement('tbody');
  for (const s of material.samples) {
    body.append(row([
      `${fmt.number(s.thicknessMm)} mm`,
      s.geometry || '—',
      s.provenance || 'not given',
      [s.instrument && `instrument: ${s.instrument}`, s.measuredOn && `measured ${s.measuredOn}`, s.lot && `lot: ${s.lot}`,
        Array.isArray(s.rangeNm) && s.rangeNm.length === 2 && `range ${fmt.number(s.rangeNm[0], 0)}–${fmt.number(s.rangeNm[1], 0)} nm`,
        Number.isFinite(s.detectionLimit) && s.detectionLimit > 0 && `detection limit ${fmt.percent(s.detectionLimit)}`,
        s.notes, s.revision > 1 && `metadata revision ${s.revision}`].filter(Boolean).join(' · ') || '—',
    ]));
  }
  table.append(body);
  return table;
}

/** The drawn chart as a picture that fits the paper, with its axis and curves named in words beneath. */
function chartPart(material, rescaled) {
  const out = [heading('Curves', 'h3')];
  const canvas = el('curve-chart').querySelector('canvas');
  const figure = document.createElement('figure');
  figure.className = 'print-chart';
  if (canvas && canvas.width > 0) {
    const img = document.createElement('img');
    img.src = canvas.toDataURL('image/png');
    img.alt = `Transmittance curves of ${material.name}`;
    figure.append(img);
  }
  const axis = el('axis-mode');
  const caption = document.createElement('figcaption');
  // the legend's first entry is the wavelength axis itself; each curve keeps its line's colour and dash
  const curves = [...el('curve-chart').querySelectorAll('.u-legend .u-series:not(:first-child)')]
    .map((series) => ({ text: series.querySelector('.u-label')?.textContent.trim(), marker: series.querySelector('.u-marker') }))
    .filter((c) => c.text);
  caption.append(paragraph(`Axis: ${axis.options[axis.selectedIndex]?.textContent || axis.value} against wavelength (nm).`));
  if (curves.length) caption.append(paragraph('Curves drawn:'), curveList(curves));
  figure.append(caption);
  out.push(figure);
  if (rescaled) {
    out.push(note('Rescaled curve', `${fmt.number(rescaled.thicknessMm)} mm, computed by the server from the `
      + `${fmt.number(rescaled.fromSample.thicknessMm)} mm sample (surface reflection kept, absorption scaled with `
      + 'path length): a model of that thickness, not a measurement.', 'print-rescaled'));
  }
  const rescaleNote = el('rescale-note').textContent.trim();
  if (rescaleNote) out.push(paragraph(rescaleNote, 'print-hint'));
  return out;
}

/** The figures table as shown, with its choices and, when any figure concerns eyes or skin, the caution. */
function figuresPart() {
  const table = el('figures-table');
  const rows = [...table.querySelectorAll('tbody tr')];
  if (!rows.length) return [];
  const out = [heading('Weighted figures', 'h3')];
  const status = el('figures-status').textContent.trim();
  if (status) out.push(paragraph(status, 'print-count'));
  if (table.querySelector('.hazard-tag')) {
    out.push(note('Caution', el('figures-caution-text').textContent.replace(/\s+/g, ' ').trim(), 'print-caution'));
  }
  const copy = document.createElement('table');
  copy.className = 'print-table print-figures';
  copy.append(head(['Figure', 'Value', 'How it was obtained, or why it is not available']));
  const body = document.createElement('tbody');
  for (const tr of rows) {
    if (tr.classList.contains('group')) {
      body.append(spanningRow(tidy(tr.textContent), 3, 'print-group', 'th'));
      continue;
    }
    const [name, value, how] = [...tr.children];
    const tag = name.querySelector('.hazard-tag');
    const label = tidy([...name.childNodes].filter((n) => n !== tag).map((n) => n.textContent).join(''));
    const copied = row([tag ? `${label} (screening)` : label, tidy(value.textContent), tidy(how.textContent)]);
    copied.children[1].className = 'print-value';
    body.append(copied);
  }
  copy.append(body);
  out.push(copy);
  return out;
}

/** The curves named, each after a short line in its colour and dash, as the chart's legend draws it. */
function curveList(curves) {
  const ul = document.createElement('ul');
  ul.className = 'print-curves';
  for (const { text, marker } of curves) {
    const li = document.createElement('li');
    const swatch = document.createElement('span');
    swatch.className = 'print-swatch';
    swatch.setAttribute('aria-hidden', 'true');
    if (marker) {
      const style = getComputedStyle(marker);
      swatch.style.borderTopColor = style.borderTopColor;
      swatch.style.borderTopStyle = style.borderTopStyle;
    }
    li.append(swatch, text);
    ul.append(li);
  }
  return ul;
}

function tidy(text) {
  return text.replace(/\s+/g, ' ').trim();
}

// ---------- notes ----------

/** Modelled demo stock says so in its provenance and notes; such rows and samples get the illustrative note. */
function isIllustrative(sample) {
  return !!sample && (sample.provenance === 'modelled' || /illustrative/i.test(sample.notes || ''));
}

function illustrativeNote() {
  const page = el('demo-note')?.textContent.replace(/^\s*Demo library:\s*/, '').replace(/\s+/g, ' ').trim();
  return note('Illustrative', page || 'modelled curves of an invented demo stock, not measurements of any real product.',
    'print-illustrative');
}

// ---------- building blocks (text only) ----------

function heading(text, tag) {
  const h = document.createElement(tag);
  h.textContent = text;
  return h;
}

function paragraph(text, className) {
  const p = document.createElement('p');
  p.textContent = text;
  if (className) p.className = className;
  return p;
}

function note(label, text, className) {
  const p = document.createElement('p');
  p.className = `print-note ${className}`;
  const strong = document.createElement('strong');
  strong.textContent = `${label}: `;
  p.append(strong, text);
  return p;
}

function list(items, className) {
  const ul = document.createElement('ul');
  ul.className = className;
  ul.append(...items.map((text) => {
    const li = document.createElement('li');
    li.textContent = text;
    return li;
  }));
  return ul;
}

function facts(pairs) {
  const dl = document.createElement('dl');
  dl.className = 'print-facts';
  for (const [term, value] of pairs) {
    const dt = document.createElement('dt');
    dt.textContent = term;
    const dd = document.createElement('dd');
    dd.textContent = value || '—';
    dl.append(dt, dd);
  }
  return dl;
}

function head(titles) {
  const thead = document.createElement('thead');
  const tr = document.createElement('tr');
  tr.append(...titles.map((t) => {
    const th = document.createElement('th');
    th.scope = 'col';
    th.textContent = t;
    return th;
  }));
  thead.append(tr);
  return thead;
}

function row(texts) {
  const tr = document.createElement('tr');
  tr.append(...texts.map((t) => {
    const td = document.createElement('td');
    td.textContent = t;
    return td;
  }));
  return tr;
}

function spanningRow(content, columns, className, tag = 'td') {
  const tr = document.createElement('tr');
  if (className) tr.className = className;
  const cell = document.createElement(tag);
  if (tag === 'th') cell.scope = 'rowgroup';
  cell.colSpan = columns;
  if (typeof content === 'string') cell.textContent = content;
  else cell.append(content);
  tr.append(cell);
  return tr;
}
