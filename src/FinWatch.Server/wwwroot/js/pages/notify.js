// @ts-check
// Notify me: the signed-in person's notification rules (each in words, with a remove button), a form to add one, the
// two choices of this browser (desktop notifications; sound and banner on a wall screen) and the escalation path.
import { el, fill, $ } from '../core/dom.js';
import { getJson, sendJson, fieldProblems } from '../core/api.js';
import { frame, me } from '../core/shell.js';
import { when } from '../core/format.js';
import { chosen, choose, severities, channelWords } from '../core/notify.js';

frame('notify.html');
const who = await me;
const form = /** @type {HTMLFormElement} */ ($('#add-rule'));
/** @param {string} id */
const select = (id) => /** @type {HTMLSelectElement} */ ($(`#${id}`));

const [channels, products, charts, known, roster] = await Promise.all([
  getJson('/api/notifications/channels'), getJson('/api/products'), getJson('/api/contexts'), getJson('/api/measurements/known-values'),
  getJson('/api/roster'),
]);

/** @param {string} label for all @param {[string, string][]} pairs value and words */
const options = (label, pairs) => [el('option', { value: '' }, label), pairs.map(([value, words]) => el('option', { value }, words))];

fill(select('r-severity'), severities.map((s) => el('option', { value: s, selected: s === 'high' }, `${s} and above`)));
fill(select('r-product'), options('every product', products.map((/** @type {any} */ p) => [p.code, `${p.code} · ${p.name}`])));
const steps = [...new Set([...charts.map((/** @type {any} */ c) => c.step), ...known.steps])].sort();
fill(select('r-step'), options('every step', steps.map((s) => [s, s])));
const tools = [...known.etch_tools, ...known.liner_tools];
fill(select('r-equipment'), options('every tool and chamber', tools.flatMap((/** @type {any} */ t) =>
  [[t.tool, `tool ${t.tool}`], ...t.chambers.map((/** @type {string} */ c) => [c, `chamber ${c} (${t.tool})`])])));
fill(select('r-context'), options('every chart', charts.map((/** @type {any} */ c) => [c.code, c.title])));
fill(select('r-webhook'), channels.webhooks.map((/** @type {any} */ w) => el('option', { value: w.name }, `${w.name} (${w.host})`)));

// The channels: each offered, or shown unavailable with the reason.
const emailWhyNot = !channels.email_configured
  ? 'not set up on this FinWatch: an administrator configures the mail server'
  : !channels.your_email ? 'you have no e-mail address in FinWatch: an administrator adds it on the people page' : null;
const webhookWhyNot = !who.permissions.includes('engineer') ? 'set by engineers and administrators'
  : channels.webhooks.length === 0 ? 'none configured on this FinWatch: an administrator adds them' : null;
const choices = [
  ['browser', 'this browser and wall screens', 'a desktop notification where you chose it, and the banner on wall screens', null],
  ['email', 'e-mail', channels.your_email ? `to ${channels.your_email}` : '', emailWhyNot],
  ['webhook', 'webhook', 'a signed message to another system (a lot-hold system, a chat room)', webhookWhyNot],
];
$('#channel-choices').append(...choices.map(([value, words, note, whyNot]) => el('div', { class: 'check-choice' },
  el('input', { type: 'radio', name: 'channel', id: `ch-${value}`, value, checked: value === 'browser', disabled: !!whyNot }),
  el('label', { for: `ch-${value}` }, words, el('span', { class: 'muted' }, whyNot ? ` · not available: ${whyNot}` : note ? ` · ${note}` : '')))),
el('span', { class: 'field-msg', dataset: { field: 'channel' } }));
form.addEventListener('change', () => $('#webhook-field').classList.toggle('hidden', channel() !== 'webhook'));
const channel = () => /** @type {HTMLInputElement | null} */ (form.querySelector('input[name="channel"]:checked'))?.value ?? 'browser';

