// Alert queue with filters, and the selected alert: its points, its context's reaction plan as a checklist, the
// actions of its state (acknowledge → disposition → close) and its append-only history.
import { el, fill, $, param } from '../core/dom.js';
import { getJson, sendJson } from '../core/api.js';
import { frame } from '../core/shell.js';
import { LiveFeed } from '../core/live.js';
import { withUnit, when, alertStateWords } from '../core/format.js';

const banner = frame('alerts.html');
const filters = $('#filters');
const queue = $('#queue');
const detail = $('#detail');
let selected = param('alert') ? Number(param('alert')) : null;
let shown = {}; // what the detail pane shows, so a live entry re-renders it only when the alert changed

const contexts = await getJson('/api/contexts');
const units = Object.fromEntries(contexts.map((c) => [c.code, c.unit]));
fill($('#f-context'), el('option', { value: '' }, 'all charts'), contexts.map((c) => el('option', { value: c.code }, c.title)));
for (const name of ['state', 'severity', 'context', 'escalated']) {
  const v = param(name);
  if (v !== null) filters.elements[name].value = v;
}
filters.addEventListener('change', () => {
  const q = new URLSearchParams(new FormData(filters));
  for (const [k, v] of [...q]) if (!v) q.delete(k);
  history.replaceState(null, '', `?${q}`);
  loadQueue();
});

async function loadQueue() {
  const q = new URLSearchParams(new FormData(filters));
  for (const [k, v] of [...q]) if (!v) q.delete(k);
  const alerts = await getJson(`/api/alerts?${q}`);
  fill(queue, alerts.length === 0 ? el('p', { class: 'notice' }, 'No alert matches these filters.') : alerts.map(card));
}

// The excursion's condition as a state mark: word, shape and colour, the same marks as a chart's state.
function condition(a) {
  return a.condition === 'back in control'
    ? el('span', { class: 'state in_control' }, 'back in control')
    : el('span', { class: 'state out_of_control' }, 'signalling');
}

const plural = (n, word) => `${n} ${word}${n === 1 ? '' : 's'}`;

// When the signals were measured, and when the alert was raised: they can be days apart.
function measuredSpan(a) {
  const first = when(a.first_signal_measured_at);
  const last = when(a.last_signal_measured_at);
  return `signals measured ${first}${last !== first ? ` – ${last}` : ''} · raised ${when(a.raised_at)}`;
}

function card(a) {
  const rules = a.rules?.length ? a.rules : [a.rule];
  return el('article', { class: `alert-item ${a.state}${a.escalated ? ' escalated' : ''}`, dataset: { alert: a.id, state: a.state } },
    el('div', { class: 'head' },
      el('span', { class: `sev ${a.severity}` }, a.severity),
      condition(a),
      el('span', {}, `· ${alertStateWords[a.state]}`),
      a.escalated ? el('strong', {}, '· escalated to supervisors') : ''),
    el('div', {}, el('a', { href: `chart.html?context=${encodeURIComponent(a.context)}` }, a.context_title),
      el('span', { class: 'rule' }, ` · rules ${rules.join(', ')}`)),
    el('div', { class: 'muted' }, measuredSpan(a)),
    el('div', { class: 'muted' },
      `${plural(a.signal_count ?? a.point_count, 'signal point')} of ${plural(a.point_count, 'point')} · ${plural(a.lot_count ?? 1, 'lot')}`,
      a.wafer_count ? ` · ${plural(a.wafer_count, 'wafer')}` : '',
      ` · last signal at lot ${a.lot_id}${a.wafer_slot ? ` wafer ${a.wafer_slot}` : ''}${a.chamber ? ` · ${a.chamber}` : ''}`,
      a.predicted_dvt_sat_mv != null ? ` · predicted ΔVT sat ${withUnit(a.predicted_dvt_sat_mv, 'mV', 1)}` : ''),
    el('button', { type: 'button', class: 'quiet', onclick: () => select(a.id) }, selected === a.id ? 'shown on the right' : 'open'));
}

