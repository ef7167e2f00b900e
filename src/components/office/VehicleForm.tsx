// A vehicle and the spec the technician needs before touching it. The trade checks (VIN,
// registration, oil grade) run as the office types; quantities can be typed in other units.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useWatch } from 'react-hook-form';
import { vehicleInput, type VehicleFormValues } from '../../lib/office/vehicle-input';
import { checkVin, normaliseRegistration, parseOilGrade, PLUG_THREADS, sparkPlugTightening } from '../../lib/trade';
import { BRAKE_FLUID_GRADES, FUEL_TYPES, PLUG_SEATS } from '../../lib/words';
import { Button } from '../ui/Button';
import { api } from './api';
import { CustomerPicker, type PickedCustomer } from './CustomerPicker';
import { FormMessage, SelectField, showServerError, TextAreaField, TextField, useZodForm } from './form';
import { Panel } from './Panel';
import { QuantityField } from './QuantityField';

type SpecPart = { id: string; kind: string; partNumber: string; description: string };

export const EMPTY_VEHICLE: VehicleFormValues = {
  customerId: '',
  registration: '',
  vin: '',
  make: '',
  model: '',
  engine: '',
  fuel: 'petrol',
  year: '',
  odometerUnit: '[mi_i]',
  oilGrade: '',
  oilCapacityL: '',
  oilFilterPartId: '',
  airFilterPartId: '',
  cabinFilterPartId: '',
  fuelFilterPartId: '',
  sparkPlugPartId: '',
  sparkPlugCount: '',
  plugThread: '',
  plugSeat: '',
  plugGapMm: '',
  plugTorqueNm: '',
  sumpPlugTorqueNm: '',
  wheelNutTorqueNm: '',
  brakeFluidGrade: '',
  tyrePressureFrontKpa: '',
  tyrePressureRearKpa: '',
  specialTools: '',
  serviceIntervalMonths: '',
  serviceIntervalDistance: '',
  lastServiceDate: '',
  lastServiceOdometer: '',
};

const attempt = <T,>(f: () => T): { value: T | null; error: string | null } => {
  try {
    return { value: f(), error: null };
  } catch (error) {
    return { value: null, error: (error as Error).message };
  }
};

export function VehicleForm(props: Parameters<typeof VehicleFormFields>[0]) {
  // Part selects must have their options before the form sets their value, or they show "Not set".
  const parts = useQuery({ queryKey: ['spec-parts'], queryFn: () => api<{ parts: SpecPart[] }>('/api/office/spec-parts') });
  if (parts.isLoading) return <p>Loading…</p>;
  if (parts.isError) return <p role="alert">{(parts.error as Error).message}</p>;
  return <VehicleFormFields {...props} parts={parts.data!.parts} />;
}

