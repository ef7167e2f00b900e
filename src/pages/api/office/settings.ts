import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../lib/server/http';
import { getSettings, updateSettings } from '../../../lib/server/settings';
import { settingsInput } from '../../../lib/office/settings-input';

export const prerender = false;

/** The office reads the settings (time zone, hours, units); only the owner changes them. */
export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  return json({ settings: await getSettings(user.organisationId) });
});

export const PUT: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, ['owner']);
  const input = await readJson(context.request, settingsInput);
  return json({ settings: await updateSettings(user.organisationId, input) });
});
