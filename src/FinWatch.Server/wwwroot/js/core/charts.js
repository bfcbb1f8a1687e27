// @ts-check
// Chart.js (global `Chart`, the LibMan-restored UMD build) set up the FinWatch way: linear axes over numbers, no
// animation, colours read once from the stylesheet's variables (one meaning each), charts created once and updated
// in place, and plugins for lines and edge markers drawn by the chart itself (no text on the data).

/* global Chart */

/** The stylesheet's colour variables: each has one meaning, named in css/finwatch.css. */
function cssColour(name, fallback) {
  const value = getComputedStyle(document.documentElement).getPropertyValue(name).trim();
  return value || fallback;
}

export const palette = {
  ink: cssColour('--ink', '#1f2733'),
  paper: cssColour('--paper', '#f6f3ec'),
  card: cssColour('--card', '#fffdf8'),
  rule: cssColour('--rule', '#d9d2c3'),
  focus: cssColour('--focus', '#1d6fd1'),
  muted: cssColour('--muted', '#5c6470'),
  steady: cssColour('--steady', '#1f6e52'),
  signal: cssColour('--signal', '#b4441b'),
  electrical: cssColour('--plum', '#6e2a78'),
  spec: cssColour('--spec', '#0e7490'),
  sand: cssColour('--sand', '#765c22'),
  maintenance: cssColour('--maint', '#4a5566'),
  zone: 'rgba(31, 39, 51, 0.22)',
  bars: 'rgba(31, 39, 51, 0.28)',
};

/**
 * Writes dataset.pointLabels[i] (text or '') above point i of every dataset that has them. Used only where a word is
 * the point's state (an excluded point on the limits page), never for rule names.
 */
export const pointLabelPlugin = {
  id: 'finwatchPointLabels',
  afterDatasetsDraw(chart) {
    const { ctx } = chart;
    ctx.save();
    ctx.font = 'bold 11px "DejaVu Sans", sans-serif';
    ctx.textAlign = 'center';
    chart.data.datasets.forEach((dataset, d) => {
      if (!dataset.pointLabels || chart.getDatasetMeta(d).hidden) return;
      chart.getDatasetMeta(d).data.forEach((element, i) => {
        const text = dataset.pointLabels[i];
        if (!text) return;
        ctx.fillStyle = dataset.pointLabelColor ?? palette.signal;
        ctx.fillText(text, element.x, element.y - 10);
      });
    });
    ctx.restore();
  },
};

/**
 * Vertical lines across the plot at x values: options.plugins.finwatchVerticals = { lines: [{ x, label, color, dash }] }.
 * A label, when given, sits at the top of its line (the histogram's specification limits).
 */
export const verticalLinePlugin = {
  id: 'finwatchVerticals',
  afterDatasetsDraw(chart, _args, options) {
    const lines = options?.lines;
    if (!Array.isArray(lines)) return;
    const { ctx, chartArea, scales } = chart;
    ctx.save();
    ctx.font = '11px "DejaVu Sans", sans-serif';
    for (const line of lines) {
      const x = scales.x.getPixelForValue(line.x);
      if (x < chartArea.left - 0.5 || x > chartArea.right + 0.5) continue;
      ctx.setLineDash(line.dash ?? [6, 4]);
      ctx.lineWidth = line.width ?? 1.5;
      ctx.strokeStyle = line.color ?? palette.spec;
      ctx.fillStyle = line.color ?? palette.spec;
      ctx.beginPath();
      ctx.moveTo(x, chartArea.top);
      ctx.lineTo(x, chartArea.bottom);
      ctx.stroke();
      if (line.label) {
        const right = x + 4 + ctx.measureText(line.label).width < chartArea.right;
        ctx.textAlign = right ? 'left' : 'right';
        ctx.fillText(line.label, right ? x + 4 : x - 4, chartArea.top + 12);
      }
    }
    ctx.restore();
  },
};

/**
 * Markers at the top or bottom edge of the plot for horizontal lines that lie outside the y-axis range, so a far
 * specification limit is said without squeezing the data: options.plugins.finwatchEdges = { marks: [{ y, label, color }] }.
 * Each is a small arrow pointing off the plot with its label ("USL 3.20° above").
 */
export const edgeMarkerPlugin = {
  id: 'finwatchEdges',
  afterDraw(chart, _args, options) {
    const marks = options?.marks;
    if (!Array.isArray(marks)) return;
    const { ctx, chartArea, scales } = chart;
    const { min, max } = scales.y;
    ctx.save();
    ctx.font = 'bold 11px "DejaVu Sans", sans-serif';
    ctx.textAlign = 'right';
    let above = 0;
    let below = 0;
    for (const mark of marks) {
      if (mark.y >= min && mark.y <= max) continue;
      const up = mark.y > max;
      const x = chartArea.right - 8;
      const y = up ? chartArea.top + 2 + 14 * above++ : chartArea.bottom - 2 - 14 * below++;
      ctx.fillStyle = mark.color ?? palette.spec;
      ctx.beginPath();
      if (up) { ctx.moveTo(x, y); ctx.lineTo(x + 5, y + 8); ctx.lineTo(x - 5, y + 8); } else { ctx.moveTo(x, y); ctx.lineTo(x + 5, y - 8); ctx.lineTo(x - 5, y - 8); }
      ctx.closePath();
      ctx.fill();
      ctx.fillText(`${mark.label} ${up ? 'above' : 'below'}`, x - 9, up ? y + 9 : y - 1);
    }
    ctx.restore();
  },
};

/** A y-axis of fixed width, so charts stacked on one x-axis line up point for point. */
export const fixedAxisWidth = (px) => ({ afterFit: (/** @type {{ width: number }} */ scale) => { scale.width = px; } });

/** y-axis bounds that fit the given values with a margin (null when there are none). */
export function fitRange(values, margin = 0.06) {
  const v = values.filter((x) => x != null && Number.isFinite(x));
  if (v.length === 0) return null;
  let lo = Math.min(...v);
  let hi = Math.max(...v);
  if (hi === lo) { lo -= Math.abs(lo) * 0.05 || 1; hi += Math.abs(hi) * 0.05 || 1; }
  const pad = (hi - lo) * margin;
  return { min: lo - pad, max: hi + pad };
}

/** Creates a chart once; later calls update it in place (new data and options, no animation, no rebuild). */
export function drawChart(existing, canvas, config) {
  if (existing) {
    existing.data = config.data;
    existing.options = { animation: false, responsive: true, maintainAspectRatio: false, ...config.options };
    existing.update('none');
    return existing;
  }
  return makeChart(canvas, config);
}

export function makeChart(canvas, config) {
  Chart.defaults.font.family = '"DejaVu Sans", "Noto Sans", sans-serif';
  Chart.defaults.color = palette.ink;
  return new Chart(canvas, {
    ...config,
    plugins: [pointLabelPlugin, verticalLinePlugin, edgeMarkerPlugin, ...(config.plugins ?? [])],
    options: { animation: false, responsive: true, maintainAspectRatio: false, ...config.options },
  });
}
