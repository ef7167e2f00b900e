// The owner's business settings: name and contact, rates and tax, currency, units, time zone and
// working hours (the rounds planner warns about visits outside them).
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { minutesToClock } from '../../lib/office/form-values';
import { formatMajorAmount } from '../../lib/office/money-input';
import { settingsInput, type SettingsFormValues } from '../../lib/office/settings-input';
import type { SettingsView } from '../../lib/server/settings';
import { Button } from '../ui/Button';
import { api } from './api';
import { FormMessage, SelectField, showServerError, TextField, useZodForm } from './form';
import { Panel } from './Panel';
import { island } from './query-client';

function SettingsPage() {
  const settings = useQuery({ queryKey: ['settings'], queryFn: () => api<{ settings: SettingsView }>('/api/office/settings') });
  if (settings.isLoading) return <p>Loading…</p>;
  if (settings.isError) return <p role="alert">{(settings.error as Error).message}</p>;
  return <SettingsEditor settings={settings.data!.settings} />;
}

function toValues(s: SettingsView): SettingsFormValues {
  return {
    name: s.name,
    addressLines: s.addressLines,
    phone: s.phone,
    email: s.email,
    currency: s.currency,
    labourRate: formatMajorAmount(s.labourRateMinorPerHour, s.currency),
    taxPercent: String(s.taxRateBasisPoints / 100),
    distanceUnit: s.distanceUnit,
    timeZone: s.timeZone,
    workdayStart: minutesToClock(s.workdayStartMinute),
    workdayEnd: minutesToClock(s.workdayEndMinute),
    reminderLeadDays: String(s.reminderLeadDays),
  };
}

function SettingsEditor({ settings }: { settings: SettingsView }) {
  const form = useZodForm(settingsInput, toValues(settings));
  const [message, setMessage] = useState<{ text: string; ok: boolean } | null>(null);
  const queryClient = useQueryClient();
  const save = useMutation({
    mutationFn: (values: SettingsFormValues) => api<{ settings: SettingsView }>('/api/office/settings', { method: 'PUT', body: values }),
    onSuccess: async ({ settings: saved }) => {
      form.reset(toValues(saved));
      setMessage({ text: 'Settings saved.', ok: true });
      await queryClient.invalidateQueries();
    },
    onError: (error) => setMessage({ text: showServerError(form, error), ok: false }),
  });
  const zones = [...new Set([settings.timeZone, ...(typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('timeZone') : [])])];
  return (
    <form onSubmit={form.handleSubmit((v) => save.mutate(v))} noValidate className="grid max-w-5xl grid-cols-2 gap-5">
      <Panel title="The business">
        <div className="flex flex-col gap-3">
          <TextField form={form} name="name" label="Name" />
          <TextField form={form} name="addressLines" label="Address" />
          <TextField form={form} name="phone" label="Phone" type="tel" />
          <TextField form={form} name="email" label="E-mail" type="email" />
        </div>
      </Panel>
      <Panel title="Money">
        <div className="flex flex-col gap-3">
          <TextField form={form} name="currency" label="Currency (ISO 4217 code)" hint="GBP, EUR, USD… Money is kept in whole minor units (pence, cents)." />
          <TextField form={form} name="labourRate" label={`Labour rate per hour (${settings.currency})`} inputMode="decimal" />
          <TextField form={form} name="taxPercent" label="Tax rate (%)" inputMode="decimal" />
        </div>
      </Panel>
      <Panel title="Units and time">
        <div className="flex flex-col gap-3">
          <SelectField form={form} name="distanceUnit" label="Distances" options={[{ value: '[mi_i]', label: 'miles' }, { value: 'km', label: 'kilometres' }]} />
          <SelectField form={form} name="timeZone" label="Time zone" options={zones.map((z) => ({ value: z, label: z }))} />
          <TextField form={form} name="reminderLeadDays" label="Remind customers this many days before a service is due" inputMode="numeric" />
        </div>
      </Panel>
      <Panel title="Working hours">
        <div className="grid grid-cols-2 gap-3">
          <TextField form={form} name="workdayStart" label="Day starts" type="time" />
          <TextField form={form} name="workdayEnd" label="Day ends" type="time" />
          <p className="col-span-2 text-sm">The rounds planner warns about visits booked outside these hours.</p>
        </div>
      </Panel>
      <div className="col-span-2 flex items-center gap-3">
        <Button type="submit" variant="primary" disabled={save.isPending}>
          Save settings
        </Button>
        <FormMessage message={message && !message.ok ? message.text : null} />
        {message?.ok && (
          <p role="status" className="font-bold text-sev-ok">
            {message.text}
          </p>
        )}
      </div>
    </form>
  );
}

export default island(SettingsPage);
