// @ts-check
// One lot: step and wafer selectors, wafer maps of the main parameters (sites at their x/y mm on the 300 mm wafer,
// coloured by value), the site table, and the selected site's cross-section drawn to scale against the product's
// nominal. Without ?lot= the page is a small lot finder.
import { el, fill, $, param } from '../core/dom.js';
import { getJson } from '../core/api.js';
import { frame } from '../core/shell.js';
import { withUnit, when, unitLabel, fixed, stateWords, alertStateWords } from '../core/format.js';
import { drawCrossSection, gateFacesLabel } from '../core/fin.js';
import { palette } from '../core/charts.js';

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
  ['delta_vt_sat_mv', 'Est. ΔVT sat', 'mV'],
];
// The site table fits the page: the mapped values and ΔVT lin; the selected site's panel adds the derived geometry.
const tableColumns = [
  ...mapped,
  ['delta_vt_lin_mv', 'Est. ΔVT lin', 'mV'],
];
const detailColumns = [
  ...tableColumns,
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
  // Without a chosen step the lot opens on its most complete one: the step with the most measured values.
  const measured = lot.steps.map((st) => st.wafers.reduce((n, w) => n + w.sites.reduce((k, x) => k + mapped.filter(([name]) => x[name] != null).length, 0), 0));
  const fullest = lot.steps[measured.indexOf(Math.max(...measured))];
  const wantedStep = param('step');
  stepSelect.value = lot.steps.some((s) => s.step === wantedStep) ? wantedStep : fullest.step;
  const scaleSelect = $('#scale');
  scaleSelect.value = param('scale') === 'spec' ? 'spec' : 'data';

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
    if (scaleSelect.value === 'spec') q.set('scale', 'spec');
    history.replaceState(null, '', `lot.html?${q}`);
  }

  stepSelect.addEventListener('change', () => { fillWafers(waferSelect.value); state.site = null; showWafer(); });
  waferSelect.addEventListener('change', () => { showWafer(); });
  scaleSelect.addEventListener('change', () => { showWafer(); });
  await lotLinks(lot);

  const chambers = [...new Set(lot.steps.flatMap((s) => s.wafers.flatMap((w) => w.sites.flatMap((x) => [x.etch_chamber, x.liner_chamber]))).filter(Boolean))].sort();
  fill($('#lot-meta'), `product ${lot.product}${product ? ` (${product.name}, ${gateFacesLabel(product.gate_faces)})` : ''} · ${lot.steps.length} step${lot.steps.length > 1 ? 's' : ''}${chambers.length ? ` · chambers ${chambers.join(', ')}` : ''}`);

  let maps = [];

  function showWafer() {
    const wafer = waferData();
    const sites = wafer.sites;
    if (!sites.some((s) => s.site_id === state.site)) state.site = param('site') && sites.some((s) => s.site_id === param('site')) ? param('site') : sites[0]?.site_id ?? null;
    const present = mapped.filter(([name]) => sites.some((s) => s[name] != null));
    maps = present.map(([name, label, unit]) => waferMap(name, label, unit, sites, specOf(name), scaleSelect.value, (siteId) => select(siteId)));
    fill($('#maps'), maps.map((m) => m.node), present.length === 0 ? el('p', {}, 'No mapped parameter was measured on this wafer.') : null);
    fill($('#map-legend'),
      `Wafer W${wafer.wafer_slot}, step ${stepSelect.value}: each dot is a site at its (x, y) position on the 300 mm wafer, notch at the bottom. `,
      scaleSelect.value === 'spec'
        ? 'Colour runs light (lower specification limit) to dark (upper limit); a parameter without both limits is coloured by its data. '
        : 'Colour runs light (wafer minimum) to dark (wafer maximum) of each parameter. ',
      'A diamond marks a value outside the product specification; a hollow grey circle means not measured at that step. With few sites each value is printed beside its site. ',
      'Click a site (or pick a table row) to select it; the ring marks the selection.');
    siteTable(sites);
    waferTable();
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
      el('th', {}, 'flags')));
    fill($('#sites tbody'), sites.map((s) => {
      const tr = el('tr', { dataset: { site: s.site_id }, tabindex: 0, class: s.flags.length ? 'flagged' : null },
        el('th', { scope: 'row' }, s.site_id),
        el('td', { class: 'num' }, fixed(s.site_x_mm, 1)), el('td', { class: 'num' }, fixed(s.site_y_mm, 1)),
        tableColumns.map(([name, , unit]) => {
          const spec = specOf(name);
          const out = outOfSpec(s[name], spec);
          // The unit is in the column head; the same decimals down a column, so values compare.
          return el('td', { class: out ? 'num out-of-spec' : 'num', title: out ? `outside specification ${specText(spec, unit)}` : null }, fixed(s[name], unit === 'mV' ? 1 : unit === 'nm^2' ? 1 : 3), out ? ' ◆' : '');
        }),
        el('td', {}, s.flags.map((f) => flagWords[f] ?? f).join('; ')));
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
      ...detailColumns.map(([name, label, unit]) => {
        const spec = specOf(name);
        return [label, `${withUnit(site[name], unit)}${spec ? `   (spec ${specText(spec, unit)})` : ''}${outOfSpec(site[name], spec) ? ' — outside specification' : ''}`];
      }),
      ['flags', site.flags.length ? site.flags.map((f) => flagWords[f] ?? f).join('; ') : 'none'],
      ['ingest batch', String(site.batch_id)],
    ];
    const whatIf = new URLSearchParams({ product: lot.product });
    for (const [q, v] of [['wt', site.top_width_nm], ['wb', site.bottom_width_nm], ['h', site.fin_height_nm], ['r', site.corner_radius_nm]]) if (v != null) whatIf.set(q, String(v));
    fill($('#site-detail'),
      site.top_width_nm != null && site.bottom_width_nm != null && site.fin_height_nm != null
        ? el('p', {}, el('a', { class: 'button-link', id: 'open-whatif', href: `whatif.html?${whatIf}` }, 'Open this site in What-if'),
          ' to see how its profile moves the threshold.')
        : el('p', { class: 'muted' }, 'What-if needs the top width, bottom width and height of a site; this step did not measure them all.'),
      el('table', { class: 'kv', id: 'site-kv' }, el('tbody', {}, rows.map(([k, v]) => el('tr', {}, el('th', { scope: 'row' }, k), el('td', {}, v))))));
  }

  /** Each wafer of the step: sites, mean taper and the predicted ΔVT sat (an estimate), with its largest site. */
  function waferTable() {
    const mean = (xs) => (xs.length ? xs.reduce((a, b) => a + b, 0) / xs.length : null);
    fill($('#wafers tbody'), stepData().wafers.map((w) => {
      const dvt = w.sites.filter((x) => x.delta_vt_sat_mv != null);
      const worst = dvt.reduce((a, b) => (a && Math.abs(a.delta_vt_sat_mv) >= Math.abs(b.delta_vt_sat_mv) ? a : b), null);
      const tr = el('tr', { dataset: { wafer: w.wafer_slot }, class: String(w.wafer_slot) === waferSelect.value ? 'selected' : null },
        el('th', { scope: 'row' }, el('a', { href: '#', onclick: (/** @type {Event} */ e) => { e.preventDefault(); waferSelect.value = String(w.wafer_slot); showWafer(); } }, `wafer ${w.wafer_slot}`)),
        el('td', { class: 'num' }, w.sites.length),
        el('td', { class: 'num' }, fixed(mean(w.sites.map((x) => x.taper_deg).filter((v) => v != null)), 2)),
        el('td', { class: 'num' }, fixed(mean(dvt.map((x) => x.delta_vt_sat_mv)), 1)),
        el('td', { class: 'num' }, worst ? `${fixed(worst.delta_vt_sat_mv, 1)} mV (${worst.site_id})` : 'not predicted'));
      return tr;
    }));
  }

  showWafer();
}

