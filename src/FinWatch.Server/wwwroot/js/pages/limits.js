// @ts-check
// Limits and reaction plans of one chart context: compute a draft from chosen points (with reasoned exclusions),
// review it drawn over its baseline points, approve (which freezes it) with an effective-from time, and the full version
// history; edit the reaction plan and tick the run rules, with the alarm budget of the ticked set.
import { el, fill, $, param } from '../core/dom.js';
import { getJson, sendJson } from '../core/api.js';
import { frame } from '../core/shell.js';
import { withUnit, number, when, unitLabel } from '../core/format.js';
import { makeChart, drawChart, palette } from '../core/charts.js';

frame('limits.html');
const [contexts, runRules] = await Promise.all([getJson('/api/contexts'), getJson('/api/spc/rules')]);
const code = param('context') ?? contexts[0]?.code;
fill($('#context'), contexts.map((c) => el('option', { value: c.code, selected: c.code === code }, c.title)));
$('#context').addEventListener('change', () => { location.search = `?context=${encodeURIComponent($('#context').value)}`; });

let context = null;
let points = [];
const excluded = new Map(); // seq → reason
let pick = null;
let draftChart = null;
let drafts = [];

async function load() {
  context = await getJson(`/api/contexts/${encodeURIComponent(code)}`);
  points = await getJson(`/api/contexts/${encodeURIComponent(code)}/points?limit=50000`);
  fill($('#title'), `Limits and reaction plan: ${context.title}`);
  $('#chart-link').href = `chart.html?context=${encodeURIComponent(code)}`;
  $('#plan-text').value = context.reaction_plan.join('\n');
  drawRuleBoxes(context.rules);
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
  pick = drawChart(pick, $('#pick'), {
    type: 'line',
    data: {
      datasets: [{
        label: `${context.title} [${context.unit}]`, data: view.map((p) => ({ x: p.seq, y: p.value })), borderColor: palette.ink, borderWidth: 1,
        pointRadius: view.map((p) => (excluded.has(p.seq) ? 6 : 3)), pointStyle: view.map((p) => (excluded.has(p.seq) ? 'crossRot' : 'circle')),
        pointBorderColor: view.map((p) => (excluded.has(p.seq) ? palette.muted : palette.ink)),
        pointLabels: view.map((p) => (excluded.has(p.seq) ? 'excluded' : '')), pointLabelColor: palette.ink,
      }],
    },
    options: {
      parsing: false,
      scales: { x: { type: 'linear', ticks: { precision: 0 }, title: { display: true, text: 'point number' } }, y: { title: { display: true, text: `${context.title} [${unitLabel(context.unit)}]` } } },
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
    await loadVersions(draft.version);
  } catch (e) {
    fill($('#compute-result'), el('div', { class: 'problem' }, e.message));
  }
});

// The run rules as boxes in their two sets, each with its words (GET /api/spc/rules); the ticked set drives the budget.
function drawRuleBoxes(ticked) {
  const sets = [...new Set(runRules.map((r) => r.set))];
  fill($('#rules'), el('legend', {}, 'Run rules that raise an alert'), sets.map((set) => el('div', { class: 'rule-set', role: 'group', 'aria-label': `${set} rules` },
    el('h4', {}, set),
    runRules.filter((r) => r.set === set).map((r) => el('label', {},
      el('input', { type: 'checkbox', name: 'rule', value: r.id, checked: ticked.includes(r.id) }), el('b', {}, r.id), r.text)))));
}

/** The ticked rules in the server's order. */
function tickedRules() {
  return [...document.querySelectorAll('#rules input[name="rule"]:checked')].map((box) => /** @type {HTMLInputElement} */ (box).value);
}

// The alarm budget of the ticked rules, asked again (debounced) as boxes change; only the answer to the latest ask is shown.
let budgetAsk = 0;
let budgetTimer = 0;

async function showBudget() {
  const ask = ++budgetAsk;
  const rules = tickedRules();
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

$('#rules').addEventListener('change', () => {
  clearTimeout(budgetTimer);
  budgetTimer = setTimeout(showBudget, 250);
});

$('#plan').addEventListener('submit', async (event) => {
  event.preventDefault();
  const rules = tickedRules();
  if (rules.length === 0) {
    fill($('#plan-result'), el('div', { class: 'problem' }, 'Tick at least one run rule: without one the chart raises no alert.'));
    return;
  }
  try {
    context = await sendJson('PUT', `/api/contexts/${encodeURIComponent(code)}`, {
      reaction_plan: $('#plan-text').value.split('\n').map((s) => s.trim()).filter(Boolean),
      rules: rules.join(','), electrical_concern_mv: Number($('#concern').value),
    });
    fill($('#plan-result'), el('div', { class: 'notice' }, `Saved: a reaction plan of ${context.reaction_plan.length} steps, rules ${context.rules.join(', ')}, electrical concern ${withUnit(context.electrical_concern_mv, 'mV', 1)}.`));
  } catch (e) {
    fill($('#plan-result'), el('div', { class: 'problem' }, e.message));
  }
});

async function loadVersions(show) {
  const versions = await getJson(`/api/contexts/${encodeURIComponent(code)}/limits`);
  const u = context.unit;
  drafts = versions.filter((v) => v.status === 'draft');
  const keep = show ?? Number($('#draft').value || drafts[0]?.version);
  fill($('#draft'), drafts.length ? drafts.map((v) => el('option', { value: v.version, selected: v.version === keep }, `v${v.version}, computed ${when(v.computed_at)}`))
    : el('option', { value: '' }, 'no draft'));
  drawDraft();
  fill($('#versions tbody'), versions.length === 0
    ? el('tr', {}, el('td', { colspan: 12 }, 'No limits yet: the chart is in its baseline phase.'))
    : versions.map((v) => el('tr', { dataset: { version: v.version, status: v.status } },
      el('td', { class: 'num' }, `v${v.version}`), el('td', {}, v.status),
      el('td', { class: 'num' }, withUnit(v.centre, u)), el('td', { class: 'num' }, withUnit(v.sigma, u)),
      el('td', { class: 'num' }, withUnit(v.ucl, u)), el('td', { class: 'num' }, withUnit(v.lcl, u)),
      el('td', {}, `${v.points_used} points, ${when(v.from)} – ${when(v.to)}`, v.excluded.length ? `; excluded ${v.excluded.map((x) => `${x.seq} (${x.reason})`).join(', ')}` : ''),
      el('td', {}, checkCell(v)),
      // Who and when in the row; the reasons and comments folded, so one version stays a few lines high.
      el('td', {}, folded(`${v.computed_by}, ${when(v.computed_at)}`, v.reason)),
      el('td', {}, v.approved_by ? folded(`${v.approved_by}, ${when(v.approved_at)}`, v.approval_comment,
        v.justification ? `approved although not stable: ${v.justification}` : '') : '—'),
      el('td', {}, v.effective_from ? when(v.effective_from) : '—'),
      el('td', {}, v.status === 'draft' ? approveForm(v) : '')))); 
}

/** A short line with the longer words folded under it ("why"). */
function folded(line, ...texts) {
  const words = texts.filter(Boolean);
  return words.length === 0 ? line : el('details', { class: 'fold' }, el('summary', {}, line), words.map((t) => el('p', {}, t)));
}

// The chosen draft over the points it was computed from (its measured-time span), with its centre line and limits;
// the chart is made once and updated in place when another draft is chosen.
function drawDraft() {
  const draft = drafts.find((v) => v.version === Number($('#draft').value));
  if (!draft) {
    if (draftChart) { draftChart.data.datasets.forEach((d) => { d.data = []; }); draftChart.update(); }
    $('#draft-chart').closest('.chart-box').classList.add('hidden'); // no empty plot: the words say there is none
    fill($('#draft-check'), el('p', { class: 'muted' }, 'No draft to review: compute one above.'));
    return;
  }
  $('#draft-chart').closest('.chart-box').classList.remove('hidden');
  const from = Date.parse(draft.from);
  const to = Date.parse(draft.to);
  const span = points.filter((p) => Date.parse(p.measured_at) >= from && Date.parse(p.measured_at) <= to);
  const out = new Set(draft.excluded.map((x) => x.seq));
  const first = span[0]?.seq ?? 0;
  const last = span.at(-1)?.seq ?? 0;
  const level = (y) => [{ x: first, y }, { x: last, y }];
  const u = draft.unit;
  const data = [
    span.map((p) => ({ x: p.seq, y: p.value })),
    level(draft.centre), level(draft.ucl), level(draft.lcl),
  ];
  const labels = [`baseline points [${unitLabel(u)}]`, `centre line ${withUnit(draft.centre, u)}`, `UCL ${withUnit(draft.ucl, u)}`, `LCL ${withUnit(draft.lcl, u)}`];
  if (!draftChart) {
    const limit = { borderColor: palette.signal, borderWidth: 1.5, borderDash: [6, 4], pointRadius: 0 };
    draftChart = makeChart($('#draft-chart'), {
      type: 'line',
      data: { datasets: [
        { data: [], borderColor: palette.ink, borderWidth: 1 },
        { data: [], borderColor: palette.steady, borderWidth: 1.5, pointRadius: 0 },
        { data: [], ...limit }, { data: [], ...limit },
      ] },
      options: { parsing: false, scales: { x: { type: 'linear', ticks: { precision: 0 }, title: { display: true, text: 'point number' } }, y: { title: { display: true, text: unitLabel(u) } } } },
    });
  }
  draftChart.data.datasets.forEach((d, i) => { d.data = data[i]; d.label = labels[i]; });
  const pointsSet = draftChart.data.datasets[0];
  pointsSet.pointStyle = span.map((p) => (out.has(p.seq) ? 'crossRot' : 'circle'));
  pointsSet.pointRadius = span.map((p) => (out.has(p.seq) ? 6 : 3));
  pointsSet.pointBorderColor = span.map((p) => (out.has(p.seq) ? palette.muted : palette.ink));
  pointsSet.pointLabels = span.map((p) => (out.has(p.seq) ? 'excluded' : ''));
  pointsSet.pointLabelColor = palette.ink;
  draftChart.update();
  const verdict = draft.verdict;
  fill($('#draft-check'),
    el('div', {}, 'Baseline check: ', el('span', { class: `state ${verdictClass[verdict] ?? verdictClass['not checked']}` }, verdict)),
    verdict === 'not stable' && draft.warnings.length ? el('ul', { class: 'reasons' }, draft.warnings.map((w) => el('li', {}, w))) : '',
    el('ul', { class: 'numbers' },
      el('li', {}, `centre line ${withUnit(draft.centre, u)}, σ ${withUnit(draft.sigma, u)}`),
      el('li', {}, `UCL ${withUnit(draft.ucl, u)}, LCL ${withUnit(draft.lcl, u)}`),
      el('li', {}, `${draft.points_used} points used${draft.excluded.length ? `, ${draft.excluded.length} excluded` : ''}`),
      el('li', {}, `measured ${when(draft.from)} – ${when(draft.to)}`)),
    el('p', { class: 'muted' }, `Computed by ${draft.computed_by}: ${draft.reason}. Approve it in the versions below.`));
}

$('#draft').addEventListener('change', drawDraft);

// The verdict as a state mark (word, shape, colour), its reasons, and the tests behind it.
const verdictClass = { stable: 'in_control', 'not stable': 'out_of_control', 'not checked': 'baseline' };
function checkCell(v) {
  const c = v.check;
  if (!c) return el('span', { class: `state ${verdictClass['not checked']}` }, 'not checked');
  const t = c.trend;
  const trend = t.p_value == null ? `trend test: too few points` : `trend (Mann–Kendall): ${t.direction}, p = ${t.p_value.toPrecision(2)}`;
  const n = c.normality;
  const normal = n.p_value == null ? `normality: ${n.note ?? 'not tested'}` : `normality (Anderson–Darling, for information): p = ${n.p_value.toPrecision(2)}`;
  // In the versions table the verdict stands alone; its reasons and the tests are folded under it.
  return el('div', {},
    el('span', { class: `state ${verdictClass[c.verdict]}` }, c.verdict),
    el('details', { class: 'fold' }, el('summary', {}, c.reasons.length ? `why (${c.reasons.length}) and the tests` : 'the tests'),
      c.reasons.length ? el('ul', { class: 'reasons' }, c.reasons.map((r) => el('li', {}, r))) : '',
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
