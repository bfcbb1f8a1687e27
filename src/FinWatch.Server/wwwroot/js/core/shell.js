// @ts-check
// The frame every page shares: the top strip with the page links (the alerts link counts the alerts nobody has
// acknowledged yet), who is signed in, the live-connection line, and the demo or wall-screen mark. It stays on one row
// at 1366 px: the longer words go to the tooltips. A page that needs a person sends the visitor to the sign-in page first.
import { el } from './dom.js';
import { getJson, sendJson, resetAntiforgery } from './api.js';
import { when, zoneName } from './format.js';
import { notifyOnThisBrowser } from './notify.js';

const pages = [
  ['index.html', 'Floor', 'floor'],
  ['chart.html', 'Chart', 'floor'],
  ['alerts.html', 'Alerts', 'read'],
  ['limits.html', 'Limits & plans', 'read'],
  ['lot.html', 'Lot', 'read'],
  ['whatif.html', 'What-if', 'read'],
  ['entry.html', 'Log data', 'ingest'],
  ['shift.html', 'Shift report', 'read'],
  ['maintenance.html', 'Maintenance', 'read'],
  ['audit.html', 'Audit', 'read'],
  ['notify.html', 'Notify', 'read'],
  ['people.html', 'People & keys', 'administer'],
];

/** Pages behind one link of the strip, linked to each other in a row at the top of each (the strip has no room for more). */
const sections = {
  'notify.html': [['notify.html', 'Notify me'], ['roster.html', 'Shift roster'], ['deliveries.html', 'Deliveries of e-mails and webhooks']],
};
/** The strip's link a page belongs under. @param {string} page */
const sectionOf = (page) => Object.keys(sections).find((top) => sections[top].some(([href]) => href === page)) ?? page;

/** Who the page is shown to (GET /api/auth/me), known once the frame has asked. */
export const me = getJson('/api/auth/me').catch(() => ({ signed_in: false, permissions: [] }));

/**
 * Adds the top strip before <main>; returns the element that shows the live-connection state. A page whose own live
 * feed watches every chart says so (watchesAll), and the desktop notifications use its feed instead of opening another.
 * @param {string} current @param {{ watchesAll?: boolean }} [options]
 */
export function frame(current, { watchesAll = false } = {}) {
  const nav = el('nav', { 'aria-label': 'FinWatch pages' });
  const who = el('span', { class: 'who' });
  const mark = el('span', { class: 'demo-mark hidden', role: 'status' });
  const strip = el('header', { class: 'strip' }, el('a', { class: 'brand', href: 'index.html' }, 'Fin', el('span', {}, 'Watch')), nav, mark, who);
  const banner = el('div', { class: 'link-state', role: 'status', 'aria-live': 'polite', dataset: { state: 'none' } });
  document.body.prepend(strip, banner);
  // One date-time format on every page, and the zone said once, here.
  document.body.append(el('footer', { class: 'zone-note' }, `Times are in ${zoneName}, this browser's time zone, written as ${when(Date.now())}.`));
  me.then((m) => {
    const needed = pages.find(([href]) => href === sectionOf(current))?.[2] ?? 'read';
    if (!m.signed_in && current !== 'signin.html') {
      location.href = `signin.html?next=${encodeURIComponent(location.pathname.slice(1) + location.search)}`;
      return;
    }
    const top = sectionOf(current);
    nav.append(...pages.filter(([, , p]) => m.permissions.includes(p) || !m.signed_in)
      .map(([href, label]) => el('a', { href, 'aria-current': href === top ? 'page' : null }, label,
        href === 'alerts.html' ? el('span', { class: 'count hidden', id: 'unacknowledged' }) : '')));
    if (sections[top]) {
      document.querySelector('main')?.prepend(el('nav', { class: 'section-nav', 'aria-label': 'notification pages' },
        sections[top].map(([href, label]) => el('a', { href, 'aria-current': href === current ? 'page' : null }, label))));
    }
    if (m.via === 'demo') show(mark, 'Demo · invented data', `Demo mode: signed in automatically as ${m.name}. Every fab, product, lot and person shown is invented.`);
    else if (m.via === 'display') show(mark, 'Wall screen · read-only', `Wall screen (${m.name}): floor and charts only, read-only`);
    if (m.signed_in && m.via !== 'display') {
      who.title = `${m.name}, ${m.role}`;
      who.append(el('span', { class: 'name' }, m.name), ' ', m.via === 'cookie'
        ? el('button', { type: 'button', class: 'quiet', id: 'sign-out', onclick: signOut }, 'Sign out')
        : el('a', { href: 'signin.html', title: 'Sign in with your own name and password' }, 'Sign in'));
    }
    if (m.signed_in && m.permissions.includes('read')) {
      watchAlertCounts();
      notifyOnThisBrowser(m.name, watchesAll).catch(() => {
        // without the live feed no desktop notification: the feed line of the page says it is offline
      });
    }
    if (m.signed_in && !m.permissions.includes(needed)) {
      document.querySelector('main')?.prepend(el('p', { class: 'problem' }, `Your role (${m.role}) may not use this page.`));
    }
  });
  return banner;
}

/** @param {HTMLElement} node @param {string} text @param {string} title */
function show(node, text, title) {
  node.textContent = text;
  node.title = title;
  node.classList.remove('hidden');
}

// The badge on the alerts link: read at once, again whenever a page's live feed delivers an alert change, and every
// minute for pages without a feed.
function watchAlertCounts() {
  let pending = 0;
  const refresh = async () => {
    const badge = document.getElementById('unacknowledged');
    if (!badge) return;
    try {
      const c = await getJson('/api/alerts/counts');
      badge.textContent = String(c.unacknowledged);
      badge.classList.toggle('hidden', c.unacknowledged === 0);
      const words = `${c.unacknowledged} alert${c.unacknowledged === 1 ? '' : 's'} not acknowledged, ${c.active} not closed${c.escalated ? `, ${c.escalated} escalated` : ''}`;
      badge.title = words;
      badge.setAttribute('aria-label', words);
    } catch {
      // the next refresh tries again; the badge keeps its last count
    }
  };
  document.addEventListener('finwatch:alert', () => {
    clearTimeout(pending);
    pending = window.setTimeout(refresh, 300);
  });
  window.setInterval(refresh, 60_000);
  refresh();
}

async function signOut() {
  try {
    await sendJson('POST', '/api/auth/sign-out');
  } finally {
    resetAntiforgery();
    location.href = 'signin.html';
  }
}
