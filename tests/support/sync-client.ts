// Push and pull as a device does, through the real endpoints.
import { callJson, type Session } from './http';
import type { Operation } from '../../src/lib/sync/operations';
import type { PullResponse } from '../../src/lib/sync/pull';
import type { PushResponse } from '../../src/lib/sync/push';

export async function push(session: Session, deviceId: string, operations: unknown[]) {
  return callJson<PushResponse & { error?: string }>(session, '/api/sync/push', { body: { deviceId, operations } });
}

/** Pushes and expects a 200; returns the outcomes by operation id. */
export async function pushOk(session: Session, deviceId: string, operations: Operation[]) {
  const response = await push(session, deviceId, operations);
  if (response.status !== 200) throw new Error(`push answered ${response.status}: ${JSON.stringify(response.json)}`);
  return new Map(response.json.results.map((r) => [r.opId, r]));
}

export async function pull(session: Session, cursor = '0', limit?: number) {
  const query = limit ? `cursor=${cursor}&limit=${limit}` : `cursor=${cursor}`;
  return callJson<PullResponse & { error?: string }>(session, `/api/sync/pull?${query}`);
}

/** Pulls page after page until the server has nothing more. */
export async function pullAll(session: Session, cursor = '0', limit?: number) {
  const pages: PullResponse[] = [];
  for (;;) {
    const response = await pull(session, cursor, limit);
    if (response.status !== 200) throw new Error(`pull answered ${response.status}: ${JSON.stringify(response.json)}`);
    pages.push(response.json);
    cursor = response.json.cursor;
    if (!response.json.hasMore) return { pages, cursor };
  }
}

/** All pages' rows together, as one response would hold them. */
export function mergePages(pages: PullResponse[]): PullResponse {
  const merged = { ...pages[pages.length - 1]! };
  for (const key of Object.keys(merged) as (keyof PullResponse)[]) {
    if (Array.isArray(merged[key])) (merged as Record<string, unknown>)[key] = pages.flatMap((p) => p[key] as unknown[]);
  }
  return merged;
}
