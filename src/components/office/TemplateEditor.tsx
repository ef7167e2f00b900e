// One checklist template: its details, its versions, and the draft being edited. Published
// versions are read-only; editing starts a draft copied from the latest version.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { get, useFieldArray, useWatch, type UseFormReturn } from 'react-hook-form';
import type { z } from 'zod';
import { PART_KINDS, PART_UNITS } from '../../lib/words';
import { READING_RULES, READING_UNITS, templateContentInput, templateDetailsInput } from '../../lib/office/template-input';
import type { getTemplate, getVersionContent } from '../../lib/server/templates';
import { Button } from '../ui/Button';
import { api, type Json } from './api';
import { FormMessage, showServerError, TextAreaField, TextField, useZodForm } from './form';
import { Panel } from './Panel';
import { island } from './query-client';
import { unitLabel } from './units';

type Template = Json<Awaited<ReturnType<typeof getTemplate>>>;
type Version = Json<Awaited<ReturnType<typeof getVersionContent>>>;
type Content = z.input<typeof templateContentInput>;
type ContentForm = UseFormReturn<Content, unknown, Content>;

const KIND_LABEL = { check: 'Check', reading: 'Reading', part: 'Part' } as const;
const PART_KIND_LABEL = (kind: string) => kind.replace('_', ' ');

function TemplateEditor({ templateId, timeZone }: { templateId: string; timeZone: string }) {
  const queryClient = useQueryClient();
  const template = useQuery({ queryKey: ['template', templateId], queryFn: () => api<Template>(`/api/office/templates/${templateId}`) });
  const [chosen, setChosen] = useState<string | null>(null);
  const versions = template.data?.versions ?? [];
  const draft = versions.find((v) => v.status === 'draft');
  const shownId = chosen ?? draft?.id ?? versions.find((v) => v.status === 'published')?.id ?? versions[0]?.id ?? null;
  const version = useQuery({
    queryKey: ['template-version', shownId],
    queryFn: () => api<{ version: Version }>(`/api/office/template-versions/${shownId}`),
    enabled: shownId !== null,
  });
  const startDraft = useMutation({
    mutationFn: () => api<{ versionId: string }>(`/api/office/templates/${templateId}/draft`, { body: {} }),
    onSuccess: async ({ versionId }) => {
      await queryClient.invalidateQueries({ queryKey: ['template', templateId] });
      setChosen(versionId);
    },
  });
  if (template.isLoading) return <p>Loading…</p>;
  if (template.isError) return <p role="alert">{(template.error as Error).message}</p>;
  const t = template.data!.template;
  const shown = version.data?.version;

  return (
    <div className="grid grid-cols-[minmax(0,1fr)_20rem] items-start gap-5">
      <div className="flex flex-col gap-5">
        {shown && shown.status === 'draft' ? (
          <DraftEditor key={shown.id} version={shown} onDone={() => setChosen(null)} />
        ) : shown ? (
          <Panel
            title={`Version ${shown.version} (${shown.status})`}
            actions={
              <Button variant="primary" onClick={() => (draft ? setChosen(draft.id) : startDraft.mutate())} disabled={startDraft.isPending}>
                {draft ? `Edit the draft (version ${draft.version})` : 'Edit: start a new draft'}
              </Button>
            }
          >
            <p className="mb-3 text-sm">Published versions never change: visits booked with this version keep it. Edits go into a new draft.</p>
            <VersionView version={shown} />
          </Panel>
        ) : (
          <p>Loading the version…</p>
        )}
      </div>
      <div className="flex flex-col gap-5">
        <Panel title="Details">
          <DetailsForm templateId={templateId} initial={{ name: t.name, description: t.description, labourHours: String(t.labourCentiHours / 100) }} />
        </Panel>
        <Panel title="Versions">
          <ol className="flex flex-col gap-1">
            {versions.map((v) => (
              <li key={v.id}>
                <button
                  type="button"
                  onClick={() => setChosen(v.id)}
                  aria-current={v.id === shownId ? 'true' : undefined}
                  className={`w-full rounded border px-2 py-1 text-left ${v.id === shownId ? 'border-brand bg-brand/10' : 'border-ink/20 hover:bg-ink/5'}`}
                >
                  <span className="font-bold">Version {v.version}</span> · {v.status}
                  <span className="block text-sm text-ink/70">
                    {v.publishedAt
                      ? `published ${new Date(v.publishedAt).toLocaleDateString('en-GB', { timeZone })}${v.publishedBy ? ` by ${v.publishedBy}` : ''}`
                      : 'not published'}
                    {` · ${v.visitCount} visit${v.visitCount === 1 ? '' : 's'}`}
                  </span>
                </button>
              </li>
            ))}
          </ol>
        </Panel>
      </div>
    </div>
  );
}

