// Checklist templates and their versions. Content is edited only on a draft; publishing
// freezes the draft as the template's current version and retires the one before, and a visit
// keeps the version it was booked with (visits.template_version_id), so a published version
// never changes. The demo seed builds its checklists through these same functions.
import { and, asc, desc, eq, sql } from 'drizzle-orm';
import { getDb, type Executor } from '../../db/client';
import * as s from '../../db/schema';
import type {
  NewTemplateInput,
  TemplateContentInput,
  TemplateDetails,
  TemplateDetailsInput,
  TemplateItemInput,
} from '../office/template-input';
import { isUniqueViolation } from './db-errors';
import { HttpError } from './http';
import { withChangeFeedWrite } from './change-feed';

/** Content with optional fixed ids, so the seed can make the same rows on every run. */
export type VersionContent = {
  sections: { id?: string; title: string; items: (TemplateItemInput & { id?: string })[] }[];
};

const NAME_TAKEN = 'A checklist with that name already exists. Choose another name.';

export async function insertTemplate(
  tx: Executor,
  organisationId: string,
  details: TemplateDetails,
  ids: { templateId?: string; versionId?: string } = {},
) {
  try {
    const [template] = await tx
      .insert(s.checklistTemplates)
      .values({ id: ids.templateId, organisationId, ...details })
      .returning();
    const [version] = await tx
      .insert(s.templateVersions)
      .values({ id: ids.versionId, templateId: template!.id, organisationId, version: 1, status: 'draft' })
      .returning();
    return { template: template!, version: version! };
  } catch (error) {
    if (isUniqueViolation(error, 'checklist_templates_org_name_unique')) throw new HttpError(409, NAME_TAKEN, ['name: taken']);
    throw error;
  }
}

/** Replaces the sections and items of a draft version. */
export async function writeDraftContent(tx: Executor, organisationId: string, versionId: string, content: VersionContent) {
  await requireDraft(tx, organisationId, versionId);
  await tx.delete(s.templateSections).where(eq(s.templateSections.versionId, versionId));
  for (const [position, section] of content.sections.entries()) {
    const [row] = await tx
      .insert(s.templateSections)
      .values({ id: section.id, versionId, position, title: section.title })
      .returning({ id: s.templateSections.id });
    if (section.items.length === 0) continue;
    await tx.insert(s.templateItems).values(section.items.map((item, itemPosition) => ({ ...item, versionId, sectionId: row!.id, position: itemPosition })));
  }
}

/** Freezes a draft as the current version; the version it replaces is retired (visits keep it). */
export async function publishVersion(
  tx: Executor,
  organisationId: string,
  versionId: string,
  publishedBy: string,
  at: Date = new Date(),
) {
  const draft = await requireDraft(tx, organisationId, versionId);
  const sections = await tx
    .select({ title: s.templateSections.title, items: sql<number>`(select count(*)::int from ${s.templateItems} i where i.section_id = ${s.templateSections}.id)` })
    .from(s.templateSections)
    .where(eq(s.templateSections.versionId, versionId));
  if (sections.length === 0) throw new HttpError(422, 'An empty checklist cannot be published: add a section with at least one item.');
  const empty = sections.find((section) => section.items === 0);
  if (empty) throw new HttpError(422, `The section “${empty.title}” has no items: add one or remove the section before publishing.`);
  await tx
    .update(s.templateVersions)
    .set({ status: 'retired', changeSeq: s.nextChangeSeq })
    .where(and(eq(s.templateVersions.templateId, draft.templateId), eq(s.templateVersions.status, 'published')));
  const [published] = await tx
    .update(s.templateVersions)
    .set({ status: 'published', publishedAt: at, publishedBy, changeSeq: s.nextChangeSeq })
    .where(eq(s.templateVersions.id, versionId))
    .returning();
  await tx.update(s.checklistTemplates).set({ updatedAt: at }).where(eq(s.checklistTemplates.id, draft.templateId));
  return published!;
}

