// @ts-check
// Shift roster: who is on shift now (the shift of the pattern running, its times, its people and supervisors), and
// the roster itself, one line per person and shift from a date until a date or further notice. Supervisors and up
// change it: lines are added and removed here and the whole roster is saved at once; the server's objection to a line
// is shown on that line.
import { el, fill, $ } from '../core/dom.js';
import { getJson, sendJson, fieldProblems } from '../core/api.js';
import { frame, me } from '../core/shell.js';
import { when, day } from '../core/format.js';

frame('roster.html');
const who = await me;
const editor = who.permissions.includes('disposition');
const body = /** @type {HTMLElement} */ ($('#roster tbody'));
/** @type {string[]} */
let shifts = [];

/** @param {any} now */
function showNow(now) {
  if (!now.shift) {
    fill($('#now-body'), el('p', { class: 'notice' }, `No shift of the pattern is running at ${when(now.at)}.`));
    return;
  }
  fill($('#now-body'),
    el('p', { class: 'shift-now' }, el('b', {}, `${now.shift} shift`), ` of ${day(now.date)}`),
    el('p', {}, `${when(now.start)} – ${when(now.end)}`),
    now.people.length === 0
      ? el('p', { class: 'problem' }, 'Nobody on the roster for this shift: escalations have no supervisor to go to.')
      : el('ul', { class: 'on-shift' }, now.people.map((/** @type {any} */ p) => el('li', {}, el('span', { class: 'name' }, p.name), el('span', { class: 'muted' }, ` · ${p.role}`)))),
    now.people.length === 0 ? ''
      : el('p', {}, now.supervisors.length ? `Alerts not acknowledged in time go first to ${now.supervisors.join(', ')}.` : 'No supervisor on this shift: an alert not acknowledged in time goes on to the next escalation step.'));
}

/** One roster line: inputs for an editor, text for everyone else. @param {any} e */
function line(e) {
  const problem = el('td', { class: 'why' });
  if (!editor) {
    return el('tr', {}, el('td', { class: 'num' }), el('td', {}, e.shift), el('td', {}, e.person), el('td', {}, day(e.from)), el('td', {}, e.to ? day(e.to) : 'further notice'), problem, el('td', {}));
  }
  const row = el('tr', {},
    el('td', { class: 'num' }),
    el('td', {}, el('select', { name: 'shift', 'aria-label': 'shift' }, shifts.map((s) => el('option', { value: s, selected: s === e.shift }, s)))),
    el('td', {}, el('input', { type: 'text', name: 'person', list: 'names', value: e.person ?? '', 'aria-label': 'person', required: true })),
    el('td', {}, el('input', { type: 'date', name: 'from', value: e.from ?? '', 'aria-label': 'from', required: true })),
    el('td', {}, el('input', { type: 'date', name: 'to', value: e.to ?? '', 'aria-label': 'until (empty: further notice)' })),
    problem,
    el('td', {}, el('button', { type: 'button', class: 'quiet', onclick: () => { row.remove(); number(); empty(); } }, 'Remove')));
  return row;
}

/** Numbers the lines as the server counts them in its messages (from 1). */
function number() {
  [...body.rows].forEach((r, i) => {
    r.cells[0].textContent = String(i + 1);
    for (const input of r.querySelectorAll('input, select')) input.setAttribute('aria-label', `line ${i + 1}: ${input.getAttribute('name') === 'to' ? 'until (empty: further notice)' : input.getAttribute('name')}`);
    const remove = r.querySelector('button');
    if (remove) remove.setAttribute('aria-label', `remove line ${i + 1}`);
  });
}

/** @param {any} roster */
function show(roster) {
  shifts = roster.shifts;
  showNow(roster.now);
  fill($('#roster-intro'), `The shifts ${roster.shifts.join(', ')} follow the pattern of ${roster.time_zone}. `,
    editor ? 'Saving replaces the whole roster; every change is in the audit.' : 'Supervisors and up change it.');
  fill(body, roster.entries.map(line));
  number();
  empty();
}

/** Says so when the roster has no line. */
function empty() {
  $('#roster-empty').classList.toggle('hidden', body.rows.length > 0);
  $('#roster-box').classList.toggle('hidden', body.rows.length === 0);
}

/** @param {string[]} names */
function offerNames(names) {
  fill($('#names'), [...new Set(names)].sort().map((n) => el('option', { value: n })));
}

const roster = await getJson('/api/roster');
show(roster);
const known = [...roster.entries.map((/** @type {any} */ e) => e.person), ...roster.now.people.map((/** @type {any} */ p) => p.name)];
offerNames(who.permissions.includes('administer') ? [...known, ...(await getJson('/api/people')).map((/** @type {any} */ p) => p.name)] : known);

if (editor) {
  $('#roster-actions').classList.remove('hidden');
  $('#add-line').addEventListener('click', () => {
    body.append(line({ shift: shifts[0], person: '', from: '', to: '' }));
    number();
    empty();
    /** @type {HTMLInputElement} */ (body.rows[body.rows.length - 1].querySelector('input[name="person"]')).focus();
  });
  $('#roster-form').addEventListener('submit', async (event) => {
    event.preventDefault();
    /** @param {HTMLTableRowElement} r @param {string} name */
    const value = (r, name) => /** @type {HTMLInputElement} */ (r.querySelector(`[name="${name}"]`)).value;
    const entries = [...body.rows].map((r) => ({ shift: value(r, 'shift'), person: value(r, 'person'), from: value(r, 'from'), to: value(r, 'to') || null }));
    for (const r of body.rows) {
      r.classList.remove('bad');
      r.cells[5].textContent = '';
      for (const input of r.querySelectorAll('.invalid')) input.classList.remove('invalid');
    }
    try {
      show(await sendJson('PUT', '/api/roster', { entries }));
      fill($('#roster-result'), el('p', { class: 'notice' }, `Saved: ${entries.length} line${entries.length === 1 ? '' : 's'}.`));
    } catch (e) {
      const byField = Object.entries(fieldProblems(e));
      for (const [key, text] of byField) {
        const m = /^entries\[(\d+)\]\.(\w+)$/.exec(key);
        const row = m ? body.rows[Number(m[1])] : null;
        if (!row || !m) continue;
        row.classList.add('bad');
        row.cells[5].append(el('div', {}, text));
        row.querySelector(`[name="${m[2]}"]`)?.classList.add('invalid');
      }
      fill($('#roster-result'), el('p', { class: 'problem' }, byField.length ? 'Not saved: see the marked lines.' : /** @type {Error} */ (e).message));
    }
  });
}
