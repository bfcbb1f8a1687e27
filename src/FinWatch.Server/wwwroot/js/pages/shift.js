// @ts-check
// Shift report as a handover: what needs action now, the outgoing supervisor's notes and both sign-offs, then the
// signals by when their points were measured, the alerts left open, actions, maintenance, lots, capability and the
// predicted ΔVT. Every time through when(), the zone said once; a section with nothing in it is one line on screen and
// left out of print. Without a choice the server answers with the last finished shift.
import { el, fill, $, param } from '../core/dom.js';
import { getJson, sendJson } from '../core/api.js';
import { frame, me } from '../core/shell.js';
import { withUnit, number, fixed, when, alertStateWords, maintenanceWords, stateWords } from '../core/format.js';

frame('shift.html');
const form = /** @type {HTMLFormElement} */ ($('#shift-form'));
const dateInput = /** @type {HTMLInputElement} */ ($('#f-date'));
const shiftSelect = /** @type {HTMLSelectElement} */ ($('#f-shift'));
const who = await me;
const maySign = (who.permissions ?? []).includes('disposition');

/** @param {number} n @param {string} word */
const plural = (n, word) => `${n} ${word}${n === 1 ? '' : 's'}`;
/** @param {number | null | undefined} v */
const mv = (v) => (v == null ? '—' : `${fixed(v, 1)} mV`);
/** @param {string} id @returns {HTMLElement} */
const byId = (id) => /** @type {HTMLElement} */ ($(`#${id}`));

/**
 * A table in a box that scrolls sideways when it must, or one muted line when there are no rows (the section is then
 * marked empty, which print leaves out).
 * @param {string} id @param {[string, string?][]} headers @param {HTMLElement[]} rows @param {string} empty
 */
function table(id, headers, rows, empty) {
  byId(id).closest('section')?.classList.toggle('empty', rows.length === 0);
  if (rows.length === 0) return el('p', { class: 'muted', id: `${id}-none` }, empty);
  return el('div', { class: 'table-box' }, el('table', { id: `${id}-table` },
    el('thead', {}, el('tr', {}, headers.map(([label, cls]) => el('th', { class: cls ?? null, scope: 'col' }, label)))),
    el('tbody', {}, rows)));
}

/** @param {string} lot */
const lotLink = (lot) => el('a', { href: `lot.html?lot=${encodeURIComponent(lot)}` }, lot);
/** @param {string} code @param {string} title */
const chartLink = (code, title) => el('a', { href: `chart.html?context=${encodeURIComponent(code)}` }, title);
/** @param {number} id */
const alertLink = (id) => el('a', { href: `alerts.html?alert=${id}&state=all` }, `alert ${id}`);
/** @param {number | null} slot */
const wafer = (slot) => (slot ? ` · wafer ${slot}` : '');
/** @param {string} first @param {string} last */
const span = (first, last) => (when(first) === when(last) ? when(first) : `${when(first)} – ${when(last)}`);
/** A state in word, shape and colour (the shape and colour from the CSS class). @param {string} state @param {string} [words] */
const stateMark = (state, words) => el('span', { class: `state ${state}` }, words ?? stateWords[state] ?? state);

/** @param {any} r */
function renderNeedsAction(r) {
  const n = r.needs_action;
  const items = [];
  if (n.alerts_not_acknowledged > 0) {
    items.push(el('li', {}, stateMark('out_of_control', plural(n.alerts_not_acknowledged, 'alert')), ' open, not yet acknowledged: ',
      el('a', { href: 'alerts.html?state=open' }, 'acknowledge them on the alerts page')));
  }
  if (n.alerts_escalated > 0) {
    items.push(el('li', {}, stateMark('out_of_control', plural(n.alerts_escalated, 'alert')), ' escalated to supervisors and not closed: ',
      el('a', { href: 'alerts.html?state=active&escalated=true' }, 'the escalated alerts')));
  }
  if (r.contexts_out_of_control.length > 0) {
    items.push(el('li', { id: 'ooc-charts' }, stateMark('out_of_control', plural(r.contexts_out_of_control.length, 'chart')), ' out of control:',
      el('ul', {}, r.contexts_out_of_control.map((/** @type {any} */ c) => el('li', {}, chartLink(c.context, c.title),
        ` (${plural(c.alerts_not_closed, 'alert')} not closed, worst `, el('span', { class: `sev ${c.worst_severity}` }, c.worst_severity), ')')))));
  }
  if (n.alerts_not_closed > 0) {
    items.push(el('li', {}, `${plural(n.alerts_not_closed, 'alert')} not closed in all: `, el('a', { href: 'alerts.html?state=active' }, 'the alert queue')));
  }
  fill(byId('needs-action'), items.length
    ? [el('p', { class: 'muted' }, "As the shift ended:"), el('ul', { class: 'action-list', id: 'action-list' }, items)]
    : el('p', { id: 'action-none' }, stateMark('in_control', 'nothing open'), ' every alert was closed and every chart in control at the shift\'s end.'));
}

