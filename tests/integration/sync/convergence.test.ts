// Property-based convergence through the real push endpoint into PostgreSQL (fast-check): two to
// five devices, offline for days with clocks skewed by up to a day, change one visit; their
// operations are delivered in two different ways (interleaved differently, split into random
// batches, with retries and operations sent twice) to two fresh copies of the visit. Both copies
// must end the same, equal to the model of the rules over the operations sent, and every
// operation must be recorded exactly once, applied or kept with its reason.
//
// Sign-off is left out on purpose: "the first sign-off to arrive locks the visit" depends on
// arrival by design (merge-sign-off.ts); the push and conflict tests cover it.
import { createHash, randomUUID } from 'node:crypto';
import { eq, inArray } from 'drizzle-orm';
import fc from 'fast-check';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as s from '../../../src/db/schema';
import type { Operation } from '../../../src/lib/sync/operations';
import { describePicture, modelOf } from '../../../src/lib/sync/fuzz/model';
import { seededRandom } from '../../../src/lib/sync/fuzz/random';
import { testDb, testPool } from '../../support/database';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { call, signIn, type Session } from '../../support/http';
import { pushOk } from '../../support/sync-client';
import { pictureFromDatabase } from '../../support/sync-state';
import { TestDevice } from '../../support/sync-ops';
import { createVisit, createVisitSetup, type VisitSetup } from '../../support/visit-fixtures';

const DAY_MS = 86_400_000;
const SEVERITIES = ['ok', 'watch', 'soon', 'now'] as const;

let org: OrganisationFixture;
let setup: VisitSetup;
let tech: Session;
let office: Session;
let photoSha: string;

beforeAll(async () => {
  org = await createOrganisation('Converge');
  setup = await createVisitSetup(org);
  [tech, office] = await Promise.all([signIn(org.technician.email, FIXTURE_PASSWORD), signIn(org.office.email, FIXTURE_PASSWORD)]);
  const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#444' } }).png().toBuffer();
  photoSha = createHash('sha256').update(png).digest('hex');
  const uploaded = await call(tech, `/api/photos/${photoSha}`, { method: 'PUT', body: new Uint8Array(png), headers: { 'content-type': 'image/png' } });
  expect(uploaded.status).toBeLessThan(300);
});
afterAll(async () => {
  await testPool().end();
});

const opSpec = fc.record({
  kind: fc.constantFrom('check', 'reading', 'finding', 'note', 'photo', 'part_line'),
  entity: fc.nat(2),
  value: fc.nat(40),
  flag: fc.boolean(),
});
const scenarioArb = fc.record({
  devices: fc.array(fc.record({ skewMs: fc.integer({ min: -DAY_MS, max: DAY_MS }), ops: fc.array(opSpec, { minLength: 1, maxLength: 8 }) }), {
    minLength: 2,
    maxLength: 5,
  }),
  officeDevice: fc.boolean(),
  deliveryA: fc.nat(),
  deliveryB: fc.nat(),
});
type Scenario = typeof scenarioArb extends fc.Arbitrary<infer T> ? T : never;

type Stream = { session: Session; deviceId: string; office: boolean; ops: Operation[] };

/** Each device's operations, in the order it made them, against a placeholder visit id. */
function streamsOf(scenario: Scenario, pools: { findings: string[]; lines: string[]; photos: string[] }): Stream[] {
  // All clocks sit days in the past, so no stamp is bounded and delivery time cannot matter.
  const base = Date.now() - 3 * DAY_MS;
  return scenario.devices.map((spec, index) => {
    const isOffice = scenario.officeDevice && index === 0;
    const device = new TestDevice(`d${index}-${randomUUID().slice(0, 6)}`, base + spec.skewMs);
    const lastStamp = new Map<string, Operation['stamp']>();
    const photoAdds = new Map<string, Operation['stamp']>();
    const ops = spec.ops.map((o): Operation => {
      const visitId = '00000000-0000-4000-8000-000000000000';
      const remember = (key: string, op: Operation) => {
        lastStamp.set(key, op.stamp);
        return op;
      };
      switch (o.kind) {
        case 'check': {
          const itemId = setup.checklist.checks[o.entity]!;
          return remember(itemId, device.check(visitId, itemId, (['done', 'skipped', 'not_yet'] as const)[o.value % 3]!, lastStamp.get(itemId) ?? null));
        }
        case 'reading': {
          const itemId = setup.checklist.readings[o.entity]!;
          return remember(itemId, device.reading(visitId, itemId, o.value / 10, lastStamp.get(itemId) ?? null));
        }
        case 'finding': {
          const findingId = pools.findings[o.entity]!;
          const op = device.finding(visitId, findingId, SEVERITIES[o.value % 4]!, {
            title: `Finding ${o.value}`,
            downgrade: o.flag,
            seen: lastStamp.get(findingId) ?? null,
          });
          return remember(findingId, op);
        }
        case 'note':
          return device.note(visitId, `Note ${o.value}`);
        case 'photo': {
          const photoId = pools.photos[o.entity]!;
          const seenAdd = photoAdds.get(photoId);
          if (seenAdd && o.flag) return device.photoRemove(visitId, photoId, seenAdd);
          const add = device.photoAdd(visitId, photoId, photoSha, { caption: `Photo ${o.value}`, seen: seenAdd ?? null });
          photoAdds.set(photoId, add.stamp);
          return add;
        }
        default: {
          const lineId = pools.lines[o.entity]!;
          return device.partLine(visitId, lineId, 1 + (o.value % 4), { removed: o.flag && o.value % 3 === 0, itemId: setup.checklist.parts[0]! });
        }
      }
    });
    return { session: isOffice ? office : tech, deviceId: device.deviceId, office: isOffice, ops };
  });
}

