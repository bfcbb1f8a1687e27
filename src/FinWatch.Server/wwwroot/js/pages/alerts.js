// @ts-check
// Alert queue with filters (kept in the address, so a link or a reload shows the same list), and the selected alert:
// first the excursion (rules, when its signals were measured, counts, severity, condition and state), then the action
// of its state (acknowledge → record the reaction plan's steps → close) with the reaction plan, the lots, the points
// folded away, and the append-only history.
import { el, fill, $, param } from '../core/dom.js';
import { getJson, sendJson } from '../core/api.js';
import { frame } from '../core/shell.js';
import { LiveFeed } from '../core/live.js';
import { withUnit, when, alertStateWords } from '../core/format.js';
import { sendState, channelTarget, occasion, timing } from '../core/outbox.js';

const banner = frame('alerts.html', { watchesAll: true });
const filters = /** @type {HTMLFormElement} */ ($('#filters'));
const queue = /** @type {HTMLElement} */ ($('#queue'));
const detail = /** @type {HTMLElement} */ ($('#detail'));
let selected = param('alert') ? Number(param('alert')) : null;
/** What the detail pane shows, so a live entry re-renders it only when the alert changed. @type {Record<string, unknown>} */
let shown = {};

const filterNames = ['state', 'severity', 'context', 'escalated'];
/** @param {string} name */
const filter = (name) => /** @type {HTMLSelectElement} */ (filters.elements.namedItem(name));

const contexts = await getJson('/api/contexts');
/** @type {Record<string, string>} */
const units = Object.fromEntries(contexts.map((/** @type {{ code: string, unit: string }} */ c) => [c.code, c.unit]));
fill(filter('context'), el('option', { value: '' }, 'all charts'),
  contexts.map((/** @type {{ code: string, title: string }} */ c) => el('option', { value: c.code }, c.title)));
// "All states" is the empty choice; in the address it is spelled out, since a missing state means the default.
for (const name of filterNames) {
  const v = param(name);
  if (v !== null) filter(name).value = name === 'state' && v === 'all' ? '' : v;
}

/** The filters as the API takes them: empty choices left out. */
function apiQuery() {
  const q = new URLSearchParams();
  for (const name of filterNames) if (filter(name).value) q.set(name, filter(name).value);
  return q;
}

/** The address: the filters (state "all" spelled out) and the selected alert, replaced in place. */
function remember() {
  const q = apiQuery();
  if (!filter('state').value) q.set('state', 'all');
  if (selected) q.set('alert', String(selected));
  history.replaceState(null, '', `?${q}`);
}

filters.addEventListener('change', () => {
  remember();
  loadQueue();
});

async function loadQueue() {
  const alerts = await getJson(`/api/alerts?${apiQuery()}`);
  fill(queue, alerts.length === 0 ? el('p', { class: 'notice' }, 'No alert matches these filters.') : alerts.map(card));
}

// The excursion's condition as a state mark: word, shape and colour, the same marks as a chart's state.
/** @param {any} a */
function condition(a) {
  return a.condition === 'back in control'
    ? el('span', { class: 'state in_control' }, 'back in control')
    : el('span', { class: 'state out_of_control' }, 'signalling');
}

/** Where the alert is in its handling, in words with its shape (an empty box filling up as it is handled). @param {string} state */
const stateMark = (state) => el('span', { class: `alert-state ${state}`, dataset: { state } }, alertStateWords[state] ?? state);

/** @param {number} n @param {string} word */
const plural = (n, word) => `${n} ${word}${n === 1 ? '' : 's'}`;

/** @param {any} a */
const rulesOf = (a) => (a.rules?.length ? a.rules : [a.rule]);

// When the signals were measured: the time that matters on the floor. The alert can be raised days later.
/** @param {any} a */
function measuredSpan(a) {
  const first = when(a.first_signal_measured_at);
  const last = when(a.last_signal_measured_at);
  return last !== first ? `${first} – ${last}` : first;
}

