// The checklist by section: one-tap ticks with undo, "not applicable" for a check this car has
// no use for, readings through the number pad, parts fitted from the vehicle's spec. (The sync
// contract has no "not applicable" for readings and parts: the server accepts a `check` only on
// a check item, so those stay "not done" on the record unless recorded.)
import { lazy, Suspense, useEffect, useState } from 'react';
import type { CheckState } from '../../lib/device/db';
import { savePartLine, recordReading, setCheck } from '../../lib/device/visit-actions';
import { readRegion, readWrench } from '../../lib/device/settings';
import { suggestPart } from '../../lib/device/part-suggestion';
import { itemSkipped, sectionProgress, type ItemOf } from '../../lib/device/visit-progress';
import { formatNumber, withUnit } from '../phone/format';
import { judgeItem, type PhoneSettings, type ReadingJudgement } from './judge';
import { VERDICT_LABEL, VerdictIcon } from './VerdictLine';
import type { TabProps } from './VisitScreen';
import { useRecorder } from './use-recorder';
import type { RecordedReading } from './ReadingPad';
import type { FindingDraft } from './FindingSheet';

const ReadingPad = lazy(() => import('./ReadingPad').then((m) => ({ default: m.ReadingPad })));
const FindingSheet = lazy(() => import('./FindingSheet'));

type Undo = { label: string; itemId: string; previous: CheckState };

export default function ChecklistTab({ device, data, locked }: TabProps) {
  const [settings, setSettings] = useState<PhoneSettings>({ wrench: null, region: 'UK' });
  const [padItem, setPadItem] = useState<ItemOf | null>(null);
  const [finding, setFinding] = useState<FindingDraft | null>(null);
  const [undo, setUndo] = useState<Undo | null>(null);
  const { db, sync } = device;
  const { run, alert } = useRecorder(device);
  const visitId = data.visit.id;

  useEffect(() => {
    void Promise.all([readWrench(), readRegion()]).then(([wrench, region]) => setSettings({ wrench, region }));
  }, []);

  useEffect(() => {
    if (!undo) return;
    const timer = setTimeout(() => setUndo(null), 8000);
    return () => clearTimeout(timer);
  }, [undo]);

  const stateOf = (itemId: string): CheckState => data.checks.find((c) => c.itemId === itemId)?.state ?? 'not_yet';

  function toggleTick(item: ItemOf) {
    const previous = stateOf(item.id);
    const next: CheckState = previous === 'done' ? 'not_yet' : 'done';
    void run(async () => {
      await setCheck(db, visitId, item.id, next);
      setUndo({ label: next === 'done' ? `Ticked “${item.label}”` : `Unticked “${item.label}”`, itemId: item.id, previous });
    });
  }

  function toggleSkip(item: ItemOf) {
    const previous = stateOf(item.id);
    const next: CheckState = previous === 'skipped' ? 'not_yet' : 'skipped';
    void run(async () => {
      await setCheck(db, visitId, item.id, next);
      setUndo({ label: next === 'skipped' ? `Marked “${item.label}” not applicable` : `“${item.label}” back on the list`, itemId: item.id, previous });
    });
  }

  function undoLast() {
    if (!undo) return;
    const { itemId, previous } = undo;
    setUndo(null);
    void run(() => setCheck(db, visitId, itemId, previous));
  }

  function fitPart(item: ItemOf) {
    const suggestion = suggestPart(item, data.vehicle, data.parts);
    if (!suggestion) return;
    void run(() => savePartLine(db, visitId, { itemId: item.id, ...suggestion }));
  }

  async function recordFromPad(item: ItemOf, reading: RecordedReading, judgement: ReadingJudgement) {
    await recordReading(db, visitId, item.id, reading, item.unit ?? '');
    sync.changed();
    setPadItem(null);
    if (judgement.verdict === 'attention' || judgement.verdict === 'out_of_range') {
      const value = 'value' in reading ? withUnit(reading.value, item.unit) : reading.textValue;
      setFinding({
        itemId: item.id,
        title: `${item.label}: ${value}`,
        detail: judgement.messages.join(' '),
        severity: judgement.suggestedSeverity && judgement.suggestedSeverity !== 'ok' ? judgement.suggestedSeverity : 'watch',
        suggested: true,
      });
    }
  }

  if (!data.version) return <p className="p-4">The checklist is not on this phone yet. Sync when you have signal.</p>;

  return (
    <div className="flex flex-col gap-5 p-3">
      {alert}
      {data.version.sections.map((section) => {
        const progress = sectionProgress(section, data);
        return (
          <section key={section.id} aria-labelledby={`s-${section.id}`} className="flex flex-col gap-2">
            <div className="sticky top-[var(--shell-header-h,8rem)] z-10 -mx-3 flex items-center gap-3 bg-paper/95 px-3 py-2">
              <h2 id={`s-${section.id}`} className="flex-1 text-xl font-bold">
                {section.title}
              </h2>
              <span className="font-bold">
                {progress.done} of {progress.total}
              </span>
              <div className="h-3 w-20 overflow-hidden rounded-full bg-ink/15" aria-hidden="true">
                <div className="h-full bg-sev-ok" style={{ width: `${(100 * progress.done) / Math.max(1, progress.total)}%` }} />
              </div>
            </div>
            <ul className="flex flex-col gap-2">
              {section.items.map((item) => (
                <li key={item.id} className="rounded-xl border-2 border-ink/15 bg-white p-3">
                  <ItemRow
                    item={item}
                    data={data}
                    settings={settings}
                    locked={locked}
                    state={stateOf(item.id)}
                    onTick={() => toggleTick(item)}
                    onSkip={() => toggleSkip(item)}
                    onOpenPad={() => setPadItem(item)}
                    onFit={() => fitPart(item)}
                  />
                </li>
              ))}
            </ul>
          </section>
        );
      })}

      {undo && (
        <div role="status" className="fixed inset-x-0 bottom-20 z-30 mx-auto flex max-w-xl items-center gap-3 rounded-t-lg bg-ink px-4 py-2 text-white">
          <span className="min-w-0 flex-1 truncate">{undo.label}</span>
          <button type="button" onClick={undoLast} className="min-h-12 rounded-lg border-2 border-white px-4 font-bold">
            Undo
          </button>
        </div>
      )}

      <Suspense fallback={null}>
        {padItem && (
          <ReadingPad
            item={padItem}
            vehicle={data.vehicle}
            current={data.readings.find((r) => r.itemId === padItem.id)}
            settings={settings}
            onRecord={(reading, judgement) => recordFromPad(padItem, reading, judgement)}
            onClose={() => setPadItem(null)}
          />
        )}
        {finding && <FindingSheet device={device} data={data} draft={finding} onClose={() => setFinding(null)} />}
      </Suspense>
    </div>
  );
}

