// The submit of the van forms: send JSON with the console's one fetch helper, keep "busy" while
// it travels, and turn a refusal into the sentence shown beside the form.
import { useState } from 'react';
import { api, ApiError } from '../office/api';

export function useSend() {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  /** The answer's body, or null when the server refused (the reason is then in `error`). */
  async function send<T = unknown>(method: string, url: string, body: unknown): Promise<T | null> {
    setBusy(true);
    setError(null);
    try {
      return await api<T>(url, { method, body });
    } catch (failure) {
      const reason = failure instanceof ApiError ? failure : null;
      setError(reason ? [reason.message, ...reason.details].join(' ') : 'Something went wrong. Nothing was saved; try again.');
      return null;
    } finally {
      setBusy(false);
    }
  }

  return { busy, error, setError, send };
}
