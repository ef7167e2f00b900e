// Vehicles and their service spec, as the office keeps them for the technicians.
import { and, count, eq, ilike, inArray, ne, or, sql } from 'drizzle-orm';
import { getDb, type Executor } from '../../db/client';
import * as s from '../../db/schema';
import type { TablePage, TableQuery } from '../office/table-query';
import type { VEHICLE_SORTS, VehicleInput } from '../office/vehicle-input';
import { HttpError } from './http';
import { matchingModelNotes } from './model-notes';
import { withChangeFeedWrite } from './change-feed';
import { containsPattern, orderFor, pageWindow } from './table-sql';

export type VehicleRow = {
  id: string;
  registration: string;
  make: string;
  model: string;
  engine: string;
  fuel: string;
  year: number | null;
  customerId: string;
  customerName: string;
  lastServiceDate: string | null;
};

export async function listVehicles(
  organisationId: string,
  query: TableQuery<(typeof VEHICLE_SORTS)[number]> & { customerId?: string | undefined },
): Promise<TablePage<VehicleRow>> {
  const db = getDb();
  const pattern = query.q ? containsPattern(query.q) : undefined;
  // Plates are stored without spaces, so "qk19 fen" must find QK19FEN.
  const platePattern = query.q ? containsPattern(query.q.replace(/[\s-]+/g, '').toUpperCase()) : undefined;
  const where = and(
    eq(s.vehicles.organisationId, organisationId),
    query.customerId ? eq(s.vehicles.customerId, query.customerId) : undefined,
    pattern
      ? or(
          ilike(s.vehicles.registration, platePattern!),
          ilike(s.vehicles.vin, platePattern!),
          ilike(s.vehicles.make, pattern),
          ilike(s.vehicles.model, pattern),
          ilike(s.customers.name, pattern),
        )
      : undefined,
  );
  const sortColumn = {
    registration: s.vehicles.registration,
    make: sql`${s.vehicles.make} || ' ' || ${s.vehicles.model}`,
    customer: s.customers.name,
    year: s.vehicles.year,
    lastService: s.vehicles.lastServiceDate,
  }[query.sort];
  const { limit, offset } = pageWindow(query);
  const [rows, [total]] = await Promise.all([
    db
      .select({
        id: s.vehicles.id,
        registration: s.vehicles.registration,
        make: s.vehicles.make,
        model: s.vehicles.model,
        engine: s.vehicles.engine,
        fuel: s.vehicles.fuel,
        year: s.vehicles.year,
        customerId: s.vehicles.customerId,
        customerName: s.customers.name,
        lastServiceDate: s.vehicles.lastServiceDate,
      })
      .from(s.vehicles)
      .innerJoin(s.customers, eq(s.customers.id, s.vehicles.customerId))
      .where(where)
      .orderBy(...orderFor(sortColumn, query.dir, s.vehicles.id))
      .limit(limit)
      .offset(offset),
    db
      .select({ n: count() })
      .from(s.vehicles)
      .innerJoin(s.customers, eq(s.customers.id, s.vehicles.customerId))
      .where(where),
  ]);
  return { rows, total: total?.n ?? 0, page: query.page, pageSize: query.pageSize };
}

export async function getVehicle(organisationId: string, vehicleId: string) {
  const db = getDb();
  const [row] = await db
    .select({ vehicle: s.vehicles, customerName: s.customers.name })
    .from(s.vehicles)
    .innerJoin(s.customers, eq(s.customers.id, s.vehicles.customerId))
    .where(and(eq(s.vehicles.id, vehicleId), eq(s.vehicles.organisationId, organisationId)));
  if (!row) throw new HttpError(404, 'No such vehicle in this business.');
  const modelNotes = await matchingModelNotes(organisationId, row.vehicle);
  return { ...row.vehicle, customerName: row.customerName, modelNotes };
}

export async function createVehicle(organisationId: string, input: VehicleInput) {
  return withChangeFeedWrite(organisationId, async (tx) => {
    await checkReferences(tx, organisationId, input, null);
    const [row] = await tx
      .insert(s.vehicles)
      .values({ organisationId, ...input })
      .returning();
    return row!;
  });
}

