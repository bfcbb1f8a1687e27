// The audit trail: filters, the entries newest first with before and after, and the CSV export of the same filter.
import { el, fill, $ } from '../core/dom.js';
import { getJson } from '../core/api.js';
import { frame } from '../core/shell.js';
import { when } from '../core/format.js';

frame('audit.html');

function query() {
  const q = new URLSearchParams();
  for (const name of ['entity', 'key', 'by']) {
    const v = $('#filters').elements[name].value.trim();
    if (v) q.set(name, v);
  }
  for (const name of ['from', 'to']) {
    const v = $('#filters').elements[name].value;
    if (v) q.set(name, `${v}:00Z`);
  }
  return q;
}

function pretty(json) {
  if (!json) return '';
  try { return JSON.stringify(JSON.parse(json), null, 1); } catch { return json; }
}

async function load() {
  const q = query();
  $('#csv').href = `/api/audit/csv?${q}`;
  const rows = await getJson(`/api/audit?${q}`);
  fill($('#audit tbody'), rows.length === 0 ? el('tr', {}, el('td', { colspan: 7 }, 'Nothing recorded for this filter.'))
    : rows.map((a) => el('tr', { dataset: { entry: a.id } },
      el('td', {}, when(a.at)), el('td', {}, a.by), el('td', {}, a.entity), el('td', {}, a.key), el('td', {}, a.action),
      el('td', {}, el('div', { class: 'audit-json' }, pretty(a.before))), el('td', {}, el('div', { class: 'audit-json' }, pretty(a.after))))));
}

$('#filters').addEventListener('submit', (event) => { event.preventDefault(); load(); });
await load();
