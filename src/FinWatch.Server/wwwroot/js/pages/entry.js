// @ts-check
// Log data: (a) a keyboard-first form for one wafer posted as JSON to POST /api/measurements: product and step fill the
// grid from the product's site plan, tools and chambers are chosen from the values seen before, the operator is whoever
// is signed in, and a check column shows the taper and any value outside the specification or the accepted range
// before anything is sent; (b) below it, folded, a CSV upload to POST /api/measurements/csv with the rejected rows shown
// in place. Batches are all or nothing on the server.
//
// DOM contract for browser tests: the upload's answer goes into #csv-result; on rejection its table has one
// <tr class="bad" data-row="N"> per row the server named (N as the server counts: the CSV header is row 1), with N in
// the first cell and a td.why holding "column: reason (value …)"; a line saying "nothing was stored" (#csv-summary) is above it.
// The grid's rows are tr.site-row; each row's td.check has data-state "fine", "out-of-spec" or "refused" (empty
// while the row is empty), one div.flag per finding and a div.taper with the derived taper.
import { el, fill, $ } from '../core/dom.js';
import { getJson, sendJson, sendText, ApiError } from '../core/api.js';
import { frame, me } from '../core/shell.js';
import { withUnit, when, zoneName, unitLabel } from '../core/format.js';
import { taperDeg, midWidth } from '../core/fin.js';

frame('entry.html');

const HEADER = ['lot_id', 'wafer_slot', 'site_id', 'site_x_mm', 'site_y_mm', 'product', 'step', 'etch_tool', 'etch_chamber', 'liner_tool',
  'liner_chamber', 'metrology_tool', 'measured_at', 'operator', 'top_width_nm', 'bottom_width_nm', 'fin_height_nm', 'corner_radius_nm', 'liner_thickness_nm'];
const SHOW_ALL_UP_TO = 60;   // rows; a larger file shows its bad rows with this many neighbours each side
const NEIGHBOURS = 2;
const MAX_BAD_SHOWN = 200;
const TEXTAREA_LIMIT = 512 * 1024; // characters; a larger file is sent as it is without being copied into the box

// ------------------------------------------------------------------------------------------------------ CSV upload
/** RFC 4180 records as the server counts them: blank lines skipped, the header is record 1. Never throws. */
function parseCsv(text) {
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  const records = [];
  let fields = [];
  let field = '';
  let quoted = false;
  let any = false; // the current record has content (a blank line has none)
  let i = 0;
  const endRecord = () => {
    if (any) { fields.push(field); records.push(fields); }
    fields = []; field = ''; any = false;
  };
  while (i < text.length) {
    const ch = text[i];
    if (quoted) {
      if (ch === '"') {
        if (text[i + 1] === '"') { field += '"'; i += 2; continue; }
        quoted = false; i++; continue;
      }
      field += ch; i++; continue;
    }
    if (ch === '"') { quoted = true; any = true; i++; continue; }
    if (ch === ',') { fields.push(field); field = ''; any = true; i++; continue; }
    if (ch === '\r' || ch === '\n') {
      endRecord();
      i += ch === '\r' && text[i + 1] === '\n' ? 2 : 1;
      continue;
    }
    field += ch; any = true; i++;
  }
  endRecord();
  return records;
}

const csvText = $('#csv-text');
const csvFile = $('#csv-file');
let bigFile = null; // { name, text } of a file too large for the box
let boxFile = null; // name of the file whose text is in the box, until it is edited

function describeSource() {
  const text = bigFile?.text ?? csvText.value;
  const lines = text ? text.split(/\r\n|\r|\n/).filter((l) => l.length).length : 0;
  fill($('#csv-source'), bigFile
    ? `Will send the file ${bigFile.name} (${lines} lines, ${(bigFile.text.length / 1024).toFixed(0)} KiB; too large to show in the box).`
    : lines ? `Will send ${boxFile ? `the file ${boxFile}, as shown in the box` : 'the text in the box'} (${lines} line${lines === 1 ? '' : 's'} incl. the header).` : 'Choose a file or paste CSV text.');
}

csvFile.addEventListener('change', async () => {
  const file = csvFile.files[0];
  if (!file) return;
  const text = await file.text();
  if (text.length > TEXTAREA_LIMIT) {
    bigFile = { name: file.name, text };
    csvText.value = '';
    csvText.placeholder = `${file.name} is loaded (too large to show here); typing here replaces it.`;
  } else {
    bigFile = null;
    boxFile = file.name;
    csvText.value = text;
  }
  describeSource();
});
csvText.addEventListener('input', () => { bigFile = null; boxFile = null; csvFile.value = ''; describeSource(); });
$('#csv-sample').addEventListener('click', () => {
  if (!csvText.value.trim()) csvText.value = `${HEADER.join(',')}\n`;
  bigFile = null;
  boxFile = null;
  csvText.focus();
  describeSource();
});
$('#csv-send').addEventListener('click', upload);
describeSource();

async function upload() {
  const text = bigFile?.text ?? csvText.value;
  const result = $('#csv-result');
  if (!text.trim()) {
    fill(result, el('div', { class: 'problem' }, 'Nothing to send: choose a file or paste CSV text first.'));
    return;
  }
  const button = $('#csv-send');
  button.disabled = true;
  fill(result, el('p', { class: 'muted' }, 'Uploading…'));
  let answer;
  try {
    answer = await sendText('/api/measurements/csv', text, 'text/csv');
  } catch (e) {
    fill(result, el('div', { class: 'problem' }, `The upload did not reach the server (${e.message}). Nothing was stored.`));
    return;
  } finally {
    button.disabled = false;
  }
  if (answer.ok) showAccepted(result, answer.body, lotsIn(text));
  else if (Array.isArray(answer.body?.errors)) showRejected(result, answer.body, text);
  else {
    const p = answer.body;
    fill(result, el('div', { class: 'problem', dataset: { status: answer.status } },
      `${p?.title ?? `The server answered ${answer.status}.`} Nothing was stored.`, p?.detail ? `\n${p.detail}` : ''));
  }
}