async function requireDraft(tx: Executor, organisationId: string, versionId: string) {
  const [version] = await tx
    .select()
    .from(s.templateVersions)
    .where(and(eq(s.templateVersions.id, versionId), eq(s.templateVersions.organisationId, organisationId)))
    .for('update');
  if (!version) throw new HttpError(404, 'No such checklist version in this business.');
  if (version.status !== 'draft') {
    throw new HttpError(409, `Version ${version.version} is ${version.status} and cannot change. Start a new draft to edit the checklist.`);
  }
  return version;
}

// ---- what the endpoints call ----

export async function listTemplates(organisationId: string) {
  const db = getDb();
  const templates = await db
    .select()
    .from(s.checklistTemplates)
    .where(eq(s.checklistTemplates.organisationId, organisationId))
    .orderBy(asc(s.checklistTemplates.name));
  const versions = await db
    .select({
      id: s.templateVersions.id,
      templateId: s.templateVersions.templateId,
      version: s.templateVersions.version,
      status: s.templateVersions.status,
      publishedAt: s.templateVersions.publishedAt,
    })
    .from(s.templateVersions)
    .where(eq(s.templateVersions.organisationId, organisationId))
    .orderBy(desc(s.templateVersions.version));
  return templates.map((template) => {
    const own = versions.filter((v) => v.templateId === template.id);
    return {
      ...template,
      current: own.find((v) => v.status === 'published') ?? null,
      draft: own.find((v) => v.status === 'draft') ?? null,
      versionCount: own.length,
    };
  });
}

export async function getTemplate(organisationId: string, templateId: string) {
  const db = getDb();
  const [template] = await db
    .select()
    .from(s.checklistTemplates)
    .where(and(eq(s.checklistTemplates.id, templateId), eq(s.checklistTemplates.organisationId, organisationId)));
  if (!template) throw new HttpError(404, 'No such checklist in this business.');
  const versions = await db
    .select({
      id: s.templateVersions.id,
      version: s.templateVersions.version,
      status: s.templateVersions.status,
      publishedAt: s.templateVersions.publishedAt,
      publishedBy: s.user.name,
      visitCount: sql<number>`(select count(*)::int from ${s.visits} where ${s.visits.templateVersionId} = ${s.templateVersions.id})`,
    })
    .from(s.templateVersions)
    .leftJoin(s.user, eq(s.user.id, s.templateVersions.publishedBy))
    .where(eq(s.templateVersions.templateId, template.id))
    .orderBy(desc(s.templateVersions.version));
  return { template, versions };
}

/** The sections and items of one version, in order. */
export async function getVersionContent(organisationId: string, versionId: string, db: Executor = getDb()) {
  const [version] = await db
    .select({
      id: s.templateVersions.id,
      templateId: s.templateVersions.templateId,
      version: s.templateVersions.version,
      status: s.templateVersions.status,
      publishedAt: s.templateVersions.publishedAt,
      name: s.checklistTemplates.name,
    })
    .from(s.templateVersions)
    .innerJoin(s.checklistTemplates, eq(s.checklistTemplates.id, s.templateVersions.templateId))
    .where(and(eq(s.templateVersions.id, versionId), eq(s.templateVersions.organisationId, organisationId)));
  if (!version) throw new HttpError(404, 'No such checklist version in this business.');
  const sections = await db
    .select()
    .from(s.templateSections)
    .where(eq(s.templateSections.versionId, versionId))
    .orderBy(asc(s.templateSections.position));
  const items = await db
    .select()
    .from(s.templateItems)
    .where(eq(s.templateItems.versionId, versionId))
    .orderBy(asc(s.templateItems.position));
  return {
    ...version,
    sections: sections.map((section) => ({
      id: section.id,
      title: section.title,
      items: items.filter((item) => item.sectionId === section.id),
    })),
  };
}

export async function createTemplate(organisationId: string, input: NewTemplateInput) {
  const { sections, name, description, labourHours } = input;
  return withChangeFeedWrite(organisationId, async (tx) => {
    const { template, version } = await insertTemplate(tx, organisationId, { name, description, labourCentiHours: labourHours });
    await writeDraftContent(tx, organisationId, version.id, { sections });
    return { templateId: template.id, draftVersionId: version.id };
  });
}

