import { afterAll, describe, expect, it } from 'vitest';
import pg from 'pg';
import { migrate } from '../../../scripts/lib/migrate.mjs';
import { scratchDatabase, testPool } from '../../support/database';

afterAll(async () => {
  await testPool().end();
});

describe('migrations', () => {
  it('apply to an empty database, and again without change', async () => {
    const scratch = await scratchDatabase('migrate');
    try {
      await migrate(process.env.TICKOVER_ROOT!, scratch.url);
      await migrate(process.env.TICKOVER_ROOT!, scratch.url);
      const client = new pg.Client({ connectionString: scratch.url });
      await client.connect();
      const { rows } = await client.query<{ table_name: string }>(
        "select table_name from information_schema.tables where table_schema = 'public' order by 1",
      );
      await client.end();
      const tables = rows.map((r) => r.table_name);
      for (const table of ['user', 'session', 'organisations', 'visits', 'template_items', 'sync_operations', 'conflicts']) {
        expect(tables).toContain(table);
      }
    } finally {
      await scratch.drop();
    }
  });
});
