// The shapes of the van endpoints' input, checked with zod at the boundary.
import { z } from 'zod';
import { PART_KINDS, PART_UNITS } from '../../db/schema';

export const technicianIdField = z.string().trim().min(1).max(64);
const day = z.iso.date('must be a date written yyyy-mm-dd');
// Litres or a count: positive, and bounded so a slip of the finger cannot load a tanker.
const quantity = z.number().positive().max(10_000);
const note = z.string().trim().max(500).default('');

export const loadListQuery = z.object({ technicianId: technicianIdField.optional(), date: day.optional() });

export const vanQuery = z.object({ technicianId: technicianIdField.optional() });

export const movementsQuery = z.object({
  technicianId: technicianIdField.optional(),
  partId: z.uuid().optional(),
  limit: z.coerce.number().int().min(1).max(1000).default(200),
});

export const stockMovementRequest = z.object({
  technicianId: technicianIdField,
  reason: z.enum(['restock', 'returned']),
  lines: z
    .array(z.object({ partId: z.uuid(), quantity }))
    .min(1, 'add at least one part')
    .max(200)
    .refine((lines) => new Set(lines.map((l) => l.partId)).size === lines.length, 'name each part once'),
  note,
});

export const stockCountRequest = z.object({
  technicianId: technicianIdField,
  partId: z.uuid(),
  counted: z.number().min(0).max(10_000),
  note,
});

export const minimumRequest = z.object({
  technicianId: technicianIdField,
  partId: z.uuid(),
  minimum: z.number().min(0).max(10_000).nullable(),
});

// An order list covers up to a month of rounds; longer spans are a planning report, not an order.
export const MAX_ORDER_DAYS = 31;
export const orderListQuery = z
  .object({ from: day.optional(), to: day.optional(), format: z.enum(['json', 'csv']).default('json') })
  .refine((q) => !q.from || !q.to || q.from <= q.to, { message: 'from must not be after to', path: ['to'] });

export const disposalRequest = z.object({
  technicianId: technicianIdField,
  disposedAt: z.iso.datetime({ offset: true, message: 'must be a date and time with its offset' }),
  siteName: z.string().trim().min(1, 'name the licensed site').max(200),
  siteLicence: z.string().trim().max(100).default(''),
  reference: z.string().trim().max(100).default(''),
  litres: z.number().positive().max(10_000),
});

const money = z.number().int('must be whole minor units (pence)').min(0).max(100_000_000);
export const partCreateRequest = z.object({
  partNumber: z.string().trim().min(1, 'give a part number').max(60),
  description: z.string().trim().min(1, 'describe the part').max(200),
  kind: z.enum(PART_KINDS),
  unit: z.enum(PART_UNITS),
  oilGrade: z.string().trim().max(20).nullable().default(null),
  costMinor: money,
  priceMinor: money,
  supplier: z.string().trim().max(120).default(''),
  active: z.boolean().default(true),
});
export const partUpdateRequest = partCreateRequest.partial().refine((p) => Object.keys(p).length > 0, 'change at least one field');

export const containerSizesRequest = z.object({
  sizesL: z.array(z.number().positive().max(1000)).max(6, 'at most six sizes'),
});
