// Money for files: integer minor units written as a plain decimal in the currency's own number of
// minor digits (ISO 4217: 2 for GBP and EUR, 0 for JPY), with no symbol, so a spreadsheet can sum it.
import { minorDigits } from './trade/money';

export function formatMinorUnits(minor: number, currency: string): string {
  const digits = minorDigits(currency);
  const sign = minor < 0 ? '-' : '';
  const abs = Math.abs(minor);
  if (digits === 0) return `${sign}${abs}`;
  const scale = 10 ** digits;
  return `${sign}${Math.floor(abs / scale)}.${String(abs % scale).padStart(digits, '0')}`;
}
