// A checklist template as the editor sends it. Only a draft version takes content; publishing
// freezes it. The rules here are the ones a technician relies on at the kerb: a reading has a
// unit, a range runs low to high, a part names what it fits.
import { z } from 'zod';
import { ITEM_KINDS, PART_KINDS, PART_UNITS } from '../words';
import { optionalNumber, optionalText } from './form-values';

// UCUM codes a reading may carry (PRODUCT.md: quantities carry their unit as a UCUM code).
// `{grade}` is an annotation for text readings such as an oil grade.
export const READING_UNITS = ['mm', 'N.m', 'V', 'kPa', 'bar', 'Cel', 'L', '%', 'km', '[mi_i]', '{grade}'] as const;

export const templateItemInput = z
  .object({
    kind: z.enum(ITEM_KINDS),
    label: z.string().trim().min(1, 'needs a label').max(200),
    unit: optionalText(32),
    expectedMin: optionalNumber({ min: -1e6, max: 1e6 }),
    expectedMax: optionalNumber({ min: -1e6, max: 1e6 }),
    rule: optionalText(40).refine((r) => r === null || /^[a-z][a-z0-9_]*$/.test(r), 'use lower-case letters and _'),
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

export const templateSectionInput = z.object({
  title: z.string().trim().min(1, 'needs a title').max(120),
  items: z.array(templateItemInput).min(1, 'a section needs at least one item').max(80, 'at most 80 items a section'),
});

export const templateContentInput = z.object({
  sections: z.array(templateSectionInput).min(1, 'add at least one section').max(30, 'at most 30 sections'),
});

export const templateDetailsInput = z.object({
  name: z.string().trim().min(1, 'needs a name').max(80),
  description: z.string().trim().max(500),
  // Hundredths of an hour: 2.5 h is 250.
  labourCentiHours: z.number().int().min(0).max(2400, 'at most 24 hours'),
});

export const newTemplateInput = templateDetailsInput.extend(templateContentInput.shape);

export type TemplateItemInput = z.output<typeof templateItemInput>;
export type TemplateSectionInput = z.output<typeof templateSectionInput>;
export type TemplateContentInput = z.output<typeof templateContentInput>;
export type TemplateDetailsInput = z.output<typeof templateDetailsInput>;
export type NewTemplateInput = z.output<typeof newTemplateInput>;
