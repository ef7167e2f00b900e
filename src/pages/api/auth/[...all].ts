// better-auth's own endpoints (sign-in, sign-out, session). We add the client's address so
// its sign-in rate limit counts per client, and strip any copy a client sent itself.
import type { APIRoute } from 'astro';
import { CLIENT_IP_HEADER, getAuth } from '../../../lib/auth';
import { trustProxy } from '../../../lib/server/config';

export const prerender = false;

function clientAddress(request: Request, socketAddress: string): string {
  if (trustProxy()) {
    const hops = (request.headers.get('x-forwarded-for') ?? '').split(',').map((h) => h.trim()).filter(Boolean);
    const last = hops.at(-1);
    if (last) return last;
  }
  return socketAddress;
}

export const ALL: APIRoute = async ({ request, clientAddress: socketAddress }) => {
  const headers = new Headers(request.headers);
  headers.set(CLIENT_IP_HEADER, clientAddress(request, socketAddress));
  const body = request.method === 'GET' || request.method === 'HEAD' ? undefined : await request.arrayBuffer();
  return getAuth().handler(new Request(request.url, { method: request.method, headers, body }));
};
