// Always on screen: what the outbox holds and when the phone last synced, with "Sync now" and a
// progress bar while photos upload.
import { useState } from 'react';
import { device } from '../../lib/device/boot';
import { useOnline, useOutboxState, useSyncStatus } from './hooks';
import { formatTime } from './format';
import { daysSinceSync, shouldUrgeUnsentFile } from '../../lib/device/unsent-urge';

export function OutboxBar() {
  const outbox = useOutboxState();
  const status = useSyncStatus();
  const online = useOnline();
  const [busy, setBusy] = useState(false);

  const syncing = status.phase === 'syncing' || busy;
  const waiting = outbox?.pending ?? 0;
  const last = outbox?.lastSyncedAt ? `last synced ${formatTime(outbox.lastSyncedAt)}` : 'not synced yet';

  let line: string;
  if (syncing) line = waiting ? `Sending ${waiting} ${waiting === 1 ? 'change' : 'changes'}…` : 'Syncing…';
  else if (waiting === 0) line = `Nothing waiting · ${last}`;
  else line = `${waiting} ${waiting === 1 ? 'change' : 'changes'} waiting · ${last}`;

  const note = !online || status.phase === 'offline'
    ? 'No signal: everything is saved on this phone.'
    : status.phase === 'error'
      ? `Sync failed: ${status.message ?? 'unknown error'} Trying again shortly.`
      : null;

  async function syncNow() {
    setBusy(true);
    try {
      await device().sync.syncNow();
    } finally {
      setBusy(false);
    }
  }

  const unsent = waiting + (outbox?.rejected ?? 0);
  const urge = outbox && shouldUrgeUnsentFile(unsent, outbox.lastSyncedAt, Date.now());
  const days = outbox ? daysSinceSync(outbox.lastSyncedAt, Date.now()) : null;

  const upload = status.upload;
  return (
    <section aria-label="Outbox" className="border-b-2 border-ink/15 bg-white px-3 py-2 text-ink">
      <div className="flex items-center gap-3">
        <p className="min-w-0 flex-1 text-base leading-snug" aria-live="polite" data-testid="outbox-state">
          <span className="font-bold">{line}</span>
          {note && <span className="block text-ink/80">{note}</span>}
          {urge && (
            <a href="/device#unsent" className="block font-bold text-sev-now underline">
              {days === null ? 'Never synced' : `No contact for ${days} days`}: save unsent changes to a file
            </a>
          )}
          {(outbox?.rejected ?? 0) > 0 && (
            <a href="/device#refused" className="block font-bold text-sev-now underline">
              {outbox!.rejected} refused by the server: see This phone
            </a>
          )}
        </p>
        <button
          type="button"
          onClick={syncNow}
          disabled={syncing}
          className="min-h-12 shrink-0 rounded-lg border-2 border-brand px-4 font-bold text-brand disabled:opacity-60"
        >
          {syncing ? 'Syncing' : 'Sync now'}
        </button>
      </div>
      {upload && upload.bytesTotal > 0 && (
        <div className="mt-2">
          <p className="text-base">
            Uploading photos: {upload.photosDone} of {upload.photosTotal}
          </p>
          <div
            role="progressbar"
            aria-label="Photo upload"
            aria-valuemin={0}
            aria-valuemax={upload.bytesTotal}
            aria-valuenow={upload.bytesDone}
            className="mt-1 h-3 overflow-hidden rounded-full bg-ink/15"
          >
            <div className="h-full bg-brand transition-[width]" style={{ width: `${Math.round((100 * upload.bytesDone) / upload.bytesTotal)}%` }} />
          </div>
        </div>
      )}
    </section>
  );
}
