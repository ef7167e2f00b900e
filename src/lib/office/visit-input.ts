// Booking, moving and ordering visits on technicians' rounds, and the filters of the visits table.
import { z } from 'zod';
import { VISIT_STATUSES } from '../words';
import { clockTime } from './form-values';
import { tableQuery } from './table-query';

const day = z.iso.date('use a date such as 2026-03-14');
const technicianId = z.string().min(1, 'choose a technician').max(64);

// A slot is at least a quarter hour: shorter bookings are typing mistakes, not visits.
export const MIN_SLOT_MINUTES = 15;

const slotRule = <T extends { start: number; end: number }>(value: T, ctx: z.RefinementCtx) => {
  if (value.end - value.start < MIN_SLOT_MINUTES) {
    ctx.addIssue({ code: 'custom', path: ['end'], message: `must be at least ${MIN_SLOT_MINUTES} minutes after the start` });
  }
};

// Who, when and where: what booking and moving a visit share.
const slotFields = {
  technicianId,
  roundDate: day,
  start: clockTime,
  end: clockTime,
  addressLines: z.string().trim().min(1, 'where is the vehicle?').max(300),
  postcode: z.string().trim().max(12).transform((v) => v.toUpperCase()),
  accessNotes: z.string().trim().max(1000),
};

export const bookVisitInput = z
  .object({
    customerId: z.uuid('choose the customer'),
    vehicleId: z.uuid('choose the vehicle'),
    templateId: z.uuid('choose a checklist'),
    ...slotFields,
  })
  .superRefine(slotRule);

/** A change to a booked visit: another technician, day or time, or where it stands. */
export const moveVisitInput = z.object(slotFields).superRefine(slotRule);

export const reorderRoundInput = z.object({
  technicianId,
  roundDate: day,
  visitIds: z.array(z.uuid()).min(1).max(100),
});

export type BookVisitInput = z.output<typeof bookVisitInput>;
export type BookVisitFormValues = z.input<typeof bookVisitInput>;
export type MoveVisitInput = z.output<typeof moveVisitInput>;
export type ReorderRoundInput = z.output<typeof reorderRoundInput>;

export const VISIT_SORTS = ['slotStart', 'technician', 'customer', 'registration', 'status'] as const;

const flag = z
  .enum(['1', '0', 'true', 'false', ''])
  .optional()
  .transform((v) => v === '1' || v === 'true');

export const visitsQuery = tableQuery(VISIT_SORTS, 'slotStart').extend({
  from: day.optional(),
  to: day.optional(),
  technicianId: z.string().max(64).optional(),
  status: z.enum(VISIT_STATUSES).optional(),
  // Findings at `soon` or `now`: the visits someone must call the customer about.
  attention: flag,
  conflicts: flag,
  customerId: z.uuid().optional(),
  vehicleId: z.uuid().optional(),
});

export type VisitsQuery = z.output<typeof visitsQuery>;

export const roundsQuery = z.object({ week: day.optional() });
