// The parts catalogue: add a part, change its prices, supplier and whether it is still stocked,
// and set the container sizes each oil comes in.
import { useState, type SubmitEvent } from 'react';
import type { CataloguePart } from '../../lib/server/catalogue';
import { formatMoney } from '../../lib/trade/money';
import { parseMoney } from '../../lib/billing/money';
import { formatMajorAmount } from '../../lib/office/money-input';
import { useSend } from './use-send';
import { FormMessage } from '../office/form';

type Props = { parts: CataloguePart[]; kinds: readonly string[]; currency: string };

const input = 'min-h-10 w-full rounded border-2 border-ink/50 bg-white px-2 font-normal';
const kindLabel = (kind: string) => kind.replace('_', ' ');

/** "7.20" → 720 in a two-digit currency; null when it is not an amount. */
const toMinor = (text: string, currency: string) => parseMoney(text, currency) ?? null;

function sizesFrom(text: string): number[] | null {
  const sizes = text.split(/[,\s]+/).filter(Boolean).map(Number);
  return sizes.every((s) => Number.isFinite(s) && s > 0) ? sizes : null;
}

function AddPart({ kinds, currency }: { kinds: readonly string[]; currency: string }) {
  const [kind, setKind] = useState('oil_filter');
  const { busy, error, setError, send } = useSend();

  async function onSubmit(event: SubmitEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const text = (name: string) => String(form.get(name) ?? '').trim();
    const costMinor = toMinor(text('cost'), currency);
    const priceMinor = toMinor(text('price'), currency);
    if (costMinor === null || priceMinor === null) {
      setError('Give the cost and the price as amounts, e.g. 7.20.');
      return;
    }
    const created = await send('POST', '/api/office/parts', {
      partNumber: text('partNumber'),
      description: text('description'),
      kind,
      unit: kind === 'oil' ? 'L' : text('unit') || '{each}',
      oilGrade: kind === 'oil' ? text('oilGrade') : null,
      costMinor,
      priceMinor,
      supplier: text('supplier'),
    });
    if (created) window.location.reload();
  }

  return (
    <form onSubmit={onSubmit} aria-label="Add a part" className="grid grid-cols-[repeat(4,minmax(0,1fr))] items-end gap-3 rounded border-2 border-ink/20 bg-white p-4">
      <h2 className="col-span-4 text-lg font-bold">Add a part</h2>
      <label className="flex flex-col text-sm font-bold">
        Part number
        <input name="partNumber" required maxLength={60} className={input} />
      </label>
      <label className="col-span-2 flex flex-col text-sm font-bold">
        Description
        <input name="description" required maxLength={200} className={input} />
      </label>
      <label className="flex flex-col text-sm font-bold">
        Kind
        <select value={kind} onChange={(e) => setKind(e.target.value)} className={input}>
          {kinds.map((k) => (
            <option key={k} value={k}>
              {kindLabel(k)}
            </option>
          ))}
        </select>
      </label>
      {kind === 'oil' ? (
        <label className="flex flex-col text-sm font-bold">
          SAE grade
          <input name="oilGrade" required placeholder="5W-30" className={input} />
        </label>
      ) : (
        <label className="flex flex-col text-sm font-bold">
          Counted in
          <select name="unit" className={input} defaultValue="{each}">
            <option value="{each}">each</option>
            <option value="L">litres</option>
          </select>
        </label>
      )}
      <label className="flex flex-col text-sm font-bold">
        Cost ({currency}{kind === 'oil' ? ' per L' : ''})
        <input name="cost" inputMode="decimal" required className={input} />
      </label>
      <label className="flex flex-col text-sm font-bold">
        Price ({currency}{kind === 'oil' ? ' per L' : ''})
        <input name="price" inputMode="decimal" required className={input} />
      </label>
      <label className="flex flex-col text-sm font-bold">
        Supplier
        <input name="supplier" maxLength={120} className={input} />
      </label>
      <div className="col-span-3">
        <FormMessage message={error} />
      </div>
      <button type="submit" disabled={busy} className="min-h-11 rounded bg-brand px-4 font-bold text-white disabled:opacity-60">
        {busy ? 'Adding…' : 'Add the part'}
      </button>
    </form>
  );
}

