// @ts-check
// What-if: move the fin profile away from a product's nominal and see the model's predicted ΔVT, Δswing and ΔDIBL
// (POST /api/model/predict), with the contribution of each input. An engineering estimate, said so.
import { el, fill, $, param } from '../core/dom.js';
import { getJson, sendJson, ApiError } from '../core/api.js';
import { frame } from '../core/shell.js';
import { withUnit, when, fixed } from '../core/format.js';
import { taperDeg, midWidth, maxCornerRadius, drawCrossSection } from '../core/fin.js';

frame('whatif.html');

// id, label, request field, unit, server limits [low, high] (low exclusive for the widths and height), step.
const inputs = [
  { id: 'top-width', label: 'Top width', field: 'top_width_nm', unit: 'nm', min: 0.01, max: 100, step: 0.01, q: 'wt' },
  { id: 'bottom-width', label: 'Bottom width', field: 'bottom_width_nm', unit: 'nm', min: 0.01, max: 100, step: 0.01, q: 'wb' },
  { id: 'fin-height', label: 'Fin height', field: 'height_nm', unit: 'nm', min: 0.1, max: 300, step: 0.1, q: 'h' },
  { id: 'corner-radius', label: 'Corner radius', field: 'corner_radius_nm', unit: 'nm', min: 0, max: 50, step: 0.01, q: 'r' },
  { id: 'eot', label: 'Gate dielectric EOT', field: 'eot_nm', unit: 'nm', min: 0.05, max: 10, step: 0.01, q: 'eot' },
];
const contributionLabels = [
  ['mid_width', 'mid width'], ['taper', 'taper (at fixed mid width)'], ['height', 'fin height'],
  ['corner_radius', 'corner radius'], ['dielectric', 'gate dielectric (EOT)'],
];

const productSelect = $('#product');
let products = [];
let product = null;
let lastResponse = null;
let sequence = 0;
let timer = null;

try {
  products = await getJson('/api/products');
} catch (e) {
  fill($('#predict-state'), el('div', { class: 'problem' }, e.message));
}
fill(productSelect, products.map((p) => el('option', { value: p.code }, `${p.code} · ${p.name}`)));
if (products.length === 0) fill($('#predict-state'), el('div', { class: 'problem' }, 'No products yet: a process engineer adds the products and their nominal profiles first.'));
const wanted = param('product');
if (products.some((p) => p.code === wanted)) productSelect.value = wanted;

// Build the slider + number pairs once; their ranges follow the product.
const controls = {};
fill($('#inputs'), inputs.map((i) => {
  const range = el('input', { type: 'range', id: i.id, step: i.step, 'aria-label': `${i.label} slider (${i.unit})` });
  const box = el('input', { type: 'number', id: `${i.id}-num`, min: i.min, max: i.max, step: i.step, inputmode: 'decimal', 'aria-label': `${i.label} (${i.unit})` });
  const nominal = el('span', { class: 'muted nominal-mark', id: `${i.id}-nominal` });
  const msg = el('span', { class: 'field-msg', id: `${i.id}-msg`, 'aria-live': 'polite' });
  controls[i.id] = { ...i, range, box, nominal, msg };
  range.addEventListener('input', () => { box.value = range.value; changed(i.id); });
  box.addEventListener('input', () => {
    const v = Number(box.value);
    if (box.value !== '' && Number.isFinite(v)) {
      if (v < Number(range.min)) range.min = String(v);
      if (v > Number(range.max)) range.max = String(v);
      range.value = box.value;
    }
    changed(i.id);
  });
  return el('div', { class: 'slider-row', dataset: { input: i.id } },
    el('label', { for: `${i.id}-num` }, `${i.label} [${i.unit}]`), range, el('span', { class: 'with-unit' }, box, ` ${i.unit}`), nominal, msg);
}));

productSelect.addEventListener('change', () => { setProduct(productSelect.value, false); });
$('#reset').addEventListener('click', () => setProduct(productSelect.value, false));
$('#contrib-regime').addEventListener('change', () => { if (lastResponse) contributions(lastResponse); });

function nominalOf(p) {
  return {
    'top-width': p.nominal.top_width_nm, 'bottom-width': p.nominal.bottom_width_nm, 'fin-height': p.nominal.fin_height_nm,
    'corner-radius': p.nominal.corner_radius_nm, eot: p.model?.eot_nm ?? 0.9,
  };
}

