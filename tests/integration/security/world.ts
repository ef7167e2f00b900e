// Two businesses for the authorization matrix: A holds one of everything an API route can name
// (visits in each state, invoices, advised work, a message, a conflict, a photo, checklists,
// record links), B is the neighbour whose people try A's ids. Every callable is signed in once.
import { createHash, randomUUID } from 'node:crypto';
import { and, eq, sql } from 'drizzle-orm';
import sharp from 'sharp';
import { expect } from 'vitest';
import * as s from '../../../src/db/schema';
import { createRecordLink } from '../../../src/lib/server/record-links';
import { testDb, testPool } from '../../support/database';
import { createOrganisation, FIXTURE_PASSWORD } from '../../support/fixtures';
import { call, callJson, signIn, type Session } from '../../support/http';
import { publishedChecklist, syncedSignedOffVisit, visitFor } from '../../support/office-fixtures';
import { createSignedOffVisit, createVisit, createVisitSetup, type VisitFixture } from '../../support/visit-fixtures';

/** Who calls. "outsider…" are B's people, calling with A's ids. */
export const CALLERS = ['anonymous', 'technician', 'otherTechnician', 'office', 'owner', 'outsiderTechnician', 'outsider', 'outsiderOwner'] as const;
export type Caller = (typeof CALLERS)[number];

export type World = Awaited<ReturnType<typeof buildWorld>>;

/** A checklist item as the editor sends it. */
export const WIPERS = { kind: 'check', label: 'Wipers and washers', unit: null, expectedMin: null, expectedMax: null, rule: null, partKind: null, caution: null, hint: null };

const day = (offsetDays: number) => new Date(Date.now() + offsetDays * 86_400_000).toISOString().slice(0, 10);

async function templateIdOf(versionId: string) {
  const [row] = await testDb().select({ templateId: s.templateVersions.templateId }).from(s.templateVersions).where(eq(s.templateVersions.id, versionId));
  return row!.templateId;
}

async function pngBytes(seed: number) {
  return new Uint8Array(await sharp({ create: { width: 64, height: 48, channels: 3, background: { r: seed, g: 80, b: 140 } } }).png().toBuffer());
}

