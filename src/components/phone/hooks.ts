// React's view of the device store: live queries over Dexie and the sync status. Components use
// these, never the network.
import { liveQuery } from 'dexie';
import { useEffect, useState, useSyncExternalStore, type DependencyList } from 'react';
import { device } from '../../lib/device/boot';
import type { SyncStatus } from '../../lib/device/sync-scheduler';
import { offlineReady, onAppUpdate, type AppUpdate } from '../../lib/device/pwa';

/** A Dexie query that re-runs whenever the tables it read change (in this tab or another). */
export function useLiveQuery<T>(query: () => Promise<T> | T, deps: DependencyList): T | undefined {
  const [value, setValue] = useState<T | undefined>(undefined);
  useEffect(() => {
    const subscription = liveQuery(query).subscribe({
      next: (v) => setValue(() => v),
      error: (error) => console.error('[tickover] live query failed', error),
    });
    return () => subscription.unsubscribe();
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, deps);
  return value;
}

export function useSyncStatus(): SyncStatus {
  const sync = device().sync;
  return useSyncExternalStore(
    (onChange) => sync.subscribe(onChange),
    () => sync.getStatus(),
  );
}

export type OutboxState = { pending: number; rejected: number; lastSyncedAt: string | null };

export function useOutboxState(): OutboxState | undefined {
  const { db } = device();
  return useLiveQuery(async () => {
    const [pending, rejected, last] = await Promise.all([
      db.outbox.where('state').equals('pending').count(),
      db.outbox.where('state').equals('rejected').count(),
      db.meta.get('lastSyncedAt'),
    ]);
    return { pending, rejected, lastSyncedAt: last?.key === 'lastSyncedAt' ? last.value : null };
  }, [db]);
}

export function useAppUpdate(): AppUpdate {
  const [update, setUpdate] = useState<AppUpdate>({ available: false, apply: async () => {} });
  useEffect(() => onAppUpdate(setUpdate), []);
  return update;
}

export function useOnline(): boolean {
  return useSyncExternalStore(
    (onChange) => {
      window.addEventListener('online', onChange);
      window.addEventListener('offline', onChange);
      return () => {
        window.removeEventListener('online', onChange);
        window.removeEventListener('offline', onChange);
      };
    },
    () => navigator.onLine,
    () => true,
  );
}

/** True once the service worker holds the app, so it opens with no signal. */
export function useShellCached(): boolean {
  const [cached, setCached] = useState(false);
  useEffect(() => {
    let live = true;
    void offlineReady().then((ready) => live && setCached(ready));
    return () => {
      live = false;
    };
  }, []);
  return cached;
}
