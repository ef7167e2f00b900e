// A button that performs one office action (send, discard, run...) and then reloads or moves on.
import { useState } from 'react';
import { requestJson } from './request';

type Props = {
  url: string;
  label: string;
  method?: 'POST' | 'DELETE';
  body?: unknown;
  confirm?: string;
  navigateTo?: string;
  /** Where to go, from a field of the answer (e.g. a new invoice's id). */
  navigateToTemplate?: { prefix: string; field: string };
  variant?: 'primary' | 'secondary' | 'danger';
};

const STYLES = {
  primary: 'bg-brand text-white',
  secondary: 'border-2 border-ink bg-white text-ink',
  danger: 'border-2 border-sev-now bg-white text-sev-now',
};

export default function ActionButton(props: Props) {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  async function run() {
    if (props.confirm && !window.confirm(props.confirm)) return;
    setBusy(true);
    setError(null);
    try {
      const answer = await requestJson<Record<string, string>>(props.url, props.method ?? 'POST', props.body);
      if (props.navigateToTemplate) window.location.assign(`${props.navigateToTemplate.prefix}${answer[props.navigateToTemplate.field]}`);
      else if (props.navigateTo) window.location.assign(props.navigateTo);
      else window.location.reload();
    } catch (e) {
      setError((e as Error).message);
      setBusy(false);
    }
  }
  return (
    <span className="inline-flex flex-col gap-1">
      <button type="button" onClick={run} disabled={busy} className={`min-h-10 rounded px-4 font-bold disabled:opacity-60 ${STYLES[props.variant ?? 'primary']}`}>
        {busy ? 'Working…' : props.label}
      </button>
      {error && (
        <span role="alert" className="max-w-md text-sm font-bold text-sev-now">
          {error}
        </span>
      )}
    </span>
  );
}
