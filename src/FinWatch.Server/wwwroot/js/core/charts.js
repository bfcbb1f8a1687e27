// Chart.js (global `Chart`, the LibMan-restored UMD build) set up the FinWatch way: linear axes over numbers, no
// animation on live updates, our palette, and a plugin that writes labels beside chosen points.

export const palette = {
  ink: '#1f2733', muted: '#8b919a', steady: '#1f6e52', signal: '#b4441b', plum: '#6e2a78', sand: '#8a6d2f', accent: '#24507a',
  zone: 'rgba(36, 80, 122, 0.25)',
};

/** Writes dataset.pointLabels[i] (text or '') above point i of every dataset that has them. */
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

/** Vertical lines at x values (spec limits on a histogram): options.plugins.finwatchVerticals = [{ x, label, color }]. */
export const verticalLinePlugin = {
  id: 'finwatchVerticals',
  afterDatasetsDraw(chart, _args, lines) {
    if (!Array.isArray(lines)) return;
    const { ctx, chartArea, scales } = chart;
    ctx.save();
    ctx.setLineDash([6, 4]);
    ctx.font = '11px "DejaVu Sans", sans-serif';
    for (const line of lines) {
      const x = scales.x.getPixelForValue(line.x);
      if (x < chartArea.left || x > chartArea.right) continue;
      ctx.strokeStyle = line.color ?? palette.plum;
      ctx.fillStyle = line.color ?? palette.plum;
      ctx.beginPath();
      ctx.moveTo(x, chartArea.top);
      ctx.lineTo(x, chartArea.bottom);
      ctx.stroke();
      ctx.fillText(line.label, x + 3, chartArea.top + 12);
    }
    ctx.restore();
  },
};

export function makeChart(canvas, config) {
  Chart.defaults.font.family = '"DejaVu Sans", "Noto Sans", sans-serif';
  Chart.defaults.color = palette.ink;
  return new Chart(canvas, {
    ...config,
    plugins: [pointLabelPlugin, verticalLinePlugin, ...(config.plugins ?? [])],
    options: { animation: false, responsive: true, maintainAspectRatio: false, ...config.options },
  });
}