async function select(id) {
  selected = id;
  const q = new URLSearchParams(location.search);
  q.set('alert', id);
  history.replaceState(null, '', `?${q}`);
  const d = await getJson(`/api/alerts/${id}`);
  const a = d.alert;
  const typed = $('#action-comment')?.value ?? '';
  const previous = shown.id;
  shown = { id: a.id, state: a.state, points: a.point_count, escalated: a.escalated, condition: a.condition };
  const unit = units[a.context] ?? '';
  const message = el('div', { role: 'status', 'aria-live': 'polite' });
  const comment = el('textarea', { id: 'action-comment', 'aria-label': 'comment' });
  if (previous === a.id) comment.value = typed; // a live refresh keeps what the user was typing
  const checklist = el('fieldset', { class: 'checklist' }, el('legend', {}, 'Reaction plan: mark each step done or not, with a note'),
    d.reaction_plan.length === 0 ? el('p', { class: 'muted' }, 'This chart has no reaction plan; describe what was done in the comment.') : '',
    d.reaction_plan.map((step, i) => el('div', {},
      el('label', {}, el('input', { type: 'checkbox', name: `step-${i}`, dataset: { step } }), step),
      el('input', { type: 'text', name: `note-${i}`, placeholder: 'note (optional)', 'aria-label': `note for: ${step}` }))));
  const actions = {
    open: ['acknowledge', 'Acknowledge'],
    acknowledged: ['disposition', 'Record the steps taken'],
    dispositioned: ['close', 'Close the alert'],
  }[a.state];
  async function act() {
    const body = { comment: comment.value };
    if (actions[0] === 'disposition') {
      body.steps = d.reaction_plan.map((step, i) => ({
        step, done: checklist.querySelector(`[name="step-${i}"]`).checked, note: checklist.querySelector(`[name="note-${i}"]`).value || null,
      }));
    }
    try {
      await sendJson('POST', `/api/alerts/${id}/${actions[0]}`, body);
      comment.value = ''; // done: the next step starts with an empty comment
      await select(id);
      await loadQueue();
    } catch (e) {
      fill(message, el('div', { class: 'problem' }, e.message));
    }
  }
  fill(detail,
    el('h2', {}, `Alert ${a.id}: excursion on ${a.context_title}`),
    el('p', {}, el('span', { class: `sev ${a.severity}` }, a.severity), ' ', condition(a),
      a.back_in_control_at ? ` since ${when(a.back_in_control_at)}` : '', ' · ', el('a', { href: `chart.html?context=${encodeURIComponent(a.context)}` }, 'open the chart')),
    el('p', {}, `State: ${alertStateWords[a.state]}`, a.acknowledged_by ? ` · acknowledged by ${a.acknowledged_by} ${when(a.acknowledged_at)}` : '',
      a.closed_by ? ` · closed by ${a.closed_by} ${when(a.closed_at)}` : ''),
    el('p', {}, measuredSpan(a)),
    el('h3', {}, 'Rules that fired'),
    el('ul', {}, (a.rules?.length ? a.rules : [a.rule]).map((r, i) => el('li', {}, `${r}: ${(a.rule_texts ?? [a.rule_text])[i] ?? ''}`))),
    el('h3', {}, `Lots involved (${plural(d.lots.length, 'lot')})`),
    el('div', { class: 'table-box short' }, el('table', {},
      el('thead', {}, el('tr', {}, el('th', {}, 'lot'), el('th', {}, 'first measured'), el('th', {}, 'wafers'), el('th', { class: 'num' }, 'signal points'))),
      el('tbody', {}, d.lots.map((l) => el('tr', {},
        el('td', {}, el('a', { href: `lot.html?lot=${encodeURIComponent(l.lot_id)}` }, l.lot_id)), el('td', {}, when(l.first_measured_at)),
        el('td', {}, l.wafers.length ? l.wafers.map((w) => `W${w}`).join(' ') : 'lot mean'), el('td', { class: 'num' }, l.signal_points)))))),
    a.predicted_dvt_sat_mv != null ? el('p', { class: 'caution' }, `Largest predicted ΔVT sat among its points: ${withUnit(a.predicted_dvt_sat_mv, 'mV', 1)}. ${d.caution}`) : '',
    el('h3', {}, `Points (${plural(a.point_count, 'point')}, newest first${d.points.length > 200 ? '; the last 200 shown' : ''})`),
    el('div', { class: 'table-box' }, el('table', {},
      el('thead', {}, el('tr', {}, el('th', {}, 'point'), el('th', {}, 'measured'), el('th', {}, 'lot · wafer'), el('th', {}, 'chamber'), el('th', { class: 'num' }, 'value'), el('th', { class: 'num' }, 'ΔVT sat'), el('th', {}, 'rules'))),
      el('tbody', {}, d.points.slice(-200).reverse().map((p) => el('tr', {},
        el('td', { class: 'num' }, p.seq), el('td', {}, when(p.measured_at)),
        el('td', {}, el('a', { href: `lot.html?lot=${encodeURIComponent(p.lot_id)}` }, p.lot_id), p.wafer_slot ? ` · W${p.wafer_slot}` : ''),
        el('td', {}, p.chamber ?? ''), el('td', { class: 'num' }, withUnit(p.value, unit)),
        el('td', { class: 'num' }, withUnit(p.predicted_dvt_sat_mv, 'mV', 1)), el('td', {}, p.signals.join(', '))))))),
    actions ? el('section', { 'aria-label': 'action' },
      el('h3', {}, actions[1]),
      actions[0] === 'disposition' ? checklist : '',
      el('label', { for: 'action-comment' }, actions[0] === 'close' ? 'Why can it be closed? (required)' : 'Comment'),
      comment,
      el('p', {}, el('button', { type: 'button', id: 'action-button', onclick: act }, actions[1])),
      message) : el('p', { class: 'notice' }, 'Closed. Nothing about an alert is ever deleted; its history stays below.'),
    el('h3', {}, 'History'),
    el('ol', { class: 'history' }, historyItems(d.history)));
  for (const b of queue.querySelectorAll('.alert-item button')) b.textContent = 'open';
}

