// A stock count: the office enters what is actually in the van; the difference is recorded.
import { useState, type SubmitEvent } from 'react';
import { useSend } from './use-send';
import { FormMessage } from '../office/form';

type PartOption = { id: string; partNumber: string; description: string; unit: string };
type Props = { technicianId: string; parts: PartOption[] };

const input = 'min-h-10 rounded border-2 border-ink/50 bg-white px-2 font-normal';

export default function StockCountForm({ technicianId, parts }: Props) {
  const { busy, error, setError, send } = useSend();
  const [done, setDone] = useState<string | null>(null);

  async function onSubmit(event: SubmitEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const partId = String(form.get('partId') ?? '');
    const counted = String(form.get('counted') ?? '');
    if (!partId || counted === '' || !(Number(counted) >= 0)) {
      setError('Choose the part and enter the quantity counted (0 or more).');
      return;
    }
    const result = await send<{ difference: number }>('POST', '/api/office/van-stock/count', {
      technicianId,
      partId,
      counted: Number(counted),
      note: String(form.get('note') ?? ''),
    });
    if (!result) return;
    if (result.difference === 0) {
      setDone('The count agrees with the recorded level; nothing was changed.');
      return;
    }
    window.location.reload();
  }

  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-3 rounded border-2 border-ink/20 bg-white p-4" aria-label="Stock count">
      <h2 className="text-lg font-bold">Stock count</h2>
      <label className="flex flex-col text-sm font-bold">
        Part
        <select name="partId" className={`${input} w-full min-w-0`} defaultValue="">
          <option value="">Choose a part…</option>
          {parts.map((p) => (
            <option key={p.id} value={p.id}>
              {p.partNumber} · {p.description}
            </option>
          ))}
        </select>
      </label>
      <div className="flex gap-2">
        <label className="flex w-32 flex-col text-sm font-bold">
          Counted
          <input name="counted" type="number" inputMode="decimal" min="0" step="any" className={input} />
        </label>
        <label className="flex flex-1 flex-col text-sm font-bold">
          Note
          <input name="note" maxLength={500} className={input} placeholder="e.g. Friday count" />
        </label>
      </div>
      <FormMessage message={error} />
      {done && <p role="status">{done}</p>}
      <button type="submit" disabled={busy} className="min-h-11 rounded border-2 border-brand px-4 font-bold text-brand disabled:opacity-60">
        {busy ? 'Saving…' : 'Record the count'}
      </button>
    </form>
  );
}
