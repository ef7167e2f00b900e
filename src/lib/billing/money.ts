// Showing integer minor units as money. ISO 4217 gives each currency its minor unit (GBP and EUR
// 2 digits, JPY 0); Intl knows the table, so we ask it rather than keep our own copy.

export function minorDigits(currency: string): number {
  return new Intl.NumberFormat('en-GB', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
}

export function formatMoney(minor: number, currency: string, locale = 'en-GB'): string {
  const digits = minorDigits(currency);
  return new Intl.NumberFormat(locale, { style: 'currency', currency, minimumFractionDigits: digits }).format(minor / 10 ** digits);
}

/** "12.50" typed by a person to 1250 minor units; undefined when it is not an amount. */
export function parseMoney(text: string, currency: string): number | undefined {
  const digits = minorDigits(currency);
  const cleaned = text.replace(/[\s,£$€]/g, '');
  const pattern = digits === 0 ? /^\d+$/ : new RegExp(`^\\d+(\\.\\d{1,${digits}})?$`);
  if (!pattern.test(cleaned)) return undefined;
  const [whole, fraction = ''] = cleaned.split('.');
  return Number(whole) * 10 ** digits + Number(fraction.padEnd(digits, '0') || '0');
}
