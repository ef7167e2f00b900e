// The office records a trip to a licensed site with a van's used oil.
import { useState, type SubmitEvent } from 'react';
import { useSend } from './use-send';
import { FormMessage } from '../office/form';

type Props = { vans: { technicianId: string; technicianName: string; heldL: number }[] };

const input = 'min-h-10 rounded border-2 border-ink/50 bg-white px-2 font-normal';

function nowForInput(): string {
  const d = new Date();
  d.setMinutes(d.getMinutes() - d.getTimezoneOffset());
  return d.toISOString().slice(0, 16);
}

export default function DisposalForm({ vans }: Props) {
  const [technicianId, setTechnicianId] = useState(vans[0]?.technicianId ?? '');
  const [litres, setLitres] = useState(String(vans[0]?.heldL || ''));
  const { busy, error, setError, send } = useSend();

  async function onSubmit(event: SubmitEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const when = String(form.get('disposedAt') ?? '');
    if (!when || !(Number(litres) > 0) || !String(form.get('siteName') ?? '').trim()) {
      setError('Give the date and time, the licensed site and the litres (above zero).');
      return;
    }
    const saved = await send('POST', '/api/office/used-oil/disposals', {
      technicianId,
      // The browser's local time, sent as an instant.
      disposedAt: new Date(when).toISOString(),
      siteName: String(form.get('siteName')),
      siteLicence: String(form.get('siteLicence') ?? ''),
      reference: String(form.get('reference') ?? ''),
      litres: Number(litres),
    });
    if (saved) window.location.reload();
  }

  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-3 rounded border-2 border-ink/20 bg-white p-4" aria-label="Record a disposal">
      <h2 className="text-lg font-bold">Record a disposal</h2>
      <div className="grid grid-cols-2 gap-3">
        <label className="flex flex-col text-sm font-bold">
          From the van of
          <select
            value={technicianId}
            onChange={(e) => {
              setTechnicianId(e.target.value);
              const held = vans.find((v) => v.technicianId === e.target.value)?.heldL;
              setLitres(held ? String(held) : '');
            }}
            className={input}
          >
            {vans.map((v) => (
              <option key={v.technicianId} value={v.technicianId}>
                {v.technicianName}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col text-sm font-bold">
          When
          <input name="disposedAt" type="datetime-local" defaultValue={nowForInput()} className={input} />
        </label>
        <label className="col-span-2 flex flex-col text-sm font-bold">
          Licensed site
          <input name="siteName" maxLength={200} className={input} placeholder="Name and address of the site" />
        </label>
        <label className="flex flex-col text-sm font-bold">
          Site permit or licence number
          <input name="siteLicence" maxLength={100} className={input} />
        </label>
        <label className="flex flex-col text-sm font-bold">
          Transfer note reference
          <input name="reference" maxLength={100} className={input} />
        </label>
        <label className="flex flex-col text-sm font-bold">
          Litres handed over
          <input type="number" inputMode="decimal" min="0" step="0.1" value={litres} onChange={(e) => setLitres(e.target.value)} className={input} />
        </label>
      </div>
      <p className="text-sm">Prefilled with what the van collected since its last disposal; enter what the site measured.</p>
      <FormMessage message={error} />
      <button type="submit" disabled={busy || vans.length === 0} className="min-h-11 rounded bg-brand px-4 font-bold text-white disabled:opacity-60">
        {busy ? 'Saving…' : 'Record the disposal'}
      </button>
    </form>
  );
}
