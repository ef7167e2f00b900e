// A quantity typed in whichever unit is at hand (a torque in lbf·ft off an old manual, a
// pressure in psi off a placard) and kept in the SI unit the spec stores. The other units are
// shown beside it, converted by lib/trade.
import { useId, useState } from 'react';
import { get, type FieldValues, type Path, type PathValue, type UseFormReturn } from 'react-hook-form';
import { convert, parseTypedNumber, unit } from '../../lib/trade';

// Display precision: enough for a torque wrench or a gauge, without conversion noise.
const SIGNIFICANT = 4;

function show(value: number): string {
  return String(Number(value.toPrecision(SIGNIFICANT)));
}

export function QuantityField<T extends FieldValues>({
  form,
  name,
  label,
  units,
}: {
  form: UseFormReturn<T, unknown, T>;
  name: Path<T>;
  label: string;
  /** UCUM codes; the first is the unit the value is stored in. */
  units: readonly [string, ...string[]];
}) {
  const id = useId();
  const base = units[0];
  const stored = form.getValues(name) as unknown;
  const storedNumber = stored === '' || stored === null || stored === undefined ? null : Number(stored);
  const [chosen, setChosen] = useState(base);
  const [text, setText] = useState(storedNumber === null || Number.isNaN(storedNumber) ? '' : show(storedNumber));
  const error = get(form.formState.errors, name) as { message?: string } | undefined;

  const typed = text.trim() === '' ? null : parseTypedNumber(text);
  const inBase = typed === null ? null : chosen === base ? typed : convert(typed, chosen, base);

  const update = (nextText: string, nextUnit: string) => {
    setText(nextText);
    setChosen(nextUnit);
    const n = nextText.trim() === '' ? null : parseTypedNumber(nextText);
    // A value that is not a number goes to the form as typed, so the schema names the problem.
    const value = nextText.trim() === '' ? '' : n === null ? nextText : String(Number((nextUnit === base ? n : convert(n, nextUnit, base)).toFixed(6)));
    form.setValue(name, value as PathValue<T, Path<T>>, { shouldDirty: true, shouldValidate: true });
  };
  const switchUnit = (nextUnit: string) => {
    // Keep the quantity, change how it is written.
    update(typed === null ? text : show(convert(typed, chosen, nextUnit)), nextUnit);
  };

  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-bold">
        {label}
      </label>
      <div className="flex gap-1">
        <input
          id={id}
          value={text}
          inputMode="decimal"
          onChange={(e) => update(e.target.value, chosen)}
          onBlur={() => form.trigger(name)}
          aria-invalid={Boolean(error)}
          className="min-h-10 w-full min-w-0 rounded border border-ink/40 bg-white px-2 aria-[invalid=true]:border-2 aria-[invalid=true]:border-sev-now"
        />
        <select aria-label={`${label}: unit`} value={chosen} onChange={(e) => switchUnit(e.target.value)} className="min-h-10 rounded border border-ink/40 bg-white px-1">
          {units.map((u) => (
            <option key={u} value={u}>
              {unit(u).label}
            </option>
          ))}
        </select>
      </div>
      {inBase !== null && !error && (
        <p className="text-sm text-ink/70">
          {units
            .filter((u) => u !== chosen)
            .map((u) => `${show(convert(inBase, base, u))} ${unit(u).label}`)
            .join(' · ')}
        </p>
      )}
      {error?.message && (
        <p role="alert" className="text-sm font-bold text-sev-now">
          {label}: {error.message}
        </p>
      )}
    </div>
  );
}
