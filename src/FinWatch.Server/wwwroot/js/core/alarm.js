// @ts-check
// "Sound and banner on this screen": on the floor page, a large banner of the alerts nobody has acknowledged yet, each
// staying until the live feed says it left the open state, and a short tone every 15 s while any is waiting. Browsers
// keep sound off until someone clicks on the page; the banner then says so and offers the click.
import { el, fill } from './dom.js';
import { getJson } from './api.js';
import { when, alertStateWords } from './format.js';
import { chosen, choose, lotWafer } from './notify.js';

const repeatMs = 15_000;

/** @type {Record<string, string>} */
const soundWords = {
  off: 'Sound off: this screen shows no banner and plays no tone.',
  quiet: 'Sound on: a tone plays every 15 s while an alert waits to be acknowledged. None is waiting.',
  playing: 'Sound on: a tone plays every 15 s until every alert here is acknowledged.',
  blocked: 'Sound blocked: this browser plays sound only after someone clicks on the page.',
  unavailable: 'No sound: this browser cannot play tones. The banner still shows every alert.',
};

/**
 * The banner and its tone, placed in `host`; `toggle` is the page's checkbox for the choice. Call `load()` in the
 * page's load (so the live feed's later entries follow it); alert changes arrive through the live feed's events.
 * @param {HTMLElement} host @param {HTMLInputElement} toggle
 */
export function alarm(host, toggle) {
  /** @type {Map<number, any>} */
  const waiting = new Map();
  /** @type {AudioContext | null} */
  let audio = null;
  /** @type {ReturnType<typeof setInterval> | null} */
  let repeat = null;
  const list = el('ul', { class: 'alarm-list' });
  const heading = el('h2', { id: 'alarm-h' });
  const sound = el('p', { class: 'sound', id: 'sound', role: 'status', dataset: { sound: 'off' } });
  const allow = el('button', { type: 'button', id: 'allow-sound', class: 'hidden', onclick: allowSound }, 'Allow sound on this screen');
  const banner = el('section', { class: 'alarm hidden', id: 'alarm', 'aria-labelledby': 'alarm-h', 'aria-live': 'assertive' },
    heading, list, el('div', { class: 'sound-line' }, sound, allow));
  host.append(banner);

  toggle.checked = chosen('wall');
  toggle.addEventListener('change', async () => {
    choose('wall', toggle.checked);
    if (toggle.checked) {
      await allowSound(); // the click on the box is the gesture browsers ask for
      await load();
    } else {
      render();
    }
  });

  async function load() {
    if (!toggle.checked) return;
    waiting.clear();
    for (const a of await getJson('/api/alerts?state=open')) waiting.set(a.id, a);
    render();
  }

  document.addEventListener('finwatch:alert', (event) => {
    const a = /** @type {CustomEvent} */ (event).detail;
    if (!a) return;
    if (a.state === 'open') waiting.set(a.id, a); else waiting.delete(a.id);
    render();
  });

  /** The page's one audio context; created suspended in most browsers until someone clicks. */
  function audioContext() {
    if (!audio) {
      audio = new AudioContext();
      audio.onstatechange = () => render(); // a click anywhere on the page may let it run
    }
    return audio;
  }

  async function allowSound() {
    try {
      const context = audioContext();
      if (context.state === 'suspended') await context.resume();
    } catch {
      audio = null;
    }
    render();
  }

  /** Two short rising notes, quiet enough not to startle. */
  function tone() {
    if (!audio || audio.state !== 'running') return;
    const start = audio.currentTime;
    for (const [i, hz] of [660, 880].entries()) {
      const osc = audio.createOscillator();
      const gain = audio.createGain();
      osc.frequency.value = hz;
      gain.gain.setValueAtTime(0.0001, start + i * 0.22);
      gain.gain.exponentialRampToValueAtTime(0.25, start + i * 0.22 + 0.03);
      gain.gain.exponentialRampToValueAtTime(0.0001, start + i * 0.22 + 0.2);
      osc.connect(gain).connect(audio.destination);
      osc.start(start + i * 0.22);
      osc.stop(start + i * 0.22 + 0.21);
    }
  }

  function soundState() {
    if (!toggle.checked) return 'off';
    if (waiting.size === 0) return 'quiet';
    if (!('AudioContext' in window)) return 'unavailable';
    return audioContext().state === 'running' ? 'playing' : 'blocked';
  }

  function render() {
    const on = toggle.checked && waiting.size > 0;
    banner.classList.toggle('hidden', !on);
    const state = soundState();
    sound.dataset.sound = state;
    sound.textContent = soundWords[state];
    allow.classList.toggle('hidden', state !== 'blocked');
    if (state === 'playing' && !repeat) {
      tone();
      repeat = setInterval(tone, repeatMs);
    } else if (state !== 'playing' && repeat) {
      clearInterval(repeat);
      repeat = null;
    }
    if (!on) return;
    const alerts = [...waiting.values()].sort((a, b) => b.severity_rank - a.severity_rank || (a.raised_at < b.raised_at ? 1 : -1));
    fill(heading, `${alerts.length} alert${alerts.length === 1 ? '' : 's'} waiting to be acknowledged`);
    fill(list, alerts.map((a) => el('li', { class: 'alarm-item', dataset: { alert: a.id } },
      el('span', { class: `sev ${a.severity}` }, a.severity),
      el('span', { class: 'alarm-chart' }, a.context_title),
      el('span', { class: 'alarm-rule' }, a.rule_text),
      el('span', { class: 'alarm-lot' }, lotWafer(a)),
      el('span', { class: 'alarm-when' }, `raised ${when(a.raised_at)}`),
      a.escalation_level > 0 ? el('b', { class: 'alarm-escalated' }, `escalated to ${(a.escalated_to ?? []).join(', ') || 'the next step'}`) : '',
      el('span', { class: 'alert-state open' }, alertStateWords.open))));
  }

  render();
  return { load };
}
