// Booking a visit and moving a booked one. Clashes come back from the server as warnings: the
// booking stands, and the office sees what to sort out.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { useWatch } from 'react-hook-form';
import type { Clash } from '../../lib/office/clashes';
import { minutesToClock } from '../../lib/office/form-values';
import type { TablePage } from '../../lib/office/table-query';
import { bookVisitInput, moveVisitInput } from '../../lib/office/visit-input';
import type { VehicleRow } from '../../lib/server/vehicles';
import type { listTemplates } from '../../lib/server/templates';
import { Button } from '../ui/Button';
import { api } from './api';
import { CustomerPicker, type PickedCustomer } from './CustomerPicker';
import { FormMessage, SelectField, showServerError, TextAreaField, TextField, useZodForm } from './form';

type Templates = { templates: Awaited<ReturnType<typeof listTemplates>> };
type Person = { id: string; name: string };
export type BookingResult = { visit: { id: string }; clashes: Clash[] };

// Slot ends are rounded to the quarter hour people book in.
const QUARTER = 15;

function endFor(start: string, labourCentiHours: number): string | null {
  const match = /^(\d\d):(\d\d)$/.exec(start);
  if (!match) return null;
  const startMinute = Number(match[1]) * 60 + Number(match[2]);
  const minutes = Math.max(QUARTER, Math.ceil((labourCentiHours * 0.6) / QUARTER) * QUARTER);
  return startMinute + minutes >= 24 * 60 ? null : minutesToClock(startMinute + minutes);
}

export function BookVisitForm({
  technicians,
  defaults,
  onBooked,
}: {
  technicians: Person[];
  defaults: { technicianId?: string; roundDate: string };
  onBooked: (result: BookingResult) => void;
}) {
  const form = useZodForm(bookVisitInput, {
    customerId: '',
    vehicleId: '',
    technicianId: defaults.technicianId ?? '',
    templateId: '',
    roundDate: defaults.roundDate,
    start: '09:00',
    end: '',
    addressLines: '',
    postcode: '',
    accessNotes: '',
  });
  const [customer, setCustomer] = useState<PickedCustomer | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const queryClient = useQueryClient();
  const templates = useQuery({ queryKey: ['templates'], queryFn: () => api<Templates>('/api/office/templates') });
  const vehicles = useQuery({
    queryKey: ['customer-vehicles', customer?.id],
    queryFn: () => api<TablePage<VehicleRow>>('/api/office/vehicles', { query: { customerId: customer!.id, pageSize: 200 } }),
    enabled: customer !== null,
  });
  const bookable = (templates.data?.templates ?? []).filter((t) => t.current !== null);

  const pickCustomer = async (picked: PickedCustomer | null) => {
    setCustomer(picked);
    form.setValue('customerId', picked?.id ?? '', { shouldValidate: picked !== null });
    form.setValue('vehicleId', '');
    if (picked) {
      const { customer: full } = await api<{ customer: { addressLines: string; postcode: string } }>(`/api/office/customers/${picked.id}`);
      form.setValue('addressLines', full.addressLines, { shouldValidate: true });
      form.setValue('postcode', full.postcode);
    }
  };

  // The only vehicle of a customer is the one being booked.
  useEffect(() => {
    const rows = vehicles.data?.rows ?? [];
    if (rows.length === 1) form.setValue('vehicleId', rows[0]!.id, { shouldValidate: true });
  }, [vehicles.data, form]);

  // Until the office sets an end time, it follows the checklist's labour time.
  const [start, templateId] = useWatch({ control: form.control, name: ['start', 'templateId'] });
  useEffect(() => {
    const template = bookable.find((t) => t.id === templateId);
    if (!template || form.getFieldState('end').isDirty) return;
    const end = endFor(start, template.labourCentiHours);
    if (end) form.setValue('end', end);
  }, [start, templateId, bookable, form]);

  const book = useMutation({
    mutationFn: (values: unknown) => api<BookingResult>('/api/office/visits', { body: values }),
    onSuccess: async (result) => {
      await queryClient.invalidateQueries();
      onBooked(result);
    },
    onError: (error) => setMessage(showServerError(form, error)),
  });
  const customerError = form.formState.errors.customerId?.message;

  return (
    <form onSubmit={form.handleSubmit((values) => book.mutate(values))} className="grid grid-cols-2 gap-4" noValidate>
      <div className="col-span-2">
        <CustomerPicker value={customer} onPick={pickCustomer} error={customerError} />
      </div>
      <SelectField
        form={form}
        name="vehicleId"
        label="Vehicle"
        empty={customer ? (vehicles.data?.rows.length === 0 ? 'This customer has no vehicle yet' : 'Choose the vehicle') : 'Choose the customer first'}
        options={(vehicles.data?.rows ?? []).map((v) => ({ value: v.id, label: `${v.registration} · ${v.make} ${v.model}` }))}
      />
      <SelectField
        form={form}
        name="templateId"
        label="Checklist"
        empty="Choose the checklist"
        options={bookable.map((t) => ({ value: t.id, label: `${t.name} (v${t.current!.version})` }))}
      />
      <SelectField form={form} name="technicianId" label="Technician" empty="Choose the technician" options={technicians.map((t) => ({ value: t.id, label: t.name }))} />
      <TextField form={form} name="roundDate" label="Day" type="date" />
      <TextField form={form} name="start" label="From" type="time" />
      <TextField form={form} name="end" label="To" type="time" hint="Follows the checklist’s labour time until you change it." />
      <TextField form={form} name="addressLines" label="Where the vehicle stands" className="col-span-2" />
      <TextField form={form} name="postcode" label="Postcode" />
      <TextAreaField form={form} name="accessNotes" label="Access notes for the technician" rows={2} className="col-span-2" />
      <div className="col-span-2 flex flex-col gap-3">
        <FormMessage message={message} />
        <div>
          <Button type="submit" variant="primary" disabled={book.isPending}>
            {book.isPending ? 'Booking…' : 'Book visit'}
          </Button>
        </div>
      </div>
    </form>
  );
}

