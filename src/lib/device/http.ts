// How the phone's background work (sync, the load list) talks to the server: errors sorted into
// signed out, no connection and refused, a time limit against weak signal, and answers checked
// against their contract before anything is stored.

/** The session is gone (401): the technician must sign in again. The outbox stays as it is. */
export class SignedOutError extends Error {
  constructor() {
    super('You are signed out. Sign in again to send your changes; they are safe on this phone.');
  }
}

/** No network, or the server did not answer. */
export class OfflineError extends Error {}

/** The server answered with an error; `message` is its explanation. */
export class ServerError extends Error {
  constructor(
    readonly status: number,
    message: string,
  ) {
    super(message);
  }
}

export type HttpDeps = { fetch: typeof fetch; baseUrl?: string };

// A request that connects but never answers (weak signal) must not hold sync up: give up, back
// off, try again. Push and pull bodies are small; photos have their own, longer limit.
const REQUEST_TIMEOUT_MS = 30_000;

export async function request(deps: HttpDeps, path: string, init?: RequestInit): Promise<Response> {
  let response: Response;
  try {
    response = await deps.fetch(`${deps.baseUrl ?? ''}${path}`, { credentials: 'same-origin', signal: AbortSignal.timeout(REQUEST_TIMEOUT_MS), ...init });
  } catch {
    throw new OfflineError('No connection to the server. Your changes are safe on this phone.');
  }
  if (response.status === 401) throw new SignedOutError();
  return response;
}

export async function errorOf(response: Response): Promise<ServerError> {
  let message = `The server answered ${response.status}.`;
  try {
    const body = (await response.json()) as { error?: unknown };
    if (typeof body.error === 'string') message = body.error;
  } catch {
    // not JSON: keep the status line
  }
  return new ServerError(response.status, message);
}

/** The answer, checked against the contract; anything else is the server's fault, not the phone's. */
export async function understood<T>(response: Response, schema: { safeParse(data: unknown): { success: true; data: T } | { success: false } }): Promise<T> {
  let body: unknown;
  try {
    body = await response.json();
  } catch {
    throw new ServerError(response.status, 'The server’s answer was not JSON. Your changes are safe; sync will try again.');
  }
  const parsed = schema.safeParse(body);
  if (!parsed.success) throw new ServerError(response.status, 'The server’s answer did not match what this app expects. Update the app, then sync again.');
  return parsed.data;
}
