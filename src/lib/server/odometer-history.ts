// A vehicle's odometer over time: every live sign-off of its visits, plus the last service the
// office recorded on the vehicle. Used to estimate how far it travels a day.
import { and, eq, isNull } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import * as s from '../../db/schema';
import type { OdometerReading } from '../reminders/service-due';
import { localDate } from './local-date';

export async function odometerHistory(db: Executor, vehicleId: string, timeZone: string): Promise<OdometerReading[]> {
  const signOffs = await db
    .select({ odometer: s.signOffs.odometer, signedAt: s.signOffs.signedAt })
    .from(s.signOffs)
    .innerJoin(s.visits, eq(s.visits.id, s.signOffs.visitId))
    .where(and(eq(s.visits.vehicleId, vehicleId), isNull(s.signOffs.voidedAt)));
  const readings = signOffs.map((r) => ({ date: localDate(r.signedAt, timeZone), odometer: r.odometer }));
  const [vehicle] = await db
    .select({ date: s.vehicles.lastServiceDate, odometer: s.vehicles.lastServiceOdometer })
    .from(s.vehicles)
    .where(eq(s.vehicles.id, vehicleId));
  if (vehicle?.date && vehicle.odometer !== null) readings.push({ date: vehicle.date, odometer: vehicle.odometer });
  return readings;
}