/** One way of delivering the streams: interleaved, in random batches, with retries and repeats. */
function deliveryOf(streams: Stream[], seed: number) {
  const rng = seededRandom(seed);
  const sent = streams.map(() => 0);
  const deliveries: { stream: Stream; batch: Operation[] }[] = [];
  while (sent.some((n, i) => n < streams[i]!.ops.length)) {
    const i = rng.pick(streams.map((_, j) => j).filter((j) => sent[j]! < streams[j]!.ops.length));
    const stream = streams[i]!;
    const size = rng.int(1, stream.ops.length - sent[i]!);
    const batch = stream.ops.slice(sent[i], sent[i]! + size);
    if (rng.chance(0.15)) batch.push(rng.pick(batch));
    deliveries.push({ stream, batch });
    // The answer was lost: the device sends the same batch again, now or after other devices.
    if (rng.chance(0.2)) deliveries.splice(rng.int(deliveries.length - 1, deliveries.length), 0, { stream, batch });
    sent[i]! += size;
  }
  return deliveries;
}

async function deliver(streams: Stream[], seed: number) {
  const visitId = await createVisit(org, setup);
  const opIds = new Map<string, string>();
  const entityIds = new Map<string, string>();
  const fresh = (map: Map<string, string>, id: string) => {
    if (!map.has(id)) map.set(id, randomUUID());
    return map.get(id)!;
  };
  // Ids made on devices (findings, notes, photos, part lines) are per copy of the visit, like op ids.
  const copy = (op: Operation): Operation => {
    const payload: Record<string, unknown> = { ...op.payload };
    for (const key of ['findingId', 'noteId', 'photoId', 'lineId']) {
      if (typeof payload[key] === 'string') payload[key] = fresh(entityIds, payload[key] as string);
    }
    return { ...op, opId: fresh(opIds, op.opId), visitId, payload } as Operation;
  };
  for (const { stream, batch } of deliveryOf(streams, seed)) {
    const results = await pushOk(stream.session, stream.deviceId, batch.map(copy));
    for (const r of results.values()) expect(['applied', 'superseded', 'conflict', 'duplicate'], r.reason).toContain(r.outcome);
  }
  const original = new Map([...entityIds].map(([from, to]) => [to, from]));
  /** The picture of this copy, with device-made ids mapped back to the scenario's own. */
  const picture = async () => {
    const p = await pictureFromDatabase(visitId);
    const back = <T>(record: Record<string, T>) => Object.fromEntries(Object.entries(record).map(([id, v]) => [original.get(id) ?? id, v]));
    return describePicture({ ...p, findings: back(p.findings), notes: back(p.notes), photos: back(p.photos), partLines: back(p.partLines) });
  };
  return { visitId, opIds, copy, picture };
}

describe('convergence through the push endpoint', () => {
  it('ends in the same state whatever the delivery, equal to the model, losing nothing', { timeout: 600_000 }, async () => {
    await fc.assert(
      fc.asyncProperty(scenarioArb, async (scenario) => {
        const pools = { findings: [randomUUID(), randomUUID(), randomUUID()], lines: [randomUUID(), randomUUID(), randomUUID()], photos: [randomUUID(), randomUUID(), randomUUID()] };
        const streams = streamsOf(scenario, pools);
        const a = await deliver(streams, scenario.deliveryA);
        const b = await deliver(streams, scenario.deliveryB);

        const pictureA = await a.picture();
        expect(await b.picture()).toBe(pictureA);
        const sent = streams.flatMap((st) => st.ops.map((op) => ({ op, stamp: op.stamp, mayDowngrade: st.office })));
        expect(pictureA).toBe(describePicture(modelOf(sent)));

        // Lossless: every operation sent is recorded once, and every one kept as a conflict is on the list.
        const recorded = await testDb().select().from(s.syncOperations).where(eq(s.syncOperations.visitId, a.visitId));
        expect(recorded.map((r) => r.opId).sort()).toEqual([...a.opIds.values()].sort());
        const conflictOps = recorded.filter((r) => r.outcome === 'conflict').map((r) => r.opId);
        if (conflictOps.length) {
          const kept = await testDb().select({ opId: s.conflicts.opId }).from(s.conflicts).where(inArray(s.conflicts.opId, conflictOps));
          expect(new Set(kept.map((k) => k.opId))).toEqual(new Set(conflictOps));
        }
      }),
      { numRuns: Number(process.env.SYNC_PROPERTY_RUNS ?? 12), endOnFailure: true },
    );
  });
});
