// @ts-check
// Control chart of one context: points with the limits each was judged by, zones, target, signals as triangles with a
// key of the rules beside the chart, maintenance as diamonds on dashed lines, specification limits as lines or as edge
// markers; predicted ΔVT of the same points full width underneath on the same x-axis; capability led by the stability
// verdict, with a histogram that shows the specification limits. Live via the feed: the charts update in place.
import { el, fill, $, param, svg } from '../core/dom.js';
import { getJson } from '../core/api.js';
import { frame } from '../core/shell.js';
import { LiveFeed } from '../core/live.js';
import { withUnit, number, fixed, when, stateWords, unitLabel, maintenanceWords, maintenanceSince } from '../core/format.js';
import { drawChart, palette, fitRange, fixedAxisWidth } from '../core/charts.js';

const banner = frame('chart.html');
const select = { context: $('#context'), range: $('#range'), chamber: $('#chamber') };
/** The y-axes of the stacked charts share one width, so point n sits at the same x on both. */
const axisWidth = 78;
let context = null;
let product = null;
let points = [];          // every point loaded for the range (all chambers)
let markers = [];         // maintenance events of the chart's chambers, each with the first point after it
let control = null;
let dvt = null;
let capability = null;
let feed = null;

const [contexts, parameterList, ruleList] = await Promise.all([getJson('/api/contexts'), getJson('/api/parameters'), getJson('/api/spc/rules')]);
const parameters = Object.fromEntries(parameterList.map((p) => [p.name, p]));
const ruleWords = Object.fromEntries(ruleList.map((r) => [r.id, r.text]));
const code = param('context') ?? contexts[0]?.code;
fill(select.context, contexts.map((c) => el('option', { value: c.code, selected: c.code === code }, c.title)));
select.range.value = param('range') ?? '30';
select.context.addEventListener('change', () => navigate({ context: select.context.value, chamber: '' }));
select.range.addEventListener('change', () => navigate({ range: select.range.value }));
select.chamber.addEventListener('change', () => navigate({ chamber: select.chamber.value }));

function navigate(change) {
  const q = new URLSearchParams(location.search);
  for (const [k, v] of Object.entries(change)) { if (v) q.set(k, v); else q.delete(k); }
  location.search = q.toString();
}

const chamberFilter = () => param('chamber') ?? '';
const visible = () => points.filter((p) => !chamberFilter() || p.chamber === chamberFilter());
/** "Fin top width [nm]": the parameter's name with its unit, never its column name. */
const axisName = () => `${parameters[context.parameter]?.label ?? context.parameter} [${unitLabel(context.unit)}]`;

function rangeQuery() {
  const days = select.range.value;
  if (days === 'all') return '';
  const from = new Date(Date.now() - Number(days) * 86_400_000).toISOString();
  return `from=${encodeURIComponent(from)}`;
}

async function load() {
  if (!code) {
    fill($('#title'), 'No charts yet: a process engineer creates one for a product, step and parameter.');
    return;
  }
  context = await getJson(`/api/contexts/${encodeURIComponent(code)}`);
  product = await getJson(`/api/products/${encodeURIComponent(context.product)}`);
  points = await getJson(`/api/contexts/${encodeURIComponent(code)}/points?${rangeQuery()}&limit=20000`);
  markers = (await getJson(`/api/contexts/${encodeURIComponent(code)}/maintenance?${rangeQuery()}`)).markers;
  $('#limits-link').href = `limits.html?context=${encodeURIComponent(code)}`;
  document.title = `FinWatch · ${context.title}`;
  fill($('#title'), context.title);
  const chambers = [...new Set(points.map((p) => p.chamber).filter(Boolean))].sort();
  fill(select.chamber, el('option', { value: '' }, context.chamber ? `${context.chamber} (this chart's chamber)` : 'all chambers'),
    context.chamber ? [] : chambers.map((c) => el('option', { value: c, selected: c === chamberFilter() }, c)));
  select.chamber.disabled = Boolean(context.chamber);
  redrawAll();
  await drawCapability();
}

