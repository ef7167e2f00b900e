// One van's minimum for one part, edited in place in the stock table.
import { useState, type SubmitEvent } from 'react';
import { useSend } from './use-send';

type Props = { technicianId: string; partId: string; partNumber: string; minimum: number | null };

export default function MinimumCell({ technicianId, partId, partNumber, minimum }: Props) {
  const [value, setValue] = useState(minimum === null ? '' : String(minimum));
  const { busy, error, setError, send } = useSend();
  const changed = value !== (minimum === null ? '' : String(minimum));

  async function onSubmit(event: SubmitEvent<HTMLFormElement>) {
    event.preventDefault();
    if (value !== '' && !(Number(value) >= 0)) {
      setError('0 or more, or empty for none');
      return;
    }
    const saved = await send('PUT', '/api/office/van-stock/minimums', { technicianId, partId, minimum: value === '' ? null : Number(value) });
    if (saved) window.location.reload();
  }

  return (
    <form onSubmit={onSubmit} className="flex items-center justify-end gap-1">
      <input
        aria-label={`Minimum for ${partNumber}`}
        type="number"
        inputMode="decimal"
        min="0"
        step="any"
        value={value}
        onChange={(e) => {
          setValue(e.target.value);
          setError(null);
        }}
        className="h-9 w-20 rounded border-2 border-ink/40 bg-white px-2 text-right"
        placeholder="none"
      />
      <button type="submit" disabled={!changed || busy} className="h-9 rounded border-2 border-brand px-2 text-sm font-bold text-brand disabled:invisible">
        Save
      </button>
      {error && (
        <span role="alert" className="text-sm font-bold text-sev-now">
          {error}
        </span>
      )}
    </form>
  );
}
