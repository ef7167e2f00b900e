// Form fields whose rules belong to the trade: each calls lib/trade and turns its verdict into
// a zod issue the form shows beside the field.
import { z } from 'zod';
import { normaliseRegistration } from '../trade/registration';

export const registrationField = z.string().transform((text, ctx) => {
  try {
    return normaliseRegistration(text);
  } catch (error) {
    ctx.addIssue({ code: 'custom', message: (error as Error).message });
    return z.NEVER;
  }
});

// Until lib/trade's VIN check lands, only the ISO 3779 shape the database enforces.
export const vinField = z
  .union([z.string(), z.null()])
  .transform((text, ctx) => {
    const vin = (text ?? '').replace(/\s+/g, '').toUpperCase();
    if (vin === '') return null;
    if (!/^[A-HJ-NPR-Z0-9]{17}$/.test(vin)) {
      ctx.addIssue({ code: 'custom', message: 'a VIN has 17 letters and digits, without I, O or Q' });
      return z.NEVER;
    }
    return vin;
  });

export const oilGradeField = z
  .union([z.string(), z.null()])
  .transform((text) => {
    const grade = (text ?? '').trim().toUpperCase();
    return grade === '' ? null : grade;
  });