function redrawAll() {
  summary();
  // What both charts and the key share, worked out once: the points in view, the x-range, the control chart's y-range
  // (points and their limits) and the maintenance lines.
  const view = visible();
  const shared = {
    x: xRange(view),
    y: fitRange(view.flatMap((p) => [p.value, p.ucl, p.lcl])) ?? { min: 0, max: 1 },
    maintenance: maintenanceLines(view),
  };
  drawControl(view, shared);
  drawDvt(view, shared);
  drawKey(view, shared);
  signalsTable(view);
}

function spec() {
  return product?.specs?.find((s) => s.parameter === context.parameter) ?? null;
}

function summary() {
  const l = context.limits;
  const items = [
    el('div', {}, el('label', {}, 'state'), el('span', { class: `state ${context.state}` }, stateWords[context.state])),
    el('div', {}, el('label', {}, 'limits in force'), l
      ? `version ${l.version}: centre ${withUnit(l.centre, context.unit)}, UCL ${withUnit(l.ucl, context.unit)}, LCL ${withUnit(l.lcl, context.unit)} (approved by ${l.approved_by})`
      : 'none approved yet (baseline phase)'),
    el('div', {}, el('label', {}, 'chart'), `${context.chart_type === 'xbar' ? 'X̄ of' : 'individual'} ${context.subgroup === 'wafer' ? 'wafer means' : 'lot means'} · rules ${context.rules.join(', ')}`),
    el('div', {}, el('label', {}, 'active alerts'), context.open_alerts > 0
      ? el('a', { href: `alerts.html?context=${encodeURIComponent(context.code)}` }, `${context.open_alerts} (worst: ${context.worst_severity})`)
      : 'none'),
  ];
  const s = spec();
  if (s) items.push(el('div', {}, el('label', {}, 'specification'), `LSL ${withUnit(s.lower, context.unit)} · target ${withUnit(s.target, context.unit)} · USL ${withUnit(s.upper, context.unit)}`));
  const m = context.maintenance;
  items.push(el('div', {}, el('label', {}, 'last maintenance'), m
    ? el('span', { class: 'maint' }, `${maintenanceSince(m)} (finished ${when(m.last.at)})`)
    : 'none recorded for this chart\'s chamber'));
  fill($('#summary'), items);
  fill($('#suggestion'), m?.baseline.suggest_new_baseline
    ? el('div', { class: 'suggestion', role: 'status' }, el('b', {}, 'New baseline suggested. '), m.baseline.message, ' ',
      el('a', { href: `limits.html?context=${encodeURIComponent(context.code)}` }, 'Compute limits from the points after it'))
    : '');
}

/** Both charts show the same points: the x-range of the view, half a point of margin. */
function xRange(view) {
  if (view.length === 0) return { min: 0, max: 1 };
  return { min: view[0].seq - 0.5, max: view[view.length - 1].seq + 0.5 };
}

/** The maintenance markers of the points in view: a dashed line before the first point after each. */
function maintenanceLines(view) {
  if (view.length === 0) return [];
  const first = view[0].seq;
  const last = view[view.length - 1].seq;
  return markers
    .filter((m) => !chamberFilter() || m.chamber === chamberFilter())
    .map((m) => ({ ...m, x: (m.first_point ?? last + 1) - 0.5 }))
    .filter((m) => m.x >= first - 0.5 && m.x <= last + 0.5);
}

const sigmaOf = (p) => (p.ucl != null && p.centre != null ? (p.ucl - p.centre) / 3 : null);