function lotsIn(text) {
  const records = parseCsv(text.length > 4_000_000 ? text.slice(0, 4_000_000) : text);
  const at = records[0]?.findIndex((h) => h.trim() === 'lot_id') ?? -1;
  return at < 0 ? [] : [...new Set(records.slice(1).map((r) => r[at]?.trim()).filter(Boolean))];
}

function showAccepted(result, a, lots) {
  fill(result, el('div', { class: 'notice', id: 'csv-accepted', dataset: { batch: a.batch_id } },
    el('strong', {}, `Accepted: ${a.inserted} new row${a.inserted === 1 ? '' : 's'} stored in batch ${a.batch_id}.`),
    el('ul', {},
      el('li', {}, `${a.rows} rows read; ${a.inserted} stored; ${a.already_present} already present (not stored twice)${a.already_present_rows.length ? `: rows ${a.already_present_rows.join(', ')}${a.already_present > a.already_present_rows.length ? ' …' : ''}` : ''}.`),
      a.re_entrant_profiles ? el('li', {}, `${a.re_entrant_profiles} re-entrant profile${a.re_entrant_profiles === 1 ? '' : 's'} (top wider than the foot), flagged.`) : null,
      a.radius_exceeds_max ? el('li', {}, `${a.radius_exceeds_max} site${a.radius_exceeds_max === 1 ? '' : 's'} with a corner radius larger than the top allows, flagged.`) : null,
      el('li', {}, `took ${withUnit(a.duration_ms, 'ms', 0)}`)),
    lots.length ? el('p', {}, 'Lots in the file: ', lots.slice(0, 12).map((l, i) => [i ? ', ' : '', el('a', { href: `lot.html?lot=${encodeURIComponent(l)}` }, l)]), lots.length > 12 ? ` and ${lots.length - 12} more` : '') : null));
}

function showRejected(result, problem, text) {
  const records = parseCsv(text);
  const header = records[0] ?? [];
  const byRow = new Map();
  for (const e of problem.errors) {
    if (!byRow.has(e.row)) byRow.set(e.row, []);
    byRow.get(e.row).push(e);
  }
  const badRows = [...byRow.keys()].sort((a, b) => a - b);
  const shownBad = badRows.slice(0, MAX_BAD_SHOWN);
  // Which rows to show: all of a small file; else the bad ones and their neighbours (row 1 is the header).
  const show = new Set();
  const last = records.length;
  if (last <= SHOW_ALL_UP_TO) for (let r = 2; r <= last; r++) show.add(r);
  for (const r of shownBad) for (let k = r - NEIGHBOURS; k <= r + NEIGHBOURS; k++) if (k >= 2 && k <= last) show.add(k);
  for (const r of shownBad) if (r >= 2) show.add(r); // even one past what the browser parsed
  const columnIndex = (name) => header.findIndex((h) => h.trim().toLowerCase() === String(name ?? '').toLowerCase());
  const width = Math.max(header.length, ...[...show].map((r) => records[r - 1]?.length ?? 0));

  const rows = [];
  let previous = 1;
  const gap = (count) => el('tr', { class: 'gap' }, el('td', { colspan: width + 2 }, `… ${count} row${count === 1 ? '' : 's'} without problems hidden …`));
  let hidden = 0;
  const ordered = [...show].sort((a, b) => a - b);
  if (byRow.has(1)) ordered.unshift(1);
  for (const r of ordered) {
    if (r > 1 && r - previous > 1) {
      const count = Math.min(r, last + 1) - previous - 1;
      if (count > 0) { rows.push(gap(count)); hidden += count; }
    }
    previous = Math.max(previous, r);
    const cells = records[r - 1];
    const errors = byRow.get(r) ?? [];
    const badCols = new Set(errors.map((e) => columnIndex(e.column)).filter((i) => i >= 0));
    const attrs = errors.length ? { class: 'bad', dataset: { row: r } } : { dataset: { row: r } };
    rows.push(el('tr', attrs,
      el('td', { class: 'num row-no' }, r),
      errors.length
        ? el('td', { class: 'why' }, errors.map((e) => el('div', {}, whyText(e))), cells ? null : el('div', {}, '(the browser could not find this row in the text)'))
        : el('td', { class: 'ok' }, ''),
      Array.from({ length: width }, (_, i) => el('td', { class: badCols.has(i) ? 'bad-cell' : null }, cells ? (cells[i] ?? '') : ''))));
  }
  if (last > previous) { rows.push(gap(last - previous)); hidden += last - previous; }

  const more = problem.error_count > problem.errors.length ? ` The server listed the first ${problem.errors.length} of ${problem.error_count} problems.` : '';
  fill(result,
    el('div', { class: 'problem', id: 'csv-summary' },
      el('strong', {}, 'Rejected: nothing was stored. '),
      byRow.has(1) && badRows.length === 1
        ? `The header row (row 1) has ${problem.error_count} problem${problem.error_count === 1 ? '' : 's'}, so no data row was checked.${more} Correct the header and upload the whole file again.`
        : `${problem.error_count} problem${problem.error_count === 1 ? '' : 's'} in ${badRows.length} row${badRows.length === 1 ? '' : 's'} of ${problem.rows_read} data row${problem.rows_read === 1 ? '' : 's'} read (row numbers count the header as row 1).${more} Correct the marked rows and upload the whole file again.`),
    hidden || badRows.length > shownBad.length
      ? el('p', { class: 'muted', id: 'csv-hidden' }, `Shown: the bad rows with ${NEIGHBOURS} neighbours each side; ${hidden} row${hidden === 1 ? '' : 's'} hidden${badRows.length > shownBad.length ? `, and ${badRows.length - shownBad.length} further bad rows not shown` : ''}.`)
      : null,
    el('div', { class: 'table-box csv-rows' },
      el('table', { id: 'csv-rows' },
        el('thead', {}, el('tr', {}, el('th', { class: 'num' }, 'row'), el('th', {}, 'problem'), Array.from({ length: width }, (_, i) => el('th', {}, header[i] ?? `(field ${i + 1})`)))),
        el('tbody', {}, rows))));
}

