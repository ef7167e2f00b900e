// Building blocks of the calculators: big fields for gloved hands, results that never rely on
// colour alone, and the source line every figure carries.
import { useId, type ReactNode } from 'react';
import { parseTypedNumber, type Severity } from '../../lib/trade';

/** Reads a field as typed; null while it is empty or not yet a number. */
export function readNumber(text: string): number | null {
  return text.trim() === '' ? null : parseTypedNumber(text);
}

/** Runs a calculation; a thrown Error becomes the message to show instead of a result. */
export function attempt<T>(compute: () => T): { value: T; error: null } | { value: null; error: string } {
  try {
    return { value: compute(), error: null };
  } catch (error) {
    return { value: null, error: error instanceof Error ? error.message : String(error) };
  }
}

export function formatNumber(n: number, maxDecimals = 2): string {
  return new Intl.NumberFormat('en-GB', { maximumFractionDigits: maxDecimals }).format(n);
}

const fieldClass =
  'min-h-14 w-full rounded-lg border-2 border-ink/70 bg-white px-3 text-2xl font-bold text-ink focus:border-brand focus:outline-none';

export function NumberField(props: { label: string; value: string; onChange: (v: string) => void; unit?: string; hint?: string; name?: string }) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-lg font-bold">
        {props.label}
      </label>
      <div className="flex items-center gap-2">
        <input
          id={id}
          name={props.name}
          type="text"
          inputMode="decimal"
          autoComplete="off"
          enterKeyHint="done"
          value={props.value}
          onChange={(e) => props.onChange(e.target.value)}
          className={fieldClass}
        />
        {props.unit ? <span className="min-w-12 text-xl font-bold">{props.unit}</span> : null}
      </div>
      {props.hint ? <p className="text-base text-ink/80">{props.hint}</p> : null}
    </div>
  );
}

export function SelectField<T extends string>(props: { label: string; value: T; onChange: (v: T) => void; options: readonly { value: T; label: string }[] }) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-lg font-bold">
        {props.label}
      </label>
      <select id={id} value={props.value} onChange={(e) => props.onChange(e.target.value as T)} className={`${fieldClass} text-xl`}>
        {props.options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </div>
  );
}

/** A row of big radio buttons (a segmented choice); every option is at least 48 px square. */
export function ChoiceGroup<T extends string>(props: { legend: string; value: T; onChange: (v: T) => void; options: readonly { value: T; label: string }[] }) {
  const name = useId();
  return (
    <fieldset className="flex flex-col gap-1">
      <legend className="mb-1 text-lg font-bold">{props.legend}</legend>
      <div className="grid gap-2" style={{ gridTemplateColumns: `repeat(${props.options.length <= 4 ? props.options.length : 3}, minmax(0, 1fr))` }}>
        {props.options.map((o) => {
          const checked = o.value === props.value;
          return (
            <label
              key={o.value}
              className={`flex min-h-12 cursor-pointer items-center justify-center rounded-lg border-2 px-1 text-center text-lg leading-tight font-bold ${
                checked ? 'border-brand-dark bg-brand-dark text-white' : 'border-ink/60 bg-white text-ink'
              }`}
            >
              <input type="radio" name={name} value={o.value} checked={checked} onChange={() => props.onChange(o.value)} className="sr-only" />
              {checked ? <span aria-hidden="true" className="mr-1">✓</span> : null}
              {o.label}
            </label>
          );
        })}
      </div>
    </fieldset>
  );
}

const SEVERITY_LOOK: Record<Severity, { label: string; className: string; icon: ReactNode }> = {
  ok: {
    label: 'Fine',
    className: 'bg-sev-ok',
    // A circle with a tick.
    icon: <path d="M12 2a10 10 0 1 1 0 20a10 10 0 0 1 0-20Zm-1.2 13.6l6-6-1.4-1.4-4.6 4.6-2.2-2.2-1.4 1.4Z" />,
  },
  watch: {
    label: 'Watch',
    className: 'bg-sev-watch',
    // An eye-like lozenge.
    icon: <path d="M12 5c5 0 9 4.5 10 7-1 2.5-5 7-10 7S3 14.5 2 12c1-2.5 5-7 10-7Zm0 3.5a3.5 3.5 0 1 0 0 7a3.5 3.5 0 0 0 0-7Z" />,
  },
  soon: {
    label: 'Soon',
    className: 'bg-sev-soon',
    // A triangle with a bar.
    icon: <path d="M12 2 23 21H1Zm-1 7v6h2V9Zm0 8v2h2v-2Z" />,
  },
  now: {
    label: 'Now',
    className: 'bg-sev-now',
    // An octagon with a bar.
    icon: <path d="M8 2h8l6 6v8l-6 6H8l-6-6V8Zm3 5v7h2V7Zm0 9v2h2v-2Z" />,
  },
};

/** Severity shown by shape, word and colour together, never by colour alone. */
export function SeverityMark({ severity }: { severity: Severity }) {
  const look = SEVERITY_LOOK[severity];
  return (
    <span className={`inline-flex items-center gap-1 rounded-full px-3 py-1 text-base font-bold text-white ${look.className}`}>
      <svg viewBox="0 0 24 24" width="22" height="22" fill="currentColor" fillRule="evenodd" aria-hidden="true">
        {look.icon}
      </svg>
      {look.label}
    </span>
  );
}

export function Result(props: { label: string; children: ReactNode; severity?: Severity | null; testId?: string }) {
  return (
    <section aria-label={props.label} data-testid={props.testId} className="flex flex-col gap-2 rounded-xl border-2 border-ink bg-white p-4" aria-live="polite">
      <div className="flex items-center justify-between gap-2">
        <h3 className="text-lg font-bold">{props.label}</h3>
        {props.severity ? <SeverityMark severity={props.severity} /> : null}
      </div>
      {props.children}
    </section>
  );
}

export function NoteList({ notes }: { notes: readonly string[] }) {
  return (
    <ul className="list-disc pl-5 text-base">
      {notes.map((n) => (
        <li key={n}>{n}</li>
      ))}
    </ul>
  );
}

export function ErrorNote({ message }: { message: string }) {
  return (
    <p role="alert" className="flex gap-2 rounded-xl border-2 border-sev-now bg-white p-4 text-lg font-bold text-sev-now">
      <svg viewBox="0 0 24 24" width="24" height="24" fill="currentColor" aria-hidden="true" className="shrink-0">
        <path d="M8 2h8l6 6v8l-6 6H8l-6-6V8Zm3 5v7h2V7Zm0 9v2h2v-2Z" />
      </svg>
      <span>{message}</span>
    </p>
  );
}

export function Caution({ children }: { children: ReactNode }) {
  return (
    <p className="flex gap-2 rounded-xl border-2 border-accent bg-accent/15 p-3 text-base">
      <svg viewBox="0 0 24 24" width="24" height="24" fill="currentColor" aria-hidden="true" className="shrink-0 text-ink">
        <path d="M12 2 23 21H1Zm-1 7v6h2V9Zm0 8v2h2v-2Z" />
      </svg>
      <span>
        <strong>Caution. </strong>
        {children}
      </span>
    </p>
  );
}

/** The source of the figures, and the precedence every specification screen states. */
export function SourceNote({ source }: { source: string }) {
  return (
    <footer className="flex flex-col gap-1 border-t-2 border-ink/20 pt-3 text-base">
      <p>
        <strong>Source:</strong> {source}
      </p>
      <p className="font-bold">The vehicle maker's data and local regulations take precedence over these figures.</p>
    </footer>
  );
}
