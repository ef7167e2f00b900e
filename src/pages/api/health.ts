import type { APIRoute } from 'astro';
import { sql } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { json } from '../../lib/server/http';

export const prerender = false;

/** For load balancers and the start script: the app answers and PostgreSQL is reachable. */
export const GET: APIRoute = async () => {
  try {
    await getDb().execute(sql`select 1`);
    return json({ ok: true });
  } catch {
    return json({ ok: false, error: 'The database is not reachable.' }, 503);
  }
};
