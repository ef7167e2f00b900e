// Everything one visit screen shows, read from the phone's database as one live query.
import type { Device } from '../../lib/device/boot';
import type {
  LocalCheckResult,
  LocalCustomer,
  LocalFinding,
  LocalModelNote,
  LocalNote,
  LocalPart,
  LocalPartLine,
  LocalPhoto,
  LocalReadingResult,
  LocalSignOff,
  LocalTemplateVersion,
  LocalVehicle,
  LocalVisit,
} from '../../lib/device/db';
import { useLiveQuery } from '../phone/hooks';

export type VisitData = {
  visit: LocalVisit;
  customer: LocalCustomer | undefined;
  vehicle: LocalVehicle | undefined;
  version: LocalTemplateVersion | undefined;
  modelNotes: LocalModelNote[];
  parts: LocalPart[];
  checks: LocalCheckResult[];
  readings: LocalReadingResult[];
  findings: LocalFinding[];
  notes: LocalNote[];
  photos: LocalPhoto[];
  partLines: LocalPartLine[];
  signOff: LocalSignOff | undefined;
  unsent: number;
};

async function loadVisit({ db }: Device, visitId: string): Promise<VisitData | null> {
  const visit = await db.visits.get(visitId);
  if (!visit) return null;
  const [customer, vehicle, version, checks, readings, findings, notes, photos, partLines, signOff, unsent, parts] = await Promise.all([
    db.customers.get(visit.customerId),
    db.vehicles.get(visit.vehicleId),
    db.templateVersions.get(visit.templateVersionId),
    db.checkResults.where('visitId').equals(visitId).toArray(),
    db.readingResults.where('visitId').equals(visitId).toArray(),
    db.findings.where('visitId').equals(visitId).toArray(),
    db.notes.where('visitId').equals(visitId).sortBy('stamp'),
    db.photos.where('visitId').equals(visitId).sortBy('stamp'),
    db.partLines.where('visitId').equals(visitId).sortBy('stamp'),
    db.signOffs.get(visitId),
    db.outbox.where('visitId').equals(visitId).count(),
    db.parts.toArray(),
  ]);
  // A model note with an empty engine applies to every engine of that make and model.
  const modelNotes = vehicle
    ? (await db.modelNotes.where('[make+model]').equals([vehicle.make, vehicle.model]).toArray()).filter(
        (n) => n.engine === '' || n.engine === vehicle.engine,
      )
    : [];
  findings.sort((a, b) => a.stamp.localeCompare(b.stamp));
  return { visit, customer, vehicle, version, modelNotes, parts, checks, readings, findings, notes, photos, partLines, signOff, unsent };
}

/** undefined while loading, null when the visit is not on this phone. */
export function useVisitData(device: Device, visitId: string): VisitData | null | undefined {
  return useLiveQuery(() => loadVisit(device, visitId), [device, visitId]);
}
