// Starts a card payment for the record's invoice and moves to the payment page.
import { useState } from 'react';

export default function PayButton(props: { token: string; label: string }) {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function pay() {
    setBusy(true);
    setError(null);
    try {
      const response = await fetch(`/api/public/record/${props.token}/pay`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{}' });
      const body = (await response.json().catch(() => ({}))) as { url?: string; error?: string };
      if (!response.ok || !body.url) throw new Error(body.error ?? 'The payment could not start. Try again in a minute.');
      window.location.assign(body.url);
    } catch (e) {
      setError(e instanceof Error && e.message !== 'Failed to fetch' ? e.message : 'No connection. Try again when you have signal.');
      setBusy(false);
    }
  }

  return (
    <div>
      {error && (
        <p role="alert" className="mb-2 font-bold text-sev-now">
          {error}
        </p>
      )}
      <button type="button" onClick={pay} disabled={busy} className="min-h-14 w-full rounded-lg bg-brand px-6 text-xl font-bold text-white disabled:opacity-60">
        {busy ? 'Opening the payment page…' : props.label}
      </button>
    </div>
  );
}
