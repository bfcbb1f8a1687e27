// @ts-check
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

/** A fixed number of decimals with a true minus sign (U+2212), for columns and tiles that compare values. */
export function fixed(value, digits) {
  if (value === null || value === undefined || Number.isNaN(value)) return '—';
  const text = value.toFixed(digits);
  return /^-0?\.?0*$/.test(text) ? text.slice(1) : text.replace(/^-/, '\u2212');
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

/** A calendar day (YYYY-MM-DD, a shift's date or a roster line's) as when() writes its date: "05 Dec 2026". */
export function day(iso) {
  if (!iso) return '—';
  return new Date(`${iso}T12:00:00Z`).toLocaleDateString('en-GB', { year: 'numeric', month: 'short', day: '2-digit', timeZone: 'UTC' });
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

/** What was done in a maintenance, in the fab's words (the API's kinds as keys). */
export const maintenanceWords = {
  wet_clean: 'wet clean',
  part_replacement: 'part replacement',
  seasoning: 'seasoning',
  preventive_maintenance: 'preventive maintenance',
  repair: 'repair after a fault',
  other: 'other work',
};

/**
 * A chart's last maintenance in words: "3 lots (12 points) and 14.5 h since the wet clean of ETA-1", or on a floor
 * tile (brief) "3 lots and 14.5 h since the wet clean".
 */
export function maintenanceSince(m, brief = false) {
  const what = `the ${maintenanceWords[m.last.kind] ?? m.last.kind}${brief ? '' : ` of ${m.chamber}`}`;
  if (m.points_since === 0) return `no point measured since ${what}`;
  const lots = `${m.lots_since} lot${m.lots_since === 1 ? '' : 's'}`;
  const points = brief ? '' : ` (${m.points_since} point${m.points_since === 1 ? '' : 's'})`;
  return `${lots}${points} and ${withUnit(m.hours_since, 'h', 1)} since ${what}`;
}
