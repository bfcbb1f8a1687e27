// @ts-check
// Alerts brought to a person on this browser. Two choices, each remembered by this browser only (localStorage):
//   desktop  a desktop notification (the browser's Notification API) when the live feed brings an alert that is newly
//            raised and matches one of the person's browser rules, or that is newly escalated to them;
//   wall     on the floor page, a banner of the alerts nobody has acknowledged, with a tone (alarm.js).
// The shell starts the desktop part on every page; it listens to the alert changes any live feed of the page delivers
// (live.js dispatches them) and opens a feed of its own on pages that do not watch every chart.
import { getJson } from './api.js';
import { LiveFeed } from './live.js';

const keys = { desktop: 'finwatch.notify.desktop', wall: 'finwatch.notify.wall' };

/** Whether this browser chose it ("desktop" or "wall"). @param {'desktop' | 'wall'} choice */
export const chosen = (choice) => localStorage.getItem(keys[choice]) === 'on';

/** Remembers the choice for this browser. @param {'desktop' | 'wall'} choice @param {boolean} on */
export function choose(choice, on) {
  localStorage.setItem(keys[choice], on ? 'on' : 'off');
}

/** The severities in rank order, as rules and alerts name them. */
export const severities = ['low', 'medium', 'high', 'critical'];
/** @param {string} name */
const rank = (name) => severities.indexOf(name) + 1;

/** The words of a channel. @type {Record<string, string>} */
export const channelWords = { browser: 'this browser and wall screens', email: 'e-mail', webhook: 'webhook' };

/**
 * Whether a rule takes the alert: severity at or above the rule's, and each of product, step, chart and tool or chamber
 * that the rule names matches (the chart's product and step; its own chamber or the last signal's chamber).
 * @param {any} rule @param {any} alert @param {any} chart the alert's chart as /api/contexts gives it
 */
export function ruleTakes(rule, alert, chart) {
  return rank(alert.severity) >= rank(rule.min_severity)
    && (!rule.product || rule.product === chart?.product)
    && (!rule.step || rule.step === chart?.step)
    && (!rule.context || rule.context === alert.context)
    && (!rule.equipment || rule.equipment === chart?.chamber || rule.equipment === alert.chamber);
}

/** "lot M0001 wafer 3" (or the lot alone for a lot mean). @param {any} a */
export const lotWafer = (a) => `lot ${a.lot_id}${a.wafer_slot ? ` wafer ${a.wafer_slot}` : ''}`;

const toldKey = 'finwatch.notify.told';

/** The alerts (and escalation steps) this browser has already shown, kept across pages; the newest 300. */
function toldBefore() {
  /** @type {string[]} */
  let list = [];
  try {
    list = JSON.parse(localStorage.getItem(toldKey) ?? '[]');
  } catch {
    list = [];
  }
  return {
    /** @param {string} key */
    has: (key) => list.includes(key),
    /** @param {string} key */
    add: (key) => {
      list = [...list.filter((k) => k !== key), key].slice(-300);
      localStorage.setItem(toldKey, JSON.stringify(list));
    },
  };
}

/** Loads the SignalR browser client on a page that does not load it itself. */
function signalRClient() {
  if ('signalR' in window) return Promise.resolve();
  return new Promise((done, failed) => {
    const script = document.createElement('script');
    script.src = 'lib/signalr/signalr.min.js';
    script.onload = () => done(undefined);
    script.onerror = () => failed(new Error('the live feed client did not load'));
    document.head.append(script);
  });
}

/**
 * Desktop notifications for the signed-in person, when this browser chose them and the browser allows them.
 * @param {string} person @param {boolean} pageWatchesAll whether the page's own feed already brings every chart's alerts
 */
export async function notifyOnThisBrowser(person, pageWatchesAll) {
  if (!chosen('desktop') || !('Notification' in window) || Notification.permission !== 'granted') return;
  const told = toldBefore();
  /** @type {any[] | null} */
  let rules = null;
  let rulesAt = 0;
  /** @type {Map<string, any>} */
  let charts = new Map();
  /** Alert changes already being weighed on this page. @type {Set<string>} */
  const weighing = new Set();

  /** The person's browser rules, asked again after a minute (they may have changed them on another page). */
  async function browserRules() {
    if (!rules || Date.now() - rulesAt > 60_000) {
      rules = (await getJson(`/api/notifications/rules?owner=${encodeURIComponent(person)}`)).filter((/** @type {any} */ r) => r.channel === 'browser');
      rulesAt = Date.now();
    }
    return rules;
  }

  /** @param {string} code */
  async function chartOf(code) {
    if (!charts.has(code)) charts = new Map((await getJson('/api/contexts')).map((/** @type {any} */ c) => [c.code, c]));
    return charts.get(code);
  }

  /** @param {any} a */
  async function consider(a) {
    if (!a) return;
    const toMe = (a.escalated_to ?? []).includes(person) && a.state === 'open';
    // Newly raised: open, and not changed since it was raised (a later point changes updated_at).
    const raised = a.state === 'open' && a.raised_at === a.updated_at;
    const key = toMe ? `${a.id}:escalated:${a.escalation_level}` : `${a.id}:raised`;
    if ((!toMe && !raised) || told.has(key) || weighing.has(key)) return;
    weighing.add(key); // at once: the same change can arrive twice (two feeds, or two entries of one commit)
    const mine = await browserRules();
    if (mine.length === 0) return;
    // An escalation is meant for the person whatever their filters (as their e-mail and webhooks get it); a new alert
    // comes through the first of their rules that takes it.
    const chart = toMe ? null : await chartOf(a.context);
    const taking = toMe ? mine[0] : mine.find((r) => ruleTakes(r, a, chart));
    if (!taking) return;
    told.add(key);
    const why = toMe
      ? `Escalated to you (step ${a.escalation_level}): nobody has acknowledged it yet.`
      : `Your rule: ${taking.description}.`;
    const note = new Notification(`${a.severity} severity: ${a.context_title} out of control`, {
      body: `${a.rule}: ${a.rule_text}\n${lotWafer(a)}${a.chamber ? `, chamber ${a.chamber}` : ''}\n${why}`,
      tag: `finwatch-alert-${a.id}`,
    });
    note.onclick = () => {
      window.focus();
      location.href = `alerts.html?state=all&alert=${a.id}`;
      note.close();
    };
  }

  document.addEventListener('finwatch:alert', (event) => {
    consider(/** @type {CustomEvent} */ (event).detail).catch(() => {
      // a rule or chart list that could not be read: the alert still shows on the pages and in the navigation's count
    });
  });
  if (!pageWatchesAll) {
    await signalRClient();
    await new LiveFeed({ all: true, onEntry: () => {} }).start(async () => {});
  }
}
