// The owner's business settings: rates, tax, currency, units and working hours.
import { z } from 'zod';
import { DISTANCE_UNITS } from '../words';
import { clockTime } from './form-values';
import { isValidTimeZone } from './local-time';

export const settingsInput = z
  .object({
    name: z.string().trim().min(1, 'needs a name').max(120),
    addressLines: z.string().trim().max(300),
    phone: z.string().trim().max(40),
    email: z.union([z.literal(''), z.email('is not an e-mail address')]),
    // ISO 4217: three capital letters. Money is kept in this currency's minor units.
    currency: z.string().trim().toUpperCase().regex(/^[A-Z]{3}$/, 'use a three-letter ISO 4217 code such as GBP'),
    labourRateMinorPerHour: z.number().int().min(0).max(10_000_000),
    // Basis points: 2000 is 20 %. The database refuses more than 100 %.
    taxRateBasisPoints: z.number().int().min(0).max(10_000, 'at most 100 %'),
    distanceUnit: z.enum(DISTANCE_UNITS),
    timeZone: z.string().refine(isValidTimeZone, 'is not a time zone (use a name such as Europe/London)'),
    workdayStart: clockTime,
    workdayEnd: clockTime,
    reminderLeadDays: z.number().int().min(0).max(365),
  })
  .superRefine((value, ctx) => {
    if (value.workdayEnd <= value.workdayStart) {
      ctx.addIssue({ code: 'custom', path: ['workdayEnd'], message: 'must be after the start of the working day' });
    }
  });

export type SettingsInput = z.output<typeof settingsInput>;
export type SettingsFormValues = z.input<typeof settingsInput>;
