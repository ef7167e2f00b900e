// The load list as a sheet: what to pick from the store first, then the detail. The same sheet
// serves the phone (from the device's saved copy), the office and paper.
import type { RoundLoadList } from '../../lib/van/load-list-contract';
import { formatDay, formatPacking, formatQuantity, formatTime } from './format';
import { EnoughMark, ShortMark } from './Marks';

type Props = { list: RoundLoadList; timeZone?: string; dense?: boolean };

export default function LoadListSheet({ list, timeZone, dense = false }: Props) {
  const toPick = list.lines.filter((l) => l.pickQuantity > 0);
  const cell = dense ? 'px-2 py-1.5' : 'px-2 py-2';
  return (
    <article className="flex flex-col gap-6" aria-label={`Load list for ${formatDay(list.roundDate)}`}>
      <header>
        <p className="text-base font-bold uppercase tracking-wide text-brand">Load list</p>
        <h2 className="text-2xl font-bold">{formatDay(list.roundDate)}</h2>
        <p>
          {list.technician.name} · {list.visits.length === 1 ? '1 visit' : `${list.visits.length} visits`}
        </p>
      </header>

      {list.visits.length === 0 && <p className="rounded border-2 border-ink/30 bg-white p-4">No visits are booked for this round.</p>}

      {list.visits.length > 0 && (
        <section aria-labelledby="pick-heading" className="flex flex-col gap-2">
          <h3 id="pick-heading" className="text-xl font-bold">
            Pick from the store
          </h3>
          {toPick.length === 0 ? (
            <p className="flex items-center gap-2 rounded border-2 border-sev-ok bg-white p-4 font-bold">
              <EnoughMark label="Enough" />
              The van holds everything this round needs.
            </p>
          ) : (
            <ul className="flex flex-col divide-y-2 divide-ink/10 rounded border-2 border-ink/30 bg-white">
              {toPick.map((line) => (
                <li key={line.part.id} className="flex min-h-14 items-center gap-3 px-3 py-2">
                  <ShortMark label="Short" />
                  <div className="min-w-0 flex-1">
                    <p className="font-mono text-lg font-bold">{line.part.partNumber}</p>
                    <p className="text-base">{line.part.description}</p>
                  </div>
                  <p className="text-right text-xl font-bold" data-testid={`pick-${line.part.partNumber}`}>
                    {line.pick ? formatPacking(line.pick) : line.part.unit === 'L' ? formatQuantity(line.pickQuantity, 'L') : `× ${line.pickQuantity}`}
                  </p>
                </li>
              ))}
            </ul>
          )}
        </section>
      )}

      {list.gaps.length > 0 && (
        <section aria-labelledby="gaps-heading" className="rounded border-2 border-sev-soon bg-white p-3">
          <h3 id="gaps-heading" className="flex items-center gap-2 text-lg font-bold">
            <ShortMark label="Check" />
            Check before you go
          </h3>
          <p className="text-base">These visits may need parts the list could not work out:</p>
          <ul className="ml-6 list-disc">
            {list.gaps.map((gap) => (
              <li key={gap}>{gap}</li>
            ))}
          </ul>
        </section>
      )}

      {list.grades.length > 0 && (
        <section aria-labelledby="grades-heading">
          <h3 id="grades-heading" className="mb-1 text-xl font-bold">
            Oil by grade
          </h3>
          <table className="w-full border-collapse bg-white text-left">
            <thead>
              <tr className="border-b-2 border-ink/40">
                <th className={cell}>Grade</th>
                <th className={`${cell} text-right`}>Needed</th>
                <th className={`${cell} text-right`}>In van</th>
                <th className={`${cell} text-right`}>Short</th>
              </tr>
            </thead>
            <tbody>
              {list.grades.map((g) => (
                <tr key={g.oilGrade} className="border-b border-ink/15">
                  <td className={`${cell} font-bold`}>{g.oilGrade}</td>
                  <td className={`${cell} text-right`}>{formatQuantity(g.needed, 'L')}</td>
                  <td className={`${cell} text-right`}>{formatQuantity(g.onHand, 'L')}</td>
                  <td className={`${cell} text-right font-bold`}>{g.shortfall > 0 ? formatQuantity(g.shortfall, 'L') : '–'}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      )}

      {list.lines.length > 0 && (
        <section aria-labelledby="parts-heading">
          <h3 id="parts-heading" className="mb-1 text-xl font-bold">
            Everything the round needs
          </h3>
          <table className="w-full border-collapse bg-white text-left">
            <thead>
              <tr className="border-b-2 border-ink/40">
                <th className={cell}>Part</th>
                <th className={`${cell} text-right`}>Needed</th>
                <th className={`${cell} text-right`}>In van</th>
              </tr>
            </thead>
            <tbody>
              {list.lines.map((line) => (
                <tr key={line.part.id} className="border-b border-ink/15 align-top">
                  <td className={cell}>
                    <span className="font-mono font-bold">{line.part.partNumber}</span>
                    <span className="block text-base">{line.part.description}</span>
                  </td>
                  <td className={`${cell} text-right`}>
                    <span className="font-bold">{formatQuantity(line.needed, line.part.unit)}</span>
                    {line.neededInContainers && <span className="block text-base">{formatPacking(line.neededInContainers)}</span>}
                  </td>
                  <td className={`${cell} text-right`}>
                    <span className="inline-flex items-center gap-1">
                      {line.shortfall > 0 ? <ShortMark label="Short" /> : <EnoughMark label="Enough" />}
                      {formatQuantity(line.onHand, line.part.unit)}
                    </span>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      )}

      {list.visits.length > 0 && (
        <section aria-labelledby="visits-heading">
          <h3 id="visits-heading" className="mb-1 text-xl font-bold">
            Visits in round order
          </h3>
          <ol className="flex flex-col gap-2">
            {list.visits.map((visit) => (
              <li key={visit.id} className="rounded border-2 border-ink/20 bg-white p-3">
                <p className="font-bold">
                  {visit.position}. {formatTime(visit.slotStart, timeZone)} · <span className="font-mono">{visit.registration}</span>
                </p>
                <p className="text-base">
                  {visit.vehicle} · {visit.checklist} · {visit.postcode}
                </p>
                {visit.parts.length > 0 && (
                  <p className="text-base">
                    {visit.parts.map((p) => `${p.partNumber} × ${formatQuantity(p.quantity, p.unit)}`).join(', ')}
                  </p>
                )}
              </li>
            ))}
          </ol>
        </section>
      )}

      <section aria-labelledby="used-oil-heading" className="rounded border-2 border-ink/20 bg-white p-3">
        <h3 id="used-oil-heading" className="text-lg font-bold">
          Used oil
        </h3>
        <p>
          The van holds <strong>{formatQuantity(list.usedOil.heldL, 'L')}</strong> of used oil; this round drains about{' '}
          <strong>{formatQuantity(list.usedOil.expectedL, 'L')}</strong> more.
        </p>
        <p className="text-base">
          Used oil and filters are hazardous waste: keep them sealed, and take them to a licensed site. Local waste rules apply.
        </p>
      </section>

      <p className="text-base">
        Quantities come from each vehicle’s spec in Tickover. The vehicle maker’s data and local regulations take precedence over the values shown.
      </p>
    </article>
  );
}
