// Control chart of one context: points with the limits each was judged by, zones, signals with their rules, spec
// lines, predicted ΔVT of the same wafers, capability with histogram and fitted normal curve; live via the feed.
import { el, fill, $, param } from '../core/dom.js';
import { getJson } from '../core/api.js';
import { frame } from '../core/shell.js';
import { LiveFeed } from '../core/live.js';
import { withUnit, number, when, stateWords, unitLabel, maintenanceWords, maintenanceSince } from '../core/format.js';
import { makeChart, palette } from '../core/charts.js';

const banner = frame('chart.html');
const select = { context: $('#context'), range: $('#range'), chamber: $('#chamber') };
let context = null;
let product = null;
let points = [];          // every point loaded for the range (all chambers)
let markers = [];         // maintenance events of the chart's chambers, each with the first point after it
let control = null;
let dvt = null;
let capability = null;
let feed = null;

const contexts = await getJson('/api/contexts');
const code = param('context') ?? contexts[0]?.code;
fill(select.context, contexts.map((c) => el('option', { value: c.code, selected: c.code === code }, `${c.title} (${c.code})`)));
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

function rangeQuery() {
  const days = select.range.value;
  if (days === 'all') return '';
  const from = new Date(Date.now() - Number(days) * 86_400_000).toISOString();
  return `from=${encodeURIComponent(from)}`;
}

