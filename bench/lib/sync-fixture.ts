// A business for the server benchmarks, written straight to the benchmark's own database: an
// organisation, technicians who can sign in, one customer and vehicle, a published checklist of
// check, reading and part items, and visits on today's round. Invented names only.
import { randomUUID } from 'node:crypto';
import { hashPassword } from 'better-auth/crypto';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import * as s from '../../src/db/schema';
import { TestDevice } from '../../tests/support/sync-ops';

export const BENCH_PASSWORD = 'bench-password-1';

type Db = NodePgDatabase<typeof s>;

export type BenchTechnician = { email: string; userId: string; device: TestDevice; address: string; cookie?: string };
export type BenchBusiness = {
  organisationId: string;
  versionId: string;
  customerId: string;
  vehicleId: string;
  checks: string[];
  readings: string[];
  parts: string[];
  technicians: BenchTechnician[];
};

let addresses = 0;
/** A client address per simulated phone (IPv6 documentation prefix), sent as X-Forwarded-For. */
function nextAddress() {
  addresses += 1;
  return `2001:db8:${(addresses >> 16).toString(16)}:${(addresses & 0xffff).toString(16)}::1`;
}

export async function benchBusiness(db: Db, options: { technicians: number; checks: number; readings: number; parts: number; label?: string }): Promise<BenchBusiness> {
  const organisationId = randomUUID();
  const tag = organisationId.slice(0, 8);
  await db.insert(s.organisations).values({ id: organisationId, name: `${options.label ?? 'Bench'} Servicing ${tag}`, slug: `bench-${tag}` });
  const hash = await hashPassword(BENCH_PASSWORD);
  const technicians: BenchTechnician[] = [];
  for (let i = 0; i < options.technicians; i++) {
    const userId = randomUUID();
    const email = `tech${i}.${tag}@bench.example`;
    await db.insert(s.user).values({ id: userId, name: `Bench Tech ${i}`, email, emailVerified: true, role: 'technician', organisationId });
    await db.insert(s.account).values({ id: randomUUID(), accountId: userId, providerId: 'credential', userId, password: hash });
    technicians.push({ email, userId, device: new TestDevice(`bench-${tag}-${i}`, Date.now() - 86_400_000), address: nextAddress() });
  }
  const customerId = randomUUID();
  const vehicleId = randomUUID();
  await db.insert(s.customers).values({ id: customerId, organisationId, name: 'Bench Customer' });
  await db.insert(s.vehicles).values({ id: vehicleId, organisationId, customerId, registration: 'BENCH1', make: 'Corvane', model: 'Estrel', fuel: 'petrol' });
  const templateId = randomUUID();
  const versionId = randomUUID();
  const sectionId = randomUUID();
  await db.insert(s.checklistTemplates).values({ id: templateId, organisationId, name: 'Bench service' });
  await db.insert(s.templateVersions).values({ id: versionId, templateId, organisationId, version: 1, status: 'published', publishedAt: new Date() });
  await db.insert(s.templateSections).values({ id: sectionId, versionId, position: 0, title: 'All' });
  const business: BenchBusiness = { organisationId, versionId, customerId, vehicleId, checks: [], readings: [], parts: [], technicians };
  const kinds = [...Array(options.checks).fill('check'), ...Array(options.readings).fill('reading'), ...Array(options.parts).fill('part')] as s.ItemKind[];
  const items = kinds.map((kind, position) => ({ id: randomUUID(), versionId, sectionId, position, kind, label: `${kind} ${position}`, unit: kind === 'check' ? null : 'mm' }));
  await db.insert(s.templateItems).values(items);
  for (const item of items) business[item.kind === 'check' ? 'checks' : item.kind === 'reading' ? 'readings' : 'parts'].push(item.id);
  return business;
}

/** A visit on today's round for `technicianId`. */
export async function benchVisit(db: Db, business: BenchBusiness, technicianId: string, position = 0): Promise<string> {
  const id = randomUUID();
  const start = new Date();
  await db.insert(s.visits).values({
    id,
    organisationId: business.organisationId,
    customerId: business.customerId,
    vehicleId: business.vehicleId,
    technicianId,
    templateVersionId: business.versionId,
    roundDate: start.toISOString().slice(0, 10),
    roundPosition: position,
    slotStart: start,
    slotEnd: new Date(start.getTime() + 3_600_000),
    addressLines: '1 Bench Row',
  });
  return id;
}

/** Signs the technician in over HTTP and keeps the session cookie on them. */
export async function benchSignIn(base: string, t: BenchTechnician): Promise<void> {
  const response = await fetch(`${base}/api/auth/sign-in/email`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: base, 'x-forwarded-for': t.address },
    body: JSON.stringify({ email: t.email, password: BENCH_PASSWORD }),
  });
  if (!response.ok) throw new Error(`sign-in of ${t.email} failed: ${response.status} ${await response.text()}`);
  t.cookie = response.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
}

export const percentile = (values: number[], p: number) => {
  if (values.length === 0) return NaN;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))]!;
};
