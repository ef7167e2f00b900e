// Checklist templates: a draft takes edits, publishing freezes it, a published version answers
// 409 to edits, a new draft copies the latest version, and visits keep the version they were
// booked with.
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as s from '../../../src/db/schema';
import { testDb, testPool } from '../../support/database';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { callJson, signIn, type Session } from '../../support/http';
import { customerWithVehicle } from '../../support/office-fixtures';

let org: OrganisationFixture;
let office: Session;

beforeAll(async () => {
  org = await createOrganisation('Templates');
  office = await signIn(org.office.email, FIXTURE_PASSWORD);
});
afterAll(async () => {
  await testPool().end();
});

const item = (over: Record<string, unknown> = {}) => ({
  kind: 'check',
  label: 'Wipers and washers',
  unit: '',
  expectedMin: '',
  expectedMax: '',
  rule: '',
  partKind: '',
  caution: '',
  hint: '',
  ...over,
});

const content = {
  sections: [
    {
      title: 'Cabin',
      items: [
        item(),
        item({ kind: 'reading', label: 'Battery resting voltage', unit: 'V', expectedMin: '12.4', expectedMax: '12.9', rule: 'battery_rest', caution: 'No sparks near the battery.' }),
      ],
    },
  ],
};

describe('checklist templates', () => {
  let templateId: string;
  let v1: string;

  it('creates a template as an empty draft version 1', async () => {
    const response = await callJson(office, '/api/office/templates', { body: { name: 'Look-over', description: 'Before a purchase', labourHours: '1.25' } });
    expect(response.status).toBe(201);
    templateId = response.json.templateId;
    v1 = response.json.draftVersionId;
    const detail = await callJson(office, `/api/office/templates/${templateId}`);
    expect(detail.json.template.labourCentiHours).toBe(125);
    expect(detail.json.versions).toMatchObject([{ id: v1, version: 1, status: 'draft', visitCount: 0 }]);
  });

  it('refuses a duplicate name with 409', async () => {
    const response = await callJson(office, '/api/office/templates', { body: { name: 'Look-over', description: '', labourHours: '1' } });
    expect(response.status).toBe(409);
  });

  it('refuses to publish an empty draft (422)', async () => {
    const response = await callJson(office, `/api/office/template-versions/${v1}/publish`, { body: {} });
    expect(response.status).toBe(422);
  });

  it('refuses item rules a technician could not rely on, with the field named', async () => {
    const bad = {
      sections: [
        {
          title: 'Bad',
          items: [
            item({ kind: 'reading', label: 'No unit', unit: '' }),
            item({ kind: 'reading', label: 'Upside down', unit: 'mm', expectedMin: '5', expectedMax: '1' }),
            item({ kind: 'check', label: 'Check with a range', expectedMin: '1' }),
            item({ kind: 'reading', label: 'Made-up rule', unit: 'V', rule: 'guesswork' }),
          ],
        },
      ],
    };
    const response = await callJson(office, `/api/office/template-versions/${v1}`, { method: 'PUT', body: bad });
    expect(response.status).toBe(400);
    expect(response.json.details).toEqual(
      expect.arrayContaining([
        'sections.0.items.0.unit: a reading needs a unit',
        'sections.0.items.1.expectedMax: must not be below the lowest expected value',
        'sections.0.items.2.expectedMin: only a reading has an expected range',
        'sections.0.items.3.rule: is not a rule the trade checks know',
      ]),
    );
  });

  it('saves draft content and publishes it', async () => {
    const saved = await callJson(office, `/api/office/template-versions/${v1}`, { method: 'PUT', body: content });
    expect(saved.status).toBe(200);
    expect(saved.json.version.sections[0].items.map((i: { label: string }) => i.label)).toEqual(['Wipers and washers', 'Battery resting voltage']);
    expect(saved.json.version.sections[0].items[1]).toMatchObject({ unit: 'V', expectedMin: 12.4, expectedMax: 12.9, rule: 'battery_rest', caution: 'No sparks near the battery.' });
    const published = await callJson(office, `/api/office/template-versions/${v1}/publish`, { body: {} });
    expect(published.status).toBe(200);
    expect(published.json.version).toMatchObject({ status: 'published', publishedBy: org.office.id });
  });

  it('answers 409 to an edit of a published version, and changes nothing', async () => {
    const response = await callJson(office, `/api/office/template-versions/${v1}`, { method: 'PUT', body: { sections: [] } });
    expect(response.status).toBe(409);
    expect(response.json.error).toMatch(/Start a new draft/);
    const items = await testDb().select().from(s.templateItems).where(eq(s.templateItems.versionId, v1));
    expect(items).toHaveLength(2);
  });

  it('keeps a booked visit on its version when a new version is published', async () => {
    const { customer, vehicle } = await customerWithVehicle(org);
    const booked = await callJson(office, '/api/office/visits', {
      body: {
        customerId: customer.id,
        vehicleId: vehicle.id,
        technicianId: org.technician.id,
        templateId,
        roundDate: '2031-03-04',
        start: '09:00',
        end: '10:30',
        addressLines: '1 Test Lane',
        postcode: '',
        accessNotes: '',
      },
    });
    expect(booked.status).toBe(201);
    expect(booked.json.visit.templateVersionId).toBe(v1);

    const draft = await callJson(office, `/api/office/templates/${templateId}/draft`, { body: {} });
    expect(draft.status).toBe(201);
    const again = await callJson(office, `/api/office/templates/${templateId}/draft`, { body: {} });
    expect(again.status).toBe(200);
    expect(again.json.versionId).toBe(draft.json.versionId);
    const copied = await callJson(office, `/api/office/template-versions/${draft.json.versionId}`);
    expect(copied.json.version).toMatchObject({ version: 2, status: 'draft' });
    expect(copied.json.version.sections[0].items.map((i: { label: string }) => i.label)).toEqual(['Wipers and washers', 'Battery resting voltage']);

    const edited = structuredClone(content);
    edited.sections[0]!.items.push(item({ label: 'Horn' }));
    await callJson(office, `/api/office/template-versions/${draft.json.versionId}`, { method: 'PUT', body: edited });
    expect((await callJson(office, `/api/office/template-versions/${draft.json.versionId}/publish`, { body: {} })).status).toBe(200);

    const [visit] = await testDb().select().from(s.visits).where(eq(s.visits.id, booked.json.visit.id));
    expect(visit!.templateVersionId).toBe(v1);
    const detail = await callJson(office, `/api/office/templates/${templateId}`);
    expect(detail.json.versions.map((v: { version: number; status: string }) => [v.version, v.status])).toEqual([
      [2, 'published'],
      [1, 'retired'],
    ]);
    const next = await callJson(office, '/api/office/visits', {
      body: { ...booked.json.visit, templateId, start: '11:00', end: '12:00', postcode: '', accessNotes: '', addressLines: '1 Test Lane' },
    });
    expect(next.status).toBe(201);
    expect(next.json.visit.templateVersionId).toBe(draft.json.versionId);
  });

  it('discards a draft but never a published version', async () => {
    const draft = await callJson(office, `/api/office/templates/${templateId}/draft`, { body: {} });
    expect((await callJson(office, `/api/office/template-versions/${draft.json.versionId}`, { method: 'DELETE', body: {} })).status).toBe(200);
    expect((await callJson(office, `/api/office/template-versions/${v1}`, { method: 'DELETE', body: {} })).status).toBe(409);
  });
});
