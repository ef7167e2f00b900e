// One visit: five screens behind a bottom tab bar (vehicle, checklist, findings, parts, sign-off).
// Each screen's code loads when first opened, so the first paint carries only what it shows.
import { lazy, Suspense, useEffect, useState, type ReactNode } from 'react';
import type { Device } from '../../lib/device/boot';
import { visitProgress } from '../../lib/device/visit-progress';
import { formatTime } from '../phone/format';
import { useVisitData, type VisitData } from './visit-data';
import { VehicleCard } from './VehicleCard';
import { Plate } from './Plate';

const ChecklistTab = lazy(() => import('./ChecklistTab'));
const FindingsTab = lazy(() => import('./FindingsTab'));
const PartsTab = lazy(() => import('./PartsTab'));
const SignOffTab = lazy(() => import('./SignOffTab'));

export const TABS = ['vehicle', 'checklist', 'findings', 'parts', 'sign-off'] as const;
export type Tab = (typeof TABS)[number];
const TAB_LABEL: Record<Tab, string> = { vehicle: 'Vehicle', checklist: 'Checklist', findings: 'Findings', parts: 'Parts', 'sign-off': 'Sign-off' };

function tabFromHash(): Tab {
  const hash = window.location.hash.replace('#', '');
  return (TABS as readonly string[]).includes(hash) ? (hash as Tab) : 'vehicle';
}

export type TabProps = { device: Device; data: VisitData; locked: boolean; go: (tab: Tab) => void };

export function VisitScreen({ device, visitId }: { device: Device; visitId: string }) {
  const data = useVisitData(device, visitId);
  const [tab, setTab] = useState<Tab>(tabFromHash);

  useEffect(() => {
    const onHash = () => setTab(tabFromHash());
    window.addEventListener('hashchange', onHash);
    return () => window.removeEventListener('hashchange', onHash);
  }, []);

  useEffect(() => {
    if (data?.vehicle) document.title = `${data.vehicle.registration} · Tickover`;
  }, [data?.vehicle]);

  const go = (next: Tab) => {
    window.location.hash = next;
    window.scrollTo(0, 0);
  };

  if (data === undefined) return <p className="p-4">Opening the visit…</p>;
  if (data === null) {
    return (
      <div className="flex flex-col gap-4 p-4">
        <p className="text-xl font-bold">This visit is not on this phone.</p>
        <p>It may have moved to another technician’s round. Go back to your round and sync when you have signal.</p>
        <a href="/round" className="flex min-h-14 items-center justify-center rounded-lg bg-brand font-bold text-white">
          Back to the round
        </a>
      </div>
    );
  }

  const locked = !!data.signOff;
  const props: TabProps = { device, data, locked, go };
  const progress = data.version ? visitProgress(data.version, data) : null;
  let content: ReactNode;
  switch (tab) {
    case 'vehicle':
      content = <VehicleCard data={data} onStart={() => go('checklist')} />;
      break;
    case 'checklist':
      content = <ChecklistTab {...props} />;
      break;
    case 'findings':
      content = <FindingsTab {...props} />;
      break;
    case 'parts':
      content = <PartsTab {...props} />;
      break;
    case 'sign-off':
      content = <SignOffTab {...props} />;
      break;
  }

  return (
    <div className="flex flex-1 flex-col">
      <div className="flex flex-col gap-1 border-b-2 border-ink/15 bg-white px-3 py-2">
        <div className="flex items-center gap-3">
          {data.vehicle && <Plate registration={data.vehicle.registration} />}
          <span className="min-w-0 truncate font-bold">{data.customer?.name}</span>
        </div>
        <div className="flex items-center gap-3 text-base">
          <span>
            {formatTime(data.visit.slotStart)}–{formatTime(data.visit.slotEnd)}
          </span>
          {progress && (
            <span className="ml-auto font-bold" data-testid="visit-progress">
              {progress.done} of {progress.total} done
            </span>
          )}
        </div>
      </div>
      {locked && (
        <p className="flex items-center gap-2 border-b-2 border-sev-ok bg-sev-ok/10 px-3 py-2 font-bold text-sev-ok" role="status">
          <svg width="22" height="22" viewBox="0 0 24 24" aria-hidden="true">
            <rect x="4" y="10" width="16" height="12" rx="2" fill="currentColor" />
            <path d="M8 10V7a4 4 0 0 1 8 0v3" fill="none" stroke="currentColor" strokeWidth="2.5" />
          </svg>
          Signed off at {formatTime(data.signOff!.signedAt)}. This visit is locked.
        </p>
      )}
      <div className="flex flex-1 flex-col pb-24">
        <Suspense fallback={<p className="p-4">Opening…</p>}>{content}</Suspense>
      </div>
      <TabBar tab={tab} go={go} findings={data.findings.length} />
    </div>
  );
}

function TabBar({ tab, go, findings }: { tab: Tab; go: (tab: Tab) => void; findings: number }) {
  return (
    <nav aria-label="Visit" className="fixed inset-x-0 bottom-0 z-20 mx-auto grid max-w-xl grid-cols-5 border-t-2 border-ink/20 bg-white">
      {TABS.map((t) => (
        <button
          key={t}
          type="button"
          onClick={() => go(t)}
          aria-current={t === tab ? 'page' : undefined}
          className={`flex min-h-16 flex-col items-center justify-center gap-0.5 px-0.5 text-[15px] font-bold leading-tight ${
            t === tab ? 'bg-brand text-white' : 'text-ink'
          }`}
        >
          <TabIcon tab={t} />
          <span>
            {TAB_LABEL[t]}
            {t === 'findings' && findings > 0 ? ` ${findings}` : ''}
          </span>
        </button>
      ))}
    </nav>
  );
}

function TabIcon({ tab }: { tab: Tab }) {
  const common = { width: 24, height: 24, viewBox: '0 0 24 24', 'aria-hidden': true, fill: 'none', stroke: 'currentColor', strokeWidth: 2.2, strokeLinecap: 'round' as const, strokeLinejoin: 'round' as const };
  switch (tab) {
    case 'vehicle':
      return (
        <svg {...common}>
          <path d="M3 16v-4l2-5h14l2 5v4zM3 16v3h3v-3M18 16v3h3v-3" />
          <circle cx="7.5" cy="13" r="1" />
          <circle cx="16.5" cy="13" r="1" />
        </svg>
      );
    case 'checklist':
      return (
        <svg {...common}>
          <path d="M4 6l2 2 3-3M4 13l2 2 3-3M12 7h8M12 14h8M12 20h8M4 20h4" />
        </svg>
      );
    case 'findings':
      return (
        <svg {...common}>
          <path d="M12 3 22 20H2z" />
          <path d="M12 10v4M12 17v.5" />
        </svg>
      );
    case 'parts':
      return (
        <svg {...common}>
          <circle cx="12" cy="12" r="3" />
          <path d="M12 2v3M12 19v3M2 12h3M19 12h3M4.9 4.9l2.1 2.1M17 17l2.1 2.1M4.9 19.1 7 17M17 7l2.1-2.1" />
        </svg>
      );
    case 'sign-off':
      return (
        <svg {...common}>
          <path d="M3 19c3-1 4-6 6-6s1 5 4 5 3-3 5-3 2 2 3 2M14 3l4 4-9 9H5v-4z" />
        </svg>
      );
  }
}
