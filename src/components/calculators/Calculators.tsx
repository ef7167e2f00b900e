// The technician's calculators, one tab each. Everything runs on the phone: no request leaves it,
// so the page works with no signal once the service worker holds it. The tab bar sits at the
// bottom, in reach of the thumb.
import { useEffect, useState, type ReactNode } from 'react';
import BatteryCalculator from './BatteryCalculator';
import CoolantCalculator from './CoolantCalculator';
import OilFillCalculator from './OilFillCalculator';
import TorqueCalculator from './TorqueCalculator';
import UnitConverter from './UnitConverter';

type TabKey = 'units' | 'oil' | 'coolant' | 'battery' | 'torque';

const TABS: { key: TabKey; label: string; title: string; icon: ReactNode; panel: () => ReactNode }[] = [
  { key: 'units', label: 'Units', title: 'Unit converter', icon: <path d="M4 7h13l-3-3 1.4-1.4L21 8l-5.6 5.4L14 12l3-3H4Zm16 10H7l3 3-1.4 1.4L3 16l5.6-5.4L10 12l-3 3h13Z" />, panel: () => <UnitConverter /> },
  { key: 'oil', label: 'Oil fill', title: 'Oil fill plan', icon: <path d="M12 2c3 4.5 7 8.6 7 13a7 7 0 0 1-14 0c0-4.4 4-8.5 7-13Zm-3 13h2a2 2 0 0 0 2 2v2a4 4 0 0 1-4-4Z" />, panel: () => <OilFillCalculator /> },
  { key: 'coolant', label: 'Coolant', title: 'Coolant protection', icon: <path d="M11 2h2v5l3-2 1 1.7-4 2.6v3.4l3 1.7 4-2.3 1 1.7-3 1.8 3 1.7-1 1.7-4-2.3-3 1.7V22h-2v-4.4l-3-1.7-4 2.3-1-1.7 3-1.7-3-1.8 1-1.7 4 2.3 3-1.7V8.3L7 6.7 8 5l3 2Z" />, panel: () => <CoolantCalculator /> },
  { key: 'battery', label: 'Battery', title: 'Battery state', icon: <path d="M7 4h3v2h4V4h3v2h3a1 1 0 0 1 1 1v12a1 1 0 0 1-1 1H4a1 1 0 0 1-1-1V7a1 1 0 0 1 1-1h3Zm-1 7v2h5v-2Zm9 0h-2v2h2v2h2v-2h2v-2h-2V9h-2Z" />, panel: () => <BatteryCalculator /> },
  { key: 'torque', label: 'Torque', title: 'Torque wrench check', icon: <path d="M15.5 2a6 6 0 0 1 5.2 9l-1.8-1.1A4 4 0 1 0 14 14.8L6 22.8 1.2 18l8-8A6 6 0 0 1 15.5 2Zm0 3a1.5 1.5 0 1 1 0 3a1.5 1.5 0 0 1 0-3Z" />, panel: () => <TorqueCalculator /> },
];

function tabFromHash(): TabKey {
  const key = typeof window === 'undefined' ? '' : window.location.hash.slice(1);
  return TABS.some((t) => t.key === key) ? (key as TabKey) : 'units';
}

export default function Calculators() {
  const [active, setActive] = useState<TabKey>('units');
  useEffect(() => {
    setActive(tabFromHash());
    const onHash = () => setActive(tabFromHash());
    window.addEventListener('hashchange', onHash);
    return () => window.removeEventListener('hashchange', onHash);
  }, []);

  function open(key: TabKey) {
    setActive(key);
    // Keep the tab in the address so a reload (or the back button) returns to it.
    window.history.replaceState(null, '', `#${key}`);
    window.scrollTo({ top: 0 });
  }

  const tab = TABS.find((t) => t.key === active)!;
  return (
    <>
      <div role="tabpanel" id={`panel-${tab.key}`} aria-labelledby={`tab-${tab.key}`} className="flex flex-col gap-4 px-4 pt-4 pb-32">
        <h2 className="text-2xl font-bold">{tab.title}</h2>
        {tab.panel()}
      </div>
      <nav className="fixed inset-x-0 bottom-0 z-10 mx-auto max-w-xl border-t-2 border-ink bg-brand-dark pb-[env(safe-area-inset-bottom)]">
        <div role="tablist" aria-label="Calculators" className="grid grid-cols-5">
          {TABS.map((t) => {
            const selected = t.key === active;
            return (
              <button
                key={t.key}
                id={`tab-${t.key}`}
                type="button"
                role="tab"
                aria-selected={selected}
                aria-controls={`panel-${t.key}`}
                onClick={() => open(t.key)}
                className={`flex min-h-16 flex-col items-center justify-center gap-0.5 text-sm font-bold ${
                  selected ? 'bg-paper text-ink underline decoration-4 underline-offset-4' : 'text-white'
                }`}
              >
                <svg viewBox="0 0 24 24" width="26" height="26" fill="currentColor" fillRule="evenodd" aria-hidden="true">
                  {t.icon}
                </svg>
                {t.label}
              </button>
            );
          })}
        </div>
      </nav>
    </>
  );
}
