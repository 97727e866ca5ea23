// A sample's curves in other states (docs/material-states.md): under the sample table, each sample's aged and
// printed curves with their descriptions, and a "Plot" toggle that draws a state curve beside the sample's own
// curve. A state curve is drawn in its sample's colour with a dash pattern of its own and its description in the
// legend, so it is told apart by line style and text, not by colour alone (docs/accessibility.md). The sample's own
// curve is always its as-supplied state. Nothing is computed here: the points come from the API as stored.
import * as api from './api.js';
import * as fmt from './format.js';

// One dash pattern per state curve of a sample, none of them the rescaled curve's [7, 4] or the bound's [1, 4].
const STATE_DASHES = [[10, 3, 2, 3], [3, 3], [12, 4], [2, 2, 8, 2]];

function node(tag, className, text) {
  const e = document.createElement(tag);
  if (className) e.className = className;
  if (text !== undefined && text !== null) e.textContent = text;
  return e;
}

/**
 * @param ui.container  the element the list goes into (hidden while the material has no state curves)
 * @param ui.sampleLabel (sample) => the label the sample table and chart use ("3 mm")
 * @param ui.sampleColour (sample) => the sample's colour on the chart
 * @param ui.changed    called with the list of state curves to draw (chart.js curve objects) after each toggle
 * @param ui.problem    called with (problem, context) when a curve cannot be read
 */
export function initStates(ui) {
  let shown = new Map(); // state curve id -> chart curve, for the material on view
  let request = 0;

  function drawn() {
    return [...shown.values()];
  }

  /** Lists the material's state curves (from each sample's `states`); forgets what was plotted before. */
  function showMaterial(material) {
    request++;
    shown = new Map();
    const withStates = (material.samples || []).filter((s) => (s.states || []).length > 0);
    ui.container.replaceChildren();
    ui.container.hidden = withStates.length === 0;
    if (withStates.length === 0) return;
    ui.container.append(node('h4', null, 'Curves in other states'));
    ui.container.append(node('p', 'hint', 'Each sample’s own curve is its as-supplied state (new, or a film’s clear'
      + ' base). These are curves of the same piece aged or printed, as measured: never rescaled.'));
    const list = node('ul', 'state-list');
    for (const sample of withStates) {
      sample.states.forEach((st, i) => list.append(item(material, sample, st, i)));
    }
    ui.container.append(list);
  }

  function item(material, sample, st, i) {
    const li = node('li', 'state-item');
    li.dataset.stateId = st.id;
    const dash = STATE_DASHES[i % STATE_DASHES.length];
    const label = `${ui.sampleLabel(sample)}: ${st.description}`;
    const swatch = node('span', 'state-swatch');
    swatch.setAttribute('aria-hidden', 'true');
    swatch.style.borderTopColor = ui.sampleColour(sample);
    swatch.style.borderTopStyle = dash.length > 2 ? 'dashed' : 'dotted';
    const text = node('span', 'state-text');
    text.append(node('strong', null, `${ui.sampleLabel(sample)} sample,`), ` ${st.description}`);
    const facts = [
      st.thicknessMm != null && `measured at ${fmt.number(st.thicknessMm)} mm`,
      st.cutoffsNm?.['50'] != null && `50 % edge ${fmt.number(st.cutoffsNm['50'], 0)} nm`,
      st.sourceFileName && `from ${st.sourceFileName}`,
    ].filter(Boolean).join(' · ');
    if (facts) text.append(node('span', 'state-facts', ` (${facts})`));
    // a toggle button: its name stays "Plot …" and aria-pressed says whether the curve is drawn
    const plot = node('button', 'quiet state-plot', 'Plot');
    plot.type = 'button';
    plot.setAttribute('aria-pressed', 'false');
    plot.append(node('span', 'visually-hidden', ` ${label} beside the sample’s own curve`));
    plot.addEventListener('click', () => toggle(sample, st, label, dash, plot));
    li.append(swatch, text, plot);
    return li;
  }

  async function toggle(sample, st, label, dash, button) {
    if (shown.has(st.id)) {
      shown.delete(st.id);
      button.setAttribute('aria-pressed', 'false');
      ui.changed(drawn());
      return;
    }
    const mine = request;
    button.disabled = true;
    try {
      const curve = await api.getStateCurve(sample.id, st.id);
      if (mine !== request) return;
      shown.set(st.id, { ...curve, label, color: ui.sampleColour(sample), dash });
      button.setAttribute('aria-pressed', 'true');
      ui.changed(drawn());
    } catch (problem) {
      ui.problem(problem, `Loading the curve ${label}`);
    } finally {
      button.disabled = false;
    }
  }

  return { showMaterial, drawn };
}
