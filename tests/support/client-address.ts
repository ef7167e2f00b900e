// Each simulated client gets its own address (sent as X-Forwarded-For, which the test server
// trusts), so the sign-in rate limit of one test never trips another. IPv6 documentation
// prefix 2001:db8::/32; the limiter groups IPv6 by /64, so the randomness sits in the first 64 bits.
import { randomInt } from 'node:crypto';

export function newClientAddress(): string {
  const group = () => randomInt(0, 0xffff).toString(16);
  return `2001:db8:${group()}:${group()}::1`;
}
