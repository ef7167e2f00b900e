// This phone: the technician's own torque wrench and region (used when readings are judged),
// whether the browser keeps our storage, what the outbox holds, and signing out.
import { useEffect, useState } from 'react';
import type { Device } from '../../lib/device/boot';
import { forgetUser } from '../../lib/device/session';
import { readRegion, readWrench, saveRegion, saveWrench, validateWrench, type TreadRegion } from '../../lib/device/settings';
import type { StorageState } from '../../lib/device/pwa';
import { PhoneShell } from '../phone/PhoneShell';
import { BottomLinks } from '../phone/BottomLinks';
import { useLiveQuery, useOutboxState } from '../phone/hooks';
import { formatTime } from '../phone/format';
import { daysSinceSync, shouldUrgeUnsentFile } from '../../lib/device/unsent-urge';

export default function DeviceApp() {
  return (
    <PhoneShell title="This phone" back={{ href: '/round', label: 'Round' }}>
      {(device) => (
        <>
          <DeviceScreen device={device} />
          <BottomLinks links={[{ href: '/round', label: 'Round' }, { href: '/calculators', label: 'Calculators' }]} />
        </>
      )}
    </PhoneShell>
  );
}

const STORAGE_TEXT: Record<StorageState, string> = {
  persisted: 'This browser keeps the app’s data on this phone, even when storage runs low.',
  refused:
    'This browser has not agreed to keep the app’s data for good: if the phone runs very low on storage it may clear it. Install Tickover to the home screen and sync often; changes are only safe once synced.',
  unsupported: 'This browser cannot promise to keep the app’s data. Sync often; changes are only safe once synced.',
  unknown: 'Could not ask the browser to keep the app’s data. Sync often.',
};

