// The service worker's life on the phone: register it, announce a new version, apply it only
// when the technician says so, and ask the browser to keep our storage.
import type { Workbox } from 'workbox-window';

export type AppUpdate = { available: boolean; apply: () => Promise<void> };
export type StorageState = 'persisted' | 'refused' | 'unsupported' | 'unknown';

type UpdateListener = (update: AppUpdate) => void;

let workbox: Workbox | undefined;
let update: AppUpdate = { available: false, apply: async () => {} };
const listeners = new Set<UpdateListener>();

function announce(next: AppUpdate) {
  update = next;
  for (const listener of listeners) listener(update);
}

export function onAppUpdate(listener: UpdateListener): () => void {
  listeners.add(listener);
  listener(update);
  return () => listeners.delete(listener);
}

/**
 * Registers /sw.js. A waiting new version is announced, never forced: the technician applies it
 * from the banner. Their work is safe either way, because every change is already in IndexedDB
 * the moment the screen shows it; `beforeApply` lets an open form say it holds unsaved input.
 */
export async function registerServiceWorker(beforeApply: () => string | null): Promise<void> {
  if (!('serviceWorker' in navigator) || workbox) return;
  const { Workbox } = await import('workbox-window');
  workbox = new Workbox('/sw.js', { scope: '/' });
  const wb = workbox;
  wb.addEventListener('waiting', () => {
    announce({
      available: true,
      apply: async () => {
        const blocker = beforeApply();
        if (blocker) throw new Error(blocker);
        wb.addEventListener('controlling', () => window.location.reload());
        wb.messageSkipWaiting();
      },
    });
  });
  try {
    await wb.register();
  } catch (error) {
    console.warn('[tickover] the service worker did not register', error);
  }
}

/** True once a service worker controls this page (the shell will open offline next time). */
export async function offlineReady(): Promise<boolean> {
  if (!('serviceWorker' in navigator)) return false;
  await navigator.serviceWorker.ready;
  return true;
}

/**
 * Asks the browser not to evict our IndexedDB under storage pressure. Browsers may refuse
 * (Chromium decides from engagement; an installed app usually gets it).
 */
export async function requestPersistentStorage(): Promise<StorageState> {
  if (!navigator.storage?.persist) return 'unsupported';
  try {
    if (await navigator.storage.persisted()) return 'persisted';
    return (await navigator.storage.persist()) ? 'persisted' : 'refused';
  } catch {
    return 'unknown';
  }
}
