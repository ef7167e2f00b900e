// better-auth's own endpoints (sign-in, sign-out, session). We add the client's address so
// its sign-in rate limit counts per client, and strip any copy a client sent itself; we bound
// the body; and over TLS every cookie it sets is marked Secure.
import type { APIRoute } from 'astro';
import { CLIENT_IP_HEADER, getAuth } from '../../../lib/auth';
import { trustProxy } from '../../../lib/server/config';
import { endpoint, readBodyBytes } from '../../../lib/server/http';
import { requestIsTls } from '../../../lib/server/security-headers';
import { withSecureCookies } from '../../../lib/server/cookies';

export const prerender = false;

// A sign-in is an e-mail address and a password: a few hundred bytes.
const MAX_AUTH_BODY_BYTES = 16_384;

function clientAddress(request: Request, socketAddress: string): string {
  if (trustProxy()) {
    const hops = (request.headers.get('x-forwarded-for') ?? '').split(',').map((h) => h.trim()).filter(Boolean);
    const last = hops.at(-1);
    if (last) return last;
  }
  return socketAddress;
}

export const ALL: APIRoute = endpoint(async ({ request, clientAddress: socketAddress }) => {
  const headers = new Headers(request.headers);
  headers.set(CLIENT_IP_HEADER, clientAddress(request, socketAddress));
  const body = request.method === 'GET' || request.method === 'HEAD' ? undefined : await readBodyBytes(request, MAX_AUTH_BODY_BYTES);
  const response = await getAuth().handler(new Request(request.url, { method: request.method, headers, body: body as BodyInit | undefined }));
  return requestIsTls(request) ? withSecureCookies(response) : response;
});
