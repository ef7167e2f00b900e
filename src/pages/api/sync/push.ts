import type { APIRoute } from 'astro';
import { z } from 'zod';
import { endpoint, HttpError, json, readJson, requireUser } from '../../../lib/server/http';
import { MAX_BATCH_OPERATIONS, MAX_PUSH_BYTES, pushRequestSchema } from '../../../lib/sync/push';
import { pushOperations } from '../../../lib/server/sync/push';

export const prerender = false;

/** A device's outbox, a batch at a time; one result per operation, in order. */
export const POST: APIRoute = endpoint(async (context) => {
  const user = requireUser(context);
  const body = await readJson(context.request, z.unknown(), MAX_PUSH_BYTES);
  const operations = (body as { operations?: unknown } | null)?.operations;
  if (Array.isArray(operations) && operations.length > MAX_BATCH_OPERATIONS) {
    throw new HttpError(413, `A push may carry at most ${MAX_BATCH_OPERATIONS} operations; send the rest in another batch.`);
  }
  const request = pushRequestSchema.parse(body);
  return json(await pushOperations(user, request));
});
