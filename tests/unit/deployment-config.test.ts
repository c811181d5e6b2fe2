// TRUST_PROXY parsing and local demo mode (README "Running Timefield for others"; the rules are ours).
import { describe, expect, it } from 'vitest';
import { isLocalDemoMode, parseTrustProxy } from '../../server/config';

describe('TRUST_PROXY', () => {
  it('is off when unset or 0, a hop count for a whole number, an address list otherwise', () => {
    expect(parseTrustProxy(undefined)).toBe(false);
    expect(parseTrustProxy('0')).toBe(false);
    expect(parseTrustProxy('1')).toBe(1);
    expect(parseTrustProxy('loopback, 10.0.0.0/8')).toBe('loopback, 10.0.0.0/8');
  });
});

describe('local demo mode', () => {
  it('is loopback without a proxy, or TF_DEMO=1 said explicitly', () => {
    expect(isLocalDemoMode({})).toBe(true);
    expect(isLocalDemoMode({ HOST: '::1' })).toBe(true);
    expect(isLocalDemoMode({ HOST: '0.0.0.0' })).toBe(false);
    expect(isLocalDemoMode({ HOST: '127.0.0.1', TRUST_PROXY: '1' })).toBe(false);
    expect(isLocalDemoMode({ HOST: '0.0.0.0', TF_DEMO: '1' })).toBe(true);
    expect(isLocalDemoMode({ TF_DEMO: '0' })).toBe(false);
  });
});
