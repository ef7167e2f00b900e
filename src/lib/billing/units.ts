// UCUM codes as people read them on a record or an invoice.
const SYMBOLS: Record<string, string> = {
  'N.m': 'N·m',
  Cel: '°C',
  '[degF]': '°F',
  '[mi_i]': 'mi',
  '[psi]': 'psi',
  '{each}': '',
  h: 'h',
  L: 'L',
  mL: 'mL',
  mm: 'mm',
  km: 'km',
  kPa: 'kPa',
  bar: 'bar',
  V: 'V',
  mV: 'mV',
  '%': '%',
};

export function unitSymbol(ucum: string | null | undefined): string {
  if (!ucum) return '';
  return SYMBOLS[ucum] ?? ucum.replace(/[[\]]/g, '').replace(/_i$/, '');
}

/** "3.2 L", "4", "-34 °C": a quantity with its unit, trimmed of float noise. */
export function formatQuantity(value: number, ucum: string | null | undefined): string {
  const rounded = Math.round(value * 1000) / 1000;
  const text = rounded.toLocaleString('en-GB', { maximumFractionDigits: 3 }).replace('-', '−');
  const symbol = unitSymbol(ucum);
  return symbol ? `${text} ${symbol}` : text;
}