export async function updateVehicle(organisationId: string, vehicleId: string, input: VehicleInput) {
  return withChangeFeedWrite(organisationId, async (tx) => {
    // The vehicle first: another business's vehicle is a 404, whatever the form says.
    const [own] = await tx
      .select({ id: s.vehicles.id })
      .from(s.vehicles)
      .where(and(eq(s.vehicles.id, vehicleId), eq(s.vehicles.organisationId, organisationId)))
      .for('update');
    if (!own) throw new HttpError(404, 'No such vehicle in this business.');
    await checkReferences(tx, organisationId, input, vehicleId);
    const [row] = await tx
      .update(s.vehicles)
      .set({ ...input, updatedAt: new Date(), changeSeq: s.nextChangeSeq })
      .where(and(eq(s.vehicles.id, vehicleId), eq(s.vehicles.organisationId, organisationId)))
      .returning();
    if (!row) throw new HttpError(404, 'No such vehicle in this business.');
    return row;
  });
}

const PART_SLOTS = [
  ['oilFilterPartId', 'oil_filter', 'oil filter'],
  ['airFilterPartId', 'air_filter', 'air filter'],
  ['cabinFilterPartId', 'cabin_filter', 'cabin filter'],
  ['fuelFilterPartId', 'fuel_filter', 'fuel filter'],
  ['sparkPlugPartId', 'spark_plug', 'spark plug'],
] as const;

/** The customer and parts must be this business's own; one plate is one vehicle on file. */
async function checkReferences(tx: Executor, organisationId: string, input: VehicleInput, vehicleId: string | null) {
  const [customer] = await tx
    .select({ id: s.customers.id })
    .from(s.customers)
    .where(and(eq(s.customers.id, input.customerId), eq(s.customers.organisationId, organisationId)));
  if (!customer) throw new HttpError(422, 'The customer is not one of this business’s customers.');

  const partIds = PART_SLOTS.map(([field]) => input[field]).filter((id): id is string => id !== null);
  if (partIds.length) {
    const found = await tx
      .select({ id: s.parts.id, kind: s.parts.kind })
      .from(s.parts)
      .where(and(inArray(s.parts.id, partIds), eq(s.parts.organisationId, organisationId)));
    for (const [field, kind, label] of PART_SLOTS) {
      const id = input[field];
      if (id === null) continue;
      const part = found.find((p) => p.id === id);
      if (!part) throw new HttpError(422, `The ${label} is not in this business’s parts list.`, [`${field}: unknown part`]);
      if (part.kind !== kind) throw new HttpError(422, `The part chosen as ${label} is a ${part.kind.replace('_', ' ')}.`, [`${field}: wrong kind of part`]);
    }
  }

  const [twin] = await tx
    .select({ id: s.vehicles.id, customerName: s.customers.name })
    .from(s.vehicles)
    .innerJoin(s.customers, eq(s.customers.id, s.vehicles.customerId))
    .where(
      and(
        eq(s.vehicles.organisationId, organisationId),
        eq(s.vehicles.registration, input.registration),
        vehicleId ? ne(s.vehicles.id, vehicleId) : undefined,
      ),
    );
  if (twin) {
    throw new HttpError(409, `${input.registration} is already on file (${twin.customerName}). Open that vehicle instead.`, [
      `registration: already on file`,
    ]);
  }
}

/** The parts the vehicle form offers, by kind. */
export async function listSpecParts(organisationId: string) {
  return getDb()
    .select({ id: s.parts.id, kind: s.parts.kind, partNumber: s.parts.partNumber, description: s.parts.description })
    .from(s.parts)
    .where(
      and(
        eq(s.parts.organisationId, organisationId),
        eq(s.parts.active, true),
        inArray(s.parts.kind, ['oil_filter', 'air_filter', 'cabin_filter', 'fuel_filter', 'spark_plug']),
      ),
    )
    .orderBy(s.parts.kind, s.parts.partNumber);
}