/** @param {any} r */
function renderHandover(r) {
  const h = r.handover;
  const query = `?${new URLSearchParams({ date: r.date, shift: r.shift })}`;
  const message = el('p', { id: 'handover-problem', role: 'status' });
  /** @param {string} method @param {string} path @param {object} body */
  const send = async (method, path, body) => {
    try {
      await sendJson(method, `/api/reports/shift/handover${path}${query}`, body);
      await load(r.date, r.shift);
    } catch (e) {
      fill(message, el('span', { class: 'caution' }, /** @type {Error} */ (e).message));
    }
  };

  const started = r.status !== 'not_started';
  let notes;
  if (maySign && started && !h.notes_locked) {
    const area = /** @type {HTMLTextAreaElement} */ (el('textarea', { id: 'handover-notes', rows: 5, maxlength: 4000, 'aria-label': 'handover notes' }));
    area.value = h.notes;
    notes = el('form', { id: 'notes-form', class: 'handover-notes', onsubmit: (/** @type {Event} */ e) => { e.preventDefault(); send('PUT', '', { notes: area.value }); } },
      el('label', { for: 'handover-notes' }, 'Notes of the outgoing supervisor for the incoming shift'), area,
      el('div', {}, el('button', { type: 'submit', id: 'save-notes' }, 'Save notes'),
        h.notes_by ? el('span', { class: 'muted' }, ` last saved by ${h.notes_by}, ${when(h.notes_at)}`) : ''),
      el('p', { class: 'handover-text print-only' }, h.notes || 'No handover notes were written.'));
  } else {
    notes = h.notes
      ? el('div', {}, el('p', { id: 'handover-text', class: 'handover-text' }, h.notes),
        el('p', { class: 'muted' }, `Written by ${h.notes_by}, ${when(h.notes_at)}${h.notes_locked ? '; locked since the outgoing supervisor signed' : ''}.`))
      : el('p', { class: 'muted', id: 'handover-text' }, started ? 'No handover notes were written.' : 'The shift has not started: no handover yet.');
  }

  /** @param {'outgoing' | 'incoming'} role @param {string} words */
  const signature = (role, words) => {
    const s = h[role];
    if (s) return el('li', { id: `signed-${role}` }, el('strong', {}, `${words}: `), `signed by ${s.by}, ${when(s.at)}`);
    const ready = role === 'outgoing' ? h.notes !== '' : h.outgoing !== null && h.outgoing.by !== who.name;
    const why = role === 'outgoing' ? 'not signed; the notes are signed once written' : h.outgoing ? 'not signed; another person than the outgoing supervisor signs' : 'not signed; signs after the outgoing supervisor';
    return el('li', { id: `signed-${role}` }, el('strong', {}, `${words}: `), why,
      maySign && started && ready ? [' ', el('button', { type: 'button', id: `sign-${role}`, onclick: () => send('POST', '/sign-off', { role }) }, `Sign as ${words.toLowerCase()}`)] : '');
  };
  fill(byId('handover'), notes, el('ul', { class: 'sign-offs' }, signature('outgoing', 'Outgoing supervisor'), signature('incoming', 'Incoming supervisor')), message);
}

/** @param {any} a */
function openAlertRow(a) {
  return el('tr', { dataset: { alert: a.id, state: a.state_at_shift_end } },
    el('td', {}, alertLink(a.id)), el('td', {}, chartLink(a.context, a.context_title)),
    el('td', {}, a.rule_text, (a.rules ?? []).length > 1 ? ` (and ${a.rules.length - 1} more rule${a.rules.length > 2 ? 's' : ''})` : ''),
    el('td', {}, el('span', { class: `sev ${a.severity}` }, a.severity)),
    el('td', {}, alertStateWords[a.state_at_shift_end] ?? a.state_at_shift_end, a.escalated_by_shift_end ? ', escalated' : ''),
    el('td', {}, span(a.first_signal_measured_at, a.last_signal_measured_at)),
    el('td', {}, lotLink(a.lot_id), wafer(a.wafer_slot)),
    el('td', { class: 'num' }, mv(a.predicted_dvt_sat_mv)));
}

