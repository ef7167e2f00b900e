// POST /api/sync/push: a batch of operations in, one result per operation out, in order.
import { z } from 'zod';
import { OUTCOMES } from './operations';

/** Operations per push. A day's work on one visit is a few hundred; photos travel separately. */
export const MAX_BATCH_OPERATIONS = 500;
/** Bytes per push body; larger gets 413 before it is parsed. */
export const MAX_PUSH_BYTES = 2_000_000;

// Operations are validated one by one on the server, so one bad operation is `rejected` with its
// reason and does not sink the batch; the envelope only checks it is a list of objects.
export const pushRequestSchema = z.object({
  deviceId: z.string().regex(/^[A-Za-z0-9_-]{1,64}$/),
  operations: z.array(z.record(z.string(), z.unknown())).max(MAX_BATCH_OPERATIONS),
});

export const pushResponseSchema = z.object({
  results: z.array(z.object({ opId: z.string(), outcome: z.enum(OUTCOMES), reason: z.string().optional() })),
  /** The server's clock after this push, for the device's `receive`. */
  serverStamp: z.string(),
});

export type PushRequest = z.infer<typeof pushRequestSchema>;
export type PushResponse = z.infer<typeof pushResponseSchema>;
