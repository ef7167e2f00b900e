// The mail queue: a message the mail server refuses for now is retried with backoff and arrives
// once; the office sees every message with its status.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { callJson, signIn, type Session } from '../../support/http';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { testDb, testPool } from '../../support/database';
import { createSignedOffVisit } from '../../support/visit-fixtures';
import { messagesTo, waitForMail } from '../../support/mailbox';
import * as s from '../../../src/db/schema';

let org: OrganisationFixture;
let office: Session;
let technician: Session;

beforeAll(async () => {
  org = await createOrganisation('Mail');
  office = await signIn(org.office.email, FIXTURE_PASSWORD);
  technician = await signIn(org.technician.email, FIXTURE_PASSWORD);
});
afterAll(async () => {
  await testPool().end();
});

async function messageRow(visitId: string) {
  const [row] = await testDb().select().from(s.outgoingMessages).where(eq(s.outgoingMessages.visitId, visitId));
  return row!;
}

describe('the mail queue', () => {
  it('retries a temporary refusal and delivers exactly one copy', async () => {
    // The fake answers 451 (try later) the first time it sees a "tempfail-once" recipient.
    const address = `tempfail-once.${crypto.randomUUID().slice(0, 8)}@customer.example`;
    const visit = await createSignedOffVisit(org, { email: address });
    expect((await callJson(office, `/api/office/visits/${visit.visitId}/record/send`, { body: {} })).status).toBe(202);
    await waitForMail(address, 1, 30_000);
    let row = await messageRow(visit.visitId);
    for (let i = 0; i < 40 && row.status !== 'sent'; i++) {
      await new Promise((r) => setTimeout(r, 250));
      row = await messageRow(visit.visitId);
    }
    expect(row.status).toBe('sent');
    expect(row.attempts).toBe(2);
    expect(row.lastError).toBeNull();
    await new Promise((r) => setTimeout(r, 1500));
    expect(messagesTo(address)).toHaveLength(1);
  });

  it('lists messages for the office with their status, not for technicians', async () => {
    const visit = await createSignedOffVisit(org);
    await callJson(office, `/api/office/visits/${visit.visitId}/record/send`, { body: {} });
    await waitForMail(visit.customerEmail);
    const listed = await callJson(office, '/api/office/messages?kind=record_ready');
    expect(listed.status).toBe(200);
    const mine = listed.json.messages.find((m: any) => m.visitId === visit.visitId);
    expect(mine).toMatchObject({ kind: 'record_ready', toAddress: visit.customerEmail });
    expect(['queued', 'sending', 'sent']).toContain(mine.status);
    expect((await callJson(office, '/api/office/messages?status=lost')).status).toBe(400);
    expect((await callJson(technician, '/api/office/messages')).status).toBe(403);
    const detail = await callJson(office, `/api/office/messages/${mine.id}`);
    expect(detail.json.message.html).toContain(visit.registration);
    expect((await callJson(office, `/api/office/messages/${mine.id}/resend`, { body: {} })).status).toBe(409);
  });
});
