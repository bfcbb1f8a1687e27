// Log data: (a) CSV upload to POST /api/measurements/csv with the rejected rows shown in place, (b) a keyboard-first
// form for one wafer posted as JSON to POST /api/measurements. Batches are all or nothing on the server.
//
// DOM contract for browser tests: the upload's answer goes into #csv-result; on rejection its table has one
// <tr class="bad" data-row="N"> per row the server named (N as the server counts: the CSV header is row 1), with N in
// the first cell and a td.why holding "column: reason (value …)"; a line saying "nothing was stored" (#csv-summary) is above it.
import { el, fill, $ } from '../core/dom.js';
import { getJson, sendJson, sendText, ApiError } from '../core/api.js';
import { frame } from '../core/shell.js';
import { withUnit, when } from '../core/format.js';

frame('entry.html');

const HEADER = ['lot_id', 'wafer_slot', 'site_id', 'site_x_mm', 'site_y_mm', 'product', 'step', 'etch_tool', 'etch_chamber', 'liner_tool',
  'liner_chamber', 'metrology_tool', 'measured_at', 'operator', 'top_width_nm', 'bottom_width_nm', 'fin_height_nm', 'corner_radius_nm', 'liner_thickness_nm'];
const SHOW_ALL_UP_TO = 60;   // rows; a larger file shows its bad rows with this many neighbours each side
const NEIGHBOURS = 2;
const MAX_BAD_SHOWN = 200;
const TEXTAREA_LIMIT = 512 * 1024; // characters; a larger file is sent as it is without being copied into the box

// -------------------------------------------------------------------------------------------------- shared checks
// The README's ranges ("The measurement record"); the server checks them again, and its word is final.
const ranges = {
  top_width_nm: { low: 0, high: 100, lowIn: false, unit: 'nm' },
  bottom_width_nm: { low: 0, high: 100, lowIn: false, unit: 'nm' },
  fin_height_nm: { low: 0, high: 300, lowIn: false, unit: 'nm' },
  corner_radius_nm: { low: 0, high: 50, lowIn: true, unit: 'nm' },
  liner_thickness_nm: { low: 0, high: 20, lowIn: true, unit: 'nm' },
  site_x_mm: { low: -150, high: 150, lowIn: true, unit: 'mm' },
  site_y_mm: { low: -150, high: 150, lowIn: true, unit: 'mm' },
};
const valueFields = ['top_width_nm', 'bottom_width_nm', 'fin_height_nm', 'corner_radius_nm', 'liner_thickness_nm'];

/** null when fine, else the reason, worded like the server's. */
function checkNumber(field, text) {
  const r = ranges[field];
  if (text.includes(',')) return "not a number (use '.' as the decimal separator)";
  const v = Number(text);
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(text) || !Number.isFinite(v)) return 'not a number';
  const lowOk = r.lowIn ? v >= r.low : v > r.low;
  if (!lowOk || v > r.high) return `out of range: expected ${r.low} ${r.lowIn ? '≤' : '<'} value ≤ ${r.high} ${r.unit}`;
  return null;
}

const isoWithZone = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d{1,7})?)?(Z|[+-]\d{2}:\d{2})$/i;

function checkTime(text) {
  if (!text) return 'a value is required';
  if (!isoWithZone.test(text) || Number.isNaN(Date.parse(text))) return 'not an ISO 8601 time with a zone, such as 2026-11-03T14:05:00Z or 2026-11-03T15:05:00+01:00';
  const t = Date.parse(text);
  if (t > Date.now() + 60 * 60_000) return 'the time lies more than 60 min in the future';
  if (t < Date.UTC(2000, 0, 1)) return 'the time is before the year 2000';
  return null;
}

function checkText(text, required) {
  if (!text) return required ? 'a value is required' : null;
  if (text.length > 64) return 'longer than 64 characters';
  // eslint-disable-next-line no-control-regex
  if (/[\u0000-\u001f\u007f]/.test(text)) return 'contains a control character';
  return null;
}