/** @param {any} a */
function counts(a) {
  return [plural(a.point_count, 'point'), plural(a.signal_count ?? a.point_count, 'signal point'), plural(a.lot_count ?? 1, 'lot'),
    a.wafer_count ? plural(a.wafer_count, 'wafer') : 'lot means'].join(' · ');
}

/** @param {any} a */
function card(a) {
  return el('article', { class: `alert-item ${a.state}${a.escalated ? ' escalated' : ''}`, dataset: { alert: a.id, state: a.state } },
    el('div', { class: 'head' },
      el('span', { class: `sev ${a.severity}` }, a.severity),
      condition(a),
      stateMark(a.state),
      a.escalated ? el('strong', {}, 'escalated to supervisors') : ''),
    el('div', {}, el('a', { href: `chart.html?context=${encodeURIComponent(a.context)}` }, a.context_title),
      el('span', { class: 'rule' }, ` · rules ${rulesOf(a).join(', ')}`)),
    el('div', { class: 'measured' }, `Signals measured ${measuredSpan(a)}`),
    el('div', { class: 'muted' }, `raised ${when(a.raised_at)}`, a.back_in_control_at ? ` · back in control ${when(a.back_in_control_at)}` : ''),
    el('div', { class: 'muted' }, counts(a),
      ` · last signal at lot ${a.lot_id}${a.wafer_slot ? ` wafer ${a.wafer_slot}` : ''}${a.chamber ? ` · ${a.chamber}` : ''}`,
      a.predicted_dvt_sat_mv != null ? ` · predicted ΔVT sat ${withUnit(a.predicted_dvt_sat_mv, 'mV', 1)}` : ''),
    el('button', { type: 'button', class: 'quiet', onclick: () => select(a.id) }, selected === a.id ? 'Shown on the right' : 'Show'));
}

/** A row of the excursion summary. @param {string} label @param {...any} value */
const fact = (label, ...value) => el('tr', {}, el('th', { scope: 'row' }, label), el('td', {}, ...value));

/** The excursion first: what fired, when it was measured, how much of the production it touches. @param {any} a @param {any} d */
function excursion(a, d) {
  return el('section', { id: 'excursion', 'aria-label': 'excursion' },
    el('p', { class: 'marks' }, el('span', { class: `sev ${a.severity}` }, a.severity), condition(a), stateMark(a.state),
      a.escalated ? el('strong', {}, 'escalated to supervisors') : ''),
    el('table', { class: 'kv' }, el('tbody', {},
      fact('Rules fired', el('ul', { class: 'rules' }, rulesOf(a).map((/** @type {string} */ r, /** @type {number} */ i) =>
        el('li', {}, el('b', {}, r), `: ${(a.rule_texts ?? [a.rule_text])[i] ?? ''}`)))),
      fact('First signal measured', when(a.first_signal_measured_at)),
      fact('Last signal measured', when(a.last_signal_measured_at),
        ` · lot ${a.lot_id}${a.wafer_slot ? ` wafer ${a.wafer_slot}` : ''}${a.chamber ? ` · ${a.chamber}` : ''}`),
      fact('Back in control', a.back_in_control_at ? when(a.back_in_control_at) : 'not yet'),
      fact('Involves', counts(a)),
      fact('Raised', el('span', { class: 'muted' }, when(a.raised_at))),
      a.acknowledged_by ? fact('Acknowledged', `${when(a.acknowledged_at)} by ${a.acknowledged_by}`) : '',
      a.closed_by ? fact('Closed', `${when(a.closed_at)} by ${a.closed_by}`) : '')),
    a.predicted_dvt_sat_mv != null ? el('p', { class: 'caution' }, `Largest predicted ΔVT sat among its points: ${withUnit(a.predicted_dvt_sat_mv, 'mV', 1)}. ${d.caution}`) : '',
    el('p', {}, el('a', { href: `chart.html?context=${encodeURIComponent(a.context)}` }, 'See the chart')));
}