async function load() {
  if (!code) {
    fill($('#title'), 'No chart contexts yet: create one with POST /api/contexts (see the README).');
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
  summary();
  drawControl();
  drawDvt();
  signalsTable();
  await drawCapability();
}

function spec() {
  return product?.specs?.find((s) => s.parameter === context.parameter) ?? null;
}

function summary() {
  const l = context.limits;
  const items = [
    el('div', {}, el('label', {}, 'state'), el('span', { class: `state ${context.state}` }, stateWords[context.state])),
    el('div', {}, el('label', {}, 'limits in force'), l
      ? `v${l.version}: centre ${withUnit(l.centre, context.unit)}, UCL ${withUnit(l.ucl, context.unit)}, LCL ${withUnit(l.lcl, context.unit)} (approved by ${l.approved_by})`
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

/** The maintenance markers of the points in view: a dashed line before the first point after each, and a diamond on it. */
function maintenanceLines(view) {
  if (view.length === 0) return [];
  const first = view[0].seq;
  const last = view[view.length - 1].seq;
  return markers
    .filter((m) => !chamberFilter() || m.chamber === chamberFilter())
    .map((m) => ({ ...m, x: (m.first_point ?? last + 1) - 0.5 }))
    .filter((m) => m.x >= first - 0.5 && m.x <= last + 0.5);
}

function series(view) {
  const line = (pick) => view.map((p) => ({ x: p.seq, y: pick(p) }));
  const sigma = (p) => (p.ucl != null && p.centre != null ? (p.ucl - p.centre) / 3 : null);
  const zone = (k) => line((p) => (sigma(p) == null ? null : p.centre + k * sigma(p)));
  return { line, zone };
}

function drawControl() {
  const view = visible();
  const { line, zone } = series(view);
  const unit = unitLabel(context.unit);
  const s = spec();
  const flat = (y) => (y == null || view.length === 0 ? [] : [{ x: view[0].seq, y }, { x: view[view.length - 1].seq, y }]);
  const limitStyle = { borderColor: palette.signal, borderWidth: 1.5, pointRadius: 0, stepped: true, fill: false, spanGaps: false };
  const zoneStyle = { borderColor: palette.zone, borderWidth: 1, borderDash: [4, 4], pointRadius: 0, stepped: true, fill: false };
  const datasets = [
    {
      label: `${context.title} (${unit})`, data: line((p) => p.value), borderColor: palette.ink, borderWidth: 1,
      pointRadius: view.map((p) => (p.signals.length ? 6 : 2.5)),
      pointStyle: view.map((p) => (p.signals.length ? 'triangle' : 'circle')),
      pointBackgroundColor: view.map((p) => (p.signals.length ? palette.signal : palette.ink)),
      // A run of signalling points is labelled where its rules change, so long runs stay readable.
      pointLabels: view.map((p, i) => (p.signals.length && p.signals.join(' ') !== view[i - 1]?.signals.join(' ') ? p.signals.join(' ') : '')), order: 0,
    },
    { label: 'centre line', data: line((p) => p.centre), borderColor: palette.steady, borderWidth: 1.5, pointRadius: 0, stepped: true },
    { label: 'UCL (3σ)', data: line((p) => p.ucl), ...limitStyle },
    { label: 'LCL (3σ)', data: line((p) => p.lcl), ...limitStyle },
    { label: 'zone +2σ', data: zone(2), ...zoneStyle }, { label: 'zone −2σ', data: zone(-2), ...zoneStyle },
    { label: 'zone +1σ', data: zone(1), ...zoneStyle }, { label: 'zone −1σ', data: zone(-1), ...zoneStyle },
  ];
  if (s?.upper != null) datasets.push({ label: 'USL', data: flat(s.upper), borderColor: palette.plum, borderDash: [10, 5], pointRadius: 0, borderWidth: 1.5 });
  if (s?.lower != null) datasets.push({ label: 'LSL', data: flat(s.lower), borderColor: palette.plum, borderDash: [10, 5], pointRadius: 0, borderWidth: 1.5 });
  const maintenance = maintenanceLines(view);
  if (maintenance.length) {
    // A dashed line across the data at each maintenance, a diamond at its top labelled with what was done.
    const ys = view.flatMap((p) => [p.value, p.ucl, p.lcl].filter((v) => v != null)).concat([s?.upper, s?.lower].filter((v) => v != null));
    const [bottom, top] = [Math.min(...ys), Math.max(...ys)];
    for (const m of maintenance) {
      datasets.push({ label: '', data: [{ x: m.x, y: bottom }, { x: m.x, y: top }], borderColor: palette.accent, borderDash: [6, 4], borderWidth: 1.5, pointRadius: 0 });
    }
    datasets.push({
      label: 'maintenance (diamond on a dashed line)', data: maintenance.map((m) => ({ x: m.x, y: top })), maintenance, showLine: false,
      pointStyle: 'rectRot', pointRadius: 7, pointBackgroundColor: palette.accent, borderColor: palette.accent,
      pointLabels: maintenance.map((m) => maintenanceWords[m.kind] ?? m.kind), pointLabelColor: palette.accent,
    });
  }
  control?.destroy();
  control = makeChart($('#control'), {
    type: 'line',
    data: { datasets },
    options: {
      parsing: false,
      scales: {
        x: { type: 'linear', title: { display: true, text: `point number (one per ${context.subgroup}, in measured order)` }, ticks: { precision: 0 } },
        y: { title: { display: true, text: `${context.title} [${unit}]` } },
      },
      plugins: {
        legend: { labels: { filter: (item) => item.text !== '' && (!item.text.startsWith('zone') || item.text === 'zone +1σ') } },
        tooltip: { callbacks: { label: (item) => tooltip(view, item) } },
      },
    },
  });
  fill($('#legend'), `${view.length} points shown${chamberFilter() ? ` (chamber ${chamberFilter()})` : ''}. Triangles mark points where a rule fired, labelled with the rule; dashed lines are the ±1σ and ±2σ zones; plum dashed lines are the specification limits. Limits step where a new version took effect: each point is judged by the limits in force when it was measured.${maintenance.length ? ` Blue diamonds on dashed lines mark maintenance (${maintenance.length} in view), labelled with what was done: the points right of a line were measured after it.` : ''}`);
}

function tooltip(view, item) {
  if (item.dataset.maintenance) {
    const m = item.dataset.maintenance[item.dataIndex];
    return `${maintenanceWords[m.kind] ?? m.kind} of ${m.chamber}, finished ${when(m.at)}`;
  }
  if (item.dataset.label === '') return null; // a maintenance line: its diamond has the words
  if (item.datasetIndex !== 0) return `${item.dataset.label}: ${withUnit(item.parsed.y, context.unit)}`;
  const p = view[item.dataIndex];
  return [
    `${withUnit(p.value, context.unit)} · lot ${p.lot_id}${p.wafer_slot ? ` wafer ${p.wafer_slot}` : ''} · ${p.chamber ?? ''}`,
    `${when(p.measured_at)} · ${p.n} sites${p.z != null ? ` · z = ${number(p.z, 2)}` : ''}`,
    p.signals.length ? `rules fired: ${p.signals.join(', ')}` : 'no rule fired',
  ];
}

function drawDvt() {
  const view = visible().filter((p) => p.predicted_dvt_sat_mv != null);
  const concern = context.electrical_concern_mv;
  const flat = (y) => (view.length ? [{ x: view[0].seq, y }, { x: view[view.length - 1].seq, y }] : []);
  dvt?.destroy();
  dvt = makeChart($('#dvt'), {
    type: 'line',
    data: {
      datasets: [
        { label: 'predicted ΔVT sat (mV), wafer mean', data: view.map((p) => ({ x: p.seq, y: p.predicted_dvt_sat_mv })), borderColor: palette.plum, borderWidth: 1, pointRadius: 2 },
        { label: `electrical concern ±${concern} mV`, data: flat(concern), borderColor: palette.sand, borderDash: [6, 4], pointRadius: 0 },
        { label: '', data: flat(-concern), borderColor: palette.sand, borderDash: [6, 4], pointRadius: 0 },
      ],
    },
    options: {
      parsing: false,
      scales: { x: { type: 'linear', ticks: { precision: 0 }, title: { display: true, text: 'point number' } }, y: { title: { display: true, text: 'ΔVT sat [mV]' } } },
      plugins: { legend: { labels: { filter: (i) => i.text !== '' } } },
    },
  });
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
    fill(box, `The product ${context.product} has no specification limits for ${context.parameter}: capability needs an LSL, a USL or both (set them on the product).`);
    capability?.destroy();
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
  const values = view.map((p) => p.value);
  const min = Math.min(...values);
  const max = Math.max(...values);
  const bins = Math.max(5, Math.min(40, Math.ceil(Math.sqrt(values.length))));
  const width = (max - min) / bins || 1;
  const counts = new Array(bins).fill(0);
  for (const v of values) counts[Math.min(bins - 1, Math.floor((v - min) / width))]++;
  const sd = c?.sigma_overall;
  const curve = [];
  if (c?.mean != null && sd > 0) {
    for (let i = 0; i <= 100; i++) {
      const x = min - width + (i / 100) * (max - min + 2 * width);
      curve.push({ x, y: values.length * width * Math.exp(-0.5 * ((x - c.mean) / sd) ** 2) / (sd * Math.sqrt(2 * Math.PI)) });
    }
  }
  capability?.destroy();
  capability = makeChart($('#capability'), {
    type: 'bar',
    data: {
      datasets: [
        { type: 'bar', label: `${context.subgroup}s per bin`, data: counts.map((n, i) => ({ x: min + (i + 0.5) * width, y: n })), backgroundColor: 'rgba(36, 80, 122, 0.45)', barPercentage: 1, categoryPercentage: 1 },
        { type: 'line', label: 'fitted normal (overall σ)', data: curve, borderColor: palette.ink, pointRadius: 0, borderWidth: 1.5 },
      ],
    },
    options: {
      parsing: false,
      scales: { x: { type: 'linear', title: { display: true, text: `${context.parameter} [${unitLabel(context.unit)}]` } }, y: { title: { display: true, text: `${context.subgroup}s` } } },
      plugins: { finwatchVerticals: [s?.lower != null && { x: s.lower, label: 'LSL' }, s?.upper != null && { x: s.upper, label: 'USL' }].filter(Boolean) },
    },
  });
  const ci = (k) => (c?.ci?.[k] ? ` (${(c.confidence * 100).toFixed(0)} % CI ${number(c.ci[k][0], 2)}–${number(c.ci[k][1], 2)})` : '');
  fill(box,
    el('p', {}, `Cpk ${number(c?.cpk, 2)}${ci('cpk')} · Cp ${number(c?.cp, 2)} · Ppk ${number(c?.ppk, 2)} · n = ${c?.n ?? 0} wafers (the indices use every wafer mean in the range; the histogram shows the chart's points)`),
    el('p', {}, `mean ${withUnit(c?.mean, context.unit)} · σ within ${withUnit(c?.sigma_within, context.unit)} · σ overall ${withUnit(c?.sigma_overall, context.unit)}`),
    cap.normality?.p_value != null ? el('p', {}, `Anderson–Darling A²* = ${number(cap.normality.a2_star, 3)}, p = ${number(cap.normality.p_value, 3)}${cap.normality.p_value < 0.05 ? ': not normal at 5 %, read Cpk with care' : ''}`) : '',
    (c?.notes ?? []).map((n) => el('p', { class: 'muted' }, n)));
}

function signalsTable() {
  const rows = visible().filter((p) => p.signals.length).reverse();
  fill($('#signals tbody'), rows.length === 0
    ? el('tr', {}, el('td', { colspan: 6 }, 'No rule fired in this range.'))
    : rows.map((p) => el('tr', {},
      el('td', { class: 'num' }, p.seq), el('td', {}, when(p.measured_at)),
      el('td', {}, el('a', { href: `lot.html?lot=${encodeURIComponent(p.lot_id)}` }, p.lot_id), p.wafer_slot ? ` · W${p.wafer_slot}` : ''),
      el('td', {}, p.chamber ?? ''), el('td', { class: 'num' }, withUnit(p.value, context.unit)), el('td', {}, p.signals.join(', ')))));
}

// Live: new points join the chart without a reload; an alert change refreshes the summary.
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
    summary();
    drawControl();
    drawDvt();
    signalsTable();
  }, 200);
}

if (code) {
  feed = new LiveFeed({ contexts: [code], onEntry, banner });
  await feed.start(load);
} else {
  await load();
}