function EditRow({ part, currency, onDone }: { part: CataloguePart; currency: string; onDone: () => void }) {
  const { busy, error, setError, send } = useSend();

  async function onSubmit(event: SubmitEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const text = (name: string) => String(form.get(name) ?? '').trim();
    const costMinor = toMinor(text('cost'), currency);
    const priceMinor = toMinor(text('price'), currency);
    const sizes = part.kind === 'oil' ? sizesFrom(text('sizes')) : [];
    if (costMinor === null || priceMinor === null) return setError('Give the cost and the price as amounts, e.g. 7.20.');
    if (sizes === null) return setError('Give container sizes in litres, separated by commas, e.g. 1, 5.');
    const saved = await send('PATCH', `/api/office/parts/${part.id}`, {
      description: text('description'),
      costMinor,
      priceMinor,
      supplier: text('supplier'),
      active: form.get('active') === 'on',
      ...(part.kind === 'oil' ? { oilGrade: text('oilGrade') } : {}),
    });
    if (!saved) return;
    if (part.kind === 'oil' && !(await send('PUT', `/api/office/parts/${part.id}/containers`, { sizesL: sizes }))) return;
    onDone();
    window.location.reload();
  }

  return (
    <tr className="border-b-2 border-brand bg-brand/5">
      <td colSpan={8} className="p-3">
        <form onSubmit={onSubmit} aria-label={`Edit ${part.partNumber}`} className="grid grid-cols-6 items-end gap-3">
          <label className="col-span-2 flex flex-col text-sm font-bold">
            Description
            <input name="description" defaultValue={part.description} className={input} />
          </label>
          {part.kind === 'oil' && (
            <label className="flex flex-col text-sm font-bold">
              SAE grade
              <input name="oilGrade" defaultValue={part.oilGrade ?? ''} className={input} />
            </label>
          )}
          <label className="flex flex-col text-sm font-bold">
            Cost ({currency})
            <input name="cost" inputMode="decimal" defaultValue={formatMajorAmount(part.costMinor, currency)} className={input} />
          </label>
          <label className="flex flex-col text-sm font-bold">
            Price ({currency})
            <input name="price" inputMode="decimal" defaultValue={formatMajorAmount(part.priceMinor, currency)} className={input} />
          </label>
          <label className="flex flex-col text-sm font-bold">
            Supplier
            <input name="supplier" defaultValue={part.supplier} className={input} />
          </label>
          {part.kind === 'oil' && (
            <label className="flex flex-col text-sm font-bold">
              Containers (L)
              <input name="sizes" defaultValue={part.containerSizesL.join(', ')} placeholder="1, 5" className={input} />
            </label>
          )}
          <label className="flex min-h-10 items-center gap-2 font-bold">
            <input type="checkbox" name="active" defaultChecked={part.active} className="size-5" />
            Still stocked
          </label>
          <div className="col-span-3">
            <FormMessage message={error} />
          </div>
          <div className="col-span-2 flex justify-end gap-2">
            <button type="button" onClick={onDone} className="min-h-10 rounded border-2 border-ink px-4 font-bold">
              Cancel
            </button>
            <button type="submit" disabled={busy} className="min-h-10 rounded bg-brand px-4 font-bold text-white disabled:opacity-60">
              {busy ? 'Saving…' : 'Save'}
            </button>
          </div>
        </form>
      </td>
    </tr>
  );
}

export default function PartsCatalogue({ parts, kinds, currency }: Props) {
  const [editing, setEditing] = useState<string | null>(null);
  return (
    <div className="flex flex-col gap-5">
      <AddPart kinds={kinds} currency={currency} />
      <table className="w-full border-collapse bg-white text-left">
        <thead>
          <tr className="border-b-2 border-ink/40">
            <th className="px-2 py-2">Part</th>
            <th className="px-2 py-2">Kind</th>
            <th className="px-2 py-2">Unit</th>
            <th className="px-2 py-2">Containers</th>
            <th className="px-2 py-2 text-right">Cost</th>
            <th className="px-2 py-2 text-right">Price</th>
            <th className="px-2 py-2">Supplier</th>
            <th className="px-2 py-2">
              <span className="sr-only">Edit</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {parts.map((part) =>
            editing === part.id ? (
              <EditRow key={part.id} part={part} currency={currency} onDone={() => setEditing(null)} />
            ) : (
              <tr key={part.id} className={`border-b border-ink/15 ${part.active ? '' : 'text-ink/60'}`}>
                <td className="px-2 py-1.5">
                  <span className="font-mono font-bold">{part.partNumber}</span> {part.description}
                  {!part.active && <span className="ml-2 rounded border border-ink/40 px-1 text-sm">no longer stocked</span>}
                </td>
                <td className="px-2 py-1.5">{part.oilGrade ? `oil ${part.oilGrade}` : kindLabel(part.kind)}</td>
                <td className="px-2 py-1.5">{part.unit === 'L' ? 'litres' : 'each'}</td>
                <td className="px-2 py-1.5">{part.kind === 'oil' ? part.containerSizesL.map((s) => `${s} L`).join(', ') || 'none set' : ''}</td>
                <td className="px-2 py-1.5 text-right">{formatMoney(part.costMinor, currency)}</td>
                <td className="px-2 py-1.5 text-right">{formatMoney(part.priceMinor, currency)}</td>
                <td className="px-2 py-1.5">{part.supplier || '–'}</td>
                <td className="px-2 py-1.5 text-right">
                  <button type="button" onClick={() => setEditing(part.id)} className="min-h-9 rounded border-2 border-brand px-3 font-bold text-brand" aria-label={`Edit ${part.partNumber}`}>
                    Edit
                  </button>
                </td>
              </tr>
            ),
          )}
        </tbody>
      </table>
    </div>
  );
}
