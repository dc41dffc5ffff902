import { z } from 'zod';

/** The development fallback secret: never accepted in production. */
export const DEV_SECRET = 'crossfault-development-secret-not-for-production';

const schema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  NEXTAUTH_SECRET: z.string().optional(),
  NEXTAUTH_URL: z.string().url().optional(),
  DATABASE_URL: z.string().optional(),
  SQLITE_PATH: z.string().optional(),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().positive().default(2525),
  MAIL_FROM: z.string().default('Crossfault <no-reply@crossfault.local>'),
  STORAGE_DRIVER: z.enum(['disk', 's3']).default('disk'),
  STORAGE_DIR: z.string().default('data/uploads'),
});

export type Env = z.infer<typeof schema> & { NEXTAUTH_SECRET: string };

export class ConfigurationError extends Error {}

/**
 * Reads and checks the environment. In production a real NEXTAUTH_SECRET (32+ characters,
 * not the development fallback) is required: sessions signed with a known key can be forged.
 */
export function readEnv(source: Record<string, string | undefined> = process.env): Env {
  const parsed = schema.safeParse(source);
  if (!parsed.success) {
    const issues = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ');
    throw new ConfigurationError(`Invalid environment: ${issues}`);
  }
  const env = parsed.data;
  const secret = env.NEXTAUTH_SECRET;
  // `next build` loads server modules with NODE_ENV=production but serves nothing; the check
  // applies when the server starts (instrumentation.ts) and on every request after.
  const building = source.NEXT_PHASE === 'phase-production-build';
  if (env.NODE_ENV === 'production' && !building) {
    if (!secret || secret === DEV_SECRET || secret.length < 32) {
      throw new ConfigurationError(
        'NEXTAUTH_SECRET must be set to a random string of at least 32 characters in production ' +
          '(for example: openssl rand -base64 32). Refusing to start.',
      );
    }
  }
  return { ...env, NEXTAUTH_SECRET: secret ?? DEV_SECRET };
}

let cached: Env | undefined;
export function env(): Env {
  cached ??= readEnv();
  return cached;
}
