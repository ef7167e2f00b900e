// The technician's load list on the phone: what to pick from the store for the next round, and
// for today's. It reads the copy kept in the phone's database (lib/device/load-lists.ts), so it
// opens with no signal; with signal it brings the copy up to date and says when it last did.
import { useEffect, useRef, useState } from 'react';
import type { Device } from '../../lib/device/boot';
import type { LocalLoadList } from '../../lib/device/db';
import { datesToKeep, phoneDay } from '../../lib/device/load-list-days';
import { PhoneShell } from '../phone/PhoneShell';
import { useLiveQuery, useOnline } from '../phone/hooks';
import { formatTime, todayIso } from '../phone/format';
import LoadListSheet from './LoadListSheet';

export default function VanApp() {
  return (
    <PhoneShell title="Load list" back={{ href: '/round', label: 'Round' }}>
      {(device) => <LoadListScreen device={device} />}
    </PhoneShell>
  );
}

// Opening the screen right after a sync run need not ask again: the run has just fetched it.
const FRESH_ENOUGH_MS = 60_000;

const shortDay = new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short' });

function dayLabel(date: string): string {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  return shortDay.format(new Date(y, m - 1, d));
}

/** "today at 18:42", or "on Mon 11 May at 18:42" for an older copy. */
function whenFetched(copy: LocalLoadList): string {
  const at = formatTime(copy.fetchedAt);
  const day = todayIso(new Date(copy.fetchedAt));
  return day === todayIso() ? `today at ${at}` : `on ${dayLabel(day)} at ${at}`;
}

function LoadListScreen({ device }: { device: Device }) {
  const { db } = device;
  const online = useOnline();
  const days = useLiveQuery(() => datesToKeep(db, new Date()), [db]);
  const [choice, setChoice] = useState<'today' | 'next'>('next');
  const date = days ? days[choice] : null;
  // The date travels with the copy: until the query for a newly chosen day answers, the hook
  // still holds the previous day's.
  const saved = useLiveQuery(async () => (date ? { date, copy: await db.loadLists.get(date) } : null), [db, date]);
  const checked = useRef<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);

  async function update(roundDate: string) {
    setBusy(true);
    setProblem(null);
    try {
      const { fetchLoadList } = await import('../../lib/device/load-lists');
      await fetchLoadList({ db, fetch: (...args) => fetch(...args) }, roundDate);
    } catch (error) {
      const { OfflineError, SignedOutError } = await import('../../lib/device/http');
      if (error instanceof SignedOutError) {
        window.location.assign(`/sign-in?next=${encodeURIComponent('/van')}`);
        return;
      }
      setProblem(error instanceof OfflineError ? 'No signal: showing the copy kept on this phone.' : error instanceof Error ? error.message : String(error));
    } finally {
      setBusy(false);
    }
  }

  // On showing a day with signal, bring its copy up to date once, unless a sync run just did;
  // later updates are the technician's tap or the next sync run.
  useEffect(() => {
    if (!saved || saved.date !== date || checked.current === date) return;
    checked.current = date;
    setProblem(null);
    const age = saved.copy ? Date.now() - Date.parse(saved.copy.fetchedAt) : Infinity;
    if (age > FRESH_ENOUGH_MS && navigator.onLine) void update(date);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [date, saved]);

  if (!days || !date || !saved || saved.date !== date) return <p className="p-4">Opening the load list…</p>;
  const copy = saved.copy;
  const nextLabel = days.next === phoneDay(new Date(), 1) ? 'Tomorrow' : dayLabel(days.next);

  return (
    <div className="flex flex-1 flex-col">
      <main className="flex flex-1 flex-col gap-4 px-3 py-4">
        <p className="rounded-lg border-2 border-ink/20 bg-white p-3 text-base" role="status" data-testid="load-list-freshness">
          {copy ? (
            <>
              <strong>Last brought up to date {whenFetched(copy)}.</strong> Kept on this phone, so it opens without signal.
              {!online && <span className="block font-bold">No signal now: this is the copy on the phone.</span>}
            </>
          ) : busy ? (
            'Fetching the load list…'
          ) : online ? (
            'No copy of this list on the phone yet.'
          ) : (
            <strong>No copy of this list on the phone yet, and no signal. It is fetched with the round when the phone next has signal.</strong>
          )}
        </p>
        {problem && (
          <p role="alert" className="rounded-lg border-2 border-sev-soon bg-white p-3 font-bold">
            {problem}
          </p>
        )}
        {copy && <LoadListSheet list={copy.list} />}
      </main>
      <div className="sticky bottom-0 z-10 flex flex-col gap-2 border-t-2 border-ink/15 bg-white p-2 print:hidden">
        <div className="grid grid-cols-2 gap-2" role="group" aria-label="Which round">
          {(['today', 'next'] as const).map((which) => (
            <button
              key={which}
              type="button"
              aria-pressed={choice === which}
              onClick={() => setChoice(which)}
              className={`min-h-14 rounded-lg border-2 border-brand px-3 text-lg font-bold ${choice === which ? 'bg-brand text-white' : 'bg-white text-brand'}`}
            >
              {which === 'today' ? 'Today' : nextLabel}
            </button>
          ))}
        </div>
        <div className="grid grid-cols-2 gap-2">
          <button
            type="button"
            onClick={() => void update(date)}
            disabled={busy}
            className="min-h-14 rounded-lg border-2 border-ink/40 bg-white px-3 text-lg font-bold disabled:opacity-60"
          >
            {busy ? 'Updating…' : 'Update'}
          </button>
          <button type="button" onClick={() => window.print()} disabled={!copy} className="min-h-14 rounded-lg bg-brand-dark px-3 text-lg font-bold text-white disabled:opacity-60">
            Print
          </button>
        </div>
      </div>
    </div>
  );
}
