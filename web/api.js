// Thin client for the backend's JSON API. Every failure becomes an ApiProblem carrying the
// RFC 9457 fields (title, detail, status, instance), so the page can always show *why*.
import { tidyNumbers } from './polish.js';

export class ApiProblem extends Error {
  constructor({ status, title, detail, instance, type, properties }) {
    super(detail ? `${title}: ${detail}` : title);
    this.name = 'ApiProblem';
    this.status = status;
    this.title = title;
    this.detail = detail;
    this.instance = instance;
    this.type = type;
    // Extension members of the problem (e.g. "position" and "suggestion" for a requirement the
    // server could not read), kept as sent.
    this.properties = properties || {};
  }
}

// Relative URLs keep the page working when the app is served under a context path.
const BASE = 'api';

/**
 * In server mode (docs/accounts-and-roles.md) the server sets the XSRF-TOKEN cookie and refuses a change sent
 * with the session unless the same token comes back in this header. The embedded tool sets no such cookie,
 * and then nothing is added.
 */
export function csrfHeaders() {
  const cookie = document.cookie.split('; ').find((c) => c.startsWith('XSRF-TOKEN='));
  return cookie ? { 'X-XSRF-TOKEN': decodeURIComponent(cookie.slice('XSRF-TOKEN='.length)) } : {};
}

async function getJson(path, init = {}) {
  let response;
  const changes = init.method && init.method !== 'GET' && init.method !== 'HEAD';
  try {
    response = await fetch(path, {
      ...init,
      headers: {
        Accept: 'application/json, application/problem+json',
        ...(changes ? csrfHeaders() : {}),
        ...(init.headers || {}),
      },
    });
  } catch (networkError) {
    throw new ApiProblem({
      status: 0,
      title: 'Server not reachable',
      detail: `${networkError.message} (while fetching ${path})`,
      instance: path,
    });
  }
  if (!response.ok) {
    throw await problemFrom(response, path);
  }
  try {
    return await response.json();
  } catch (parseError) {
    throw new ApiProblem({
      status: response.status,
      title: 'Unreadable answer from the server',
      detail: `${path} did not return valid JSON: ${parseError.message}`,
      instance: path,
    });
  }
}

// A non-2xx answer: prefer the server's problem detail; fall back to the HTTP status line.
async function problemFrom(response, path) {
  let body = null;
  const type = response.headers.get('content-type') || '';
  if (type.includes('json')) {
    try {
      body = await response.json();
    } catch {
      body = null; // the status line below still tells the user what happened
    }
  }
  return new ApiProblem({
    status: body?.status ?? response.status,
    title: body?.title || response.statusText || 'The server refused the request',
    // long floats in a server's words written as the page writes numbers (polish.js)
    detail: tidyNumbers(body?.detail) || `The server could not answer ${path}.`,
    instance: body?.instance || path,
    type: body?.type,
    properties: body && typeof body === 'object' ? body : {},
  });
}

function query(params) {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    if (value !== undefined && value !== null && value !== '') search.set(key, value);
  }
  const text = search.toString();
  return text ? `?${text}` : '';
}

export function listMaterials({ text, materialClass } = {}) {
  return getJson(`${BASE}/materials${query({ q: text, class: materialClass })}`);
}

/**
 * Words and facets over the library (docs/library-search.md): `{ total, hits, facets, generation }`.
 * `facets` maps a dimension (class, geometry, provenance, thickness) to the values chosen; each value is
 * sent as its own parameter, so values of one dimension are alternatives.
 */
export function searchLibrary({ text, facets = {}, limit } = {}) {
  const search = new URLSearchParams();
  if (text) search.set('q', text);
  for (const [dimension, values] of Object.entries(facets)) {
    for (const value of values || []) search.append(dimension, value);
  }
  if (limit) search.set('limit', limit);
  const params = search.toString();
  return getJson(`${BASE}/library${params ? `?${params}` : ''}`);
}

export function getMaterial(id) {
  return getJson(`${BASE}/materials/${encodeURIComponent(id)}`);
}

export function getCurve(sampleId, thicknessMm) {
  return getJson(`${BASE}/samples/${encodeURIComponent(sampleId)}/curve${query({ thicknessMm })}`);
}

/** One of a sample's curves in another state (aged, printed): its points, never rescaled (docs/material-states.md). */
export function getStateCurve(sampleId, stateId) {
  return getJson(`${BASE}/samples/${encodeURIComponent(sampleId)}/states/${encodeURIComponent(stateId)}`);
}

export function curveCsvUrl(sampleId) {
  return `${BASE}/samples/${encodeURIComponent(sampleId)}/curve.csv`;
}

function postJson(path, body) {
  return getJson(path, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify(body),
  });
}

/** The requirement text as the server reads it (structured clauses), or an ApiProblem locating the error. */
export function parseRequirement(text) {
  return postJson(`${BASE}/requirements/parse`, { requirement: text });
}

