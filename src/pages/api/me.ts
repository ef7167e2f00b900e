import type { APIRoute } from 'astro';
import { endpoint, json, requireUser } from '../../lib/server/http';

export const prerender = false;

/** Who is signed in on this device; the phone keeps a copy for working offline. */
export const GET: APIRoute = endpoint((context) => {
  const user = requireUser(context);
  return json({ user });
});
