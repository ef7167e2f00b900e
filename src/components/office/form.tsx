// The one form pattern of the console: react-hook-form with the same zod schema the endpoint
// uses. The form checks as the office types; on submit it sends what was typed (the raw input)
// and the server parses it again, so the browser never decides alone.
import { zodResolver } from '@hookform/resolvers/zod';
import type { ReactNode } from 'react';
import {
  get,
  useForm,
  type DefaultValues,
  type FieldValues,
  type Path,
  type UseFormReturn,
} from 'react-hook-form';
import type { z } from 'zod';
import { ApiError } from './api';

export function useZodForm<S extends z.ZodType<unknown, FieldValues>>(schema: S, defaultValues: DefaultValues<z.input<S>>) {
  return useForm<z.input<S>, unknown, z.input<S>>({
    resolver: zodResolver(schema as never, undefined, { raw: true }) as never,
    defaultValues,
    mode: 'onTouched',
  });
}

/** Puts the server's "field: problem" details beside their fields; returns the overall message. */
export function showServerError<T extends FieldValues>(form: UseFormReturn<T, unknown, T>, error: unknown): string {
  if (!(error instanceof ApiError)) return 'Something went wrong. Nothing was saved; try again.';
  for (const detail of error.details) {
    const colon = detail.indexOf(': ');
    if (colon > 0) form.setError(detail.slice(0, colon) as Path<T>, { type: 'server', message: detail.slice(colon + 2) });
  }
  return error.message;
}

type FieldProps<T extends FieldValues> = {
  form: UseFormReturn<T, unknown, T>;
  name: Path<T>;
  label: string;
  hint?: ReactNode;
  className?: string;
};

const inputClass =
  'min-h-10 w-full rounded border border-ink/40 bg-white px-2 py-1 text-base aria-[invalid=true]:border-2 aria-[invalid=true]:border-sev-now';

function FieldFrame<T extends FieldValues>({ form, name, label, hint, className, children }: FieldProps<T> & { children: ReactNode }) {
  const error = get(form.formState.errors, name) as { message?: string } | undefined;
  const id = `field-${String(name).replace(/\W+/g, '-')}`;
  return (
    <div className={`flex flex-col gap-1 ${className ?? ''}`}>
      <label htmlFor={id} className="text-sm font-bold">
        {label}
      </label>
      {children}
      {hint && !error && <p className="text-sm text-ink/70">{hint}</p>}
      {error?.message && (
        <p id={`${id}-error`} role="alert" className="text-sm font-bold text-sev-now">
          {label}: {error.message}
        </p>
      )}
    </div>
  );
}

function a11y<T extends FieldValues>(form: UseFormReturn<T, unknown, T>, name: Path<T>) {
  const id = `field-${String(name).replace(/\W+/g, '-')}`;
  const invalid = Boolean(get(form.formState.errors, name));
  return { id, 'aria-invalid': invalid, 'aria-describedby': invalid ? `${id}-error` : undefined };
}

export function TextField<T extends FieldValues>(
  props: FieldProps<T> & { type?: string; placeholder?: string; autoComplete?: string; inputMode?: 'decimal' | 'numeric' | 'text' | 'email' | 'tel' },
) {
  const { form, name, type = 'text', placeholder, autoComplete, inputMode } = props;
  return (
    <FieldFrame {...props}>
      <input
        {...form.register(name)}
        {...a11y(form, name)}
        type={type}
        placeholder={placeholder}
        autoComplete={autoComplete ?? 'off'}
        inputMode={inputMode}
        className={inputClass}
      />
    </FieldFrame>
  );
}

export function TextAreaField<T extends FieldValues>(props: FieldProps<T> & { rows?: number }) {
  const { form, name, rows = 3 } = props;
  return (
    <FieldFrame {...props}>
      <textarea {...form.register(name)} {...a11y(form, name)} rows={rows} className={inputClass} />
    </FieldFrame>
  );
}

export function SelectField<T extends FieldValues>(
  props: FieldProps<T> & { options: readonly { value: string; label: string }[]; empty?: string },
) {
  const { form, name, options, empty } = props;
  return (
    <FieldFrame {...props}>
      <select {...form.register(name)} {...a11y(form, name)} className={inputClass}>
        {empty !== undefined && <option value="">{empty}</option>}
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </FieldFrame>
  );
}

export function FormMessage({ message }: { message: string | null }) {
  if (!message) return null;
  return (
    <p role="alert" className="rounded border-2 border-sev-now bg-white p-3 font-bold text-sev-now">
      {message}
    </p>
  );
}
