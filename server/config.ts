import { z } from 'zod';

// Environment is parsed once at start-up; everything else receives a typed Config.

const emptyToUndefined = (value: unknown) => (value === '' ? undefined : value);

const booleanFlag = (name: string) =>
  z.preprocess(
    emptyToUndefined,
    z
      .enum(['true', 'false', '1', '0', 'yes', 'no'], {
        error: `${name} must be one of true, false, 1, 0, yes, no`,
      })
      .transform((value) => value === 'true' || value === '1' || value === 'yes')
      .optional(),
  );

const databaseUrl = z
  .string()
  .trim()
  .refine(
    (value) =>
      /^sqlite:.+/.test(value) || /^postgres(ql)?:\/\/.+/.test(value),
    'DATABASE_URL must start with sqlite: (e.g. sqlite:./data/baywright.sqlite or sqlite::memory:) or postgres://',
  );

const positiveWhole = (name: string, max: number) =>
  z.preprocess(
    emptyToUndefined,
    z.coerce
      .number({ error: `${name} must be a whole number` })
      .int(`${name} must be a whole number`)
      .min(1, `${name} must be at least 1`)
      .max(max, `${name} must be at most ${max}`)
      .optional(),
  );

const envSchema = z.object({
  PORT: z.preprocess(
    emptyToUndefined,
    z.coerce
      .number({ error: 'PORT must be a whole number between 1 and 65535' })
      .int('PORT must be a whole number between 1 and 65535')
      .min(1, 'PORT must be a whole number between 1 and 65535')
      .max(65535, 'PORT must be a whole number between 1 and 65535')
      .default(3000),
  ),
  DATABASE_URL: z.preprocess(emptyToUndefined, databaseUrl.default('sqlite:./data/baywright.sqlite')),
  NODE_ENV: z.preprocess(
    emptyToUndefined,
    z
      .enum(['development', 'production', 'test'], {
        error: 'NODE_ENV must be development, production or test',
      })
      .default('development'),
  ),
  COOKIE_SECURE: booleanFlag('COOKIE_SECURE'),
  RATE_LIMIT_RELAXED: booleanFlag('RATE_LIMIT_RELAXED'),
  SEED_DEMO: booleanFlag('SEED_DEMO'),
  TRUST_PROXY: z.preprocess(emptyToUndefined, z.string().optional()),
  UPLOAD_DIR: z.preprocess(emptyToUndefined, z.string().default('./data/uploads')),
  SMTP_HOST: z.preprocess(emptyToUndefined, z.string().optional()),
  SMTP_PORT: z.preprocess(
    emptyToUndefined,
    z.coerce
      .number({ error: 'SMTP_PORT must be a whole number' })
      .int('SMTP_PORT must be a whole number')
      .min(1)
      .max(65535)
      .optional(),
  ),
  DESIGN_TIMEOUT_MS: positiveWhole('DESIGN_TIMEOUT_MS', 3_600_000),
  DESIGN_MEMORY_MB: positiveWhole('DESIGN_MEMORY_MB', 65_536),
  DESIGN_WORKERS: positiveWhole('DESIGN_WORKERS', 64),
  SMTP_USER: z.preprocess(emptyToUndefined, z.string().optional()),
  SMTP_PASSWORD: z.preprocess(emptyToUndefined, z.string().optional()),
  SMTP_FROM: z.preprocess(
    emptyToUndefined,
    z.email({ error: 'SMTP_FROM must be an email address' }).optional(),
  ),
  // Aliases: SMTP_PASS for SMTP_PASSWORD, MAIL_FROM for SMTP_FROM.
  SMTP_PASS: z.preprocess(emptyToUndefined, z.string().optional()),
  MAIL_FROM: z.preprocess(
    emptyToUndefined,
    z.email({ error: 'MAIL_FROM must be an email address' }).optional(),
  ),
  DESIGN_RUNS_KEPT: z.preprocess(
    emptyToUndefined,
    z.coerce
      .number({ error: 'DESIGN_RUNS_KEPT must be a whole number between 1 and 1000' })
      .int('DESIGN_RUNS_KEPT must be a whole number between 1 and 1000')
      .min(1, 'DESIGN_RUNS_KEPT must be a whole number between 1 and 1000')
      .max(1000, 'DESIGN_RUNS_KEPT must be a whole number between 1 and 1000')
      .default(5),
  ),
  APP_URL: z.preprocess(
    emptyToUndefined,
    z
      .url({ protocol: /^https?$/, error: 'APP_URL must be an http(s) address, e.g. https://baywright.example' })
      .transform((value) => value.replace(/\/+$/, ''))
      .optional(),
  ),
});

