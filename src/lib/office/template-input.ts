// A checklist template as the editor sends it. Only a draft version takes content; publishing
// freezes it. The rules here are the ones a technician relies on at the kerb: a reading has a
// unit, a range runs low to high, a part names what it fits.
import { z } from 'zod';
import type { ReadingRule } from '../trade';
import { ITEM_KINDS, PART_KINDS, PART_UNITS } from '../words';
import { optionalNumber, optionalText } from './form-values';

// UCUM codes a reading may carry (PRODUCT.md: quantities carry their unit as a UCUM code).
// `{grade}` is an annotation for text readings such as an oil grade.
export const READING_UNITS = ['mm', 'N.m', 'V', 'kPa', 'bar', 'Cel', 'L', '%', 'km', '[mi_i]', '{grade}'] as const;

// The trade rules a reading can name (lib/trade judgeReading); the label is what the editor shows.
export const READING_RULES = [
  { rule: 'used_oil', label: 'Used oil drained, against the oil capacity' },
  { rule: 'torque_wrench', label: 'Tightening torque, on the wrench’s scale' },
  { rule: 'oil_grade', label: 'Oil grade (SAE J300), against the spec' },
  { rule: 'plug_gap', label: 'Spark plug gap, against the spec' },
  { rule: 'coolant_protection', label: 'Coolant freeze protection' },
  { rule: 'brake_fluid_boiling', label: 'Brake fluid boiling point (FMVSS No. 116)' },
  { rule: 'battery_rest', label: 'Battery resting voltage (state of charge)' },
  { rule: 'charging_voltage', label: 'Charging voltage' },
  { rule: 'earth_drop', label: 'Earth-side voltage drop' },
  { rule: 'tread_depth', label: 'Tyre tread depth, against the legal minimum' },
  { rule: 'tyre_pressure', label: 'Tyre pressure, against the spec' },
  { rule: 'brake_pad', label: 'Brake pad thickness' },
] as const satisfies readonly { rule: ReadingRule; label: string }[];
const RULE_NAMES: readonly string[] = READING_RULES.map((r) => r.rule);

export const templateItemInput = z
  .object({
    kind: z.enum(ITEM_KINDS),
    label: z.string().trim().min(1, 'needs a label').max(200),
    unit: optionalText(32),
    expectedMin: optionalNumber({ min: -1e6, max: 1e6 }),
    expectedMax: optionalNumber({ min: -1e6, max: 1e6 }),
    rule: optionalText(40).refine((r) => r === null || RULE_NAMES.includes(r), 'is not a rule the trade checks know'),
    partKind: z.union([z.enum(PART_KINDS), z.literal(''), z.null()]).transform((v) => (v === '' ? null : v)),
    caution: optionalText(500),
    hint: optionalText(500),
  })
  .superRefine((item, ctx) => {
    const issue = (path: string, message: string) => ctx.addIssue({ code: 'custom', path: [path], message });
    if (item.kind === 'reading') {
      if (!item.unit) issue('unit', 'a reading needs a unit');
      else if (!(READING_UNITS as readonly string[]).includes(item.unit)) issue('unit', `use one of ${READING_UNITS.join(', ')}`);
    }
    if (item.kind === 'part') {
      if (item.unit && !(PART_UNITS as readonly string[]).includes(item.unit)) issue('unit', 'a part is counted in L or {each}');
    }
    if (item.kind !== 'reading') {
      if (item.expectedMin !== null || item.expectedMax !== null) issue('expectedMin', 'only a reading has an expected range');
      if (item.rule !== null) issue('rule', 'only a reading has a trade rule');
    }
    if (item.kind !== 'part' && item.partKind !== null) issue('partKind', 'only a part item names a part kind');
    if (item.expectedMin !== null && item.expectedMax !== null && item.expectedMin > item.expectedMax) {
      issue('expectedMax', 'must not be below the lowest expected value');
    }
  });

// A draft may be half-built (empty sections while the office works on it); publishing asks for
// a checklist a technician can work through (lib/server/templates.ts, publishVersion).
export const templateSectionInput = z.object({
  title: z.string().trim().min(1, 'needs a title').max(120),
  items: z.array(templateItemInput).max(80, 'at most 80 items a section'),
});

export const templateContentInput = z.object({
  sections: z.array(templateSectionInput).max(30, 'at most 30 sections'),
});

export const templateDetailsInput = z.object({
  name: z.string().trim().min(1, 'needs a name').max(80),
  description: z.string().trim().max(500),
  // Typed in hours (2.5), kept in hundredths of an hour (250) so no rate needs floating point.
  labourHours: optionalNumber({ min: 0, max: 24 }).transform((hours, ctx) => {
    if (hours === null) {
      ctx.addIssue({ code: 'custom', message: 'say how long the work takes, in hours' });
      return z.NEVER;
    }
    return Math.round(hours * 100);
  }),
});

export const newTemplateInput = templateDetailsInput.extend({ sections: templateContentInput.shape.sections.default([]) });

export type TemplateItemInput = z.output<typeof templateItemInput>;
export type TemplateSectionInput = z.output<typeof templateSectionInput>;
export type TemplateContentInput = z.output<typeof templateContentInput>;
export type TemplateDetailsInput = z.output<typeof templateDetailsInput>;
export type TemplateDetails = { name: string; description: string; labourCentiHours: number };
export type NewTemplateInput = z.output<typeof newTemplateInput>;
