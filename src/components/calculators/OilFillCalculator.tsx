import { useState } from 'react';
import { oilFillPlan } from '../../lib/trade';
import { attempt, Caution, ChoiceGroup, ErrorNote, formatNumber, NoteList, NumberField, readNumber, Result, SourceNote } from './parts';

const JUGS = [
  { value: '0.5', label: '0.5 L' },
  { value: '1', label: '1 L' },
  { value: '2', label: '2 L' },
  { value: '5', label: '5 L' },
] as const;

export default function OilFillCalculator() {
  const [capacity, setCapacity] = useState('');
  const [jug, setJug] = useState<(typeof JUGS)[number]['value']>('1');
  const [span, setSpan] = useState('');
  const [level, setLevel] = useState('');

  const capacityL = readNumber(capacity);
  const spanL = readNumber(span);
  const levelPercent = readNumber(level);
  const plan =
    capacityL === null
      ? null
      : attempt(() =>
          oilFillPlan({
            capacityL,
            jugL: Number(jug),
            dipstickSpanL: spanL,
            levelBetweenMarks: levelPercent === null ? null : levelPercent / 100,
          }),
        );

  return (
    <div className="flex flex-col gap-4">
      <Caution>Engine oil and the exhaust can be hot enough to burn: let them cool, wear gloves. Take used oil to a licensed site.</Caution>
      <NumberField label="Oil capacity with filter" value={capacity} onChange={setCapacity} unit="L" hint="From the vehicle card." />
      <ChoiceGroup legend="Jug size" value={jug} onChange={setJug} options={JUGS} />
      <NumberField label="Volume between dipstick marks (optional)" value={span} onChange={setSpan} unit="L" />
      {span.trim() !== '' ? (
        <NumberField label="Level now, from lower mark (optional)" value={level} onChange={setLevel} unit="%" hint="0 % at the lower mark, 100 % at the upper." />
      ) : null}
      {plan?.error ? <ErrorNote message={plan.error} /> : null}
      {plan && plan.error === null ? (
        <Result label="Pours" testId="oil-result">
          <p className="text-3xl font-bold" data-testid="oil-pours">
            {plan.value.pours.map((p) => `${formatNumber(p, 3)} L`).join(' + ')}
          </p>
          <p className="text-lg">
            {plan.value.fullJugs} full {plan.value.fullJugs === 1 ? 'jug' : 'jugs'}
            {plan.value.pours.length > plan.value.fullJugs ? `, then ${formatNumber(plan.value.lastPourL, 3)} L` : ''}.
          </p>
          {plan.value.topUpL !== null ? (
            <p className="text-xl font-bold" data-testid="oil-top-up">
              Top-up to the upper mark: {formatNumber(plan.value.topUpL, 3)} L
            </p>
          ) : null}
          <NoteList notes={plan.value.advice} />
        </Result>
      ) : null}
      <SourceNote source="Arithmetic on the capacity from the vehicle data, measured to the millilitre." />
    </div>
  );
}