export type NodeEnv = 'development' | 'production' | 'test';

export interface SmtpConfig {
  host: string;
  port: number;
  user?: string;
  password?: string;
  from: string;
}

export interface Config {
  port: number;
  databaseUrl: string;
  nodeEnv: NodeEnv;
  cookieSecure: boolean;
  rateLimitRelaxed: boolean;
  seedDemo: boolean;
  uploadDir: string;
  /**
   * Express 'trust proxy' setting (e.g. 1 or "loopback") so req.ip, used by the per-IP
   * sign-in limit, is the client behind a reverse proxy. false: use the socket address.
   */
  trustProxy: boolean | number | string;
  /** null when SMTP_HOST is unset: mail goes to the outbox only. */
  smtp: SmtpConfig | null;
  /**
   * Public address of the app (no trailing slash) for links in e-mails. Required with SMTP so
   * a forged Host header can never steer a reset link elsewhere; without SMTP (local outbox)
   * links fall back to the request's own origin.
   */
  appUrl?: string;
  /** Budget of a design run (worker threads): time, memory, parallel runs; unset parts take the defaults. */
  designRuns?: { timeoutMs?: number; memoryMb?: number; workers?: number; maxQueue?: number };
  /**
   * Design runs whose full result is kept per scheme (the newest); older runs keep their summary
   * (revision, weight, pieces, failures: what the activity feed lists) and drop the result.
   */
  designRunsKept: number;
}

export class ConfigError extends Error {
  constructor(public readonly problems: string[]) {
    super(`Invalid environment:\n${problems.map((p) => `  - ${p}`).join('\n')}`);
    this.name = 'ConfigError';
  }
}

function parseTrustProxy(value: string | undefined): boolean | number | string {
  if (value === undefined || value === 'false' || value === '0') return false;
  if (value === 'true') return true;
  return /^\d+$/.test(value) ? Number(value) : value;
}

export function loadConfig(env: Record<string, string | undefined> = process.env): Config {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((issue) => {
      const name = String(issue.path[0] ?? 'environment');
      const raw = env[name];
      const shown = raw === undefined ? '' : ` (got ${JSON.stringify(raw)})`;
      const message = issue.message.startsWith(name) ? issue.message : `${name}: ${issue.message}`;
      return `${message}${shown}`;
    });
    throw new ConfigError(problems);
  }
  const e = parsed.data;
  const from = e.SMTP_FROM ?? e.MAIL_FROM;
  if (e.SMTP_HOST && !from) {
    throw new ConfigError(['SMTP_FROM: required when SMTP_HOST is set (or MAIL_FROM)']);
  }
  if (e.SMTP_HOST && !e.APP_URL) {
    throw new ConfigError([
      'APP_URL: required when SMTP_HOST is set (links in e-mails must not depend on the request Host header)',
    ]);
  }
  return {
    port: e.PORT,
    databaseUrl: e.DATABASE_URL,
    nodeEnv: e.NODE_ENV,
    cookieSecure: e.COOKIE_SECURE ?? e.NODE_ENV === 'production',
    rateLimitRelaxed: e.RATE_LIMIT_RELAXED ?? false,
    seedDemo: e.SEED_DEMO ?? true,
    uploadDir: e.UPLOAD_DIR,
    trustProxy: parseTrustProxy(e.TRUST_PROXY),
    designRunsKept: e.DESIGN_RUNS_KEPT,
    smtp: e.SMTP_HOST
      ? {
          host: e.SMTP_HOST,
          port: e.SMTP_PORT ?? 587,
          user: e.SMTP_USER,
          password: e.SMTP_PASSWORD ?? e.SMTP_PASS,
          from: from as string,
        }
      : null,
    ...(e.APP_URL ? { appUrl: e.APP_URL } : {}),
    designRuns: {
      ...(e.DESIGN_TIMEOUT_MS ? { timeoutMs: e.DESIGN_TIMEOUT_MS } : {}),
      ...(e.DESIGN_MEMORY_MB ? { memoryMb: e.DESIGN_MEMORY_MB } : {}),
      ...(e.DESIGN_WORKERS ? { workers: e.DESIGN_WORKERS } : {}),
    },
  };
}
