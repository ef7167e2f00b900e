// Input checks shared by the trade calculations. Every function of lib/trade takes plain data from
// a form, a sync operation or a test, so a bad value must stop with a sentence a person can act on.

/** The number itself, or an Error naming the field when it is not a finite number. */
export function finite(name: string, value: unknown): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new Error(`${name} must be a number, not ${describe(value)}`);
  }
  return value;
}

export function nonNegative(name: string, value: unknown): number {
  const n = finite(name, value);
  if (n < 0) throw new Error(`${name} cannot be negative (got ${n})`);
  return n;
}

export function positive(name: string, value: unknown): number {
  const n = finite(name, value);
  if (n <= 0) throw new Error(`${name} must be more than zero (got ${n})`);
  return n;
}

export function describe(value: unknown): string {
  if (typeof value === 'number') return String(value);
  if (typeof value === 'string') return `"${value}"`;
  if (value === null) return 'nothing (null)';
  if (value === undefined) return 'nothing';
  return typeof value;
}

/**
 * Reads a number typed on a phone: "1.6", "1,6" (a decimal comma) and surrounding spaces are fine;
 * anything else (two separators, letters, an empty field) is refused.
 */
export function parseTypedNumber(text: string): number | null {
  const trimmed = text.trim().replace(/^\+/, '').replace('\u2212', '-');
  if (!/^-?(\d+([.,]\d*)?|[.,]\d+)$/.test(trimmed)) return null;
  return Number(trimmed.replace(',', '.'));
}