/** Now in the browser's zone as ISO 8601 with its offset, to the second: 2026-11-20T09:00:04+01:00. */
function nowIso() {
  const d = new Date();
  const pad = (n) => String(Math.abs(n)).padStart(2, '0');
  const off = -d.getTimezoneOffset();
  const zone = off === 0 ? 'Z' : `${off > 0 ? '+' : '-'}${pad(Math.trunc(off / 60))}:${pad(off % 60)}`;
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}:${pad(d.getSeconds())}${zone}`;
}

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
const form = $('#manual-form');
const grid = $('#site-grid tbody');
const gridFields = ['site_id', 'site_x_mm', 'site_y_mm', 'top_width_nm', 'bottom_width_nm', 'fin_height_nm', 'corner_radius_nm', 'liner_thickness_nm'];
const headFields = ['lot_id', 'wafer_slot', 'product', 'step', 'measured_at', 'etch_tool', 'etch_chamber', 'liner_tool', 'liner_chamber', 'metrology_tool', 'operator'];
const headInput = (field) => form.querySelector(`.entry-head [data-field="${field}"]`);
const remembered = ['product', 'step', 'etch_tool', 'etch_chamber', 'liner_tool', 'liner_chamber', 'metrology_tool', 'operator'];
const STORE_KEY = 'finwatch.entry.head';

try {
  const products = await getJson('/api/products');
  fill($('#m-product'), el('option', { value: '' }, '— choose —'), products.map((p) => el('option', { value: p.code }, `${p.code} · ${p.name}`)));
} catch (e) {
  fill($('#m-product-msg'), `products could not be loaded: ${e.message}`);
}
getJson('/api/lots?page_size=200').then((page) => {
  const steps = [...new Set(page.items.map((l) => l.step))].sort();
  fill($('#step-list'), steps.map((s) => el('option', { value: s })));
}).catch(() => { /* suggestions only */ });
try {
  const saved = JSON.parse(localStorage.getItem(STORE_KEY) ?? '{}');
  for (const f of remembered) if (saved[f] && headInput(f)) headInput(f).value = saved[f];
} catch { /* nothing remembered */ }
if (!headInput('step').value) headInput('step').value = 'FIN-PROFILE';
headInput('measured_at').value = nowIso();
$('#m-now').addEventListener('click', () => { headInput('measured_at').value = nowIso(); checkHead('measured_at'); });

function addRow(from) {
  const index = grid.children.length + 1;
  const tr = el('tr', { class: 'site-row', dataset: { index } },
    el('td', { class: 'num muted' }, index),
    gridFields.map((f) => el('td', {}, el('input', {
      type: 'text', inputmode: f === 'site_id' ? null : 'decimal', spellcheck: 'false', 'data-field': f,
      class: f === 'site_id' ? 'cell id' : 'cell', 'aria-label': `row ${index} ${f.replace(/_/g, ' ')}`,
    }))),
    el('td', { class: 'row-msg' }),
    el('td', {}, el('button', { type: 'button', class: 'quiet remove', tabindex: '-1', 'aria-label': `remove row ${index}` }, '×')));
  if (from) {
    const id = from.querySelector('[data-field="site_id"]').value.trim();
    const m = /^(.*?)(\d+)$/.exec(id);
    if (m) tr.querySelector('[data-field="site_id"]').value = m[1] + String(Number(m[2]) + 1).padStart(m[2].length, '0');
  }
  grid.append(tr);
  return tr;
}

function renumber() {
  [...grid.children].forEach((tr, i) => { tr.dataset.index = i + 1; tr.firstChild.textContent = String(i + 1); });
}

grid.addEventListener('click', (e) => {
  const button = e.target.closest('button.remove');
  if (!button) return;
  button.closest('tr').remove();
  if (grid.children.length === 0) addRow();
  renumber();
});

const rowEmpty = (tr) => gridFields.every((f) => !tr.querySelector(`[data-field="${f}"]`).value.trim());
const fieldsInOrder = () => [...form.querySelectorAll('.entry-head input:not([type="button"]), .entry-head select, #site-grid input')];

form.addEventListener('keydown', (e) => {
  const target = e.target;
  if (e.key === 'Enter' && (e.ctrlKey || e.metaKey)) { e.preventDefault(); form.requestSubmit(); return; }
  if (!(target instanceof HTMLInputElement || target instanceof HTMLSelectElement)) return;
  const inGrid = target.closest('#site-grid');
  if (inGrid && (e.key === 'ArrowDown' || e.key === 'ArrowUp')) {
    e.preventDefault();
    const tr = target.closest('tr');
    const next = e.key === 'ArrowDown' ? tr.nextElementSibling ?? (rowEmpty(tr) ? null : addRow(tr)) : tr.previousElementSibling;
    next?.querySelector(`[data-field="${target.dataset.field}"]`)?.focus();
    return;
  }
  const forward = (e.key === 'Enter' && !e.shiftKey) || (e.key === 'Tab' && !e.shiftKey);
  const backward = (e.key === 'Enter' && e.shiftKey);
  if (!forward && !backward) return;
  const order = fieldsInOrder();
  const at = order.indexOf(target);
  if (forward && at === order.length - 1 && inGrid) {
    // Leaving the last cell of the last row: a new row, unless this one is empty (then Tab goes on to the buttons).
    const tr = target.closest('tr');
    if (rowEmpty(tr)) { if (e.key === 'Enter') { e.preventDefault(); $('#m-submit').focus(); } return; }
    e.preventDefault();
    checkRow(tr);
    const fresh = addRow(tr);
    fresh.querySelector(fresh.querySelector('[data-field="site_id"]').value ? '[data-field="site_x_mm"]' : '[data-field="site_id"]').focus();
    return;
  }
  if (e.key === 'Tab') return; // the browser moves focus in the same order; focusout checks the cell
  e.preventDefault();
  const next = order[at + (forward ? 1 : -1)];
  if (inGrid && next?.closest('tr') !== target.closest('tr')) checkRow(target.closest('tr'));
  if (next) { next.focus(); if (next instanceof HTMLInputElement) next.select(); }
});

form.addEventListener('focusout', (e) => {
  const f = e.target.dataset?.field;
  if (!f) return;
  if (e.target.closest('#site-grid')) checkCell(e.target);
  else checkHead(f);
});

function setMessage(input, msgNode, text) {
  input.classList.toggle('invalid', Boolean(text));
  if (text) input.setAttribute('aria-invalid', 'true'); else input.removeAttribute('aria-invalid');
  input.title = text ?? '';
  if (msgNode) fill(msgNode, text ?? '');
}

function checkHead(field) {
  const input = headInput(field);
  const v = input.value.trim();
  let why = null;
  if (field === 'wafer_slot') why = !v ? 'a value is required' : !/^\d+$/.test(v) ? 'not a whole number' : Number(v) < 1 || Number(v) > 25 ? 'wafer slot must be 1 to 25' : null;
  else if (field === 'measured_at') why = checkTime(v);
  else why = checkText(v, ['lot_id', 'product', 'step'].includes(field));
  setMessage(input, $(`#${input.id}-msg`), why);
  return !why;
}