function drawControl(view, { x, y, maintenance }) {
  const line = (pick) => view.map((p) => ({ x: p.seq, y: pick(p) }));
  const zone = (k) => line((p) => (sigmaOf(p) == null ? null : p.centre + k * sigmaOf(p)));
  const s = spec();
  const flat = (y) => (y == null || view.length === 0 ? [] : [{ x: x.min, y }, { x: x.max, y }]);
  const limitStyle = { borderColor: palette.signal, borderWidth: 1.5, pointRadius: 0, stepped: true, fill: false, spanGaps: false };
  const zoneStyle = { borderColor: palette.zone, borderWidth: 1, borderDash: [4, 4], pointRadius: 0, stepped: true, fill: false };
  const specStyle = { borderColor: palette.spec, borderDash: [12, 4], pointRadius: 0, borderWidth: 1.5 };
  // The y-axis fits the data, the control limits and the target; specification limits outside that range are said
  // by a marker at the plot's edge instead of squeezing the data into a band.
  const inside = (v) => v != null && v >= y.min && v <= y.max;
  const datasets = [
    {
      label: 'point', data: line((p) => p.value), borderColor: palette.ink, borderWidth: 1,
      pointRadius: view.map((p) => (p.signals.length ? 6 : 2.5)),
      pointStyle: view.map((p) => (p.signals.length ? 'triangle' : 'circle')),
      pointBackgroundColor: view.map((p) => (p.signals.length ? palette.signal : palette.ink)),
      pointBorderColor: view.map((p) => (p.signals.length ? palette.signal : palette.ink)),
      order: 0,
    },
    { label: 'centre line', data: line((p) => p.centre), borderColor: palette.steady, borderWidth: 1.5, pointRadius: 0, stepped: true },
    { label: 'UCL (3σ)', data: line((p) => p.ucl), ...limitStyle },
    { label: 'LCL (3σ)', data: line((p) => p.lcl), ...limitStyle },
    { label: 'zone +2σ', data: zone(2), ...zoneStyle }, { label: 'zone −2σ', data: zone(-2), ...zoneStyle },
    { label: 'zone +1σ', data: zone(1), ...zoneStyle }, { label: 'zone −1σ', data: zone(-1), ...zoneStyle },
  ];
  if (inside(s?.target)) datasets.push({ label: 'target', data: flat(s.target), borderColor: palette.spec, borderDash: [2, 3], pointRadius: 0, borderWidth: 1.5 });
  if (inside(s?.upper)) datasets.push({ label: 'USL', data: flat(s.upper), ...specStyle });
  if (inside(s?.lower)) datasets.push({ label: 'LSL', data: flat(s.lower), ...specStyle });
  if (maintenance.length) {
    datasets.push({
      label: 'maintenance', data: maintenance.map((m) => ({ x: m.x, y: y.max })), maintenance, showLine: false,
      pointStyle: 'rectRot', pointRadius: 7, pointHoverRadius: 9, pointBackgroundColor: palette.maintenance, borderColor: palette.maintenance,
    });
  }
  const edges = [
    s?.upper != null && !inside(s.upper) && { y: s.upper, label: `USL ${withUnit(s.upper, context.unit)}` },
    s?.lower != null && !inside(s.lower) && { y: s.lower, label: `LSL ${withUnit(s.lower, context.unit)}` },
    s?.target != null && !inside(s.target) && { y: s.target, label: `target ${withUnit(s.target, context.unit)}` },
  ].filter(Boolean);
  control = drawChart(control, $('#control'), {
    type: 'line',
    data: { datasets },
    options: {
      parsing: false,
      scales: {
        x: { type: 'linear', min: x.min, max: x.max, title: { display: true, text: `point number (one per ${context.subgroup}, in measured order)` }, ticks: { precision: 0, includeBounds: false } },
        y: { min: y.min, max: y.max, ticks: { includeBounds: false }, title: { display: true, text: axisName() }, ...fixedAxisWidth(axisWidth) },
      },
      plugins: {
        legend: { display: false },
        tooltip: { callbacks: { label: (item) => tooltip(view, item) } },
        finwatchVerticals: { lines: maintenance.map((m) => ({ x: m.x, color: palette.maintenance, dash: [6, 4], width: 1.5 })) },
        finwatchEdges: { marks: edges },
      },
    },
  });
  fill($('#legend'), `${view.length} points shown${chamberFilter() ? ` (chamber ${chamberFilter()})` : ''}. Limits step where a new version took effect: each point is judged by the limits in force when it was measured. Hover a point for its lot, wafer, time and the rules that fired.`);
}

