import type { APIRoute } from 'astro';
import { z } from 'zod';
import { endpoint, json, OFFICE_ROLES, readJson, readQuery, requireRole } from '../../../../lib/server/http';
import { createVehicle, listVehicles } from '../../../../lib/server/vehicles';
import { VEHICLE_SORTS, vehicleInput } from '../../../../lib/office/vehicle-input';
import { tableQuery } from '../../../../lib/office/table-query';

export const prerender = false;

const query = tableQuery(VEHICLE_SORTS, 'registration').extend({ customerId: z.uuid().optional() });

export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  return json(await listVehicles(user.organisationId, readQuery(context.url, query)));
});

export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const input = await readJson(context.request, vehicleInput);
  return json({ vehicle: await createVehicle(user.organisationId, input) }, 201);
});
