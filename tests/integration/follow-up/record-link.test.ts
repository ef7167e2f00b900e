// The customer's service record: the e-mail reaches the mail fake with a working link, the page
// and the PDF show the visit, and the link is checked on every request.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { call, callJson, signIn, type Session } from '../../support/http';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { testPool } from '../../support/database';
import { createSignedOffVisit, type VisitFixture } from '../../support/visit-fixtures';
import { readMail, waitForMail } from '../../support/mailbox';
import { pdfText } from '../../support/pdf-text';

let org: OrganisationFixture;
let other: OrganisationFixture;
let visit: VisitFixture;
let office: Session;
let technician: Session;
let otherOffice: Session;
let link: string;

beforeAll(async () => {
  org = await createOrganisation('Record');
  other = await createOrganisation('Elsewhere');
  visit = await createSignedOffVisit(org);
  office = await signIn(org.office.email, FIXTURE_PASSWORD);
  technician = await signIn(org.technician.email, FIXTURE_PASSWORD);
  otherOffice = await signIn(other.office.email, FIXTURE_PASSWORD);
});
afterAll(async () => {
  await testPool().end();
});

describe('sending the record', () => {
  it('refuses a technician and another business', async () => {
    expect((await callJson(technician, `/api/office/visits/${visit.visitId}/record/send`, { body: {} })).status).toBe(403);
    expect((await callJson(otherOffice, `/api/office/visits/${visit.visitId}/record/send`, { body: {} })).status).toBe(404);
    expect((await callJson(office, `/api/office/visits/not-a-uuid/record/send`, { body: {} })).status).toBe(400);
  });

  it('e-mails the customer a link that opens the record', async () => {
    const sent = await callJson(office, `/api/office/visits/${visit.visitId}/record/send`, { body: {} });
    expect(sent.status).toBe(202);
    const [entry] = await waitForMail(visit.customerEmail);
    const mail = await readMail(entry!);
    expect(mail.subject).toContain(visit.registration);
    expect(mail.text).toContain('Needs doing soon: Coolant protection only to −18 °C');
    const url = (mail.html || '').match(/href="(http[^"]+\/record\/[^"]+)"/)?.[1];
    expect(url).toBeDefined();
    expect(mail.text).toContain(url!);
    link = new URL(url!).pathname;
    const page = await call(null, link);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain(visit.registration);
    expect(html).toContain('Coolant protection only to −18 °C');
    expect(html).toContain('−18 °C');
    expect(html).toContain('12.62 V');
    expect(html).toContain('Not done this time: Scuttle drains cleared');
    expect(html).toContain('local regulations take precedence');
    // Next service: 12 months or 10 000 miles after 41 230 mi.
    expect(html).toContain('51,230 mi');
  });

  it('does not send the same record twice by accident', async () => {
    const again = await callJson(office, `/api/office/visits/${visit.visitId}/record/send`, { body: {} });
    expect(again.status).toBe(409);
    expect(again.json.error).toMatch(/Send again/);
  });

  it('serves the same record as a PDF with the expected text', async () => {
    const response = await call(null, `${link}/pdf`);
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe('application/pdf');
    const text = await pdfText(new Uint8Array(await response.arrayBuffer()));
    expect(text).toContain('Service record');
    expect(text).toContain(visit.registration);
    expect(text).toContain('Coolant protection only to −18 °C');
    expect(text).toContain('NEEDS DOING SOON');
    expect(text).toContain('12.62 V');
    expect(text).toContain('41,230 mi');
    expect(text).toContain('local regulations take precedence');
  });
});

describe('the signed link', () => {
  it('rejects a token whose signature or expiry was changed', async () => {
    const token = link.split('/')[2]!;
    const [id, expiry, signature] = token.split('.');
    const flipped = signature!.slice(0, -2) + (signature!.endsWith('AA') ? 'BB' : 'AA');
    expect((await call(null, `/record/${id}.${expiry}.${flipped}`)).status).toBe(404);
    const stretched = (parseInt(expiry!, 36) + 86_400 * 365).toString(36);
    expect((await call(null, `/record/${id}.${stretched}.${signature}`)).status).toBe(404);
    expect((await call(null, `/record/nonsense`)).status).toBe(404);
    expect((await call(null, `/record/${id}.${expiry}.${flipped}/pdf`)).status).toBe(404);
  });

  it('stops working once the office withdraws it', async () => {
    const other = await createSignedOffVisit(org);
    const sent = await callJson(office, `/api/office/visits/${other.visitId}/record/send`, { body: {} });
    const path = new URL(sent.json.url).pathname;
    expect((await call(null, path)).status).toBe(200);
    const withdrawn = await callJson(office, `/api/office/visits/${other.visitId}/record/withdraw`, { body: {} });
    expect(withdrawn.json.withdrawn).toBe(1);
    const after = await call(null, path);
    expect(after.status).toBe(404);
    expect(await after.text()).toContain('no longer available');
  });
});
