import { describe, expect, it } from 'vitest';
import { homeFor, pageAccess } from '../../src/lib/route-access';

describe('page access', () => {
  it('keeps sign-in, the customer record link and static assets public', () => {
    for (const path of ['/sign-in', '/record/abc', '/_astro/x.js', '/favicon.svg', '/manifest.webmanifest']) {
      expect(pageAccess(path)).toEqual({ kind: 'public' });
    }
  });

  it('lets better-auth and health checks through without a session', () => {
    expect(pageAccess('/api/auth/sign-in/email')).toEqual({ kind: 'api-public' });
    expect(pageAccess('/api/health')).toEqual({ kind: 'api-public' });
  });

  it('treats every other API route as needing a session', () => {
    expect(pageAccess('/api/office/team')).toEqual({ kind: 'api' });
    expect(pageAccess('/api/sync/push')).toEqual({ kind: 'api' });
  });

  it('gives the office console to office and owner only', () => {
    expect(pageAccess('/office')).toEqual({ kind: 'roles', roles: ['office', 'owner'] });
    expect(pageAccess('/office/visits/123')).toEqual({ kind: 'roles', roles: ['office', 'owner'] });
  });

  it('keeps people and business settings to the owner', () => {
    expect(pageAccess('/office/people')).toEqual({ kind: 'roles', roles: ['owner'] });
    expect(pageAccess('/office/settings')).toEqual({ kind: 'roles', roles: ['owner'] });
    expect(pageAccess('/office/peoplehood')).toEqual({ kind: 'roles', roles: ['office', 'owner'] });
  });

  it('gives the round to technicians', () => {
    expect(pageAccess('/round')).toEqual({ kind: 'roles', roles: ['technician'] });
  });

  it('does not mistake a look-alike path for the office', () => {
    expect(pageAccess('/officers')).toEqual({ kind: 'roles', roles: ['technician'] });
  });

  it('sends each role to its own start page', () => {
    expect(homeFor('technician')).toBe('/round');
    expect(homeFor('office')).toBe('/office');
    expect(homeFor('owner')).toBe('/office');
  });
});
