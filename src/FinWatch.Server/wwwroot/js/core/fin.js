// @ts-check
// Fin cross-section geometry (docs/model.md §A) and its drawing as SVG built with createElementNS, to scale in nm.
// The profile: straight sidewalls from the bottom width at the foot (isolation-oxide top) to the top width at the
// height H, both top corners rounded by arcs of radius r, a conformal liner of thickness t around it.
import { withUnit } from './format.js';
import { svg } from './dom.js';

/** Sidewall angle from vertical per side, degrees, positive when wider at the foot: atan((Wb − Wt)/(2H)). */
export function taperDeg(wt, wb, h) {
  if (!(h > 0) || wt == null || wb == null) return null;
  return (Math.atan((wb - wt) / (2 * h)) * 180) / Math.PI;
}

export function midWidth(wt, wb) {
  return wt == null || wb == null ? null : (wt + wb) / 2;
}

/** A product's gate_faces as the floor says it: the API's "tri-gate", or "double-gate" with its hard mask named. */
export function gateFacesLabel(gateFaces) {
  return gateFaces === 'double-gate' ? 'double-gate (hard mask on top)' : gateFaces;
}

/** The largest corner radius the top allows: (Wt/2)·tan(45° + θ/2). */
export function maxCornerRadius(wt, wb, h) {
  const t = taperDeg(wt, wb, h);
  if (t == null) return null;
  return (wt / 2) * Math.tan(Math.PI / 4 + (t * Math.PI) / 360);
}

/**
 * The outline points of a rounded trapezoid, in nm with y up, offset outward by `off` (0 for the fin itself, t for
 * the liner's outer face). Returns { left, right, topLeft, topRight, radius, clampedRadius } for path building.
 */
function outline(p, off) {
  const { wt, wb, h } = p;
  const theta = Math.atan((wb - wt) / (2 * h));
  const rMax = (wt / 2) * Math.tan(Math.PI / 4 + theta / 2);
  const r = Math.max(0, Math.min(p.r ?? 0, rMax));
  const d = r / Math.tan(Math.PI / 4 + theta / 2);              // corner vertex to tangent points
  const c = { x: wt / 2 - d, y: h - r };                          // centre of the right arc
  const n = { x: Math.cos(theta), y: Math.sin(theta) };           // outward normal of the right sidewall
  const R = r + off;
  const side = { x: c.x + R * n.x, y: c.y + R * n.y };            // right sidewall tangent point (offset)
  const top = { x: c.x, y: c.y + R };                              // right top tangent point (offset)
  const footX = (y) => side.x + (side.y - y) * Math.tan(theta);  // right (offset) sidewall x at height y
  return { theta, r, R, side, top, footX, clamped: (p.r ?? 0) > rMax + 1e-9, rMax };
}

/** SVG path data of the (offset) outline from the left foot at height y0 over the top to the right foot. */
function pathData(p, off, y0, X, Y) {
  const o = outline(p, off);
  const pts = [
    `M ${X(-o.footX(y0))} ${Y(y0)}`,
    `L ${X(-o.side.x)} ${Y(o.side.y)}`,
    o.R > 0 ? `A ${o.R * X.k} ${o.R * X.k} 0 0 1 ${X(-o.top.x)} ${Y(o.top.y)}` : '',
    `L ${X(o.top.x)} ${Y(o.top.y)}`,
    o.R > 0 ? `A ${o.R * X.k} ${o.R * X.k} 0 0 1 ${X(o.side.x)} ${Y(o.side.y)}` : '',
    `L ${X(o.footX(y0))} ${Y(y0)}`,
  ];
  return { d: pts.filter(Boolean).join(' '), o };
}

/**
 * Draws the measured profile (filled, with its liner) over the nominal one (dashed) into the <svg> `target`, with
 * dimension labels in nm and a scale bar. measured/nominal: { wt, wb, h, r, t } in nm (missing values: null).
 */
