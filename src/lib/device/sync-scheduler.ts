// When sync runs: when the network comes back, when the app becomes visible, on a timer, shortly
// after each change, and when the technician taps "Sync now". Failures back off exponentially.
// Never blocks the screen: runs are async, one at a time (across tabs too, via Web Locks).
import type { DeviceDb } from './db';
import type { UploadProgress } from './sync-client';

export type SyncPhase = 'idle' | 'syncing' | 'offline' | 'error' | 'signed-out';
export type SyncStatus = { phase: SyncPhase; message: string | null; upload: UploadProgress | null; nextRetryAt: number | null };

// A phone on a driveway may have no signal for hours; 5 minutes keeps retries cheap on battery.
const BACKOFF_FIRST_MS = 2_000;
const BACKOFF_MAX_MS = 5 * 60_000;
// With signal, changes reach the office within about a minute without anyone tapping anything.
const INTERVAL_MS = 60_000;
// Ticks come in bursts as the technician walks the checklist; wait for a pause before sending.
const AFTER_CHANGE_MS = 3_000;

export function backoffDelay(failures: number, random = Math.random): number {
  const base = Math.min(BACKOFF_MAX_MS, BACKOFF_FIRST_MS * 2 ** Math.max(0, failures - 1));
  // Up to 20 % jitter so a van full of phones coming back into signal do not all call at once.
  return Math.round(base * (1 + 0.2 * random()));
}

type Listener = (status: SyncStatus) => void;

export class SyncScheduler {
  private status: SyncStatus = { phase: 'idle', message: null, upload: null, nextRetryAt: null };
  private listeners = new Set<Listener>();
  private failures = 0;
  private timer: ReturnType<typeof setTimeout> | null = null;
  private interval: ReturnType<typeof setInterval> | null = null;
  private running: Promise<void> | null = null;
  private again = false;
  private stopped = false;

  constructor(
    private readonly db: DeviceDb,
    private readonly onSignedOut: () => void,
  ) {}

  start(): void {
    window.addEventListener('online', this.onOnline);
    document.addEventListener('visibilitychange', this.onVisible);
    this.interval = setInterval(() => void this.run(), INTERVAL_MS);
    void this.run();
  }

  stop(): void {
    this.stopped = true;
    window.removeEventListener('online', this.onOnline);
    document.removeEventListener('visibilitychange', this.onVisible);
    if (this.interval) clearInterval(this.interval);
    if (this.timer) clearTimeout(this.timer);
  }

  subscribe(listener: Listener): () => void {
    this.listeners.add(listener);
    listener(this.status);
    return () => this.listeners.delete(listener);
  }

  getStatus(): SyncStatus {
    return this.status;
  }

  /** After a local change: sync soon, once the technician pauses. */
  changed(): void {
    this.schedule(AFTER_CHANGE_MS);
  }

  /** "Sync now": at once, forgetting any backoff. */
  syncNow(): Promise<void> {
    this.failures = 0;
    return this.run();
  }

  private onOnline = () => {
    this.failures = 0;
    void this.run();
  };

  private onVisible = () => {
    if (document.visibilityState === 'visible') void this.run();
  };

  private set(patch: Partial<SyncStatus>) {
    this.status = { ...this.status, ...patch };
    for (const listener of this.listeners) listener(this.status);
  }

  private schedule(delayMs: number) {
    if (this.stopped) return;
    if (this.timer) clearTimeout(this.timer);
    this.timer = setTimeout(() => {
      this.timer = null;
      void this.run();
    }, delayMs);
  }

  run(): Promise<void> {
    if (this.stopped || this.status.phase === 'signed-out') return Promise.resolve();
    if (this.running) {
      this.again = true;
      return this.running;
    }
    this.running = this.withLock(() => this.once()).finally(() => {
      this.running = null;
      if (this.again) {
        this.again = false;
        void this.run();
      }
    });
    return this.running;
  }

  private async withLock(task: () => Promise<void>): Promise<void> {
    const locks = typeof navigator !== 'undefined' ? navigator.locks : undefined;
    if (!locks) return task();
    // Another tab syncing the same outbox: skip this turn rather than send it twice.
    await locks.request('tickover-sync', { ifAvailable: true }, async (lock) => {
      if (lock) await task();
    });
  }

  private async once(): Promise<void> {
    const client = await import('./sync-client');
    this.set({ phase: 'syncing', message: null, nextRetryAt: null });
    try {
      await client.syncOnce({
        db: this.db,
        fetch: (...args) => fetch(...args),
        putBytes: xhrPut,
        onUploadProgress: (upload) => this.set({ upload }),
      });
      this.failures = 0;
      this.set({ phase: 'idle', message: null, upload: null });
    } catch (error) {
      if (error instanceof client.SignedOutError) {
        this.set({ phase: 'signed-out', message: error.message, upload: null });
        this.onSignedOut();
        return;
      }
      this.failures += 1;
      const delay = backoffDelay(this.failures);
      const phase: SyncPhase = error instanceof client.OfflineError ? 'offline' : 'error';
      const message = error instanceof Error ? error.message : String(error);
      this.set({ phase, message, upload: null, nextRetryAt: Date.now() + delay });
      this.schedule(delay);
    }
  }
}

/** PUT with upload progress (fetch cannot report it). */
function xhrPut(url: string, blob: Blob, contentType: string, onProgress: (loaded: number) => void) {
  return new Promise<{ status: number; body: string }>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('PUT', url);
    // A downscaled photo is a few hundred kilobytes: two minutes covers a crawl of a connection.
    xhr.timeout = 120_000;
    xhr.ontimeout = () => reject(new Error('timeout'));
    xhr.withCredentials = true;
    xhr.setRequestHeader('content-type', contentType);
    xhr.upload.onprogress = (event) => onProgress(event.loaded);
    xhr.onload = () => resolve({ status: xhr.status, body: xhr.responseText });
    xhr.onerror = () => reject(new Error('network'));
    xhr.onabort = () => reject(new Error('aborted'));
    xhr.send(blob);
  });
}
