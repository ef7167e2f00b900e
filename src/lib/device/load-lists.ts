// The van's load list on the phone: fetched from GET /api/van/load-list after each pull that
// changed the round (and when the copy has aged), and when the technician opens or updates it;
// kept per round date in the device database, so it reads with no signal in the store at night or
// at the kerb in the morning. The list is the server's (sums, containers, the van's stock): the
// phone never works it out itself, it only keeps the latest answer and says how old it is.
import { roundLoadListSchema } from '../van/load-list-contract';
import type { DeviceDb, LocalLoadList } from './db';
import { errorOf, request, ServerError, SignedOutError, understood, type HttpDeps } from './http';
import { datesToKeep } from './load-list-days';

export type LoadListDeps = HttpDeps & { db: DeviceDb; now?: () => Date };

// The office may restock the van or change a spec without the pull bringing anything: a copy
// older than this is fetched again on the next sync run, so the evening's list is never stale
// for long while there is signal, and a phone with signal asks at most every few minutes.
export const LOAD_LIST_MAX_AGE_MS = 10 * 60_000;

/** Fetches one round's load list and keeps it on the phone. Throws the errors of lib/device/http. */
export async function fetchLoadList(deps: LoadListDeps, roundDate: string): Promise<LocalLoadList> {
  const response = await request(deps, `/api/van/load-list?date=${encodeURIComponent(roundDate)}`, { headers: { accept: 'application/json' } });
  if (!response.ok) throw await errorOf(response);
  const list = await understood(response, roundLoadListSchema);
  if (list.roundDate !== roundDate) throw new ServerError(response.status, 'The server sent the load list of another day. Try again.');
  const row: LocalLoadList = { roundDate, list, fetchedAt: (deps.now?.() ?? new Date()).toISOString() };
  await deps.db.loadLists.put(row);
  return row;
}

/**
 * After a pull: fetch today's and the next round's lists when the round changed, when there is
 * no copy, or when the copy has aged. A list that cannot be fetched keeps its older copy (the
 * screen shows its age) and never fails the sync run; a 401 does, as it does for the outbox.
 * Copies of days gone by are dropped.
 */
export async function refreshLoadLists(deps: LoadListDeps, options: { roundChanged: boolean }): Promise<{ saved: number; failed: string | null }> {
  const now = deps.now?.() ?? new Date();
  const { today, next } = await datesToKeep(deps.db, now);
  let saved = 0;
  let failed: string | null = null;
  for (const date of [today, next]) {
    const copy = await deps.db.loadLists.get(date);
    const aged = !copy || now.getTime() - Date.parse(copy.fetchedAt) >= LOAD_LIST_MAX_AGE_MS;
    if (!options.roundChanged && !aged) continue;
    try {
      await fetchLoadList(deps, date);
      saved += 1;
    } catch (error) {
      if (error instanceof SignedOutError) throw error;
      failed = error instanceof Error ? error.message : String(error);
    }
  }
  await deps.db.loadLists.where('roundDate').below(today).delete();
  return { saved, failed };
}
