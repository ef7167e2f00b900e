// When the phone should put "save unsent changes to a file" first. Kept apart from the file format
// (lib/sync/unsent-file.ts, which carries zod) so every screen can ask without loading it.

/** The server out of reach this long with work waiting: the technician is urged to save a file. */
export const UNSENT_FILE_URGE_AFTER_MS = 2 * 24 * 60 * 60 * 1000;
const DAY_MS = 24 * 60 * 60 * 1000;

export function shouldUrgeUnsentFile(pending: number, lastSyncedAt: string | null, nowMs: number): boolean {
  if (pending === 0) return false;
  // Never synced yet with work waiting: nothing of it is on the server.
  if (lastSyncedAt === null) return true;
  return nowMs - Date.parse(lastSyncedAt) >= UNSENT_FILE_URGE_AFTER_MS;
}

/** Whole days since the last sync, for the words on screen; null when it never synced. */
export function daysSinceSync(lastSyncedAt: string | null, nowMs: number): number | null {
  return lastSyncedAt === null ? null : Math.floor((nowMs - Date.parse(lastSyncedAt)) / DAY_MS);
}