export async function updateTemplateDetails(organisationId: string, templateId: string, details: TemplateDetailsInput) {
  try {
    const [row] = await getDb()
      .update(s.checklistTemplates)
      .set({ name: details.name, description: details.description, labourCentiHours: details.labourHours, updatedAt: new Date() })
      .where(and(eq(s.checklistTemplates.id, templateId), eq(s.checklistTemplates.organisationId, organisationId)))
      .returning();
    if (!row) throw new HttpError(404, 'No such checklist in this business.');
    return row;
  } catch (error) {
    if (isUniqueViolation(error, 'checklist_templates_org_name_unique')) throw new HttpError(409, NAME_TAKEN, ['name: taken']);
    throw error;
  }
}

/** The template's draft: the open one, or a new one copied from the latest version. */
export async function startDraft(organisationId: string, templateId: string) {
  return withChangeFeedWrite(organisationId, async (tx) => {
    const [template] = await tx
      .select({ id: s.checklistTemplates.id })
      .from(s.checklistTemplates)
      .where(and(eq(s.checklistTemplates.id, templateId), eq(s.checklistTemplates.organisationId, organisationId)))
      .for('update');
    if (!template) throw new HttpError(404, 'No such checklist in this business.');
    const versions = await tx
      .select({ id: s.templateVersions.id, version: s.templateVersions.version, status: s.templateVersions.status })
      .from(s.templateVersions)
      .where(eq(s.templateVersions.templateId, templateId))
      .orderBy(desc(s.templateVersions.version));
    const open = versions.find((v) => v.status === 'draft');
    if (open) return { versionId: open.id, created: false };
    const latest = versions[0];
    const [draft] = await tx
      .insert(s.templateVersions)
      .values({ templateId, organisationId, version: (latest?.version ?? 0) + 1, status: 'draft' })
      .returning();
    if (latest) {
      const content = await getVersionContent(organisationId, latest.id, tx);
      await writeDraftContent(tx, organisationId, draft!.id, {
        sections: content.sections.map((section) => ({ title: section.title, items: section.items.map(itemInputOf) })),
      });
    }
    return { versionId: draft!.id, created: true };
  });
}

export async function saveDraft(organisationId: string, versionId: string, content: TemplateContentInput) {
  await withChangeFeedWrite(organisationId, (tx) => writeDraftContent(tx, organisationId, versionId, content));
  return getVersionContent(organisationId, versionId);
}

export async function publishDraft(organisationId: string, versionId: string, userId: string) {
  return withChangeFeedWrite(organisationId, (tx) => publishVersion(tx, organisationId, versionId, userId));
}

/** Throws away a draft. Visits are booked only on published versions, so nothing refers to it. */
export async function discardDraft(organisationId: string, versionId: string) {
  await withChangeFeedWrite(organisationId, async (tx) => {
    await requireDraft(tx, organisationId, versionId);
    await tx.delete(s.templateVersions).where(eq(s.templateVersions.id, versionId));
  });
}

/** The published version a new booking of `templateId` gets. */
export async function currentVersionId(tx: Executor, organisationId: string, templateId: string): Promise<string> {
  const [version] = await tx
    .select({ id: s.templateVersions.id })
    .from(s.templateVersions)
    .where(
      and(
        eq(s.templateVersions.templateId, templateId),
        eq(s.templateVersions.organisationId, organisationId),
        eq(s.templateVersions.status, 'published'),
      ),
    );
  if (!version) throw new HttpError(422, 'That checklist has no published version yet: publish it before booking visits with it.');
  return version.id;
}

function itemInputOf(item: typeof s.templateItems.$inferSelect): TemplateItemInput {
  return {
    kind: item.kind,
    label: item.label,
    unit: item.unit,
    expectedMin: item.expectedMin,
    expectedMax: item.expectedMax,
    rule: item.rule,
    partKind: item.partKind,
    caution: item.caution,
    hint: item.hint,
  };
}