function setProduct(code, fromUrl) {
  product = products.find((p) => p.code === code);
  if (!product) return;
  const nom = nominalOf(product);
  for (const c of Object.values(controls)) {
    const n = nom[c.id];
    // Slider span around the nominal; the number box takes anything the model accepts.
    const low = c.id === 'corner-radius' ? 0 : Math.max(c.min, +(n * (c.id === 'fin-height' ? 0.6 : 0.5)).toFixed(2));
    const high = c.id === 'corner-radius' ? Math.max(5, +(n * 3).toFixed(2), product.nominal.top_width_nm) : Math.min(c.max, +(n * (c.id === 'fin-height' ? 1.4 : 1.6)).toFixed(2));
    c.range.min = String(low);
    c.range.max = String(high);
    const fromQuery = fromUrl ? Number(param(c.q)) : NaN;
    const v = fromUrl && param(c.q) !== null && Number.isFinite(fromQuery) ? fromQuery : n;
    if (v < low) c.range.min = String(v);
    if (v > high) c.range.max = String(v);
    c.range.value = String(v);
    c.box.value = String(v);
    fill(c.nominal, `nominal ${withUnit(n, c.unit, 2)}`);
  }
  changed(null);
}

function readProfile() {
  const values = {};
  let ok = true;
  for (const c of Object.values(controls)) {
    const text = c.box.value.trim();
    const v = Number(text);
    let why = '';
    if (text === '' || !Number.isFinite(v)) why = 'enter a number';
    else if (c.id === 'corner-radius' ? v < 0 || v > c.max : v <= 0 || v > c.max) {
      why = c.id === 'corner-radius' ? `0 to ${c.max} ${c.unit}` : `more than 0, at most ${c.max} ${c.unit}`;
    }
    c.box.classList.toggle('invalid', Boolean(why));
    fill(c.msg, why);
    if (why) ok = false;
    values[c.id] = v;
  }
  return ok ? values : null;
}

function changed() {
  const v = readProfile();
  derived(v);
  if (!v || !product) {
    fill($('#predict-state'), v ? '' : 'Correct the marked input to update the prediction.');
    return;
  }
  const q = new URLSearchParams({ product: product.code });
  for (const c of Object.values(controls)) q.set(c.q, String(v[c.id]));
  history.replaceState(null, '', `whatif.html?${q}`);
  fill($('#predict-state'), 'updating…');
  clearTimeout(timer);
  timer = setTimeout(() => predict(v), 250);
}

function derived(v) {
  if (!v) { fill($('#derived'), ''); return; }
  const wt = v['top-width'];
  const wb = v['bottom-width'];
  const h = v['fin-height'];
  const r = v['corner-radius'];
  const taper = taperDeg(wt, wb, h);
  const mid = midWidth(wt, wb);
  const rMax = maxCornerRadius(wt, wb, h);
  const n = product ? nominalOf(product) : null;
  const nTaper = n ? taperDeg(n['top-width'], n['bottom-width'], n['fin-height']) : null;
  const nMid = n ? midWidth(n['top-width'], n['bottom-width']) : null;
  const delta = (a, b, unit) => (b == null ? '' : ` (${a - b >= 0 ? '+' : '−'}${withUnit(Math.abs(a - b), unit, 2)} against the nominal)`);
  fill($('#derived'),
    el('div', { id: 'derived-taper' }, el('label', {}, 'sidewall taper per side'), `${withUnit(taper, 'deg', 2)}${delta(taper, nTaper, 'deg')}`),
    el('div', { id: 'derived-mid-width' }, el('label', {}, 'mid width (Wt + Wb)/2'), `${withUnit(mid, 'nm', 2)}${delta(mid, nMid, 'nm')}`),
    el('div', { id: 'derived-max-radius' }, el('label', {}, 'largest corner radius the top allows'), withUnit(rMax, 'nm', 2)),
    wt > wb ? el('div', { class: 'problem' }, 'Re-entrant profile: the top is wider than the foot.') : null,
    r > rMax ? el('div', { class: 'problem' }, `The corner radius ${withUnit(r, 'nm', 2)} is larger than the ${withUnit(rMax, 'nm', 2)} the top allows; the geometry uses the largest possible radius.`) : null);
  if (product) {
    drawCrossSection($('#whatif-xsection'), { wt, wb, h, r: Math.min(r, rMax), t: product.nominal.liner_thickness_nm },
      { wt: product.nominal.top_width_nm, wb: product.nominal.bottom_width_nm, h: product.nominal.fin_height_nm, r: product.nominal.corner_radius_nm, t: product.nominal.liner_thickness_nm },
      { width: 560, height: 380, measuredLabel: 'chosen profile' });
  }
}

