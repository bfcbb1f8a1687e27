// Shift report: pick a date and a shift of the configured pattern; the sections as tables, a CSV download and a
// print layout (one section per page). Without a choice the server answers with the last finished shift.
import { el, fill, $, param } from '../core/dom.js';
import { getJson } from '../core/api.js';
import { frame } from '../core/shell.js';
import { withUnit, number, when, zoneName, alertStateWords, maintenanceWords } from '../core/format.js';

frame('shift.html');
const form = $('#shift-form');
const dateInput = $('#f-date');
const shiftSelect = $('#f-shift');

const plural = (n, word) => `${n} ${word}${n === 1 ? '' : 's'}`;
const mv = (v) => withUnit(v, 'mV', 1);

function table(id, headers, rows, empty) {
  if (rows.length === 0) return el('p', { class: 'notice', id: `${id}-none` }, empty);
  return el('div', { class: 'table-box' }, el('table', { id: `${id}-table` },
    el('thead', {}, el('tr', {}, headers.map(([label, cls]) => el('th', { class: cls ?? null, scope: 'col' }, label)))),
    el('tbody', {}, rows)));
}

const lotLink = (lot) => el('a', { href: `lot.html?lot=${encodeURIComponent(lot)}` }, lot);
const chartLink = (code, title) => el('a', { href: `chart.html?context=${encodeURIComponent(code)}` }, title ?? code);
const alertLink = (id) => el('a', { href: `alerts.html?alert=${id}&state=` }, `#${id}`);
const wafer = (slot) => (slot ? ` · W${slot}` : '');

const alertHeaders = [['alert'], ['chart'], ['rules'], ['severity'], ['state at the shift end'], ['signals measured'], ['raised'], ['lot · wafer'], ['chamber'], ['predicted ΔVT sat', 'num']];
const span = (first, last) => (when(first) === when(last) ? when(first) : `${when(first)} – ${when(last)}`);
function alertRow(a) {
  return el('tr', { dataset: { alert: a.id, state: a.state_at_shift_end } },
    el('td', {}, alertLink(a.id)), el('td', {}, chartLink(a.context, a.context_title)),
    el('td', {}, `${a.rule}: ${a.rule_text}`, (a.rules ?? []).length > 1 ? `; also ${a.rules.filter((r) => r !== a.rule).join(', ')}` : ''), el('td', {}, el('span', { class: `sev ${a.severity}` }, a.severity)),
    el('td', {}, alertStateWords[a.state_at_shift_end] ?? a.state_at_shift_end, a.escalated_by_shift_end ? ' · escalated' : ''),
    el('td', {}, a.first_signal_measured_at ? span(a.first_signal_measured_at, a.last_signal_measured_at) : '—'), el('td', {}, when(a.raised_at)), el('td', {}, lotLink(a.lot_id), wafer(a.wafer_slot)), el('td', {}, a.chamber ?? '—'),
    el('td', { class: 'num' }, mv(a.predicted_dvt_sat_mv)));
}

function steps(list) {
  if (!list) return '';
  return el('ul', { class: 'steps-taken' }, list.map((s) => el('li', {}, `${s.done ? '✓ done' : '✗ not done'}: ${s.step}`, s.note ? ` (${s.note})` : '')));
}

function capabilityCell(w, unit) {
  return [
    el('td', { class: 'num' }, plural(w.points, 'point')),
    el('td', { class: 'num' }, withUnit(w.mean, unit)),
    el('td', { class: 'num' }, withUnit(w.sigma_within, unit, 4)),
    el('td', { class: 'num' }, w.cpk == null ? el('span', { class: 'muted' }, `no Cpk: ${w.reason}`) : `Cpk ${number(w.cpk, 2)}`),
  ];
}

