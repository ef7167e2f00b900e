// Which part a checklist's part item means on this vehicle: its spec names the filters and plugs,
// and the oil is the stocked oil of the vehicle's grade, filled to the vehicle's capacity.
import type { LocalPart, LocalVehicle } from './db';
import type { ItemOf } from './visit-progress';

export type SuggestedPart = { partId: string | null; partNumber: string; description: string; quantity: number; unit: string };

const SPEC_SLOT: Record<string, keyof LocalVehicle> = {
  oil_filter: 'oilFilterPartId',
  air_filter: 'airFilterPartId',
  cabin_filter: 'cabinFilterPartId',
  fuel_filter: 'fuelFilterPartId',
  spark_plug: 'sparkPlugPartId',
};

export function suggestPart(item: ItemOf, vehicle: LocalVehicle | undefined, parts: readonly LocalPart[]): SuggestedPart | null {
  if (item.kind !== 'part' || !item.partKind || !vehicle) return null;
  const line = (part: LocalPart, quantity: number): SuggestedPart => ({
    partId: part.id,
    partNumber: part.partNumber,
    description: part.description,
    quantity,
    unit: part.unit,
  });
  if (item.partKind === 'oil') {
    const oil = parts.find((p) => p.kind === 'oil' && p.oilGrade === vehicle.oilGrade);
    return oil && vehicle.oilCapacityL ? line(oil, vehicle.oilCapacityL) : null;
  }
  const slot = SPEC_SLOT[item.partKind];
  const partId = slot ? (vehicle[slot] as string | null) : null;
  const part = partId ? parts.find((p) => p.id === partId) : undefined;
  if (!part) return null;
  const quantity = item.partKind === 'spark_plug' ? (vehicle.sparkPlugCount ?? 1) : 1;
  return line(part, quantity);
}