/** @param {any[] | null} list */
function steps(list) {
  if (!list) return '';
  return el('ul', { class: 'steps-taken' }, list.map((s) => el('li', {}, `${s.done ? '✓ done' : '✗ not done'}: ${s.step}`, s.note ? ` (${s.note})` : '')));
}

/** Cpk of a window with its points, or why there is none. @param {any} w */
const cpk = (w) => (w.cpk == null ? el('span', { class: 'muted' }, w.reason) : `Cpk ${number(w.cpk, 2)} (${plural(w.points, 'point')})`);

/** @param {any} c */
function capabilityRow(c) {
  const stable = c.state_at_shift_end === 'in_control';
  const stability = c.state_at_shift_end === 'out_of_control'
    ? [stateMark('out_of_control', 'not stable'), ': indices do not predict']
    : stable ? stateMark('in_control', 'stable') : [stateMark('baseline', 'no limits yet'), ': stability not judged'];
  const w = c.last_seven_days;
  const change = c.cpk_change == null ? '' : `; ${c.cpk_change >= 0 ? '+' : '−'}${number(Math.abs(c.cpk_change), 2)} against the 7 days before`;
  return el('tr', { dataset: { context: c.context, state: c.state_at_shift_end } },
    el('td', {}, chartLink(c.context, c.context_title)), el('td', {}, stability),
    el('td', { class: 'num' }, `${c.lsl == null ? '—' : withUnit(c.lsl, c.unit)} to ${c.usl == null ? '—' : withUnit(c.usl, c.unit)}`),
    el('td', { class: 'num' }, withUnit(w.mean, c.unit)), el('td', { class: 'num' }, withUnit(w.sigma_within, c.unit, 4)),
    el('td', { class: 'num' }, cpk(w)),
    el('td', {}, c.shift.cpk == null ? el('span', { class: 'muted' }, c.shift.reason) : [`Cpk ${number(c.shift.cpk, 2)}`, change]));
}

