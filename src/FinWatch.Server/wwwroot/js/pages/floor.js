// @ts-check
// Floor overview: one tile per chart context, worst first, with the floor's expected false alarms; updated from the live feed.
import { el, fill, $, svg, param } from '../core/dom.js';
import { getJson } from '../core/api.js';
import { frame, me } from '../core/shell.js';
import { LiveFeed } from '../core/live.js';
import { alarm } from '../core/alarm.js';
import { fixed, unitLabel, when, stateWords, maintenanceSince } from '../core/format.js';

const banner = frame('index.html', { watchesAll: true });
const waiting = alarm($('#alarm-host'), /** @type {HTMLInputElement} */ ($('#alarm-on')));
const board = $('#board');
const tally = $('#tally');
let contexts = [];
/** Which tool each chamber belongs to (the equipment seen in the measurements), for the grouped view. */
let toolOf = new Map();

// The view and the layout live in the address, so a wall screen's link keeps them; a display token means a wall screen.
const viewSelect = $('#view');
const layoutSelect = $('#layout');
viewSelect.value = param('view') === 'chambers' ? 'chambers' : 'worst';
layoutSelect.value = param('layout') === 'wall' || (param('layout') !== 'desk' && (await me).via === 'display') ? 'wall' : 'desk';
for (const select of [viewSelect, layoutSelect]) {
  select.addEventListener('change', () => {
    const q = new URLSearchParams(location.search);
    q.set(select.id, select.value);
    history.replaceState(null, '', `?${q}`);
    applyLayout();
    if (select === viewSelect) loadTools().then(() => render()); else render();
  });
}

/** The tool of each chamber, from the equipment seen in stored rows; asked once, and only for the grouped view. */
async function loadTools() {
  if (viewSelect.value !== 'chambers' || toolOf.size > 0 || !(await me).permissions.includes('read')) return;
  try {
    const known = await getJson('/api/measurements/known-values');
    toolOf = new Map([...known.etch_tools, ...known.liner_tools].flatMap((t) => t.chambers.map((c) => [c, t.tool])));
  } catch {
    toolOf = new Map(); // the groups are still named by chamber
  }
}

function applyLayout() {
  document.body.classList.toggle('wall', layoutSelect.value === 'wall');
  fill($('#floor-title'), viewSelect.value === 'chambers' ? 'Floor: charts by tool and chamber' : 'Floor: every chart, worst first');
}
applyLayout();

// Decimals per unit, the same on every tile, so that tiles compare at a glance.
const digits = { nm: 2, '°': 2, mV: 1 };
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
  const make = (c) => {
    const t = tile(c);
    if (flash.has(c.code)) t.classList.add('flash');
    return t;
  };
  const wall = layoutSelect.value === 'wall';
  // On a wall screen the charts that need someone are large tiles; the calm ones are one line each underneath.
  const isCalm = (c) => wall && c.state === 'in_control' && c.open_alerts === 0;
  const chips = (list) => (list.length === 0 ? '' : el('div', { class: 'calm' },
    el('span', { class: 'state in_control' }, `${list.length} in control, no active alert:`),
    list.map((c) => el('a', { class: 'chip', href: `chart.html?context=${encodeURIComponent(c.code)}`, dataset: { context: c.code } }, c.title))));
  const section = (list) => [el('div', { class: 'board' }, list.filter((c) => !isCalm(c)).map(make)), chips(list.filter(isCalm))];
  if (viewSelect.value !== 'chambers') {
    fill(board, section(contexts));
    return;
  }
  fill(board, groups(contexts).map((g) => el('section', { class: 'group', 'aria-label': g.name },
    el('h2', {}, g.name, el('span', { class: 'muted' }, ` · ${g.summary}`)), section(g.list))));
}

/**
 * The charts grouped by chamber under their tool, groups with the most charts out of control first; charts of a whole
 * step (no chamber) last. Within a group the floor's order (worst first) holds.
 */
function groups(list) {
  const byKey = new Map();
  for (const c of list) {
    const key = c.chamber ?? '';
    if (!byKey.has(key)) byKey.set(key, []);
    byKey.get(key).push(c);
  }
  return [...byKey.entries()].map(([chamber, charts]) => {
    const ooc = charts.filter((c) => c.state === 'out_of_control').length;
    const tool = toolOf.get(chamber);
    return {
      chamber, ooc, list: charts,
      name: chamber ? `${tool ? `tool ${tool} · ` : ''}chamber ${chamber}` : 'whole step, every chamber',
      summary: `${charts.length} chart${charts.length === 1 ? '' : 's'}, ${ooc} out of control`,
    };
  }).sort((a, b) => (a.chamber === '') - (b.chamber === '') || b.ooc - a.ooc || (a.chamber < b.chamber ? -1 : a.chamber > b.chamber ? 1 : 0));
}

async function load() {
  await loadTools();
  [contexts] = await Promise.all([getJson('/api/contexts'), waiting.load()]);
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
