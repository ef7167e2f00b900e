// A backup taken with `npm run db:backup` restores into an empty database with every visit.
import { afterAll, describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pg from 'pg';
import { backupDatabase, restoreDatabase } from '../../../scripts/lib/backup.mjs';
import { scratchDatabase, testPool } from '../../support/database';

afterAll(async () => {
  await testPool().end();
});

async function visitIds(url: string) {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  const { rows } = await client.query<{ id: string }>('select id from visits order by id');
  await client.end();
  return rows.map((r) => r.id);
}

describe('backup and restore', () => {
  it('restores a dump of the test database into an empty one, visit for visit', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'tickover-backup-'));
    const scratch = await scratchDatabase('restore');
    try {
      // Other test files add visits while this runs: read before and after the dump, and the
      // restored set must lie between the two.
      const before = await visitIds(process.env.DATABASE_URL!);
      const file = backupDatabase(process.env.DATABASE_URL!, join(dir, 'test.dump'));
      const afterDump = await visitIds(process.env.DATABASE_URL!);
      expect(before.length).toBeGreaterThan(0);
      restoreDatabase(scratch.url, file);
      const restored = await visitIds(scratch.url);
      for (const id of before) expect(restored).toContain(id);
      for (const id of restored) expect(afterDump).toContain(id);
    } finally {
      await scratch.drop();
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('refuses a missing backup file with a clear message', async () => {
    const scratch = await scratchDatabase('restore_missing');
    try {
      expect(() => restoreDatabase(scratch.url, '/nonexistent/backup.dump')).toThrow(/no backup file/);
    } finally {
      await scratch.drop();
    }
  });
});
