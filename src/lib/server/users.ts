// The owner's screen of people: who works for the business and in which role. Public sign-up is
// off (lib/auth.ts), so this is the only way in.
import { randomUUID } from 'node:crypto';
import { hashPassword } from 'better-auth/crypto';
import { and, asc, count, eq } from 'drizzle-orm';
import { getDb } from '../../db/client';
import * as s from '../../db/schema';
import type { NewPersonInput } from '../office/people-input';
import { isUniqueViolation } from './db-errors';
import { HttpError } from './http';

export async function listPeople(organisationId: string) {
  return getDb()
    .select({ id: s.user.id, name: s.user.name, email: s.user.email, role: s.user.role, createdAt: s.user.createdAt })
    .from(s.user)
    .where(eq(s.user.organisationId, organisationId))
    .orderBy(asc(s.user.name));
}

export async function addPerson(organisationId: string, input: NewPersonInput) {
  const id = randomUUID();
  const password = await hashPassword(input.password);
  try {
    return await getDb().transaction(async (tx) => {
      const [person] = await tx
        .insert(s.user)
        .values({ id, name: input.name, email: input.email, emailVerified: true, role: input.role, organisationId })
        .returning({ id: s.user.id, name: s.user.name, email: s.user.email, role: s.user.role });
      await tx.insert(s.account).values({ id: randomUUID(), accountId: id, providerId: 'credential', userId: id, password });
      return person!;
    });
  } catch (error) {
    // E-mail addresses are unique across every business: say so without saying whose it is.
    if (isUniqueViolation(error)) throw new HttpError(409, 'That e-mail address already has an account. Use another address.', ['email: taken']);
    throw error;
  }
}

/** Changes a person's role; a business always keeps at least one owner. */
export async function changeRole(organisationId: string, personId: string, role: s.UserRole) {
  return getDb().transaction(async (tx) => {
    const [person] = await tx
      .select({ id: s.user.id, role: s.user.role })
      .from(s.user)
      .where(and(eq(s.user.id, personId), eq(s.user.organisationId, organisationId)))
      .for('update');
    if (!person) throw new HttpError(404, 'No such person in this business.');
    if (person.role === 'owner' && role !== 'owner') {
      const [owners] = await tx
        .select({ n: count() })
        .from(s.user)
        .where(and(eq(s.user.organisationId, organisationId), eq(s.user.role, 'owner')));
      if ((owners?.n ?? 0) <= 1) throw new HttpError(409, 'The business needs at least one owner: make someone else owner first.');
    }
    const [row] = await tx
      .update(s.user)
      .set({ role, updatedAt: new Date() })
      .where(eq(s.user.id, personId))
      .returning({ id: s.user.id, name: s.user.name, email: s.user.email, role: s.user.role });
    return row!;
  });
}
