// Adds thousands of invented visits to one organisation, to try the office tables at scale:
//   npx tsx scripts/bulk-visits.ts --org fenwright --count 5000
// It writes to DATABASE_URL, or else to the project's own database (the one `npm start` serves):
// not for a live business.
import { parseArgs } from 'node:util';
import { eq } from 'drizzle-orm';
import { closeDb, getDb } from '../src/db/client';
import * as s from '../src/db/schema';
import { createBulkVisits } from '../src/db/seed/bulk-visits';
import { localToday } from '../src/lib/office/local-time';
import { setup } from './setup.mjs';

if (!process.env.DATABASE_URL) process.env.DATABASE_URL = (await setup({ install: false })).databaseUrl;
const { values } = parseArgs({ options: { org: { type: 'string', default: 'fenwright' }, count: { type: 'string', default: '5000' } } });
const db = getDb();
const [org] = await db.select().from(s.organisations).where(eq(s.organisations.slug, values.org!));
if (!org) throw new Error(`No organisation with the slug "${values.org}"`);
const made = await db.transaction((tx) => createBulkVisits(tx, org.id, { count: Number(values.count), until: localToday(org.timeZone) }));
console.log(`[tickover] ${org.name}: added`, made);
await closeDb();