async function loadRules() {
  const rules = await getJson(`/api/notifications/rules?owner=${encodeURIComponent(who.name)}`);
  fill($('#rules'), rules.length === 0
    ? el('p', { class: 'notice' }, 'No rule yet: alerts reach you only on the pages you have open.')
    : el('div', { class: 'table-box' }, el('table', { id: 'rule-table' },
      el('thead', {}, el('tr', {}, el('th', {}, 'what reaches you'), el('th', {}, 'by'), el('th', {}, 'added'), el('th', {}, el('span', { class: 'visually-hidden' }, 'remove')))),
      el('tbody', {}, rules.map((/** @type {any} */ r) => el('tr', { dataset: { rule: r.id } },
        el('td', {}, r.description), el('td', {}, r.channel === 'webhook' ? `webhook ${r.webhook}` : channelWords[r.channel] ?? r.channel),
        el('td', { class: 'nowrap' }, when(r.created_at)),
        el('td', {}, el('button', { type: 'button', class: 'quiet', onclick: () => remove(r) , 'aria-label': `remove: ${r.description}` }, 'Remove'))))))));
  showDesktopChoice(rules.some((/** @type {any} */ r) => r.channel === 'browser'));
}

/** @param {any} rule */
async function remove(rule) {
  try {
    await sendJson('DELETE', `/api/notifications/rules/${rule.id}`);
    fill($('#rule-result'), el('p', { class: 'notice' }, `Removed: ${rule.description}.`));
  } catch (e) {
    fill($('#rule-result'), el('p', { class: 'problem' }, /** @type {Error} */ (e).message));
  }
  await loadRules();
}

form.addEventListener('submit', async (event) => {
  event.preventDefault();
  for (const m of form.querySelectorAll('.field-msg')) m.textContent = '';
  const body = {
    channel: channel(), webhook: channel() === 'webhook' ? select('r-webhook').value : null, min_severity: select('r-severity').value,
    product: select('r-product').value || null, step: select('r-step').value || null,
    equipment: select('r-equipment').value || null, context: select('r-context').value || null,
  };
  try {
    const rule = await sendJson('POST', '/api/notifications/rules', body);
    fill($('#rule-result'), el('p', { class: 'notice' }, `Added: ${rule.description}.`));
  } catch (e) {
    const byField = fieldProblems(e);
    for (const [field, text] of Object.entries(byField)) {
      const spot = form.querySelector(`.field-msg[data-field="${field}"]`);
      if (spot) spot.textContent = text;
    }
    fill($('#rule-result'), el('p', { class: 'problem' }, Object.keys(byField).length ? 'The rule was not added: see the marked choices.' : /** @type {Error} */ (e).message));
  }
  await loadRules();
});

/** The desktop notifications of this browser: what they do, whether the browser lets them, and the button. @param {boolean} hasBrowserRule */
function showDesktopChoice(hasBrowserRule) {
  const box = $('#desktop-choice');
  const supported = 'Notification' in window;
  const allowed = supported && Notification.permission === 'granted';
  const on = allowed && chosen('desktop');
  const state = !supported ? 'This browser cannot show desktop notifications.'
    : Notification.permission === 'denied' ? 'This browser blocks notifications from FinWatch: allow them in the browser\'s settings for this site, then choose again.'
      : on ? `On: an alert that one of your browser rules takes, or that is escalated to you, appears as a desktop notification while any FinWatch page is open here.${hasBrowserRule ? '' : ' You have no browser rule yet, so only escalations to you appear.'}`
        : 'Off: alerts appear only on the pages you have open.';
  const button = !supported || Notification.permission === 'denied' ? ''
    : el('button', {
      type: 'button', id: 'desktop-button', class: on ? 'quiet' : null,
      onclick: async () => {
        if (on) choose('desktop', false);
        else choose('desktop', (await Notification.requestPermission()) === 'granted');
        showDesktopChoice(hasBrowserRule);
      },
    }, on ? 'Stop desktop notifications here' : 'Show desktop notifications here');
  fill(box, el('h3', {}, 'Desktop notifications'), el('p', { id: 'desktop-state', dataset: { on: String(on) } }, state), button);
}

const wall = /** @type {HTMLInputElement} */ ($('#wall-choice'));
wall.checked = chosen('wall');
wall.addEventListener('change', () => choose('wall', wall.checked));

fill($('#escalation'), channels.escalation.map((/** @type {any} */ s) =>
  el('li', {}, `After ${s.after_minutes} min without acknowledgement: to ${s.to}`, s.level === 1
    ? ` (${roster.now.shift ? `now the ${roster.now.shift} shift: ${roster.now.supervisors.join(', ') || 'no supervisor on the roster'}` : 'no shift running now'}; see the `
    : '', s.level === 1 ? el('a', { href: 'roster.html' }, 'roster') : '', s.level === 1 ? ').' : '.')));

await loadRules();
