// The pure parts of the security policy: what counts as TLS, which origins are ours, where
// sign-in may send someone next.
import { afterEach, describe, expect, it } from 'vitest';
import { crossSiteRefusal } from '../../../src/lib/server/origin-check';
import { contentSecurityPolicy, securityHeaders, servedOverTls } from '../../../src/lib/server/security-policy.mjs';
import { pathAfterSignIn } from '../../../src/lib/route-access';

const saved = { ...process.env };
afterEach(() => {
  for (const name of ['TRUST_PROXY', 'PUBLIC_BASE_URL', 'HOST', 'PORT', 'SERVER_CERT_PATH', 'SERVER_KEY_PATH']) {
    if (saved[name] === undefined) delete process.env[name];
    else process.env[name] = saved[name];
  }
});

describe('served over TLS', () => {
  it('when the server holds its own certificate', () => {
    expect(servedOverTls(undefined, { SERVER_CERT_PATH: '/c.pem', SERVER_KEY_PATH: '/k.pem' })).toBe(true);
  });
  it("when a proxy we trust says so in the last X-Forwarded-Proto, and only then", () => {
    expect(servedOverTls('https', { TRUST_PROXY: '1' })).toBe(true);
    expect(servedOverTls('http, https', { TRUST_PROXY: '1' })).toBe(true);
    expect(servedOverTls('https, http', { TRUST_PROXY: '1' })).toBe(false);
    expect(servedOverTls('https', {})).toBe(false);
    expect(servedOverTls(undefined, { TRUST_PROXY: '1' })).toBe(false);
  });
  it('decides HSTS', () => {
    expect(securityHeaders({ tls: true })['strict-transport-security']).toBe('max-age=31536000');
    expect(securityHeaders({ tls: false })).not.toHaveProperty('strict-transport-security');
  });
  it("keeps inline scripts out of a build's policy, and frame-ancestors out of a meta policy", () => {
    expect(contentSecurityPolicy()).not.toMatch(/script-src[^;]*'unsafe-inline'/);
    expect(contentSecurityPolicy()).toContain("frame-ancestors 'none'");
    expect(contentSecurityPolicy({ forMeta: true })).not.toContain('frame-ancestors');
  });
});

describe('a cross-site write', () => {
  const write = (headers: Record<string, string>, method = 'POST') => new Request('http://127.0.0.1:4321/api/office/customers', { method, headers });

  it('is refused when Origin is not ours, and allowed when it is', () => {
    process.env.PUBLIC_BASE_URL = 'https://servicing.example';
    delete process.env.TRUST_PROXY;
    expect(crossSiteRefusal(write({ host: '127.0.0.1:4321', origin: 'https://evil.example' }))).toMatch(/evil/);
    expect(crossSiteRefusal(write({ host: '127.0.0.1:4321', origin: 'null' }))).not.toBeNull();
    expect(crossSiteRefusal(write({ host: '127.0.0.1:4321', origin: 'http://127.0.0.1:4321' }))).toBeNull();
    expect(crossSiteRefusal(write({ host: 'internal:8080', origin: 'https://servicing.example' }))).toBeNull();
    expect(crossSiteRefusal(write({ host: 'internal:8080', origin: 'HTTPS://SERVICING.EXAMPLE' }))).toBeNull();
  });

  it("trusts X-Forwarded-Host and -Proto only from a proxy we trust", () => {
    delete process.env.PUBLIC_BASE_URL;
    delete process.env.TRUST_PROXY;
    const proxied = { host: 'internal:8080', 'x-forwarded-host': 'servicing.example', 'x-forwarded-proto': 'https', origin: 'https://servicing.example' };
    expect(crossSiteRefusal(write(proxied))).not.toBeNull();
    process.env.TRUST_PROXY = '1';
    expect(crossSiteRefusal(write(proxied))).toBeNull();
    expect(crossSiteRefusal(write({ ...proxied, origin: 'http://servicing.example' }))).not.toBeNull();
  });

  it('without Origin, goes by Sec-Fetch-Site; a program sending neither passes to the endpoint', () => {
    expect(crossSiteRefusal(write({ 'sec-fetch-site': 'cross-site' }))).not.toBeNull();
    expect(crossSiteRefusal(write({ 'sec-fetch-site': 'same-site' }))).not.toBeNull();
    expect(crossSiteRefusal(write({ 'sec-fetch-site': 'same-origin' }))).toBeNull();
    expect(crossSiteRefusal(write({}))).toBeNull();
  });

  it('never concerns a read', () => {
    expect(crossSiteRefusal(write({ origin: 'https://evil.example' }, 'GET'))).toBeNull();
  });
});

describe('after sign-in', () => {
  const origin = 'https://servicing.example';
  it("follows a path of this app's", () => {
    expect(pathAfterSignIn('/office/visits?status=booked#top', '/office', origin)).toBe('/office/visits?status=booked#top');
  });
  it.each(['//evil.example/x', '/\\evil.example', '/\\/evil.example', 'https://evil.example/', 'javascript:alert(1)', '', null])('goes home instead of %j', (next) => {
    expect(pathAfterSignIn(next, '/round', origin)).toBe('/round');
  });
});