/** Checks one grid cell alone; returns its reason or null. */
function cellReason(input) {
  const f = input.dataset.field;
  const v = input.value.trim();
  const tr = input.closest('tr');
  if (rowEmpty(tr)) return null;
  if (f === 'site_id') {
    const why = checkText(v, true);
    if (why) return why;
    const twice = [...grid.querySelectorAll('[data-field="site_id"]')].filter((x) => x !== input && x.value.trim() === v && !rowEmpty(x.closest('tr')));
    return twice.length ? 'the same site id appears twice on this wafer' : null;
  }
  if (!v) return f === 'site_x_mm' || f === 'site_y_mm' ? 'a value is required' : null;
  return checkNumber(f, v);
}

function checkCell(input) {
  const why = cellReason(input);
  setMessage(input, null, why);
  rowMessage(input.closest('tr'));
  return !why;
}

const gridLabels = { site_id: 'site id', site_x_mm: 'x', site_y_mm: 'y', top_width_nm: 'top width', bottom_width_nm: 'bottom width',
  fin_height_nm: 'height', corner_radius_nm: 'corner radius', liner_thickness_nm: 'liner' };

function rowMessage(tr, extra = [], full = false) {
  if (full) tr.dataset.checked = 'full';
  full = full || tr.dataset.checked === 'full'; // once the whole row was checked, keep its row-level reasons
  const lines = [];
  for (const input of tr.querySelectorAll('input[data-field]')) if (input.title) lines.push(`${gridLabels[input.dataset.field]}: ${input.title}`);
  if (!rowEmpty(tr)) {
    const get = (f) => tr.querySelector(`[data-field="${f}"]`).value.trim();
    if (full && valueFields.every((f) => !get(f))) lines.push('no measured value: fill at least one of the widths, height, radius or liner');
    const x = Number(get('site_x_mm'));
    const y = Number(get('site_y_mm'));
    if (get('site_x_mm') && get('site_y_mm') && Number.isFinite(x) && Number.isFinite(y) && Math.hypot(x, y) > 150) {
      lines.push(`the site (${x}, ${y}) mm lies outside the 300 mm wafer (radius 150 mm)`);
      tr.querySelector('[data-field="site_x_mm"]').classList.add('invalid');
    }
    const wt = Number(get('top_width_nm'));
    const wb = Number(get('bottom_width_nm'));
    if (get('top_width_nm') && get('bottom_width_nm') && wt > wb) lines.push('note: top wider than the foot (re-entrant); it will be stored and flagged');
  }
  lines.push(...extra);
  const cell = tr.querySelector('.row-msg');
  fill(cell, lines.map((l) => el('div', { class: l.startsWith('note:') ? 'muted' : null }, l)));
  tr.classList.toggle('bad', lines.some((l) => !l.startsWith('note:')));
  return !tr.classList.contains('bad');
}

