import { validateEnv } from './env.validation';

describe('validateEnv', () => {
  it('lists every missing or wrong variable at once', () => {
    expect(() => validateEnv({ PORT: 'eighty', APP_ORIGIN: 'not a url' })).toThrow(
      /PORT must be a number[\s\S]*APP_ORIGIN must be a valid uri[\s\S]*SESSION_SECRET is required[\s\S]*DB_PORT is required/,
    );
  });

  it('fills defaults for a complete set', () => {
    const env = validateEnv({
      APP_ORIGIN: 'http://127.0.0.1:3000',
      SESSION_SECRET: 'x'.repeat(32),
      DB_PORT: '3407',
      DB_NAME: 'selvage',
      DB_USER: 'selvage',
      DB_PASSWORD: 'pw',
      SMTP_PORT: '2525',
    });
    expect(env.PORT).toBe(3000);
    expect(env.DB_PORT).toBe(3407);
    expect(env.AUTH_ACCOUNT_FAILURE_LIMIT).toBe(10);
  });

  it('checks the payment-service settings: both secrets together, in their own formats', () => {
    const base = {
      APP_ORIGIN: 'http://127.0.0.1:3000',
      SESSION_SECRET: 'x'.repeat(32),
      DB_PORT: '3407',
      DB_NAME: 'selvage',
      DB_USER: 'selvage',
      DB_PASSWORD: 'pw',
      SMTP_PORT: '2525',
    };
    expect(validateEnv(base).PAYMENTS_SECRET_KEY).toBe('');
    expect(() => validateEnv({ ...base, PAYMENTS_SECRET_KEY: 'sk_test_abc' })).toThrow(/PAYMENTS_WEBHOOK_SECRET is required when PAYMENTS_SECRET_KEY is set/);
    expect(() => validateEnv({ ...base, PAYMENTS_SECRET_KEY: 'pk_test_abc', PAYMENTS_WEBHOOK_SECRET: 'secret', PAYMENTS_API_URL: 'ftp://x' })).toThrow(
      /PAYMENTS_SECRET_KEY must be a secret key[\s\S]*PAYMENTS_WEBHOOK_SECRET must be a webhook signing secret[\s\S]*PAYMENTS_API_URL must be a valid uri/,
    );
    const ok = validateEnv({ ...base, PAYMENTS_SECRET_KEY: 'sk_test_abc', PAYMENTS_WEBHOOK_SECRET: 'whsec_abc', PAYMENTS_API_URL: 'http://127.0.0.1:12111' });
    expect(ok.PAYMENTS_API_URL).toBe('http://127.0.0.1:12111');
  });
});
