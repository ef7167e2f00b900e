// The number pad for a reading: big keys for gloved fingers, the unit always in view, and the
// value judged as it is typed (range, torque wrench span, legal limits, oil grades that exist).
import { useEffect, useMemo, useState } from 'react';
import { parseTypedNumber } from '../../lib/trade';
import { markUnsaved } from '../../lib/device/boot';
import type { LocalReadingResult, LocalVehicle } from '../../lib/device/db';
import type { ItemOf } from '../../lib/device/visit-progress';
import { formatNumber, unitLabel, withUnit } from '../phone/format';
import { Sheet } from '../ui/Sheet';
import { judgeItem, type PhoneSettings, type ReadingJudgement } from './judge';
import { VERDICT_LABEL, VerdictIcon } from './VerdictLine';

// SAE J300 grades a technician pours most; anything else is typed.
const COMMON_GRADES = ['0W-20', '0W-30', '5W-30', '5W-40', '10W-40', '15W-40'];
const KEYS = ['1', '2', '3', '4', '5', '6', '7', '8', '9', '.', '0', 'del'] as const;

export type RecordedReading = { value: number } | { textValue: string };

type Props = {
  item: ItemOf;
  vehicle: LocalVehicle | undefined;
  current: LocalReadingResult | undefined;
  settings: PhoneSettings;
  onRecord: (reading: RecordedReading, judgement: ReadingJudgement) => Promise<void>;
  onClose: () => void;
};

function initialText(item: ItemOf, vehicle: LocalVehicle | undefined, current: LocalReadingResult | undefined): string {
  if (current) return current.textValue ?? (current.value !== null ? formatNumber(current.value) : '');
  // Used oil is prefilled from the vehicle's oil capacity: what went in is what came out, near enough.
  if (item.rule === 'used_oil' && vehicle?.oilCapacityL) return formatNumber(vehicle.oilCapacityL);
  return '';
}