function whyText(e) {
  const where = e.column ? `${e.column}: ` : '';
  const value = e.value != null && e.value !== e.column ? ` (value “${e.value}”)` : '';
  return `${where}${e.reason}${value}`;
}

// ------------------------------------------------------------------------------------------------- manual entry
const form = /** @type {HTMLFormElement} */ ($('#manual-form'));
const grid = /** @type {HTMLElement} */ ($('#site-grid tbody'));
const siteFields = ['site_id', 'site_x_mm', 'site_y_mm'];
const valueFields = ['top_width_nm', 'bottom_width_nm', 'fin_height_nm', 'corner_radius_nm', 'liner_thickness_nm'];
const gridFields = [...siteFields, ...valueFields];
const choiceFields = ['step', 'etch_tool', 'etch_chamber', 'liner_tool', 'liner_chamber', 'metrology_tool'];
const headFields = ['product', 'lot_id', 'wafer_slot', 'measured_at', ...choiceFields];
const remembered = ['product', 'step', 'etch_tool', 'etch_chamber', 'liner_tool', 'liner_chamber', 'metrology_tool'];
const nouns = { step: 'step', etch_tool: 'etch tool', etch_chamber: 'etch chamber', liner_tool: 'liner tool', liner_chamber: 'liner chamber', metrology_tool: 'metrology tool' };
const gridLabels = { site_id: 'site id', site_x_mm: 'x', site_y_mm: 'y', top_width_nm: 'top width', bottom_width_nm: 'bottom width',
  fin_height_nm: 'height', corner_radius_nm: 'corner radius', liner_thickness_nm: 'liner' };
const STORE_KEY = 'finwatch.entry.head';
// The value of a choice's "another …" option: a control character, which no stored value can contain.
const ANOTHER = '\u0001another';

/** @param {string} field @returns {any} */
const headInput = (field) => form.querySelector(`.entry-head [data-field="${field}"]`);
/** @param {Element} tr @param {string} field @returns {any} */
const cell = (tr, field) => tr.querySelector(`[data-field="${field}"]`);

// What ingest checks every row against (GET /api/measurements/ranges), and the parameters' labels and units.
const [ranges, parameters, who] = await Promise.all([getJson('/api/measurements/ranges'), getJson('/api/parameters'), me]);
/** @type {Record<string, { field: string, low: number, high: number, low_inclusive: boolean, unit: string }>} */
const rangeOf = Object.fromEntries(ranges.values.map((/** @type {any} */ r) => [r.field, r]));
/** @type {Record<string, { name: string, unit: string, label: string }>} */
const parameterOf = Object.fromEntries(parameters.map((/** @type {any} */ p) => [p.name, p]));
const numberPattern = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** null when fine, else the reason, worded like the server's. @param {string} field @param {string} text */
function checkNumber(field, text) {
  const r = rangeOf[field];
  if (text.includes(',')) return "not a number (use '.' as the decimal separator)";
  const v = Number(text);
  if (!numberPattern.test(text) || !Number.isFinite(v)) return 'not a number';
  const lowOk = r.low_inclusive ? v >= r.low : v > r.low;
  if (!lowOk || v > r.high) return `out of range: expected ${r.low} ${r.low_inclusive ? '≤' : '<'} value ≤ ${r.high} ${r.unit}`;
  return null;
}

/** @param {string} text @param {boolean} required */
function checkText(text, required) {
  if (!text) return required ? 'a value is required' : null;
  if (text.length > ranges.max_text_length) return `longer than ${ranges.max_text_length} characters`;
  // eslint-disable-next-line no-control-regex
  if (/[\u0000-\u001f\u007f]/.test(text)) return 'contains a control character';
  return null;
}

// ------------------------------------------------------------------ measured at: the browser's zone, sent as UTC
const pad = (/** @type {number} */ n) => String(Math.abs(n)).padStart(2, '0');