function tooltip(view, item) {
  if (item.dataset.maintenance) {
    const m = item.dataset.maintenance[item.dataIndex];
    return `${maintenanceWords[m.kind] ?? m.kind} of ${m.chamber}, finished ${when(m.at)}: the points right of the line were measured after it`;
  }
  if (item.datasetIndex !== 0) return `${item.dataset.label}: ${withUnit(item.parsed.y, context.unit)}`;
  const p = view[item.dataIndex];
  return [
    `${withUnit(p.value, context.unit)} · lot ${p.lot_id}${p.wafer_slot ? ` wafer ${p.wafer_slot}` : ''} · ${p.chamber ?? ''}`,
    `${when(p.measured_at)} · ${p.n} sites${p.z != null ? ` · z = ${number(p.z, 2)}` : ''}`,
    ...(p.signals.length ? p.signals.map((r) => `${r}: ${ruleWords[r] ?? ''}`) : ['no rule fired']),
  ];
}

function drawDvt(all, { x, maintenance }) {
  const view = all.filter((p) => p.predicted_dvt_sat_mv != null);
  const concern = context.electrical_concern_mv;
  const over = (p) => Math.abs(p.predicted_dvt_sat_mv) > concern;
  const flat = (y) => [{ x: x.min, y }, { x: x.max, y }];
  const y = fitRange(view.map((p) => p.predicted_dvt_sat_mv).concat([concern, -concern])) ?? { min: -concern, max: concern };
  dvt = drawChart(dvt, $('#dvt'), {
    type: 'line',
    data: {
      datasets: [
        {
          label: 'predicted ΔVT sat, estimate', data: view.map((p) => ({ x: p.seq, y: p.predicted_dvt_sat_mv })), borderColor: palette.electrical, borderWidth: 1,
          pointStyle: view.map((p) => (over(p) ? 'rect' : 'circle')), pointRadius: view.map((p) => (over(p) ? 5 : 2)),
          pointBackgroundColor: view.map((p) => (over(p) ? palette.electrical : palette.card)), pointBorderColor: palette.electrical,
        },
        { label: `electrical concern +${concern} mV`, data: flat(concern), borderColor: palette.electrical, borderDash: [6, 4], pointRadius: 0, borderWidth: 1 },
        { label: `electrical concern −${concern} mV`, data: flat(-concern), borderColor: palette.electrical, borderDash: [6, 4], pointRadius: 0, borderWidth: 1 },
      ],
    },
    options: {
      parsing: false,
      scales: {
        x: { type: 'linear', min: x.min, max: x.max, ticks: { precision: 0, includeBounds: false }, title: { display: true, text: 'point number (the same points as above)' } },
        y: { min: y.min, max: y.max, ticks: { includeBounds: false }, title: { display: true, text: 'ΔVT sat [mV]' }, ...fixedAxisWidth(axisWidth) },
      },
      plugins: {
        legend: { display: false },
        tooltip: { callbacks: { label: (item) => dvtTooltip(view, item, concern) } },
        finwatchVerticals: { lines: maintenance.map((m) => ({ x: m.x, color: palette.maintenance, dash: [6, 4], width: 1 })) },
      },
    },
  });
}

function dvtTooltip(view, item, concern) {
  if (item.datasetIndex !== 0) return item.dataset.label;
  const p = view[item.dataIndex];
  const v = p.predicted_dvt_sat_mv;
  return [`predicted ΔVT sat ${fixed(v, 1)} mV (engineering estimate)`, `lot ${p.lot_id}${p.wafer_slot ? ` wafer ${p.wafer_slot}` : ''} · ${when(p.measured_at)}`,
    Math.abs(v) > concern ? `past the electrical concern of ±${concern} mV` : `within the electrical concern of ±${concern} mV`];
}

