// @ts-check
// The audit trail: filters, the entries newest first, each with a short list of what changed (before → after, in words,
// rounded, with units) and the stored record folded away; the CSV export of the same filter.
import { el, fill, $ } from '../core/dom.js';
import { getJson } from '../core/api.js';
import { frame } from '../core/shell.js';
import { when, unitLabel } from '../core/format.js';

frame('audit.html');

/** At most this many changed fields per entry, so that one entry never fills the screen. */
const shownChanges = 6;
/** A longer text value is cut to this many characters in the list (the folded record keeps it whole). */
const shownText = 60;

const filterForm = /** @type {HTMLFormElement} */ ($('#filters'));
/** @param {string} name */
const field = (name) => /** @type {HTMLInputElement} */ (filterForm.elements.namedItem(name));

/** @type {Record<string, { unit: string, label: string }>} */
const parameters = Object.fromEntries((await getJson('/api/parameters')).map(
  (/** @type {{ name: string, unit: string, label: string }} */ p) => [p.name, { unit: p.unit, label: p.label }]));

const entityWords = {
  product: 'product', context: 'chart', limits: 'limits', 'model-parameters': 'model parameter set', alert: 'alert',
  person: 'person', key: 'tool key', maintenance: 'maintenance', handover: 'shift handover',
};

// Field names in words, with the unit the value carries when the name does not end in one ([words, unit]).
/** @type {Record<string, [string, string?]>} */
const fieldWords = {
  ucl: ['upper control limit'], lcl: ['lower control limit'], sigma: ['σ'], centre: ['centre'],
  points_used: ['points used', 'points'], subgroup_size: ['subgroup size', 'per subgroup'], subgroups: ['subgroups', 'subgroups'],
  recommended_subgroups: ['recommended subgroups', 'subgroups'], flagged_points: ['flagged points', 'points'],
  lower: ['lower spec'], target: ['target'], upper: ['upper spec'], gate_faces: ['gated faces'],
  eot_nm: ['equivalent oxide thickness', 'nm'], channel_doping_cm3: ['channel doping', 'cm⁻³'],
  electrical_concern_mv: ['electrical concern', 'mV'], reaction_plan: ['reaction plan'], p_value: ['p-value'],
  a_squared: ['A²'], a_star: ['A*²'], s: ['S'], z: ['z'], tau: ['τ'], seq: ['point'],
};
// The unit a field name ends in.
/** @type {[string, string][]} */
const suffixes = [['_nm', 'nm'], ['_mv', 'mV'], ['_mm', 'mm'], ['_cm3', 'cm⁻³'], ['_deg', '°'], ['_h', 'h']];
// Fields whose numbers are in the unit of the object they belong to (a limit version's unit, a specification's parameter).
const inObjectUnit = new Set(['centre', 'sigma', 'ucl', 'lcl', 'lower', 'target', 'upper', 'value']);

/** @param {string} name @returns {[string, string | undefined]} the words and the unit of a field name */
function words(name) {
  if (fieldWords[name]) return [fieldWords[name][0], fieldWords[name][1]];
  if (parameters[name]) return [parameters[name].label, parameters[name].unit];
  for (const [suffix, unit] of suffixes) {
    if (name.endsWith(suffix)) return [name.slice(0, -suffix.length).replaceAll('_', ' '), unit];
  }
  return [name.replaceAll('_', ' '), undefined];
}

const superscript = Object.fromEntries([...'0123456789-'].map((c, i) => [c, '⁰¹²³⁴⁵⁶⁷⁸⁹⁻'[i]]));

/** Integers as they are (very large ones as a power of ten), others to at most 4 significant digits. @param {number} v */
function rounded(v) {
  if (Math.abs(v) >= 1e6 || (v !== 0 && Math.abs(v) < 1e-3)) {
    const [mantissa, exponent] = v.toExponential(3).split('e');
    return `${Number(mantissa)} × 10${[...String(Number(exponent))].map((c) => superscript[c]).join('')}`;
  }
  return Number.isInteger(v) ? String(v) : String(Number(v.toPrecision(4)));
}

const isoTime = /^\d{4}-\d\d-\d\dT\d\d:\d\d/;

/** One stored value in words: numbers rounded with their unit, times in the page's one format. @param {unknown} v @param {string | undefined} unit */
function shown(v, unit) {
  if (v === null || v === undefined) return 'none';
  if (typeof v === 'boolean') return v ? 'yes' : 'no';
  if (typeof v === 'number') {
    const u = unitLabel(unit);
    return u === '°' ? `${rounded(v)}°` : u ? `${rounded(v)} ${u}` : rounded(v);
  }
  if (typeof v === 'string') {
    if (isoTime.test(v)) return when(v);
    return v.length > shownText ? `${v.slice(0, shownText)}…` : v;
  }
  if (Array.isArray(v)) return v.length === 0 ? 'none' : shown(v.map((x) => (typeof x === 'object' ? JSON.stringify(x) : String(x))).join('; '), undefined);
  return shown(JSON.stringify(v), undefined);
}