async function predict(v) {
  const mine = ++sequence;
  const body = { product: product.code };
  for (const c of Object.values(controls)) body[c.field] = v[c.id];
  try {
    const response = await sendJson('POST', '/api/model/predict', body);
    if (mine !== sequence) return; // a newer request is on its way
    lastResponse = response;
    show(response);
    fill($('#predict-state'), `Prediction for ${response.product} at the inputs on the left.`);
  } catch (e) {
    if (mine !== sequence) return;
    if (e instanceof ApiError && e.problem?.errors) {
      for (const [field, messages] of Object.entries(e.problem.errors)) {
        const c = Object.values(controls).find((x) => x.field === field);
        if (c) { c.box.classList.add('invalid'); fill(c.msg, [].concat(messages).join('; ')); }
      }
    }
    fill($('#predict-state'), el('div', { class: 'problem' }, e.message));
  }
}

function show(r) {
  const tile = (id, label, value, unit, digits) => el('div', { class: 'shift', id },
    el('label', {}, label),
    el('div', { class: 'shift-value' }, value == null ? '—' : signed(value, unit, digits)),
    value == null ? el('div', { class: 'muted' }, 'not defined for this profile') : null);
  fill($('#shifts'),
    tile('dvt-lin', 'ΔVT linear', r.delta_vt_lin_mv, 'mV', 1),
    tile('dvt-sat', 'ΔVT saturation', r.delta_vt_sat_mv, 'mV', 1),
    tile('dswing', 'Δ subthreshold swing', r.delta_swing_lin_mv_per_dec, 'mV/dec', 2),
    tile('ddibl', 'ΔDIBL', r.delta_dibl_mv_per_v, 'mV/V', 1));
  fill($('#warnings'), r.warnings.length
    ? el('div', { class: 'problem', id: 'validity-warnings' }, el('strong', {}, 'Outside the model’s validity:'), el('ul', {}, r.warnings.map((w) => el('li', {}, w))))
    : el('p', { class: 'muted', id: 'validity-warnings' }, 'No validity warnings for this profile.'));
  fill($('#caution'), el('strong', {}, 'Engineering estimate, not an electrical test result. '), r.note);
  // The stamp in the page's one date format, and the model's version number without its internal name.
  const stamp = String(r.parameter_set_version).replace(/\d{4}-\d{2}-\d{2}[ T]\d{2}:\d{2}(:\d{2})?Z/g, (t) => when(t.replace(' ', 'T')));
  fill($('#model-version'), `Model parameter set ${r.parameter_set}, ${stamp}; model version ${String(r.code_version).split('/').pop()}. Dashed: the nominal profile of ${r.product}; filled: the chosen profile with the nominal liner.`);
  contributions(r);
}

function signed(value, unit, digits) {
  const sign = value > 0 ? '+' : value < 0 ? '−' : '±';
  return `${sign}${withUnit(Math.abs(value), unit, digits)}`;
}

function contributions(r) {
  const regime = $('#contrib-regime').value;
  const c = regime === 'lin' ? r.contributions_lin_mv : r.contributions_sat_mv;
  const exact = regime === 'lin' ? r.delta_vt_lin_mv : r.delta_vt_sat_mv;
  const largest = Math.max(1e-9, ...contributionLabels.map(([k]) => Math.abs(c[k])), Math.abs(c.linear_total));
  const line = (key, label, value, cls) => {
    const bar = el('span', { class: `bar${value < 0 ? ' negative' : ''}` });
    const half = (Math.abs(value) / largest) * 50;
    bar.style.width = `${half}%`;
    bar.style.left = value < 0 ? `${50 - half}%` : '50%';
    return [
      el('span', { class: cls }, label),
      el('span', { class: 'bar-track', dataset: { input: key }, title: `${label}: ${signed(value, 'mV', 2)}` }, bar),
      el('span', { class: `num ${cls ?? ''}` }, signed(value, 'mV', 2)),
    ];
  };
  fill($('#contrib'),
    contributionLabels.map(([k, label]) => line(k, label, c[k])),
    line('linear_total', 'sum (linear estimate)', c.linear_total, 'total'));
  fill($('#contrib-note'),
    `Solid bars right of the centre line raise VT; hatched bars left of it lower VT. The contributions come from the sensitivity table at the nominal and add up to the linear estimate ${signed(c.linear_total, 'mV', 2)}; `,
    `the full model gives ${exact == null ? '—' : signed(exact, 'mV', 2)} (difference ${exact == null ? '—' : `${fixed(exact - c.linear_total, 2)} mV`}, the non-linear part).`);
}

if (products.length) setProduct(productSelect.value, true);