const historyWords = {
  raised: 'raised', 'rule-added': 'another rule fired', 'back-in-control': 'back in control', 'signalling-again': 'signalling again',
  escalated: 'escalated', acknowledged: 'acknowledged', dispositioned: 'dispositioned', closed: 'closed',
};

// Every event is kept and shown; a run of "point added" events folds into one line that opens to the full list.
function historyItems(history) {
  const items = [];
  for (let i = 0; i < history.length;) {
    const h = history[i];
    if (h.kind === 'point-added') {
      let j = i;
      while (j < history.length && history[j].kind === 'point-added') j++;
      const run = history.slice(i, j);
      items.push(el('li', {}, el('details', {},
        el('summary', {}, `${when(run[0].at)} – ${when(run.at(-1).at)} · ${run.length} point${run.length > 1 ? 's' : ''} added by ${h.by}`),
        el('ul', {}, run.map((r) => el('li', {}, `${when(r.at)}: ${r.comment}${r.point_seq ? ` (point ${r.point_seq})` : ''}`))))));
      i = j;
      continue;
    }
    items.push(el('li', {}, `${when(h.at)} · ${historyWords[h.kind] ?? h.kind} by ${h.by}`, h.comment ? `: ${h.comment}` : '',
      h.steps ? el('ul', {}, h.steps.map((st) => el('li', {}, `${st.done ? '✔ done' : '✘ not done'}: ${st.step}${st.note ? ` (${st.note})` : ''}`))) : ''));
    i++;
  }
  return items;
}

async function load() {
  await loadQueue();
  if (selected) await select(selected);
}

let timer = null;
function onEntry(entry) {
  if (entry.kind !== 'alert') return;
  timer ??= setTimeout(async () => {
    timer = null;
    await loadQueue();
    const a = entry.alert;
    const changed = a && a.id === selected && (a.state !== shown.state || a.point_count !== shown.points || a.escalated !== shown.escalated || a.condition !== shown.condition);
    if (changed) await select(selected);
  }, 300);
}

await new LiveFeed({ all: true, onEntry, banner }).start(load);
