// Who may open which page. Endpoints under /api check roles themselves (lib/server/http.ts);
// this table guards pages and gives anonymous API calls their 401.
import type { UserRole } from '../db/schema';

export type PageAccess =
  | { kind: 'public' }
  | { kind: 'api-public' }
  | { kind: 'api' }
  | { kind: 'roles'; roles: readonly UserRole[] };

const PUBLIC_PREFIXES = ['/sign-in', '/record/', '/_astro/', '/fonts/', '/icons/'];
const PUBLIC_FILES = new Set(['/', '/favicon.svg', '/manifest.webmanifest', '/sw.js', '/robots.txt', '/offline']);
const PUBLIC_API_PREFIXES = ['/api/auth/', '/api/public/', '/api/health'];

export const TECHNICIAN_ROLES = ['technician'] as const satisfies readonly UserRole[];
export const OFFICE_PAGE_ROLES = ['office', 'owner'] as const satisfies readonly UserRole[];
export const OWNER_PAGE_ROLES = ['owner'] as const satisfies readonly UserRole[];
// People and business settings are the owner's alone (PRODUCT.md, roles).
const OWNER_PAGES = ['/office/people', '/office/settings'];

export function pageAccess(pathname: string): PageAccess {
  if (pathname.startsWith('/api/')) {
    return PUBLIC_API_PREFIXES.some((p) => pathname.startsWith(p)) ? { kind: 'api-public' } : { kind: 'api' };
  }
  if (PUBLIC_FILES.has(pathname) || PUBLIC_PREFIXES.some((p) => pathname.startsWith(p))) return { kind: 'public' };
  if (pathname.startsWith('/workbox-')) return { kind: 'public' };
  if (OWNER_PAGES.some((p) => pathname === p || pathname.startsWith(`${p}/`))) return { kind: 'roles', roles: OWNER_PAGE_ROLES };
  if (pathname === '/office' || pathname.startsWith('/office/')) return { kind: 'roles', roles: OFFICE_PAGE_ROLES };
  // The technician's pages (/round, /visit, /device, /van, /calculators) are prerendered shells served
  // as static files, so this guard never sees them: they hold no data and check the session on
  // the device (lib/device/boot.ts); the data comes only through guarded /api endpoints.
  return { kind: 'roles', roles: TECHNICIAN_ROLES };
}

/** Where a signed-in user of each role starts. */
export function homeFor(role: UserRole): string {
  return role === 'technician' ? '/round' : '/office';
}

/**
 * Where sign-in goes next: `next` when it is a page of this app, else `home`. Resolved as a URL
 * rather than judged by its first characters, because browsers read `/\evil.example` as
 * `//evil.example`, another site.
 */
export function pathAfterSignIn(next: string | null, home: string, origin: string): string {
  if (!next || !next.startsWith('/')) return home;
  try {
    const url = new URL(next, origin);
    return url.origin === origin ? url.pathname + url.search + url.hash : home;
  } catch {
    return home;
  }
}
