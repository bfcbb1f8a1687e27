// @ts-check
// Floor overview: one tile per chart context, worst first, with the floor's expected false alarms; updated from the live feed.
import { el, fill, $ } from '../core/dom.js';
import { getJson } from '../core/api.js';
import { frame, me } from '../core/shell.js';
import { LiveFeed } from '../core/live.js';
import { fixed, unitLabel, when, stateWords, maintenanceSince } from '../core/format.js';

const banner = frame('index.html');
const board = $('#board');
const tally = $('#tally');
let contexts = [];

// Decimals per unit, the same on every tile, so that tiles compare at a glance.
const digits = { nm: 2, '°': 2, mV: 1 };
const svgNs = 'http://www.w3.org/2000/svg';

/** @param {string} tag @param {Record<string, string|number>} attrs */
function svg(tag, attrs) {
  const node = document.createElementNS(svgNs, tag);
  for (const [k, v] of Object.entries(attrs)) node.setAttribute(k, String(v));
  return node;
}

/**
 * The chart's latest points as a small line with the limits each was judged by (dashed) and its centre (thin); a point
 * where a rule fired is a triangle, as on the chart. Decorative for screen readers: the tile says the same in words.
 */
function sparkline(c) {
  const pts = c.recent ?? [];
  const box = svg('svg', { class: 'spark', viewBox: '0 0 200 44', preserveAspectRatio: 'none', 'aria-hidden': 'true' });
  if (pts.length < 2) return box;
  const ys = pts.flatMap((p) => [p.value, p.ucl, p.lcl].filter((v) => v != null));
  let lo = Math.min(...ys), hi = Math.max(...ys);
  if (hi - lo < 1e-12) { lo -= 1; hi += 1; }
  const x = (i) => 4 + (i * 192) / (pts.length - 1);
  const y = (v) => 40 - ((v - lo) / (hi - lo)) * 36;
  const line = (key, cls) => {
    const segs = pts.map((p, i) => (p[key] == null ? null : `${x(i).toFixed(1)},${y(p[key]).toFixed(1)}`));
    if (segs.every((s) => s == null)) return;
    box.append(svg('polyline', { class: cls, points: segs.filter(Boolean).join(' ') }));
  };
  line('ucl', 'limit');
  line('lcl', 'limit');
  line('centre', 'centre');
  line('value', 'value');
  pts.forEach((p, i) => {
    if (!p.signal) return;
    const cx = x(i), cy = y(p.value);
    box.append(svg('polygon', { class: 'signal', points: `${cx},${cy - 4} ${cx - 3.5},${cy + 3} ${cx + 3.5},${cy + 3}` }));
  });
  return box;
}

function tile(c) {
  const last = c.last_point;
  const unit = unitLabel(c.unit);
  const d = digits[unit] ?? 3;
  const dvt = last?.predicted_dvt_sat_mv;
  const over = dvt != null && Math.abs(dvt) >= c.electrical_concern_mv;
  return el('a', { class: `tile ${c.state}`, href: `chart.html?context=${encodeURIComponent(c.code)}`, dataset: { context: c.code, state: c.state } },
    el('div', { class: 'title' }, c.title),
    el('div', { class: `state ${c.state}` }, stateWords[c.state] ?? c.state),
    c.open_alerts > 0
      ? el('div', { class: 'urgent' },
          el('span', { class: `sev ${c.worst_severity}` }, c.worst_severity),
          c.unacknowledged_alerts > 0 ? el('b', { class: 'unack' }, `${c.unacknowledged_alerts} not acknowledged`) : el('span', {}, 'acknowledged'),
          c.escalated_alerts > 0 ? el('b', { class: 'unack' }, 'escalated') : '')
      : '',
    c.out_of_control_since ? el('div', { class: 'since' }, `out of control since ${when(c.out_of_control_since)}`) : '',
    sparkline(c),
    el('div', { class: 'last' }, last ? `${fixed(last.value, d)}${unit === '°' ? '°' : ` ${unit}`}` : '—'),
    el('div', { class: 'meta' },
      el('span', {}, last ? `lot ${last.lot_id}${last.wafer_slot ? ` W${last.wafer_slot}` : ''}` : 'no points yet'),
      el('span', {}, last ? when(last.measured_at) : '')),
    el('div', { class: 'meta' },
      el('span', {}, c.open_alerts > 0 ? `${c.open_alerts} active alert${c.open_alerts > 1 ? 's' : ''}` : c.phase === 'baseline' ? `${c.points} baseline points` : 'no active alerts'),
      dvt != null
        ? el('span', { class: over ? 'dvt over' : 'dvt', title: 'predicted threshold shift at saturation of the last point: an engineering estimate from the measured profile, not an electrical test result' },
            `${over ? '▲ ' : ''}est. ΔVT ${fixed(dvt, 1)} mV / ±${fixed(c.electrical_concern_mv, 0)} mV`)
        : ''),
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
  budget();
}

// The alarm budget of the whole floor: how many false alarms its charts are expected to raise in a shift while in control.
async function budget() {
  if (!(await me).permissions.includes('read')) return; // a wall screen shows the tiles only
  try {
    const b = await getJson('/api/run-length');
    const shift = b.shifts[0];
    fill($('#budget'), shift
      ? `Alarm budget: about ${fixed(shift.expected_false_alarms, 2)} false alarms expected per ${fixed(shift.length_hours, 0)} h shift from the ${b.charts_counted} charts with approved limits while the process is in control.`
      : '');
  } catch {
    fill($('#budget'), '');
  }
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
