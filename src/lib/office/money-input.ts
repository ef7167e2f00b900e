// An amount kept in minor units (6250) written back into a form field in major units ("62.50");
// reading what was typed is lib/billing/money's parseMoney.
import { minorDigits } from '../trade';

export function formatMajorAmount(minor: number, currency: string): string {
  const digits = minorDigits(currency);
  if (digits === 0) return String(minor);
  const whole = Math.floor(minor / 10 ** digits);
  const fraction = String(minor % 10 ** digits).padStart(digits, '0');
  return `${whole}.${fraction}`;
}
