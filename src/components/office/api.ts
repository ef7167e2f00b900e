// The one way office islands talk to the server: JSON in, JSON out, and errors as ApiError
// carrying the server's message (and its per-field details) for the screen to show.

export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly details: string[] = [],
  ) {
    super(message);
  }
}

type Query = Record<string, string | number | boolean | null | undefined>;

export function withQuery(path: string, query: Query = {}): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value === undefined || value === null || value === '' || value === false) continue;
    params.set(key, value === true ? '1' : String(value));
  }
  const text = params.toString();
  return text ? `${path}?${text}` : path;
}

export async function api<T>(path: string, options: { method?: string; body?: unknown; query?: Query } = {}): Promise<T> {
  const method = options.method ?? (options.body === undefined ? 'GET' : 'POST');
  // Every write carries a JSON body, even a DELETE, so every write reaches the server in the one
  // shape its endpoints read.
  const body = method === 'GET' ? undefined : JSON.stringify(options.body ?? {});
  let response: Response;
  try {
    response = await fetch(withQuery(path, options.query), {
      method,
      headers: body === undefined ? { accept: 'application/json' } : { 'content-type': 'application/json', accept: 'application/json' },
      body,
      credentials: 'same-origin',
    });
  } catch {
    throw new ApiError(0, 'No connection to the server. Check the network and try again; nothing was saved.');
  }
  if (response.status === 401) {
    window.location.assign(`/sign-in?next=${encodeURIComponent(window.location.pathname + window.location.search)}`);
    throw new ApiError(401, 'Your session has ended. Sign in again.');
  }
  const text = await response.text();
  let answer: unknown = null;
  try {
    answer = text ? JSON.parse(text) : null;
  } catch {
    // A proxy's HTML error page: fall through to the generic message below.
  }
  if (!response.ok) {
    const error = answer as { error?: string; details?: unknown } | null;
    const details = Array.isArray(error?.details) ? error.details.filter((d): d is string => typeof d === 'string') : [];
    throw new ApiError(response.status, error?.error ?? `The server answered ${response.status}. Try again.`, details);
  }
  return answer as T;
}

/** The shape a server value has after JSON: dates become ISO strings. */
export type Json<T> = T extends Date
  ? string
  : T extends (infer U)[]
    ? Json<U>[]
    : T extends object
      ? { [K in keyof T]: Json<T[K]> }
      : T;