/** The lot's alerts (excursions that collected one of its points) and the charts its steps and chambers feed. */
async function lotLinks(lot) {
  const box = $('#lot-links');
  try {
    const [alerts, contexts] = await Promise.all([getJson(`/api/alerts?lot=${encodeURIComponent(lot.lot_id)}`), getJson('/api/contexts')]);
    const steps = new Set(lot.steps.map((s) => s.step));
    const chambers = new Set(lot.steps.flatMap((s) => s.wafers.flatMap((w) => w.sites.flatMap((x) => [x.etch_chamber, x.liner_chamber]))).filter(Boolean));
    const charts = contexts.filter((c) => c.product === lot.product && steps.has(c.step) && (!c.chamber || chambers.has(c.chamber)));
    fill(box,
      el('h3', {}, alerts.length ? `${alerts.length} alert${alerts.length === 1 ? '' : 's'} with points of this lot` : 'No alert collected a point of this lot'),
      alerts.length ? el('ul', { id: 'lot-alerts' }, alerts.map((a) => el('li', {},
        el('a', { href: `alerts.html?alert=${a.id}&state=all` }, a.context_title), ` · ${a.severity} · ${alertStateWords[a.state] ?? a.state} · first signal measured ${when(a.first_signal_measured_at)}`))) : '',
      el('h3', {}, `Charts this lot feeds (${charts.length})`),
      el('ul', { id: 'lot-charts', class: 'chart-links' }, charts.map((c) => el('li', {},
        el('a', { href: `chart.html?context=${encodeURIComponent(c.code)}` }, c.title), ' ',
        el('span', { class: `state ${c.state}` }, stateWords[c.state] ?? c.state)))));
  } catch (e) {
    fill(box, el('div', { class: 'problem' }, e.message));
  }
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
function waferMap(name, label, unit, sites, spec, scaleBy, onPick) {
  const size = 240;
  const dpr = window.devicePixelRatio || 1;
  const canvas = el('canvas', { width: size * dpr, height: size * dpr, class: 'wafer', dataset: { parameter: name }, tabindex: 0,
    role: 'img', 'aria-label': `wafer map of ${label}` });
  canvas.style.width = `${size}px`;
  canvas.style.height = `${size}px`;
  const values = sites.map((s) => s[name]).filter((v) => v != null);
  // The colour scale: the wafer's own range, or the specification's when the user asks and both limits exist.
  const bySpec = scaleBy === 'spec' && spec?.lower != null && spec?.upper != null;
  const min = bySpec ? spec.lower : Math.min(...values);
  const max = bySpec ? spec.upper : Math.max(...values);
  const printed = sites.length <= 13;
  const scale = el('div', { class: 'scale' },
    el('span', { class: 'scale-bar' }),
    el('span', { class: 'scale-ends' }, el('span', {}, `${bySpec ? 'LSL' : 'min'} ${withUnit(min, unit)}`), el('span', {}, `${bySpec ? 'USL' : 'max'} ${withUnit(max, unit)}`)));
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
    ctx.fillStyle = palette.paper;
    ctx.fill();
    ctx.strokeStyle = palette.muted;
    ctx.lineWidth = 1.5;
    ctx.stroke();
    ctx.strokeStyle = palette.rule;
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
        ctx.strokeStyle = palette.muted;
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
        ctx.strokeStyle = out ? palette.signal : palette.ink;
        ctx.lineWidth = out ? 2 : 0.75;
        ctx.stroke();
      }
      if (printed && v != null) {
        ctx.fillStyle = palette.ink;
        ctx.font = '10px "DejaVu Sans", sans-serif';
        ctx.textAlign = p.x > c + r * 0.55 ? 'right' : 'left';
        ctx.fillText(fixed(v, unit === 'mV' ? 1 : 2), p.x + (ctx.textAlign === 'right' ? -9 : 9), p.y + 3.5);
        ctx.textAlign = 'left';
      }
      if (s.site_id === selected) {
        ctx.beginPath();
        ctx.arc(p.x, p.y, 11, 0, 2 * Math.PI);
        ctx.strokeStyle = palette.focus;
        ctx.lineWidth = 2.5;
        ctx.stroke();
      }
    }
    ctx.fillStyle = palette.muted;
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
