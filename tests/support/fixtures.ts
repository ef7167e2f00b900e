// A fresh organisation with one person of each role, for tests that must not share data.
import { randomUUID } from 'node:crypto';
import { hashPassword } from 'better-auth/crypto';
import * as s from '../../src/db/schema';
import { testDb } from './database';

export const FIXTURE_PASSWORD = 'fixture-password-1';

let passwordHash: Promise<string> | undefined;

export type Person = { id: string; email: string; name: string; role: s.UserRole };
export type OrganisationFixture = {
  organisationId: string;
  owner: Person;
  office: Person;
  technician: Person;
  otherTechnician: Person;
};

export async function createOrganisation(label = 'Test', db = testDb()): Promise<OrganisationFixture> {
  const organisationId = randomUUID();
  const tag = organisationId.slice(0, 8);
  await db.insert(s.organisations).values({ id: organisationId, name: `${label} Servicing ${tag}`, slug: `test-${tag}` });
  passwordHash ??= hashPassword(FIXTURE_PASSWORD);
  const hash = await passwordHash;
  const person = async (role: s.UserRole, name: string): Promise<Person> => {
    const id = randomUUID();
    const email = `${name.toLowerCase().replace(/\s+/g, '.')}.${tag}@test.example`;
    await db.insert(s.user).values({ id, name, email, emailVerified: true, role, organisationId });
    await db.insert(s.account).values({ id: randomUUID(), accountId: id, providerId: 'credential', userId: id, password: hash });
    return { id, email, name, role };
  };
  return {
    organisationId,
    owner: await person('owner', 'Olive Owner'),
    office: await person('office', 'Oscar Office'),
    technician: await person('technician', 'Tara Tech'),
    otherTechnician: await person('technician', 'Theo Tech'),
  };
}
