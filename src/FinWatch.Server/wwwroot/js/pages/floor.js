// Floor overview: one tile per chart context, worst first, updated from the live feed.
import { el, fill, $ } from '../core/dom.js';
import { getJson } from '../core/api.js';
import { frame } from '../core/shell.js';
import { LiveFeed } from '../core/live.js';
import { withUnit, when, stateWords, maintenanceSince } from '../core/format.js';

const banner = frame('index.html');
const board = $('#board');
const tally = $('#tally');
let contexts = [];

function tile(c) {
  const last = c.last_point;
  return el('a', { class: `tile ${c.state}`, href: `chart.html?context=${encodeURIComponent(c.code)}`, dataset: { context: c.code, state: c.state } },
    el('div', { class: 'title' }, c.title),
    el('div', { class: `state ${c.state}` }, stateWords[c.state] ?? c.state),
    el('div', { class: 'last' }, last ? withUnit(last.value, c.unit) : '—'),
    el('div', { class: 'meta' },
      el('span', {}, last ? `lot ${last.lot_id}${last.wafer_slot ? ` W${last.wafer_slot}` : ''}` : 'no points yet'),
      el('span', {}, last ? when(last.measured_at) : '')),
    el('div', { class: 'meta' },
      c.open_alerts > 0
        ? el('span', {}, el('span', { class: `sev ${c.worst_severity}` }, c.worst_severity), ` ${c.open_alerts} active alert${c.open_alerts > 1 ? 's' : ''}`,
            c.unacknowledged_alerts > 0 ? `, ${c.unacknowledged_alerts} not acknowledged` : '',
            c.escalated_alerts > 0 ? `, ${c.escalated_alerts} escalated` : '')
        : el('span', {}, c.phase === 'baseline' ? `${c.points} baseline points` : 'no active alerts'),
      last?.predicted_dvt_sat_mv != null ? el('span', { title: 'predicted ΔVT (saturation), engineering estimate' }, `ΔVT ${withUnit(last.predicted_dvt_sat_mv, 'mV', 1)}`) : ''),
    c.maintenance ? el('div', { class: 'meta' }, el('span', { class: 'maint' }, maintenanceLine(c.maintenance))) : '');
}

/** The chart's last maintenance in words, and a suggested new baseline. */
function maintenanceLine(m) {
  const since = maintenanceSince(m, true);
  return m.baseline.suggest_new_baseline ? `${since} · new baseline suggested` : since;
}

function render(flash = new Set()) {
  const counts = { out_of_control: 0, in_control: 0, baseline: 0 };
  for (const c of contexts) counts[c.state] = (counts[c.state] ?? 0) + 1;
  fill(tally,
    el('span', { class: 'state out_of_control' }, el('b', {}, counts.out_of_control), ' out of control'),
    el('span', { class: 'state in_control' }, el('b', {}, counts.in_control), ' in control'),
    el('span', { class: 'state baseline' }, el('b', {}, counts.baseline), ' in baseline'));
  fill(board, contexts.map((c) => {
    const t = tile(c);
    if (flash.has(c.code)) t.classList.add('flash');
    return t;
  }));
}

async function load() {
  contexts = await getJson('/api/contexts');
  render();
}

// Entries come in bursts (one per point of an ingest); refresh the changed tiles once per burst.
const changed = new Set();
let timer = null;
function onEntry(entry) {
  changed.add(entry.context);
  timer ??= setTimeout(refresh, 300);
}

async function refresh() {
  timer = null;
  const codes = [...changed];
  changed.clear();
  if (codes.length > 8) {
    contexts = await getJson('/api/contexts');
  } else {
    for (const code of codes) {
      const fresh = await getJson(`/api/contexts/${encodeURIComponent(code)}`);
      const i = contexts.findIndex((c) => c.code === code);
      if (i >= 0) contexts[i] = fresh; else contexts.push(fresh);
    }
    contexts = order(contexts);
  }
  render(new Set(codes));
}

const severityOrder = ['none', 'low', 'medium', 'high', 'critical'];
function order(list) {
  // Same order as the server's list: out of control first, then by worst severity, unacknowledged alerts, code.
  return [...list].sort((a, b) =>
    (b.state === 'out_of_control') - (a.state === 'out_of_control')
    || severityOrder.indexOf(b.worst_severity) - severityOrder.indexOf(a.worst_severity)
    || b.unacknowledged_alerts - a.unacknowledged_alerts
    || (a.code < b.code ? -1 : a.code > b.code ? 1 : 0));
}

await new LiveFeed({ all: true, onEntry, banner }).start(load);