function checkRow(tr) {
  if (!tr) return true;
  let ok = true;
  for (const input of tr.querySelectorAll('input[data-field]')) {
    const why = cellReason(input);
    setMessage(input, null, why);
    if (why) ok = false;
  }
  return rowMessage(tr, [], true) && ok;
}

function clearServerMarks() {
  for (const tr of grid.children) rowMessage(tr);
}

form.addEventListener('submit', async (e) => {
  e.preventDefault();
  const result = $('#manual-result');
  let ok = true;
  for (const f of headFields) ok = checkHead(f) && ok;
  const rows = [...grid.children].filter((tr) => !rowEmpty(tr));
  for (const tr of grid.children) ok = checkRow(tr) && ok;
  if (rows.length === 0) {
    fill(result, el('div', { class: 'problem' }, 'No site rows filled in: nothing to store.'));
    return;
  }
  if (!ok) {
    fill(result, el('div', { class: 'problem' }, 'Not sent: correct the marked fields first (the reasons are beside them). Nothing was stored.'));
    form.querySelector('.invalid')?.focus();
    return;
  }
  const head = {};
  for (const f of headFields) {
    const v = headInput(f).value.trim();
    if (v) head[f] = f === 'wafer_slot' ? Number(v) : v;
  }
  const body = rows.map((tr) => {
    const row = { ...head };
    for (const f of gridFields) {
      const v = tr.querySelector(`[data-field="${f}"]`).value.trim();
      if (v) row[f] = f === 'site_id' ? v : Number(v);
    }
    return row;
  });
  try {
    localStorage.setItem(STORE_KEY, JSON.stringify(Object.fromEntries(remembered.map((f) => [f, headInput(f).value.trim()]))));
  } catch { /* private mode */ }
  const button = $('#m-submit');
  button.disabled = true;
  fill(result, el('p', { class: 'muted' }, 'Sending…'));
  try {
    const a = await sendJson('POST', '/api/measurements', body);
    clearServerMarks();
    storedSummary(result, a, head, body);
  } catch (err) {
    if (err instanceof ApiError && Array.isArray(err.problem?.errors)) placeServerErrors(result, err.problem, rows);
    else fill(result, el('div', { class: 'problem' }, `${err.message}\nNothing was stored.`));
  } finally {
    button.disabled = false;
  }
});