/** A time as the picker shows it, in the browser's zone: 2026-11-20T09:00:04. @param {Date} d */
function pickerValue(d) {
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}:${pad(d.getSeconds())}`;
}

/** The picker's local time as UTC ISO 8601, or null when it holds no time. */
function measuredAtUtc() {
  const v = headInput('measured_at').value;
  const d = v ? new Date(v) : null; // a date-time without a zone is read in the browser's zone
  return d && !Number.isNaN(d.getTime()) ? d.toISOString() : null;
}

function checkTime() {
  const iso = measuredAtUtc();
  if (!iso) return 'a date and time are required';
  const t = Date.parse(iso);
  if (t > Date.now() + ranges.future_tolerance_minutes * 60_000) return `the time lies more than ${ranges.future_tolerance_minutes} min in the future`;
  if (t < Date.UTC(2000, 0, 1)) return 'the time is before the year 2000';
  return null;
}

const offsetMin = -new Date().getTimezoneOffset();
const offsetText = `UTC${offsetMin < 0 ? '−' : '+'}${pad(Math.trunc(offsetMin / 60))}:${pad(offsetMin % 60)}`;
fill($('#m-measured-at-label'), `Measured at (${zoneName}, ${offsetText})`);
const setNow = () => { headInput('measured_at').value = pickerValue(new Date()); };
setNow();
$('#m-now').addEventListener('click', () => { setNow(); checkHead('measured_at'); });

// -------------------------------------------------------------------------------------------- operator: who signed in
const operator = who.signed_in && who.via !== 'display' ? who.name : null;
fill($('#m-operator'), operator ?? 'not signed in');
$('#m-operator').title = operator ? 'Rows are stored with the name you signed in with.' : '';

// ------------------------------------------------------------------------- choices: known values or "another …"
/** The value a choice sends: the chosen known value, or what was typed after choosing "another …". @param {string} field */
function choiceValue(field) {
  const select = headInput(field);
  return select.value === ANOTHER ? select.parentElement.querySelector('.choice-new').value.trim() : select.value;
}

/**
 * Offers the known values (keeping the current one, also a typed new one), then "another …".
 * @param {string} field @param {string[]} values @param {string} [wanted] the value to choose when it is offered
 */
function setChoices(field, values, wanted) {
  const select = headInput(field);
  const current = wanted ?? choiceValue(field);
  const list = [...values];
  if (current && !list.includes(current)) list.push(current);
  const required = field === 'step';
  fill(select, el('option', { value: '' }, required ? '— choose —' : '— none —'), list.map((v) => el('option', { value: v }, v)),
    el('option', { value: ANOTHER }, `another ${nouns[field]}…`));
  select.value = current ?? '';
  showAnother(select);
}

/** @param {HTMLSelectElement} select */
function showAnother(select) {
  const input = select.parentElement?.querySelector('.choice-new');
  input?.classList.toggle('hidden', select.value !== ANOTHER);
}

/** @type {{ steps: string[], etch_tools: { tool: string, chambers: string[] }[], liner_tools: { tool: string, chambers: string[] }[], metrology_tools: string[] }} */
let known = { steps: [], etch_tools: [], liner_tools: [], metrology_tools: [] };
/** @param {{ tool: string, chambers: string[] }[]} tools @param {string} tool */
const chambersOf = (tools, tool) => [...new Set(tools.filter((t) => !tool || t.tool === tool).flatMap((t) => t.chambers))].sort();

function offerChambers() {
  setChoices('etch_chamber', chambersOf(known.etch_tools, choiceValue('etch_tool')));
  setChoices('liner_chamber', chambersOf(known.liner_tools, choiceValue('liner_tool')));
}

// --------------------------------------------------------------------------------- product, step and site plan
/** @type {any} */
let product = null;
/** @type {Map<string, { step: string, sites: { site_id: string, site_x_mm: number, site_y_mm: number }[], updated_at: string, updated_by: string }>} */
let plans = new Map();
let asked = 0; // answers to an older choice are dropped

/** @type {Record<string, string>} */
let saved = {};
try { saved = JSON.parse(localStorage.getItem(STORE_KEY) ?? '{}'); } catch { /* nothing remembered */ }

try {
  const products = await getJson('/api/products');
  fill(headInput('product'), el('option', { value: '' }, '— choose —'), products.map((/** @type {any} */ p) => el('option', { value: p.code }, `${p.code} · ${p.name}`)));
  if (saved.product && products.some((/** @type {any} */ p) => p.code === saved.product)) headInput('product').value = saved.product;
} catch (e) {
  fill($('#m-product-msg'), `the products could not be loaded: ${e instanceof Error ? e.message : e}`);
}

async function productChanged(wantedStep = choiceValue('step')) {
  const code = headInput('product').value;
  const mine = ++asked;
  product = null;
  plans = new Map();
  if (!code) {
    known = { steps: [], etch_tools: [], liner_tools: [], metrology_tools: [] };
    setChoices('step', [], wantedStep);
    return stepChanged();
  }
  const c = encodeURIComponent(code);
  const [p, sitePlans, steps] = await Promise.all([getJson(`/api/products/${c}`), getJson(`/api/products/${c}/site-plans`),
    getJson(`/api/measurements/known-values?product=${c}`)]);
  if (mine !== asked) return;
  product = p;
  plans = new Map(sitePlans.plans.map((/** @type {any} */ x) => [x.step, x]));
  const stepNames = steps.steps;
  const first = wantedStep || stepNames.find((/** @type {string} */ s) => plans.has(s)) || stepNames[0] || '';
  setChoices('step', stepNames, first);
  await stepChanged();
}

async function stepChanged() {
  const code = headInput('product').value;
  const step = choiceValue('step');
  const mine = ++asked;
  const query = new URLSearchParams();
  if (code) query.set('product', code);
  if (step) query.set('step', step);
  // Without a product nothing is offered yet (and the whole history is not searched for it).
  const values = code ? await getJson(`/api/measurements/known-values?${query}`) : { steps: [], etch_tools: [], liner_tools: [], metrology_tools: [] };
  if (mine !== asked) return;
  known = values;
  setChoices('etch_tool', known.etch_tools.map((t) => t.tool), saved.etch_tool);
  setChoices('liner_tool', known.liner_tools.map((t) => t.tool), saved.liner_tool);
  offerChambers();
  for (const f of ['etch_chamber', 'liner_chamber']) if (saved[f] && !choiceValue(f)) setChoices(f, chambersOf(f === 'etch_chamber' ? known.etch_tools : known.liner_tools, choiceValue(f.replace('chamber', 'tool'))), saved[f]);
  setChoices('metrology_tool', known.metrology_tools, saved.metrology_tool);
  saved = {}; // remembered values apply to the first load only; afterwards the choices keep what is chosen
  applyPlan();
}

const hasValues = () => [...grid.children].some((tr) => valueFields.some((f) => cell(tr, f).value.trim()));

/** Fills the site columns from the plan of the chosen product and step, unless values are typed in the grid already. */
function applyPlan() {
  const code = headInput('product').value;
  const step = choiceValue('step');
  const plan = plans.get(step);
  const note = $('#plan-note');
  if (hasValues()) {
    fill(note, `The grid keeps its sites because measured values are typed in it; “Clear the values” loads the plan of ${code || 'the product'} at ${step || 'the step'}.`);
    recheckAll();
    return;
  }
  grid.replaceChildren();
  if (plan && plan.sites.length) {
    for (const s of plan.sites) {
      const tr = addRow();
      cell(tr, 'site_id').value = s.site_id;
      cell(tr, 'site_x_mm').value = String(s.site_x_mm);
      cell(tr, 'site_y_mm').value = String(s.site_y_mm);
      lockSites(tr, true);
    }
    fill(note, `${plan.sites.length} sites from the site plan of ${code} at ${step} (last changed ${when(plan.updated_at)} by ${plan.updated_by}): type the measured values.`);
  } else {
    cell(addRow(), 'site_id').value = 'S01';
    fill(note, code && step
      ? `No site plan for ${code} at ${step}: type the site ids and positions${mayPlan() ? ', then save them as the plan below' : ''}.`
      : 'Choose the product and step: the sites of its plan fill the grid.');
  }
  planEditor();
}

/** @param {Element} tr @param {boolean} locked */
function lockSites(tr, locked) {
  for (const f of siteFields) {
    const input = cell(tr, f);
    input.readOnly = locked;
    input.tabIndex = locked ? -1 : 0;
    input.classList.toggle('planned', locked);
  }
}

headInput('product').addEventListener('change', () => { productChanged('').catch(showLoadProblem); });
form.addEventListener('change', (e) => {
  const target = /** @type {HTMLElement} */ (e.target);
  if (!(target instanceof HTMLSelectElement) || !target.closest('.choice')) return;
  showAnother(target);
  if (target.dataset.field === 'step') stepChanged().catch(showLoadProblem);
  if (target.dataset.field === 'etch_tool' || target.dataset.field === 'liner_tool') offerChambers();
});
$('#m-step-new').addEventListener('change', () => { stepChanged().catch(showLoadProblem); });

/** @param {unknown} e */
function showLoadProblem(e) {
  fill($('#plan-note'), el('span', { class: 'problem' }, `The product's plan and known values could not be loaded: ${e instanceof Error ? e.message : e}`));
}