function render(r) {
  const range = `${when(r.start)} – ${when(r.end)}`;
  fill($('#report-title'), `Shift report: ${r.shift}, ${r.date}`);
  fill($('#report-summary'), `${r.shift} shift of ${r.date} (pattern zone ${r.time_zone}): ${range} in your browser's zone (${zoneName}), `,
    withUnit(r.length_hours, 'h', 1), ` · ${r.status.replace('_', ' ')} · generated ${when(r.generated_at)}`);
  fill($('#report-caution'), el('strong', {}, 'Predicted ΔVT: '), r.prediction_caution);

  fill($('#lots'), table('lots', [['lot'], ['product'], ['step'], ['wafers', 'num'], ['sites', 'num'], ['chambers'], ['first measured'], ['last measured']],
    r.lots_measured.map((l) => el('tr', {}, el('td', {}, lotLink(l.lot_id)), el('td', {}, l.product), el('td', {}, l.step),
      el('td', { class: 'num' }, plural(l.wafer_count, 'wafer')), el('td', { class: 'num' }, plural(l.site_count, 'site')),
      el('td', {}, l.chambers.join(', ') || '—'), el('td', {}, when(l.first_measured_at)), el('td', {}, when(l.last_measured_at)))),
    'No lot was measured in this shift.'));

  fill($('#raised'), table('raised', alertHeaders, r.alerts_raised.map(alertRow), 'No alert was raised in this shift.'));

  fill($('#signals-measured'), table('measured', [['alert'], ['chart'], ['rules'], ['signal points', 'num'], ['lots', 'num'], ['measured'], ['raised']],
    r.signals_measured.map((m) => el('tr', { dataset: { alert: m.alert_id ?? '' } },
      el('td', {}, m.alert_id ? alertLink(m.alert_id) : '—'), el('td', {}, chartLink(m.context, m.context_title)), el('td', {}, m.rules.join(', ')),
      el('td', { class: 'num' }, plural(m.signal_points, 'point')), el('td', { class: 'num' }, plural(m.lots, 'lot')),
      el('td', {}, span(m.first_measured_at, m.last_measured_at)),
      el('td', {}, m.raised_at ? `${when(m.raised_at)}${m.raised_in_shift ? '' : ' (another shift)'}` : '—'))),
    'No point measured in this shift fired a rule.'));

  fill($('#actions'), table('actions', [['alert'], ['chart'], ['rule'], ['lot'], ['action'], ['when'], ['by'], ['comment'], ['reaction-plan steps']],
    r.alert_actions.map((a) => el('tr', { dataset: { alert: a.alert_id, action: a.action } },
      el('td', {}, alertLink(a.alert_id)), el('td', {}, chartLink(a.context)), el('td', {}, a.rule), el('td', {}, lotLink(a.lot_id)),
      el('td', {}, a.action), el('td', {}, when(a.at)), el('td', {}, a.by), el('td', {}, a.comment || '—'), el('td', {}, steps(a.steps)))),
    'No alert was acknowledged, dispositioned or closed in this shift.'));

  fill($('#maintenance'), table('maintenance', [['finished'], ['chamber or tool'], ['what was done'], ['done by'], ['note'], ['recorded by'], ['charts of this chamber only']],
    r.maintenance_performed.map((m) => el('tr', { dataset: { event: m.id } },
      el('td', {}, when(m.occurred_at)), el('td', {}, m.chamber), el('td', {}, el('span', { class: 'maint' }, maintenanceWords[m.kind] ?? m.kind)),
      el('td', {}, m.performed_by), el('td', {}, m.note || '—'), el('td', {}, m.recorded_by),
      el('td', {}, m.contexts.length ? m.contexts.map((c, i) => [i ? ', ' : '', chartLink(c.context, c.context_title)]) : '—'))),
    'No chamber maintenance finished in this shift: none recorded in the maintenance log.'));

  fill($('#open-alerts'), table('open', alertHeaders, r.alerts_open_at_end.map(alertRow), 'Every alert was closed at the end of this shift.'));

  fill($('#out-of-control'), table('ooc', [['chart'], ['product · step'], ['parameter'], ['chamber'], ['alerts not closed', 'num'], ['worst severity'], ['rules']],
    r.contexts_out_of_control.map((c) => el('tr', { dataset: { context: c.context } },
      el('td', {}, el('span', { class: 'state-word' }, '▲ out of control '), chartLink(c.context, c.title)), el('td', {}, `${c.product} · ${c.step}`),
      el('td', {}, c.parameter), el('td', {}, c.chamber ?? 'all'), el('td', { class: 'num' }, plural(c.alerts_not_closed, 'alert')),
      el('td', {}, el('span', { class: `sev ${c.worst_severity}` }, c.worst_severity)), el('td', {}, c.rules.join(', ')))),
    'No chart was out of control at the end of this shift.'));

  fill($('#risks'), table('risks', [['lot · wafer'], ['chamber'], ['measured'], ['predicted ΔVT sat', 'num'], ['electrical concern', 'num'], ['chart'], ['also on']],
    r.dvt_risks.map((d) => el('tr', { dataset: { lot: d.lot_id } },
      el('td', {}, lotLink(d.lot_id), wafer(d.wafer_slot)), el('td', {}, d.chamber ?? '—'), el('td', {}, when(d.measured_at)),
      el('td', { class: 'num' }, mv(d.predicted_dvt_sat_mv), Math.abs(d.predicted_dvt_sat_mv) >= d.electrical_concern_mv ? el('strong', {}, ' ▲ at or above concern') : ''),
      el('td', { class: 'num' }, mv(d.electrical_concern_mv)), el('td', {}, chartLink(d.context)), el('td', {}, d.also_in_contexts.join(', ') || '—'))),
    'No wafer measured in this shift has a predicted ΔVT.'));

  fill($('#capability'), table('capability',
    [['chart'], ['spec', 'num'], ['shift: points', 'num'], ['mean', 'num'], ['σ within', 'num'], ['Cpk', 'num'],
      ['7 days before: points', 'num'], ['mean', 'num'], ['σ within', 'num'], ['Cpk', 'num'], ['change', 'num']],
    r.capability_changes.map((c) => el('tr', { dataset: { context: c.context } },
      el('td', {}, chartLink(c.context)),
      el('td', { class: 'num' }, `${c.lsl == null ? '—' : withUnit(c.lsl, c.unit)} … ${c.usl == null ? '—' : withUnit(c.usl, c.unit)}`),
      capabilityCell(c.shift, c.unit), capabilityCell(c.previous_seven_days, c.unit),
      el('td', { class: 'num' }, c.cpk_change == null ? '—' : `${c.cpk_change >= 0 ? '+' : ''}${number(c.cpk_change, 2)} (Cpk)`))),
    'No chart watches a parameter with specification limits.'));
}

async function load(date, shift) {
  const q = date && shift ? `?${new URLSearchParams({ date, shift })}` : '';
  fill($('#report-problem'));
  try {
    const r = await getJson(`/api/reports/shift${q}`);
    fill(shiftSelect, r.shifts.map((s) => el('option', { value: s }, s)));
    shiftSelect.value = r.shift;
    dateInput.value = r.date;
    const chosen = new URLSearchParams({ date: r.date, shift: r.shift });
    $('#csv-link').href = `/api/reports/shift.csv?${chosen}`;
    history.replaceState(null, '', `?${chosen}`);
    render(r);
  } catch (e) {
    fill($('#report-problem'), el('p', { class: 'caution', role: 'alert' }, e.message));
  }
}

form.addEventListener('submit', (e) => {
  e.preventDefault();
  load(dateInput.value, shiftSelect.value);
});
$('#print-report').addEventListener('click', () => window.print());

await load(param('date'), param('shift'));