function DeviceScreen({ device }: { device: Device }) {
  const [storage, setStorage] = useState<StorageState | null>(null);
  const outbox = useOutboxState();
  const refused = useLiveQuery(() => device.db.outbox.where('state').equals('rejected').toArray(), [device]);

  useEffect(() => {
    void device.storage.then(setStorage);
  }, [device]);

  async function letGoOfRefused() {
    if (!window.confirm('Let go of the refused changes? The phone then shows what the office has for those visits.')) return;
    const { startPullOver } = await import('../../lib/device/sync-client');
    await device.db.outbox.where('state').equals('rejected').delete();
    await startPullOver(device.db);
    await device.sync.syncNow();
  }

  async function signOut() {
    const waiting = outbox?.pending ?? 0;
    if (waiting > 0 && !window.confirm(`${waiting} changes have not reached the office yet. They stay on this phone and are sent the next time you sign in. Sign out?`)) return;
    await fetch('/api/auth/sign-out', { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{}' }).catch(() => undefined);
    await forgetUser();
    window.location.assign('/sign-in');
  }

  const unsent = (outbox?.pending ?? 0) + (outbox?.rejected ?? 0);
  const urgent = outbox ? shouldUrgeUnsentFile(unsent, outbox.lastSyncedAt, Date.now()) : false;
  const unsentSection = unsent > 0 && <UnsentChanges device={device} count={unsent} lastSyncedAt={outbox?.lastSyncedAt ?? null} urgent={urgent} />;

  return (
    <main className="flex flex-1 flex-col gap-5 p-3 pb-24">
      {urgent && unsentSection}
      <p>
        Signed in as <strong>{device.user.name}</strong> ({device.user.email}).
      </p>
      <WrenchSetting />
      <RegionSetting />

      <section className="rounded-xl border-2 border-ink/15 bg-white p-3" aria-labelledby="storage-heading">
        <h2 id="storage-heading" className="text-xl font-bold">
          Storage
        </h2>
        <p data-testid="storage-state" className={storage === 'persisted' ? '' : 'font-bold'}>
          {storage ? STORAGE_TEXT[storage] : 'Checking…'}
        </p>
      </section>

      <section id="refused" className="rounded-xl border-2 border-ink/15 bg-white p-3" aria-labelledby="outbox-heading">
        <h2 id="outbox-heading" className="text-xl font-bold">
          Outbox
        </h2>
        <p>
          {outbox ? `${outbox.pending} waiting to be sent.` : '…'} {outbox?.lastSyncedAt ? `Last synced ${formatTime(outbox.lastSyncedAt)}.` : 'Not synced yet.'}
        </p>
        {refused && refused.length > 0 && (
          <>
            <p className="mt-2 font-bold text-sev-now">Refused by the server (kept here; tell the office):</p>
            <ul className="mt-1 flex flex-col gap-2">
              {refused.map((entry) => (
                <li key={entry.opId} className="rounded-lg border-2 border-sev-now p-2 text-base">
                  <span className="font-bold">{entry.kind}</span> on visit {entry.visitId.slice(0, 8)}: {entry.reason}
                </li>
              ))}
            </ul>
            <button type="button" onClick={letGoOfRefused} className="mt-3 min-h-12 w-full rounded-lg border-2 border-sev-now px-3 font-bold text-sev-now">
              Let go of refused changes
            </button>
          </>
        )}
      </section>
      {!urgent && unsentSection}

      <button type="button" onClick={signOut} className="min-h-14 rounded-lg border-2 border-ink px-4 text-lg font-bold">
        Sign out
      </button>
    </main>
  );
}

/**
 * Saving the outbox to a file for the office, when the phone cannot reach the server. Offered
 * whenever something is unsent; first on the screen, in alarm colours, after two days without
 * reaching the server (lib/device/unsent-urge.ts).
 */
function UnsentChanges({ device, count, lastSyncedAt, urgent }: { device: Device; count: number; lastSyncedAt: string | null; urgent: boolean }) {
  const [result, setResult] = useState<{ ok: boolean; text: string } | null>(null);
  const [busy, setBusy] = useState(false);
  const days = daysSinceSync(lastSyncedAt, Date.now());

  async function save() {
    setBusy(true);
    setResult(null);
    try {
      const { saveUnsentFile } = await import('../../lib/device/unsent-export');
      const saved = await saveUnsentFile(device.db, device.user);
      setResult({
        ok: true,
        text: `Saved ${saved.name}: ${saved.operations} ${saved.operations === 1 ? 'change' : 'changes'}, ${saved.photos} ${saved.photos === 1 ? 'photo' : 'photos'}. Send it to the office (e-mail it, or copy it across); they import it. The changes also stay on this phone and are sent when it finds signal: nothing is counted twice.`,
      });
    } catch (error) {
      setResult({ ok: false, text: `Could not save the file: ${error instanceof Error ? error.message : String(error)}` });
    } finally {
      setBusy(false);
    }
  }

  return (
    <section
      id="unsent"
      aria-labelledby="unsent-heading"
      className={urgent ? 'rounded-xl border-4 border-sev-now bg-white p-3' : 'rounded-xl border-2 border-ink/15 bg-white p-3'}
    >
      <h2 id="unsent-heading" className="flex items-center gap-2 text-xl font-bold">
        {urgent && (
          <svg width="28" height="28" viewBox="0 0 24 24" aria-hidden="true" className="shrink-0 text-sev-now">
            <path d="M12 2 1 21h22L12 2z" fill="currentColor" />
            <path d="M12 9v5M12 17v1" stroke="white" strokeWidth="2.5" strokeLinecap="round" />
          </svg>
        )}
        {urgent ? (days === null ? 'Not synced yet' : `No contact with the office for ${days} days`) : 'Unsent changes'}
      </h2>
      <p className="mt-1">
        {count} {count === 1 ? 'change has' : 'changes have'} not reached the office.
        {urgent ? ' Save them to a file and send it to the office, so the work is safe even if this phone is lost or broken.' : ' If this phone cannot reach the server, save them to a file for the office.'}
      </p>
      <button
        type="button"
        onClick={save}
        disabled={busy}
        className={`mt-3 min-h-14 w-full rounded-lg px-3 text-lg font-bold disabled:opacity-60 ${urgent ? 'bg-sev-now text-white' : 'border-2 border-brand text-brand'}`}
      >
        {busy ? 'Saving…' : 'Save unsent changes to a file'}
      </button>
      {result && (
        <p role={result.ok ? 'status' : 'alert'} className={`mt-2 ${result.ok ? '' : 'font-bold text-sev-now'}`}>
          {result.text}
        </p>
      )}
    </section>
  );
}

function WrenchSetting() {
  const [min, setMin] = useState('');
  const [max, setMax] = useState('');
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);

  useEffect(() => {
    void readWrench().then((w) => {
      if (w) {
        setMin(String(w.minNm));
        setMax(String(w.maxNm));
      }
    });
  }, []);

  async function save(event: { preventDefault(): void }) {
    event.preventDefault();
    const minNm = Number(min.replace(',', '.'));
    const maxNm = Number(max.replace(',', '.'));
    const problem = validateWrench(minNm, maxNm);
    if (problem) {
      setMessage({ ok: false, text: problem });
      return;
    }
    await saveWrench({ minNm, maxNm });
    setMessage({ ok: true, text: `Saved: torque readings are checked against ${minNm}–${maxNm} N·m.` });
  }

  const field = 'min-h-14 w-full rounded-lg border-2 border-ink/60 bg-white px-3 font-mono text-2xl';
  return (
    <form onSubmit={save} className="flex flex-col gap-2 rounded-xl border-2 border-ink/15 bg-white p-3" aria-labelledby="wrench-heading">
      <h2 id="wrench-heading" className="text-xl font-bold">
        Your torque wrench
      </h2>
      <p className="text-base">The range marked on its scale. A torque reading below the lowest mark cannot be trusted (ISO 6789-1:2017).</p>
      {/* items-end keeps the two boxes level when one label wraps on a narrow phone. */}
      <div className="grid grid-cols-2 items-end gap-3">
        <label className="flex flex-col gap-1 font-bold">
          Lowest mark (N·m)
          <input value={min} onChange={(e) => setMin(e.target.value)} inputMode="decimal" className={field} />
        </label>
        <label className="flex flex-col gap-1 font-bold">
          Highest mark (N·m)
          <input value={max} onChange={(e) => setMax(e.target.value)} inputMode="decimal" className={field} />
        </label>
      </div>
      {message && (
        <p role={message.ok ? 'status' : 'alert'} className={message.ok ? 'font-bold text-sev-ok' : 'font-bold text-sev-now'}>
          {message.text}
        </p>
      )}
      <button type="submit" className="min-h-14 rounded-lg bg-brand text-lg font-bold text-white">
        Save wrench
      </button>
    </form>
  );
}

const REGIONS: { value: TreadRegion; label: string }[] = [
  { value: 'UK', label: 'United Kingdom' },
  { value: 'EU', label: 'European Union' },
  { value: 'US', label: 'United States' },
];

function RegionSetting() {
  const [region, setRegion] = useState<TreadRegion>('UK');
  useEffect(() => {
    void readRegion().then(setRegion);
  }, []);
  return (
    <fieldset className="flex flex-col gap-2 rounded-xl border-2 border-ink/15 bg-white p-3">
      <legend className="px-1 text-xl font-bold">Tread depth law</legend>
      <p className="text-base">Where you work decides the legal minimum tread depth the checklist applies.</p>
      {REGIONS.map((r) => (
        <label key={r.value} className="flex min-h-12 items-center gap-3">
          <input
            type="radio"
            name="region"
            checked={region === r.value}
            onChange={() => {
              setRegion(r.value);
              void saveRegion(r.value);
            }}
            className="size-6 accent-brand"
          />
          {r.label}
        </label>
      ))}
    </fieldset>
  );
}
