import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { z } from 'zod';

export const REPO_ROOT = path.resolve(__dirname, '..');

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  DATABASE_URL: z.string().min(1, 'DATABASE_URL is required (npm start sets it).'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(8080),
  PUBLIC_URL: z.string().optional(),
  TRUST_PROXY: z.string().regex(/^(\d+|loopback|linklocal|uniquelocal|[0-9a-fA-F.:/]+)(,\s*(loopback|linklocal|uniquelocal|[0-9a-fA-F.:/]+))*$/, 'TRUST_PROXY is a hop count (1) or addresses and subnets (loopback, 10.0.0.0/8, …).').optional(),
  DATA_DIR: z.string().default(path.join(REPO_ROOT, '.data')),
  UPLOADS_DIR: z.string().default(path.join(REPO_ROOT, 'uploads')),
  STORAGE: z.enum(['disk', 's3']).default('disk'),
  S3_ENDPOINT: z.url({ protocol: /^https?$/, message: 'S3_ENDPOINT must be an http(s) URL such as http://127.0.0.1:9000.' }).optional(),
  S3_BUCKET: z.string().optional(),
  S3_REGION: z.string().optional(),
  S3_ACCESS_KEY_ID: z.string().optional(),
  S3_SECRET_ACCESS_KEY: z.string().optional(),
  S3_FORCE_PATH_STYLE: z.enum(['0', '1']).default('1'),
  WEB_DIST_DIR: z.string().default(path.join(REPO_ROOT, 'dist')),
  JWT_SECRET: z.string().min(32, 'JWT_SECRET must be at least 32 characters.').optional(),
  TOKEN_TTL_HOURS: z.coerce.number().positive().default(24 * 14),
  BCRYPT_COST: z.coerce.number().int().min(4).max(15).default(12),
  AUTH_RATE_LIMIT: z.coerce.number().int().positive().default(20),
  AUTH_RATE_WINDOW_SECONDS: z.coerce.number().int().positive().default(15 * 60),
  ACCOUNT_RATE_LIMIT: z.coerce.number().int().positive().default(10),
  MAIL_RATE_LIMIT: z.coerce.number().int().positive().default(5),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).optional(),
  DB_POOL_MAX: z.coerce.number().int().min(1).default(10),
  DB_ACQUIRE_TIMEOUT_MS: z.coerce.number().int().min(100).default(5_000),
  BENCH_ROUTES: z.enum(['0', '1']).default('0'),
  ADMIN_EMAIL: z.string().optional(),
  ADMIN_PASSWORD: z.string().optional(),
  SMTP_HOST: z.string().optional(),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(587),
  SMTP_SECURE: z.enum(['0', '1']).default('0'),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().default('Carbwright <carbwright@localhost>'),
  FAKE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(0),
  MAIL_RETRY_BASE_SECONDS: z.coerce.number().positive().default(30),
  MAIL_MAX_ATTEMPTS: z.coerce.number().int().min(1).default(8),
  MAIL_POLL_SECONDS: z.coerce.number().positive().default(30),
}).refine((env) => env.NODE_ENV === 'test' || env.BCRYPT_COST >= 12, {
  message: 'BCRYPT_COST must be at least 12 outside tests.',
  path: ['BCRYPT_COST'],
}).superRefine((env, ctx) => {
  if (env.STORAGE !== 's3') return;
  for (const name of ['S3_BUCKET', 'S3_REGION'] as const) {
    if (!env[name]) ctx.addIssue({ code: 'custom', path: [name], message: `${name} is required when STORAGE=s3.` });
  }
  if (!env.S3_ACCESS_KEY_ID !== !env.S3_SECRET_ACCESS_KEY) {
    const missing = env.S3_ACCESS_KEY_ID ? 'S3_SECRET_ACCESS_KEY' : 'S3_ACCESS_KEY_ID';
    ctx.addIssue({ code: 'custom', path: [missing], message: 'S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY go together (or leave both out to use the SDK\'s own credentials).' });
  }
});

type LogLevel = NonNullable<z.infer<typeof envSchema>['LOG_LEVEL']>;
export type Config = Omit<z.infer<typeof envSchema>, 'LOG_LEVEL'> & { jwtSecret: string; LOG_LEVEL: LogLevel };

/** Reads the JWT secret from the environment, or from DATA_DIR/jwt-secret (created once, mode 600). */
function loadJwtSecret(env: z.infer<typeof envSchema>): string {
  if (env.JWT_SECRET) return env.JWT_SECRET;
  const file = path.join(env.DATA_DIR, 'jwt-secret');
  if (!fs.existsSync(file)) {
    fs.mkdirSync(env.DATA_DIR, { recursive: true });
    fs.writeFileSync(file, crypto.randomBytes(48).toString('base64url'), { mode: 0o600, flag: 'wx' });
  }
  return fs.readFileSync(file, 'utf8').trim();
}

/**
 * The address people reach the app at: PUBLIC_URL, else this server's own HOST and PORT. Links that leave the
 * request (label QR codes) use this, never the request's Host header, which a client can forge.
 */
export function publicUrl(config: Pick<Config, 'PUBLIC_URL' | 'HOST' | 'PORT'>): string {
  return (config.PUBLIC_URL ?? `http://${config.HOST}:${config.PORT}`).replace(/\/+$/, '');
}

/**
 * Express's `trust proxy` setting from TRUST_PROXY: behind a load balancer the client's address (for the per-address
 * sign-in limit) comes from X-Forwarded-For, added by the proxies trusted here; unset, the connection's own address.
 */
export function trustProxy(config: Pick<Config, 'TRUST_PROXY'>): number | string | false {
  if (!config.TRUST_PROXY) return false;
  return /^\d+$/.test(config.TRUST_PROXY) ? Number(config.TRUST_PROXY) : config.TRUST_PROXY;
}

/** True when no SMTP host is configured: mail goes to the local fake SMTP server and the captured-mail page is on. */
export function usesFakeSmtp(config: Config): boolean {
  return !config.SMTP_HOST;
}

/** Parses the environment once; fails fast with every problem listed. */
export function loadConfig(source: NodeJS.ProcessEnv = process.env): Config {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const LOG_LEVEL = parsed.data.LOG_LEVEL ?? (parsed.data.NODE_ENV === 'test' ? 'silent' : 'info');
  return { ...parsed.data, LOG_LEVEL, jwtSecret: loadJwtSecret(parsed.data) };
}
