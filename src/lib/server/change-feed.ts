// The pull cursor is a change_seq value, and sequence values are handed out before the writing
// transaction commits. A pull that answered "up to 120" while a transaction holding 118 had not
// committed yet would skip row 118 for ever. So every transaction that writes rows a device
// pulls holds this organisation's change-feed lock in SHARED mode from before its first write
// to its commit, and a pull takes the same lock EXCLUSIVELY for an instant to read the sequence:
// at that instant no writer of that organisation is in flight, so every value up to what it
// reads belongs to a committed transaction or to another organisation. Writers do not exclude
// each other (pushes to different visits run side by side; the visit row lock orders pushes to
// one visit), and PostgreSQL queues a new writer behind a waiting pull, so pulls are not starved.
//
// Office writes (bookings, reassignments, customer and vehicle edits, template publishing) must
// use `withChangeFeedWrite` (or call `lockChangeFeed` first in their own transaction) and set
// `changeSeq: nextChangeSeq` on updates.
import { sql } from 'drizzle-orm';
import { getDb, type Database, type Executor, type Transaction } from '../../db/client';

// The first key of our two-key advisory locks; the second is a hash of the organisation id.
// A hash collision between two organisations only makes them wait for each other.
const CHANGE_FEED_LOCK_CLASS = 731_001;

/**
 * Joins the organisation's writers for the rest of the transaction; call before the first write.
 * `tx` must be inside a transaction (a drizzle transaction, or a client after `begin`): on the
 * pool the lock would end with the statement.
 */
export async function lockChangeFeed(tx: Executor, organisationId: string): Promise<void> {
  await tx.execute(sql`select pg_advisory_xact_lock_shared(${CHANGE_FEED_LOCK_CLASS}, hashtext(${organisationId}))`);
}

/** Runs `work` in a transaction that holds the organisation's change-feed lock. */
export function withChangeFeedWrite<T>(organisationId: string, work: (tx: Transaction) => Promise<T>, db: Database = getDb()): Promise<T> {
  return db.transaction(async (tx) => {
    await lockChangeFeed(tx, organisationId);
    return work(tx);
  });
}

/**
 * The highest change_seq a pull may promise for this organisation: every row of it at or below
 * this value is committed.
 */
export async function committedChangeSeq(organisationId: string, db: Executor = getDb()): Promise<number> {
  return db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(${CHANGE_FEED_LOCK_CLASS}, hashtext(${organisationId}))`);
    const result = await tx.execute<{ value: string }>(
      sql`select (case when is_called then last_value else last_value - 1 end)::text as value from change_seq`,
    );
    return Number(result.rows[0]!.value);
  });
}
