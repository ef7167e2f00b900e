// How islands call our JSON API: one place that turns an error answer into a sentence to show.
export type JsonResult<T> = { ok: true; status: number; data: T } | { ok: false; status: number; message: string };

export async function requestJson<T>(method: string, url: string, body?: unknown): Promise<JsonResult<T>> {
  let response: Response;
  try {
    response = await fetch(url, {
      method,
      headers: body === undefined ? {} : { 'content-type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
      credentials: 'same-origin',
    });
  } catch {
    return { ok: false, status: 0, message: 'No connection to the server. Check the network and try again.' };
  }
  const payload = (await response.json().catch(() => null)) as { error?: string; details?: string[] } | null;
  if (response.ok) return { ok: true, status: response.status, data: payload as T };
  if (response.status === 401) return { ok: false, status: 401, message: 'Your session has ended. Sign in again.' };
  const details = payload?.details?.length ? ` ${payload.details.join('; ')}.` : '';
  return { ok: false, status: response.status, message: `${payload?.error ?? `The server answered ${response.status}.`}${details}` };
}
