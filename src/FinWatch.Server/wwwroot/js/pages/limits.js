// Limits and reaction plans of one chart context: compute a draft from chosen points (with reasoned exclusions),
// review, approve (which freezes it) with an effective-from time, and the full version history; edit the reaction plan.
import { el, fill, $, param } from '../core/dom.js';
import { getJson, sendJson } from '../core/api.js';
import { frame } from '../core/shell.js';
import { withUnit, number, when } from '../core/format.js';
import { makeChart, palette } from '../core/charts.js';

frame('limits.html');
const contexts = await getJson('/api/contexts');
const code = param('context') ?? contexts[0]?.code;
fill($('#context'), contexts.map((c) => el('option', { value: c.code, selected: c.code === code }, `${c.title} (${c.code})`)));
$('#context').addEventListener('change', () => { location.search = `?context=${encodeURIComponent($('#context').value)}`; });

let context = null;
let points = [];
const excluded = new Map(); // seq → reason
let pick = null;

async function load() {
  context = await getJson(`/api/contexts/${encodeURIComponent(code)}`);
  points = await getJson(`/api/contexts/${encodeURIComponent(code)}/points?limit=50000`);
  fill($('#title'), `Limits and reaction plan: ${context.title}`);
  $('#chart-link').href = `chart.html?context=${encodeURIComponent(code)}`;
  $('#plan-text').value = context.reaction_plan.join('\n');
  $('#rules').value = context.rules.join(',');
  $('#concern').value = context.electrical_concern_mv;
  showBudget();
  if (!$('#from-seq').value) {
    // Default: the points before the limits in force took effect, else the first 25 (common practice: 20-25 subgroups).
    $('#from-seq').value = points[0]?.seq ?? 1;
    $('#to-seq').value = points.filter((p) => p.limit_version == null).at(-1)?.seq ?? points[Math.min(24, points.length - 1)]?.seq ?? 1;
  }
  drawPick();
  await loadVersions();
}

function chosen() {
  const from = Number($('#from-seq').value);
  const to = Number($('#to-seq').value);
  return points.filter((p) => p.seq >= from && p.seq <= to);
}

function drawPick() {
  const view = chosen();
  pick?.destroy();
  pick = makeChart($('#pick'), {
    type: 'line',
    data: {
      datasets: [{
        label: `${context.title} [${context.unit}]`, data: view.map((p) => ({ x: p.seq, y: p.value })), borderColor: palette.ink, borderWidth: 1,
        pointRadius: view.map((p) => (excluded.has(p.seq) ? 6 : 3)), pointStyle: view.map((p) => (excluded.has(p.seq) ? 'crossRot' : 'circle')),
        pointBorderColor: view.map((p) => (excluded.has(p.seq) ? palette.signal : palette.ink)),
        pointLabels: view.map((p) => (excluded.has(p.seq) ? 'excluded' : '')),
      }],
    },
    options: {
      parsing: false,
      scales: { x: { type: 'linear', ticks: { precision: 0 }, title: { display: true, text: 'point number' } }, y: { title: { display: true, text: context.unit } } },
      onClick: (_e, items) => {
        if (!items.length) return;
        const p = view[items[0].index];
        if (excluded.has(p.seq)) excluded.delete(p.seq); else excluded.set(p.seq, '');
        drawPick();
        drawExcluded();
      },
    },
  });
}

function drawExcluded() {
  const rows = [...excluded.keys()].sort((a, b) => a - b).map((seq) => {
    const p = points.find((x) => x.seq === seq);
    const reason = el('input', { type: 'text', value: excluded.get(seq), 'aria-label': `reason for excluding point ${seq}`, size: 30 });
    reason.addEventListener('input', () => excluded.set(seq, reason.value));
    return el('tr', {}, el('td', { class: 'num' }, seq), el('td', {}, p?.lot_id ?? ''), el('td', { class: 'num' }, withUnit(p?.value, context.unit)),
      el('td', {}, reason), el('td', {}, el('button', { type: 'button', class: 'quiet', onclick: () => { excluded.delete(seq); drawPick(); drawExcluded(); } }, 'keep it')));
  });
  fill($('#excluded tbody'), rows.length ? rows : el('tr', {}, el('td', { colspan: 5, class: 'muted' }, 'none: every chosen point is used')));
}

for (const id of ['#from-seq', '#to-seq']) $(id).addEventListener('change', drawPick);

