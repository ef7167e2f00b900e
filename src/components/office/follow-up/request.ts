// The one way the follow-up islands call the API: JSON in, JSON out, errors as a sentence.
export async function requestJson<T = unknown>(url: string, method: string, body?: unknown): Promise<T> {
  const response = await fetch(url, {
    method,
    headers: { 'content-type': 'application/json' },
    body: body === undefined ? '{}' : JSON.stringify(body),
  });
  const data = (await response.json().catch(() => ({}))) as { error?: string; details?: string[] } & T;
  if (!response.ok) {
    const details = data.details?.length ? ` (${data.details.join('; ')})` : '';
    throw new Error(`${data.error ?? `The server answered ${response.status}.`}${details}`);
  }
  return data;
}