export type MovableVisit = {
  id: string;
  technicianId: string;
  roundDate: string;
  start: number;
  end: number;
  addressLines: string;
  postcode: string;
  accessNotes: string;
};

export function MoveVisitForm({ visit, technicians, onMoved }: { visit: MovableVisit; technicians: Person[]; onMoved: (result: BookingResult) => void }) {
  const form = useZodForm(moveVisitInput, {
    technicianId: visit.technicianId,
    roundDate: visit.roundDate,
    start: minutesToClock(visit.start),
    end: minutesToClock(visit.end),
    addressLines: visit.addressLines,
    postcode: visit.postcode,
    accessNotes: visit.accessNotes,
  });
  const [message, setMessage] = useState<string | null>(null);
  const queryClient = useQueryClient();
  const move = useMutation({
    mutationFn: (values: unknown) => api<BookingResult>(`/api/office/visits/${visit.id}`, { method: 'PUT', body: values }),
    onSuccess: async (result) => {
      await queryClient.invalidateQueries();
      onMoved(result);
    },
    onError: (error) => setMessage(showServerError(form, error)),
  });
  return (
    <form onSubmit={form.handleSubmit((values) => move.mutate(values))} className="grid grid-cols-2 gap-4" noValidate>
      <SelectField form={form} name="technicianId" label="Technician" options={technicians.map((t) => ({ value: t.id, label: t.name }))} />
      <TextField form={form} name="roundDate" label="Day" type="date" />
      <TextField form={form} name="start" label="From" type="time" />
      <TextField form={form} name="end" label="To" type="time" />
      <TextField form={form} name="addressLines" label="Where the vehicle stands" className="col-span-2" />
      <TextField form={form} name="postcode" label="Postcode" />
      <TextAreaField form={form} name="accessNotes" label="Access notes for the technician" rows={2} className="col-span-2" />
      <p className="col-span-2 text-sm text-ink/80">
        Moving the visit to another technician takes it off the first technician’s phone at their next sync.
      </p>
      <div className="col-span-2 flex flex-col gap-3">
        <FormMessage message={message} />
        <div>
          <Button type="submit" variant="primary" disabled={move.isPending || !form.formState.isDirty}>
            {move.isPending ? 'Saving…' : 'Save changes'}
          </Button>
        </div>
      </div>
    </form>
  );
}
