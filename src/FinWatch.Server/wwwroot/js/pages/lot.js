// One lot: step and wafer selectors, wafer maps of the main parameters (sites at their x/y mm on the 300 mm wafer,
// coloured by value), the site table, and the selected site's cross-section drawn to scale against the product's
// nominal. Without ?lot= the page is a small lot finder.
import { el, fill, $, param } from '../core/dom.js';
import { getJson } from '../core/api.js';
import { frame } from '../core/shell.js';
import { withUnit, when, unitLabel } from '../core/format.js';
import { drawCrossSection, gateFacesLabel } from '../core/fin.js';

frame('lot.html');

const WAFER_RADIUS_MM = 150;
const mapped = [
  ['top_width_nm', 'Top width', 'nm'],
  ['bottom_width_nm', 'Bottom width', 'nm'],
  ['fin_height_nm', 'Fin height', 'nm'],
  ['corner_radius_nm', 'Corner radius', 'nm'],
  ['liner_thickness_nm', 'Liner', 'nm'],
  ['taper_deg', 'Taper', 'deg'],
  ['mid_width_nm', 'Mid width', 'nm'],
];
const tableColumns = [
  ...mapped,
  ['area_nm2', 'Area', 'nm^2'],
  ['gated_perimeter_nm', 'Gated perimeter', 'nm'],
  ['max_corner_radius_nm', 'Largest radius', 'nm'],
];
const flagWords = { re_entrant_profile: 're-entrant (top wider than foot)', radius_exceeds_max: 'radius larger than the top allows' };

// A light-to-dark ramp (pale leaf → teal → deep slate): lightness carries the value, so it reads in grey too.
const ramp = [[236, 241, 214], [120, 178, 160], [47, 110, 125], [31, 45, 82]];
function colourAt(f) {
  const x = Math.max(0, Math.min(1, f)) * (ramp.length - 1);
  const i = Math.min(ramp.length - 2, Math.floor(x));
  const t = x - i;
  const c = ramp[i].map((v, k) => Math.round(v + (ramp[i + 1][k] - v) * t));
  return `rgb(${c[0]}, ${c[1]}, ${c[2]})`;
}
const rampCss = `linear-gradient(to right, ${ramp.map((_, i) => colourAt(i / (ramp.length - 1))).join(', ')})`;

const lotId = param('lot');
if (!lotId) await finder();
else await showLot(lotId);

// ---------------------------------------------------------------------------------------------------------- finder
async function finder() {
  $('#finder').classList.remove('hidden');
  const search = $('#lot-search');
  const productSelect = $('#lot-product');
  let items = [];
  try {
    const products = await getJson('/api/products');
    productSelect.append(...products.map((p) => el('option', { value: p.code }, `${p.code} · ${p.name}`)));
  } catch { /* the list still works for all products */ }

  async function load() {
    const q = new URLSearchParams({ page_size: '200' });
    if (productSelect.value) q.set('product', productSelect.value);
    try {
      items = (await getJson(`/api/lots?${q}`)).items;
      fill($('#finder-problem'));
    } catch (e) {
      items = [];
      fill($('#finder-problem'), el('div', { class: 'problem' }, e.message));
    }
    render();
  }

  function render() {
    const needle = search.value.trim().toLowerCase();
    const shown = items.filter((l) => !needle || l.lot_id.toLowerCase().includes(needle)).slice(0, 60);
    fill($('#recent-lots tbody'), shown.length === 0
      ? el('tr', {}, el('td', { colspan: 7 }, needle ? `No recent lot matches “${search.value.trim()}”; press Enter to open it anyway.` : 'No lots measured yet.'))
      : shown.map((l) => el('tr', { dataset: { lot: l.lot_id } },
        el('td', {}, el('a', { href: `lot.html?lot=${encodeURIComponent(l.lot_id)}&step=${encodeURIComponent(l.step)}` }, l.lot_id)),
        el('td', {}, l.product), el('td', {}, l.step),
        el('td', { class: 'num' }, l.wafer_count), el('td', { class: 'num' }, l.site_count),
        el('td', {}, l.chambers.join(', ')), el('td', {}, when(l.last_measured_at)))));
  }

  search.addEventListener('input', render);
  productSelect.addEventListener('change', load);
  $('#lot-search-form').addEventListener('submit', (e) => {
    e.preventDefault();
    const id = search.value.trim();
    if (id) location.href = `lot.html?lot=${encodeURIComponent(id)}`;
  });
  search.focus();
  await load();
}