/**
 * The record as a flat list of fields: nested objects by path, lists of objects by their parameter, rule or point
 * (else by position), lists of plain values as one value.
 * @param {unknown} value @param {string[]} path @param {string | undefined} unit
 * @param {Map<string, { label: string, value: unknown, unit: string | undefined }>} out
 */
function flatten(value, path, unit, out) {
  if (value !== null && typeof value === 'object' && !Array.isArray(value)) {
    const o = /** @type {Record<string, unknown>} */ (value);
    const own = typeof o.parameter === 'string' && parameters[o.parameter] ? parameters[o.parameter].unit : typeof o.unit === 'string' ? o.unit : unit;
    for (const [k, v] of Object.entries(o)) {
      if (k === 'parameter' && path.length > 0) continue; // named in the path already
      const [label, fieldUnit] = words(k);
      flatten(v, [...path, label], fieldUnit ?? (inObjectUnit.has(k) ? own : undefined), out);
    }
    return;
  }
  if (Array.isArray(value) && value.some((x) => x !== null && typeof x === 'object')) {
    value.forEach((x, i) => {
      const item = /** @type {Record<string, unknown>} */ (x ?? {});
      const name = typeof item.parameter === 'string' ? words(item.parameter)[0] : item.rule ?? (item.seq !== undefined ? `point ${item.seq}` : `#${i + 1}`);
      flatten(x, [...path, String(name)], unit, out);
    });
    return;
  }
  const key = path.join(' · ');
  out.set(key, { label: key, value, unit });
}

/** @param {string | null} json */
function parsed(json) {
  if (!json) return null;
  try { return JSON.parse(json); } catch { return json; }
}

/** The changed fields of an entry, as "field: before → after", at most shownChanges of them. @param {string | null} before @param {string | null} after */
function changes(before, after) {
  const b = new Map();
  const a = new Map();
  flatten(parsed(before), [], undefined, b);
  flatten(parsed(after), [], undefined, a);
  const keys = [...new Set([...b.keys(), ...a.keys()])]
    .filter((k) => JSON.stringify(b.get(k)?.value ?? null) !== JSON.stringify(a.get(k)?.value ?? null));
  if (keys.length === 0) return el('p', { class: 'muted' }, before || after ? 'no field changed' : 'nothing stored');
  const line = (/** @type {string} */ k) => {
    const was = b.get(k);
    const is = a.get(k);
    return el('li', {}, el('span', { class: 'field' }, `${k}: `),
      before ? el('span', { class: 'was' }, shown(was?.value, was?.unit)) : '', before ? ' → ' : '',
      after ? el('span', { class: 'is' }, shown(is?.value, is?.unit)) : el('span', { class: 'muted' }, 'removed'));
  };
  return el('ul', { class: 'changes' }, keys.slice(0, shownChanges).map(line),
    keys.length > shownChanges ? el('li', { class: 'muted more' }, `and ${keys.length - shownChanges} more`) : '');
}

/** @param {string | null} json */
function pretty(json) {
  const v = parsed(json);
  return v === null ? 'none' : typeof v === 'string' ? v : JSON.stringify(v, null, 1);
}

function query() {
  const q = new URLSearchParams();
  for (const name of ['entity', 'key', 'by']) {
    const v = field(name).value.trim();
    if (v) q.set(name, v);
  }
  for (const name of ['from', 'to']) {
    const v = field(name).value;
    if (v) q.set(name, `${v}:00Z`);
  }
  return q;
}

/** @param {{ id: number, at: string, by: string, entity: string, key: string, action: string, before: string | null, after: string | null }} a */
function row(a) {
  const stored = a.before || a.after
    ? el('details', { class: 'stored' }, el('summary', {}, 'full record'),
      el('div', { class: 'stored-pair' },
        el('div', { class: 'audit-json' }, `before:\n${pretty(a.before)}`),
        el('div', { class: 'audit-json' }, `after:\n${pretty(a.after)}`)))
    : '';
  return el('tr', { dataset: { entry: a.id } },
    el('td', { class: 'nowrap' }, when(a.at)), el('td', {}, a.by), el('td', {}, entityWords[a.entity] ?? a.entity.replaceAll('-', ' ')),
    el('td', {}, a.key), el('td', {}, a.action.replaceAll('-', ' ')),
    el('td', { class: 'audit-change' }, changes(a.before, a.after), stored));
}

async function load() {
  const q = query();
  /** @type {HTMLAnchorElement} */ ($('#csv')).href = `/api/audit/csv?${q}`;
  const rows = await getJson(`/api/audit?${q}`);
  fill(/** @type {HTMLElement} */ ($('#audit tbody')), rows.length === 0 ? el('tr', {}, el('td', { colspan: 6 }, 'Nothing recorded for this filter.')) : rows.map(row));
}

filterForm.addEventListener('submit', (event) => { event.preventDefault(); load(); });
await load();