/** A shape or line as drawn on the charts, for the key. */
function swatch(kind) {
  const box = (children) => svg('svg', { class: 'swatch', viewBox: '0 0 28 14', width: 28, height: 14, 'aria-hidden': 'true' }, ...children);
  const stroke = (colour, dash = '', width = 1.5) => svg('line', { x1: 1, y1: 7, x2: 27, y2: 7, stroke: colour, 'stroke-width': width, 'stroke-dasharray': dash });
  switch (kind) {
    case 'point': return box([svg('circle', { cx: 14, cy: 7, r: 3, fill: palette.ink })]);
    case 'signal': return box([svg('polygon', { points: '14,1 20,12 8,12', fill: palette.signal })]);
    case 'maintenance': return box([stroke(palette.maintenance, '4 3'), svg('polygon', { points: '14,1 20,7 14,13 8,7', fill: palette.maintenance })]);
    case 'centre': return box([stroke(palette.steady)]);
    case 'limit': return box([stroke(palette.signal)]);
    case 'zone': return box([stroke(palette.zone, '4 4', 1)]);
    case 'target': return box([stroke(palette.spec, '2 3')]);
    case 'spec': return box([stroke(palette.spec, '9 3')]);
    case 'edge': return box([svg('polygon', { points: '14,2 19,10 9,10', fill: palette.spec })]);
    case 'dvt': return box([stroke(palette.electrical, '', 1), svg('circle', { cx: 14, cy: 7, r: 2.5, fill: palette.card, stroke: palette.electrical })]);
    case 'over': return box([svg('rect', { x: 9, y: 2, width: 10, height: 10, fill: palette.electrical })]);
    case 'concern': return box([stroke(palette.electrical, '5 3', 1)]);
    default: return box([]);
  }
}

/** The key beside the charts: every shape and line in words, then each rule that fired in view with its meaning. */
function drawKey(view, { y, maintenance }) {
  const s = spec();
  const item = (kind, text) => el('li', {}, swatch(kind), el('span', {}, text));
  const outside = (v) => v != null && (v < y.min || v > y.max);
  const counts = new Map();
  for (const p of view) for (const r of p.signals) counts.set(r, (counts.get(r) ?? 0) + 1);
  const signalling = view.filter((p) => p.signals.length).length;
  const concern = context.electrical_concern_mv;
  const overCount = view.filter((p) => p.predicted_dvt_sat_mv != null && Math.abs(p.predicted_dvt_sat_mv) > concern).length;
  fill($('#key'),
    el('h2', {}, 'Key'),
    el('ul', { class: 'key-list' },
      item('point', `${context.subgroup === 'wafer' ? 'wafer' : 'lot'} mean`),
      item('signal', `a rule fired (${signalling} point${signalling === 1 ? '' : 's'} in view)`),
      item('centre', 'centre line'),
      item('limit', 'control limits (3σ)'),
      item('zone', 'zones at ±1σ and ±2σ'),
      s?.target != null && item(outside(s.target) ? 'edge' : 'target', `target ${withUnit(s.target, context.unit)}`),
      (s?.lower != null || s?.upper != null) && item(outside(s.lower) || outside(s.upper) ? 'edge' : 'spec',
        `specification limits${outside(s.lower) || outside(s.upper) ? ': an arrow at the edge marks a limit beyond the plotted range' : ''}`),
      item('maintenance', `maintenance: ${maintenance.length} in view (hover a diamond for what was done)`)),
    el('h3', {}, 'Rules fired in view'),
    counts.size === 0
      ? el('p', { class: 'muted' }, 'No rule fired in this range.')
      : el('dl', { class: 'rule-key' }, [...counts.entries()].sort().map(([r, n]) => [
        el('dt', {}, swatch('signal'), `${r} · ${n} point${n === 1 ? '' : 's'}`), el('dd', {}, ruleWords[r] ?? '')])),
    el('h3', {}, 'Predicted ΔVT (lower chart)'),
    el('ul', { class: 'key-list' },
      item('dvt', 'predicted ΔVT sat, engineering estimate'),
      item('over', `past the electrical concern (${overCount} in view)`),
      item('concern', `electrical concern ±${concern} mV`)));
}

