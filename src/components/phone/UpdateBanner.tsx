// A new version of the app is announced here and applied only when the technician taps it.
import { useState } from 'react';
import { useAppUpdate } from './hooks';

export function UpdateBanner() {
  const update = useAppUpdate();
  const [problem, setProblem] = useState<string | null>(null);
  if (!update.available) return null;

  async function apply() {
    setProblem(null);
    try {
      await update.apply();
    } catch (error) {
      setProblem(error instanceof Error ? error.message : String(error));
    }
  }

  return (
    <div role="status" className="border-b-2 border-accent bg-accent/25 px-3 py-2">
      <div className="flex items-center gap-3">
        <p className="flex-1 text-base">
          <span className="font-bold">A new version of Tickover is ready.</span> Your work is saved on this phone and carries over.
        </p>
        <button type="button" onClick={apply} className="min-h-12 shrink-0 rounded-lg bg-ink px-4 font-bold text-white">
          Update
        </button>
      </div>
      {problem && <p className="mt-1 font-bold text-sev-now">{problem}</p>}
    </div>
  );
}
