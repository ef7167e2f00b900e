// Today's round (and the days around it that are on the phone): each visit in order, with its
// slot, place, vehicle, progress, and whether everything it needs offline is on the phone.
import { useEffect, useState } from 'react';
import type { Device } from '../../lib/device/boot';
import type { StorageState } from '../../lib/device/pwa';
import { markStorageNoticeSeen, storageNoticeSeen } from '../../lib/device/settings';
import type { LocalCustomer, LocalVehicle, LocalVisit } from '../../lib/device/db';
import { visitProgress, type Progress } from '../../lib/device/visit-progress';
import { formatDay, formatTime, todayIso } from '../phone/format';
import { useLiveQuery, useShellCached } from '../phone/hooks';
import { Plate } from '../visit/Plate';

type RoundRow = {
  visit: LocalVisit;
  customer?: LocalCustomer;
  vehicle?: LocalVehicle;
  templateName?: string;
  progress: Progress | null;
  signedOff: boolean;
  ready: boolean;
};

async function loadRound({ db }: Device): Promise<RoundRow[]> {
  const visits = (await db.visits.toArray()).filter((v) => !v.gone);
  visits.sort((a, b) => a.roundDate.localeCompare(b.roundDate) || a.roundPosition - b.roundPosition);
  return Promise.all(
    visits.map(async (visit) => {
      const [customer, vehicle, version, checks, readings, partLines, signOff] = await Promise.all([
        db.customers.get(visit.customerId),
        db.vehicles.get(visit.vehicleId),
        db.templateVersions.get(visit.templateVersionId),
        db.checkResults.where('visitId').equals(visit.id).toArray(),
        db.readingResults.where('visitId').equals(visit.id).toArray(),
        db.partLines.where('visitId').equals(visit.id).toArray(),
        db.signOffs.get(visit.id),
      ]);
      return {
        visit,
        customer,
        vehicle,
        templateName: version?.name,
        progress: version ? visitProgress(version, { checks, readings, partLines }) : null,
        signedOff: !!signOff,
        ready: !!(customer && vehicle && version),
      };
    }),
  );
}

export function RoundScreen({ device }: { device: Device }) {
  const loaded = useLiveQuery(() => loadRound(device), [device]);
  const shellCached = useShellCached();
  const [storage, setStorage] = useState<StorageState | null>(null);
  useEffect(() => {
    void Promise.all([device.storage, storageNoticeSeen()]).then(([state, seen]) => setStorage(seen ? null : state));
  }, [device]);
  const today = todayIso();
  if (!loaded) return <p className="p-4">Loading the round…</p>;
  // A visit is ready offline once its data is on the phone and the app itself is cached.
  const rows = loaded.map((row) => ({ ...row, ready: row.ready && shellCached }));

  const earlierOpen = rows.filter((r) => r.visit.roundDate < today && !r.signedOff && r.visit.status !== 'signed_off');
  const todays = rows.filter((r) => r.visit.roundDate === today);
  const later = rows.filter((r) => r.visit.roundDate > today);

  return (
    <main className="flex flex-1 flex-col gap-6 px-3 py-4">
      <section aria-labelledby="today-heading" className="flex flex-col gap-3">
        <h2 id="today-heading" className="text-2xl font-bold">
          Today · {formatDay(today)}
        </h2>
        <p className="text-base">Signed in as {device.user.name}.</p>
        {(storage === 'refused' || storage === 'unsupported') && (
          <div className="rounded-lg border-2 border-sev-soon bg-white p-3 text-base" role="status" data-testid="storage-warning">
            <strong>This browser may clear the app’s data</strong> if the phone runs low on storage, so sync whenever you have signal. Installing Tickover to the home screen
            usually lets it keep the data. <a href="/device" className="font-bold underline">More on This phone</a>
            <button
              type="button"
              onClick={() => {
                setStorage(null);
                void markStorageNoticeSeen();
              }}
              className="mt-2 block min-h-12 rounded-lg border-2 border-ink/40 px-4 font-bold"
            >
              Got it
            </button>
          </div>
        )}
        {!shellCached && (
          <p className="rounded-lg border-2 border-sev-watch bg-white p-3 text-base" role="status">
            Getting the app ready to work without signal. Keep it open while you have signal.
          </p>
        )}
        {todays.length === 0 ? (
          <p className="rounded-lg border-2 border-dashed border-ink/30 p-4">
            No visits for today on this phone. If you expect some, sync when you have signal.
          </p>
        ) : (
          <ol className="flex flex-col gap-3">
            {todays.map((row, index) => (
              <VisitCard key={row.visit.id} row={row} number={index + 1} />
            ))}
          </ol>
        )}
      </section>
      {earlierOpen.length > 0 && <DayList title="Earlier, not signed off" rows={earlierOpen} />}
      {groupByDay(later).map(([day, dayRows]) => (
        <DayList key={day} title={formatDay(day)} rows={dayRows} />
      ))}
    </main>
  );
}

