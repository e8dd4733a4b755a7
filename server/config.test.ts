import { describe, expect, it } from 'vitest';
import { isLocalDemo, loadConfig } from './config.ts';

const HOSTED_PAYMENTS = { STRIPE_API_HOST: 'api.stripe.com', STRIPE_API_PORT: '443', STRIPE_API_PROTOCOL: 'https' };

describe('hosted defaults (issue 9, item 7)', () => {
  it('a non-loopback payment host with missing secrets stops the start, naming each variable', () => {
    expect(() => loadConfig(HOSTED_PAYMENTS)).toThrow(/STRIPE_SECRET_KEY: the payment service at api\.stripe\.com is not this machine/);
    expect(() => loadConfig(HOSTED_PAYMENTS)).toThrow(/STRIPE_WEBHOOK_SECRET/);
  });

  it('a non-loopback payment host with the documented local secrets stops the start', () => {
    const env = { ...HOSTED_PAYMENTS, STRIPE_SECRET_KEY: 'sk_test_tidefield_local', STRIPE_WEBHOOK_SECRET: 'whsec_real_one' };
    expect(() => loadConfig(env)).toThrow(/STRIPE_SECRET_KEY/);
    expect(() => loadConfig(env)).not.toThrow(/STRIPE_WEBHOOK_SECRET/);
  });

  it('a non-loopback payment host with its own secrets starts, and is not the local demo', () => {
    const config = loadConfig({ ...HOSTED_PAYMENTS, STRIPE_SECRET_KEY: 'sk_live_own', STRIPE_WEBHOOK_SECRET: 'whsec_own' });
    expect(isLocalDemo(config)).toBe(false);
  });

  it('npm start on a fresh machine: the defaults load unchanged and are the local demo', () => {
    const config = loadConfig({});
    expect(config.STRIPE_SECRET_KEY).toBe('sk_test_tidefield_local');
    expect(isLocalDemo(config)).toBe(true);
  });

  it('mail or the app off this machine is not the local demo (no demo accounts are seeded)', () => {
    expect(isLocalDemo(loadConfig({ SMTP_HOST: 'smtp.example.org' }))).toBe(false);
    expect(isLocalDemo(loadConfig({ HOST: '0.0.0.0' }))).toBe(false);
  });
});
