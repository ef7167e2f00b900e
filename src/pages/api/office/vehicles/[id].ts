import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../../lib/server/http';
import { getVehicle, updateVehicle } from '../../../../lib/server/vehicles';
import { idParam } from '../../../../lib/server/params';
import { vehicleInput } from '../../../../lib/office/vehicle-input';

export const prerender = false;

export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  return json({ vehicle: await getVehicle(user.organisationId, idParam(context, 'id', 'vehicle')) });
});

export const PUT: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const id = idParam(context, 'id', 'vehicle');
  const input = await readJson(context.request, vehicleInput);
  return json({ vehicle: await updateVehicle(user.organisationId, id, input) });
});
