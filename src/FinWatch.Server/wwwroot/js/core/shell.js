// The frame every page shares: the top strip with the page links, who is signed in, the live-connection line, and the
// demo or wall-screen mark. A page that needs a person sends the visitor to the sign-in page first.
import { el } from './dom.js';
import { getJson, sendJson, resetAntiforgery } from './api.js';

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
  ['people.html', 'People & keys', 'administer'],
];

/** Who the page is shown to (GET /api/auth/me), known once the frame has asked. */
export const me = getJson('/api/auth/me').catch(() => ({ signed_in: false, permissions: [] }));

/** Adds the top strip before <main>; returns the element that shows the live-connection state. */
export function frame(current) {
  const nav = el('nav', { 'aria-label': 'FinWatch pages' });
  const who = el('span', { class: 'who' });
  const mark = el('span', { class: 'demo-mark hidden', role: 'status' });
  const strip = el('header', { class: 'strip' }, el('a', { class: 'brand', href: 'index.html' }, 'Fin', el('span', {}, 'Watch')), nav, mark, who);
  const banner = el('div', { class: 'link-state', role: 'status', 'aria-live': 'polite', dataset: { state: 'none' } });
  document.body.prepend(strip, banner);
  me.then((m) => {
    const needed = pages.find(([href]) => href === current)?.[2] ?? 'read';
    if (!m.signed_in && current !== 'signin.html') {
      location.href = `signin.html?next=${encodeURIComponent(location.pathname.slice(1) + location.search)}`;
      return;
    }
    nav.append(...pages.filter(([, , p]) => m.permissions.includes(p) || !m.signed_in)
      .map(([href, label]) => el('a', { href, 'aria-current': href === current ? 'page' : null }, label)));
    if (m.via === 'demo') show(mark, `Demo mode: signed in automatically as ${m.name}. Invented data.`);
    else if (m.via === 'display') show(mark, `Wall screen (${m.name}): floor and charts only, read-only`);
    if (m.signed_in && m.via !== 'display') {
      who.append(`${m.name} · ${m.role}`, ' ', m.via === 'cookie'
        ? el('button', { type: 'button', class: 'quiet', id: 'sign-out', onclick: signOut }, 'Sign out')
        : el('a', { href: 'signin.html' }, 'Sign in as a person'));
    }
    if (m.signed_in && !m.permissions.includes(needed)) {
      document.querySelector('main')?.prepend(el('p', { class: 'problem' }, `Your role (${m.role}) may not use this page.`));
    }
  });
  return banner;
}

function show(node, text) {
  node.textContent = text;
  node.classList.remove('hidden');
}

async function signOut() {
  try {
    await sendJson('POST', '/api/auth/sign-out');
  } finally {
    resetAntiforgery();
    location.href = 'signin.html';
  }
}
