// @ts-check
// Chamber maintenance: record one (supervisors and up), import a file of them, and the recent log.
import { el, fill, $ } from '../core/dom.js';
import { getJson, sendJson, sendText, ApiError } from '../core/api.js';
import { frame, me } from '../core/shell.js';
import { when, maintenanceWords } from '../core/format.js';

frame('maintenance.html');

// The form's fields by the name the server gives them, in the page's words.
const labels = { chamber: 'Chamber or tool', kind: 'What was done', occurred_at: 'Finished at', performed_by: 'Done by', note: 'Note' };
const form = $('#record');

fill(form.elements.kind, el('option', { value: '' }, 'choose…'),
  Object.entries(maintenanceWords).map(([value, words]) => el('option', { value }, words)));

const who = await me;
if (!who.permissions.includes('disposition')) {
  for (const id of ['#record-card', '#import-card']) {
    const card = $(id);
    fill(card, el('h2', {}, card.querySelector('h2').textContent),
      el('p', { class: 'muted' }, `Supervisors and engineers record maintenance; your role (${who.role ?? 'not signed in'}) reads the log.`));
  }
}

function clearMarks() {
  for (const input of form.querySelectorAll('.invalid')) input.classList.remove('invalid');
}

function mark(field) {
  form.elements[field]?.classList.add('invalid');
}

/** The request, or the fields the person still has to fill in. */
function read() {
  const f = form.elements;
  const missing = ['chamber', 'kind', 'occurred_at', 'performed_by'].filter((name) => !f[name].value.trim());
  if (missing.length) return { missing };
  return {
    body: {
      chamber: f.chamber.value.trim(), kind: f.kind.value, occurred_at: new Date(f.occurred_at.value).toISOString(),
      performed_by: f.performed_by.value.trim(), note: f.note.value.trim() || null,
    },
  };
}

form.addEventListener('submit', async (event) => {
  event.preventDefault();
  clearMarks();
  const result = $('#record-result');
  const { body, missing } = read();
  if (missing) {
    missing.forEach(mark);
    fill(result, el('p', { class: 'problem' }, `Fill in: ${missing.map((m) => labels[m]).join(', ')}.`));
    return;
  }
  try {
    const saved = await sendJson('POST', '/api/maintenance', body);
    fill(result, el('p', { class: 'notice', id: 'recorded' }, `Recorded: ${maintenanceWords[saved.kind]} of ${saved.chamber}, finished ${when(saved.occurred_at)}.`));
    form.elements.note.value = '';
    await load();
  } catch (err) {
    if (!(err instanceof ApiError)) throw err;
    const errors = Object.entries(err.problem.errors ?? {});
    errors.forEach(([field]) => mark(field));
    fill(result, el('div', { class: 'problem' }, errors.length
      ? errors.map(([field, messages]) => el('div', {}, `${labels[field] ?? field}: ${[].concat(messages).join(' ')}`))
      : err.message));
  }
});

$('#import').addEventListener('submit', async (event) => {
  event.preventDefault();
  const file = $('#m-file').files[0];
  const result = $('#import-result');
  if (!file) {
    fill(result, el('p', { class: 'problem' }, 'Choose a file first.'));
    return;
  }
  const answer = await sendText('/api/maintenance/import', await file.text());
  if (answer.ok) {
    fill(result, el('p', { class: 'notice' }, `Recorded ${answer.body.recorded} maintenance events from ${file.name}.`));
    await load();
    return;
  }
  const problem = answer.body ?? {};
  fill(result, el('div', { class: 'problem' },
    el('div', {}, `Nothing was recorded: ${problem.detail ?? `the server answered ${answer.status}.`}`),
    (Array.isArray(problem.errors) ? problem.errors : []).map((e) =>
      el('div', {}, `row ${e.row}${e.column ? `, ${e.column}` : ''}${e.value != null ? ` “${e.value}”` : ''}: ${e.reason}`))));
});

async function load() {
  const chamber = $('#f-chamber').value.trim();
  const rows = await getJson(`/api/maintenance?limit=200${chamber ? `&chamber=${encodeURIComponent(chamber)}` : ''}`);
  fill($('#m-chambers'), [...new Set(rows.map((r) => r.chamber))].sort().map((c) => el('option', { value: c })));
  fill($('#log tbody'), rows.length === 0
    ? el('tr', {}, el('td', { colspan: 6 }, chamber ? `No maintenance recorded for ${chamber}.` : 'No maintenance recorded yet.'))
    : rows.map((r) => el('tr', { dataset: { event: r.id } },
      el('td', {}, when(r.occurred_at)), el('td', {}, r.chamber),
      el('td', {}, el('span', { class: 'maint' }, maintenanceWords[r.kind] ?? r.kind)),
      el('td', {}, r.performed_by), el('td', {}, r.note),
      el('td', {}, `${r.recorded_by}, ${when(r.recorded_at)}${r.source === 'api' ? '' : ` (from ${r.source})`}`))));
}

$('#filter').addEventListener('submit', (event) => { event.preventDefault(); load(); });
await load();
