// Parts fitted on this visit: the checklist's parts from the vehicle's spec, and anything else
// taken from the van (wipers, bulbs). Quantities in the part's own unit (L or each).
import { useState } from 'react';
import type { LocalPart, LocalPartLine } from '../../lib/device/db';
import { savePartLine } from '../../lib/device/visit-actions';
import { suggestPart } from '../../lib/device/part-suggestion';
import { itemSkipped } from '../../lib/device/visit-progress';
import { formatNumber, withUnit } from '../phone/format';
import type { TabProps } from './VisitScreen';
import { useRecorder } from './use-recorder';

// Oil is poured by the litre and read off a jug in tenths; counted parts go one at a time.
const STEP: Record<string, number> = { L: 0.1, '{each}': 1 };

export default function PartsTab({ device, data, locked }: TabProps) {
  const [picking, setPicking] = useState(false);
  const { db } = device;
  const { run, alert } = useRecorder(device);
  const visitId = data.visit.id;
  const lines = data.partLines.filter((l) => !l.removed);
  const partItems = data.version?.sections.flatMap((s) => s.items).filter((i) => i.kind === 'part') ?? [];
  const open = partItems.filter((item) => !lines.some((l) => l.itemId === item.id) && !itemSkipped(item, data));

  const change = (line: LocalPartLine, patch: Partial<LocalPartLine>) =>
    run(() => savePartLine(db, visitId, { lineId: line.id, itemId: line.itemId, partId: line.partId, partNumber: line.partNumber, description: line.description, quantity: line.quantity, unit: line.unit, removed: line.removed, ...patch }));

  function addFromVan(part: LocalPart) {
    setPicking(false);
    void run(() => savePartLine(db, visitId, { itemId: null, partId: part.id, partNumber: part.partNumber, description: part.description, quantity: 1, unit: part.unit }));
  }

  return (
    <div className="flex flex-col gap-5 p-3">
      {alert}
      <section className="flex flex-col gap-2">
        <h2 className="text-xl font-bold">Fitted on this visit</h2>
        {lines.length === 0 && <p>Nothing fitted yet.</p>}
        <ul className="flex flex-col gap-2">
          {lines.map((line) => {
            const step = STEP[line.unit] ?? 1;
            const label = partItems.find((i) => i.id === line.itemId)?.label;
            return (
              <li key={line.id} className="flex flex-col gap-2 rounded-xl border-2 border-ink/15 bg-white p-3">
                <div>
                  <p className="text-lg font-bold">{line.partNumber}</p>
                  <p>{line.description}</p>
                  {label && <p className="text-base text-ink/80">For: {label}</p>}
                </div>
                <div className="flex items-center gap-2">
                  <button
                    type="button"
                    disabled={locked || line.quantity - step <= 0}
                    onClick={() => void change(line, { quantity: Math.round((line.quantity - step) * 10) / 10 })}
                    aria-label={`Less ${line.partNumber}`}
                    className="size-14 rounded-lg border-2 border-ink/40 text-3xl font-bold disabled:opacity-40"
                  >
                    −
                  </button>
                  <span className="min-w-24 text-center font-mono text-2xl font-bold" aria-label={`Quantity of ${line.partNumber}`}>
                    {withUnit(formatNumber(line.quantity), line.unit === '{each}' ? null : line.unit)}
                  </span>
                  <button
                    type="button"
                    disabled={locked}
                    onClick={() => void change(line, { quantity: Math.round((line.quantity + step) * 10) / 10 })}
                    aria-label={`More ${line.partNumber}`}
                    className="size-14 rounded-lg border-2 border-ink/40 text-3xl font-bold disabled:opacity-40"
                  >
                    +
                  </button>
                  <button type="button" disabled={locked} onClick={() => void change(line, { removed: true })} className="ml-auto min-h-14 rounded-lg border-2 border-sev-now px-3 font-bold text-sev-now disabled:opacity-40">
                    Remove
                  </button>
                </div>
              </li>
            );
          })}
        </ul>
      </section>

      {!locked && open.length > 0 && (
        <section className="flex flex-col gap-2">
          <h2 className="text-xl font-bold">From the checklist, not fitted yet</h2>
          <ul className="flex flex-col gap-2">
            {open.map((item) => {
              const suggestion = suggestPart(item, data.vehicle, data.parts);
              return (
                <li key={item.id} className="rounded-xl border-2 border-dashed border-ink/30 bg-white p-3">
                  <p className="font-bold">{item.label}</p>
                  {suggestion ? (
                    <button
                      type="button"
                      onClick={() => void run(() => savePartLine(db, visitId, { itemId: item.id, ...suggestion }))}
                      className="mt-2 flex min-h-14 w-full items-center justify-between rounded-lg border-2 border-brand px-3 font-bold text-brand"
                    >
                      <span>
                        {suggestion.partNumber} × {withUnit(suggestion.quantity, suggestion.unit)}
                      </span>
                      <span>Fitted</span>
                    </button>
                  ) : (
                    <p className="text-base">Not on this vehicle’s spec: add the part below if you fitted one.</p>
                  )}
                </li>
              );
            })}
          </ul>
        </section>
      )}

      {!locked && (
        <section className="flex flex-col gap-2">
          {picking ? (
            <>
              <h2 className="text-xl font-bold">Add a part from the van</h2>
              <ul className="flex flex-col gap-2">
                {data.parts.map((part) => (
                  <li key={part.id}>
                    <button type="button" onClick={() => addFromVan(part)} className="flex min-h-14 w-full flex-col justify-center rounded-lg border-2 border-ink/30 bg-white px-3 text-left">
                      <span className="font-bold">{part.partNumber}</span>
                      <span className="text-base">{part.description}</span>
                    </button>
                  </li>
                ))}
              </ul>
              <button type="button" onClick={() => setPicking(false)} className="min-h-14 rounded-lg border-2 border-ink/40 font-bold">
                Cancel
              </button>
            </>
          ) : (
            <button type="button" onClick={() => setPicking(true)} className="min-h-14 rounded-lg bg-brand text-lg font-bold text-white">
              Add a part
            </button>
          )}
        </section>
      )}
    </div>
  );
}
