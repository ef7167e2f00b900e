// The one way a visit screen records a change: run the device-store action, nudge sync, and turn a
// refusal into a message on screen (nothing was written when an action throws).
import { useState } from 'react';
import type { Device } from '../../lib/device/boot';

export function useRecorder(device: Device) {
  const [problem, setProblem] = useState<string | null>(null);

  async function run(action: () => Promise<unknown>): Promise<boolean> {
    setProblem(null);
    try {
      await action();
      device.sync.changed();
      return true;
    } catch (error) {
      setProblem(error instanceof Error ? error.message : String(error));
      return false;
    }
  }

  const alert = problem ? (
    <p role="alert" className="rounded-lg border-2 border-sev-now bg-white p-3 font-bold text-sev-now">
      {problem}
    </p>
  ) : null;

  return { run, alert };
}
