// The accounts `npm start` prints must be the ones the seed creates.
import { describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD as PRINTED_PASSWORD } from '../../scripts/lib/demo-accounts.mjs';
import { DEMO_PASSWORD, PEOPLE } from '../../src/db/seed/scenario';

describe('demo accounts', () => {
  it('match the seeded people', () => {
    expect(DEMO_ACCOUNTS.map((a) => [a.email, a.role, a.name])).toEqual(PEOPLE.map((p) => [p.email, p.role, p.name]));
    expect(PRINTED_PASSWORD).toBe(DEMO_PASSWORD);
  });
});