// ---------------------------------------------------------------------------------------------------------- grid
/** @param {Element} [from] the row to continue the site numbering from */
function addRow(from) {
  const index = grid.children.length + 1;
  const tr = el('tr', { class: 'site-row', dataset: { index } },
    el('td', { class: 'num muted' }, index),
    gridFields.map((f) => el('td', {}, el('input', {
      type: 'text', inputmode: f === 'site_id' ? null : 'decimal', spellcheck: 'false', 'data-field': f,
      class: f === 'site_id' ? 'cell id' : siteFields.includes(f) ? 'cell pos' : 'cell', 'aria-label': `row ${index} ${gridLabels[f]}`,
    }))),
    el('td', { class: 'check', dataset: { state: '' } }),
    el('td', {}, el('button', { type: 'button', class: 'quiet remove', tabindex: '-1', 'aria-label': `remove row ${index}` }, '×')));
  if (from) {
    const id = cell(from, 'site_id').value.trim();
    const m = /^(.*?)(\d+)$/.exec(id);
    if (m) cell(tr, 'site_id').value = m[1] + String(Number(m[2]) + 1).padStart(m[2].length, '0');
  }
  grid.append(tr);
  return tr;
}

function renumber() {
  [...grid.children].forEach((tr, i) => {
    const row = /** @type {HTMLElement} */ (tr);
    row.dataset.index = String(i + 1);
    if (row.firstChild) row.firstChild.textContent = String(i + 1);
  });
}

grid.addEventListener('click', (e) => {
  const button = /** @type {HTMLElement} */ (e.target).closest('button.remove');
  if (!button) return;
  button.closest('tr')?.remove();
  if (grid.children.length === 0) addRow();
  renumber();
});

/** @param {Element} tr */
const rowEmpty = (tr) => gridFields.every((f) => !cell(tr, f).value.trim());
/** A row without any measured value is not sent (a site of the plan that was not measured). @param {Element} tr */
const unmeasured = (tr) => valueFields.every((f) => !cell(tr, f).value.trim());
const fieldsInOrder = () => /** @type {HTMLElement[]} */ ([...form.querySelectorAll('.entry-head input:not(.hidden), .entry-head select, #site-grid input:not([readonly])')]);

form.addEventListener('keydown', (e) => {
  const target = e.target;
  if (e.key === 'Enter' && (e.ctrlKey || e.metaKey)) { e.preventDefault(); form.requestSubmit(); return; }
  if (!(target instanceof HTMLInputElement || target instanceof HTMLSelectElement)) return;
  const inGrid = target.closest('#site-grid');
  const tr = target.closest('tr');
  if (inGrid && tr && (e.key === 'ArrowDown' || e.key === 'ArrowUp')) {
    e.preventDefault();
    const next = e.key === 'ArrowDown' ? tr.nextElementSibling ?? (rowEmpty(tr) || planned(tr) ? null : addRow(tr)) : tr.previousElementSibling;
    /** @type {HTMLInputElement | null | undefined} */ (next?.querySelector(`[data-field="${target.dataset.field}"]`))?.focus();
    return;
  }
  const forward = (e.key === 'Enter' && !e.shiftKey) || (e.key === 'Tab' && !e.shiftKey);
  const backward = (e.key === 'Enter' && e.shiftKey);
  if (!forward && !backward) return;
  const order = fieldsInOrder();
  const at = order.indexOf(target);
  if (forward && at === order.length - 1 && inGrid && tr) {
    // Leaving the last cell of the last row: a plan's grid (or an empty row) goes on to the store button; a grid typed
    // by hand gets a new row (the next site id filled in).
    if (rowEmpty(tr) || planned(tr)) {
      checkRow(tr);
      if (e.key === 'Enter') { e.preventDefault(); $('#m-submit').focus(); }
      return;
    }
    e.preventDefault();
    checkRow(tr);
    const fresh = addRow(tr);
    cell(fresh, cell(fresh, 'site_id').value ? 'site_x_mm' : 'site_id').focus();
    return;
  }
  if (e.key === 'Tab') return; // the browser moves focus in the same order; focusout checks the cell
  e.preventDefault();
  const next = order[at + (forward ? 1 : -1)];
  if (inGrid && tr && next?.closest('tr') !== tr) checkRow(tr);
  if (next) { next.focus(); if (next instanceof HTMLInputElement && next.type === 'text') next.select(); }
});

/** @param {Element} tr */
const planned = (tr) => cell(tr, 'site_id').readOnly;

