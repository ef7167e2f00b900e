// The pull cursor. Every row a device may need carries `change_seq`, bumped from this one
// sequence on each insert and update, so "what changed since cursor N" is an index range scan
// and the cursor is a server-issued number, never a device's wall clock.
import { sql } from 'drizzle-orm';
import { bigint, pgSequence } from 'drizzle-orm/pg-core';

export const changeSeq = pgSequence('change_seq', { startWith: 1, increment: 1 });

export const changeSeqColumn = () =>
  bigint('change_seq', { mode: 'number' })
    .notNull()
    .default(sql`nextval('change_seq')`);

/** Use in `.set({...})` of an update so the row shows up in the next pull. */
export const nextChangeSeq = sql`nextval('change_seq')`;
