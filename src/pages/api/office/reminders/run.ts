import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, requireRole } from '../../../../lib/server/http';
import { scanReminders } from '../../../../lib/server/reminders';

export const prerender = false;

/** Runs the reminder scan for this business now (the worker also runs it every morning). */
export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  return json(await scanReminders(user.organisationId));
});
