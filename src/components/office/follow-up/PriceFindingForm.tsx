// The office prices a finding as advised work (net of tax).
import { useState } from 'react';
import { requestJson } from './request';

export default function PriceFindingForm(props: { findingId: string; description: string; priceMinor: number | null; labourCentiHours: number | null; label?: string }) {
  const [description, setDescription] = useState(props.description);
  const [price, setPrice] = useState(props.priceMinor === null ? '' : (props.priceMinor / 100).toFixed(2));
  const [hours, setHours] = useState(props.labourCentiHours === null ? '' : String(props.labourCentiHours / 100));
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function save() {
    setBusy(true);
    setError(null);
    try {
      if (!/^\d+(\.\d{1,2})?$/.test(price.trim())) throw new Error('Enter the price as an amount, for example 85.00.');
      await requestJson(`/api/office/findings/${props.findingId}/advised`, 'PUT', {
        description,
        priceMinor: Math.round(Number(price) * 100),
        labourCentiHours: Math.round(Number(hours || '0') * 100),
      });
      window.location.reload();
    } catch (e) {
      setError((e as Error).message);
      setBusy(false);
    }
  }
  return (
    <div className="flex flex-wrap items-end gap-2 text-sm">
      <label className="flex flex-col">
        <span>Work to offer</span>
        <input value={description} onChange={(e) => setDescription(e.target.value)} className="min-h-10 w-72 rounded border border-ink/30 px-2" />
      </label>
      <label className="flex flex-col">
        <span>Price before tax</span>
        <input value={price} inputMode="decimal" onChange={(e) => setPrice(e.target.value)} className="min-h-10 w-28 rounded border border-ink/30 px-2" />
      </label>
      <label className="flex flex-col">
        <span>Labour (h)</span>
        <input value={hours} inputMode="decimal" onChange={(e) => setHours(e.target.value)} className="min-h-10 w-20 rounded border border-ink/30 px-2" />
      </label>
      <button type="button" disabled={busy} onClick={save} className="min-h-10 rounded bg-brand px-4 font-bold text-white disabled:opacity-60">
        {props.label ?? 'Save price'}
      </button>
      {error && <span role="alert" className="font-bold text-sev-now">{error}</span>}
    </div>
  );
}
