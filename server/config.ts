import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { isIP } from 'node:net';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

export const projectRoot = resolve(dirname(fileURLToPath(import.meta.url)), '..');

export interface Config {
  nodeEnv: 'development' | 'production' | 'test';
  host: string;
  port: number;
  publicOrigin: string;
  databaseUrl: string;
  jwtSecret: string;
  jwtTtlSeconds: number;
  secureCookies: boolean;
  bodyLimitBytes: number;
  logLevel: 'fatal' | 'error' | 'warn' | 'info' | 'debug' | 'trace' | 'silent';
  loginLimitPerIp: number;
  loginLimitPerAccount: number;
  calcRateLimitPerMinute: number;
  /** Express's 'trust proxy': false, a hop count, or addresses, subnets and names such as loopback. */
  trustProxy: boolean | number | string[];
  imageStorage: 'disk' | 's3';
  uploadDir: string;
  uploadMaxBytes: number;
  /** Empty for the provider's own endpoint. */
  s3Endpoint: string;
  s3Bucket: string;
  s3Region: string;
  /** Both empty: the SDK's usual credential chain (environment, instance role). */
  s3AccessKeyId: string;
  s3SecretAccessKey: string;
  s3ForcePathStyle: boolean;
  csvImportMaxBytes: number;
  catalogueCacheTtlMs: number;
  clientDist: string;
  /** Payment provider (the stripe SDK); by default the local stand-in on 127.0.0.1. */
  stripeSecretKey: string;
  stripeWebhookSecret: string;
  stripeApiHost: string;
  stripeApiPort: number;
  stripeApiProtocol: 'http' | 'https';
  /** How long checkout holds stock for an unpaid order. */
  reservationMinutes: number;
  /** How often each app server looks for reservations past their time. */
  reservationSweepMs: number;
  smtpHost: string;
  smtpPort: number;
  smtpSecure: boolean;
  smtpUser: string;
  smtpPassword: string;
  mailFrom: string;
  mailCaptureUrl: string;
  mailWorker: boolean;
  mailRetryLimit: number;
  mailRetryDelaySeconds: number;
}

export class ConfigError extends Error {
  constructor(readonly problems: string[]) {
    super(`Invalid configuration:\n  - ${problems.join('\n  - ')}`);
  }
}

type Env = Record<string, string | undefined>;

