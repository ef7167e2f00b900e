import type { APIRoute } from 'astro';
import { endpoint, json, readJson } from '../../../../../../lib/server/http';
import { decisionBody, recordAdvisedParams } from '../../../../../../lib/server/follow-up-schemas';
import { decideAdvisedWork } from '../../../../../../lib/server/advised-work';

export const prerender = false;

/** The customer approves or declines one item of advised work from the record's link. */
export const POST: APIRoute = endpoint(async (context) => {
  const { token, id } = recordAdvisedParams.parse(context.params);
  const { decision } = await readJson(context.request, decisionBody, 1_000);
  return json(await decideAdvisedWork(id, decision, { token }));
});
