// Numbers always with their unit; times in the browser's zone with the zone shown.

const unitLabels = { deg: '°', 'nm^2': 'nm²' };

export function unitLabel(unit) {
  return unitLabels[unit] ?? unit ?? '';
}

/** 12.345 → "12.35 nm" with a sensible number of decimals for the size. */
export function withUnit(value, unit, digits) {
  if (value === null || value === undefined || Number.isNaN(value)) return '—';
  const d = digits ?? (Math.abs(value) >= 100 ? 1 : Math.abs(value) >= 10 ? 2 : 3);
  const u = unitLabel(unit);
  return u === '°' ? `${value.toFixed(d)}°` : u ? `${value.toFixed(d)} ${u}` : value.toFixed(d);
}

export function number(value, digits = 3) {
  return value === null || value === undefined || Number.isNaN(value) ? '—' : value.toFixed(digits);
}

const zone = Intl.DateTimeFormat().resolvedOptions().timeZone;

export function when(iso) {
  if (!iso) return '—';
  const d = typeof iso === 'number' ? new Date(iso) : new Date(iso);
  return d.toLocaleString('en-GB', { year: 'numeric', month: 'short', day: '2-digit', hour: '2-digit', minute: '2-digit' });
}

export const zoneName = zone;

/** The words for a context state; the shape comes from the CSS class of the same name. */
export const stateWords = {
  in_control: 'in control',
  out_of_control: 'out of control',
  baseline: 'baseline: no limits yet',
};

export const alertStateWords = {
  open: 'open, not yet acknowledged',
  acknowledged: 'acknowledged',
  dispositioned: 'dispositioned',
  closed: 'closed',
};
