import { describe, expect, it } from 'vitest';
import {
  can,
  CAPABILITIES,
  describeCapability,
  PROJECT_ROLES,
  type Capability,
} from '@/lib/auth/permissions';
import { ConfigurationError, DEV_SECRET, readEnv } from '@/lib/env';

// The role matrix follows the product design (DESIGN.md §1): engineers write the schedule and
// run audits, technicians record markups, reviewers decide findings, viewers only read.
describe('capabilities per project role', () => {
  const expected: Record<Capability, string[]> = {
    'project:read': ['engineer', 'technician', 'reviewer', 'viewer'],
    'schedule:read': ['engineer', 'technician', 'reviewer', 'viewer'],
    'schedule:write': ['engineer'],
    'settings:write': ['engineer'],
    'audit:read': ['engineer', 'technician', 'reviewer', 'viewer'],
    'audit:run': ['engineer'],
    'markup:create': ['technician', 'engineer'],
    'markup:decide': ['engineer'],
    'review:decide': ['reviewer'],
    'handover:read': ['engineer', 'technician', 'reviewer', 'viewer'],
    'members:manage': [],
  };

  for (const capability of Object.keys(CAPABILITIES) as Capability[]) {
    for (const role of PROJECT_ROLES) {
      const allowed = expected[capability].includes(role);
      it(`${role} ${allowed ? 'may' : 'may not'} ${capability}`, () => {
        expect(can({ role, isAdmin: false }, capability)).toBe(allowed);
      });
    }
  }

  it('a non-member who is not an admin may do nothing', () => {
    for (const capability of Object.keys(CAPABILITIES) as Capability[]) {
      expect(can({ role: null, isAdmin: false }, capability)).toBe(false);
    }
  });

  it('an admin may do everything but decide review findings, which stay with a named reviewer', () => {
    expect(can({ role: null, isAdmin: true }, 'schedule:write')).toBe(true);
    expect(can({ role: null, isAdmin: true }, 'members:manage')).toBe(true);
    expect(can({ role: null, isAdmin: true }, 'review:decide')).toBe(false);
  });

  it('refusals name the roles that may', () => {
    expect(describeCapability('schedule:write')).toBe(
      'Only a project engineer or an administrator may do this.',
    );
    expect(describeCapability('markup:create')).toBe(
      'Only a project technician or engineer or an administrator may do this.',
    );
  });
});

describe('environment', () => {
  it('refuses to run in production without a real session secret', () => {
    expect(() => readEnv({ NODE_ENV: 'production' })).toThrow(ConfigurationError);
    expect(() => readEnv({ NODE_ENV: 'production', NEXTAUTH_SECRET: DEV_SECRET })).toThrow(
      /NEXTAUTH_SECRET/,
    );
    expect(() => readEnv({ NODE_ENV: 'production', NEXTAUTH_SECRET: 'short' })).toThrow(
      /32 characters/,
    );
    expect(
      readEnv({ NODE_ENV: 'production', NEXTAUTH_SECRET: 'x'.repeat(32) }).NEXTAUTH_SECRET,
    ).toBe('x'.repeat(32));
  });

  it('falls back to the development secret outside production', () => {
    expect(readEnv({ NODE_ENV: 'development' }).NEXTAUTH_SECRET).toBe(DEV_SECRET);
  });

  it('names the bad variable', () => {
    expect(() => readEnv({ SMTP_PORT: 'abc' })).toThrow(/SMTP_PORT/);
  });
});

describe('environment during a production build', () => {
  it('does not demand the secret while next build collects pages, only when serving', () => {
    expect(() =>
      readEnv({ NODE_ENV: 'production', NEXT_PHASE: 'phase-production-build' }),
    ).not.toThrow();
    expect(() =>
      readEnv({ NODE_ENV: 'production', NEXT_PHASE: 'phase-production-server' }),
    ).toThrow(/NEXTAUTH_SECRET/);
  });
});
