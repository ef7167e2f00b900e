// Form fields arrive as text; these turn them into the values the database keeps. Empty means
// "not known" (null), never zero: a zero torque would be a wrong value, not a missing one.
import { z } from 'zod';

/** A number typed in a form, or null when left empty. */
export function optionalNumber(label: { min: number; max: number; integer?: boolean }) {
  return z
    .union([z.number(), z.string(), z.null()])
    .transform((value, ctx) => {
      if (value === null) return null;
      const text = typeof value === 'number' ? String(value) : value.trim().replace(',', '.');
      if (text === '') return null;
      const number = Number(text);
      if (!Number.isFinite(number)) {
        ctx.addIssue({ code: 'custom', message: 'is not a number' });
        return z.NEVER;
      }
      if (label.integer && !Number.isInteger(number)) {
        ctx.addIssue({ code: 'custom', message: 'must be a whole number' });
        return z.NEVER;
      }
      if (number < label.min || number > label.max) {
        ctx.addIssue({ code: 'custom', message: `must be between ${label.min} and ${label.max}` });
        return z.NEVER;
      }
      return number;
    });
}

/** Text that may be left empty (stored as null). */
export function optionalText(max: number) {
  return z
    .string()
    .trim()
    .max(max, `must be at most ${max} characters`)
    .nullable()
    .transform((value) => (value === null || value === '' ? null : value));
}

/** "HH:mm" on a 24-hour clock, as minutes after midnight. */
export const clockTime = z
  .string()
  .regex(/^([01]\d|2[0-3]):[0-5]\d$|^24:00$/, 'use a 24-hour time such as 08:30')
  .transform((text) => {
    const [h, m] = text.split(':').map(Number) as [number, number];
    return h * 60 + m;
  });

export function minutesToClock(minutes: number): string {
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  return `${String(h).padStart(2, '0')}:${String(m).padStart(2, '0')}`;
}
