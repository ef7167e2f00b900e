import { useState } from 'react';
import { COOLANT_SOURCES, coolantFreezePoint, glycolForProtection, type Glycol } from '../../lib/trade';
import { attempt, Caution, ChoiceGroup, ErrorNote, formatNumber, NoteList, NumberField, readNumber, Result, SourceNote } from './parts';

type Mode = 'strength' | 'protection';

export default function CoolantCalculator() {
  const [mode, setMode] = useState<Mode>('strength');
  const [glycol, setGlycol] = useState<Glycol>('ethylene');
  const [strength, setStrength] = useState('');
  const [target, setTarget] = useState('');
  const [capacity, setCapacity] = useState('');

  const strengthValue = readNumber(strength);
  const targetValue = readNumber(target);
  const capacityValue = readNumber(capacity);
  const freeze = mode === 'strength' && strengthValue !== null ? attempt(() => coolantFreezePoint(strengthValue, glycol)) : null;
  const need =
    mode === 'protection' && targetValue !== null ? attempt(() => glycolForProtection(targetValue, glycol, { systemCapacityL: capacityValue })) : null;
  const error = freeze?.error ?? need?.error ?? null;

  return (
    <div className="flex flex-col gap-4">
      <Caution>Never open a hot cooling system: it is under pressure. Coolant is poisonous; keep it from children and pets.</Caution>
      <ChoiceGroup
        legend="Work out"
        value={mode}
        onChange={setMode}
        options={[
          { value: 'strength', label: 'Protection' },
          { value: 'protection', label: 'Glycol needed' },
        ]}
      />
      <ChoiceGroup
        legend="Glycol"
        value={glycol}
        onChange={setGlycol}
        options={[
          { value: 'ethylene', label: 'Ethylene' },
          { value: 'propylene', label: 'Propylene' },
        ]}
      />
      {mode === 'strength' ? (
        <NumberField label="Glycol strength by volume" value={strength} onChange={setStrength} unit="%" hint="From the refractometer or hydrometer." />
      ) : (
        <>
          <NumberField label="Protect down to" value={target} onChange={setTarget} unit="°C" hint="For example −25." />
          <NumberField label="Cooling system capacity (optional)" value={capacity} onChange={setCapacity} unit="L" />
        </>
      )}
      {error ? <ErrorNote message={error} /> : null}
      {freeze && freeze.error === null ? (
        <Result label="Freezing point" testId="coolant-result">
          <p className="text-4xl font-bold" data-testid="coolant-value">
            {freeze.value.freezePointC === null ? 'Beyond the table' : `${formatNumber(freeze.value.freezePointC, 1)} °C`}
          </p>
          {freeze.value.freezePointF !== null ? <p className="text-lg">{formatNumber(freeze.value.freezePointF, 1)} °F</p> : null}
          {freeze.value.glycolMassPercent !== null ? <p className="text-base">{formatNumber(freeze.value.glycolMassPercent, 1)} % glycol by mass.</p> : null}
          <NoteList notes={freeze.value.notes} />
        </Result>
      ) : null}
      {need && need.error === null ? (
        <Result label="Glycol needed" testId="coolant-result">
          <p className="text-4xl font-bold" data-testid="coolant-value">
            {formatNumber(need.value.glycolVolPercent, 1)} % by volume
          </p>
          {need.value.glycolL !== null ? <p className="text-xl font-bold">{formatNumber(need.value.glycolL, 2)} L of glycol in the system</p> : null}
          <NoteList notes={need.value.notes} />
        </Result>
      ) : null}
      <SourceNote source={COOLANT_SOURCES[glycol]} />
    </div>
  );
}

