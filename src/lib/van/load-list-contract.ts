// What GET /api/van/load-list answers: a technician's load list for one round. The server builds
// it (lib/server/load-list.ts); the phone checks an answer against this schema before keeping it
// in its database (lib/device/load-lists.ts), so a copy read with no signal is always whole.
import { z } from 'zod';

const quantity = z.number();

const packing = z.object({
  containers: z.array(z.object({ sizeL: z.number().positive(), count: z.number().int().nonnegative() })),
  totalL: quantity,
});

const stockPart = z.object({
  id: z.string(),
  partNumber: z.string(),
  description: z.string(),
  kind: z.string(),
  unit: z.string(),
  oilGrade: z.string().nullable(),
});

const loadLine = z.object({
  part: stockPart,
  needed: quantity,
  neededInContainers: packing.nullable(),
  onHand: quantity,
  shortfall: quantity,
  pick: packing.nullable(),
  pickQuantity: quantity,
  visits: z.number().int(),
});

const loadVisit = z.object({
  id: z.string(),
  position: z.number().int(),
  slotStart: z.iso.datetime({ offset: true }),
  registration: z.string(),
  vehicle: z.string(),
  customerName: z.string(),
  postcode: z.string(),
  checklist: z.string(),
  parts: z.array(z.object({ partNumber: z.string(), description: z.string(), quantity, unit: z.string() })),
});

export const roundLoadListSchema = z.object({
  technician: z.object({ id: z.string(), name: z.string() }),
  roundDate: z.iso.date(),
  lines: z.array(loadLine),
  grades: z.array(z.object({ oilGrade: z.string(), needed: quantity, onHand: quantity, shortfall: quantity })),
  visits: z.array(loadVisit),
  gaps: z.array(z.string()),
  usedOil: z.object({ heldL: quantity, expectedL: quantity }),
});

export type RoundLoadList = z.infer<typeof roundLoadListSchema>;
