/**
 * Configuration from environment variables, validated with zod. Secrets come
 * only from the environment; in development the start script generates local
 * ones (kept in .data/dev-secrets.json) and passes them in the same way.
 */
import { z } from 'zod';

const boolish = z
  .enum(['1', '0', 'true', 'false', 'yes', 'no'])
  .transform((v) => v === '1' || v === 'true' || v === 'yes');

export const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(4000),
  PUBLIC_URL: z.url().optional(),
  DATABASE_URL: z.string().startsWith('mysql://', 'DATABASE_URL must be a mysql:// URL').optional(),
  DATA_DIR: z.string().default('.data'),
  DB_PORT: z.coerce.number().int().min(1024).max(65535).default(3407),
  SESSION_SECRET: z.string().min(32, 'SESSION_SECRET must be at least 32 characters').optional(),
  SESSION_MAX_AGE_HOURS: z.coerce.number().positive().default(12),
  OIDC_ISSUER: z.url().optional(),
  OIDC_CLIENT_ID: z.string().min(1).optional(),
  OIDC_CLIENT_SECRET: z.string().min(1).optional(),
  OIDC_SCOPE: z.string().default('openid profile email'),
  ADMIN_EMAILS: z.string().default(''),
  SMTP_URL: z.string().optional(),
  MAIL_FROM: z.string().default('Bondmark <bondmark@localhost>'),
  DEV_IDP_PORT: z.coerce.number().int().default(4001),
  DEV_MAIL_SMTP_PORT: z.coerce.number().int().default(2525),
  DEV_MAIL_WEB_PORT: z.coerce.number().int().default(4002),
  SIGNIN_RATE_LIMIT_PER_MINUTE: z.coerce.number().int().positive().default(30),
  TRUST_PROXY: boolish.default(false),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
});
export type Env = z.infer<typeof envSchema>;

export interface AppConfig {
  env: Env['NODE_ENV'];
  publicUrl: string;
  sessionSecret: string;
  sessionMaxAgeMs: number;
  oidc: { issuer: string; clientId: string; clientSecret: string; scope: string };
  adminEmails: Set<string>;
  signinRateLimitPerMinute: number;
  trustProxy: boolean;
  logLevel: Env['LOG_LEVEL'];
}

/** Reads and checks the environment; throws one message listing every bad variable. */
export function readEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Bad configuration in environment variables:\n${lines.join('\n')}`);
  }
  return parsed.data;
}

/** Turns the environment into the app's configuration; in production every secret must be set. */
export function buildConfig(env: Env): AppConfig {
  const missing: string[] = [];
  if (!env.SESSION_SECRET) missing.push('SESSION_SECRET');
  if (!env.OIDC_ISSUER) missing.push('OIDC_ISSUER');
  if (!env.OIDC_CLIENT_ID) missing.push('OIDC_CLIENT_ID');
  if (!env.OIDC_CLIENT_SECRET) missing.push('OIDC_CLIENT_SECRET');
  if (missing.length) throw new Error(`Missing configuration: ${missing.join(', ')} must be set`);
  return {
    env: env.NODE_ENV,
    publicUrl: (env.PUBLIC_URL ?? `http://${env.HOST}:${env.PORT}`).replace(/\/$/, ''),
    sessionSecret: env.SESSION_SECRET!,
    sessionMaxAgeMs: env.SESSION_MAX_AGE_HOURS * 3600_000,
    oidc: { issuer: env.OIDC_ISSUER!, clientId: env.OIDC_CLIENT_ID!, clientSecret: env.OIDC_CLIENT_SECRET!, scope: env.OIDC_SCOPE },
    adminEmails: new Set(
      env.ADMIN_EMAILS.split(',')
        .map((s) => s.trim().toLowerCase())
        .filter(Boolean),
    ),
    signinRateLimitPerMinute: env.SIGNIN_RATE_LIMIT_PER_MINUTE,
    trustProxy: env.TRUST_PROXY,
    logLevel: env.LOG_LEVEL,
  };
}
