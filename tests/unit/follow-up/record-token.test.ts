import { describe, expect, it } from 'vitest';
import { signRecordToken, verifyRecordToken } from '../../../src/lib/server/record-links';

const secret = 'a-test-secret-that-is-long-enough-123456';
const linkId = '0b9c2f8e-1d2a-4c3b-9e8f-7a6b5c4d3e2f';
const expires = new Date('2030-01-01T00:00:00Z');
const now = new Date('2029-12-01T00:00:00Z');

describe('record link tokens', () => {
  it('verify with the same secret before expiry', () => {
    const token = signRecordToken(linkId, expires, secret);
    expect(verifyRecordToken(token, now, secret)).toEqual({ linkId, expiresAt: expires });
  });

  it('fail with another secret, after expiry, or when any part is changed', () => {
    const token = signRecordToken(linkId, expires, secret);
    expect(verifyRecordToken(token, now, `${secret}x`)).toHaveProperty('error');
    expect(verifyRecordToken(token, new Date('2030-01-01T00:00:01Z'), secret)).toMatchObject({ error: expect.stringMatching(/expired/) });
    const [id, expiry, sig] = token.split('.');
    const later = (parseInt(expiry!, 36) + 1).toString(36);
    expect(verifyRecordToken(`${id}.${later}.${sig}`, now, secret)).toHaveProperty('error');
    const otherId = id!.replace(/^0/, '1');
    expect(verifyRecordToken(`${otherId}.${expiry}.${sig}`, now, secret)).toHaveProperty('error');
    expect(verifyRecordToken('not-a-token', now, secret)).toHaveProperty('error');
  });
});
