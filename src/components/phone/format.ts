// How the phone shows times, dates and units. The device's own time zone is the technician's.

const time = new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit' });
const day = new Intl.DateTimeFormat('en-GB', { weekday: 'long', day: 'numeric', month: 'long' });

export function formatTime(iso: string): string {
  return time.format(new Date(iso));
}

/** A round date (YYYY-MM-DD, the business's calendar day) as "Monday 2 March". */
export function formatDay(isoDate: string): string {
  const [y, m, d] = isoDate.split('-').map(Number);
  return day.format(new Date(y!, m! - 1, d!));
}

const date = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric' });

/** A calendar date (YYYY-MM-DD) or an instant as "1 January 2026", in the phone's time zone. */
export function formatDate(value: string): string {
  if (/^\d{4}-\d{2}-\d{2}$/.test(value)) {
    const [y, m, d] = value.split('-').map(Number);
    return date.format(new Date(y!, m! - 1, d!));
  }
  return date.format(new Date(value));
}

/** Today's calendar date on this phone, as YYYY-MM-DD. */
export function todayIso(now = new Date()): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}

// UCUM codes as a technician reads them.
const UNIT_LABEL: Record<string, string> = {
  'N.m': 'N·m',
  Cel: '°C',
  kPa: 'kPa',
  mm: 'mm',
  V: 'V',
  L: 'L',
  km: 'km',
  '[mi_i]': 'miles',
  '{each}': '',
  '{grade}': '',
};

export function unitLabel(ucum: string | null | undefined): string {
  if (!ucum) return '';
  return UNIT_LABEL[ucum] ?? ucum;
}

export function formatNumber(value: number): string {
  return Number.isInteger(value) ? String(value) : String(Math.round(value * 1000) / 1000);
}

export function withUnit(value: number | string, ucum: string | null | undefined): string {
  const label = unitLabel(ucum);
  const v = typeof value === 'number' ? formatNumber(value) : value;
  return label ? `${v} ${label}` : v;
}
