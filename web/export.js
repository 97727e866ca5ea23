// Downloads of what the material view shows (docs/page-exports.md): each drawn sample's curve, and the rescaled
// curve when one is drawn, as the project's CSV or JCAMP-DX (the server writes both, with provenance, the
// illustrative note of demo stock and the measurement uncertainty where there is one), and the chart as PNG.

const list = () => document.getElementById('curve-downloads');

/**
 * Lists a download row per curve shown: the material's samples as measured and, when drawn, the rescaled curve
 * at its thickness (the server rescales it again for the file, exactly as for the chart).
 *
 * @param material  the open material (null: nothing open)
 * @param rescaled  { fromSample, thicknessMm } or null
 */
export function showDownloads(material, rescaled) {
  const rows = [];
  for (const sample of material?.samples || []) {
    rows.push(row(`${number(sample.thicknessMm)} mm ${sample.geometry}, as measured`, sample.id, null));
  }
  if (rescaled) {
    rows.push(row(`rescaled to ${number(rescaled.thicknessMm)} mm (from the ${number(rescaled.fromSample.thicknessMm)} mm sample)`,
      rescaled.fromSample.id, rescaled.thicknessMm));
  }
  list().replaceChildren(...rows);
}

/** One download row: `label: CSV · JCAMP-DX`, the server's files of the sample (at `thicknessMm` when not null). */
export function downloadRow(label, sampleId, thicknessMm) {
  return row(label, sampleId, thicknessMm);
}

function row(label, sampleId, thicknessMm) {
  const li = document.createElement('li');
  const name = document.createElement('span');
  name.textContent = `${label}: `;
  li.append(name, link('CSV', sampleId, 'csv', thicknessMm), document.createTextNode(' · '),
    link('JCAMP-DX', sampleId, 'jdx', thicknessMm));
  return li;
}

function link(text, sampleId, extension, thicknessMm) {
  const a = document.createElement('a');
  const query = thicknessMm === null ? '' : `?thicknessMm=${encodeURIComponent(thicknessMm)}`;
  a.href = `api/samples/${encodeURIComponent(sampleId)}/curve.${extension}${query}`;
  a.textContent = text;
  a.dataset.format = extension;
  a.setAttribute('download', '');
  return a;
}

/** 12.5 → "12.5", 0.1000000001 → "0.1": a thickness as a person writes it. */
function number(value) {
  return Number.isFinite(value) ? String(Number(value.toPrecision(6))) : String(value);
}

/**
 * Saves the drawn chart as PNG: uPlot draws series on one canvas; the frame, axes and legend are HTML, so the
 * image holds the curves and grid only, on white, with the material's name as its file name.
 */
export function initChartPng(chartElement, fileStem) {
  document.getElementById('chart-png').addEventListener('click', () => saveChartPng(chartElement, fileStem()));
}

/** Saves the series canvas of the uPlot chart in `chartElement` as `<fileStem>.png`, on white. */
export function saveChartPng(chartElement, fileStem) {
  const canvas = chartElement.querySelector('canvas');
  if (!canvas) return;
  const white = document.createElement('canvas');
  white.width = canvas.width;
  white.height = canvas.height;
  const context = white.getContext('2d');
  context.fillStyle = '#ffffff';
  context.fillRect(0, 0, white.width, white.height);
  context.drawImage(canvas, 0, 0);
  const a = document.createElement('a');
  a.href = white.toDataURL('image/png');
  a.download = `${(fileStem || 'curves').replace(/[^A-Za-z0-9._-]+/g, '-').replace(/^-+|-+$/g, '')}.png`;
  document.body.append(a);
  a.click();
  a.remove();
}
