// Seeds the demo business into DATABASE_URL. Safe to run again: it adds nothing twice.
import { closeDb, getDb } from '../src/db/client';
import { seedDemo } from '../src/db/seed/seed-demo';

await seedDemo(getDb());
await closeDb();
console.log('[tickover] demo data seeded');
