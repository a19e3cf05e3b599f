import * as Joi from 'joi';

/** Every variable the api reads, checked at boot; the error lists all problems at once. */
export const envSchema = Joi.object({
  NODE_ENV: Joi.string().valid('development', 'production', 'test').default('development'),
  PORT: Joi.number().port().default(3000),
  APP_ORIGIN: Joi.string().uri({ scheme: ['http', 'https'] }).required(),
  EXTRA_ORIGINS: Joi.string().allow('').default(''),
  SESSION_SECRET: Joi.string().min(32).required(),
  WEB_DIST_DIR: Joi.string().allow('').default(''),
  TRUST_PROXY: Joi.boolean().default(false),
  UPLOADS_DIR: Joi.string().allow('').default(''),
  BEES_TICK_MS: Joi.number().integer().min(100).default(60000),
  BEES_SCHEDULER_ENABLED: Joi.boolean().default(true),
  LOG_PRETTY: Joi.boolean().default(false),
  LOG_LEVEL: Joi.string().valid('fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent').default('info'),

  DB_HOST: Joi.string().default('127.0.0.1'),
  DB_PORT: Joi.number().port().required(),
  DB_NAME: Joi.string().pattern(/^[A-Za-z0-9_]+$/).required(),
  DB_USER: Joi.string().required(),
  DB_PASSWORD: Joi.string().allow('').required(),

  SMTP_HOST: Joi.string().default('127.0.0.1'),
  SMTP_PORT: Joi.number().port().required(),
  SMTP_SECURE: Joi.boolean().default(false),
  SMTP_USER: Joi.string().allow('').default(''),
  SMTP_PASSWORD: Joi.string().allow('').default(''),
  MAIL_FROM: Joi.string().default('Selvage <no-reply@selvage.invalid>'),
  SMTP_FAKE_INBOX_URL: Joi.string().uri({ scheme: ['http'] }).allow('').default(''),
  OUTBOX_POLL_MS: Joi.number().integer().min(50).default(1000),
  OUTBOX_ENABLED: Joi.boolean().default(true),

  // Card payments: all three empty turns online payment off (cash and cheque still work).
  PAYMENTS_SECRET_KEY: Joi.string()
    .pattern(/^(sk|rk)_(test|live)_[A-Za-z0-9_]+$/)
    .allow('')
    .default('')
    .messages({ 'string.pattern.base': 'PAYMENTS_SECRET_KEY must be a secret key such as sk_test_… or sk_live_…' }),
  PAYMENTS_WEBHOOK_SECRET: Joi.string()
    .pattern(/^whsec_[A-Za-z0-9_]+$/)
    .allow('')
    .default('')
    .when('PAYMENTS_SECRET_KEY', { is: Joi.string().min(1), then: Joi.string().empty('').required() })
    .messages({
      'string.pattern.base': 'PAYMENTS_WEBHOOK_SECRET must be a webhook signing secret such as whsec_…',
      'any.required': 'PAYMENTS_WEBHOOK_SECRET is required when PAYMENTS_SECRET_KEY is set',
    }),
  PAYMENTS_API_URL: Joi.string().uri({ scheme: ['http', 'https'] }).allow('').default(''),

  AUTH_ACCOUNT_FAILURE_LIMIT: Joi.number().integer().min(1).default(10),
  AUTH_ADDRESS_FAILURE_LIMIT: Joi.number().integer().min(1).default(100),
  AUTH_FAILURE_WINDOW_MINUTES: Joi.number().integer().min(1).default(15),
}).unknown(true);

export function formatEnvErrors(error: Joi.ValidationError): string {
  const lines = error.details.map((d) => `  - ${d.message.replace(/"/g, '')}`);
  return `Selvage cannot start; fix these settings (environment variables):\n${lines.join('\n')}`;
}

export function validateEnv(config: Record<string, unknown>): Record<string, unknown> {
  const { error, value } = envSchema.validate(config, { abortEarly: false, convert: true });
  if (error) throw new Error(formatEnvErrors(error));
  return value;
}