function placeServerErrors(result, problem, rows) {
  const general = [];
  const perRow = new Map();
  const perHead = new Map(); // field → reason → rows
  for (const e of problem.errors) {
    const tr = rows[e.row - 1];
    if (e.column && headFields.includes(e.column)) {
      if (!perHead.has(e.column)) perHead.set(e.column, new Map());
      const reasons = perHead.get(e.column);
      if (!reasons.has(e.reason)) reasons.set(e.reason, []);
      reasons.get(e.reason).push(Number(tr?.dataset.index ?? e.row));
    } else if (tr) {
      const input = e.column ? tr.querySelector(`[data-field="${e.column}"]`) : null;
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
  form.querySelector('.invalid')?.focus();
}

function storedSummary(result, a, head, body) {
  const lotLink = `lot.html?lot=${encodeURIComponent(head.lot_id)}&step=${encodeURIComponent(head.step)}&wafer=${head.wafer_slot}`;
  const unit = (f) => (f.endsWith('_mm') ? 'mm' : 'nm');
  fill(result, el('div', { class: 'notice', id: 'manual-stored', dataset: { batch: a.batch_id } },
    el('strong', {}, `Stored: ${a.inserted} site${a.inserted === 1 ? '' : 's'} of lot ${head.lot_id}, wafer ${head.wafer_slot}, step ${head.step} (batch ${a.batch_id}).`),
    a.already_present ? el('p', {}, `${a.already_present} row${a.already_present === 1 ? ' was' : 's were'} already stored (rows ${a.already_present_rows.join(', ')}) and not stored twice.`) : null,
    a.re_entrant_profiles || a.radius_exceeds_max ? el('p', {}, `Flagged: ${a.re_entrant_profiles} re-entrant, ${a.radius_exceeds_max} with a radius larger than the top allows.`) : null,
    el('p', {}, `Measured at ${when(head.measured_at)} (${head.measured_at}). `, el('a', { href: lotLink }, 'See the wafer on the lot page')),
    el('div', { class: 'table-box' }, el('table', { id: 'manual-stored-rows' },
      el('thead', {}, el('tr', {}, gridFields.map((f) => el('th', {}, f)))),
      el('tbody', {}, body.map((r) => el('tr', {}, gridFields.map((f) => el('td', { class: f === 'site_id' ? null : 'num' },
        f === 'site_id' ? r[f] : r[f] == null ? '—' : `${r[f]} ${unit(f)}`)))))))));
}

$('#m-add-row').addEventListener('click', () => {
  const last = grid.lastElementChild;
  addRow(last).querySelector('[data-field="site_id"]').focus();
});
$('#m-clear').addEventListener('click', () => { grid.replaceChildren(); addRow(); fill($('#manual-result')); });
$('#m-next-wafer').addEventListener('click', () => {
  for (const tr of grid.children) for (const f of valueFields) tr.querySelector(`[data-field="${f}"]`).value = '';
  for (const tr of grid.children) rowMessage(tr);
  const slot = headInput('wafer_slot');
  if (/^\d+$/.test(slot.value.trim()) && Number(slot.value) < 25) slot.value = String(Number(slot.value) + 1);
  headInput('measured_at').value = nowIso();
  fill($('#manual-result'));
  grid.querySelector('[data-field="top_width_nm"]')?.focus();
});

addRow();
const first = grid.querySelector('[data-field="site_id"]');
first.value = 'S01';
headInput('lot_id').focus();
