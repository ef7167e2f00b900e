// Server configuration from the environment, with the defaults `npm start` relies on.
// Every variable is listed in README.md under Configuration.

export function appBaseUrl(): string {
  if (process.env.PUBLIC_BASE_URL) return process.env.PUBLIC_BASE_URL.replace(/\/$/, '');
  const host = process.env.HOST ?? '127.0.0.1';
  const port = process.env.PORT ?? '4321';
  return `http://${host}:${port}`;
}

export function authSecret(): string {
  const secret = process.env.BETTER_AUTH_SECRET;
  if (!secret || secret.length < 32) {
    throw new Error('BETTER_AUTH_SECRET must be set to at least 32 random characters (npm start makes one).');
  }
  return secret;
}

/** Sign-in attempts allowed per client address per minute. */
export function signInLimitPerMinute(): number {
  return Number(process.env.AUTH_SIGN_IN_LIMIT_PER_MINUTE ?? 10);
}

/**
 * Behind a load balancer the socket address is the balancer's; only then is the last
 * X-Forwarded-For hop (the one our own balancer appended) the client's address.
 */
export function trustProxy(): boolean {
  return process.env.TRUST_PROXY === '1';
}
