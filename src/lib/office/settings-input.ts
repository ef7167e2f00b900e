// The owner's business settings as the form sends them: money typed in major units, the tax
// rate in per cent, times as HH:mm. Kept as minor units, basis points and minutes.
import { z } from 'zod';
import { DISTANCE_UNITS } from '../words';
import { clockTime, optionalNumber } from './form-values';
import { isValidTimeZone } from './local-time';
import { parseMoney } from '../billing/money';

const isCurrency = (code: string) => {
  try {
    new Intl.NumberFormat('en', { style: 'currency', currency: code });
    return true;
  } catch {
    return false;
  }
};

export const settingsInput = z
  .object({
    name: z.string().trim().min(1, 'needs a name').max(120),
    addressLines: z.string().trim().max(300),
    phone: z.string().trim().max(40),
    email: z.union([z.literal(''), z.email('is not an e-mail address')]),
    // ISO 4217: three capital letters. Money is kept in this currency's minor units.
    currency: z
      .string()
      .trim()
      .toUpperCase()
      .regex(/^[A-Z]{3}$/, 'use a three-letter ISO 4217 code such as GBP')
      .refine(isCurrency, 'is not a currency code'),
    labourRate: z.string(),
    // Two decimals of a per cent is one basis point, the unit the database keeps.
    taxPercent: z.string().regex(/^\d{1,3}([.,]\d{1,2})?$/, 'use a percentage such as 20 or 12.5'),
    distanceUnit: z.enum(DISTANCE_UNITS),
    timeZone: z.string().refine(isValidTimeZone, 'is not a time zone (use a name such as Europe/London)'),
    workdayStart: clockTime,
    workdayEnd: clockTime,
    reminderLeadDays: optionalNumber({ min: 0, max: 365, integer: true }),
  })
  .transform((value, ctx) => {
    const labourRateMinorPerHour = parseMoney(value.labourRate, value.currency);
    if (labourRateMinorPerHour === undefined || labourRateMinorPerHour > 100_000_000) {
      ctx.addIssue({ code: 'custom', path: ['labourRate'], message: 'use an amount such as 62.50' });
    }
    const taxRateBasisPoints = Math.round(Number(value.taxPercent.replace(',', '.')) * 100);
    if (taxRateBasisPoints > 10_000) ctx.addIssue({ code: 'custom', path: ['taxPercent'], message: 'at most 100 %' });
    if (value.workdayEnd <= value.workdayStart) {
      ctx.addIssue({ code: 'custom', path: ['workdayEnd'], message: 'must be after the start of the working day' });
    }
    if (value.reminderLeadDays === null) ctx.addIssue({ code: 'custom', path: ['reminderLeadDays'], message: 'give a number of days' });
    const { labourRate: _rate, taxPercent: _tax, ...rest } = value;
    return { ...rest, labourRateMinorPerHour: labourRateMinorPerHour ?? 0, taxRateBasisPoints, reminderLeadDays: value.reminderLeadDays ?? 0 };
  });

export type SettingsInput = z.output<typeof settingsInput>;
export type SettingsFormValues = z.input<typeof settingsInput>;
