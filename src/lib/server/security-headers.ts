// The security headers of the app's own answers (middleware.ts); the policy itself lives in
// security-policy.mjs, shared with the process that serves the static files.
import { securityHeaders, servedOverTls } from './security-policy.mjs';

/** Whether this request reached us over TLS (a certificate of our own, or a trusted proxy's word). */
export function requestIsTls(request: Request): boolean {
  return servedOverTls(request.headers.get('x-forwarded-proto'));
}

export function securityHeadersFor(request: Request): Record<string, string> {
  return securityHeaders({ tls: requestIsTls(request), dev: import.meta.env.DEV });
}