export function ReadingPad({ item, vehicle, current, settings, onRecord, onClose }: Props) {
  const textMode = item.unit === '{grade}';
  const [typed, setTyped] = useState(() => initialText(item, vehicle, current));
  const [saving, setSaving] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const allowsNegative = (item.expectedMin ?? 0) < 0 || item.rule === 'coolant_protection';

  useEffect(() => {
    markUnsaved('reading', typed ? `the reading for “${item.label}”` : null);
    return () => markUnsaved('reading', null);
  }, [typed, item.label]);

  const judgement = useMemo(() => (typed.trim() ? judgeItem(item, vehicle, settings, typed) : null), [typed, item, vehicle, settings]);
  const number = textMode ? null : parseTypedNumber(typed);
  const canRecord = !!judgement && judgement.verdict !== 'invalid' && (textMode ? typed.trim().length > 0 : number !== null);

  function press(key: (typeof KEYS)[number] | 'minus') {
    setError(null);
    setTyped((t) => {
      if (key === 'del') return t.slice(0, -1);
      if (key === 'minus') return t.startsWith('-') ? t.slice(1) : `-${t}`;
      if (key === '.' && t.includes('.')) return t;
      if (t.replace(/[-.]/g, '').length >= 7) return t;
      return t + key;
    });
  }

  async function record() {
    if (!canRecord || !judgement) return;
    setSaving(true);
    try {
      await onRecord(textMode ? { textValue: typed.trim() } : { value: number! }, judgement);
    } catch (e) {
      setError(e instanceof Error ? e.message : String(e));
      setSaving(false);
    }
  }

  const range =
    item.expectedMin !== null && item.expectedMax !== null
      ? `Expected ${formatNumber(item.expectedMin)} to ${withUnit(item.expectedMax, item.unit)}`
      : item.expectedMin !== null
        ? `Expected at least ${withUnit(item.expectedMin, item.unit)}`
        : item.expectedMax !== null
          ? `Expected at most ${withUnit(item.expectedMax, item.unit)}`
          : null;
  const shown = textMode ? typed : typed.replace('-', '−');

  return (
    <Sheet
      title={item.label}
      onClose={onClose}
      closeLabel="Cancel"
      footer={
        <div className="flex flex-col gap-2">
          {!textMode && (
            <div className="grid grid-cols-3 gap-2" aria-label="Number pad">
              {allowsNegative && (
                <button type="button" onClick={() => press('minus')} className="col-span-3 min-h-12 rounded-lg border-2 border-ink/40 bg-white text-xl font-bold" aria-label="Minus">
                  − (below zero)
                </button>
              )}
              {KEYS.map((key) => (
                <button
                  key={key}
                  type="button"
                  onClick={() => press(key)}
                  aria-label={key === 'del' ? 'Delete' : key === '.' ? 'Decimal point' : key}
                  className="min-h-14 rounded-lg border-2 border-ink/30 bg-paper text-3xl font-bold active:bg-ink/10"
                >
                  {key === 'del' ? '⌫' : key}
                </button>
              ))}
            </div>
          )}
          <button
            type="button"
            onClick={record}
            disabled={!canRecord || saving}
            className="min-h-16 w-full rounded-lg bg-brand px-4 text-xl font-bold text-white disabled:bg-ink/30 disabled:text-ink/70"
          >
            {canRecord ? `Record ${withUnit(textMode ? typed.trim() : formatNumber(number!), item.unit)}` : 'Record'}
          </button>
        </div>
      }
    >
      <div className="flex flex-col gap-3">
        {(range || item.hint) && (
          <p className="text-base">
            {range}
            {range && item.hint ? '. ' : ''}
            {item.hint}
          </p>
        )}
        {item.rule === 'torque_wrench' && !settings.wrench && (
          <p className="rounded-lg border-2 border-sev-watch bg-white p-2 text-base">
            Your torque wrench’s marked range is not set, so the reading is not checked against it. Set it on <a className="font-bold underline" href="/device">This phone</a>.
          </p>
        )}
        {textMode ? (
          <>
            <label className="flex flex-col gap-1 font-bold">
              Grade as printed on the container
              <input
                value={typed}
                onChange={(e) => setTyped(e.target.value.toUpperCase())}
                autoCapitalize="characters"
                autoComplete="off"
                className="min-h-16 rounded-lg border-2 border-ink/60 bg-white px-3 font-mono text-3xl"
              />
            </label>
            <div className="grid grid-cols-3 gap-2">
              {COMMON_GRADES.map((grade) => (
                <button key={grade} type="button" onClick={() => setTyped(grade)} className="min-h-14 rounded-lg border-2 border-ink/40 bg-white font-mono text-xl font-bold">
                  {grade}
                </button>
              ))}
            </div>
          </>
        ) : (
          <output aria-label="Typed value" className="flex min-h-20 items-baseline justify-end gap-2 rounded-lg border-2 border-ink/60 bg-white px-4 py-2">
            <span className="font-mono text-5xl font-bold" data-testid="typed-value">
              {shown || '\u00a0'}
            </span>
            <span className="text-2xl font-bold">{unitLabel(item.unit)}</span>
          </output>
        )}

        <Judgement judgement={judgement} />
        {error && (
          <p role="alert" className="font-bold text-sev-now">
            {error}
          </p>
        )}

      </div>
    </Sheet>
  );
}

function Judgement({ judgement }: { judgement: ReadingJudgement | null }) {
  if (!judgement) return <p className="min-h-16 text-base text-ink/80">Type the reading; it is checked as you go.</p>;
  const invalid = judgement.verdict === 'invalid';
  return (
    <div className={`flex min-h-16 gap-3 rounded-lg border-2 bg-white p-3 ${invalid ? 'border-sev-now' : 'border-ink/20'}`} role={invalid ? 'alert' : 'status'} data-testid="judgement">
      <VerdictIcon judgement={judgement} size={32} />
      <div className="min-w-0">
        <p className="text-lg font-bold">{VERDICT_LABEL[judgement.verdict]}</p>
        {judgement.messages.map((m) => (
          <p key={m}>{m}</p>
        ))}
        {judgement.source && <p className="mt-1 text-base text-ink/80">Source: {judgement.source}</p>}
      </div>
    </div>
  );
}