function groupByDay(rows: RoundRow[]): [string, RoundRow[]][] {
  const days = new Map<string, RoundRow[]>();
  for (const row of rows) days.set(row.visit.roundDate, [...(days.get(row.visit.roundDate) ?? []), row]);
  return [...days.entries()];
}

function DayList({ title, rows }: { title: string; rows: RoundRow[] }) {
  return (
    <section className="flex flex-col gap-3">
      <h2 className="text-xl font-bold">{title}</h2>
      <ol className="flex flex-col gap-3">
        {rows.map((row, index) => (
          <VisitCard key={row.visit.id} row={row} number={index + 1} />
        ))}
      </ol>
    </section>
  );
}

function statusText(row: RoundRow): string {
  if (row.signedOff || row.visit.status === 'signed_off') return 'Signed off';
  if (['reviewed', 'invoiced', 'paid'].includes(row.visit.status)) return 'Done, reviewed';
  if (row.progress && row.progress.done > 0) return `In progress · ${row.progress.done} of ${row.progress.total}`;
  return row.progress ? `Not started · ${row.progress.total} items` : 'Not started';
}

// `number` is the visit's place in its day as shown (the office's order, counted from 1).
function VisitCard({ row, number }: { row: RoundRow; number: number }) {
  const { visit, customer, vehicle } = row;
  const done = row.signedOff || ['signed_off', 'reviewed', 'invoiced', 'paid'].includes(visit.status);
  return (
    <li>
      <a
        href={`/visit?id=${visit.id}`}
        className="flex flex-col gap-2 rounded-xl border-2 border-ink/20 bg-white p-4 shadow-sm active:bg-paper"
        aria-label={`Visit ${number}: ${customer?.name ?? 'customer'}, ${vehicle?.registration ?? ''}`}
      >
        <div className="flex items-center gap-3">
          <span className="flex size-10 shrink-0 items-center justify-center rounded-full bg-brand text-lg font-bold text-white">
            {number}
          </span>
          <span className="text-xl font-bold">
            {formatTime(visit.slotStart)}–{formatTime(visit.slotEnd)}
          </span>
          {vehicle && <Plate registration={vehicle.registration} className="ml-auto" />}
        </div>
        <div>
          <p className="text-xl font-bold">{customer?.name ?? 'Customer details not on this phone yet'}</p>
          <p>
            {visit.addressLines}
            {visit.postcode && `, ${visit.postcode}`}
          </p>
          {visit.accessNotes && <p className="text-ink/80">Access: {visit.accessNotes}</p>}
        </div>
        {vehicle && (
          <p className="font-bold">
            {vehicle.make} {vehicle.model} · {vehicle.engine}
            {row.templateName && <span className="font-normal"> · {row.templateName}</span>}
          </p>
        )}
        <div className="flex flex-wrap items-center gap-x-4 gap-y-1 border-t border-ink/15 pt-2">
          <span className={done ? 'font-bold text-sev-ok' : 'font-bold'}>{statusText(row)}</span>
          <ReadyMark ready={row.ready} />
        </div>
      </a>
    </li>
  );
}

function ReadyMark({ ready }: { ready: boolean }) {
  return ready ? (
    <span className="ml-auto inline-flex items-center gap-1.5 font-bold text-sev-ok" data-testid="ready-offline">
      <svg width="22" height="22" viewBox="0 0 24 24" aria-hidden="true">
        <path d="M12 2 21 6v6c0 5-4 9-9 10-5-1-9-5-9-10V6z" fill="currentColor" />
        <path d="M7.5 12.5l3 3 6-6.5" fill="none" stroke="#fff" strokeWidth="2.5" strokeLinecap="round" strokeLinejoin="round" />
      </svg>
      Ready offline
    </span>
  ) : (
    <span className="ml-auto inline-flex items-center gap-1.5 font-bold text-sev-soon">
      <svg width="22" height="22" viewBox="0 0 24 24" aria-hidden="true">
        <circle cx="12" cy="12" r="10" fill="none" stroke="currentColor" strokeWidth="2.5" strokeDasharray="4 3" />
      </svg>
      Needs a sync
    </span>
  );
}
