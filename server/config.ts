import { randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { z } from 'zod';
import type { CollabOptions } from './boards-live/types';

/** Everything the server can be told; `loadConfig` fills it from the environment. */
export interface AppConfig {
  port: number;
  /** Interface to listen on; undefined = all interfaces. Tests use 127.0.0.1. */
  host?: string;
  databaseFile: string;
  sessionSecret: string;
  /** Outgoing SMTP server; undefined = run the built-in catcher on loopback and send there. */
  smtpUrl?: string;
  /** Port of the built-in catcher (0 = a free port). */
  smtpCatcherPort: number;
  mailFrom: string;
  uploadDir: string;
  /** Public origin for links in e-mails and the Origin check; undefined = the request's own origin. */
  publicUrl?: string;
  seedDemo: boolean;
  bcryptCost: number;
  jsonLimit: string;
  rateLimit: { windowMs: number; login: number; signup: number; resetRequest: number };
  /** Directory of the built client; served only when it holds index.html. */
  distDir: string;
  version: string;
  /** Express `trust proxy` (e.g. `loopback`, `1`), so rate limits see client addresses behind a proxy. */
  trustProxy?: string | number;
  /** Log unexpected errors to stderr (tests may silence expected noise). */
  logErrors: boolean;
  /** Limits of the live board rooms (tests lower them); defaults in server/boards-live/types.ts. */
  collab?: Partial<CollabOptions>;
}

const truthy = z
  .enum(['1', '0', 'true', 'false', 'yes', 'no', ''])
  .transform((v) => v === '1' || v === 'true' || v === 'yes');

const EnvSchema = z.object({
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  HOST: z.string().min(1).optional(),
  DATABASE_FILE: z.string().min(1).default('data/gatefold.sqlite'),
  SESSION_SECRET: z.string().min(16, 'SESSION_SECRET must be at least 16 characters').optional(),
  SMTP_URL: z.url({ error: 'SMTP_URL must be a URL such as smtp://host:25' }).optional(),
  SMTP_CATCHER_PORT: z.coerce.number().int().min(0).max(65535).default(0),
  MAIL_FROM: z.string().min(3).default('Gatefold <no-reply@gatefold.invalid>'),
  UPLOAD_DIR: z.string().min(1).default('data/uploads'),
  PUBLIC_URL: z.url({ protocol: /^https?$/, error: 'PUBLIC_URL must be an http(s) URL' }).optional(),
  GATEFOLD_SEED_DEMO: truthy.default(false),
  BCRYPT_COST: z.coerce.number().int().min(10, 'BCRYPT_COST must be at least 10').max(15).default(12),
  JSON_LIMIT: z.string().default('8mb'),
  RATE_LIMIT_WINDOW_MS: z.coerce.number().int().positive().default(15 * 60 * 1000),
  RATE_LIMIT_LOGIN: z.coerce.number().int().positive().default(10),
  RATE_LIMIT_SIGNUP: z.coerce.number().int().positive().default(20),
  RATE_LIMIT_RESET: z.coerce.number().int().positive().default(10),
  DIST_DIR: z.string().default('dist'),
  TRUST_PROXY: z.string().min(1).optional(),
});

/** The version in package.json, shown by /api/health. */
export function packageVersion(): string {
  const raw = readFileSync(new URL('../package.json', import.meta.url), 'utf8');
  return (JSON.parse(raw) as { version: string }).version;
}

/** Empty strings in the environment mean "not set". */
function cleanEnv(env: NodeJS.ProcessEnv): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of Object.entries(env)) if (v !== undefined && v !== '') out[k] = v;
  return out;
}

/** Reads and validates the environment; throws one readable line per bad setting. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): AppConfig {
  const parsed = EnvSchema.safeParse(cleanEnv(env));
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
    throw new Error(`invalid configuration: ${lines.join('; ')}`);
  }
  const e = parsed.data;
  let sessionSecret = e.SESSION_SECRET;
  if (!sessionSecret) {
    // A per-start secret is safe but signs everyone out at every restart, so say so.
    console.warn('warning: SESSION_SECRET is not set; using a random one (sessions end when the server restarts)');
    sessionSecret = randomBytes(32).toString('hex');
  }
  return {
    port: e.PORT,
    host: e.HOST,
    databaseFile: e.DATABASE_FILE,
    sessionSecret,
    smtpUrl: e.SMTP_URL,
    smtpCatcherPort: e.SMTP_CATCHER_PORT,
    mailFrom: e.MAIL_FROM,
    uploadDir: e.UPLOAD_DIR,
    publicUrl: e.PUBLIC_URL ? new URL(e.PUBLIC_URL).origin : undefined,
    seedDemo: e.GATEFOLD_SEED_DEMO,
    bcryptCost: e.BCRYPT_COST,
    jsonLimit: e.JSON_LIMIT,
    rateLimit: { windowMs: e.RATE_LIMIT_WINDOW_MS, login: e.RATE_LIMIT_LOGIN, signup: e.RATE_LIMIT_SIGNUP, resetRequest: e.RATE_LIMIT_RESET },
    distDir: e.DIST_DIR,
    trustProxy: e.TRUST_PROXY === undefined ? undefined : /^\d+$/.test(e.TRUST_PROXY) ? Number(e.TRUST_PROXY) : e.TRUST_PROXY,
    version: packageVersion(),
    logErrors: true,
  };
}
