import { z } from 'zod';

/**
 * Settings, parsed once at start-up. A missing or bad setting stops the process with a message naming it.
 * The start and test scripts fill DATABASE_URL and SESSION_SECRET for the project-local cluster.
 */
const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  DATABASE_URL: z.string().url('DATABASE_URL must be a postgres:// URL'),
  SESSION_SECRET: z.string().min(32, 'SESSION_SECRET must be at least 32 characters'),
  KILOWATCH_HOST: z.string().default('127.0.0.1'),
  KILOWATCH_PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  /** Public origin of the app (for links in e-mails and the Origin check), e.g. https://kilowatch.example.com. */
  APP_ORIGIN: z.string().url().optional(),
  /** `fake`: start the local fake SMTP server in-process and send to it. `smtp`: send through SMTP_* settings. */
  MAIL_MODE: z.enum(['fake', 'smtp']).default('fake'),
  SMTP_HOST: z.string().optional(),
  SMTP_PORT: z.coerce.number().int().optional(),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  SMTP_SECURE: z
    .enum(['true', 'false'])
    .default('false')
    .transform((v) => v === 'true'),
  MAIL_FROM: z.string().default('Kilowatch <no-reply@kilowatch.invalid>'),
  /** Set when the app is served over https (cookies get the Secure flag). */
  COOKIE_SECURE: z
    .enum(['true', 'false'])
    .default('false')
    .transform((v) => v === 'true'),
  /** Folder for uploaded delivery notes and lab reports (kept out of git). */
  KILOWATCH_UPLOAD_DIR: z.string().optional(),
  /** Express `trust proxy` setting, for a reverse proxy in front. */
  TRUST_PROXY: z.string().optional(),
});

export type Env = z.infer<typeof envSchema>;

export function parseEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Kilowatch cannot start; fix these settings:\n${lines.join('\n')}`);
  }
  const env = parsed.data;
  if (env.MAIL_MODE === 'smtp' && !env.SMTP_HOST) throw new Error('Kilowatch cannot start: MAIL_MODE=smtp needs SMTP_HOST');
  return env;
}
