// One vehicle: its spec (editable), the model notes that match it, when its next service is due,
// and its visits.
import { useQuery } from '@tanstack/react-query';
import type { getVehicle } from '../../lib/server/vehicles';
import { nextServiceDue } from '../../lib/trade';
import { localToday } from '../../lib/office/local-time';
import { api, type Json } from './api';
import { Panel } from './Panel';
import { island } from './query-client';
import { EMPTY_VEHICLE, VehicleForm } from './VehicleForm';
import type { VehicleFormValues } from '../../lib/office/vehicle-input';

type Vehicle = Json<Awaited<ReturnType<typeof getVehicle>>>;

const text = (v: number | string | null) => (v === null ? '' : String(v));

function toForm(v: Vehicle): VehicleFormValues {
  const values = { ...EMPTY_VEHICLE };
  for (const key of Object.keys(EMPTY_VEHICLE) as (keyof VehicleFormValues)[]) {
    const value = (v as Record<string, unknown>)[key];
    (values as Record<string, unknown>)[key] = Array.isArray(value) ? value.join('\n') : text(value as number | string | null);
  }
  return values;
}

function VehiclePage({ vehicleId, timeZone }: { vehicleId: string; timeZone: string }) {
  const vehicle = useQuery({ queryKey: ['vehicle', vehicleId], queryFn: () => api<{ vehicle: Vehicle }>(`/api/office/vehicles/${vehicleId}`) });
  if (vehicle.isLoading) return <p>Loading…</p>;
  if (vehicle.isError) return <p role="alert">{(vehicle.error as Error).message}</p>;
  const v = vehicle.data!.vehicle;
  const due = dueText(v, timeZone);
  return (
    <div className="flex flex-col gap-5">
      <div className="grid grid-cols-3 gap-5">
        <Panel title="Next service">
          <p>{due}</p>
        </Panel>
        <Panel title={`Model notes (${v.modelNotes.length})`}>
          {v.modelNotes.length === 0 ? (
            <p>No notes for {v.make} {v.model}. <a className="text-brand underline" href="/office/model-notes">Add one</a></p>
          ) : (
            <ul className="flex flex-col gap-2">
              {v.modelNotes.map((n) => (
                <li key={n.id}>
                  <strong>{n.title}</strong>
                  <p className="text-sm">{n.body}</p>
                </li>
              ))}
            </ul>
          )}
        </Panel>
        <Panel title="Visits">
          <p className="flex flex-col gap-1">
            <a className="text-brand underline" href={`/office/visits?vehicleId=${v.id}&sort=slotStart&dir=desc`}>
              Every visit to {v.registration}
            </a>
            <a className="text-brand underline" href={`/office/customers/${v.customerId}`}>
              {v.customerName}
            </a>
          </p>
        </Panel>
      </div>
      <VehicleForm key={v.updatedAt} vehicleId={v.id} initial={toForm(v)} customer={{ id: v.customerId, name: v.customerName, postcode: '' }} onSaved={() => undefined} />
    </div>
  );
}

function dueText(v: Vehicle, timeZone: string): string {
  if (!v.lastServiceDate) return 'No last service on file: add its date below.';
  if (v.serviceIntervalMonths === null && v.serviceIntervalDistance === null) return 'No service interval set.';
  try {
    const due = nextServiceDue({
      last: { date: v.lastServiceDate, odometer: v.lastServiceOdometer },
      interval: { months: v.serviceIntervalMonths, distance: v.serviceIntervalDistance, unit: v.odometerUnit },
      today: localToday(timeZone),
    });
    return due.message;
  } catch (error) {
    return (error as Error).message;
  }
}

export default island(VehiclePage);