/** Ranked, explained shortlist for a requirement text. */
export function search(text, limit) {
  return postJson(`${BASE}/search`, { requirement: text, limit });
}

/** The light sources figures can be weighted with: { emitters: [...], caution }. */
export function listEmitters() {
  return getJson(`${BASE}/emitters`);
}

/** The response (action) spectra figures can be weighted with: { responses: [...], caution }. */
export function listResponses() {
  return getJson(`${BASE}/responses`);
}

/**
 * A sample's weighted figures under one emitter × response, at `thicknessMm` when given (rescaled by the
 * server), else at the measured thickness; `light` a statement of how the light arrives ("at 30° incidence",
 * "over a 60° beam"), normal incidence when left out.
 */
export function getFigures(sampleId, { thicknessMm, emitter, response, convention, solar, behind, behindMm, light } = {}) {
  return getJson(`${BASE}/samples/${encodeURIComponent(sampleId)}/figures${query({
    thicknessMm, emitter, response, convention, solar, behind, behindMm, light,
  })}`);
}

/**
 * A sample's transmittance against the angle of incidence at `nm` (0° to 89°, unpolarised, s and p), with the
 * effective transmittance under three spread sources and the Brewster angle (docs/oblique-incidence.md).
 */
export function getAngles(sampleId, { nm, thicknessMm } = {}) {
  return getJson(`${BASE}/samples/${encodeURIComponent(sampleId)}/angles${query({ nm, thicknessMm })}`);
}

/** Imports a source (kind "emitters") or response ("responses") spectrum from a file; answers the stored spectrum. */
export function importSpectrum(kind, { name, file, valueColumn, description }) {
  const form = new FormData();
  form.set('name', name);
  form.set('file', file, file.name);
  if (valueColumn) form.set('valueColumn', valueColumn);
  if (description) form.set('description', description);
  return getJson(`${BASE}/${encodeURIComponent(kind)}`, { method: 'POST', body: form });
}

// ---------- undo without loss (docs/undo.md): nothing is deleted, corrections are revisions ----------

/** `kinds`: 'samples' or 'materials'. Answers { retiredAt, inUse, changed, note }. */
export function retire(kinds, id) {
  return postJson(`${BASE}/${kinds}/${encodeURIComponent(id)}/retire`, {});
}

export function restore(kinds, id) {
  return postJson(`${BASE}/${kinds}/${encodeURIComponent(id)}/restore`, {});
}

/** `fields`: the values to change (text, as typed) and `reason`; answers the new revision. */
export function correct(kinds, id, fields) {
  return postJson(`${BASE}/${kinds}/${encodeURIComponent(id)}/revisions`, fields);
}

export function listRevisions(kinds, id) {
  return getJson(`${BASE}/${kinds}/${encodeURIComponent(id)}/revisions`);
}

export function listRetiredMaterials() {
  return getJson(`${BASE}/materials/retired`);
}

// ---------- curves shaped alike (docs/similar-curves.md, docs/similar-curves-page.md) ----------

/**
 * The stored samples whose curves look most like this sample's: `{ sampleId, metric, band?, warnings?, hits }`.
 * `band` is "FROM-TO" in nm; a server that does not compare within a band answers without a `band` member.
 */
export function similarTo(sampleId, { limit, metric, band } = {}) {
  return getJson(`${BASE}/samples/${encodeURIComponent(sampleId)}/similar${query({ limit, metric, band })}`);
}

/**
 * An unsaved capture (a `File`) compared with the library: `{ query, metric, band, warnings, requirement, hits }`.
 * Only the fields given are sent; the file is read for this answer and not stored.
 */
export function identifyCapture({ file, thicknessMm, bulk, band, metric, limit, requirement }) {
  const form = new FormData();
  form.set('file', file, file.name);
  for (const [key, value] of Object.entries({ thicknessMm, bulk, band, metric, limit, requirement })) {
    if (value !== undefined && value !== null && value !== '') form.set(key, String(value));
  }
  return getJson(`${BASE}/similar`, { method: 'POST', body: form });
}

// ---------- requirement presets (presets.js, docs/presets.md) ----------

export function listPresets() {
  return getJson(`${BASE}/presets`);
}

export function getPreset(key) {
  return getJson(`${BASE}/presets/${encodeURIComponent(key)}`);
}

function presetChange(method, path, body) {
  return getJson(path, { method, headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(body) });
}

export function savePreset({ name, text, note }) {
  return presetChange('POST', `${BASE}/presets`, { name, text, note });
}

export function editPreset(key, { name, text, note }) {
  return presetChange('PUT', `${BASE}/presets/${encodeURIComponent(key)}`, { name, text, note });
}

export function deletePreset(key) {
  return getJson(`${BASE}/presets/${encodeURIComponent(key)}`, { method: 'DELETE' });
}

export function importPresets(file) {
  return presetChange('POST', `${BASE}/presets/import`, file);
}

export const PRESETS_EXPORT_URL = `${BASE}/presets/export`;
