// The owner's list of people: add someone, change a role.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { newPersonInput } from '../../lib/office/people-input';
import { USER_ROLES, type UserRole } from '../../lib/words';
import { Button } from '../ui/Button';
import { api } from './api';
import { FormMessage, SelectField, showServerError, TextField, useZodForm } from './form';
import { Panel } from './Panel';
import { island } from './query-client';

type Person = { id: string; name: string; email: string; role: UserRole };

const ROLE_LABEL: Record<UserRole, string> = {
  owner: 'Owner: everything, plus people and settings',
  office: 'Office: customers, rounds, review, billing',
  technician: 'Technician: their own round on the phone',
};

function People({ me }: { me: string }) {
  const queryClient = useQueryClient();
  const people = useQuery({ queryKey: ['people'], queryFn: () => api<{ people: Person[] }>('/api/office/people') });
  const [message, setMessage] = useState<string | null>(null);
  const change = useMutation({
    mutationFn: ({ id, role }: { id: string; role: UserRole }) => api(`/api/office/people/${id}`, { method: 'PUT', body: { role } }),
    onSuccess: () => {
      setMessage(null);
      return queryClient.invalidateQueries({ queryKey: ['people'] });
    },
    onError: (error) => {
      setMessage((error as Error).message);
      return queryClient.invalidateQueries({ queryKey: ['people'] });
    },
  });
  return (
    <div className="grid grid-cols-[minmax(0,3fr)_minmax(0,2fr)] items-start gap-5">
      <Panel title="People">
        <FormMessage message={message} />
        <table className="w-full text-left">
          <thead>
            <tr className="border-b border-ink/20">
              <th className="py-2 pr-3">Name</th>
              <th className="py-2 pr-3">E-mail</th>
              <th className="py-2">Role</th>
            </tr>
          </thead>
          <tbody>
            {people.data?.people.map((p) => (
              <tr key={p.id} className="border-b border-ink/10">
                <td className="py-2 pr-3 font-bold">
                  {p.name} {p.id === me && <span className="font-normal">(you)</span>}
                </td>
                <td className="py-2 pr-3">{p.email}</td>
                <td className="py-2">
                  <select
                    aria-label={`Role of ${p.name}`}
                    value={p.role}
                    disabled={change.isPending}
                    onChange={(e) => change.mutate({ id: p.id, role: e.target.value as UserRole })}
                    className="min-h-10 rounded border border-ink/40 bg-white px-2"
                  >
                    {USER_ROLES.map((r) => (
                      <option key={r} value={r}>
                        {r}
                      </option>
                    ))}
                  </select>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        <ul className="mt-3 text-sm text-ink/80">
          {USER_ROLES.map((r) => (
            <li key={r}>{ROLE_LABEL[r]}</li>
          ))}
        </ul>
      </Panel>
      <Panel title="Add a person">
        <AddPerson />
      </Panel>
    </div>
  );
}

function AddPerson() {
  const form = useZodForm(newPersonInput, { name: '', email: '', role: 'technician', password: '' });
  const [message, setMessage] = useState<{ text: string; ok: boolean } | null>(null);
  const queryClient = useQueryClient();
  const add = useMutation({
    mutationFn: (values: unknown) => api<{ person: Person }>('/api/office/people', { body: values }),
    onSuccess: async ({ person }) => {
      form.reset();
      setMessage({ text: `${person.name} can now sign in with the password you gave them.`, ok: true });
      await queryClient.invalidateQueries({ queryKey: ['people'] });
    },
    onError: (error) => setMessage({ text: showServerError(form, error), ok: false }),
  });
  return (
    <form onSubmit={form.handleSubmit((v) => add.mutate(v))} className="flex flex-col gap-3" noValidate>
      <TextField form={form} name="name" label="Name" />
      <TextField form={form} name="email" label="E-mail" type="email" />
      <SelectField form={form} name="role" label="Role" options={USER_ROLES.map((r) => ({ value: r, label: r }))} />
      <TextField form={form} name="password" label="First password" type="password" autoComplete="new-password" hint="At least 10 characters. Give it to them in person." />
      {message && (
        <p role={message.ok ? 'status' : 'alert'} className={`font-bold ${message.ok ? 'text-sev-ok' : 'text-sev-now'}`}>
          {message.text}
        </p>
      )}
      <div>
        <Button type="submit" variant="primary" disabled={add.isPending}>
          Add person
        </Button>
      </div>
    </form>
  );
}

export default island(People);
