import { z } from 'zod';

/** Configuration, parsed once at start-up. A missing or malformed value stops the process with a
 * message naming it. Every variable and its default is listed in README.md. */
const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  DATABASE_URL: z.string().url().default('postgres://postgres@127.0.0.1:54329/compline'),
  APP_ORIGIN: z.string().url().optional(),
  DATA_DIR: z.string().default('.data'),
  SMTP_URL: z.string().url().optional(),
  MAIL_FROM: z.string().default('Compline <no-reply@compline.invalid>'),
  MAP_STYLE_URL: z.string().url().optional(),
  SESSION_DAYS: z.coerce.number().int().min(1).max(90).default(14),
  SIGN_IN_MAX_FAILURES: z.coerce.number().int().min(1).default(5),
  /** Where photos live: the data folder (disk) or S3-compatible object storage (s3). */
  PHOTO_STORAGE: z.enum(['disk', 's3']).default('disk'),
  S3_BUCKET: z.string().min(1).optional(),
  S3_REGION: z.string().min(1).default('us-east-1'),
  S3_ENDPOINT: z.string().url().optional(),
  S3_ACCESS_KEY_ID: z.string().min(1).optional(),
  S3_SECRET_ACCESS_KEY: z.string().min(1).optional(),
  /** Unset: the server starts the local fake payments API and uses it. */
  PAYMENTS_SECRET_KEY: z.string().min(1).optional(),
  PAYMENTS_WEBHOOK_SECRET: z.string().min(1).optional(),
  /** Where the payments SDK sends its requests (host, port and protocol); unset: the provider's own. */
  PAYMENTS_API_URL: z.string().url().optional(),
}).refine((e) => e.PHOTO_STORAGE !== 's3' || (e.S3_BUCKET && e.S3_ACCESS_KEY_ID && e.S3_SECRET_ACCESS_KEY), {
  path: ['S3_BUCKET'],
  message: 'PHOTO_STORAGE=s3 needs S3_BUCKET, S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY',
}).refine((e) => !e.PAYMENTS_SECRET_KEY || e.PAYMENTS_WEBHOOK_SECRET, {
  path: ['PAYMENTS_WEBHOOK_SECRET'],
  message: 'required when PAYMENTS_SECRET_KEY is set (webhooks are verified with it)',
});

export type Env = z.infer<typeof envSchema>;

function parseEnv(): Env {
  const parsed = envSchema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    console.error(`Compline cannot start: bad configuration\n${lines.join('\n')}`);
    process.exit(1);
  }
  return parsed.data;
}

export const env = parseEnv();
