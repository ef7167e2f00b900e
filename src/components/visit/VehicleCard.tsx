// The vehicle's data at hand before anything is touched: spec, special tools, known weak spots,
// and the reminder that the maker's data and local rules come first.
import type { ReactNode } from 'react';
import { convert } from '../../lib/trade/units';
import type { LocalPart } from '../../lib/device/db';
import { formatDate, formatNumber, unitLabel } from '../phone/format';
import type { VisitData } from './visit-data';


export function VehicleCard({ data, onStart }: { data: VisitData; onStart: () => void }) {
  const { vehicle, visit, customer } = data;
  const partNumber = (id: string | null) => (id ? data.parts.find((p: LocalPart) => p.id === id)?.partNumber ?? 'on file' : null);

  if (!vehicle) {
    return <p className="p-4">The vehicle’s details are not on this phone yet. Sync when you have signal.</p>;
  }
  const spec: [string, ReactNode][] = [];
  const add = (label: string, value: ReactNode | null | undefined) => {
    if (value !== null && value !== undefined && value !== '') spec.push([label, value]);
  };
  const fuel = vehicle.engine.toLowerCase().includes(vehicle.fuel) ? '' : ` · ${vehicle.fuel}`;
  add('Engine', `${vehicle.engine}${fuel}${vehicle.year ? ` · ${vehicle.year}` : ''}`);
  add('VIN', vehicle.vin);
  add('Engine oil', vehicle.oilGrade && `${vehicle.oilGrade}${vehicle.oilCapacityL ? `, ${formatNumber(vehicle.oilCapacityL)} L with filter` : ''}`);
  add('Sump plug torque', vehicle.sumpPlugTorqueNm && `${formatNumber(vehicle.sumpPlugTorqueNm)} N·m`);
  add('Oil filter', partNumber(vehicle.oilFilterPartId));
  add('Air filter', partNumber(vehicle.airFilterPartId));
  add('Cabin filter', partNumber(vehicle.cabinFilterPartId));
  add('Fuel filter', partNumber(vehicle.fuelFilterPartId));
  if (vehicle.sparkPlugPartId || vehicle.plugGapMm) {
    const plug = [
      partNumber(vehicle.sparkPlugPartId),
      vehicle.sparkPlugCount && `× ${vehicle.sparkPlugCount}`,
      vehicle.plugThread,
      vehicle.plugSeat && `${vehicle.plugSeat} seat`,
    ].filter(Boolean);
    add('Spark plugs', plug.join(' '));
    add('Plug gap', vehicle.plugGapMm && `${formatNumber(vehicle.plugGapMm)} mm`);
    add('Plug torque', vehicle.plugTorqueNm && `${formatNumber(vehicle.plugTorqueNm)} N·m`);
  }
  add('Wheel nut torque', vehicle.wheelNutTorqueNm && `${formatNumber(vehicle.wheelNutTorqueNm)} N·m`);
  add('Brake fluid', vehicle.brakeFluidGrade);
  // Pressures are kept in kPa; many driveway gauges read psi, shown as a whole number.
  const pressure = (kpa: number | null) => (kpa ? `${formatNumber(kpa)} kPa (${Math.round(convert(kpa, 'kPa', '[psi]'))} psi)` : null);
  add('Tyres, front', pressure(vehicle.tyrePressureFrontKpa));
  add('Tyres, rear', pressure(vehicle.tyrePressureRearKpa));
  add(
    'Last service',
    vehicle.lastServiceDate &&
      `${formatDate(vehicle.lastServiceDate)}${vehicle.lastServiceOdometer ? ` at ${vehicle.lastServiceOdometer.toLocaleString('en-GB')} ${unitLabel(vehicle.odometerUnit)}` : ''}`,
  );

  return (
    <div className="flex flex-col gap-4 p-3">
      <section className="rounded-xl border-2 border-ink/20 bg-white p-4">
        <h2 className="text-2xl font-bold">
          {vehicle.make} {vehicle.model}
        </h2>
        <dl className="mt-3 grid grid-cols-[auto_1fr] gap-x-4 gap-y-2">
          {spec.map(([label, value]) => (
            <div key={label} className="contents">
              <dt className="text-ink/80">{label}</dt>
              <dd className="font-bold">{value}</dd>
            </div>
          ))}
        </dl>
      </section>

      {vehicle.specialTools.length > 0 && (
        <section className="rounded-xl border-2 border-ink/20 bg-white p-4">
          <h2 className="text-xl font-bold">Special tools</h2>
          <ul className="mt-2 list-disc pl-6">
            {vehicle.specialTools.map((tool) => (
              <li key={tool}>{tool}</li>
            ))}
          </ul>
        </section>
      )}

      {data.modelNotes.length > 0 && (
        <section className="rounded-xl border-2 border-sev-watch bg-white p-4" aria-labelledby="model-notes">
          <h2 id="model-notes" className="text-xl font-bold text-sev-watch">
            Known weak spots
          </h2>
          {data.modelNotes.map((note) => (
            <div key={note.id} className="mt-3">
              <p className="font-bold">{note.title}</p>
              <p>{note.body}</p>
            </div>
          ))}
        </section>
      )}

      <section className="rounded-xl border-2 border-ink/20 bg-white p-4">
        <h2 className="text-xl font-bold">Where</h2>
        <p>
          {visit.addressLines}
          {visit.postcode && `, ${visit.postcode}`}
        </p>
        {visit.accessNotes && <p className="mt-1">Access: {visit.accessNotes}</p>}
        {customer?.phone && (
          <a href={`tel:${customer.phone.replace(/\s+/g, '')}`} className="mt-3 flex min-h-12 items-center justify-center rounded-lg border-2 border-brand font-bold text-brand">
            Call {customer.name}: {customer.phone}
          </a>
        )}
      </section>

      <p className="rounded-xl border-2 border-accent bg-accent/15 p-4" role="note">
        <strong>Safety:</strong> the vehicle maker’s data and local regulations take precedence over the values shown here. Never work under a car held only by a
        jack.
      </p>

      <button type="button" onClick={onStart} className="min-h-14 rounded-lg bg-brand px-4 text-lg font-bold text-white">
        Go to the checklist
      </button>
    </div>
  );
}