// ------------------------------------------------------------------------------------------------------------- lot
async function showLot(id) {
  $('#lot-view').classList.remove('hidden');
  fill($('#lot-title'), `Lot ${id}`);
  document.title = `FinWatch · Lot ${id}`;
  let lot;
  try {
    lot = await getJson(`/api/lots/${encodeURIComponent(id)}`);
  } catch (e) {
    fill($('#lot-problem'), el('div', { class: 'problem' }, e.message), el('p', {}, el('a', { href: 'lot.html' }, 'Find another lot')));
    return;
  }
  let product = null;
  try {
    product = await getJson(`/api/products/${encodeURIComponent(lot.product)}`);
  } catch { /* maps and table still work without the nominal */ }
  const specOf = (name) => product?.specs?.find((s) => s.parameter === name) ?? null;

  const stepSelect = $('#step');
  const waferSelect = $('#wafer');
  const state = { step: null, wafer: null, site: null };
  fill(stepSelect, lot.steps.map((s) => el('option', { value: s.step }, `${s.step} (${s.wafers.length} wafers)`)));
  const wantedStep = param('step');
  stepSelect.value = lot.steps.some((s) => s.step === wantedStep) ? wantedStep : lot.steps[0].step;

  const stepData = () => lot.steps.find((s) => s.step === stepSelect.value);
  const waferData = () => stepData().wafers.find((w) => String(w.wafer_slot) === waferSelect.value);

  function fillWafers(wanted) {
    const wafers = stepData().wafers;
    fill(waferSelect, wafers.map((w) => el('option', { value: w.wafer_slot }, `W${w.wafer_slot} (${w.sites.length} sites)`)));
    waferSelect.value = wafers.some((w) => String(w.wafer_slot) === String(wanted)) ? String(wanted) : String(wafers[0].wafer_slot);
  }
  fillWafers(param('wafer'));

  function syncUrl() {
    const q = new URLSearchParams({ lot: id, step: stepSelect.value, wafer: waferSelect.value });
    if (state.site) q.set('site', state.site);
    history.replaceState(null, '', `lot.html?${q}`);
  }

  stepSelect.addEventListener('change', () => { fillWafers(waferSelect.value); state.site = null; showWafer(); });
  waferSelect.addEventListener('change', () => { showWafer(); });

  const chambers = [...new Set(lot.steps.flatMap((s) => s.wafers.flatMap((w) => w.sites.flatMap((x) => [x.etch_chamber, x.liner_chamber]))).filter(Boolean))].sort();
  fill($('#lot-meta'), `product ${lot.product}${product ? ` (${product.name}, ${gateFacesLabel(product.gate_faces)})` : ''} · ${lot.steps.length} step${lot.steps.length > 1 ? 's' : ''}${chambers.length ? ` · chambers ${chambers.join(', ')}` : ''}`);

  let maps = [];

  function showWafer() {
    const wafer = waferData();
    const sites = wafer.sites;
    if (!sites.some((s) => s.site_id === state.site)) state.site = param('site') && sites.some((s) => s.site_id === param('site')) ? param('site') : sites[0]?.site_id ?? null;
    const present = mapped.filter(([name]) => sites.some((s) => s[name] != null));
    maps = present.map(([name, label, unit]) => waferMap(name, label, unit, sites, specOf(name), (siteId) => select(siteId)));
    fill($('#maps'), maps.map((m) => m.node), present.length === 0 ? el('p', {}, 'No mapped parameter was measured on this wafer.') : null);
    fill($('#map-legend'),
      `Wafer W${wafer.wafer_slot}, step ${stepSelect.value}: each dot is a site at its (x, y) position on the 300 mm wafer, notch at the bottom. `,
      'Colour runs light (wafer minimum) to dark (wafer maximum) of each parameter; a diamond marks a value outside the product specification; a hollow grey circle means not measured at that step. ',
      'Click a site (or pick a table row) to select it; the ring marks the selection.');
    siteTable(sites);
    select(state.site);
  }

  function select(siteId) {
    state.site = siteId;
    syncUrl();
    for (const m of maps) m.draw(siteId);
    for (const tr of document.querySelectorAll('#sites tbody tr')) tr.classList.toggle('selected', tr.dataset.site === siteId);
    const site = waferData().sites.find((s) => s.site_id === siteId);
    showSite(site);
  }

  function siteTable(sites) {
    fill($('#sites thead'), el('tr', {},
      el('th', {}, 'site'), el('th', { class: 'num' }, 'x [mm]'), el('th', { class: 'num' }, 'y [mm]'),
      tableColumns.map(([, label, unit]) => el('th', { class: 'num' }, `${label} [${unitLabel(unit)}]`)),
      el('th', {}, 'flags'), el('th', {}, 'measured'), el('th', {}, 'chambers')));
    fill($('#sites tbody'), sites.map((s) => {
      const tr = el('tr', { dataset: { site: s.site_id }, tabindex: 0, class: s.flags.length ? 'flagged' : null },
        el('th', { scope: 'row' }, s.site_id),
        el('td', { class: 'num' }, withUnit(s.site_x_mm, 'mm', 1)), el('td', { class: 'num' }, withUnit(s.site_y_mm, 'mm', 1)),
        tableColumns.map(([name, , unit]) => {
          const spec = specOf(name);
          const out = outOfSpec(s[name], spec);
          return el('td', { class: out ? 'num out-of-spec' : 'num', title: out ? `outside specification ${specText(spec, unit)}` : null }, withUnit(s[name], unit), out ? ' ◆' : '');
        }),
        el('td', {}, s.flags.map((f) => flagWords[f] ?? f).join('; ')),
        el('td', {}, when(s.measured_at)),
        el('td', {}, [s.etch_chamber, s.liner_chamber].filter(Boolean).join(', ')));
      tr.addEventListener('click', () => select(s.site_id));
      tr.addEventListener('keydown', (e) => { if (e.key === 'Enter' || e.key === ' ') { e.preventDefault(); select(s.site_id); } });
      return tr;
    }));
  }

  function showSite(site) {
    const svg = $('#xsection');
    if (!site) {
      fill($('#site-detail'), 'No site selected.');
      svg.replaceChildren();
      return;
    }
    fill($('#xs-title'), `Cross-section of site ${site.site_id} (W${waferSelect.value}, ${stepSelect.value})`);
    const nominal = product?.nominal;
    drawCrossSection(svg,
      { wt: site.top_width_nm, wb: site.bottom_width_nm, h: site.fin_height_nm, r: site.corner_radius_nm, t: site.liner_thickness_nm },
      nominal ? { wt: nominal.top_width_nm, wb: nominal.bottom_width_nm, h: nominal.fin_height_nm, r: nominal.corner_radius_nm, t: nominal.liner_thickness_nm } : null);
    fill($('#xs-note'), nominal
      ? `Drawn to scale. Dashed: the nominal profile of ${lot.product} (top ${withUnit(nominal.top_width_nm, 'nm', 2)}, bottom ${withUnit(nominal.bottom_width_nm, 'nm', 2)}, height ${withUnit(nominal.fin_height_nm, 'nm', 1)}, corner radius ${withUnit(nominal.corner_radius_nm, 'nm', 2)}, liner ${withUnit(nominal.liner_thickness_nm, 'nm', 2)}). A missing corner radius or liner is drawn as 0 nm.`
      : 'Drawn to scale; the product nominal could not be loaded.');
    const rows = [
      ['position', `x ${withUnit(site.site_x_mm, 'mm', 1)}, y ${withUnit(site.site_y_mm, 'mm', 1)} (${withUnit(Math.hypot(site.site_x_mm, site.site_y_mm), 'mm', 1)} from centre)`],
      ['measured', `${when(site.measured_at)} by ${site.operator ?? '—'} on ${site.metrology_tool ?? '—'}`],
      ['etch', [site.etch_tool, site.etch_chamber].filter(Boolean).join(' / ') || '—'],
      ['liner deposition', [site.liner_tool, site.liner_chamber].filter(Boolean).join(' / ') || '—'],
      ...tableColumns.map(([name, label, unit]) => {
        const spec = specOf(name);
        return [label, `${withUnit(site[name], unit)}${spec ? `   (spec ${specText(spec, unit)})` : ''}${outOfSpec(site[name], spec) ? ' — outside specification' : ''}`];
      }),
      ['flags', site.flags.length ? site.flags.map((f) => flagWords[f] ?? f).join('; ') : 'none'],
      ['ingest batch', String(site.batch_id)],
    ];
    fill($('#site-detail'), el('table', { class: 'kv', id: 'site-kv' }, el('tbody', {}, rows.map(([k, v]) => el('tr', {}, el('th', { scope: 'row' }, k), el('td', {}, v))))));
  }

  showWafer();
}