form.addEventListener('focusout', (e) => {
  const target = /** @type {HTMLElement} */ (e.target);
  const f = target.dataset?.field;
  if (!f) return;
  if (target.closest('#site-grid')) checkCell(/** @type {HTMLInputElement} */ (target));
  else if (headInput(f)?.value || headInput(f)?.title) checkHead(f); // an empty field passed by is said on sending, not on leaving
});
form.addEventListener('input', (e) => {
  // The check column follows the typing (the taper and the specification as soon as the values allow), and a mark
  // goes as soon as the value is right, so nothing moves under the pointer when the field is left.
  const target = /** @type {HTMLInputElement} */ (e.target);
  const tr = target.closest('#site-grid tr');
  if (tr && target.title) checkCell(target);
  else if (tr) rowMessage(tr);
  else if (target.dataset?.field && target.title) checkHead(target.dataset.field);
});

/** @param {HTMLElement} input @param {Element | null} msgNode @param {string | null} text */
function setMessage(input, msgNode, text) {
  input.classList.toggle('invalid', Boolean(text));
  if (text) input.setAttribute('aria-invalid', 'true'); else input.removeAttribute('aria-invalid');
  input.title = text ?? '';
  if (msgNode) fill(msgNode, text ?? '');
}

/** @param {string} field */
function checkHead(field) {
  const input = headInput(field);
  if (!input) return true;
  const v = choiceFields.includes(field) ? choiceValue(field) : input.value.trim();
  let why = null;
  if (field === 'wafer_slot') why = !v ? 'a value is required' : !/^\d+$/.test(v) ? 'not a whole number' : Number(v) < 1 || Number(v) > ranges.max_wafer_slot ? `wafer slot must be 1 to ${ranges.max_wafer_slot}` : null;
  else if (field === 'measured_at') why = checkTime();
  else why = checkText(v, ['lot_id', 'product', 'step'].includes(field));
  setMessage(input, $(`#${input.id}-msg`), why);
  return !why;
}

/** Checks one grid cell alone; returns its reason or null. @param {HTMLInputElement} input */
function cellReason(input) {
  const f = input.dataset.field ?? '';
  const v = input.value.trim();
  const tr = input.closest('tr');
  if (!tr || unmeasured(tr)) return null;
  if (f === 'site_id') {
    const why = checkText(v, true);
    if (why) return why;
    const twice = [...grid.querySelectorAll('[data-field="site_id"]')].filter((x) => x !== input && /** @type {HTMLInputElement} */ (x).value.trim() === v && !unmeasured(/** @type {Element} */ (x.closest('tr'))));
    return twice.length ? 'the same site id appears twice on this wafer' : null;
  }
  if (!v) return f === 'site_x_mm' || f === 'site_y_mm' ? 'a value is required' : null;
  return checkNumber(f, v);
}

/** @param {HTMLInputElement} input */
function checkCell(input) {
  const why = cellReason(input);
  setMessage(input, null, why);
  const tr = input.closest('tr');
  if (tr) rowMessage(tr);
  return !why;
}

/**
 * The row's values that pass the range check, with the derived taper and mid-height width (docs/model.md §A, the
 * server's formulas in js/core/fin.js). @param {Element} tr @returns {Record<string, number | null>}
 */
function rowValues(tr) {
  /** @type {Record<string, number | null>} */
  const v = {};
  for (const f of valueFields) {
    const text = cell(tr, f).value.trim();
    v[f] = text && !checkNumber(f, text) ? Number(text) : null;
  }
  const wt = v.top_width_nm ?? undefined;
  const wb = v.bottom_width_nm ?? undefined;
  v.taper_deg = v.fin_height_nm != null ? taperDeg(wt, wb, v.fin_height_nm) : null;
  v.mid_width_nm = midWidth(wt, wb);
  return v;
}

/**
 * The check column: the taper, then each finding in words with its mark: refused (the server would not store the
 * row), above or below the product's specification (stored, but out of specification), or within specification.
 * @param {Element} tr @param {string[]} [extra] reasons the server gave @param {boolean} [full] check the whole row
 */
function rowMessage(tr, extra = [], full = false) {
  const row = /** @type {HTMLElement} */ (tr);
  if (full) row.dataset.checked = 'full';
  full = full || row.dataset.checked === 'full'; // once the whole row was checked, keep its row-level reasons
  /** @type {{ kind: string, text: string }[]} */
  const flags = [];
  for (const input of tr.querySelectorAll('input[data-field]')) {
    const i = /** @type {HTMLInputElement} */ (input);
    if (i.title) flags.push({ kind: 'refused', text: `will be refused: ${gridLabels[i.dataset.field ?? '']} ${i.value.trim() ? `“${i.value.trim()}” ` : ''}${i.title}` });
  }
  let taper = null;
  if (!rowEmpty(tr)) {
    const get = (/** @type {string} */ f) => cell(tr, f).value.trim();
    if (unmeasured(tr)) flags.push({ kind: 'note', text: full ? 'no value typed: this site is left out' : 'waiting for values' });
    const x = Number(get('site_x_mm'));
    const y = Number(get('site_y_mm'));
    if (get('site_x_mm') && get('site_y_mm') && Number.isFinite(x) && Number.isFinite(y) && Math.hypot(x, y) > ranges.wafer_radius_mm) {
      flags.push({ kind: 'refused', text: `will be refused: the site (${x} mm, ${y} mm) lies outside the wafer (radius ${ranges.wafer_radius_mm} mm)` });
      cell(tr, 'site_x_mm').classList.add('invalid');
    }
    const v = rowValues(tr);
    taper = v.taper_deg;
    for (const s of product?.specs ?? []) {
      const value = v[s.parameter];
      if (value == null) continue;
      const p = parameterOf[s.parameter];
      const label = p?.label ?? s.parameter;
      const unit = p?.unit ?? '';
      if (s.upper != null && value > s.upper) flags.push({ kind: 'above', text: `above specification: ${label} ${withUnit(value, unit, 2)} > upper limit ${withUnit(s.upper, unit, 2)}` });
      if (s.lower != null && value < s.lower) flags.push({ kind: 'below', text: `below specification: ${label} ${withUnit(value, unit, 2)} < lower limit ${withUnit(s.lower, unit, 2)}` });
    }
    if (v.top_width_nm != null && v.bottom_width_nm != null && v.top_width_nm > v.bottom_width_nm) flags.push({ kind: 'note', text: 'note: top wider than the foot (re-entrant); it will be stored and flagged' });
    const measured = valueFields.some((f) => v[f] != null);
    if (measured && !flags.some((f) => f.kind !== 'note')) flags.push({ kind: 'fine', text: product?.specs?.length ? 'within specification' : 'accepted ranges met (no specification to compare)' });
  }
  for (const text of extra) flags.push({ kind: 'refused', text });
  const state = flags.some((f) => f.kind === 'refused') ? 'refused' : flags.some((f) => f.kind === 'above' || f.kind === 'below') ? 'out-of-spec' : flags.some((f) => f.kind === 'fine') ? 'fine' : '';
  const check = /** @type {HTMLElement} */ (tr.querySelector('td.check'));
  check.dataset.state = state;
  fill(check, taper != null ? el('div', { class: 'taper' }, `taper ${withUnit(taper, unitLabel('deg'), 2)}`) : null,
    flags.map((f) => el('div', { class: `flag ${f.kind}` }, f.text)));
  tr.classList.toggle('bad', state === 'refused');
  return state !== 'refused';
}