/** @param {any} r */
function render(r) {
  fill(byId('report-title'), `Shift report: ${r.shift} shift`);
  const status = { finished: 'finished', in_progress: 'in progress', not_started: 'not started' }[/** @type {'finished'} */ (r.status)] ?? r.status;
  fill(byId('report-summary'), `${when(r.start)} – ${when(r.end)} (`, withUnit(r.length_hours, 'h', 1), `), ${status}; `,
    `report made ${when(r.generated_at)}.`);
  fill(byId('report-caution'), el('strong', {}, 'Predicted ΔVT: '), r.prediction_caution);

  renderNeedsAction(r);
  renderHandover(r);

  fill(byId('signals-measured'), table('signals-measured', [['measured'], ['chart'], ['rules fired'], ['signal points', 'num'], ['lots', 'num'], ['alert'], ['alert raised']],
    r.signals_measured.map((/** @type {any} */ m) => el('tr', { dataset: { alert: m.alert_id ?? '' } },
      el('td', {}, span(m.first_measured_at, m.last_measured_at)), el('td', {}, chartLink(m.context, m.context_title)),
      el('td', {}, m.rule_texts.join('; ')),
      el('td', { class: 'num' }, plural(m.signal_points, 'point')), el('td', { class: 'num' }, plural(m.lots, 'lot')),
      el('td', {}, m.alert_id ? alertLink(m.alert_id) : '—'),
      el('td', {}, m.raised_at ? `${when(m.raised_at)}${m.raised_in_shift ? '' : ' (in another shift)'}` : '—'))),
    'No point measured in this shift fired a rule.'));

  fill(byId('open-alerts'), table('open-alerts', [['alert'], ['chart'], ['rule'], ['severity'], ['state at the end'], ['signals measured'], ['lot · wafer'], ['predicted ΔVT sat', 'num']],
    r.alerts_open_at_end.map(openAlertRow), 'Every alert was closed at the end of this shift.'));

  fill(byId('actions'), table('actions', [['when'], ['alert'], ['chart'], ['action'], ['by'], ['comment'], ['reaction-plan steps']],
    r.alert_actions.map((/** @type {any} */ a) => el('tr', { dataset: { alert: a.alert_id, action: a.action } },
      el('td', {}, when(a.at)), el('td', {}, alertLink(a.alert_id), ` · lot `, lotLink(a.lot_id)), el('td', {}, chartLink(a.context, a.context_title)),
      el('td', {}, alertStateWords[a.action] ?? a.action), el('td', {}, a.by), el('td', {}, a.comment || '—'), el('td', {}, steps(a.steps)))),
    'No alert was acknowledged, dispositioned or closed in this shift.'));

  fill(byId('maintenance'), table('maintenance', [['finished'], ['chamber or tool'], ['what was done'], ['done by'], ['note'], ['recorded by'], ['charts of this chamber only']],
    r.maintenance_performed.map((/** @type {any} */ m) => el('tr', { dataset: { event: m.id } },
      el('td', {}, when(m.occurred_at)), el('td', {}, m.chamber), el('td', {}, el('span', { class: 'maint' }, maintenanceWords[m.kind] ?? m.kind)),
      el('td', {}, m.performed_by), el('td', { class: 'wrap' }, m.note || '—'), el('td', {}, m.recorded_by),
      el('td', {}, m.contexts.length ? m.contexts.map((/** @type {any} */ c, /** @type {number} */ i) => [i ? ', ' : '', chartLink(c.context, c.context_title)]) : '—'))),
    'No chamber maintenance finished in this shift.'));

  fill(byId('lots'), table('lots', [['lot'], ['product · step'], ['wafers', 'num'], ['sites', 'num'], ['chambers'], ['measured']],
    r.lots_measured.map((/** @type {any} */ l) => el('tr', {}, el('td', {}, lotLink(l.lot_id)), el('td', {}, `${l.product} · ${l.step}`),
      el('td', { class: 'num' }, plural(l.wafer_count, 'wafer')), el('td', { class: 'num' }, plural(l.site_count, 'site')),
      el('td', {}, l.chambers.join(', ') || '—'), el('td', {}, span(l.first_measured_at, l.last_measured_at)))),
    'No lot was measured in this shift.'));

  fill(byId('capability'), table('capability',
    [['chart'], ['stability at the end'], ['spec', 'num'], ['mean', 'num'], ['σ within', 'num'], ['Cpk, 7 days', 'num'], ['this shift alone']],
    r.capability_changes.map(capabilityRow), 'No chart watches a parameter with specification limits.'));

  fill(byId('risks'), table('risks', [['lot · wafer'], ['chamber'], ['measured'], ['predicted ΔVT sat', 'num'], ['electrical concern', 'num'], ['chart']],
    r.dvt_risks.map((/** @type {any} */ d) => el('tr', { dataset: { lot: d.lot_id } },
      el('td', {}, lotLink(d.lot_id), wafer(d.wafer_slot)), el('td', {}, d.chamber ?? '—'), el('td', {}, when(d.measured_at)),
      el('td', { class: 'num' }, mv(d.predicted_dvt_sat_mv), Math.abs(d.predicted_dvt_sat_mv) >= d.electrical_concern_mv ? el('strong', {}, ' ▲ at or above concern') : ''),
      el('td', { class: 'num' }, mv(d.electrical_concern_mv)),
      el('td', {}, chartLink(d.context, d.context_title),
        d.also_in_context_titles.length ? el('span', { class: 'muted', title: d.also_in_context_titles.join(', ') }, ` and ${plural(d.also_in_context_titles.length, 'other chart')}`) : ''))),
    'No wafer measured in this shift has a predicted ΔVT.'));
}

/** @param {string | null} date @param {string | null} shift */
async function load(date, shift) {
  const q = date && shift ? `?${new URLSearchParams({ date, shift })}` : '';
  fill(byId('report-problem'));
  try {
    const r = await getJson(`/api/reports/shift${q}`);
    fill(shiftSelect, r.shifts.map((/** @type {string} */ s) => el('option', { value: s }, s)));
    shiftSelect.value = r.shift;
    dateInput.value = r.date;
    const chosen = new URLSearchParams({ date: r.date, shift: r.shift });
    /** @type {HTMLAnchorElement} */ ($('#csv-link')).href = `/api/reports/shift.csv?${chosen}`;
    history.replaceState(null, '', `?${chosen}`);
    render(r);
  } catch (e) {
    fill(byId('report-problem'), el('p', { class: 'caution', role: 'alert' }, /** @type {Error} */ (e).message));
  }
}

form.addEventListener('submit', (e) => {
  e.preventDefault();
  load(dateInput.value, shiftSelect.value);
});
byId('print-report').addEventListener('click', () => window.print());

await load(param('date'), param('shift'));