function VehicleFormFields({
  vehicleId,
  initial,
  customer: fixedCustomer,
  onSaved,
  parts,
}: {
  vehicleId?: string;
  initial: VehicleFormValues;
  customer: PickedCustomer | null;
  onSaved: (id: string) => void;
  parts?: SpecPart[];
}) {
  const form = useZodForm(vehicleInput, initial);
  const [customer, setCustomer] = useState<PickedCustomer | null>(fixedCustomer);
  const [message, setMessage] = useState<string | null>(null);
  const queryClient = useQueryClient();
  const save = useMutation({
    mutationFn: (values: VehicleFormValues) =>
      vehicleId
        ? api<{ vehicle: { id: string } }>(`/api/office/vehicles/${vehicleId}`, { method: 'PUT', body: values })
        : api<{ vehicle: { id: string } }>('/api/office/vehicles', { body: values }),
    onSuccess: async ({ vehicle }) => {
      setMessage(null);
      form.reset(form.getValues());
      await queryClient.invalidateQueries();
      onSaved(vehicle.id);
    },
    onError: (error) => setMessage(showServerError(form, error)),
  });

  const [registration, vin, oilGrade, plugThread, plugSeat, fuel, odometerUnit] = useWatch({
    control: form.control,
    name: ['registration', 'vin', 'oilGrade', 'plugThread', 'plugSeat', 'fuel', 'odometerUnit'],
  });
  const plate = registration ? attempt(() => normaliseRegistration(String(registration))) : null;
  const vinCheck = vin && String(vin).trim() ? checkVin(String(vin)) : null;
  const grade = oilGrade && String(oilGrade).trim() ? attempt(() => parseOilGrade(String(oilGrade))) : null;
  const plugGuide =
    plugThread && (plugSeat === 'flat' || plugSeat === 'taper')
      ? (['cast_iron', 'aluminium'] as const).map((head) => attempt(() => sparkPlugTightening({ thread: String(plugThread), seat: plugSeat, head })))
      : null;
  const partOptions = (kind: string) =>
    (parts ?? []).filter((p) => p.kind === kind).map((p) => ({ value: p.id, label: `${p.partNumber} · ${p.description}` }));
  const distance = odometerUnit === 'km' ? 'km' : 'miles';
  const customerError = form.formState.errors.customerId?.message;

  return (
    <form
      onSubmit={form.handleSubmit((values) => save.mutate(values))}
      noValidate
      className="grid grid-cols-3 items-start gap-5"
      aria-label={vehicleId ? 'Vehicle' : 'New vehicle'}
    >
      <Panel title="The vehicle">
        <div className="flex flex-col gap-3">
          {fixedCustomer ? (
            <p>
              Customer: <strong>{fixedCustomer.name}</strong>
            </p>
          ) : (
            <CustomerPicker
              value={customer}
              error={customerError}
              onPick={(picked) => {
                setCustomer(picked);
                form.setValue('customerId', picked?.id ?? '', { shouldValidate: true, shouldDirty: true });
              }}
            />
          )}
          <TextField
            form={form}
            name="registration"
            label="Registration"
            hint={plate?.value && plate.value !== registration ? `Kept as ${plate.value}` : undefined}
          />
          <TextField
            form={form}
            name="vin"
            label="VIN"
            hint={
              vinCheck
                ? vinCheck.valid
                  ? [`VIN looks right (${vinCheck.wmi} · ${vinCheck.vds} · ${vinCheck.vis}).`, ...vinCheck.notes].join(' ')
                  : null
                : 'Optional: 17 characters, on the windscreen corner or the door pillar.'
            }
          />
          {vinCheck && !vinCheck.valid && !form.formState.errors.vin && (
            <p className="text-sm font-bold text-sev-now" role="status">
              VIN: {vinCheck.problems.join(' ')}
            </p>
          )}
          <div className="grid grid-cols-2 gap-3">
            <TextField form={form} name="make" label="Make" />
            <TextField form={form} name="model" label="Model" />
            <TextField form={form} name="engine" label="Engine" placeholder="1.6 diesel" />
            <TextField form={form} name="year" label="Year" inputMode="numeric" />
            <SelectField form={form} name="fuel" label="Fuel" options={FUEL_TYPES.map((f) => ({ value: f, label: f }))} />
            <SelectField
              form={form}
              name="odometerUnit"
              label="Odometer reads"
              options={[
                { value: '[mi_i]', label: 'miles' },
                { value: 'km', label: 'kilometres' },
              ]}
            />
          </div>
        </div>
      </Panel>

      <Panel title="Oil, filters and plugs">
        <div className="flex flex-col gap-3">
          <div className="grid grid-cols-2 gap-3">
            <TextField
              form={form}
              name="oilGrade"
              label="Oil grade (SAE J300)"
              placeholder="5W-30"
              hint={grade?.value ? `${grade.value.grade}: ${grade.value.kind}, at least ${grade.value.limits.kv100MinMm2s} mm²/s at 100 °C.` : undefined}
            />
            <QuantityField form={form} name="oilCapacityL" label="Oil capacity with filter" units={['L', '[qt_us]', '[qt_br]']} />
          </div>
          {grade?.error && !form.formState.errors.oilGrade && <p className="text-sm font-bold text-sev-now">Oil grade: {grade.error}</p>}
          <SelectField form={form} name="oilFilterPartId" label="Oil filter" empty="Not set" options={partOptions('oil_filter')} />
          <SelectField form={form} name="airFilterPartId" label="Air filter" empty="Not set" options={partOptions('air_filter')} />
          <SelectField form={form} name="cabinFilterPartId" label="Cabin (pollen) filter" empty="Not set" options={partOptions('cabin_filter')} />
          {fuel === 'diesel' && <SelectField form={form} name="fuelFilterPartId" label="Fuel filter" empty="Not set" options={partOptions('fuel_filter')} />}
          {fuel !== 'diesel' && fuel !== 'electric' && (
            <>
              <div className="grid grid-cols-2 gap-3">
                <SelectField form={form} name="sparkPlugPartId" label="Spark plug" empty="Not set" options={partOptions('spark_plug')} />
                <TextField form={form} name="sparkPlugCount" label="Plugs" inputMode="numeric" />
                <SelectField form={form} name="plugThread" label="Plug thread" empty="Not known" options={PLUG_THREADS.map((t) => ({ value: t, label: t }))} />
                <SelectField form={form} name="plugSeat" label="Plug seat" empty="Not known" options={PLUG_SEATS.map((s) => ({ value: s, label: s === 'flat' ? 'flat (gasket)' : 'taper' }))} />
                <QuantityField form={form} name="plugGapMm" label="Plug gap" units={['mm', '[in_i]']} />
                <QuantityField form={form} name="plugTorqueNm" label="Plug torque" units={['N.m', '[lbf_av].[ft_i]']} />
              </div>
              {plugGuide && (
                <p className="text-sm text-ink/80">
                  Common practice for a {String(plugThread)} {String(plugSeat)}-seat plug:{' '}
                  {plugGuide
                    .map((g, i) => (g.value?.torqueNm ? `${g.value.torqueNm.min}–${g.value.torqueNm.max} N·m in a ${i === 0 ? 'cast-iron' : 'aluminium'} head` : null))
                    .filter(Boolean)
                    .join(', ') || 'no published figure'}
                  . The vehicle maker’s figure comes first.
                </p>
              )}
            </>
          )}
        </div>
      </Panel>

      <Panel title="Torques, brakes, tyres and interval">
        <div className="flex flex-col gap-3">
          <div className="grid grid-cols-2 gap-3">
            <QuantityField form={form} name="sumpPlugTorqueNm" label="Sump plug torque" units={['N.m', '[lbf_av].[ft_i]']} />
            <QuantityField form={form} name="wheelNutTorqueNm" label="Wheel nut torque" units={['N.m', '[lbf_av].[ft_i]']} />
            <SelectField form={form} name="brakeFluidGrade" label="Brake fluid" empty="Not known" options={BRAKE_FLUID_GRADES.map((g) => ({ value: g, label: g }))} />
            <span />
            <QuantityField form={form} name="tyrePressureFrontKpa" label="Tyres, front (cold)" units={['kPa', 'bar', '[psi]']} />
            <QuantityField form={form} name="tyrePressureRearKpa" label="Tyres, rear (cold)" units={['kPa', 'bar', '[psi]']} />
            <TextField form={form} name="serviceIntervalMonths" label="Service every (months)" inputMode="numeric" />
            <TextField form={form} name="serviceIntervalDistance" label={`or every (${distance})`} inputMode="numeric" />
            <TextField form={form} name="lastServiceDate" label="Last service" type="date" />
            <TextField form={form} name="lastServiceOdometer" label={`Odometer then (${distance})`} inputMode="numeric" />
          </div>
          <TextAreaField form={form} name="specialTools" label="Special tools, one a line" rows={3} />
        </div>
      </Panel>

      <div className="col-span-3 flex flex-col gap-3">
        <p className="rounded border-2 border-sev-soon bg-white p-3 text-sm">
          <strong>Safety:</strong> the vehicle maker’s data and local regulations take precedence over the values kept here. Check a figure against the maker’s data before
          relying on it at the kerb.
        </p>
        <FormMessage message={message} />
        <div className="flex items-center gap-3">
          <Button type="submit" variant="primary" disabled={save.isPending}>
            {save.isPending ? 'Saving…' : vehicleId ? 'Save vehicle' : 'Add vehicle'}
          </Button>
          {save.isSuccess && !form.formState.isDirty && vehicleId && (
            <p role="status" className="font-bold text-sev-ok">
              Saved.
            </p>
          )}
        </div>
      </div>
    </form>
  );
}
