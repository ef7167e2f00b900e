// The visits table's filters and the review of a synced visit: readings with their trade
// judgement, findings with photos, the sign-off, the operations and conflicts, and "mark
// reviewed" (only for a signed-off visit without open conflicts).
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as s from '../../../src/db/schema';
import { testDb, testPool } from '../../support/database';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { callJson, signIn, type Session } from '../../support/http';
import { customerWithVehicle, publishedChecklist, syncedSignedOffVisit, visitFor } from '../../support/office-fixtures';

let org: OrganisationFixture;
let other: OrganisationFixture;
let office: Session;
let outsider: Session;
let clean: typeof s.visits.$inferSelect;
let disputed: typeof s.visits.$inferSelect;
let booked: typeof s.visits.$inferSelect;

beforeAll(async () => {
  org = await createOrganisation('Review');
  other = await createOrganisation('Review elsewhere');
  office = await signIn(org.office.email, FIXTURE_PASSWORD);
  outsider = await signIn(other.office.email, FIXTURE_PASSWORD);
  const { versionId } = await publishedChecklist(org);
  const { customer, vehicle } = await customerWithVehicle(org, 'Review Customer');
  const refs = { customerId: customer.id, vehicleId: vehicle.id, versionId };
  clean = await visitFor(org, refs, { roundDate: '2031-02-03', start: '2031-02-03T09:00:00Z', end: '2031-02-03T11:00:00Z', status: 'in_progress' });
  disputed = await visitFor(org, refs, { roundDate: '2031-02-04', start: '2031-02-04T09:00:00Z', end: '2031-02-04T11:00:00Z', status: 'in_progress', technicianId: org.otherTechnician.id });
  booked = await visitFor(org, refs, { roundDate: '2031-02-10', start: '2031-02-10T09:00:00Z', end: '2031-02-10T11:00:00Z' });
  await syncedSignedOffVisit(org, clean);
  await syncedSignedOffVisit(org, disputed, { openConflict: true });
});
afterAll(async () => {
  await testPool().end();
});

const ids = (response: { json: { rows: { id: string }[] } }) => response.json.rows.map((r) => r.id).sort();

describe('the visits table', () => {
  it('filters by date range, technician and status', async () => {
    expect(ids(await callJson(office, '/api/office/visits?from=2031-02-04&to=2031-02-28'))).toEqual([disputed.id, booked.id].sort());
    expect(ids(await callJson(office, `/api/office/visits?technicianId=${org.otherTechnician.id}`))).toEqual([disputed.id]);
    expect(ids(await callJson(office, '/api/office/visits?status=booked'))).toEqual([booked.id]);
  });

  it('finds visits with findings at soon or now, and visits with open conflicts', async () => {
    expect(ids(await callJson(office, '/api/office/visits?attention=1'))).toEqual([clean.id, disputed.id].sort());
    const conflicted = await callJson(office, '/api/office/visits?conflicts=1');
    expect(ids(conflicted)).toEqual([disputed.id]);
    expect(conflicted.json.rows[0]).toMatchObject({ worstSeverity: 'now', findingCount: 1, openConflicts: 1, technicianName: 'Theo Tech' });
  });

  it('refuses an unknown status or a malformed date', async () => {
    expect((await callJson(office, '/api/office/visits?status=lost')).status).toBe(400);
    expect((await callJson(office, '/api/office/visits?from=04/02/2031')).status).toBe(400);
  });

  it('shows another business none of these visits', async () => {
    expect((await callJson(outsider, '/api/office/visits')).json.total).toBe(0);
    expect((await callJson(outsider, `/api/office/visits/${clean.id}`)).status).toBe(404);
    expect((await callJson(outsider, `/api/office/visits/${clean.id}/review`, { body: {} })).status).toBe(404);
  });
});

describe('reviewing a visit', () => {
  it('shows each item’s result with the trade judgement of its reading', async () => {
    const response = await callJson(office, `/api/office/visits/${clean.id}`);
    expect(response.status).toBe(200);
    const items = response.json.checklist.sections.flatMap((section: { items: unknown[] }) => section.items);
    const byLabel = (label: string) => items.find((i: { label: string }) => i.label === label);
    expect(byLabel('Coolant level and hoses').check.state).toBe('done');
    // 12.2 V at rest is about half charged (BCI table: 12.24 V = 50 %), under the 12.4 V the item expects.
    expect(byLabel('Battery resting voltage').reading).toMatchObject({ value: 12.2, judgement: { verdict: expect.not.stringMatching(/^ok$/) } });
    expect(['watch', 'soon', 'now']).toContain(byLabel('Battery resting voltage').reading.judgement.severity);
    // 1.4 mm is under the 1.6 mm legal minimum (Council Directive 89/459/EEC; UK C&U reg. 27(1)(g)).
    expect(byLabel('Tread depth, front left').reading.judgement.severity).toBe('now');
    expect(byLabel('Oil grade used').reading).toBeNull();
  });

  it('shows findings with their photos, the sign-off and the history of operations', async () => {
    const d = (await callJson(office, `/api/office/visits/${clean.id}`)).json;
    expect(d.findings).toEqual([expect.objectContaining({ severity: 'now', title: 'Front left tyre below the legal limit', photos: [expect.objectContaining({ sizeBytes: 123_456, contentType: 'image/jpeg' })] })]);
    expect(d.signOff).toMatchObject({ odometer: 41_000, customerName: 'Ada Testwell', technicianName: 'Tara Tech' });
    expect(d.signOff.signatureSvg).toContain('<svg');
    expect(d.operations.total).toBe(4);
    expect(d.operations.shown.map((op: { kind: string }) => op.kind).sort()).toEqual(['check', 'reading', 'reading', 'sign_off']);
    expect(d.review).toEqual({ allowed: true, reason: null });
  });

  it('refuses to mark reviewed while a conflict is open (409), and leaves the visit as it was', async () => {
    const d = (await callJson(office, `/api/office/visits/${disputed.id}`)).json;
    expect(d.conflicts).toEqual([expect.objectContaining({ reason: 'visit_locked', resolvedAt: null })]);
    expect(d.review).toEqual({ allowed: false, reason: 'Resolve the 1 open conflict first.' });
    const response = await callJson(office, `/api/office/visits/${disputed.id}/review`, { body: {} });
    expect(response.status).toBe(409);
    expect(response.json.error).toMatch(/open conflict/);
    const [row] = await testDb().select().from(s.visits).where(eq(s.visits.id, disputed.id));
    expect(row!.status).toBe('signed_off');
  });

  it('refuses to mark a booked visit reviewed', async () => {
    const response = await callJson(office, `/api/office/visits/${booked.id}/review`, { body: {} });
    expect(response.status).toBe(409);
    expect(response.json.error).toMatch(/not started/);
  });

  it('marks a signed-off visit reviewed, once', async () => {
    const before = (await testDb().select().from(s.visits).where(eq(s.visits.id, clean.id)))[0]!;
    const response = await callJson(office, `/api/office/visits/${clean.id}/review`, { body: {} });
    expect(response.status).toBe(200);
    expect(response.json.visit).toMatchObject({ status: 'reviewed', reviewedBy: org.office.id });
    expect(Number(response.json.visit.changeSeq)).toBeGreaterThan(before.changeSeq);
    expect((await callJson(office, `/api/office/visits/${clean.id}/review`, { body: {} })).status).toBe(409);
  });
});