/** @param {number} id */
async function select(id) {
  selected = id;
  remember();
  const [d, messages] = await Promise.all([getJson(`/api/alerts/${id}`), getJson(`/api/notifications/messages?alert=${id}`)]);
  const a = d.alert;
  const typed = /** @type {HTMLTextAreaElement | null} */ ($('#action-comment'))?.value ?? '';
  const previous = shown.id;
  shown = { id: a.id, state: a.state, points: a.point_count, escalated: a.escalated, condition: a.condition };
  const unit = units[a.context] ?? '';
  const message = el('div', { role: 'status', 'aria-live': 'polite' });
  const comment = /** @type {HTMLTextAreaElement} */ (el('textarea', { id: 'action-comment', 'aria-label': 'comment' }));
  if (previous === a.id) comment.value = typed; // a live refresh keeps what the user was typing
  /** @type {string[]} */
  const plan = d.reaction_plan;
  const checklist = el('fieldset', { class: 'checklist' }, el('legend', {}, 'Reaction plan: mark each step done or not, with a note'),
    plan.length === 0 ? el('p', { class: 'muted' }, 'This chart has no reaction plan; describe what was done in the comment.') : '',
    plan.map((step, i) => el('div', {},
      el('label', {}, el('input', { type: 'checkbox', name: `step-${i}`, dataset: { step } }), step),
      el('input', { type: 'text', name: `note-${i}`, placeholder: 'note (optional)', 'aria-label': `note for: ${step}` }))));
  /** @type {Record<string, [string, string]>} */
  const steps = {
    open: ['acknowledge', 'Acknowledge'],
    acknowledged: ['disposition', 'Record the steps taken'],
    dispositioned: ['close', 'Close the alert'],
  };
  const action = steps[a.state];
  /** @param {string} name */
  const input = (name) => /** @type {HTMLInputElement} */ (checklist.querySelector(`[name="${name}"]`));
  async function act() {
    /** @type {Record<string, unknown>} */
    const body = { comment: comment.value };
    if (action[0] === 'disposition') {
      body.steps = plan.map((step, i) => ({ step, done: input(`step-${i}`).checked, note: input(`note-${i}`).value || null }));
    }
    try {
      await sendJson('POST', `/api/alerts/${id}/${action[0]}`, body);
      comment.value = ''; // done: the next step starts with an empty comment
      await select(id);
      await loadQueue();
    } catch (e) {
      fill(message, el('div', { class: 'problem' }, /** @type {Error} */ (e).message));
    }
  }
  // The plan as a list wherever it is not the checklist being filled in.
  const planList = action?.[0] === 'disposition' || plan.length === 0 ? ''
    : el('section', { 'aria-label': 'reaction plan' }, el('h3', {}, 'Reaction plan'),
      a.state === 'open' ? el('p', { class: 'muted' }, 'Once acknowledged, each step is recorded here as done or not done.') : '',
      el('ol', { class: 'plan' }, plan.map((step) => el('li', {}, step))));
  const points = d.points.slice(-200).reverse();
  fill(detail,
    el('h2', {}, `Alert ${a.id}: excursion on ${a.context_title}`),
    excursion(a, d),
    action ? el('section', { id: 'action', 'aria-label': 'action' },
      el('h3', {}, action[1]),
      action[0] === 'disposition' ? checklist : '',
      el('label', { for: 'action-comment' }, action[0] === 'close' ? 'Why can it be closed? (required)' : 'Comment'),
      comment,
      el('p', {}, el('button', { type: 'button', id: 'action-button', onclick: act }, action[1])),
      message) : el('p', { class: 'notice', id: 'action' }, 'Closed. Nothing about an alert is ever deleted; its history stays below.'),
    planList,
    el('h3', {}, `Lots involved (${plural(d.lots.length, 'lot')})`),
    el('div', { class: 'table-box short' }, el('table', {},
      el('thead', {}, el('tr', {}, el('th', {}, 'lot'), el('th', {}, 'first measured'), el('th', {}, 'wafers'), el('th', { class: 'num' }, 'signal points'))),
      el('tbody', {}, d.lots.map((/** @type {any} */ l) => el('tr', {},
        el('td', {}, el('a', { href: `lot.html?lot=${encodeURIComponent(l.lot_id)}` }, l.lot_id)), el('td', {}, when(l.first_measured_at)),
        el('td', {}, l.wafers.length ? l.wafers.map((/** @type {number} */ w) => `W${w}`).join(' ') : 'lot mean'), el('td', { class: 'num' }, l.signal_points)))))),
    el('details', { id: 'points' },
      el('summary', {}, `Points (${plural(a.point_count, 'point')}, newest first${d.points.length > 200 ? '; the last 200 shown' : ''})`),
      el('div', { class: 'table-box' }, el('table', {},
        el('thead', {}, el('tr', {}, el('th', {}, 'point'), el('th', {}, 'measured'), el('th', {}, 'lot · wafer'), el('th', {}, 'chamber'), el('th', { class: 'num' }, 'value'), el('th', { class: 'num' }, 'ΔVT sat'), el('th', {}, 'rules'))),
        el('tbody', {}, points.map((/** @type {any} */ p) => el('tr', {},
          el('td', { class: 'num' }, p.seq), el('td', {}, when(p.measured_at)),
          el('td', {}, el('a', { href: `lot.html?lot=${encodeURIComponent(p.lot_id)}` }, p.lot_id), p.wafer_slot ? ` · W${p.wafer_slot}` : ''),
          el('td', {}, p.chamber ?? ''), el('td', { class: 'num' }, withUnit(p.value, unit)),
          el('td', { class: 'num' }, withUnit(p.predicted_dvt_sat_mv, 'mV', 1)), el('td', {}, p.signals.join(', ')))))))),
    notificationsSent(a, messages),
    el('h3', {}, 'History'),
    el('ol', { class: 'history' }, historyItems(d.history)));
  for (const b of queue.querySelectorAll('.alert-item')) {
    const button = b.querySelector('button');
    if (button) button.textContent = Number(/** @type {HTMLElement} */ (b).dataset.alert) === id ? 'Shown on the right' : 'Show';
  }
}

