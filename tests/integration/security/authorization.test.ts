// Every API route, called as every kind of caller (matrix.ts): the status each must get, nothing
// of business A in any answer to business B (nor of one technician's visits to the other), and
// nothing of A's changed by a call that was refused. A route file or exported method under
// src/pages/api without a row in the matrix fails the first test, so no route goes in untested.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testPool } from '../../support/database';
import { call } from '../../support/http';
import { MATRIX, METHODS, type Expected, type Probe, type Row } from './matrix';
import { buildWorld, CALLERS, digestOf, type Caller, type World } from './world';

const apiRoot = join(__dirname, '..', '..', '..', 'src', 'pages', 'api');

function routeFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? routeFiles(path) : /\.(ts|js|mjs)$/.test(name) && !name.endsWith('.d.ts') ? [path] : [];
  });
}

/** Every route file and the HTTP methods it exports, however it exports them. */
function discoveredRoutes(): { file: string; method: string }[] {
  const pattern = new RegExp(`export\\s+(?:const|let|async\\s+function|function)\\s+(${METHODS.join('|')})\\b|export\\s*\\{([^}]*)\\}`, 'g');
  return routeFiles(apiRoot).flatMap((path) => {
    const file = relative(apiRoot, path).split('\\').join('/');
    const methods = new Set<string>();
    for (const match of readFileSync(path, 'utf8').matchAll(pattern)) {
      if (match[1]) methods.add(match[1]);
      for (const name of (match[2] ?? '').split(',').map((n) => n.trim().split(/\s+as\s+/).at(-1)!)) {
        if ((METHODS as readonly string[]).includes(name)) methods.add(name);
      }
    }
    // A route file that exports no method we know is a route nobody can call: say so too.
    return methods.size ? [...methods].map((method) => ({ file, method })) : [{ file, method: '(none)' }];
  });
}

const matches = (status: number, expected: Expected) => (typeof expected === 'number' ? status === expected : expected.includes(status));
const key = (row: { file: string; method: string }) => `${row.method} ${row.file}`;

let w: World;

beforeAll(async () => {
  w = await buildWorld();
}, 180_000);
afterAll(async () => {
  await testPool().end();
});

describe('the authorization matrix', () => {
  it('has a row for every route file and exported method under src/pages/api, and none for routes that are gone', () => {
    const discovered = discoveredRoutes().map(key).sort();
    const listed = [...new Set(MATRIX.map(key))].sort();
    expect(discovered.filter((route) => !listed.includes(route)), 'routes without a row in tests/integration/security/matrix.ts').toEqual([]);
    expect(listed.filter((route) => !discovered.includes(route)), 'rows for routes that no longer exist').toEqual([]);
    expect(discovered.length).toBeGreaterThan(50);
  });

  it('asks every route without a session for 401, unless it is declared public with a reason', () => {
    const unguarded = MATRIX.filter((row) => !row.public && row.expect.anonymous !== 401).map(key);
    expect(unguarded).toEqual([]);
    for (const row of MATRIX.filter((r) => r.public)) expect(row.public!.length, key(row)).toBeGreaterThan(20);
  });
});

async function send(caller: Caller, probe: Probe) {
  const response = await call(w.sessions[caller], probe.path, { method: probe.method, body: probe.body, headers: probe.headers });
  const text = await response.text();
  let body: unknown = text;
  try {
    body = JSON.parse(text);
  } catch {
    // photos and other bytes
  }
  return { status: response.status, text, body };
}

/** Strings this caller must never be sent: all of A's for B, A's technician's visits for the other technician. */
function forbiddenStrings(caller: Caller): string[] {
  if (caller.startsWith('outsider')) return w.aMarkers;
  if (caller === 'otherTechnician') return w.technicianMarkers;
  return [];
}

async function callAs(row: Row, caller: Caller, problems: string[]) {
  const expected = row.expect[caller]!;
  const probe = await row.request(w, caller);
  const answer = await send(caller, probe);
  if (!matches(answer.status, expected)) {
    problems.push(`${caller}: expected ${JSON.stringify(expected)}, got ${answer.status} ${answer.text.slice(0, 200)}`);
    return;
  }
  if (answer.status < 300) {
    // An id the caller sent may come back in the answer ("no such visit …"); that tells them nothing.
    const sent = `${probe.path} ${probe.body instanceof Uint8Array ? '' : JSON.stringify(probe.body ?? '')}`;
    const leaked = forbiddenStrings(caller).filter((marker) => answer.text.includes(marker) && !sent.includes(marker));
    if (leaked.length) problems.push(`${caller}: answer ${answer.status} holds ${leaked.join(', ')}`);
    try {
      row.check?.(w, caller, answer.body);
    } catch (error) {
      problems.push(`${caller}: ${(error as Error).message}`);
    }
  }
}

const refusedOrOutside = (row: Row, caller: Caller) => {
  const expected = row.expect[caller]!;
  const statuses = typeof expected === 'number' ? [expected] : expected;
  return caller.startsWith('outsider') || statuses.every((s) => s >= 400);
};

describe.each(MATRIX.map((row) => [key(row), row] as const))('%s', (_name, row) => {
  it('answers each caller as the matrix says, leaks nothing, and a refused call changes nothing', async () => {
    const problems: string[] = [];
    const callers = CALLERS.filter((caller) => row.expect[caller] !== undefined);

    const before = await digestOf(w.a.organisationId);
    for (const caller of callers.filter((c) => refusedOrOutside(row, c))) await callAs(row, caller, problems);
    for (const probe of row.probes ?? []) {
      const answer = await send('anonymous', probe.request(w));
      if (!matches(answer.status, probe.expect)) problems.push(`${probe.name}: expected ${probe.expect}, got ${answer.status} ${answer.text.slice(0, 200)}`);
    }
    const after = await digestOf(w.a.organisationId);
    const changed = Object.keys(before).filter((table) => before[table] !== after[table]);
    if (changed.length) problems.push(`refused or outside calls changed A's ${changed.join(', ')}`);

    for (const caller of callers.filter((c) => !refusedOrOutside(row, c))) await callAs(row, caller, problems);
    expect(problems).toEqual([]);
  });
});