export async function buildWorld() {
  const db = testDb();
  const a = await createOrganisation('Matrix A');
  const b = await createOrganisation('Matrix B');
  const signedIn = await Promise.all([
    signIn(a.technician.email, FIXTURE_PASSWORD),
    signIn(a.otherTechnician.email, FIXTURE_PASSWORD),
    signIn(a.office.email, FIXTURE_PASSWORD),
    signIn(a.owner.email, FIXTURE_PASSWORD),
    signIn(b.technician.email, FIXTURE_PASSWORD),
    signIn(b.office.email, FIXTURE_PASSWORD),
    signIn(b.owner.email, FIXTURE_PASSWORD),
  ]);
  const sessions: Record<Caller, Session | null> = {
    anonymous: null,
    technician: signedIn[0],
    otherTechnician: signedIn[1],
    office: signedIn[2],
    owner: signedIn[3],
    outsiderTechnician: signedIn[4],
    outsider: signedIn[5],
    outsiderOwner: signedIn[6],
  };
  const office = sessions.office!;

  // Booked visits on A's technician's rounds: today's (pushed to, cancelled), one to move, and a
  // round of two far ahead for reordering, which nothing else touches.
  const setup = await createVisitSetup(a);
  const templateId = await templateIdOf(setup.checklist.versionId);
  const pushVisitId = await createVisit(a, setup);
  const cancelVisitId = await createVisit(a, setup);
  const moveVisitId = await createVisit(a, setup);
  const orderDate = day(40);
  const orderVisitIds = [await createVisit(a, setup, { roundDate: orderDate }), await createVisit(a, setup, { roundDate: orderDate })];

  // Signed-off visits: one to review, invoice, price and share; the others each carry one
  // invoice or one piece of advised work in the state its route needs.
  const email = () => `keeper.${randomUUID().slice(0, 8)}@customer.example`;
  const reviewed = await createSignedOffVisit(a, { email: email() });
  const withDraft = await createSignedOffVisit(a, { email: email() });
  const withDiscardable = await createSignedOffVisit(a, { email: email() });
  const withSendable = await createSignedOffVisit(a, { email: email() });
  const withSent = await createSignedOffVisit(a, { email: email() });
  const draftInvoice = async (visit: VisitFixture) => {
    const made = await callJson(office, `/api/office/visits/${visit.visitId}/invoice`, { body: {} });
    expect(made.status).toBe(201);
    return made.json.invoiceId as string;
  };
  const draftInvoiceId = await draftInvoice(withDraft);
  const discardableInvoiceId = await draftInvoice(withDiscardable);
  const sendableInvoiceId = await draftInvoice(withSendable);
  const sentInvoiceId = await draftInvoice(withSent);
  expect((await callJson(office, `/api/office/invoices/${sentInvoiceId}/send`, { body: {} })).status).toBe(200);

  const price = { description: 'Replace the coolant', priceMinor: 8900, labourCentiHours: 50 };
  const priceFinding = async (findingId: string) => {
    const priced = await callJson(office, `/api/office/findings/${findingId}/advised`, { method: 'PUT', body: price });
    expect(priced.status).toBe(200);
    return priced.json.advisedWorkId as string;
  };
  const decidableAdvisedId = await priceFinding(withDraft.findingIds.soon);
  const bookableAdvisedId = await priceFinding(withDiscardable.findingIds.soon);
  expect((await callJson(office, `/api/office/advised-work/${bookableAdvisedId}/decision`, { body: { decision: 'approved' } })).status).toBe(200);
  const customerAdvisedId = await priceFinding(withSent.findingIds.watch);

  // Customers' links: to the record with advised work on it, and to the one with a sent invoice.
  const link = async (visitId: string) => (await createRecordLink(db, { organisationId: a.organisationId, visitId, createdBy: a.office.id })).token;
  const sentRecordToken = await link(withSent.visitId);

  // A message that failed, for a person to send again.
  const [failedMessage] = await db
    .insert(s.outgoingMessages)
    .values({
      organisationId: a.organisationId,
      kind: 'record_ready',
      idempotencyKey: `matrix:${randomUUID()}`,
      toAddress: 'bounced@customer.example',
      subject: 'Your service record',
      html: '<p>Your record</p>',
      text: 'Your record',
      status: 'failed',
      lastError: '550 no such mailbox',
      visitId: reviewed.visitId,
    })
    .returning();

  // A visit synced and signed off with a change that arrived after the sign-off: an open conflict.
  const checklist = await publishedChecklist(a, `Conflict service ${randomUUID().slice(0, 6)}`);
  const conflictVisit = await visitFor(
    a,
    { customerId: setup.customerId, vehicleId: setup.vehicleId, versionId: checklist.versionId },
    { roundDate: day(-3), start: new Date(Date.now() - 3 * 86_400_000).toISOString(), end: new Date(Date.now() - 3 * 86_400_000 + 5_400_000).toISOString() },
  );
  await syncedSignedOffVisit(a, conflictVisit, { openConflict: true });
  const [conflict] = await db.select({ id: s.conflicts.id }).from(s.conflicts).where(eq(s.conflicts.visitId, conflictVisit.id));

  // Checklists: drafts to save, discard and publish; the published one to read and copy.
  const newTemplate = async (name: string) => {
    const made = await callJson(office, '/api/office/templates', {
      body: { name, description: '', labourHours: '1', sections: [{ title: 'Checks', items: [WIPERS] }] },
    });
    expect(made.status).toBe(201);
    return made.json as { templateId: string; draftVersionId: string };
  };
  const tag = randomUUID().slice(0, 6);
  const savable = await newTemplate(`Matrix save ${tag}`);
  const discardable = await newTemplate(`Matrix discard ${tag}`);
  const publishable = await newTemplate(`Matrix publish ${tag}`);

  // A photo A's technician uploaded; it is on none of the other technician's visits.
  const photoBytes = await pngBytes(7);
  const photoSha = createHash('sha256').update(photoBytes).digest('hex');
  const uploaded = await call(sessions.technician, `/api/photos/${photoSha}`, { method: 'PUT', body: photoBytes, headers: { 'content-type': 'image/png' } });
  expect(uploaded.status).toBe(201);
  const uploadBytes = await pngBytes(9);
  const uploadSha = createHash('sha256').update(uploadBytes).digest('hex');

  // The van stock's parts: an oil (bought in containers) and a filter, from the signed-off visits' catalogue.
  const [oilPart] = await db.select({ id: s.parts.id }).from(s.parts).where(and(eq(s.parts.organisationId, a.organisationId), eq(s.parts.kind, 'oil'))).limit(1);
  const [filterPart] = await db.select({ id: s.parts.id }).from(s.parts).where(and(eq(s.parts.organisationId, a.organisationId), eq(s.parts.kind, 'oil_filter'))).limit(1);

  const [modelNote] = await db
    .insert(s.modelNotes)
    .values({ organisationId: a.organisationId, make: 'Corvane', model: 'Estrel', engine: '', title: 'Matrix note', body: 'Look at the coolant pipe.' })
    .returning();

  const ids = {
    templateId,
    setup,
    pushVisitId,
    cancelVisitId,
    moveVisitId,
    orderDate,
    orderVisitIds,
    reviewed,
    withSendable,
    draftInvoiceId,
    discardableInvoiceId,
    sendableInvoiceId,
    sentInvoiceId,
    decidableAdvisedId,
    bookableAdvisedId,
    customerAdvisedId,
    sentRecordToken,
    failedMessageId: failedMessage!.id,
    conflictId: conflict!.id,
    savable,
    discardable,
    publishable,
    publishedVersionId: setup.checklist.versionId,
    photoSha,
    uploadSha,
    uploadBytes,
    modelNoteId: modelNote!.id,
    oilPartId: oilPart!.id,
    filterPartId: filterPart!.id,
  };

  // Strings of A's that must never reach B, and strings of A's technician's visits that the other
  // technician must never be sent.
  const [customer] = await db.select().from(s.customers).where(eq(s.customers.id, setup.customerId));
  const [vehicle] = await db.select().from(s.vehicles).where(eq(s.vehicles.id, setup.vehicleId));
  const aMarkers = [
    a.organisationId,
    a.technician.email,
    a.office.email,
    customer!.name,
    vehicle!.registration,
    setup.customerId,
    setup.vehicleId,
    pushVisitId,
    reviewed.visitId,
    reviewed.registration,
    draftInvoiceId,
    conflict!.id,
    photoSha,
    modelNote!.id,
    oilPart!.id,
  ];
  const technicianMarkers = [pushVisitId, cancelVisitId, moveVisitId, ...orderVisitIds, customer!.name];

  return { a, b, sessions, ids, names: { customer: customer!.name, registration: vehicle!.registration }, aMarkers, technicianMarkers };
}