type RowProps = {
  item: ItemOf;
  data: TabProps['data'];
  settings: PhoneSettings;
  locked: boolean;
  state: CheckState;
  onTick: () => void;
  onSkip: () => void;
  onOpenPad: () => void;
  onFit: () => void;
};

function ItemRow({ item, data, settings, locked, state, onTick, onSkip, onOpenPad, onFit }: RowProps) {
  const skipped = itemSkipped(item, data);
  return (
    <div className="flex flex-col gap-2">
      <div className="flex items-start gap-2">
        <p className={`min-w-0 flex-1 pt-2 text-lg font-bold leading-snug ${skipped ? 'text-ink/60 line-through' : ''}`}>{item.label}</p>
        {item.kind === 'check' && (
          <>
            <SkipButton item={item} skipped={skipped} locked={locked} onSkip={onSkip} />
            <button
              type="button"
              onClick={onTick}
              disabled={locked || skipped}
              aria-pressed={state === 'done'}
              aria-label={`Tick: ${item.label}`}
              className={`flex size-16 shrink-0 items-center justify-center rounded-xl border-[3px] ${
                state === 'done' ? 'border-sev-ok bg-sev-ok text-white' : 'border-ink/50 bg-white text-transparent'
              } disabled:opacity-50`}
            >
              <svg width="36" height="36" viewBox="0 0 24 24" aria-hidden="true">
                <path d="M5 12.5l4.5 4.5L19 7" fill="none" stroke="currentColor" strokeWidth="3.2" strokeLinecap="round" strokeLinejoin="round" />
              </svg>
            </button>
          </>
        )}
      </div>
      {item.caution && (
        <p className="flex gap-2 rounded-lg border-2 border-sev-soon bg-sev-soon/10 p-2 text-base">
          <svg width="22" height="22" viewBox="0 0 24 24" aria-hidden="true" className="mt-0.5 shrink-0">
            <path d="M12 2 23 21H1z" fill="var(--color-sev-soon)" />
            <path d="M12 9v5M12 17v.5" stroke="#fff" strokeWidth="2.5" strokeLinecap="round" />
          </svg>
          <span>
            <strong>Caution:</strong> {item.caution}
          </span>
        </p>
      )}
      {item.kind === 'reading' && !skipped && <ReadingValue item={item} data={data} settings={settings} locked={locked} onOpenPad={onOpenPad} />}
      {item.kind === 'part' && !skipped && <PartValue item={item} data={data} locked={locked} onFit={onFit} />}
      {item.hint && item.kind !== 'reading' && <p className="text-base text-ink/80">{item.hint}</p>}
    </div>
  );
}