$('#compute').addEventListener('submit', async (event) => {
  event.preventDefault();
  const body = {
    from_seq: Number($('#from-seq').value), to_seq: Number($('#to-seq').value), reason: $('#reason').value,
    exclude: [...excluded].map(([seq, reason]) => ({ seq, reason })),
  };
  try {
    const draft = await sendJson('POST', `/api/contexts/${encodeURIComponent(code)}/limits`, body);
    fill($('#compute-result'), el('div', { class: 'notice' },
      `Draft v${draft.version}: centre ${withUnit(draft.centre, draft.unit)}, σ ${withUnit(draft.sigma, draft.unit)}, UCL ${withUnit(draft.ucl, draft.unit)}, LCL ${withUnit(draft.lcl, draft.unit)} from ${draft.points_used} points; baseline check: ${draft.verdict}. Review it in the versions below and approve it there.`,
      draft.warnings.map((w) => el('div', { class: 'problem' }, w))));
    await loadVersions();
  } catch (e) {
    fill($('#compute-result'), el('div', { class: 'problem' }, e.message));
  }
});

// The alarm budget of the rules in the box, asked again as they are typed; only the answer to the latest ask is shown.
let budgetAsk = 0;
let budgetTimer = 0;

async function showBudget() {
  const ask = ++budgetAsk;
  const rules = $('#rules').value.split(',').map((s) => s.trim()).filter(Boolean);
  if (rules.length === 0) {
    fill($('#budget'), el('p', { class: 'problem' }, 'No rule chosen: the chart would raise no alarm and catch no shift.'));
    return;
  }
  try {
    const budget = await sendJson('POST', '/api/contexts/run-length', { chart_type: context.chart_type, rules, context: code });
    if (ask === budgetAsk) drawBudget(budget);
  } catch (e) {
    const messages = Object.values(e.problem?.errors ?? {}).flat();
    if (ask === budgetAsk) fill($('#budget'), el('p', { class: 'problem' }, messages.length ? messages.join('\n') : e.message));
  }
}

const inPoints = (n) => withUnit(n, 'points', n >= 100 ? 0 : 1);
const inHours = (h) => withUnit(h, 'h', h >= 10 ? 0 : 1);
const perDay = (n) => (n >= 1 ? n.toFixed(1) : n.toPrecision(2));

function drawBudget(b) {
  const fa = b.false_alarm;
  const falseAlarms = fa.points == null
    ? 'False alarms are too rare to estimate with these rules.'
    : fa.hours == null
      ? `A false alarm about every ${inPoints(fa.points)} while the process is in control.`
      : `A false alarm about every ${inHours(fa.hours)} (${inPoints(fa.points)}) while the process is in control: about ${perDay(b.false_alarms_per_day)} false alarms a day.`;
  const caught = b.detection.map((d) => (d.points == null
    ? `A ${d.shift_sigma}σ shift is practically never caught by these rules.`
    : `A ${d.shift_sigma}σ shift is caught in about ${inPoints(d.points)}${d.hours == null ? '' : ` (${inHours(d.hours)})`}.`));
  const rate = b.points_per_day > 0
    ? `At this chart's rate of ${withUnit(b.points_per_day, 'points a day', 1)}, measured over the last ${number(b.rate.days, b.rate.days >= 10 ? 0 : 1)} days.`
    : '';
  const how = fa.method.startsWith('exact')
    ? 'Worked out exactly (a Markov chain over the zones).'
    : `Estimated by ${fa.method.replace(/^simulation, /, 'simulation: ')}.`;
  fill($('#budget'),
    el('ul', {}, el('li', {}, falseAlarms), caught.map((text) => el('li', {}, text))),
    el('p', { class: 'muted' }, `Each point is ${b.plotted_statistic}; σ is that of the point. ${rate} ${how}`),
    b.notes.map((n) => el('p', { class: 'muted' }, n)));
}

$('#rules').addEventListener('input', () => {
  clearTimeout(budgetTimer);
  budgetTimer = setTimeout(showBudget, 250);
});

$('#plan').addEventListener('submit', async (event) => {
  event.preventDefault();
  try {
    context = await sendJson('PUT', `/api/contexts/${encodeURIComponent(code)}`, {
      reaction_plan: $('#plan-text').value.split('\n').map((s) => s.trim()).filter(Boolean),
      rules: $('#rules').value, electrical_concern_mv: Number($('#concern').value),
    });
    fill($('#plan-result'), el('div', { class: 'notice' }, `Saved: ${context.reaction_plan.length} steps, rules ${context.rules.join(', ')}, concern ${withUnit(context.electrical_concern_mv, 'mV', 1)}.`));
  } catch (e) {
    fill($('#plan-result'), el('div', { class: 'problem' }, e.message));
  }
});

