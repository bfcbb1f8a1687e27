// @ts-check
// The outbox's messages (e-mails and webhook calls about an alert) as the deliveries page and the alert page show them:
// the state in words with its mark, where each went, and the log of its attempts.
import { el } from './dom.js';
import { when } from './format.js';

/** @type {Record<string, string>} */
export const sendStateWords = { waiting: 'waiting to be sent', sending: 'being sent', sent: 'sent', failed: 'failed' };

/** @type {Record<string, string>} */
const eventWords = { raised: 'alert raised', escalated: 'escalation' };

/** The state as a word with its mark: a dashed ring waiting, a ring being sent, a dot sent, a cross failed. @param {string} status */
export const sendState = (status) => el('span', { class: `send-state ${status}`, dataset: { status } }, sendStateWords[status] ?? status);

/** "e-mail to name@site" or "webhook lot-hold". @param {any} m */
export const channelTarget = (m) => (m.channel === 'email' ? `e-mail to ${m.target || 'no address'}` : `webhook ${m.target}`);

/** Why it was sent, in words. @param {any} m */
export const occasion = (m) => `${eventWords[m.event] ?? m.event}, for ${m.recipient ?? 'the configured receiver'}`;

/** When it went, or will go. @param {any} m */
export function timing(m) {
  if (m.sent_at) return `sent ${when(m.sent_at)}`;
  if (m.next_attempt_at) return `next attempt ${when(m.next_attempt_at)}`;
  return `written ${when(m.created_at)}`;
}

/** The attempts, folded away. @param {any} m */
export function deliveryLog(m) {
  if (m.deliveries.length === 0) return el('p', { class: 'muted' }, 'No attempt yet.');
  return el('details', { class: 'fold delivery-log' },
    el('summary', {}, `Delivery log: ${m.deliveries.length} attempt${m.deliveries.length === 1 ? '' : 's'}`),
    el('table', {},
      el('thead', {}, el('tr', {}, el('th', { class: 'num' }, 'attempt'), el('th', {}, 'at'), el('th', { class: 'num' }, 'took'), el('th', {}, 'outcome'), el('th', {}, 'what happened'))),
      el('tbody', {}, m.deliveries.map((/** @type {any} */ d) => el('tr', {},
        el('td', { class: 'num' }, d.attempt), el('td', { class: 'nowrap' }, when(d.at)), el('td', { class: 'num' }, `${d.duration_ms} ms`),
        el('td', {}, d.outcome), el('td', { class: 'wrap' }, d.detail))))));
}
