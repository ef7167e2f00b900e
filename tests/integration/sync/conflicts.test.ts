// The office's conflict list: GET /api/office/conflicts and POST /api/office/conflicts/{id}/resolve.
import { randomUUID } from 'node:crypto';
import { and, eq, isNull } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as s from '../../../src/db/schema';
import { testDb, testPool } from '../../support/database';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { callJson, signIn, type Session } from '../../support/http';
import { pushOk } from '../../support/sync-client';
import { TestDevice } from '../../support/sync-ops';
import { createVisit, createVisitSetup, type VisitSetup } from '../../support/visit-fixtures';

let org: OrganisationFixture;
let setup: VisitSetup;
let tech: Session;
let office: Session;
let outsider: Session;

beforeAll(async () => {
  org = await createOrganisation('Conflicts');
  const elsewhere = await createOrganisation('Elsewhere');
  setup = await createVisitSetup(org);
  [tech, office, outsider] = await Promise.all([
    signIn(org.technician.email, FIXTURE_PASSWORD),
    signIn(org.office.email, FIXTURE_PASSWORD),
    signIn(elsewhere.office.email, FIXTURE_PASSWORD),
  ]);
});
afterAll(async () => {
  await testPool().end();
});

/** Two phones change the same reading without seeing each other; the earlier stamp arrives last. */
async function concurrentReading() {
  const visitId = await createVisit(org, setup);
  const itemId = setup.checklist.readings[0]!;
  const early = new TestDevice(`tara-${randomUUID().slice(0, 6)}`, Date.now() - 600_000);
  const late = new TestDevice(`van-${randomUUID().slice(0, 6)}`, Date.now() - 300_000);
  const loser = early.reading(visitId, itemId, 1.9);
  await pushOk(tech, late.deviceId, [late.reading(visitId, itemId, 2.1)]);
  await pushOk(tech, early.deviceId, [loser]);
  return { visitId, itemId, loser };
}

const list = (session: Session, query = '') => callJson(session, `/api/office/conflicts${query}`);
const resolve = (session: Session, id: string, body: unknown) => callJson(session, `/api/office/conflicts/${id}/resolve`, { body });

describe('conflict list', () => {
  it('shows a visit’s conflicts with both values, who and when', async () => {
    const { visitId, loser } = await concurrentReading();
    const response = await list(office, `?visitId=${visitId}`);
    expect(response.status).toBe(200);
    expect(response.json.total).toBe(1);
    const [conflict] = response.json.conflicts;
    expect(conflict).toMatchObject({
      kind: 'reading',
      reason: 'concurrent_edit',
      subject: 'Tread depth, rear right',
      proposed: { text: '1.9 mm', opId: loser.opId, author: { name: 'Tara Tech' } },
      standing: { text: '2.1 mm', author: { name: 'Tara Tech' } },
      visit: { id: visitId, technicianName: 'Tara Tech', vehicle: 'Corvane Estrel' },
      resolvedAt: null,
    });
    expect(Date.parse(conflict.proposed.at)).toBeLessThan(Date.parse(conflict.standing.at));
  });

  it('is the office’s: technicians get 403, another business sees nothing of it', async () => {
    const { visitId } = await concurrentReading();
    expect((await list(tech)).status).toBe(403);
    const foreign = await list(outsider, `?visitId=${visitId}`);
    expect(foreign.json.total).toBe(0);
    const [conflict] = (await list(office, `?visitId=${visitId}`)).json.conflicts;
    expect((await resolve(outsider, conflict.id, { use: 'standing' })).status).toBe(404);
    expect((await list(office, '?visitId=not-an-id')).status).toBe(400);
  });
});

