// Edits a draft invoice's lines: quantities, prices, discounts; add and remove lines.
import { useState } from 'react';
import { requestJson } from './request';

type Line = { kind: 'part' | 'labour' | 'other'; description: string; partNumber: string | null; quantity: number; unit: string; unitPriceMinor: number; discountMinor: number };

const toMajor = (minor: number) => (minor / 100).toFixed(2);
const toMinor = (text: string) => Math.round(Number(text) * 100);

export default function InvoiceLinesEditor(props: { invoiceId: string; lines: Line[]; currencySymbol: string }) {
  const [lines, setLines] = useState(props.lines.map((l) => ({ ...l, price: toMajor(l.unitPriceMinor), discount: toMajor(l.discountMinor), qty: String(l.quantity) })));
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const update = (i: number, patch: Partial<(typeof lines)[number]>) => setLines(lines.map((l, n) => (n === i ? { ...l, ...patch } : l)));

  async function save() {
    setBusy(true);
    setError(null);
    try {
      await requestJson(`/api/office/invoices/${props.invoiceId}`, 'PUT', {
        lines: lines.map((l) => ({
          kind: l.kind,
          description: l.description,
          partNumber: l.partNumber || null,
          quantity: Number(l.qty),
          unit: l.unit,
          unitPriceMinor: toMinor(l.price),
          discountMinor: toMinor(l.discount || '0'),
        })),
      });
      window.location.reload();
    } catch (e) {
      setError((e as Error).message);
      setBusy(false);
    }
  }

  const input = 'w-full rounded border border-ink/30 px-2 py-1';
  return (
    <div>
      <table className="w-full text-sm">
        <thead>
          <tr className="border-b border-ink/20 text-left">
            <th className="py-1 pr-2">Description</th>
            <th className="w-28 py-1 pr-2">Part no.</th>
            <th className="w-20 py-1 pr-2">Qty</th>
            <th className="w-20 py-1 pr-2">Unit</th>
            <th className="w-28 py-1 pr-2">Unit price ({props.currencySymbol})</th>
            <th className="w-24 py-1 pr-2">Discount</th>
            <th className="w-20 py-1"><span className="sr-only">Remove</span></th>
          </tr>
        </thead>
        <tbody>
          {lines.map((l, i) => (
            <tr key={i} className="border-b border-ink/10">
              <td className="py-1 pr-2"><input aria-label={`Line ${i + 1} description`} className={input} value={l.description} onChange={(e) => update(i, { description: e.target.value })} /></td>
              <td className="py-1 pr-2"><input aria-label={`Line ${i + 1} part number`} className={input} value={l.partNumber ?? ''} onChange={(e) => update(i, { partNumber: e.target.value })} /></td>
              <td className="py-1 pr-2"><input aria-label={`Line ${i + 1} quantity`} inputMode="decimal" className={input} value={l.qty} onChange={(e) => update(i, { qty: e.target.value })} /></td>
              <td className="py-1 pr-2"><input aria-label={`Line ${i + 1} unit`} className={input} value={l.unit} onChange={(e) => update(i, { unit: e.target.value })} /></td>
              <td className="py-1 pr-2"><input aria-label={`Line ${i + 1} unit price`} inputMode="decimal" className={input} value={l.price} onChange={(e) => update(i, { price: e.target.value })} /></td>
              <td className="py-1 pr-2"><input aria-label={`Line ${i + 1} discount`} inputMode="decimal" className={input} value={l.discount} onChange={(e) => update(i, { discount: e.target.value })} /></td>
              <td className="py-1"><button type="button" className="min-h-9 rounded border border-ink/30 px-2" onClick={() => setLines(lines.filter((_, n) => n !== i))}>Remove</button></td>
            </tr>
          ))}
        </tbody>
      </table>
      <div className="mt-3 flex items-center gap-3">
        <button
          type="button"
          className="min-h-10 rounded border-2 border-ink px-4 font-bold"
          onClick={() => setLines([...lines, { kind: 'other', description: '', partNumber: null, quantity: 1, unit: '{each}', unitPriceMinor: 0, discountMinor: 0, price: '0.00', discount: '0.00', qty: '1' }])}
        >
          Add a line
        </button>
        <button type="button" disabled={busy} onClick={save} className="min-h-10 rounded bg-brand px-4 font-bold text-white disabled:opacity-60">
          {busy ? 'Saving…' : 'Save lines'}
        </button>
        {error && <span role="alert" className="text-sm font-bold text-sev-now">{error}</span>}
      </div>
    </div>
  );
}
