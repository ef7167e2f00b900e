// Allocates the next invoice or credit note number of an organisation. Call it inside the
// transaction that issues the document: the counter row stays locked until that transaction ends,
// so concurrent issues queue up, and a rollback gives the number back. No gaps, no duplicates.
import { sql } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import type { DocumentSeries } from '../../db/schema';

export async function allocateDocumentNumber(db: Executor, organisationId: string, series: DocumentSeries): Promise<number> {
  const result = await db.execute<{ last_number: number }>(sql`
    insert into document_counters (organisation_id, series, last_number) values (${organisationId}, ${series}, 1)
    on conflict (organisation_id, series) do update set last_number = document_counters.last_number + 1
    returning last_number`);
  return Number(result.rows[0]!.last_number);
}
