// @ts-check
// Deliveries: the outbox's messages (failed first by default, the filter in the address), each with its alert, whom it
// was for, where it went, its attempts and delivery log; "Send again" for supervisors and up on a failed one.
import { el, fill, $, param } from '../core/dom.js';
import { getJson, sendJson } from '../core/api.js';
import { frame, me } from '../core/shell.js';
import { sendState, sendStateWords, channelTarget, occasion, timing, deliveryLog } from '../core/outbox.js';

frame('deliveries.html');
const mayResend = (await me).permissions.includes('disposition');
const status = /** @type {HTMLSelectElement} */ ($('#f-status'));
status.value = param('status') === 'all' ? '' : param('status') ?? 'failed';
status.addEventListener('change', () => {
  history.replaceState(null, '', `?status=${status.value || 'all'}`);
  load();
});

/** @param {any} m */
function card(m) {
  return el('article', { class: `message ${m.status}`, dataset: { message: m.id, status: m.status } },
    el('div', { class: 'body' },
      el('div', { class: 'head' }, sendState(m.status),
        el('a', { href: `alerts.html?state=all&alert=${m.alert_id}` }, `Alert ${m.alert_id}: ${m.alert_title}`),
        el('span', {}, occasion(m))),
      el('div', {}, channelTarget(m), ` · ${m.attempts} attempt${m.attempts === 1 ? '' : 's'} · ${timing(m)}`),
      m.last_error ? el('div', { class: 'error' }, `Last error: ${m.last_error}`) : '',
      deliveryLog(m)),
    m.status === 'failed' && mayResend
      ? el('button', { type: 'button', onclick: () => again(m), 'aria-label': `send again: alert ${m.alert_id} to ${channelTarget(m)}` }, 'Send again')
      : '');
}

/** @param {any} m */
async function again(m) {
  try {
    const queued = await sendJson('POST', `/api/notifications/messages/${m.id}/send-again`);
    fill($('#send-result'), el('p', { class: 'notice' }, `Alert ${m.alert_id}, ${channelTarget(m)}: ${sendStateWords[queued.status] ?? queued.status} again.`));
    followUp = 10;
  } catch (e) {
    fill($('#send-result'), el('p', { class: 'problem' }, /** @type {Error} */ (e).message));
  }
  await load();
}

/** @type {ReturnType<typeof setTimeout> | null} */
let nextLook = null;
/** Looks left after a "send again" (the message leaves the failed list while it waits, and may come back). */
let followUp = 0;

// While a message on the list is waiting or being sent, or one was just sent again, the list is read again every 3 s
// to show how it ended.
async function load() {
  const messages = await getJson(`/api/notifications/messages?limit=200${status.value ? `&status=${status.value}` : ''}`);
  const pending = messages.some((/** @type {any} */ m) => m.status === 'waiting' || m.status === 'sending');
  if ((pending || followUp-- > 0) && !nextLook) nextLook = setTimeout(() => { nextLook = null; load(); }, 3000);
  const what = status.value ? sendStateWords[status.value] : 'in any state';
  fill($('#messages'), messages.length === 0
    ? el('p', { class: 'notice' }, `No e-mail or webhook call ${status.value ? `is ${what}` : 'has been written yet'}.`)
    : [el('p', { class: 'muted' }, `${messages.length === 200 ? 'The newest 200' : messages.length} message${messages.length === 1 ? '' : 's'} ${what}, newest first.`),
      messages.map(card)]);
}

await load();