function outOfSpec(v, spec) {
  if (v == null || !spec) return false;
  return (spec.lower != null && v < spec.lower) || (spec.upper != null && v > spec.upper);
}

function specText(spec, unit) {
  const parts = [];
  if (spec.lower != null) parts.push(`LSL ${withUnit(spec.lower, unit)}`);
  if (spec.target != null) parts.push(`target ${withUnit(spec.target, unit)}`);
  if (spec.upper != null) parts.push(`USL ${withUnit(spec.upper, unit)}`);
  return parts.join(' · ');
}

// ------------------------------------------------------------------------------------------------------- wafer map
function waferMap(name, label, unit, sites, spec, onPick) {
  const size = 240;
  const dpr = window.devicePixelRatio || 1;
  const canvas = el('canvas', { width: size * dpr, height: size * dpr, class: 'wafer', dataset: { parameter: name }, tabindex: 0,
    role: 'img', 'aria-label': `wafer map of ${label}` });
  canvas.style.width = `${size}px`;
  canvas.style.height = `${size}px`;
  const values = sites.map((s) => s[name]).filter((v) => v != null);
  const min = Math.min(...values);
  const max = Math.max(...values);
  const scale = el('div', { class: 'scale' },
    el('span', { class: 'scale-bar' }),
    el('span', { class: 'scale-ends' }, el('span', {}, `min ${withUnit(min, unit)}`), el('span', {}, `max ${withUnit(max, unit)}`)));
  scale.firstChild.style.background = rampCss;
  const mean = values.reduce((a, b) => a + b, 0) / values.length;
  const node = el('figure', { class: 'wafer-map', dataset: { parameter: name } },
    el('figcaption', {}, `${label} [${unitLabel(unit)}]`), canvas, scale,
    el('div', { class: 'legend-note' }, `mean ${withUnit(mean, unit)} · ${values.length} of ${sites.length} sites${spec ? ` · spec ${specText(spec, unit)}` : ''}`));
  const r = size / 2 - 10;
  const c = size / 2;
  const px = (s) => ({ x: c + (s.site_x_mm / WAFER_RADIUS_MM) * r, y: c - (s.site_y_mm / WAFER_RADIUS_MM) * r });

  function draw(selected) {
    const ctx = canvas.getContext('2d');
    ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
    ctx.clearRect(0, 0, size, size);
    // Wafer: disc with a notch at 6 o'clock, faint centre lines and the 100 mm ring.
    ctx.beginPath();
    ctx.arc(c, c, r, Math.PI / 2 + 0.04, Math.PI / 2 - 0.04 + 2 * Math.PI);
    ctx.lineTo(c, c + r - 6);
    ctx.closePath();
    ctx.fillStyle = '#f4f1ea';
    ctx.fill();
    ctx.strokeStyle = '#5c6470';
    ctx.lineWidth = 1.5;
    ctx.stroke();
    ctx.strokeStyle = '#d9d2c3';
    ctx.lineWidth = 1;
    ctx.setLineDash([3, 3]);
    ctx.beginPath();
    ctx.moveTo(c - r, c); ctx.lineTo(c + r, c); ctx.moveTo(c, c - r); ctx.lineTo(c, c + r);
    ctx.moveTo(c + (100 / WAFER_RADIUS_MM) * r, c);
    ctx.arc(c, c, (100 / WAFER_RADIUS_MM) * r, 0, 2 * Math.PI);
    ctx.stroke();
    ctx.setLineDash([]);
    for (const s of sites) {
      const p = px(s);
      const v = s[name];
      ctx.beginPath();
      if (v == null) {
        ctx.arc(p.x, p.y, 5, 0, 2 * Math.PI);
        ctx.strokeStyle = '#8b919a';
        ctx.lineWidth = 1;
        ctx.stroke();
      } else {
        const out = outOfSpec(v, spec);
        if (out) {
          ctx.moveTo(p.x, p.y - 8); ctx.lineTo(p.x + 8, p.y); ctx.lineTo(p.x, p.y + 8); ctx.lineTo(p.x - 8, p.y); ctx.closePath();
        } else {
          ctx.arc(p.x, p.y, 6.5, 0, 2 * Math.PI);
        }
        ctx.fillStyle = colourAt(max > min ? (v - min) / (max - min) : 0.5);
        ctx.fill();
        ctx.strokeStyle = out ? '#b4441b' : '#1f2733';
        ctx.lineWidth = out ? 2 : 0.75;
        ctx.stroke();
      }
      if (s.site_id === selected) {
        ctx.beginPath();
        ctx.arc(p.x, p.y, 11, 0, 2 * Math.PI);
        ctx.strokeStyle = '#1d6fd1';
        ctx.lineWidth = 2.5;
        ctx.stroke();
      }
    }
    ctx.fillStyle = '#5c6470';
    ctx.font = '10px "DejaVu Sans", sans-serif';
    ctx.fillText('+x', size - 18, c - 4);
    ctx.fillText('+y', c + 4, 10);
    const sel = sites.find((s) => s.site_id === selected);
    canvas.title = sel ? `site ${sel.site_id}: ${withUnit(sel[name], unit)}` : '';
  }

  canvas.addEventListener('click', (e) => {
    const box = canvas.getBoundingClientRect();
    const x = e.clientX - box.left;
    const y = e.clientY - box.top;
    let best = null;
    let bestD = 14;
    for (const s of sites) {
      const p = px(s);
      const d = Math.hypot(p.x - x, p.y - y);
      if (d < bestD) { best = s; bestD = d; }
    }
    if (best) onPick(best.site_id);
  });
  // Keyboard: arrow keys step through the sites in table order.
  canvas.addEventListener('keydown', (e) => {
    if (!['ArrowRight', 'ArrowDown', 'ArrowLeft', 'ArrowUp'].includes(e.key)) return;
    e.preventDefault();
    const i = sites.findIndex((s) => s.site_id === (param('site') ?? ''));
    const step = e.key === 'ArrowRight' || e.key === 'ArrowDown' ? 1 : -1;
    const next = sites[(Math.max(0, i) + step + sites.length) % sites.length];
    onPick(next.site_id);
  });
  return { node, draw };
}
