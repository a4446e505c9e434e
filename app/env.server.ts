import { z } from "zod";

// The environment is read once, here, and checked at boot: a missing or malformed setting
// stops the server with a message that names it, instead of failing on the first request.
const envSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  DATABASE_URL: z.string().regex(/^postgres(ql)?:\/\//, "must be a postgres:// URL"),
  SESSION_SECRET: z.string().min(32, "must be at least 32 characters (use a long random string)"),
  APP_URL: z.url().default("http://127.0.0.1:3000"),
  SMTP_HOST: z.string().min(1).default("127.0.0.1"),
  SMTP_PORT: z.coerce.number().int().positive().default(1025),
  SMTP_SECURE: z
    .enum(["true", "false"])
    .default("false")
    .transform((v) => v === "true"),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().min(3).default("Tenderflow <no-reply@tenderflow.test>"),
  BCRYPT_COST: z.coerce.number().int().min(10).max(15).default(10),
  /** A session ends after this long without a request, and in any case this many days after sign-in. */
  SESSION_IDLE_MINUTES: z.coerce
    .number()
    .int()
    .min(5)
    .max(7 * 24 * 60)
    .default(120),
  SESSION_MAX_DAYS: z.coerce.number().int().min(1).max(90).default(14),
  /** Live sizing sends a request per pause in typing; this allows brisk typing, not scraping. */
  SIZING_REQUESTS_PER_MINUTE: z.coerce.number().int().positive().default(240),
  /** Uploaded files live in an S3-compatible object store; unset endpoint means AWS S3 itself. */
  S3_ENDPOINT: z.url().optional(),
  S3_BUCKET: z.string().regex(/^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/, "must be a bucket name: 3 to 63 lower-case letters, digits, dots or hyphens"),
  S3_REGION: z.string().min(1).default("us-east-1"),
  /** Both or neither; without them the AWS SDK finds credentials itself (AWS_* variables, an instance role). */
  S3_ACCESS_KEY_ID: z.string().min(1).optional(),
  S3_SECRET_ACCESS_KEY: z.string().min(1).optional(),
  /** Stripe: a test or live secret key and the webhook endpoint's signing secret. */
  STRIPE_SECRET_KEY: z.string().regex(/^(sk|rk)_(test|live)_\w+$/, "must be a Stripe secret key (sk_test_…)"),
  STRIPE_WEBHOOK_SECRET: z.string().regex(/^whsec_\w+$/, "must be a Stripe webhook signing secret (whsec_…)"),
  /** Only for a local stand-in, e.g. http://127.0.0.1:12111; unset means Stripe itself. */
  STRIPE_API_URL: z.url().optional(),
  /** `on` prints every SQL statement the app sends: what a page asks of the database. */
  LOG_SQL: z.enum(["on", "off"]).default("off"),
});

// Settings that only make sense together.
const checkedEnvSchema = envSchema.refine((e) => !e.S3_ACCESS_KEY_ID === !e.S3_SECRET_ACCESS_KEY, {
  path: ["S3_SECRET_ACCESS_KEY"],
  message: "set both S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY, or neither",
});

export type Env = z.infer<typeof envSchema>;

let cached: Env | undefined;

export function env(): Env {
  if (cached) return cached;
  const parsed = checkedEnvSchema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Tenderflow cannot start: the environment is incomplete.\n${lines.join("\n")}`);
  }
  cached = parsed.data;
  return cached;
}