export function drawCrossSection(target, measured, nominal, { width = 520, height = 420, measuredLabel = 'measured fin' } = {}) {
  target.replaceChildren();
  target.setAttribute('viewBox', `0 0 ${width} ${height}`);
  target.setAttribute('width', width);
  target.setAttribute('height', height);
  const complete = (p) => p && p.wt > 0 && p.wb > 0 && p.h > 0;
  if (!complete(measured)) {
    target.setAttribute('viewBox', `0 0 ${width} 60`);
    target.setAttribute('height', 60);
    target.append(svg('text', { x: 20, y: 40, class: 'xs-note' }, 'This site lacks top width, bottom width or height: no cross-section.'));
    return;
  }
  const m = { ...measured, r: measured.r ?? 0, t: measured.t ?? 0 };
  const n = complete(nominal) ? { ...nominal, r: nominal.r ?? 0, t: nominal.t ?? 0 } : null;
  const spanX = Math.max(m.wb + 2 * m.t, n ? n.wb + 2 * n.t : 0, m.wt, n ? n.wt : 0);
  const spanY = Math.max(m.h + m.t, n ? n.h + n.t : 0);
  const pad = { left: 90, right: 120, top: 60, bottom: 70 };
  const k = Math.min((width - pad.left - pad.right) / (spanX * 1.3), (height - pad.top - pad.bottom) / spanY);
  const cx = pad.left + (width - pad.left - pad.right) / 2;
  const baseY = height - pad.bottom;
  const X = (x) => +(cx + x * k).toFixed(2);
  X.k = k;
  const Y = (y) => +(baseY - y * k).toFixed(2);
  const halfFrame = (width - pad.left - pad.right) / 2 / k + 20 / k;

  // Oxide below the foot, liner (conformal, also on the oxide), fin.
  target.append(svg('rect', { x: X(-halfFrame), y: Y(0), width: 2 * halfFrame * k, height: pad.bottom - 30, class: 'xs-oxide' }));
  if (m.t > 0) {
    const outer = pathData(m, m.t, m.t, X, Y);
    const d = `M ${X(-halfFrame)} ${Y(0)} L ${X(-halfFrame)} ${Y(m.t)} L ${X(-outer.o.footX(m.t))} ${Y(m.t)} ${outer.d.replace(/^M [^L]*/, '')} L ${X(halfFrame)} ${Y(m.t)} L ${X(halfFrame)} ${Y(0)} Z`;
    target.append(svg('path', { d, class: 'xs-liner' }));
  }
  const fin = pathData(m, 0, 0, X, Y);
  target.append(svg('path', { d: `${fin.d} Z`, class: 'xs-fin' }));
  if (n) {
    target.append(svg('path', { d: pathData(n, 0, 0, X, Y).d, class: 'xs-nominal' }));
    if (n.t > 0) target.append(svg('path', { d: pathData(n, n.t, n.t, X, Y).d, class: 'xs-nominal thin' }));
  }

  // Dimensions: top width above, bottom width below, height at the left, radius and liner at the right.
  const dim = (x1, y1, x2, y2, text, tx, ty, anchor = 'middle') => {
    target.append(svg('line', { x1, y1, x2, y2, class: 'xs-dim', 'marker-start': 'url(#xs-arrow)', 'marker-end': 'url(#xs-arrow)' }));
    target.append(svg('text', { x: tx, y: ty, class: 'xs-label', 'text-anchor': anchor }, text));
  };
  target.append(svg('defs', {}, svg('marker', { id: 'xs-arrow', viewBox: '0 0 10 10', refX: 5, refY: 5, markerWidth: 6, markerHeight: 6, orient: 'auto-start-reverse' },
    svg('path', { d: 'M 0 0 L 10 5 L 0 10 z', class: 'xs-arrowhead' }))));
  const topY = Y(m.h + m.t) - 22;
  dim(X(-m.wt / 2), topY, X(m.wt / 2), topY, `top width ${withUnit(m.wt, 'nm', 2)}`, X(0), topY - 8);
  target.append(svg('line', { x1: X(-m.wt / 2), y1: topY, x2: X(-m.wt / 2), y2: Y(m.h), class: 'xs-ext' }));
  target.append(svg('line', { x1: X(m.wt / 2), y1: topY, x2: X(m.wt / 2), y2: Y(m.h), class: 'xs-ext' }));
  const botY = Y(0) + 22;
  dim(X(-m.wb / 2), botY, X(m.wb / 2), botY, `bottom width ${withUnit(m.wb, 'nm', 2)}`, X(0), botY + 18);
  const leftX = X(-Math.max(m.wb / 2 + m.t, n ? n.wb / 2 + n.t : 0)) - 24;
  dim(leftX, Y(0), leftX, Y(m.h), `height`, leftX - 6, Y(m.h / 2) - 4, 'end');
  target.append(svg('text', { x: leftX - 6, y: Y(m.h / 2) + 12, class: 'xs-label', 'text-anchor': 'end' }, withUnit(m.h, 'nm', 1)));
  const o = fin.o;
  const arcMid = { x: o.top.x + m.r * Math.sin(Math.PI / 4), y: o.top.y - m.r + m.r * Math.cos(Math.PI / 4) };
  const rx = X(Math.max(m.wb / 2 + m.t, n ? n.wb / 2 + n.t : 0)) + 16;
  target.append(svg('line', { x1: X(arcMid.x), y1: Y(arcMid.y), x2: rx, y2: Y(m.h) - 10, class: 'xs-leader' }));
  target.append(svg('text', { x: rx + 4, y: Y(m.h) - 6, class: 'xs-label' }, `corner r ${withUnit(measured.r, 'nm', 2)}`));
  if (o.clamped) target.append(svg('text', { x: rx + 4, y: Y(m.h) + 10, class: 'xs-label warn' }, `> max ${withUnit(o.rMax, 'nm', 2)}, drawn at max`));
  if (m.t > 0) {
    const ly = Y(m.h * 0.35);
    const lx = X(o.footX(m.h * 0.35) - m.t / 2 / Math.cos(o.theta));
    target.append(svg('line', { x1: lx, y1: ly, x2: rx, y2: ly + 30, class: 'xs-leader' }));
    target.append(svg('text', { x: rx + 4, y: ly + 34, class: 'xs-label' }, `liner ${withUnit(measured.t, 'nm', 2)}`));
  }
  const taper = taperDeg(m.wt, m.wb, m.h);
  target.append(svg('text', { x: rx + 4, y: Y(m.h * 0.1), class: 'xs-label muted' }, `taper ${withUnit(taper, '°', 2)}`));

  // Scale bar: a round number of nm about a fifth of the drawing.
  const target_nm = (width - pad.left - pad.right) / 5 / k;
  const bar = [1, 2, 5, 10, 20, 50, 100].reduce((best, v) => (Math.abs(v - target_nm) < Math.abs(best - target_nm) ? v : best), 1);
  target.append(svg('line', { x1: 16, y1: height - 16, x2: 16 + bar * k, y2: height - 16, class: 'xs-scale' }));
  target.append(svg('text', { x: 16, y: height - 22, class: 'xs-label' }, `${bar} nm`));
  // Key, top left.
  const ky = 12;
  const key = [];
  if (n) key.push(['nominal', 'product nominal (dashed)']);
  key.push(['fin', measuredLabel]);
  if (m.t > 0) key.push(['liner', 'liner']);
  key.forEach(([kind, text], i) => {
    const y = ky + i * 15;
    if (kind === 'nominal') target.append(svg('line', { x1: 12, y1: y + 5, x2: 42, y2: y + 5, class: 'xs-nominal' }));
    else target.append(svg('rect', { x: 12, y, width: 30, height: 10, class: kind === 'fin' ? 'xs-fin' : 'xs-liner' }));
    target.append(svg('text', { x: 48, y: y + 10, class: 'xs-label' }, text));
  });
}
