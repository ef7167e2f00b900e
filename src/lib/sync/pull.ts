// What GET /api/sync/pull answers: the rows that changed since the device's cursor, for the
// visits the user may see, plus what those visits need offline. The device stores these rows
// as they come (lib/device) and advances its cursor only after storing a whole page.
import { z } from 'zod';
import { CHECK_STATES, SEVERITIES } from './operations';

const id = z.uuid();
const userId = z.string().min(1);
const instant = z.iso.datetime({ offset: true });
const day = z.iso.date();
const stamp = z.string();

export const pulledVisit = z.object({
  id,
  customerId: id,
  vehicleId: id,
  technicianId: userId,
  templateVersionId: id,
  roundDate: day,
  roundPosition: z.number().int(),
  slotStart: instant,
  slotEnd: instant,
  addressLines: z.string(),
  postcode: z.string(),
  accessNotes: z.string(),
  status: z.enum(['booked', 'in_progress', 'signed_off', 'reviewed', 'invoiced', 'paid', 'cancelled']),
});

export const pulledCustomer = z.object({
  id,
  name: z.string(),
  phone: z.string().nullable(),
  addressLines: z.string(),
  postcode: z.string(),
});

export const pulledPart = z.object({
  id,
  partNumber: z.string(),
  description: z.string(),
  kind: z.string(),
  unit: z.string(),
  oilGrade: z.string().nullable(),
});

export const pulledVehicle = z.object({
  id,
  customerId: id,
  registration: z.string(),
  vin: z.string().nullable(),
  make: z.string(),
  model: z.string(),
  engine: z.string(),
  fuel: z.string(),
  year: z.number().int().nullable(),
  odometerUnit: z.enum(['km', '[mi_i]']),
  oilGrade: z.string().nullable(),
  oilCapacityL: z.number().nullable(),
  oilFilterPartId: id.nullable(),
  airFilterPartId: id.nullable(),
  cabinFilterPartId: id.nullable(),
  fuelFilterPartId: id.nullable(),
  sparkPlugPartId: id.nullable(),
  sparkPlugCount: z.number().int().nullable(),
  plugThread: z.string().nullable(),
  plugSeat: z.enum(['flat', 'taper']).nullable(),
  plugGapMm: z.number().nullable(),
  plugTorqueNm: z.number().nullable(),
  sumpPlugTorqueNm: z.number().nullable(),
  wheelNutTorqueNm: z.number().nullable(),
  brakeFluidGrade: z.string().nullable(),
  tyrePressureFrontKpa: z.number().nullable(),
  tyrePressureRearKpa: z.number().nullable(),
  specialTools: z.array(z.string()),
  serviceIntervalMonths: z.number().int().nullable(),
  serviceIntervalDistance: z.number().int().nullable(),
  lastServiceDate: day.nullable(),
  lastServiceOdometer: z.number().int().nullable(),
});

export const pulledModelNote = z.object({ id, make: z.string(), model: z.string(), engine: z.string(), title: z.string(), body: z.string() });

export const pulledTemplateItem = z.object({
  id,
  sectionId: id,
  position: z.number().int(),
  kind: z.enum(['check', 'reading', 'part']),
  label: z.string(),
  unit: z.string().nullable(),
  expectedMin: z.number().nullable(),
  expectedMax: z.number().nullable(),
  rule: z.string().nullable(),
  partKind: z.string().nullable(),
  caution: z.string().nullable(),
  hint: z.string().nullable(),
});

/** A published template version is immutable, so it travels whole. */
export const pulledTemplateVersion = z.object({
  id,
  templateId: id,
  name: z.string(),
  version: z.number().int(),
  sections: z.array(z.object({ id, position: z.number().int(), title: z.string(), items: z.array(pulledTemplateItem) })),
});

export const pulledCheckResult = z.object({ visitId: id, itemId: id, state: z.enum(CHECK_STATES), stamp });
export const pulledReadingResult = z.object({
  visitId: id,
  itemId: id,
  value: z.number().nullable(),
  textValue: z.string().nullable(),
  unit: z.string().nullable(),
  stamp,
});
const severityEvent = z.object({ stamp, severity: z.enum(SEVERITIES), opId: z.string().nullable(), author: z.string().nullable().optional() });
/** What the device needs to merge its own pending severity changes the way the server will (severity-log.ts). */
export const pulledSeverityLog = z.object({
  reset: severityEvent.extend({ seenStamp: stamp.nullable() }).nullable(),
  raises: z.array(severityEvent),
});

export const pulledFinding = z.object({
  id,
  visitId: id,
  itemId: id.nullable(),
  title: z.string(),
  detail: z.string(),
  severity: z.enum(SEVERITIES),
  severityStamp: stamp,
  stamp,
  severityLog: pulledSeverityLog.optional(),
});
export const pulledNote = z.object({ id, visitId: id, body: z.string(), authorId: userId, stamp });
export const pulledPhoto = z.object({
  id,
  visitId: id,
  findingId: id.nullable(),
  itemId: id.nullable(),
  caption: z.string(),
  sha256: z.string(),
  contentType: z.string(),
  // Our own URLs that serve the bytes to a signed-in user allowed to see the visit.
  url: z.string(),
  thumbnailUrl: z.string().nullable(),
  addStamp: stamp,
  removed: z.boolean(),
});
export const pulledPartLine = z.object({
  id,
  visitId: id,
  itemId: id.nullable(),
  partId: id.nullable(),
  partNumber: z.string(),
  description: z.string(),
  quantity: z.number(),
  unit: z.string(),
  removed: z.boolean(),
  stamp,
});
export const pulledSignOff = z.object({
  id,
  visitId: id,
  odometer: z.number().int(),
  odometerUnit: z.enum(['km', '[mi_i]']),
  customerName: z.string(),
  signatureSvg: z.string(),
  declaration: z.string(),
  technicianId: userId,
  signedAt: instant,
  stamp,
  voided: z.boolean(),
});

export const pullResponseSchema = z.object({
  /** Pass back as ?cursor= on the next pull. A server sequence number, never a clock. */
  cursor: z.string().regex(/^\d+$/),
  /** More changes wait beyond this page: pull again at once with the new cursor. */
  hasMore: z.boolean(),
  /** Visits that left this user's sight (moved to another technician, cancelled): drop them. */
  removedVisitIds: z.array(id),
  visits: z.array(pulledVisit),
  customers: z.array(pulledCustomer),
  vehicles: z.array(pulledVehicle),
  parts: z.array(pulledPart),
  modelNotes: z.array(pulledModelNote),
  templateVersions: z.array(pulledTemplateVersion),
  checkResults: z.array(pulledCheckResult),
  readingResults: z.array(pulledReadingResult),
  findings: z.array(pulledFinding),
  notes: z.array(pulledNote),
  photos: z.array(pulledPhoto),
  partLines: z.array(pulledPartLine),
  signOffs: z.array(pulledSignOff),
});

export type PullResponse = z.infer<typeof pullResponseSchema>;
export type PulledVisit = z.infer<typeof pulledVisit>;
export type PulledVehicle = z.infer<typeof pulledVehicle>;
export type PulledTemplateVersion = z.infer<typeof pulledTemplateVersion>;