/** @param {Element} tr */
function checkRow(tr) {
  if (!tr) return true;
  let ok = true;
  for (const input of tr.querySelectorAll('input[data-field]')) {
    const why = cellReason(/** @type {HTMLInputElement} */ (input));
    setMessage(/** @type {HTMLElement} */ (input), null, why);
    if (why) ok = false;
  }
  return rowMessage(tr, [], true) && ok;
}

function recheckAll() {
  for (const tr of grid.children) rowMessage(tr);
}

form.addEventListener('submit', async (e) => {
  e.preventDefault();
  const result = /** @type {HTMLElement} */ ($('#manual-result'));
  let ok = true;
  for (const f of headFields) ok = checkHead(f) && ok;
  const rows = [...grid.children].filter((tr) => !unmeasured(tr));
  for (const tr of grid.children) ok = checkRow(tr) && ok;
  if (!operator) {
    fill(result, el('div', { class: 'problem' }, 'Sign in with your own name first: rows are stored with the operator who signed in.'));
    return;
  }
  if (rows.length === 0) {
    fill(result, el('div', { class: 'problem' }, 'No measured value typed in the grid: nothing to store.'));
    return;
  }
  if (!ok) {
    fill(result, el('div', { class: 'problem' }, 'Not sent: correct the marked fields first (the reasons are beside them and in the check column). Nothing was stored.'));
    /** @type {HTMLElement | null} */ (form.querySelector('.invalid'))?.focus();
    return;
  }
  /** @type {Record<string, string | number>} */
  const head = { operator };
  for (const f of headFields) {
    const v = f === 'measured_at' ? measuredAtUtc() : choiceFields.includes(f) ? choiceValue(f) : headInput(f).value.trim();
    if (v) head[f] = f === 'wafer_slot' ? Number(v) : v;
  }
  const body = rows.map((tr) => {
    /** @type {Record<string, string | number>} */
    const row = { ...head };
    for (const f of gridFields) {
      const v = cell(tr, f).value.trim();
      if (v) row[f] = f === 'site_id' ? v : Number(v);
    }
    return row;
  });
  try {
    localStorage.setItem(STORE_KEY, JSON.stringify(Object.fromEntries(remembered.map((f) => [f, choiceFields.includes(f) ? choiceValue(f) : headInput(f).value.trim()]))));
  } catch { /* private mode */ }
  const button = /** @type {HTMLButtonElement} */ ($('#m-submit'));
  button.disabled = true;
  fill(result, el('p', { class: 'muted' }, 'Sending…'));
  try {
    const a = await sendJson('POST', '/api/measurements', body);
    recheckAll();
    storedSummary(result, a, head, body);
  } catch (err) {
    if (err instanceof ApiError && Array.isArray(err.problem?.errors)) placeServerErrors(result, err.problem, rows);
    else fill(result, el('div', { class: 'problem' }, `${err instanceof Error ? err.message : err}\nNothing was stored.`));
  } finally {
    button.disabled = false;
  }
});

/** @param {HTMLElement} result @param {any} problem @param {Element[]} rows */
function placeServerErrors(result, problem, rows) {
  /** @type {string[]} */
  const general = [];
  const perRow = new Map();
  const perHead = new Map(); // field → reason → rows
  for (const e of problem.errors) {
    const tr = /** @type {HTMLElement | undefined} */ (rows[e.row - 1]);
    if (e.column && headFields.includes(e.column)) {
      if (!perHead.has(e.column)) perHead.set(e.column, new Map());
      const reasons = perHead.get(e.column);
      if (!reasons.has(e.reason)) reasons.set(e.reason, []);
      reasons.get(e.reason).push(Number(tr?.dataset.index ?? e.row));
    } else if (tr && e.column !== 'operator') {
      const input = e.column ? cell(tr, e.column) : null;
      if (input) setMessage(input, null, e.reason);
      if (!perRow.has(tr)) perRow.set(tr, []);
      if (!input) perRow.get(tr).push(`${e.column ? `${gridLabels[e.column] ?? e.column}: ` : ''}${e.reason}`);
    } else {
      general.push(whyText(e));
    }
  }
  for (const [field, reasons] of perHead) {
    const input = headInput(field);
    const text = [...reasons].map(([reason, at]) => (at.length === rows.length ? reason : `${reason} (grid row${at.length > 1 ? 's' : ''} ${at.join(', ')})`)).join('; ');
    setMessage(input, $(`#${input.id}-msg`), text);
  }
  for (const tr of grid.children) rowMessage(tr, perRow.get(tr) ?? []);
  fill(result, el('div', { class: 'problem', id: 'manual-rejected' },
    el('strong', {}, 'Rejected by the server: nothing was stored. '),
    `${problem.error_count} problem${problem.error_count === 1 ? '' : 's'}; each is shown beside its field or in its row's check column.`,
    general.length ? el('ul', {}, general.map((g) => el('li', {}, g))) : null));
  /** @type {HTMLElement | null} */ (form.querySelector('.invalid'))?.focus();
}

