// The people of one business.
import { asc, eq } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { user } from '../../db/schema';

export async function listTeam(organisationId: string) {
  return getDb()
    .select({ id: user.id, name: user.name, email: user.email, role: user.role })
    .from(user)
    .where(eq(user.organisationId, organisationId))
    .orderBy(asc(user.role), asc(user.name));
}
