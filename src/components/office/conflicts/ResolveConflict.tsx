// Settling one conflict: keep what stands or use the other value, optionally keeping the value not
// chosen as a note. On a signed-off visit, using the other value reopens the visit, which voids
// the customer's sign-off; the button says so and asks first.
import { useId, useState } from 'react';
import { requestJson } from '../follow-up/request';

type Props = { conflictId: string; locked: boolean; hasStanding: boolean };

export default function ResolveConflict({ conflictId, locked, hasStanding }: Props) {
  const [keepNote, setKeepNote] = useState(true);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const noteId = useId();

  async function resolve(use: 'standing' | 'proposed') {
    if (use === 'proposed' && locked && !window.confirm('Reopen the visit? This voids the customer’s sign-off; the technician will need to sign off again.')) return;
    setBusy(true);
    setError(null);
    try {
      await requestJson(`/api/office/conflicts/${conflictId}/resolve`, 'POST', { use, keepOtherAsNote: keepNote, reopen: use === 'proposed' && locked });
      window.location.reload();
    } catch (e) {
      setError((e as Error).message);
      setBusy(false);
    }
  }

  return (
    <div className="flex flex-col gap-2">
      <button
        type="button"
        disabled={busy}
        onClick={() => resolve('standing')}
        className="min-h-10 rounded border-2 border-ink bg-white px-3 font-bold disabled:opacity-60"
      >
        {hasStanding ? 'Keep what stands' : 'Do not apply it'}
      </button>
      <button type="button" disabled={busy} onClick={() => resolve('proposed')} className="min-h-10 rounded bg-brand px-3 font-bold text-white disabled:opacity-60">
        {locked ? 'Reopen visit and apply' : 'Use the other value'}
      </button>
      <label htmlFor={noteId} className="flex min-h-10 items-center gap-2 text-sm">
        <input id={noteId} type="checkbox" checked={keepNote} onChange={(e) => setKeepNote(e.target.checked)} className="size-5 accent-brand" />
        Keep the value not chosen as a note
      </label>
      {error && (
        <p role="alert" className="text-sm font-bold text-sev-now">
          {error}
        </p>
      )}
    </div>
  );
}