/** Short-term σ is what the chart's limits use; long-term σ is the spread of every point. */
function stability(view) {
  const signalling = view.filter((p) => p.signals.length).length;
  if (context.phase !== 'monitoring' || !context.limits) {
    return { stable: null, words: 'Stability not yet judged: the chart has no approved limits. Read the indices as a description of the points, not a prediction.' };
  }
  if (context.state === 'out_of_control' || signalling > 0) {
    return {
      stable: false,
      words: `Not stable: ${signalling} point${signalling === 1 ? '' : 's'} in this range broke a rule${context.state === 'out_of_control' ? ' and the chart is out of control' : ''}. The indices do not predict what the process will make next; the long-term index describes what it made.`,
    };
  }
  return { stable: true, words: 'Stable in this range: no rule fired. The short-term index predicts what the process can make while it stays this way.' };
}

async function drawCapability() {
  const view = visible();
  const box = $('#capability-numbers');
  if (view.length < 2) {
    fill(box, 'Too few points in this range for capability.');
    return;
  }
  const s = spec();
  if (s?.lower == null && s?.upper == null) {
    fill(box, `The product ${context.product} has no specification limits for ${parameters[context.parameter]?.label.toLowerCase() ?? context.parameter}: capability needs a lower limit, an upper limit or both (an engineer sets them on the product).`);
    return;
  }
  const chamber = context.chamber ?? chamberFilter();
  const from = new Date(Date.parse(view[0].measured_at)).toISOString();
  const to = new Date(Date.parse(view[view.length - 1].measured_at)).toISOString();
  const q = new URLSearchParams({ product: context.product, step: context.step, parameter: context.parameter, level: 'wafer', chart: context.chart_type === 'xbar' ? 'Xbar-S' : 'I-MR', from, to });
  if (chamber) q.set('chamber', chamber);
  let cap;
  try {
    cap = (await getJson(`/api/series/capability?${q}`)).analysis;
  } catch (e) {
    fill(box, el('div', { class: 'problem' }, e.message));
    return;
  }
  const c = cap.capability;
  drawHistogram(view, c, s);
  const verdict = stability(view);
  const ci = (k) => (c?.ci?.[k] ? ` (${(c.confidence * 100).toFixed(0)} % interval ${number(c.ci[k][0], 2)}–${number(c.ci[k][1], 2)})` : '');
  const shortTerm = context.chart_type === 'xbar' ? 'within subgroups' : 'from the moving ranges of consecutive wafers';
  const longTerm = el('div', { class: 'index' }, el('span', { class: 'index-name' }, 'Ppk'), el('span', { class: 'index-value' }, number(c?.ppk, 2)),
    el('span', {}, `long-term: σ ${withUnit(c?.sigma_overall, context.unit)} from all ${c?.n ?? 0} wafers${ci('ppk')}. What was made.`));
  const shortTermIndex = el('div', { class: 'index' }, el('span', { class: 'index-name' }, 'Cpk'), el('span', { class: 'index-value' }, number(c?.cpk, 2)),
    el('span', {}, `short-term: σ ${withUnit(c?.sigma_within, context.unit)} ${shortTerm}${ci('cpk')}. What the process could make if it stayed stable.`));
  fill(box,
    el('p', { class: `verdict ${verdict.stable === false ? 'unstable' : verdict.stable ? 'stable' : 'unjudged'}`, id: 'stability' }, verdict.words),
    // When the chart is not stable the long-term index leads: it is the one that describes the wafers.
    verdict.stable === false ? [longTerm, shortTermIndex] : [shortTermIndex, longTerm],
    el('p', {}, `mean ${withUnit(c?.mean, context.unit)} · Cp ${number(c?.cp, 2)} · Pp ${number(c?.pp, 2)} · against LSL ${withUnit(s.lower, context.unit)}, USL ${withUnit(s.upper, context.unit)}`),
    cap.normality?.p_value != null ? el('p', {}, `Anderson–Darling A²* = ${number(cap.normality.a2_star, 3)}, p ${cap.normality.p_value < 0.001 ? '< 0.001' : `= ${number(cap.normality.p_value, 3)}`}${cap.normality.p_value < 0.05 ? ': not normal at 5 %, read the indices with care' : ''}`) : '',
    el('p', { class: 'muted' }, 'The indices use every wafer mean in the range; the histogram shows the chart\'s points.'));
}

