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
  DATA_DIR: z.string().default(path.join(REPO_ROOT, '.data')),
  UPLOADS_DIR: z.string().default(path.join(REPO_ROOT, 'uploads')),
  WEB_DIST_DIR: z.string().default(path.join(REPO_ROOT, 'dist')),
  JWT_SECRET: z.string().min(32, 'JWT_SECRET must be at least 32 characters.').optional(),
  TOKEN_TTL_HOURS: z.coerce.number().positive().default(24 * 14),
  BCRYPT_COST: z.coerce.number().int().min(4).max(15).default(12),
  AUTH_RATE_LIMIT: z.coerce.number().int().positive().default(20),
  AUTH_RATE_WINDOW_SECONDS: z.coerce.number().int().positive().default(15 * 60),
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

/** The address the app is reached at (links in e-mails and label QR codes). */
export function publicUrl(config: Config): string {
  return (config.PUBLIC_URL ?? `http://${config.HOST}:${config.PORT}`).replace(/\/+$/, '');
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
