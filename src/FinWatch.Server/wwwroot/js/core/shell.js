// The frame every page shares: the top strip with the page links, the live-connection line, the demo mark.
import { el } from './dom.js';
import { getJson } from './api.js';

const pages = [
  ['index.html', 'Floor'],
  ['chart.html', 'Chart'],
  ['alerts.html', 'Alerts'],
  ['limits.html', 'Limits & plans'],
  ['lot.html', 'Lot'],
  ['whatif.html', 'What-if'],
  ['entry.html', 'Log data'],
  ['shift.html', 'Shift report'],
];

/** Adds the top strip before <main>; returns the element that shows the live-connection state. */
export function frame(current) {
  const nav = el('nav', { 'aria-label': 'FinWatch pages' },
    pages.map(([href, label]) => el('a', { href, 'aria-current': href === current ? 'page' : null }, label)));
  const demo = el('span', { class: 'demo-mark hidden', role: 'status' });
  const strip = el('header', { class: 'strip' }, el('a', { class: 'brand', href: 'index.html' }, 'Fin', el('span', {}, 'Watch')), nav, demo);
  const banner = el('div', { class: 'link-state', role: 'status', 'aria-live': 'polite', dataset: { state: 'none' } });
  document.body.prepend(strip, banner);
  getJson('/api/about').then((about) => {
    if (about?.demo_data && about.demo_data !== 'idle') {
      demo.textContent = `Demo data (invented fab): ${about.demo_data}`;
      demo.classList.remove('hidden');
    }
  }).catch(() => { /* the page still works without the mark */ });
  return banner;
}
