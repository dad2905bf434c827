import { describe, expect, it } from 'vitest';
import { billingState, GRACE_PERIOD_MS, localStatus } from './billing-state.js';
import { payClientOptions } from './pay-client.js';

const pay = { apiKey: 'sk_test_warpmeter_local', host: '127.0.0.1', port: 3027, protocol: 'http' as const, webhookSecret: 'whsec_x' };

describe('payment client options', () => {
  it('points the local placeholder key at the local provider, without retries', () => {
    expect(payClientOptions(pay, {})).toMatchObject({ host: '127.0.0.1', port: 3027, protocol: 'http', maxNetworkRetries: 0 });
  });

  it('leaves real credentials on the SDK defaults unless a host is set explicitly', () => {
    const real = { ...pay, apiKey: 'sk_live_51Abc' };
    const opts = payClientOptions(real, {});
    expect(opts).not.toHaveProperty('host');
    expect(opts).not.toHaveProperty('port');
    expect(opts).not.toHaveProperty('protocol');
    const proxied = { ...real, host: 'pay.internal', protocol: 'https' as const, port: 8443 };
    expect(payClientOptions(proxied, { WARPMETER_PAY_HOST: 'pay.internal' })).toMatchObject({ host: 'pay.internal', port: 8443, protocol: 'https' });
  });
});

describe('billing state', () => {
  const now = new Date('2027-03-01T12:00:00Z');
  it('folds provider statuses into the four Warpmeter acts on', () => {
    expect(['active', 'trialing'].map(localStatus)).toEqual(['active', 'active']);
    expect(['past_due', 'unpaid', 'paused'].map(localStatus)).toEqual(['past_due', 'past_due', 'past_due']);
    expect(localStatus('incomplete')).toBe('incomplete');
    expect(['canceled', 'incomplete_expired'].map(localStatus)).toEqual(['canceled', 'canceled']);
  });

  it('is in grace until the grace date, blocked from then on, and blocked once canceled', () => {
    expect(billingState(null, now)).toBe('none');
    expect(billingState({ status: 'none', graceUntil: null }, now)).toBe('none');
    expect(billingState({ status: 'active', graceUntil: null }, now)).toBe('active');
    const failedAt = now.getTime() - 1000;
    expect(billingState({ status: 'past_due', graceUntil: new Date(failedAt + GRACE_PERIOD_MS) }, now)).toBe('grace');
    expect(billingState({ status: 'past_due', graceUntil: now }, now)).toBe('blocked');
    expect(billingState({ status: 'past_due', graceUntil: null }, now)).toBe('blocked');
    expect(billingState({ status: 'canceled', graceUntil: null }, now)).toBe('blocked');
    expect(GRACE_PERIOD_MS).toBe(7 * 24 * 3600 * 1000);
  });
});
