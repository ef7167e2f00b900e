// Invoices from a visit: priced from parts and labour, numbered without gaps, never edited once
// sent, credited in full and issued again.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { callJson, signIn, type Session } from '../../support/http';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { testDb, testPool } from '../../support/database';
import { createSignedOffVisit } from '../../support/visit-fixtures';
import { readMail, waitForMail } from '../../support/mailbox';
import * as s from '../../../src/db/schema';

let org: OrganisationFixture;
let office: Session;
let technician: Session;

beforeAll(async () => {
  org = await createOrganisation('Invoices');
  office = await signIn(org.office.email, FIXTURE_PASSWORD);
  technician = await signIn(org.technician.email, FIXTURE_PASSWORD);
});
afterAll(async () => {
  await testPool().end();
});

async function draftFor(visitId: string) {
  const made = await callJson(office, `/api/office/visits/${visitId}/invoice`, { body: {} });
  expect(made.status).toBe(201);
  return made.json.invoiceId as string;
}

describe('a draft invoice', () => {
  it('is priced from the parts fitted and the checklist labour, with tax per line', async () => {
    const visit = await createSignedOffVisit(org);
    const id = await draftFor(visit.visitId);
    const detail = await callJson(office, `/api/office/invoices/${id}`);
    expect(detail.status).toBe(200);
    const lines = detail.json.lines.map((l: any) => [l.description, l.quantity, l.unitPriceMinor, l.netMinor, l.taxMinor]);
    // Oil 3.2 L x 11.50 = 36.80; filter 11.00; labour 1.5 h x 60.00 = 90.00 (fixture prices);
    // tax 20 % per line, rounded half up: 7.36 + 2.20 + 18.00.
    expect(lines).toEqual(
      expect.arrayContaining([
        ['Engine oil 5W-30', 3.2, 1150, 3680, 736],
        ['Oil filter', 1, 1100, 1100, 220],
        [expect.stringContaining('Labour'), 1.5, 6000, 9000, 1800],
      ]),
    );
    expect(detail.json.invoice).toMatchObject({ status: 'draft', number: null, netMinor: 13780, taxMinor: 2756, totalMinor: 16536 });
    const second = await callJson(office, `/api/office/visits/${visit.visitId}/invoice`, { body: {} });
    expect(second.status).toBe(409);
  });

  it('can be edited; bad lines are refused and change nothing', async () => {
    const visit = await createSignedOffVisit(org);
    const id = await draftFor(visit.visitId);
    const bad = await callJson(office, `/api/office/invoices/${id}`, {
      method: 'PUT',
      body: { lines: [{ kind: 'other', description: 'Wiper', quantity: -1, unit: '{each}', unitPriceMinor: 1400 }] },
    });
    expect(bad.status).toBe(400);
    expect(bad.json.details.join(' ')).toMatch(/quantity/);
    const tooMuchDiscount = await callJson(office, `/api/office/invoices/${id}`, {
      method: 'PUT',
      body: { lines: [{ kind: 'other', description: 'Wiper', quantity: 1, unit: '{each}', unitPriceMinor: 1400, discountMinor: 2000 }] },
    });
    expect(tooMuchDiscount.status).toBe(422);
    expect((await callJson(office, `/api/office/invoices/${id}`)).json.invoice.totalMinor).toBe(16536);
    const edited = await callJson(office, `/api/office/invoices/${id}`, {
      method: 'PUT',
      body: { lines: [{ kind: 'other', description: 'Wiper blade 600 mm', partNumber: 'WB-600', quantity: 2, unit: '{each}', unitPriceMinor: 1400, discountMinor: 300 }] },
    });
    expect(edited.status).toBe(200);
    expect(edited.json.invoice).toMatchObject({ netMinor: 2500, taxMinor: 500, totalMinor: 3000 });
    expect((await callJson(technician, `/api/office/invoices/${id}`)).status).toBe(403);
  });
});