/**
 * Who was told about the alert beyond the pages: its escalation in words and each e-mail or webhook call with its
 * state (desktop notifications and wall screens are not sent from FinWatch's outbox, so they are not listed).
 * @param {any} a @param {any[]} messages
 */
function notificationsSent(a, messages) {
  const to = (a.escalated_to ?? []).join(', ') || 'nobody named';
  const escalation = a.escalation_level === 0 ? 'Not escalated.'
    : a.escalation_level === 1 ? `Escalated to the supervisors on shift: ${to}.`
      : `Escalated to step ${a.escalation_level}: ${to}.`;
  return el('section', { id: 'notifications', 'aria-labelledby': 'notifications-h' },
    el('h3', { id: 'notifications-h' }, 'Notifications sent'),
    el('p', {}, escalation),
    messages.length === 0
      ? el('p', { class: 'muted' }, 'No e-mail or webhook call about this alert: no rule of anyone took it.')
      : el('ul', { class: 'sent-list' }, messages.map((m) => el('li', { dataset: { message: m.id } },
        sendState(m.status), ` ${channelTarget(m)} · ${occasion(m)} · ${m.attempts} attempt${m.attempts === 1 ? '' : 's'} · ${timing(m)}`,
        m.last_error ? el('div', { class: 'error' }, `Last error: ${m.last_error}`) : ''))),
    el('p', {}, el('a', { href: 'deliveries.html?status=all' }, 'All deliveries')));
}

/** @type {Record<string, string>} */
const historyWords = {
  raised: 'raised', 'rule-added': 'another rule fired', 'back-in-control': 'back in control', 'signalling-again': 'signalling again',
  escalated: 'escalated', acknowledged: 'acknowledged', dispositioned: 'dispositioned', closed: 'closed',
};

// Every event is kept and shown; a run of "point added" events folds into one line that opens to the full list.
/** @param {any[]} history */
function historyItems(history) {
  /** @type {HTMLElement[]} */
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

/** @type {ReturnType<typeof setTimeout> | null} */
let timer = null;
/** @param {any} entry */
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
