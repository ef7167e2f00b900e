import { afterAll, describe, expect, it } from 'vitest';
import pg from 'pg';
import { drizzle } from 'drizzle-orm/node-postgres';
import * as schema from '../../../src/db/schema';
import { seedDemo } from '../../../src/db/seed/seed-demo';
import { migrate } from '../../../scripts/lib/migrate.mjs';
import { scratchDatabase, testPool } from '../../support/database';

afterAll(async () => {
  await testPool().end();
});

/** Every row of every table, as text, in a stable order. */
async function snapshot(client: pg.Client) {
  const { rows: tables } = await client.query<{ table_name: string }>(
    "select table_name from information_schema.tables where table_schema = 'public' and table_name not like '\\_\\_%' order by 1",
  );
  const result: Record<string, string[]> = {};
  for (const { table_name } of tables) {
    const { rows } = await client.query(`select t::text as row from "${table_name}" t order by 1`);
    result[table_name] = rows.map((r) => r.row as string);
  }
  return result;
}

describe('demo seed', () => {
  it('run twice gives the same data', async () => {
    const scratch = await scratchDatabase('seed');
    const pool = new pg.Pool({ connectionString: scratch.url, max: 2 });
    try {
      await migrate(process.env.TICKOVER_ROOT!, scratch.url);
      const db = drizzle(pool, { schema });
      const today = new Date('2026-12-01T10:00:00Z');
      await seedDemo(db, { today });
      const client = new pg.Client({ connectionString: scratch.url });
      await client.connect();
      const first = await snapshot(client);
      await seedDemo(db, { today });
      const second = await snapshot(client);
      // A later day must not lay the week out again: the same cars would be booked twice.
      await seedDemo(db, { today: new Date('2026-12-03T10:00:00Z') });
      const dayAfter = await snapshot(client);
      await client.end();

      expect(second).toEqual(first);
      expect(dayAfter).toEqual(first);
      expect(first.user).toHaveLength(4);
      expect(first.customers).toHaveLength(12);
      expect(first.vehicles!.length).toBeGreaterThanOrEqual(12);
      expect(first.checklist_templates).toHaveLength(2);
      expect(first.visits!.length).toBeGreaterThanOrEqual(10);
      expect(first.sign_offs!.length).toBeGreaterThan(0);
      // The reviewed visits are invoiced, the oldest one paid, so billing and the dashboard show money.
      expect(first.invoices).toHaveLength(2);
      expect(first.payments).toHaveLength(1);
      expect(first.document_counters).toHaveLength(1);
      // One note that arrived after the customer signed waits in the office's conflict list.
      expect(first.conflicts).toHaveLength(1);
      expect(first.conflicts![0]).toContain('visit_locked');
    } finally {
      await pool.end();
      await scratch.drop();
    }
  });
});
