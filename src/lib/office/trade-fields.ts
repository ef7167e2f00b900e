// Form fields whose rules belong to the trade: each calls lib/trade and turns its verdict into
// a zod issue the form shows beside the field.
import { z } from 'zod';
import { checkVin, normaliseRegistration, parseOilGrade } from '../trade';

const fromTrade = <T>(parse: (text: string) => T) =>
  z.string().transform((text, ctx) => {
    try {
      return parse(text);
    } catch (error) {
      ctx.addIssue({ code: 'custom', message: (error as Error).message });
      return z.NEVER;
    }
  });

export const registrationField = fromTrade(normaliseRegistration);

/** Empty is "not known"; otherwise ISO 3779 shape and, for North-American VINs, the check digit. */
export const vinField = z
  .union([z.string(), z.null()])
  .transform((text, ctx) => {
    if (text === null || text.trim() === '') return null;
    const check = checkVin(text);
    if (!check.valid) {
      ctx.addIssue({ code: 'custom', message: check.problems.join(' ') });
      return z.NEVER;
    }
    return check.vin;
  });

/** Empty is "not known"; otherwise an SAE J300 grade, stored in its normal form (5W-30). */
export const oilGradeField = z
  .union([z.string(), z.null()])
  .transform((text, ctx) => {
    if (text === null || text.trim() === '') return null;
    try {
      return parseOilGrade(text).grade;
    } catch (error) {
      ctx.addIssue({ code: 'custom', message: (error as Error).message });
      return z.NEVER;
    }
  });
