// Adding or editing a customer.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { customerInput, type CustomerFormValues } from '../../lib/office/customer-input';
import { Button } from '../ui/Button';
import { api } from './api';
import { FormMessage, showServerError, TextAreaField, TextField, useZodForm } from './form';

type Saved = { customer: { id: string } };

export function CustomerForm({
  customerId,
  initial,
  onSaved,
}: {
  customerId?: string;
  initial?: Partial<CustomerFormValues>;
  onSaved: (id: string) => void;
}) {
  const form = useZodForm(customerInput, {
    name: '',
    email: '',
    phone: '',
    addressLines: '',
    postcode: '',
    notes: '',
    ...initial,
  });
  const [message, setMessage] = useState<string | null>(null);
  const queryClient = useQueryClient();
  const save = useMutation({
    mutationFn: (values: CustomerFormValues) =>
      customerId
        ? api<Saved>(`/api/office/customers/${customerId}`, { method: 'PUT', body: values })
        : api<Saved>('/api/office/customers', { method: 'POST', body: values }),
    onSuccess: async (saved) => {
      setMessage(null);
      await queryClient.invalidateQueries();
      onSaved(saved.customer.id);
    },
    onError: (error) => setMessage(showServerError(form, error)),
  });
  return (
    <form onSubmit={form.handleSubmit((values) => save.mutate(values))} className="grid max-w-3xl grid-cols-2 gap-4" noValidate>
      <TextField form={form} name="name" label="Name" className="col-span-2" />
      <TextField form={form} name="phone" label="Phone" type="tel" inputMode="tel" />
      <TextField form={form} name="email" label="E-mail" type="email" inputMode="email" />
      <TextField form={form} name="addressLines" label="Address (where the vehicle usually stands)" className="col-span-2" />
      <TextField form={form} name="postcode" label="Postcode" />
      <TextAreaField form={form} name="notes" label="Notes for the office" className="col-span-2" />
      <div className="col-span-2 flex flex-col gap-3">
        <FormMessage message={message} />
        {save.isSuccess && customerId && !form.formState.isDirty && <p role="status">Saved.</p>}
        <div>
          <Button type="submit" variant="primary" disabled={save.isPending}>
            {save.isPending ? 'Saving…' : customerId ? 'Save customer' : 'Add customer'}
          </Button>
        </div>
      </div>
    </form>
  );
}
