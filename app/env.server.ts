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
  /** Folder for uploaded drawings and photos (local-disk storage); relative to the working directory. */
  UPLOAD_DIR: z.string().min(1).default(".data/uploads"),
  /** Stripe: a test or live secret key and the webhook endpoint's signing secret. */
  STRIPE_SECRET_KEY: z.string().regex(/^(sk|rk)_(test|live)_\w+$/, "must be a Stripe secret key (sk_test_…)"),
  STRIPE_WEBHOOK_SECRET: z.string().regex(/^whsec_\w+$/, "must be a Stripe webhook signing secret (whsec_…)"),
  /** Only for a local stand-in, e.g. http://127.0.0.1:12111; unset means Stripe itself. */
  STRIPE_API_URL: z.url().optional(),
});

export type Env = z.infer<typeof envSchema>;

let cached: Env | undefined;

export function env(): Env {
  if (cached) return cached;
  const parsed = envSchema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Tenderflow cannot start: the environment is incomplete.\n${lines.join("\n")}`);
  }
  cached = parsed.data;
  return cached;
}
