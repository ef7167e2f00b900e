// GET /api/sync/pull: what a user may see, in pages, with a cursor that never skips a row.
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as s from '../../../src/db/schema';
import { testDb, testPool } from '../../support/database';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { signIn, type Session } from '../../support/http';
import { mergePages, pull, pullAll, pushOk } from '../../support/sync-client';
import { TestDevice } from '../../support/sync-ops';
import { createVisit, createVisitSetup, type VisitSetup } from '../../support/visit-fixtures';

let org: OrganisationFixture;
let setup: VisitSetup;
let tech: Session;
let office: Session;
let mine: string;
let theirs: string;

beforeAll(async () => {
  org = await createOrganisation('Pull');
  setup = await createVisitSetup(org);
  mine = await createVisit(org, setup);
  theirs = await createVisit(org, setup, { technicianId: org.otherTechnician.id });
  await testDb().insert(s.modelNotes).values({
    organisationId: org.organisationId,
    make: 'Corvane',
    model: 'Estrel',
    engine: '',
    title: 'Coolant hose clip',
    body: 'The lower hose clip loosens; check it at every service.',
  });
  [tech, office] = await Promise.all([signIn(org.technician.email, FIXTURE_PASSWORD), signIn(org.office.email, FIXTURE_PASSWORD)]);
});
afterAll(async () => {
  await testPool().end();
});

describe('pull', () => {
  it('gives a technician their own visits with all they need offline, and no one else’s', async () => {
    const { pages } = await pullAll(tech);
    const visits = pages.flatMap((p) => p.visits.map((v) => v.id));
    expect(visits).toContain(mine);
    expect(visits).not.toContain(theirs);
    const everything = mergePages(pages);
    expect(everything.customers.map((c) => c.id)).toContain(setup.customerId);
    expect(everything.vehicles.map((v) => v.id)).toContain(setup.vehicleId);
    expect(everything.modelNotes.map((n) => n.title)).toContain('Coolant hose clip');
    const version = everything.templateVersions.find((v) => v.id === setup.checklist.versionId);
    expect(version?.sections[0]?.items).toHaveLength(8);
  });

  it('returns only what changed after the cursor, and the visit whole when its row changed', async () => {
    const { cursor } = await pullAll(tech);
    const quiet = await pull(tech, cursor);
    expect(quiet.json).toMatchObject({ cursor, hasMore: false, visits: [], checkResults: [] });

    const phone = new TestDevice(`tara-${randomUUID().slice(0, 6)}`, Date.now() - 60_000);
    const check = phone.check(mine, setup.checklist.checks[0]!, 'done');
    await pushOk(tech, phone.deviceId, [check]);
    const next = await pull(tech, cursor);
    expect(Number(next.json.cursor)).toBeGreaterThan(Number(cursor));
    // The first change moved the visit to in progress, so the visit comes whole.
    expect(next.json.visits.map((v) => [v.id, v.status])).toEqual([[mine, 'in_progress']]);
    expect(next.json.checkResults).toEqual([{ visitId: mine, itemId: check.payload.itemId, state: 'done', stamp: check.stamp }]);

    const reading = phone.reading(mine, setup.checklist.readings[0]!, 3.3);
    await pushOk(tech, phone.deviceId, [reading]);
    const after = await pull(tech, next.json.cursor);
    expect(after.json.visits).toEqual([]);
    expect(after.json.readingResults.map((r) => r.value)).toEqual([3.3]);
    expect(after.json.checkResults).toEqual([]);
  });

  it('pages through many changes without losing or repeating any', async () => {
    const visitId = await createVisit(org, setup);
    const phone = new TestDevice(`tara-${randomUUID().slice(0, 6)}`, Date.now() - 60_000);
    const notes = Array.from({ length: 30 }, (_, i) => phone.note(visitId, `Note ${i}`));
    await pushOk(tech, phone.deviceId, notes);
    const { pages } = await pullAll(tech, '0', 7);
    expect(pages.length).toBeGreaterThan(3);
    const cursors = pages.map((p) => Number(p.cursor));
    expect([...cursors].sort((a, b) => a - b)).toEqual(cursors);
    const noteIds = pages.flatMap((p) => p.notes.filter((n) => n.visitId === visitId).map((n) => n.id));
    expect(new Set(noteIds)).toEqual(new Set(notes.map((n) => n.payload.noteId)));
  });

  it('tells a technician to drop visits that left their round or were cancelled', async () => {
    const moved = await createVisit(org, setup);
    const cancelled = await createVisit(org, setup);
    const { cursor } = await pullAll(tech);
    await testDb().update(s.visits).set({ technicianId: org.otherTechnician.id, changeSeq: s.nextChangeSeq }).where(eq(s.visits.id, moved));
    await testDb().insert(s.roundRemovals).values({ visitId: moved, technicianId: org.technician.id });
    await testDb().update(s.visits).set({ status: 'cancelled', changeSeq: s.nextChangeSeq }).where(eq(s.visits.id, cancelled));
    const { pages } = await pullAll(tech, cursor);
    expect(pages.flatMap((p) => p.removedVisitIds).sort()).toEqual([moved, cancelled].sort());
    expect(pages.flatMap((p) => p.visits.map((v) => v.id))).not.toContain(moved);
  });

  it('lets the office see every technician’s visits', async () => {
    const { pages } = await pullAll(office);
    const visits = pages.flatMap((p) => p.visits.map((v) => v.id));
    expect(visits).toEqual(expect.arrayContaining([mine, theirs]));
  });

  it('refuses a malformed cursor and one ahead of the server', async () => {
    expect((await pull(tech, 'yesterday')).status).toBe(400);
    const ahead = await pull(tech, '999999999999');
    expect(ahead.status).toBe(409);
    expect(ahead.json.error).toMatch(/from cursor 0/);
  });

  it('never hands out a cursor past a change whose transaction has not committed', async () => {
    const { cursor } = await pullAll(tech);
    // A writer that took its sequence number and is still in its transaction.
    const writer = new pg.Client({ connectionString: process.env.DATABASE_URL });
    await writer.connect();
    try {
      await writer.query('begin');
      // As every writer of synced rows does (lib/server/change-feed.ts).
      await writer.query('select pg_advisory_xact_lock_shared(731001, hashtext($1))', [org.organisationId]);
      const inserted = await writer.query<{ change_seq: string }>(
        `insert into model_notes (organisation_id, make, model, title, body) values ($1, 'Corvane', 'Estrel', 'Late note', 'Written slowly.') returning change_seq`,
        [org.organisationId],
      );
      const seq = Number(inserted.rows[0]!.change_seq);
      let answered = false;
      const pending = pull(tech, cursor).then((r) => {
        answered = true;
        return r;
      });
      await new Promise((resolve) => setTimeout(resolve, 300));
      expect(answered).toBe(false);
      await writer.query('commit');
      const response = await pending;
      expect(Number(response.json.cursor)).toBeGreaterThanOrEqual(seq);
      expect(response.json.modelNotes.map((n) => n.title)).toContain('Late note');
    } finally {
      await writer.end();
    }
  });
});