function DetailsForm({ templateId, initial }: { templateId: string; initial: z.input<typeof templateDetailsInput> }) {
  const form = useZodForm(templateDetailsInput, initial);
  const [message, setMessage] = useState<string | null>(null);
  const queryClient = useQueryClient();
  const save = useMutation({
    mutationFn: (values: unknown) => api(`/api/office/templates/${templateId}`, { method: 'PUT', body: values }),
    onSuccess: async () => {
      setMessage(null);
      form.reset(form.getValues());
      await queryClient.invalidateQueries({ queryKey: ['template', templateId] });
    },
    onError: (error) => setMessage(showServerError(form, error)),
  });
  return (
    <form onSubmit={form.handleSubmit((v) => save.mutate(v))} className="flex flex-col gap-3" noValidate>
      <TextField form={form} name="name" label="Name" />
      <TextAreaField form={form} name="description" label="What it covers" rows={2} />
      <TextField form={form} name="labourHours" label="Labour time (hours)" inputMode="decimal" />
      <FormMessage message={message} />
      <div>
        <Button type="submit" disabled={save.isPending || !form.formState.isDirty}>
          Save details
        </Button>
      </div>
    </form>
  );
}

function VersionView({ version }: { version: Version }) {
  return (
    <div className="flex flex-col gap-4">
      {version.sections.map((section) => (
        <section key={section.id}>
          <h3 className="mb-1 font-bold">{section.title}</h3>
          <table className="w-full text-left text-[15px]">
            <tbody>
              {section.items.map((item) => (
                <tr key={item.id} className="border-b border-ink/10 align-top last:border-0">
                  <td className="w-20 py-1 pr-2 text-sm text-ink/70">{KIND_LABEL[item.kind]}</td>
                  <td className="py-1 pr-2">
                    {item.label}
                    {item.caution && <p className="text-sm text-sev-soon">Caution: {item.caution}</p>}
                  </td>
                  <td className="py-1 pr-2 text-sm whitespace-nowrap">
                    {item.kind === 'reading' && (
                      <>
                        {item.expectedMin ?? '…'} to {item.expectedMax ?? '…'} {unitLabel(item.unit)}
                      </>
                    )}
                    {item.kind === 'part' && item.partKind && PART_KIND_LABEL(item.partKind)}
                  </td>
                  <td className="py-1 text-sm text-ink/70">{item.rule ? READING_RULES.find((r) => r.rule === item.rule)?.label : ''}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      ))}
    </div>
  );
}

function toForm(version: Version): Content {
  return {
    sections: version.sections.map((section) => ({
      title: section.title,
      items: section.items.map((item) => ({
        kind: item.kind,
        label: item.label,
        unit: item.unit ?? '',
        expectedMin: item.expectedMin === null ? '' : String(item.expectedMin),
        expectedMax: item.expectedMax === null ? '' : String(item.expectedMax),
        rule: item.rule ?? '',
        partKind: item.partKind ?? '',
        caution: item.caution ?? '',
        hint: item.hint ?? '',
      })),
    })),
  };
}

const blankItem = (): Content['sections'][number]['items'][number] => ({
  kind: 'check',
  label: '',
  unit: '',
  expectedMin: '',
  expectedMax: '',
  rule: '',
  partKind: '',
  caution: '',
  hint: '',
});

function DraftEditor({ version, onDone }: { version: Version; onDone: () => void }) {
  const form = useZodForm(templateContentInput, toForm(version)) as ContentForm;
  const sections = useFieldArray({ control: form.control, name: 'sections' });
  const [message, setMessage] = useState<{ text: string; ok: boolean } | null>(null);
  const queryClient = useQueryClient();
  const refresh = () => queryClient.invalidateQueries({ predicate: (q) => ['template', 'template-version', 'templates'].includes(String(q.queryKey[0])) });
  const save = useMutation({
    mutationFn: (values: Content) => api(`/api/office/template-versions/${version.id}`, { method: 'PUT', body: values }),
    onSuccess: () => {
      form.reset(form.getValues());
      setMessage({ text: 'Draft saved.', ok: true });
    },
    onError: (error) => setMessage({ text: showServerError(form, error), ok: false }),
  });
  const publish = useMutation({
    mutationFn: async (values: Content) => {
      if (form.formState.isDirty) await api(`/api/office/template-versions/${version.id}`, { method: 'PUT', body: values });
      return api(`/api/office/template-versions/${version.id}/publish`, { body: {} });
    },
    onSuccess: async () => {
      await refresh();
      onDone();
    },
    onError: (error) => setMessage({ text: showServerError(form, error), ok: false }),
  });
  const discard = useMutation({
    mutationFn: () => api(`/api/office/template-versions/${version.id}`, { method: 'DELETE' }),
    onSuccess: async () => {
      await refresh();
      onDone();
    },
    onError: (error) => setMessage({ text: (error as Error).message, ok: false }),
  });
  const busy = save.isPending || publish.isPending || discard.isPending;

  return (
    <form onSubmit={form.handleSubmit((v) => save.mutate(v))} noValidate className="flex flex-col gap-4">
      <div className="rounded border-2 border-accent bg-white p-3">
        <p className="font-bold">Draft: version {version.version}</p>
        <p className="text-sm">
          Technicians see this only once it is published. Visits already booked keep the version they were booked with. Cautions are shown to the technician beside the item; the
          vehicle maker’s data and local regulations take precedence over the ranges given here.
        </p>
      </div>
      {sections.fields.map((field, index) => (
        <SectionEditor
          key={field.id}
          form={form}
          index={index}
          count={sections.fields.length}
          onMove={(to) => sections.move(index, to)}
          onRemove={() => sections.remove(index)}
        />
      ))}
      <div>
        <Button onClick={() => sections.append({ title: '', items: [blankItem()] })}>Add a section</Button>
      </div>
      <div className="sticky bottom-0 flex flex-wrap items-center gap-3 border-t border-ink/20 bg-paper py-3">
        <Button type="submit" disabled={busy}>
          {save.isPending ? 'Saving…' : 'Save draft'}
        </Button>
        <Button variant="primary" disabled={busy} onClick={form.handleSubmit((v) => publish.mutate(v))}>
          {publish.isPending ? 'Publishing…' : `Publish version ${version.version}`}
        </Button>
        <Button variant="danger" disabled={busy} onClick={() => window.confirm('Throw this draft away?') && discard.mutate()}>
          Discard draft
        </Button>
        {form.formState.isDirty && <span className="text-sm font-bold">Unsaved changes</span>}
        {message && (
          <p role={message.ok ? 'status' : 'alert'} className={`font-bold ${message.ok ? 'text-sev-ok' : 'text-sev-now'}`}>
            {message.text}
          </p>
        )}
      </div>
    </form>
  );
}

function SectionEditor({ form, index, count, onMove, onRemove }: { form: ContentForm; index: number; count: number; onMove: (to: number) => void; onRemove: () => void }) {
  const items = useFieldArray({ control: form.control, name: `sections.${index}.items` });
  const titleError = (get(form.formState.errors, `sections.${index}.title`) as { message?: string } | undefined)?.message;
  return (
    <fieldset className="rounded border border-ink/20 bg-white p-3">
      <legend className="sr-only">Section {index + 1}</legend>
      <div className="mb-2 flex items-end gap-2">
        <label className="flex flex-1 flex-col gap-1 text-sm font-bold">
          Section {index + 1} title
          <input {...form.register(`sections.${index}.title`)} aria-invalid={Boolean(titleError)} className="min-h-10 rounded border border-ink/40 px-2 text-lg font-bold aria-[invalid=true]:border-sev-now" />
        </label>
        <Button disabled={index === 0} onClick={() => onMove(index - 1)} aria-label={`Move section ${index + 1} up`}>
          ▲
        </Button>
        <Button disabled={index === count - 1} onClick={() => onMove(index + 1)} aria-label={`Move section ${index + 1} down`}>
          ▼
        </Button>
        <Button variant="danger" onClick={onRemove}>
          Remove section
        </Button>
      </div>
      {titleError && <p className="mb-2 text-sm font-bold text-sev-now">Title: {titleError}</p>}
      <ol className="flex flex-col gap-2">
        {items.fields.map((field, itemIndex) => (
          <li key={field.id}>
            <ItemEditor
              form={form}
              section={index}
              index={itemIndex}
              count={items.fields.length}
              onMove={(to) => items.move(itemIndex, to)}
              onRemove={() => items.remove(itemIndex)}
            />
          </li>
        ))}
      </ol>
      <div className="mt-2">
        <Button onClick={() => items.append(blankItem())}>Add an item</Button>
      </div>
    </fieldset>
  );
}

function ItemEditor({ form, section, index, count, onMove, onRemove }: { form: ContentForm; section: number; index: number; count: number; onMove: (to: number) => void; onRemove: () => void }) {
  const path = `sections.${section}.items.${index}` as const;
  const kind = useWatch({ control: form.control, name: `${path}.kind` });
  const errors = get(form.formState.errors, path) as Record<string, { message?: string }> | undefined;
  const problems = errors ? Object.entries(errors).filter(([, e]) => e?.message).map(([k, e]) => `${k}: ${e.message}`) : [];
  const cell = 'min-h-9 rounded border border-ink/40 bg-white px-1 text-[15px] font-normal';
  const n = `${index + 1}`;
  return (
    <div className={`rounded border p-2 ${problems.length ? 'border-2 border-sev-now' : 'border-ink/15'}`}>
      <div className="flex flex-wrap items-end gap-2">
        <span className="w-6 pb-2 text-right text-sm text-ink/60">{n}</span>
        <label className="flex flex-col text-xs font-bold">
          Kind
          <select {...form.register(`${path}.kind`)} className={`${cell} w-28`}>
            {(['check', 'reading', 'part'] as const).map((k) => (
              <option key={k} value={k}>
                {KIND_LABEL[k]}
              </option>
            ))}
          </select>
        </label>
        <label className="flex min-w-48 flex-1 flex-col text-xs font-bold">
          Label
          <input {...form.register(`${path}.label`)} className={cell} />
        </label>
        {kind === 'reading' && (
          <>
            <label className="flex flex-col text-xs font-bold">
              Unit
              <select {...form.register(`${path}.unit`)} className={`${cell} w-24`}>
                <option value="">—</option>
                {READING_UNITS.map((u) => (
                  <option key={u} value={u}>
                    {unitLabel(u) || u}
                  </option>
                ))}
              </select>
            </label>
            <label className="flex flex-col text-xs font-bold">
              Expected from
              <input {...form.register(`${path}.expectedMin`)} inputMode="decimal" className={`${cell} w-24`} />
            </label>
            <label className="flex flex-col text-xs font-bold">
              to
              <input {...form.register(`${path}.expectedMax`)} inputMode="decimal" className={`${cell} w-24`} />
            </label>
            <label className="flex flex-col text-xs font-bold">
              Trade check
              <select {...form.register(`${path}.rule`)} className={`${cell} w-52`}>
                <option value="">None: range only</option>
                {READING_RULES.map((r) => (
                  <option key={r.rule} value={r.rule}>
                    {r.label}
                  </option>
                ))}
              </select>
            </label>
          </>
        )}
        {kind === 'part' && (
          <>
            <label className="flex flex-col text-xs font-bold">
              Counted in
              <select {...form.register(`${path}.unit`)} className={`${cell} w-28`}>
                <option value="">—</option>
                {PART_UNITS.map((u) => (
                  <option key={u} value={u}>
                    {u === 'L' ? 'litres' : 'each'}
                  </option>
                ))}
              </select>
            </label>
            <label className="flex flex-col text-xs font-bold">
              Part from the spec
              <select {...form.register(`${path}.partKind`)} className={`${cell} w-40`}>
                <option value="">None</option>
                {PART_KINDS.map((k) => (
                  <option key={k} value={k}>
                    {PART_KIND_LABEL(k)}
                  </option>
                ))}
              </select>
            </label>
          </>
        )}
        <div className="ml-auto flex gap-1">
          <Button disabled={index === 0} onClick={() => onMove(index - 1)} aria-label={`Move item ${n} up`}>
            ▲
          </Button>
          <Button disabled={index === count - 1} onClick={() => onMove(index + 1)} aria-label={`Move item ${n} down`}>
            ▼
          </Button>
          <Button variant="quiet" onClick={onRemove} aria-label={`Remove item ${n}`}>
            Remove
          </Button>
        </div>
      </div>
      <div className="mt-1 flex gap-2 pl-8">
        <label className="flex flex-1 flex-col text-xs font-bold">
          Caution shown to the technician
          <input {...form.register(`${path}.caution`)} className={cell} placeholder="For example: never work under a car held only by a jack" />
        </label>
        <label className="flex flex-1 flex-col text-xs font-bold">
          Hint
          <input {...form.register(`${path}.hint`)} className={cell} />
        </label>
      </div>
      {problems.length > 0 && (
        <ul role="alert" className="mt-1 pl-8 text-sm font-bold text-sev-now">
          {problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      )}
    </div>
  );
}

export default island(TemplateEditor);
