import { useState } from 'react';
import { convert, unitsOf, type Dimension } from '../../lib/trade';
import { attempt, ChoiceGroup, ErrorNote, formatNumber, NumberField, readNumber, Result, SelectField, SourceNote } from './parts';

const DIMENSIONS: { value: Dimension; label: string; from: string; to: string }[] = [
  { value: 'torque', label: 'Torque', from: 'N.m', to: '[lbf_av].[ft_i]' },
  { value: 'pressure', label: 'Pressure', from: '[psi]', to: 'kPa' },
  { value: 'volume', label: 'Volume', from: 'L', to: '[qt_us]' },
  { value: 'length', label: 'Length', from: 'km', to: '[mi_i]' },
  { value: 'temperature', label: 'Temp.', from: 'Cel', to: '[degF]' },
  { value: 'electric potential', label: 'Voltage', from: 'V', to: 'mV' },
];

const SOURCE =
  'Exact factors from the definitions in NIST SP 811 (2008), Appendix B (inch 25.4 mm, pound 0.453 592 37 kg, standard gravity 9.806 65 m/s², US gallon 231 in³); imperial gallon 4.546 09 L (UK Weights and Measures Act 1985).';

export default function UnitConverter() {
  const [dimension, setDimension] = useState<Dimension>('torque');
  const [from, setFrom] = useState('N.m');
  const [to, setTo] = useState('[lbf_av].[ft_i]');
  const [text, setText] = useState('');

  const units = unitsOf(dimension).map((u) => ({ value: u.code, label: u.label }));
  const label = (code: string) => units.find((u) => u.value === code)?.label ?? code;
  const value = readNumber(text);
  const result = value === null ? null : attempt(() => convert(value, from, to));

  function pickDimension(d: Dimension) {
    const preset = DIMENSIONS.find((x) => x.value === d)!;
    setDimension(d);
    setFrom(preset.from);
    setTo(preset.to);
  }

  return (
    <div className="flex flex-col gap-4">
      <ChoiceGroup legend="Quantity" value={dimension} onChange={pickDimension} options={DIMENSIONS} />
      <NumberField label={`Value in ${label(from)}`} value={text} onChange={setText} unit={label(from)} />
      <div className="grid grid-cols-[1fr_auto_1fr] items-end gap-2">
        <SelectField label="From" value={from} onChange={setFrom} options={units} />
        <button
          type="button"
          onClick={() => {
            setFrom(to);
            setTo(from);
          }}
          className="min-h-14 min-w-14 rounded-lg border-2 border-ink bg-white text-2xl font-bold"
          aria-label="Swap the units"
        >
          ⇄
        </button>
        <SelectField label="To" value={to} onChange={setTo} options={units} />
      </div>
      {text.trim() !== '' && value === null ? <ErrorNote message={`"${text}" is not a number.`} /> : null}
      {result?.error ? <ErrorNote message={result.error} /> : null}
      {result && result.error === null ? (
        <Result label="Result" testId="unit-result">
          <p className="text-4xl font-bold" data-testid="unit-result-value">
            {formatNumber(result.value, dimension === 'temperature' ? 1 : 4)} {label(to)}
          </p>
          <ul className="grid grid-cols-2 gap-x-4 text-lg">
            {units
              .filter((u) => u.value !== to && u.value !== from)
              .map((u) => (
                <li key={u.value}>
                  {formatNumber(convert(value!, from, u.value), 3)} {u.label}
                </li>
              ))}
          </ul>
        </Result>
      ) : null}
      <SourceNote source={SOURCE} />
    </div>
  );
}
