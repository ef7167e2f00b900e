// Model notes: the known weak spots of a make and model, shown on every matching visit.
import { and, asc, count, eq, ilike, or, sql } from 'drizzle-orm';
import { getDb } from '../../db/client';
import * as s from '../../db/schema';
import type { ModelNoteInput } from '../office/model-note-input';
import type { TablePage, TableQuery } from '../office/table-query';
import { HttpError } from './http';
import { withChangeFeedWrite } from './change-feed';
import { containsPattern, pageWindow } from './table-sql';

export type ModelNoteRow = typeof s.modelNotes.$inferSelect;

export async function listModelNotes(organisationId: string, query: TableQuery): Promise<TablePage<ModelNoteRow>> {
  const db = getDb();
  const pattern = query.q ? containsPattern(query.q) : undefined;
  const where = and(
    eq(s.modelNotes.organisationId, organisationId),
    pattern
      ? or(
          ilike(s.modelNotes.make, pattern),
          ilike(s.modelNotes.model, pattern),
          ilike(s.modelNotes.engine, pattern),
          ilike(s.modelNotes.title, pattern),
        )
      : undefined,
  );
  const { limit, offset } = pageWindow(query);
  const [rows, [total]] = await Promise.all([
    db
      .select()
      .from(s.modelNotes)
      .where(where)
      .orderBy(asc(s.modelNotes.make), asc(s.modelNotes.model), asc(s.modelNotes.engine), asc(s.modelNotes.title))
      .limit(limit)
      .offset(offset),
    db.select({ n: count() }).from(s.modelNotes).where(where),
  ]);
  return { rows, total: total?.n ?? 0, page: query.page, pageSize: query.pageSize };
}

/** The notes for a vehicle: same make and model, and its engine or every engine. */
export async function matchingModelNotes(organisationId: string, vehicle: { make: string; model: string; engine: string }) {
  return getDb()
    .select({ id: s.modelNotes.id, make: s.modelNotes.make, model: s.modelNotes.model, engine: s.modelNotes.engine, title: s.modelNotes.title, body: s.modelNotes.body })
    .from(s.modelNotes)
    .where(
      and(
        eq(s.modelNotes.organisationId, organisationId),
        sql`lower(${s.modelNotes.make}) = lower(${vehicle.make})`,
        sql`lower(${s.modelNotes.model}) = lower(${vehicle.model})`,
        or(eq(s.modelNotes.engine, ''), sql`lower(${s.modelNotes.engine}) = lower(${vehicle.engine})`),
      ),
    )
    .orderBy(asc(s.modelNotes.title));
}

export async function createModelNote(organisationId: string, input: ModelNoteInput) {
  return withChangeFeedWrite(organisationId, async (tx) => {
    const [row] = await tx.insert(s.modelNotes).values({ organisationId, ...input }).returning();
    return row!;
  });
}

export async function updateModelNote(organisationId: string, noteId: string, input: ModelNoteInput) {
  return withChangeFeedWrite(organisationId, async (tx) => {
    const [row] = await tx
      .update(s.modelNotes)
      .set({ ...input, updatedAt: new Date(), changeSeq: s.nextChangeSeq })
      .where(and(eq(s.modelNotes.id, noteId), eq(s.modelNotes.organisationId, organisationId)))
      .returning();
    if (!row) throw new HttpError(404, 'No such model note in this business.');
    return row;
  });
}