describe('resolving', () => {
  it('uses the other value and keeps the replaced one as a note', async () => {
    const { visitId, itemId } = await concurrentReading();
    const [conflict] = (await list(office, `?visitId=${visitId}`)).json.conflicts;
    const done = await resolve(office, conflict.id, { use: 'proposed', keepOtherAsNote: true });
    expect(done.status).toBe(200);
    const [reading] = await testDb().select().from(s.readingResults).where(and(eq(s.readingResults.visitId, visitId), eq(s.readingResults.itemId, itemId)));
    expect(reading!.value).toBe(1.9);
    const notes = await testDb().select().from(s.visitNotes).where(eq(s.visitNotes.visitId, visitId));
    expect(notes.map((n) => n.body)).toEqual([expect.stringMatching(/^Replaced after a sync conflict \(reading\): 2\.1 mm/)]);
    // No new conflict: the office had seen what stood.
    const after = await list(office, `?visitId=${visitId}&status=all`);
    expect(after.json.conflicts).toHaveLength(1);
    expect(after.json.conflicts[0]).toMatchObject({ resolvedBy: 'Oscar Office', resolution: expect.stringMatching(/used the other value/) });
    expect((await resolve(office, conflict.id, { use: 'standing' })).status).toBe(409);
  });

  it('keeps the standing value, optionally noting the other', async () => {
    const { visitId, itemId } = await concurrentReading();
    const [conflict] = (await list(office, `?visitId=${visitId}`)).json.conflicts;
    expect((await resolve(office, conflict.id, { use: 'standing', keepOtherAsNote: true })).status).toBe(200);
    const [reading] = await testDb().select().from(s.readingResults).where(and(eq(s.readingResults.visitId, visitId), eq(s.readingResults.itemId, itemId)));
    expect(reading!.value).toBe(2.1);
    const notes = await testDb().select().from(s.visitNotes).where(eq(s.visitNotes.visitId, visitId));
    expect(notes[0]!.body).toMatch(/^Not used after a sync conflict \(reading\): 1\.9 mm/);
    expect((await list(office, `?visitId=${visitId}`)).json.total).toBe(0);
    expect((await list(office, `?visitId=${visitId}&status=resolved`)).json.total).toBe(1);
  });

  it('reopens a signed-off visit to apply work that arrived after the sign-off, only when asked', async () => {
    const visitId = await createVisit(org, setup);
    const phone = new TestDevice(`tara-${randomUUID().slice(0, 6)}`, Date.now() - 600_000);
    await pushOk(tech, phone.deviceId, [phone.signOff(visitId)]);
    const late = phone.reading(visitId, setup.checklist.readings[1]!, 12.4, null, 'V');
    await pushOk(tech, phone.deviceId, [late]);
    const [conflict] = (await list(office, `?visitId=${visitId}&reason=visit_locked`)).json.conflicts;
    expect(conflict).toMatchObject({ kind: 'reading', reason: 'visit_locked', standing: null, subject: 'Battery resting voltage' });

    const refused = await resolve(office, conflict.id, { use: 'proposed' });
    expect(refused.status).toBe(409);
    expect(refused.json.error).toMatch(/reopen/);

    expect((await resolve(office, conflict.id, { use: 'proposed', reopen: true })).status).toBe(200);
    const [visit] = await testDb().select().from(s.visits).where(eq(s.visits.id, visitId));
    expect(visit!.status).toBe('in_progress');
    const live = await testDb().select().from(s.signOffs).where(and(eq(s.signOffs.visitId, visitId), isNull(s.signOffs.voidedAt)));
    expect(live).toHaveLength(0);
    const [reading] = await testDb().select().from(s.readingResults).where(eq(s.readingResults.visitId, visitId));
    expect(reading!.value).toBe(12.4);
    // Reopened: the technician's next changes apply, and a new sign-off locks it again.
    const next = phone.check(visitId, setup.checklist.checks[0]!, 'done');
    expect((await pushOk(tech, phone.deviceId, [next])).get(next.opId)?.outcome).toBe('applied');
  });

  it('says what is wrong with a bad request', async () => {
    const { visitId } = await concurrentReading();
    const [conflict] = (await list(office, `?visitId=${visitId}`)).json.conflicts;
    const bad = await resolve(office, conflict.id, { use: 'both' });
    expect(bad.status).toBe(400);
    expect(bad.json.details.join(' ')).toMatch(/use/);
    expect((await resolve(office, randomUUID(), { use: 'standing' })).status).toBe(404);
  });
});
