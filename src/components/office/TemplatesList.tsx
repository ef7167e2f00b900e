// The business's checklist templates, and adding a new one.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { newTemplateInput } from '../../lib/office/template-input';
import type { listTemplates } from '../../lib/server/templates';
import { Button } from '../ui/Button';
import { api, type Json } from './api';
import { Dialog } from './Dialog';
import { FormMessage, showServerError, TextAreaField, TextField, useZodForm } from './form';
import { island } from './query-client';

type Templates = Json<{ templates: Awaited<ReturnType<typeof listTemplates>> }>;

function TemplatesList({ timeZone }: { timeZone: string }) {
  const [adding, setAdding] = useState(false);
  const templates = useQuery({ queryKey: ['templates'], queryFn: () => api<Templates>('/api/office/templates') });
  if (templates.isLoading) return <p>Loading…</p>;
  if (templates.isError) return <p role="alert">{(templates.error as Error).message}</p>;
  return (
    <div className="flex flex-col gap-4">
      <div className="flex">
        <Button variant="primary" className="ml-auto" onClick={() => setAdding(true)}>
          New checklist
        </Button>
      </div>
      <table className="w-full rounded border border-ink/20 bg-white text-left">
        <thead className="bg-ink/5">
          <tr>
            <th className="px-3 py-2">Checklist</th>
            <th className="px-3 py-2">In use</th>
            <th className="px-3 py-2">Draft</th>
            <th className="px-3 py-2">Labour</th>
            <th className="px-3 py-2">Versions</th>
          </tr>
        </thead>
        <tbody>
          {templates.data!.templates.map((t) => (
            <tr key={t.id} className="border-t border-ink/10 align-top">
              <td className="px-3 py-2">
                <a href={`/office/templates/${t.id}`} className="font-bold text-brand underline">
                  {t.name}
                </a>
                <p className="text-sm text-ink/80">{t.description}</p>
              </td>
              <td className="px-3 py-2">
                {t.current ? (
                  <>
                    Version {t.current.version}
                    <span className="block text-sm text-ink/70">
                      published {new Date(t.current.publishedAt!).toLocaleDateString('en-GB', { timeZone, day: 'numeric', month: 'short', year: 'numeric' })}
                    </span>
                  </>
                ) : (
                  <span className="font-bold">Not published yet</span>
                )}
              </td>
              <td className="px-3 py-2">{t.draft ? `Version ${t.draft.version} being edited` : '—'}</td>
              <td className="px-3 py-2">{(t.labourCentiHours / 100).toLocaleString('en-GB')} h</td>
              <td className="px-3 py-2">{t.versionCount}</td>
            </tr>
          ))}
          {templates.data!.templates.length === 0 && (
            <tr>
              <td colSpan={5} className="px-3 py-6 text-center">
                No checklists yet. Add the first one.
              </td>
            </tr>
          )}
        </tbody>
      </table>
      <Dialog open={adding} title="New checklist" onClose={() => setAdding(false)}>
        <NewTemplateForm />
      </Dialog>
    </div>
  );
}

function NewTemplateForm() {
  const form = useZodForm(newTemplateInput, { name: '', description: '', labourHours: '1', sections: [] });
  const [message, setMessage] = useState<string | null>(null);
  const queryClient = useQueryClient();
  const create = useMutation({
    mutationFn: (values: unknown) => api<{ templateId: string }>('/api/office/templates', { body: values }),
    onSuccess: async ({ templateId }) => {
      await queryClient.invalidateQueries({ queryKey: ['templates'] });
      window.location.assign(`/office/templates/${templateId}`);
    },
    onError: (error) => setMessage(showServerError(form, error)),
  });
  return (
    <form onSubmit={form.handleSubmit((v) => create.mutate(v))} className="flex flex-col gap-4" noValidate>
      <TextField form={form} name="name" label="Name" placeholder="For example: Pre-purchase look-over" />
      <TextAreaField form={form} name="description" label="What it covers" rows={2} />
      <TextField form={form} name="labourHours" label="Labour time (hours)" inputMode="decimal" hint="What the office prices a visit of this kind at." />
      <FormMessage message={message} />
      <div>
        <Button type="submit" variant="primary" disabled={create.isPending}>
          Create and edit its first draft
        </Button>
      </div>
    </form>
  );
}

export default island(TemplatesList);
