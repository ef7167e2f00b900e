// better-auth: e-mail and password sign-in, sessions in PostgreSQL, roles on the user row.
// Public sign-up is off: the owner adds people to the business (see lib/server/users.ts).
import { betterAuth } from 'better-auth';
import { drizzleAdapter } from 'better-auth/adapters/drizzle';
import { getDb } from '../db/client';
import * as schema from '../db/schema';
import { appBaseUrl, authSecret, signInLimitPerMinute } from './server/config';

/** Header our auth endpoint sets from the socket address; incoming copies are stripped. */
export const CLIENT_IP_HEADER = 'x-tickover-client-ip';

function createAuth() {
  const baseURL = appBaseUrl();
  const alternate = baseURL.includes('127.0.0.1')
    ? baseURL.replace('127.0.0.1', 'localhost')
    : baseURL.replace('localhost', '127.0.0.1');
  return betterAuth({
    appName: 'Tickover',
    baseURL,
    secret: authSecret(),
    trustedOrigins: [baseURL, alternate],
    database: drizzleAdapter(getDb(), {
      provider: 'pg',
      schema: {
        user: schema.user,
        session: schema.session,
        account: schema.account,
        verification: schema.verification,
        rateLimit: schema.rateLimit,
      },
    }),
    emailAndPassword: {
      enabled: true,
      disableSignUp: true,
      minPasswordLength: 10,
    },
    session: {
      // A technician signs in once and then works offline for days; the device keeps its data
      // even if the session lapses, and sync asks for a fresh sign-in.
      expiresIn: 60 * 60 * 24 * 30,
      updateAge: 60 * 60 * 24,
    },
    user: {
      additionalFields: {
        role: { type: 'string', required: true, input: false },
        organisationId: { type: 'string', required: true, input: false },
      },
    },
    rateLimit: {
      enabled: true,
      // In PostgreSQL so the limit holds across several app servers behind a load balancer.
      storage: 'database',
      window: 60,
      max: 100,
      customRules: {
        '/sign-in/email': { window: 60, max: signInLimitPerMinute() },
      },
    },
    advanced: {
      ipAddress: { ipAddressHeaders: [CLIENT_IP_HEADER] },
      useSecureCookies: baseURL.startsWith('https://'),
      defaultCookieAttributes: { httpOnly: true, sameSite: 'lax' },
    },
    telemetry: { enabled: false },
  });
}

let instance: ReturnType<typeof createAuth> | undefined;

export function getAuth() {
  instance ??= createAuth();
  return instance;
}

export type SessionUser = {
  id: string;
  name: string;
  email: string;
  role: schema.UserRole;
  organisationId: string;
};

export async function readSession(headers: Headers): Promise<SessionUser | null> {
  const result = await getAuth().api.getSession({ headers });
  if (!result) return null;
  const u = result.user as typeof result.user & { role: string; organisationId: string };
  if (!isRole(u.role)) return null;
  return { id: u.id, name: u.name, email: u.email, role: u.role, organisationId: u.organisationId };
}

function isRole(value: string): value is schema.UserRole {
  return (schema.USER_ROLES as readonly string[]).includes(value);
}
