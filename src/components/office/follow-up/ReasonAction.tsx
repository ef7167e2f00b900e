// An action that needs a sentence of reason first (crediting an invoice).
import { useState } from 'react';
import { requestJson } from './request';

export default function ReasonAction(props: { url: string; label: string; placeholder: string }) {
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  if (!open) {
    return (
      <button type="button" onClick={() => setOpen(true)} className="min-h-10 rounded border-2 border-sev-now bg-white px-4 font-bold text-sev-now">
        {props.label}
      </button>
    );
  }
  async function submit() {
    setBusy(true);
    setError(null);
    try {
      await requestJson(props.url, 'POST', { reason });
      window.location.reload();
    } catch (e) {
      setError((e as Error).message);
      setBusy(false);
    }
  }
  return (
    <div className="flex flex-wrap items-center gap-2">
      <label className="flex items-center gap-2">
        <span>Reason</span>
        <input value={reason} onChange={(e) => setReason(e.target.value)} placeholder={props.placeholder} className="min-h-10 w-96 rounded border border-ink/30 px-2" />
      </label>
      <button type="button" disabled={busy} onClick={submit} className="min-h-10 rounded bg-sev-now px-4 font-bold text-white disabled:opacity-60">
        {props.label}
      </button>
      <button type="button" onClick={() => setOpen(false)} className="min-h-10 rounded border border-ink/30 px-3">Cancel</button>
      {error && <span role="alert" className="text-sm font-bold text-sev-now">{error}</span>}
    </div>
  );
}