describe('issuing', () => {
  it('numbers invoices without gaps, even when many are sent at once', async () => {
    const fresh = await createOrganisation('Numbers');
    const session = await signIn(fresh.office.email, FIXTURE_PASSWORD);
    const visits = await Promise.all(Array.from({ length: 6 }, () => createSignedOffVisit(fresh)));
    const ids: string[] = [];
    for (const v of visits) ids.push((await callJson(session, `/api/office/visits/${v.visitId}/invoice`, { body: {} })).json.invoiceId);
    // A draft discarded before sending takes no number.
    const discardedVisit = await createSignedOffVisit(fresh);
    const discarded = (await callJson(session, `/api/office/visits/${discardedVisit.visitId}/invoice`, { body: {} })).json.invoiceId;
    expect((await callJson(session, `/api/office/invoices/${discarded}`, { method: 'DELETE', body: {} })).status).toBe(200);
    const sent = await Promise.all(ids.map((id) => callJson(session, `/api/office/invoices/${id}/send`, { body: {} })));
    expect(sent.map((r) => r.status)).toEqual([200, 200, 200, 200, 200, 200]);
    const numbers = sent.map((r) => r.json.number).sort();
    expect(numbers).toEqual(['INV-00001', 'INV-00002', 'INV-00003', 'INV-00004', 'INV-00005', 'INV-00006']);
    const resend = await callJson(session, `/api/office/invoices/${ids[0]}/send`, { body: {} });
    expect(resend.status).toBe(409);
  });

  it('sends the invoice e-mail once, marks the visit invoiced, and refuses edits afterwards', async () => {
    const visit = await createSignedOffVisit(org);
    const id = await draftFor(visit.visitId);
    const sent = await callJson(office, `/api/office/invoices/${id}/send`, { body: {} });
    expect(sent.status).toBe(200);
    expect(sent.json.emailed).toBe(true);
    const [entry] = await waitForMail(visit.customerEmail);
    const mail = await readMail(entry!);
    expect(mail.subject).toContain(sent.json.number);
    expect(mail.subject).toContain('£165.36');
    expect(mail.html).toContain('/record/');
    const [row] = await testDb().select().from(s.visits).where(eq(s.visits.id, visit.visitId));
    expect(row!.status).toBe('invoiced');
    const edit = await callJson(office, `/api/office/invoices/${id}`, {
      method: 'PUT',
      body: { lines: [{ kind: 'other', description: 'x', quantity: 1, unit: '{each}', unitPriceMinor: 1 }] },
    });
    expect(edit.status).toBe(409);
    expect(edit.json.error).toMatch(/credit it/);
  });

  it('credits a sent invoice in full with its own number, then allows a corrected invoice', async () => {
    const visit = await createSignedOffVisit(org);
    const id = await draftFor(visit.visitId);
    await callJson(office, `/api/office/invoices/${id}/send`, { body: {} });
    expect((await callJson(office, `/api/office/invoices/${id}/credit`, { body: { reason: '' } })).status).toBe(400);
    const credit = await callJson(office, `/api/office/invoices/${id}/credit`, { body: { reason: 'Oil charged at the wrong grade' } });
    expect(credit.status).toBe(201);
    expect(credit.json.number).toMatch(/^CRN-\d{5}$/);
    const detail = await callJson(office, `/api/office/invoices/${id}`);
    expect(detail.json.invoice.status).toBe('void');
    expect(detail.json.creditNote.totalMinor).toBe(detail.json.invoice.totalMinor);
    expect((await callJson(office, `/api/office/invoices/${id}/credit`, { body: { reason: 'again' } })).status).toBe(409);
    const corrected = await callJson(office, `/api/office/visits/${visit.visitId}/invoice`, { body: {} });
    expect(corrected.status).toBe(201);
  });

  it('will not invoice a visit that is not signed off', async () => {
    const visit = await createSignedOffVisit(org);
    await testDb().update(s.visits).set({ status: 'booked' }).where(eq(s.visits.id, visit.visitId));
    const made = await callJson(office, `/api/office/visits/${visit.visitId}/invoice`, { body: {} });
    expect(made.status).toBe(409);
    expect(made.json.error).toMatch(/signed off/);
  });
});
