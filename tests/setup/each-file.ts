// Runs before each test file: a fresh database cloned from the migrated template, a bucket of
// its own in the S3 fake, and the environment the app reads, set before any app module is imported.
import { randomBytes } from "node:crypto";
import pg from "pg";
import { afterAll, inject } from "vitest";

const dbName = `test_${randomBytes(6).toString("hex")}`;
const adminUrl = inject("postgresUrl");

const admin = new pg.Client({ connectionString: adminUrl });
await admin.connect();
await admin.query(`CREATE DATABASE ${dbName} TEMPLATE ${inject("templateDb")}`);
await admin.end();

// s3rver takes unsigned requests: a plain PUT makes the bucket without loading the AWS SDK in
// every file (most never store a file).
const s3Env = { ...inject("s3Env"), S3_BUCKET: `files-${dbName.replace(/_/g, "-")}` };
const bucket = await fetch(`${s3Env.S3_ENDPOINT}/${s3Env.S3_BUCKET}`, { method: "PUT" });
if (!bucket.ok) throw new Error(`The S3 fake did not create ${s3Env.S3_BUCKET}: ${bucket.status} ${await bucket.text()}`);

const url = new URL(adminUrl);
url.pathname = `/${dbName}`;
Object.assign(process.env, {
  NODE_ENV: "test",
  DATABASE_URL: url.toString(),
  SESSION_SECRET: "test-secret-that-is-long-enough-for-signing-cookies",
  APP_URL: "http://127.0.0.1:3000",
  SMTP_HOST: "127.0.0.1",
  SMTP_PORT: String(inject("smtpPort")),
  MAILDEV_URL: inject("maildevUrl"),
  BCRYPT_COST: "10",
  STRIPE_SECRET_KEY: "sk_test_tenderflowTests",
  STRIPE_WEBHOOK_SECRET: inject("stripeWebhookSecret"),
  STRIPE_API_URL: inject("stripeUrl"),
  ...s3Env,
});

afterAll(async () => {
  // Forks reuse a process across files: drop this file's pool so the next file gets its own.
  const holder = globalThis as unknown as { __tenderflowDb?: { close(): Promise<void> } };
  await holder.__tenderflowDb?.close();
  delete holder.__tenderflowDb;
  const cleanup = new pg.Client({ connectionString: adminUrl });
  await cleanup.connect();
  await cleanup.query(`DROP DATABASE IF EXISTS ${dbName} WITH (FORCE)`);
  await cleanup.end();
});
