// Who is signed in on this phone. The shell pages are static, so the browser asks GET /api/me;
// a copy kept in idb-keyval lets a cold start with no signal know whose round to open.
import { del, get, set } from 'idb-keyval';

export type DeviceUser = { id: string; name: string; email: string; role: 'technician' | 'office' | 'owner'; organisationId: string };

const USER_KEY = 'tickover:user';

export type SessionCheck =
  | { kind: 'signed-in'; user: DeviceUser; fresh: boolean }
  | { kind: 'signed-out' }
  | { kind: 'offline-unknown' };

export function cachedUser(): Promise<DeviceUser | undefined> {
  return get<DeviceUser>(USER_KEY);
}

export async function forgetUser(): Promise<void> {
  await del(USER_KEY);
}

function isDeviceUser(value: unknown): value is DeviceUser {
  if (!value || typeof value !== 'object') return false;
  const u = value as Record<string, unknown>;
  return typeof u.id === 'string' && typeof u.name === 'string' && typeof u.role === 'string' && typeof u.organisationId === 'string';
}

/**
 * Asks the server when it can; falls back to the cached user when it cannot. A 401 is final:
 * the cached user is forgotten, but their device database (and outbox) stays for next sign-in.
 */
export async function checkSession(fetchImpl: typeof fetch = fetch): Promise<SessionCheck> {
  const cached = await cachedUser();
  let response: Response;
  try {
    response = await fetchImpl('/api/me', { credentials: 'same-origin', headers: { accept: 'application/json' } });
  } catch {
    return cached ? { kind: 'signed-in', user: cached, fresh: false } : { kind: 'offline-unknown' };
  }
  if (response.status === 401) {
    await forgetUser();
    return { kind: 'signed-out' };
  }
  if (!response.ok) return cached ? { kind: 'signed-in', user: cached, fresh: false } : { kind: 'offline-unknown' };
  const body = (await response.json().catch(() => null)) as { user?: unknown } | null;
  if (!isDeviceUser(body?.user)) return cached ? { kind: 'signed-in', user: cached, fresh: false } : { kind: 'offline-unknown' };
  const user: DeviceUser = {
    id: body.user.id,
    name: body.user.name,
    email: body.user.email,
    role: body.user.role,
    organisationId: body.user.organisationId,
  };
  await set(USER_KEY, user);
  return { kind: 'signed-in', user, fresh: true };
}

/** Where to send a signed-out technician so that they come back to the same screen. */
export function signInPath(location: { pathname: string; search: string; hash: string }): string {
  return `/sign-in?next=${encodeURIComponent(location.pathname + location.search + location.hash)}`;
}