function drawHistogram(view, c, s) {
  const values = view.map((p) => p.value);
  const min = Math.min(...values);
  const max = Math.max(...values);
  const bins = Math.max(5, Math.min(40, Math.ceil(Math.sqrt(values.length))));
  const width = (max - min) / bins || 1;
  const counts = new Array(bins).fill(0);
  for (const v of values) counts[Math.min(bins - 1, Math.floor((v - min) / width))]++;
  // The x-axis spans the data and both specification limits, so the limits are always drawn.
  const x = fitRange([min - width, max + width, s?.lower, s?.upper], 0.03) ?? { min, max };
  const sd = c?.sigma_overall;
  const curve = [];
  if (c?.mean != null && sd > 0) {
    for (let i = 0; i <= 120; i++) {
      const at = x.min + (i / 120) * (x.max - x.min);
      curve.push({ x: at, y: values.length * width * Math.exp(-0.5 * ((at - c.mean) / sd) ** 2) / (sd * Math.sqrt(2 * Math.PI)) });
    }
  }
  const lines = [
    s?.lower != null && { x: s.lower, label: `LSL ${withUnit(s.lower, context.unit)}`, color: palette.spec, dash: [12, 4] },
    s?.target != null && { x: s.target, label: 'target', color: palette.spec, dash: [2, 3] },
    s?.upper != null && { x: s.upper, label: `USL ${withUnit(s.upper, context.unit)}`, color: palette.spec, dash: [12, 4] },
  ].filter(Boolean);
  capability = drawChart(capability, $('#capability'), {
    type: 'bar',
    data: {
      datasets: [
        { type: 'bar', label: `${context.subgroup}s per bin`, data: counts.map((n, i) => ({ x: min + (i + 0.5) * width, y: n })), backgroundColor: palette.bars, barPercentage: 1, categoryPercentage: 1 },
        { type: 'line', label: 'fitted normal (long-term σ)', data: curve, borderColor: palette.ink, pointRadius: 0, borderWidth: 1.5 },
      ],
    },
    options: {
      parsing: false,
      scales: {
        x: { type: 'linear', min: x.min, max: x.max, ticks: { includeBounds: false }, title: { display: true, text: axisName() } },
        y: { title: { display: true, text: `${context.subgroup}s per bin` } },
      },
      plugins: { finwatchVerticals: { lines } },
    },
  });
}

function signalsTable(view) {
  const rows = view.filter((p) => p.signals.length).reverse();
  fill($('#signals tbody'), rows.length === 0
    ? el('tr', {}, el('td', { colspan: 6 }, 'No rule fired in this range.'))
    : rows.map((p) => el('tr', {},
      el('td', { class: 'num' }, p.seq), el('td', {}, when(p.measured_at)),
      el('td', {}, el('a', { href: `lot.html?lot=${encodeURIComponent(p.lot_id)}` }, p.lot_id), p.wafer_slot ? ` · wafer ${p.wafer_slot}` : ''),
      el('td', {}, p.chamber ?? ''), el('td', { class: 'num' }, withUnit(p.value, context.unit)),
      el('td', {}, p.signals.map((r) => el('abbr', { title: ruleWords[r] ?? r }, r)).flatMap((a, i) => (i ? [', ', a] : [a]))))));
}

// Live: new points join the charts in place; an alert change refreshes the summary.
let redraw = null;
function onEntry(entry) {
  if (entry.kind === 'point' && entry.point) {
    const last = points.length ? points[points.length - 1].seq : 0;
    if (entry.point.seq <= last) return; // the page load already had it
    points.push(entry.point);
  }
  redraw ??= setTimeout(async () => {
    redraw = null;
    context = await getJson(`/api/contexts/${encodeURIComponent(code)}`);
    redrawAll();
  }, 200);
}

if (code) {
  feed = new LiveFeed({ contexts: [code], onEntry, banner });
  await feed.start(load);
} else {
  await load();
}
