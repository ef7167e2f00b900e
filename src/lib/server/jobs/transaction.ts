// A database transaction that can also enqueue jobs: the jobs are written by pg-boss on the same
// connection, so they commit (or roll back) together with the business rows that need them.
// That is the difference between "the invoice is sent and its e-mail will go" and "maybe".
import { drizzle } from 'drizzle-orm/node-postgres';
import type PgBoss from 'pg-boss';
import { getPool, type Database } from '../../../db/client';
import * as schema from '../../../db/schema';
import { getBoss } from './boss';

export type Enqueue = (name: string, data: object, options?: PgBoss.SendOptions) => void;

export async function transactionWithJobs<T>(work: (db: Database, enqueue: Enqueue) => Promise<T>): Promise<T> {
  const boss = await getBoss();
  const client = await getPool().connect();
  const jobs: { name: string; data: object; options: PgBoss.SendOptions }[] = [];
  try {
    await client.query('begin');
    const db = drizzle(client, { schema }) as unknown as Database;
    const result = await work(db, (name, data, options = {}) => jobs.push({ name, data, options }));
    const onThisConnection = { executeSql: (text: string, values: unknown[]) => client.query(text, values) };
    for (const job of jobs) await boss.send(job.name, job.data, { ...job.options, db: onThisConnection });
    await client.query('commit');
    return result;
  } catch (error) {
    await client.query('rollback').catch(() => undefined);
    throw error;
  } finally {
    client.release();
  }
}
