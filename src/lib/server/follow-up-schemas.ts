// Request shapes of the follow-up endpoints (zod), shared by the endpoints and the islands that call them.
import { z } from 'zod';
import { ADVISED_DECISIONS, INVOICE_LINE_KINDS, INVOICE_STATUSES, MESSAGE_KINDS, MESSAGE_STATUSES } from '../../db/schema';

export const idParam = z.object({ id: z.uuid('is not a valid id') });

export const draftLinesBody = z.object({
  lines: z
    .array(
      z.object({
        kind: z.enum(INVOICE_LINE_KINDS),
        description: z.string().trim().min(1, 'needs a description').max(200),
        partNumber: z.string().trim().max(60).nullable().default(null),
        quantity: z.number().positive('must be above zero').max(10_000),
        unit: z.string().trim().min(1).max(32),
        unitPriceMinor: z.number().int('must be whole minor units').min(0).max(100_000_000),
        discountMinor: z.number().int().min(0).max(100_000_000).default(0),
      }),
    )
    .max(100, 'at most 100 lines'),
});

export const creditBody = z.object({ reason: z.string().trim().min(3, 'say why the invoice is credited').max(500) });

export const sendRecordBody = z.object({ again: z.boolean().default(false) });

export const advisedPriceBody = z.object({
  description: z.string().trim().min(1, 'needs a description').max(300),
  priceMinor: z.number().int('must be whole minor units').min(0).max(100_000_000),
  labourCentiHours: z.number().int().min(0).max(10_000).default(0),
});

export const decisionBody = z.object({ decision: z.enum(['approved', 'declined']) });

export const bookingBody = z.object({
  technicianId: z.string().min(1).max(64),
  date: z.iso.date('must be a date (yyyy-mm-dd)'),
  start: z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'must be a time (hh:mm)'),
  durationMinutes: z.number().int().min(15).max(600).default(60),
});

export const invoiceListQuery = z.object({
  status: z.enum(INVOICE_STATUSES).optional(),
  page: z.coerce.number().int().min(0).max(10_000).default(0),
});

export const messageListQuery = z.object({
  kind: z.enum(MESSAGE_KINDS).optional(),
  status: z.enum(MESSAGE_STATUSES).optional(),
  page: z.coerce.number().int().min(0).max(10_000).default(0),
});

export const advisedListQuery = z.object({ decision: z.enum([...ADVISED_DECISIONS, 'unpriced']).optional() });

export const recordTokenParam = z.object({ token: z.string().min(10).max(200) });
export const recordAdvisedParams = recordTokenParam.extend({ id: z.uuid('is not a valid id') });
