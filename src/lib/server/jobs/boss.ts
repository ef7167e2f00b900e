// pg-boss keeps its jobs in PostgreSQL (schema `pgboss`), so a job is as durable as the row that
// caused it, and it can be sent inside the same transaction (see transaction.ts).
import PgBoss from 'pg-boss';
import { databaseUrl } from '../../../db/client';
import { queueDefinitions } from './queues';

let starting: Promise<PgBoss> | undefined;

async function ensureQueues(boss: PgBoss) {
  for (const queue of queueDefinitions()) {
    const existing = await boss.getQueue(queue.name);
    if (existing) await boss.updateQueue(queue.name, queue);
    else await boss.createQueue(queue.name, queue);
  }
}

/**
 * The process's pg-boss. In the web server it only sends (no maintenance, no cron);
 * the worker (jobs/worker.ts) starts its own with `role: 'worker'`.
 */
export function getBoss(role: 'producer' | 'worker' = 'producer'): Promise<PgBoss> {
  starting ??= (async () => {
    const boss = new PgBoss({
      connectionString: databaseUrl(),
      application_name: `tickover-${role}`,
      max: role === 'worker' ? 4 : 2,
      supervise: role === 'worker',
      schedule: role === 'worker',
    });
    boss.on('error', (error) => console.error('[jobs]', error));
    await boss.start();
    await ensureQueues(boss);
    return boss;
  })();
  starting.catch(() => (starting = undefined));
  return starting;
}

export async function stopBoss() {
  const boss = await starting;
  starting = undefined;
  await boss?.stop({ graceful: true, timeout: 10_000 });
}
