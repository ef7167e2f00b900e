// Reads a visit's records from PostgreSQL as the same picture the model of the rules draws
// (src/lib/sync/fuzz/model.ts), so the database can be compared with the model.
import { eq } from 'drizzle-orm';
import * as s from '../../src/db/schema';
import type { VisitPicture } from '../../src/lib/sync/fuzz/model';
import { testDb } from './database';

export async function pictureFromDatabase(visitId: string, db = testDb()): Promise<VisitPicture> {
  const picture: VisitPicture = { checks: {}, readings: {}, findings: {}, notes: {}, photos: {}, partLines: {} };
  for (const c of await db.select().from(s.checkResults).where(eq(s.checkResults.visitId, visitId))) picture.checks[c.itemId] = c.state;
  for (const r of await db.select().from(s.readingResults).where(eq(s.readingResults.visitId, visitId))) {
    picture.readings[r.itemId] = `${r.value ?? r.textValue} ${r.unit ?? ''}`;
  }
  for (const f of await db.select().from(s.findings).where(eq(s.findings.visitId, visitId))) {
    picture.findings[f.id] = { title: f.title, detail: f.detail, itemId: f.itemId, severity: f.severity };
  }
  for (const n of await db.select().from(s.visitNotes).where(eq(s.visitNotes.visitId, visitId))) picture.notes[n.id] = n.body;
  for (const p of await db.select().from(s.photos).where(eq(s.photos.visitId, visitId))) {
    picture.photos[p.id] = { caption: p.caption, removed: p.removedStamp !== null };
  }
  for (const l of await db.select().from(s.partLines).where(eq(s.partLines.visitId, visitId))) {
    picture.partLines[l.id] = { partNumber: l.partNumber, quantity: l.quantity, removed: l.removed };
  }
  return picture;
}
