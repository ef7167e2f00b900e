// Cross-site request refusal (CSRF). A browser names the page that sent a request in Origin
// (every POST, PUT, PATCH and DELETE) or, failing that, says in Sec-Fetch-Site where it came from;
// a write whose page is not Tickover itself is refused whatever its content type. Requests with
// neither header come from programs, not from a browser a visitor's cookies could be borrowed
// from (Stripe's webhook, the scripts, curl): those pass on to the endpoint's own checks.
//
// Tickover's own origins are PUBLIC_BASE_URL and the address the request was sent to: its Host
// (X-Forwarded-Host from a proxy we trust) with https when it came over TLS. A page elsewhere
// cannot make a browser send our Host with its own Origin, so trusting Host here is safe, and it
// lets the same build answer at 127.0.0.1, at localhost and behind a proxy without configuration.
import { appBaseUrl, trustProxy } from './config';
import { lastHeaderValue } from './security-policy.mjs';
import { requestIsTls } from './security-headers';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** The origin the request was addressed to, as the browser saw it. */
export function addressedOrigin(request: Request): string | null {
  const forwarded = trustProxy() ? lastHeaderValue(request.headers.get('x-forwarded-host')) : undefined;
  const host = forwarded ?? request.headers.get('host');
  if (!host || /[\s/\\@]/.test(host)) return null;
  return `${requestIsTls(request) ? 'https' : 'http'}://${host.toLowerCase()}`;
}

export function ownOrigins(request: Request): Set<string> {
  const origins = new Set([new URL(appBaseUrl()).origin]);
  const addressed = addressedOrigin(request);
  if (addressed) origins.add(addressed);
  return origins;
}

/** Why the request must be refused as cross-site, or null when it may go on. */
export function crossSiteRefusal(request: Request): string | null {
  if (SAFE_METHODS.has(request.method)) return null;
  const origin = request.headers.get('origin');
  if (origin !== null) {
    return ownOrigins(request).has(origin.toLowerCase()) ? null : `Origin ${origin} is not this app`;
  }
  const site = request.headers.get('sec-fetch-site');
  if (site !== null && site !== 'same-origin' && site !== 'none') return `Sec-Fetch-Site is ${site}`;
  return null;
}
