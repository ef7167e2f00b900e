// Writes to rows the phone pulls. The pull cursor is a sequence number, so a reader must never
// see a row with a higher change_seq committed before one with a lower: writers of one
// organisation's synced rows take the same transaction-scoped lock, which makes commit order
// follow sequence order within the organisation.
import { sql } from 'drizzle-orm';
import { getDb, type Transaction } from '../../db/client';

export async function writeSynced<T>(organisationId: string, work: (tx: Transaction) => Promise<T>): Promise<T> {
  return getDb().transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`change-feed:${organisationId}`}))`);
    return work(tx);
  });
}
