// The office loads a van from the store, or takes parts back: several lines, one submit.
import { useState, type SubmitEvent } from 'react';
import { useSend } from './use-send';
import { FormMessage } from '../office/form';

type PartOption = { id: string; partNumber: string; description: string; unit: string };
type Props = { technicianId: string; technicianName: string; parts: PartOption[] };
type Line = { key: number; partId: string; quantity: string };

const input = 'min-h-10 rounded border-2 border-ink/50 bg-white px-2';

export default function RestockForm({ technicianId, technicianName, parts }: Props) {
  const [lines, setLines] = useState<Line[]>([{ key: 0, partId: '', quantity: '' }]);
  const [reason, setReason] = useState<'restock' | 'returned'>('restock');
  const [note, setNote] = useState('');
  const { busy, error, setError, send } = useSend();
  const unitOf = (partId: string) => parts.find((p) => p.id === partId)?.unit;

  const update = (key: number, change: Partial<Line>) => setLines((all) => all.map((l) => (l.key === key ? { ...l, ...change } : l)));

  async function onSubmit(event: SubmitEvent<HTMLFormElement>) {
    event.preventDefault();
    const filled = lines.filter((l) => l.partId || l.quantity);
    if (filled.length === 0 || filled.some((l) => !l.partId || !(Number(l.quantity) > 0))) {
      setError('Choose a part and a quantity above zero on every line.');
      return;
    }
    const saved = await send('POST', '/api/office/van-stock/movements', {
      technicianId,
      reason,
      note,
      lines: filled.map((l) => ({ partId: l.partId, quantity: Number(l.quantity) })),
    });
    if (saved) window.location.reload();
  }

  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-3 rounded border-2 border-ink/20 bg-white p-4" aria-label={`Restock ${technicianName}'s van`}>
      <h2 className="text-lg font-bold">Load or unload {technicianName}’s van</h2>
      <fieldset className="flex gap-4">
        <legend className="sr-only">Direction</legend>
        <label className="flex items-center gap-2">
          <input type="radio" name="reason" checked={reason === 'restock'} onChange={() => setReason('restock')} className="size-5" />
          Load from the store
        </label>
        <label className="flex items-center gap-2">
          <input type="radio" name="reason" checked={reason === 'returned'} onChange={() => setReason('returned')} className="size-5" />
          Return to the store
        </label>
      </fieldset>
      {lines.map((line, index) => (
        <div key={line.key} className="flex items-end gap-2">
          <label className="flex min-w-0 flex-1 flex-col text-sm font-bold">
            Part {index + 1}
            <select value={line.partId} onChange={(e) => update(line.key, { partId: e.target.value })} className={`${input} w-full min-w-0 font-normal`}>
              <option value="">Choose a part…</option>
              {parts.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.partNumber} · {p.description}
                </option>
              ))}
            </select>
          </label>
          <label className="flex w-24 shrink-0 flex-col text-sm font-bold">
            Quantity{unitOf(line.partId) === 'L' ? ' (L)' : ''}
            <input
              type="number"
              inputMode="decimal"
              min="0"
              step={unitOf(line.partId) === 'L' ? '0.1' : '1'}
              value={line.quantity}
              onChange={(e) => update(line.key, { quantity: e.target.value })}
              className={`${input} w-full font-normal`}
            />
          </label>
          {lines.length > 1 && (
            <button type="button" onClick={() => setLines((all) => all.filter((l) => l.key !== line.key))} className="min-h-10 rounded border-2 border-ink/40 px-3" aria-label={`Remove line ${index + 1}`}>
              Remove
            </button>
          )}
        </div>
      ))}
      <button
        type="button"
        onClick={() => setLines((all) => [...all, { key: Math.max(...all.map((l) => l.key)) + 1, partId: '', quantity: '' }])}
        className="min-h-10 self-start rounded border-2 border-brand px-3 font-bold text-brand"
      >
        Add a line
      </button>
      <label className="flex flex-col text-sm font-bold">
        Note
        <input value={note} onChange={(e) => setNote(e.target.value)} maxLength={500} className={`${input} font-normal`} placeholder="e.g. Monday load" />
      </label>
      <FormMessage message={error} />
      <button type="submit" disabled={busy} className="min-h-11 rounded bg-brand px-4 font-bold text-white disabled:opacity-60">
        {busy ? 'Saving…' : reason === 'restock' ? 'Record the load' : 'Record the return'}
      </button>
    </form>
  );
}
