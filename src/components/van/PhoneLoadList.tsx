// The technician's load list on the phone. The last copy fetched for each day is kept on the
// device (idb-keyval), so the list opens with no signal in the store or at the first visit.
import { useCallback, useEffect, useState } from 'react';
import { get, set } from 'idb-keyval';
import type { RoundLoadList } from '../../lib/server/load-list';
import { api, ApiError } from '../office/api';
import LoadListSheet from './LoadListSheet';
import { formatTime } from './format';

type Saved = { list: RoundLoadList; savedAt: string };
type Day = 'today' | 'tomorrow';

const cacheKey = (date: string) => `tickover:load-list:${date}`;

/** The phone's own calendar date, `offset` days on (the phone keeps the business's local time). */
function localDate(offset: number): string {
  const d = new Date();
  d.setDate(d.getDate() + offset);
  return [d.getFullYear(), String(d.getMonth() + 1).padStart(2, '0'), String(d.getDate()).padStart(2, '0')].join('-');
}

export default function PhoneLoadList() {
  const [day, setDay] = useState<Day>('tomorrow');
  const [saved, setSaved] = useState<Saved | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const [signedOut, setSignedOut] = useState(false);
  const [busy, setBusy] = useState(false);
  const date = localDate(day === 'today' ? 0 : 1);

  const refresh = useCallback(async () => {
    setBusy(true);
    try {
      const fresh = { list: await api<RoundLoadList>('/api/van/load-list', { query: { date } }), savedAt: new Date().toISOString() };
      setSaved(fresh);
      setMessage(null);
      await set(cacheKey(date), fresh).catch(() => undefined);
    } catch (failure) {
      const status = failure instanceof ApiError ? failure.status : -1;
      setMessage(status === 0 ? 'No signal: showing the copy saved on this phone.' : (failure as Error).message);
      setSignedOut(status === 401);
    } finally {
      setBusy(false);
    }
  }, [date]);

  useEffect(() => {
    let current = true;
    setSaved(null);
    setMessage(null);
    get<Saved>(cacheKey(date))
      .catch(() => undefined)
      .then((copy) => {
        if (current && copy) setSaved(copy);
      })
      .finally(() => {
        if (current) void refresh();
      });
    return () => {
      current = false;
    };
  }, [date, refresh]);

  return (
    <div className="flex flex-1 flex-col">
      <div className="flex-1 p-4">
        <p className="mb-3 text-base" role="status">
          {saved ? `Saved on this phone at ${formatTime(saved.savedAt, undefined, true)}; it opens without signal.` : busy ? 'Fetching the load list…' : ''}
        </p>
        {message && (
          <p role="alert" className="mb-4 rounded border-2 border-sev-soon bg-white p-3 font-bold">
            {message}
            {signedOut && (
              <a href="/sign-in?next=/van" className="mt-2 flex min-h-12 items-center justify-center rounded bg-brand px-4 text-white">
                Sign in
              </a>
            )}
          </p>
        )}
        {saved ? (
          <LoadListSheet list={saved.list} />
        ) : (
          !busy && !message && <p className="rounded border-2 border-ink/30 bg-white p-4">No copy of this day’s list is on the phone yet.</p>
        )}
      </div>
      <div className="sticky bottom-0 flex flex-col gap-2 border-t-2 border-ink/20 bg-paper p-3 print:hidden">
        <div className="grid grid-cols-2 gap-2" role="group" aria-label="Which round">
          {(['today', 'tomorrow'] as const).map((choice) => (
            <button
              key={choice}
              type="button"
              aria-pressed={day === choice}
              onClick={() => setDay(choice)}
              className={`min-h-14 rounded border-2 border-brand px-3 text-lg font-bold ${day === choice ? 'bg-brand text-white' : 'bg-white text-brand'}`}
            >
              {choice === 'today' ? 'Today' : 'Tomorrow'}
            </button>
          ))}
        </div>
        <div className="grid grid-cols-2 gap-2">
          <button type="button" onClick={() => void refresh()} disabled={busy} className="min-h-14 rounded border-2 border-ink bg-white px-3 text-lg font-bold disabled:opacity-60">
            {busy ? 'Updating…' : 'Update'}
          </button>
          <button type="button" onClick={() => window.print()} disabled={!saved} className="min-h-14 rounded bg-brand-dark px-3 text-lg font-bold text-white disabled:opacity-60">
            Print
          </button>
        </div>
      </div>
    </div>
  );
}
