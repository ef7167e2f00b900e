// Model notes: known weak spots by make, model and engine, shown on every matching visit.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ColumnDef } from '@tanstack/react-table';
import { useState } from 'react';
import { modelNoteInput, type ModelNoteInput } from '../../lib/office/model-note-input';
import { Button } from '../ui/Button';
import { api } from './api';
import { DataTable } from './DataTable';
import { Dialog } from './Dialog';
import { FormMessage, showServerError, TextAreaField, TextField, useZodForm } from './form';
import { island } from './query-client';
import { tableStateFrom, useServerTable } from './server-table';

type Note = ModelNoteInput & { id: string };

function ModelNotes({ search }: { search: string }) {
  const table = useServerTable<Note>('/api/office/model-notes', tableStateFrom(search, { sort: 'make' }));
  const [editing, setEditing] = useState<Note | 'new' | null>(null);
  const columns: ColumnDef<Note, unknown>[] = [
    { id: 'make', header: 'Make and model', cell: ({ row }) => <strong>{`${row.original.make} ${row.original.model}`}</strong> },
    { id: 'engine', header: 'Engine', enableSorting: false, cell: ({ row }) => row.original.engine || 'every engine' },
    {
      id: 'title',
      header: 'Note',
      enableSorting: false,
      cell: ({ row }) => (
        <div>
          <p className="font-bold">{row.original.title}</p>
          <p className="text-sm">{row.original.body}</p>
        </div>
      ),
    },
    {
      id: 'edit',
      header: '',
      enableSorting: false,
      cell: ({ row }) => (
        <Button variant="quiet" onClick={() => setEditing(row.original)} aria-label={`Edit note: ${row.original.title}`}>
          Edit
        </Button>
      ),
    },
  ];
  return (
    <>
      <DataTable
        label="Model notes"
        table={table}
        columns={columns}
        rowKey={(row) => row.id}
        searchPlaceholder="Make, model, engine or title"
        empty="No model notes match."
        actions={
          <Button variant="primary" onClick={() => setEditing('new')}>
            New model note
          </Button>
        }
      />
      <Dialog open={editing !== null} title={editing === 'new' ? 'New model note' : 'Edit model note'} onClose={() => setEditing(null)}>
        {editing && <NoteForm note={editing === 'new' ? null : editing} onSaved={() => setEditing(null)} />}
      </Dialog>
    </>
  );
}

function NoteForm({ note, onSaved }: { note: Note | null; onSaved: () => void }) {
  const form = useZodForm(modelNoteInput, note ?? { make: '', model: '', engine: '', title: '', body: '' });
  const [message, setMessage] = useState<string | null>(null);
  const queryClient = useQueryClient();
  const save = useMutation({
    mutationFn: (values: unknown) =>
      note ? api(`/api/office/model-notes/${note.id}`, { method: 'PUT', body: values }) : api('/api/office/model-notes', { body: values }),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: ['/api/office/model-notes'] });
      onSaved();
    },
    onError: (error) => setMessage(showServerError(form, error)),
  });
  return (
    <form onSubmit={form.handleSubmit((v) => save.mutate(v))} noValidate className="grid grid-cols-3 gap-3">
      <TextField form={form} name="make" label="Make" />
      <TextField form={form} name="model" label="Model" />
      <TextField form={form} name="engine" label="Engine" hint="Leave empty for every engine." />
      <TextField form={form} name="title" label="Title" className="col-span-3" />
      <TextAreaField form={form} name="body" label="What to look for, and what to advise" rows={4} className="col-span-3" />
      <div className="col-span-3 flex flex-col gap-2">
        <FormMessage message={message} />
        <div>
          <Button type="submit" variant="primary" disabled={save.isPending}>
            Save note
          </Button>
        </div>
      </div>
    </form>
  );
}

export default island(ModelNotes);
