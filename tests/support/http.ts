// A signed-in HTTP client for integration tests: real requests to the built server.
import { newClientAddress } from './client-address';

export const baseUrl = () => process.env.TEST_BASE_URL!;

export type Session = { cookie: string; address: string; user: { id: string; role: string; organisationId: string } };

export async function signIn(email: string, password: string, address = newClientAddress()): Promise<Session> {
  const response = await fetch(`${baseUrl()}/api/auth/sign-in/email`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: baseUrl(), 'x-forwarded-for': address },
    body: JSON.stringify({ email, password }),
  });
  if (!response.ok) throw new Error(`sign-in as ${email} failed: ${response.status} ${await response.text()}`);
  const cookie = response.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
  const body = (await response.json()) as { user: Session['user'] };
  return { cookie, address, user: body.user };
}

type RequestOptions = { method?: string; body?: unknown; headers?: Record<string, string>; redirect?: RequestRedirect };

/** Calls the app as `session` (or anonymously with null). */
export async function call(session: Session | null, path: string, options: RequestOptions = {}) {
  const headers: Record<string, string> = { origin: baseUrl(), ...options.headers };
  if (session) {
    headers.cookie = session.cookie;
    headers['x-forwarded-for'] = session.address;
  }
  let body: BodyInit | undefined;
  if (options.body instanceof Uint8Array) {
    // Bytes (a photo upload) go as they are; the caller sets their content-type.
    body = options.body as Uint8Array<ArrayBuffer>;
  } else if (options.body !== undefined) {
    body = typeof options.body === 'string' ? options.body : JSON.stringify(options.body);
    headers['content-type'] ??= 'application/json';
  }
  return fetch(`${baseUrl()}${path}`, {
    method: options.method ?? (body ? 'POST' : 'GET'),
    headers,
    body,
    redirect: options.redirect ?? 'manual',
  });
}

export async function callJson<T = any>(session: Session | null, path: string, options: RequestOptions = {}) {
  const response = await call(session, path, options);
  const text = await response.text();
  let json: T;
  try {
    json = JSON.parse(text) as T;
  } catch {
    json = text as unknown as T;
  }
  return { status: response.status, json, headers: response.headers };
}

/** `fetch` as a signed-in phone would make it: its cookie, its address, same-origin. */
export function sessionFetch(session: Session): typeof fetch {
  return (input, init) => {
    const headers = new Headers(init?.headers);
    headers.set('cookie', session.cookie);
    headers.set('x-forwarded-for', session.address);
    headers.set('origin', baseUrl());
    return fetch(input, { ...init, headers });
  };
}