/** Reads and checks every setting once; throws ConfigError listing every bad value. */
export function parseConfig(env: Env = process.env): Config {
  const problems: string[] = [];

  const int = (key: string, fallback: number, min: number, max: number): number => {
    const raw = env[key];
    if (raw === undefined || raw === '') return fallback;
    const n = Number(raw);
    if (!Number.isInteger(n) || n < min || n > max) {
      problems.push(`${key} must be a whole number from ${min} to ${max}, got '${raw}'`);
      return fallback;
    }
    return n;
  };
  const oneOf = <T extends string>(key: string, fallback: T, allowed: readonly T[]): T => {
    const raw = env[key];
    if (raw === undefined || raw === '') return fallback;
    if (!(allowed as readonly string[]).includes(raw)) {
      problems.push(`${key} must be one of ${allowed.join(', ')}, got '${raw}'`);
      return fallback;
    }
    return raw as T;
  };
  const bool = (key: string, fallback: boolean): boolean => {
    const raw = env[key];
    if (raw === undefined || raw === '') return fallback;
    if (raw === 'true' || raw === '1') return true;
    if (raw === 'false' || raw === '0') return false;
    problems.push(`${key} must be true or false, got '${raw}'`);
    return fallback;
  };

  const nodeEnv = oneOf('NODE_ENV', 'development', ['development', 'production', 'test'] as const);
  const host = env.HOST || '127.0.0.1';
  const port = int('PORT', 8080, 0, 65535);
  const publicOrigin = env.PUBLIC_ORIGIN || `http://127.0.0.1:${port}`;
  try {
    const u = new URL(publicOrigin);
    if (u.origin !== publicOrigin) problems.push(`PUBLIC_ORIGIN must be an origin like http://127.0.0.1:8080, got '${publicOrigin}'`);
  } catch {
    problems.push(`PUBLIC_ORIGIN must be a URL, got '${publicOrigin}'`);
  }
  const databaseUrl = env.DATABASE_URL || 'postgres://postgres@127.0.0.1:54329/loadline';
  if (!/^postgres(ql)?:\/\//.test(databaseUrl)) problems.push('DATABASE_URL must start with postgres://');

  let jwtSecret = env.JWT_SECRET ?? '';
  if (jwtSecret && jwtSecret.length < 32) problems.push('JWT_SECRET must be at least 32 characters');
  if (!jwtSecret) {
    if (nodeEnv === 'production') problems.push('JWT_SECRET is required in production');
    else jwtSecret = demoSecret();
  }

  const trustProxy = parseTrustProxy(env.TRUST_PROXY, problems);
  const imageStorage = oneOf('IMAGE_STORAGE', 'disk', ['disk', 's3'] as const);
  const s3Endpoint = env.S3_ENDPOINT ?? '';
  if (s3Endpoint && !/^https?:\/\/[^/]+\/?$/.test(s3Endpoint)) problems.push(`S3_ENDPOINT must be a URL like https://objects.example.test, got '${s3Endpoint}'`);
  const s3Bucket = env.S3_BUCKET ?? '';
  if (imageStorage === 's3' && !/^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/.test(s3Bucket)) problems.push(`S3_BUCKET must name a bucket (3–63 lower-case letters, digits, dots, hyphens) when IMAGE_STORAGE=s3, got '${s3Bucket}'`);
  const s3AccessKeyId = env.S3_ACCESS_KEY_ID ?? '';
  const s3SecretAccessKey = env.S3_SECRET_ACCESS_KEY ?? '';
  if (!s3AccessKeyId !== !s3SecretAccessKey) problems.push('S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY are set together or not at all');
  const mailFrom = env.MAIL_FROM || 'Loadline shop <shop@loadline.test>';
  if (!/^[^<>@\s]+@[^<>@\s]+\.[^<>@\s]+$|<[^<>@\s]+@[^<>@\s]+\.[^<>@\s]+>$/.test(mailFrom)) {
    problems.push(`MAIL_FROM must be an address like shop@example.test or Name <shop@example.test>, got '${mailFrom}'`);
  }
  if (env.SMTP_USER && !env.SMTP_PASSWORD) problems.push('SMTP_PASSWORD is required when SMTP_USER is set');
  const mailCaptureUrl = env.MAIL_CAPTURE_URL || 'http://127.0.0.1:2526';
  if (!/^https?:\/\//.test(mailCaptureUrl)) problems.push(`MAIL_CAPTURE_URL must be an http:// URL, got '${mailCaptureUrl}'`);

  const config: Config = {
    nodeEnv,
    host,
    port,
    publicOrigin,
    databaseUrl,
    jwtSecret,
    jwtTtlSeconds: int('JWT_TTL_SECONDS', 8 * 3600, 60, 30 * 24 * 3600),
    secureCookies: bool('SECURE_COOKIES', nodeEnv === 'production'),
    bodyLimitBytes: int('BODY_LIMIT_BYTES', 4 * 1024 * 1024, 1024, 50 * 1024 * 1024),
    logLevel: oneOf('LOG_LEVEL', nodeEnv === 'test' ? 'silent' : 'info', ['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent'] as const),
    loginLimitPerIp: int('LOGIN_LIMIT_PER_IP', 30, 1, 1_000_000),
    loginLimitPerAccount: int('LOGIN_LIMIT_PER_ACCOUNT', 8, 1, 1_000_000),
    calcRateLimitPerMinute: int('CALC_RATE_LIMIT_PER_MINUTE', 600, 1, 100_000_000),
    trustProxy,
    imageStorage,
    uploadDir: resolve(projectRoot, env.UPLOAD_DIR || '.data/uploads'),
    uploadMaxBytes: int('UPLOAD_MAX_BYTES', 5 * 1024 * 1024, 1024, 100 * 1024 * 1024),
    s3Endpoint: s3Endpoint.replace(/\/$/, ''),
    s3Bucket,
    s3Region: env.S3_REGION || 'us-east-1',
    s3AccessKeyId,
    s3SecretAccessKey,
    s3ForcePathStyle: bool('S3_FORCE_PATH_STYLE', false),
    csvImportMaxBytes: int('CSV_IMPORT_MAX_BYTES', 20 * 1024 * 1024, 1024, 200 * 1024 * 1024),
    catalogueCacheTtlMs: int('CATALOGUE_CACHE_TTL_MS', 5000, 0, 3_600_000),
    clientDist: resolve(projectRoot, env.CLIENT_DIST || 'dist/client'),
    stripeSecretKey: env.STRIPE_SECRET_KEY || 'sk_test_loadline_local',
    stripeWebhookSecret: env.STRIPE_WEBHOOK_SECRET || 'whsec_loadline_local_standin',
    stripeApiHost: env.STRIPE_API_HOST || '127.0.0.1',
    stripeApiPort: int('STRIPE_API_PORT', 8470, 1, 65535),
    stripeApiProtocol: oneOf('STRIPE_API_PROTOCOL', 'http', ['http', 'https'] as const),
    reservationMinutes: int('RESERVATION_MINUTES', 30, 1, 1440),
    reservationSweepMs: int('RESERVATION_SWEEP_MS', 30_000, 0, 3_600_000),
    smtpHost: env.SMTP_HOST || '127.0.0.1',
    smtpPort: int('SMTP_PORT', 2525, 1, 65535),
    smtpSecure: bool('SMTP_SECURE', false),
    smtpUser: env.SMTP_USER ?? '',
    smtpPassword: env.SMTP_PASSWORD ?? '',
    mailFrom,
    mailCaptureUrl: mailCaptureUrl.replace(/\/+$/, ''),
    mailWorker: bool('MAIL_WORKER', true),
    mailRetryLimit: int('MAIL_RETRY_LIMIT', 10, 0, 100),
    mailRetryDelaySeconds: int('MAIL_RETRY_DELAY_SECONDS', 30, 1, 3600),
  };
  if (!/^(sk|rk)_(test|live)_\w+$/.test(config.stripeSecretKey)) problems.push('STRIPE_SECRET_KEY must look like sk_test_… or sk_live_…');
  if (!config.stripeWebhookSecret.startsWith('whsec_')) problems.push('STRIPE_WEBHOOK_SECRET must start with whsec_');
  if (nodeEnv === 'production' && (!env.STRIPE_SECRET_KEY || !env.STRIPE_WEBHOOK_SECRET)) problems.push('STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET are required in production');
  if (problems.length) throw new ConfigError(problems);
  return Object.freeze(config);
}

const proxyNames = ['loopback', 'linklocal', 'uniquelocal'];

// 'true' would trust any X-Forwarded-For, so every client could pick its own address and dodge per-address limits.
function parseTrustProxy(raw: string | undefined, problems: string[]): Config['trustProxy'] {
  if (raw === undefined || raw.trim() === '') return ['loopback'];
  const v = raw.trim();
  if (v === 'false') return false;
  if (/^\d+$/.test(v)) return Number(v);
  const parts = v.split(',').map((p) => p.trim());
  const bad = parts.filter((p) => {
    if (proxyNames.includes(p)) return false;
    const [addr = '', bits, ...more] = p.split('/');
    const family = isIP(addr);
    if (!family || more.length) return true;
    return bits !== undefined && !(/^\d+$/.test(bits) && Number(bits) <= (family === 4 ? 32 : 128));
  });
  if (bad.length) {
    problems.push(
      `TRUST_PROXY must be false, a number of proxy hops, or a comma-separated list of addresses, subnets (10.0.0.0/8) or ${proxyNames.join(', ')}; '${bad.join(', ')}' is not`,
    );
    return ['loopback'];
  }
  return parts;
}

// The demo keeps a random secret in a git-ignored file so sign-ins survive a restart.
function demoSecret(): string {
  const file = resolve(projectRoot, '.secrets/jwt-secret');
  if (existsSync(file)) {
    const s = readFileSync(file, 'utf8').trim();
    if (s.length >= 32) return s;
  }
  const s = randomBytes(48).toString('base64url');
  mkdirSync(dirname(file), { recursive: true });
  writeFileSync(file, s + '\n', { mode: 0o600 });
  return s;
}

let cached: Config | undefined;
export function getConfig(): Config {
  cached ??= parseConfig();
  return cached;
}
