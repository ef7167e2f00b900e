// Showing integer minor units as money comes from the trade calculations (one formatter for the
// whole app); reading an amount a person typed is ours.
import { minorDigits } from '../trade';

export { formatMoney, minorDigits } from '../trade';

/** "12.50" typed by a person to 1250 minor units; undefined when it is not an amount. */
export function parseMoney(text: string, currency: string): number | undefined {
  const digits = minorDigits(currency);
  const cleaned = text.replace(/[\s,£$€]/g, '');
  const pattern = digits === 0 ? /^\d+$/ : new RegExp(`^\\d+(\\.\\d{1,${digits}})?$`);
  if (!pattern.test(cleaned)) return undefined;
  const [whole, fraction = ''] = cleaned.split('.');
  return Number(whole) * 10 ** digits + Number(fraction.padEnd(digits, '0') || '0');
}
