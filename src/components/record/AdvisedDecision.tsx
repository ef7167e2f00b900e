// The customer's approve / decline buttons for one item of advised work on the record's link.
import { useState } from 'react';

type Decision = 'pending' | 'approved' | 'declined';

export default function AdvisedDecision(props: { token: string; advisedId: string; decision: Decision; booked: boolean; price: string }) {
  const [decision, setDecision] = useState<Decision>(props.decision);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function decide(next: 'approved' | 'declined') {
    setBusy(true);
    setError(null);
    try {
      const response = await fetch(`/api/public/record/${props.token}/advised/${props.advisedId}`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ decision: next }),
      });
      const body = (await response.json().catch(() => ({}))) as { error?: string };
      if (!response.ok) throw new Error(body.error ?? 'That did not work. Try again, or call us.');
      setDecision(next);
    } catch (e) {
      setError(e instanceof Error && e.message !== 'Failed to fetch' ? e.message : 'No connection. Try again when you have signal.');
    } finally {
      setBusy(false);
    }
  }

  if (props.booked) {
    return <p className="rounded-lg bg-sev-ok/10 p-3 font-bold text-sev-ok">Approved and booked. We will be in touch with the date.</p>;
  }
  return (
    <div className="mt-3" data-advised={props.advisedId}>
      <p role="status" aria-live="polite" className="mb-2 text-base font-bold">
        {decision === 'approved' && <span className="text-sev-ok">✔ You approved this work. We will call you to book it.</span>}
        {decision === 'declined' && <span className="text-ink/80">You declined this work for now.</span>}
      </p>
      <div className="grid grid-cols-2 gap-3">
        <button
          type="button"
          disabled={busy || decision === 'approved'}
          onClick={() => decide('approved')}
          className="min-h-14 rounded-lg bg-brand px-4 text-lg font-bold text-white disabled:opacity-50"
        >
          Approve {props.price}
        </button>
        <button
          type="button"
          disabled={busy || decision === 'declined'}
          onClick={() => decide('declined')}
          className="min-h-14 rounded-lg border-2 border-ink px-4 text-lg font-bold disabled:opacity-50"
        >
          Not now
        </button>
      </div>
      {error && (
        <p role="alert" className="mt-2 font-bold text-sev-now">
          {error}
        </p>
      )}
    </div>
  );
}
