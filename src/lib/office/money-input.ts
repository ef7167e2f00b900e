// Amounts of money as the owner types them ("62.50") and as we keep them (6250 minor units).
import { minorDigits } from '../trade';

/** Minor units from a decimal typed in major units; null when it is not a plain amount. */
export function parseMajorAmount(text: string, currency: string): number | null {
  const digits = minorDigits(currency);
  const trimmed = text.trim().replace(/[\s,](?=\d{3}\b)/g, '');
  const pattern = digits === 0 ? /^\d+$/ : new RegExp(`^\\d+(\\.\\d{1,${digits}})?$`);
  if (!pattern.test(trimmed)) return null;
  const [whole, fraction = ''] = trimmed.split('.') as [string, string?];
  return Number(whole) * 10 ** digits + Number(fraction.padEnd(digits, '0') || 0);
}

/** Minor units shown as a plain decimal for a form field ("62.50"). */
export function formatMajorAmount(minor: number, currency: string): string {
  const digits = minorDigits(currency);
  if (digits === 0) return String(minor);
  const whole = Math.floor(minor / 10 ** digits);
  const fraction = String(minor % 10 ** digits).padStart(digits, '0');
  return `${whole}.${fraction}`;
}
