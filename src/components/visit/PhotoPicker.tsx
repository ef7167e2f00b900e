// "Take photo": the camera on a phone (`capture`), a file chooser elsewhere. The photo is
// downscaled and stored on the phone at once; it uploads when there is signal.
import { useId, useState } from 'react';
import { preparePhoto } from '../../lib/device/photo-prepare';
import type { PreparedPhoto } from '../../lib/device/visit-actions';

type Props = { label: string; disabled?: boolean; onPhoto: (photo: PreparedPhoto) => Promise<void> };

export function PhotoPicker({ label, disabled, onPhoto }: Props) {
  const id = useId();
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);

  async function onChange(event: React.ChangeEvent<HTMLInputElement>) {
    const files = [...(event.target.files ?? [])];
    event.target.value = '';
    if (files.length === 0) return;
    setBusy(true);
    setProblem(null);
    try {
      for (const file of files) await onPhoto(await preparePhoto(file));
    } catch (error) {
      setProblem(error instanceof Error ? error.message : String(error));
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="flex flex-col gap-1">
      <label
        htmlFor={id}
        className={`flex min-h-14 cursor-pointer items-center justify-center gap-2 rounded-lg border-2 border-brand bg-white px-4 text-lg font-bold text-brand ${disabled ? 'pointer-events-none opacity-50' : ''}`}
      >
        <svg width="26" height="26" viewBox="0 0 24 24" aria-hidden="true" fill="none" stroke="currentColor" strokeWidth="2.2">
          <path d="M3 8h4l2-3h6l2 3h4v12H3z" strokeLinejoin="round" />
          <circle cx="12" cy="13.5" r="4" />
        </svg>
        {busy ? 'Saving photo…' : label}
      </label>
      <input id={id} type="file" accept="image/*" capture="environment" multiple className="sr-only" disabled={disabled || busy} onChange={onChange} />
      {problem && (
        <p role="alert" className="font-bold text-sev-now">
          {problem}
        </p>
      )}
    </div>
  );
}
