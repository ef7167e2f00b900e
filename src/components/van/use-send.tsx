// The one submit pattern of the van forms: send JSON, keep "busy" while it travels, and turn a
// refusal into a sentence shown beside the form.
import { useState } from 'react';
import { requestJson } from '../ui/request-json';

export function useSend() {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  /** The answer's body, or null when the server refused (the reason is then in `error`). */
  async function send<T = unknown>(method: string, url: string, body: unknown): Promise<T | null> {
    setBusy(true);
    setError(null);
    const result = await requestJson<T>(method, url, body);
    setBusy(false);
    if (!result.ok) {
      setError(result.message);
      return null;
    }
    return result.data;
  }

  return { busy, error, setError, send };
}

export function FormError({ message }: { message: string | null }) {
  return message ? (
    <p role="alert" className="rounded border-2 border-sev-now p-2 font-bold text-sev-now">
      {message}
    </p>
  ) : null;
}