/** @param {HTMLElement} result @param {any} a @param {Record<string, any>} head @param {Record<string, any>[]} body */
function storedSummary(result, a, head, body) {
  const lotLink = `lot.html?lot=${encodeURIComponent(head.lot_id)}&step=${encodeURIComponent(head.step)}&wafer=${head.wafer_slot}`;
  const unit = (/** @type {string} */ f) => (f.endsWith('_mm') ? 'mm' : 'nm');
  fill(result, el('div', { class: 'notice', id: 'manual-stored', dataset: { batch: a.batch_id } },
    el('strong', {}, `Stored: ${a.inserted} site${a.inserted === 1 ? '' : 's'} of lot ${head.lot_id}, wafer ${head.wafer_slot}, step ${head.step} (batch ${a.batch_id}).`),
    a.already_present ? el('p', {}, `${a.already_present} row${a.already_present === 1 ? ' was' : 's were'} already stored (rows ${a.already_present_rows.join(', ')}) and not stored twice.`) : null,
    a.re_entrant_profiles || a.radius_exceeds_max ? el('p', {}, `Flagged: ${a.re_entrant_profiles} re-entrant, ${a.radius_exceeds_max} with a radius larger than the top allows.`) : null,
    el('p', {}, `Measured at ${when(head.measured_at)} by ${head.operator}. `, el('a', { href: lotLink }, 'See the wafer on the lot page')),
    el('details', {}, el('summary', {}, 'The stored rows'), el('div', { class: 'table-box' }, el('table', { id: 'manual-stored-rows' },
      el('thead', {}, el('tr', {}, gridFields.map((f) => el('th', {}, `${gridLabels[f]}${f === 'site_id' ? '' : ` [${unit(f)}]`}`)))),
      el('tbody', {}, body.map((r) => el('tr', {}, gridFields.map((f) => el('td', { class: f === 'site_id' ? null : 'num' },
        f === 'site_id' ? r[f] : r[f] == null ? '—' : `${r[f]} ${unit(f)}`))))))))));
}

function clearValues() {
  for (const tr of grid.children) {
    for (const f of valueFields) { cell(tr, f).value = ''; setMessage(cell(tr, f), null, null); }
    delete /** @type {HTMLElement} */ (tr).dataset.checked;
  }
}

$('#m-add-row').addEventListener('click', () => {
  const last = grid.lastElementChild ?? undefined;
  cell(addRow(last), 'site_id').focus();
});
$('#m-clear').addEventListener('click', () => { clearValues(); applyPlan(); fill($('#manual-result')); });
$('#m-next-wafer').addEventListener('click', () => {
  clearValues();
  recheckAll();
  const slot = headInput('wafer_slot');
  if (/^\d+$/.test(slot.value.trim()) && Number(slot.value) < ranges.max_wafer_slot) slot.value = String(Number(slot.value) + 1);
  setNow();
  fill($('#manual-result'));
  /** @type {HTMLElement | null} */ (grid.querySelector('[data-field="top_width_nm"]'))?.focus();
});

// ------------------------------------------------------------------------------- the site plan, for engineers
const mayPlan = () => Boolean(who.permissions?.includes('engineer'));

function planEditor() {
  const code = headInput('product').value;
  const step = choiceValue('step');
  $('#plan-editor').classList.toggle('hidden', !(mayPlan() && code && step));
  const locked = [...grid.children].some(planned);
  /** @type {HTMLButtonElement} */ ($('#plan-unlock')).disabled = !locked;
  /** @type {HTMLButtonElement} */ ($('#plan-save')).disabled = locked;
  fill($('#plan-result'));
}

$('#plan-unlock').addEventListener('click', () => {
  for (const tr of grid.children) lockSites(tr, false);
  planEditor();
  /** @type {HTMLElement | null} */ (grid.querySelector('[data-field="site_id"]'))?.focus();
});

$('#plan-save').addEventListener('click', async () => {
  const code = headInput('product').value;
  const step = choiceValue('step');
  const rows = [...grid.children].filter((tr) => siteFields.some((f) => cell(tr, f).value.trim()));
  const num = (/** @type {string} */ t) => (t.trim() && numberPattern.test(t.trim()) ? Number(t) : null);
  const sites = rows.map((tr) => ({ site_id: cell(tr, 'site_id').value.trim(), site_x_mm: num(cell(tr, 'site_x_mm').value), site_y_mm: num(cell(tr, 'site_y_mm').value) }));
  const result = /** @type {HTMLElement} */ ($('#plan-result'));
  try {
    const plan = await sendJson('PUT', `/api/products/${encodeURIComponent(code)}/site-plans`, { step, sites });
    if (plan.sites.length) plans.set(step, plan); else plans.delete(step);
    for (const tr of rows) lockSites(tr, plan.sites.length > 0);
    planEditor();
    fill(result, el('div', { class: 'notice', id: 'plan-saved' }, plan.sites.length
      ? `Saved: the plan of ${code} at ${step} has ${plan.sites.length} sites.` : `Removed: ${code} has no site plan at ${step} now.`));
  } catch (err) {
    const errors = err instanceof ApiError ? err.problem?.errors ?? {} : {};
    for (const [key, messages] of Object.entries(errors)) {
      const m = /^sites\[(\d+)\]\.(site_id|site_x_mm|site_y_mm)$/.exec(key);
      const tr = m ? rows[Number(m[1])] : null;
      if (tr && m) setMessage(cell(tr, m[2]), null, [].concat(messages).join('; '));
    }
    fill(result, el('div', { class: 'problem', id: 'plan-refused' }, `The plan was not saved.\n${err instanceof Error ? err.message : err}`));
  }
});

await productChanged(saved.step ?? '').catch(showLoadProblem);
headInput(headInput('product').value ? 'lot_id' : 'product').focus();