// ---- "changed nothing": a digest of every row of A's ------------------------------------------

type DigestedTable = { table: string; where: string };

let digestTables: Promise<DigestedTable[]> | undefined;

/**
 * A's rows in every table: by organisation_id where the table has one, else through the visit,
 * checklist version, invoice or user the row hangs off. Sessions and rate limits change with
 * every sign-in anywhere, so they are left out.
 */
async function tablesToDigest(): Promise<DigestedTable[]> {
  const { rows } = await testPool().query<{ table_name: string; columns: string[] }>(
    `select table_name, array_agg(column_name::text) as columns from information_schema.columns
      where table_schema = 'public' group by table_name order by table_name`,
  );
  const skip = new Set(['session', 'rate_limit', 'verification', '__drizzle_migrations']);
  const tables: DigestedTable[] = [];
  for (const { table_name: table, columns } of rows) {
    if (skip.has(table)) continue;
    const quoted = `"${table}"`;
    if (columns.includes('organisation_id')) tables.push({ table: quoted, where: 'organisation_id = $1' });
    else if (columns.includes('visit_id')) tables.push({ table: quoted, where: 'visit_id in (select id from visits where organisation_id = $1)' });
    else if (columns.includes('version_id')) tables.push({ table: quoted, where: 'version_id in (select id from template_versions where organisation_id = $1)' });
    else if (columns.includes('invoice_id')) tables.push({ table: quoted, where: 'invoice_id in (select id from invoices where organisation_id = $1)' });
    else if (columns.includes('user_id')) tables.push({ table: quoted, where: 'user_id in (select id from "user" where organisation_id = $1)' });
  }
  return tables;
}

/**
 * Waits until the job worker has sent what A's allowed calls queued: its status changes to
 * outgoing_messages are not anyone's refused call.
 */
async function mailSettled(organisationId: string) {
  for (let i = 0; i < 150; i++) {
    const { rows } = await testPool().query(
      `select 1 from outgoing_messages where organisation_id = $1 and status in ('queued', 'sending', 'retrying') limit 1`,
      [organisationId],
    );
    if (rows.length === 0) return;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error('mail queued by the matrix was not sent within 15 s');
}

/** One md5 per table over A's rows, in a stable order. */
export async function digestOf(organisationId: string): Promise<Record<string, string>> {
  await mailSettled(organisationId);
  digestTables ??= tablesToDigest();
  const tables = await digestTables;
  const query = tables
    .map(({ table, where }) => `select '${table}' as t, md5(coalesce(string_agg(x::text, '|' order by x::text), '')) as d from ${table} x where ${where}`)
    .join(' union all ');
  const { rows } = await testPool().query<{ t: string; d: string }>(query, [organisationId]);
  return Object.fromEntries(rows.map((r) => [r.t, r.d]));
}

/** The ids of A's technician's round on a day, as the office's week shows them now. */
export async function roundVisitIds(organisationId: string, technicianId: string, roundDate: string) {
  const rows = await testDb()
    .select({ id: s.visits.id })
    .from(s.visits)
    .where(
      and(
        eq(s.visits.organisationId, organisationId),
        eq(s.visits.technicianId, technicianId),
        eq(s.visits.roundDate, roundDate),
        sql`${s.visits.status} <> 'cancelled'`,
      ),
    )
    .orderBy(s.visits.roundPosition);
  return rows.map((r) => r.id).reverse();
}