async function loadVersions() {
  const versions = await getJson(`/api/contexts/${encodeURIComponent(code)}/limits`);
  const u = context.unit;
  fill($('#versions tbody'), versions.length === 0
    ? el('tr', {}, el('td', { colspan: 12 }, 'No limits yet: the chart is in its baseline phase.'))
    : versions.map((v) => el('tr', { dataset: { version: v.version, status: v.status } },
      el('td', { class: 'num' }, `v${v.version}`), el('td', {}, v.status),
      el('td', { class: 'num' }, withUnit(v.centre, u)), el('td', { class: 'num' }, withUnit(v.sigma, u)),
      el('td', { class: 'num' }, withUnit(v.ucl, u)), el('td', { class: 'num' }, withUnit(v.lcl, u)),
      el('td', {}, `${v.points_used} points, ${when(v.from)} – ${when(v.to)}`, v.excluded.length ? `; excluded ${v.excluded.map((x) => `${x.seq} (${x.reason})`).join(', ')}` : ''),
      el('td', {}, checkCell(v)),
      el('td', {}, `${v.computed_by}, ${when(v.computed_at)}: ${v.reason}`),
      el('td', {}, v.approved_by ? `${v.approved_by}, ${when(v.approved_at)}${v.approval_comment ? `: ${v.approval_comment}` : ''}` : '—',
        v.justification ? el('div', { class: 'muted' }, `approved although not stable: ${v.justification}`) : ''),
      el('td', {}, v.effective_from ? when(v.effective_from) : '—'),
      el('td', {}, v.status === 'draft' ? approveForm(v) : '')))); 
}

// The verdict as a state mark (word, shape, colour), its reasons, and the tests behind it.
const verdictClass = { stable: 'in_control', 'not stable': 'out_of_control', 'not checked': 'baseline' };
function checkCell(v) {
  const c = v.check;
  if (!c) return el('span', { class: `state ${verdictClass['not checked']}` }, 'not checked');
  const t = c.trend;
  const trend = t.p_value == null ? `trend test: too few points` : `trend (Mann–Kendall): ${t.direction}, p = ${t.p_value.toPrecision(2)}`;
  const n = c.normality;
  const normal = n.p_value == null ? `normality: ${n.note ?? 'not tested'}` : `normality (Anderson–Darling, for information): p = ${n.p_value.toPrecision(2)}`;
  return el('div', {},
    el('span', { class: `state ${verdictClass[c.verdict]}` }, c.verdict),
    c.reasons.length ? el('ul', { class: 'reasons' }, c.reasons.map((r) => el('li', {}, r))) : '',
    el('details', {}, el('summary', {}, 'tests'),
      el('div', {}, `${c.subgroups} subgroups (${c.recommended_subgroups} usual)`),
      el('div', {}, c.rule_signals.length ? `rules on the baseline: ${c.rule_signals.map((r) => `${r.rule} on ${r.points} points`).join(', ')}` : 'no rule fired on the baseline'),
      el('div', {}, trend), el('div', {}, normal)));
}

function approveForm(v) {
  const unstable = v.verdict === 'not stable';
  const justification = unstable
    ? el('textarea', { rows: 2, placeholder: 'why approve a baseline that is not stable (required)', 'aria-label': `justification for approving v${v.version}` })
    : null;
  const comment = el('input', { type: 'text', placeholder: 'review comment', 'aria-label': `comment approving v${v.version}`, size: 18 });
  const effective = el('input', { type: 'datetime-local', 'aria-label': `v${v.version} effective from (local time; empty = now)` });
  const message = el('div', { role: 'status' });
  const button = el('button', {
    type: 'button',
    onclick: async () => {
      try {
        await sendJson('POST', `/api/contexts/${encodeURIComponent(code)}/limits/${v.version}/approve`, {
          comment: comment.value, effective_from: effective.value ? new Date(effective.value).toISOString() : null,
          justification: justification ? justification.value : null,
        });
        await load();
      } catch (e) {
        fill(message, el('div', { class: 'problem' }, e.message));
      }
    },
  }, `Approve v${v.version}`);
  return el('div', {}, justification ?? '', comment, ' ', effective, ' ', button, message);
}

if (code) await load();
else fill($('#title'), 'No chart contexts yet.');
drawExcluded();
