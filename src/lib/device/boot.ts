// Starting a technician page: who is signed in (server, or the cached copy when offline), their
// device database, the sync scheduler and the service worker. Every shell page calls bootDevice()
// once; the screens then reach the same instance through device().
import { DeviceDb, deviceDbName } from './db';
import { cachedUser, checkSession, signInPath, type DeviceUser } from './session';
import { SyncScheduler } from './sync-scheduler';
import { registerServiceWorker, requestPersistentStorage, type StorageState } from './pwa';

export type Device = { user: DeviceUser; db: DeviceDb; sync: SyncScheduler; storage: Promise<StorageState> };

export type BootResult =
  | { kind: 'ready'; device: Device }
  | { kind: 'needs-network' }
  | { kind: 'redirect'; to: string };

let current: Device | undefined;
const unsaved = new Map<string, string>();

export function device(): Device {
  if (!current) throw new Error('bootDevice() has not finished yet');
  return current;
}

/** An open form holding input that is not saved yet (blocks applying an app update). */
export function markUnsaved(key: string, description: string | null): void {
  if (description) unsaved.set(key, description);
  else unsaved.delete(key);
}

/** Why an app update must wait, or null when nothing unsaved is open. */
export function updateBlocker(): string | null {
  const open = [...unsaved.values()];
  return open.length ? `Save or cancel ${open.join(' and ')} first; then update.` : null;
}

// With no cached user the first answer of /api/me decides; on a signal that connects but never
// answers ("lie-fi") the screen must not hang, so after this long it says the network is needed.
const FIRST_SESSION_CHECK_MS = 15_000;

export async function bootDevice(): Promise<BootResult> {
  if (current) return { kind: 'ready', device: current };
  const cached = await cachedUser();
  let user: DeviceUser;
  if (cached) {
    // Open at once from the phone's copy; the server's answer follows and only redirects.
    user = cached;
    void checkSession().then((session) => {
      if (session.kind === 'signed-out') window.location.assign(signInPath(window.location));
      else if (session.kind === 'signed-in' && session.user.id !== cached.id) window.location.reload();
    });
  } else {
    const session = await Promise.race([
      checkSession(),
      new Promise<{ kind: 'offline-unknown' }>((resolve) => setTimeout(() => resolve({ kind: 'offline-unknown' }), FIRST_SESSION_CHECK_MS)),
    ]);
    if (session.kind === 'signed-out') return { kind: 'redirect', to: signInPath(window.location) };
    if (session.kind === 'offline-unknown') return { kind: 'needs-network' };
    user = session.user;
  }
  if (user.role !== 'technician') return { kind: 'redirect', to: '/office' };

  const db = new DeviceDb(deviceDbName(user.id));
  await db.open();
  const sync = new SyncScheduler(db, () => {
    // The outbox stays in this phone's database; it drains after the next sign-in.
    window.location.assign(signInPath(window.location));
  });
  current = { user, db, sync, storage: requestPersistentStorage() };
  sync.start();
  void registerServiceWorker(updateBlocker);
  return { kind: 'ready', device: current };
}