function SkipButton({ item, skipped, locked, onSkip }: { item: ItemOf; skipped: boolean; locked: boolean; onSkip: () => void }) {
  return (
    <button
      type="button"
      onClick={onSkip}
      disabled={locked}
      aria-pressed={skipped}
      aria-label={`Not applicable: ${item.label}`}
      className={`min-h-12 min-w-14 shrink-0 self-center rounded-lg border-2 px-2 text-base font-bold ${skipped ? 'border-ink bg-ink text-white' : 'border-ink/40 bg-white'} disabled:opacity-50`}
    >
      N/A
    </button>
  );
}

function ReadingValue({ item, data, settings, locked, onOpenPad }: { item: ItemOf; data: TabProps['data']; settings: PhoneSettings; locked: boolean; onOpenPad: () => void }) {
  const reading = data.readings.find((r) => r.itemId === item.id);
  const value = reading ? (reading.textValue ?? reading.value) : null;
  const judgement = value !== null && value !== undefined ? judgeItem(item, data.vehicle, settings, value) : null;
  return (
    <button
      type="button"
      onClick={onOpenPad}
      disabled={locked}
      aria-label={`Reading: ${item.label}`}
      className="flex min-h-16 items-center gap-3 rounded-lg border-2 border-brand bg-white px-3 text-left disabled:border-ink/20"
    >
      {judgement ? (
        <>
          <VerdictIcon judgement={judgement} size={30} />
          <span className="flex-1">
            <span className="block font-mono text-2xl font-bold">{typeof value === 'number' ? withUnit(formatNumber(value), item.unit) : value}</span>
            <span className="block text-base">{VERDICT_LABEL[judgement.verdict]}</span>
          </span>
          {!locked && <span className="font-bold text-brand">Change</span>}
        </>
      ) : (
        <span className="flex-1 text-lg font-bold text-brand">
          Enter reading{item.expectedMin !== null && item.expectedMax !== null ? ` (${formatNumber(item.expectedMin)} to ${withUnit(item.expectedMax, item.unit)})` : ''}
        </span>
      )}
    </button>
  );
}

function PartValue({ item, data, locked, onFit }: { item: ItemOf; data: TabProps['data']; locked: boolean; onFit: () => void }) {
  const fitted = data.partLines.filter((l) => l.itemId === item.id && !l.removed);
  const suggestion = suggestPart(item, data.vehicle, data.parts);
  if (fitted.length > 0) {
    return (
      <p className="flex items-center gap-2 font-bold text-sev-ok">
        <svg width="24" height="24" viewBox="0 0 24 24" aria-hidden="true">
          <circle cx="12" cy="12" r="11" fill="currentColor" />
          <path d="M6.5 12.5l3.5 3.5 7.5-8" fill="none" stroke="#fff" strokeWidth="2.6" strokeLinecap="round" />
        </svg>
        Fitted: {fitted.map((l) => `${l.partNumber} × ${withUnit(l.quantity, l.unit)}`).join(', ')}
        <a href="#parts" className="ml-auto min-h-12 content-center px-2 text-brand underline">
          Change
        </a>
      </p>
    );
  }
  if (!suggestion) {
    return (
      <p className="text-base">
        No part for this on the vehicle’s spec. Add one on <a href="#parts" className="font-bold text-brand underline">Parts</a> if you fitted one; if not, the record shows it as not done.
      </p>
    );
  }
  return (
    <button type="button" onClick={onFit} disabled={locked} className="flex min-h-14 items-center justify-between gap-2 rounded-lg border-2 border-brand bg-white px-3 text-left disabled:opacity-50" aria-label={`Fitted: ${item.label}`}>
      <span>
        <span className="block font-bold">{suggestion.partNumber}</span>
        <span className="block text-base">
          {suggestion.description} × {withUnit(suggestion.quantity, suggestion.unit)}
        </span>
      </span>
      <span className="rounded-lg bg-brand px-3 py-2 font-bold text-white">Fitted</span>
    </button>
  );
}
