// `npm start`: the whole local stack in one command. It starts the project's own PostgreSQL
// cluster (data in .data/), migrates and seeds it, starts maildev for e-mail, the Stripe fake
// for card payments and the S3 fake for uploaded files, builds the app and serves it on
// http://127.0.0.1:3000, then stops everything it started on Ctrl-C.
import { randomBytes } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { MailDev } from "maildev";
import pg from "pg";
import { Sequelize } from "sequelize";
import { clusterDirFor, ensureDatabase, isRunning, startCluster, stopCluster, type Cluster } from "../db/cluster";
import { migrator } from "../db/migrator";
import { DEMO_PASSWORD, DEMO_SIGN_INS, seedDemo } from "../db/seeds/demo";
import { ROLE_LABELS } from "../app/auth/roles";
import { run, serveBuild, stop } from "./processes";
import { startS3Fake } from "./s3";
import { importLocalUploads } from "./s3-import";
import { startStripeFake } from "./stripe";

const root = path.resolve(import.meta.dirname, "..");
const dataDir = path.join(root, ".data");
const APP_PORT = Number(process.env.PORT ?? 3000);
const PG_PORT = Number(process.env.TENDERFLOW_PG_PORT ?? 54329);
const SMTP_PORT = Number(process.env.TENDERFLOW_SMTP_PORT ?? 1025);
const MAIL_WEB_PORT = Number(process.env.TENDERFLOW_MAIL_WEB_PORT ?? 1080);
const STRIPE_PORT = Number(process.env.TENDERFLOW_STRIPE_PORT ?? 12111);
const S3_PORT = Number(process.env.TENDERFLOW_S3_PORT ?? 4569);
const step = (text: string) => console.log(`\n▸ ${text}`);

/** A secret made once per checkout, so sessions survive restarts of the local stack. */
function localSecret(name: string) {
  const file = path.join(dataDir, name);
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString("hex"), { mode: 0o600 });
  return readFileSync(file, "utf8").trim();
}

async function main() {
  mkdirSync(dataDir, { recursive: true });
  let cluster: Cluster | undefined;
  let databaseUrl = process.env.DATABASE_URL;
  if (databaseUrl) {
    step("Using the database in DATABASE_URL");
  } else {
    const { dir: clusterDir, moved, blocked } = clusterDirFor(path.join(dataDir, "postgres"));
    step(`Starting PostgreSQL (project cluster in ${moved ? clusterDir : ".data/postgres"}, 127.0.0.1:${PG_PORT})`);
    if (moved) console.log(`  ${blocked} is closed to other users, so the postgres user keeps this project's cluster in ${clusterDir}.`);
    if (isRunning(clusterDir)) stopCluster({ dataDir: clusterDir }); // left over from an interrupted run
    cluster = startCluster({ dataDir: clusterDir, port: PG_PORT });
    databaseUrl = await ensureDatabase(cluster, "tenderflow", localSecret("db-password"));
  }

  const db = new Sequelize(databaseUrl, { dialect: "postgres", dialectModule: pg, logging: false });
  step("Migrating the database");
  const applied = await migrator(db).up();
  console.log(applied.length ? `  applied ${applied.map((m) => m.name).join(", ")}` : "  schema is up to date");
  const seeded = await seedDemo(db);
  console.log(seeded ? "  demo data loaded" : "  existing data kept");
  // The Stripe fake forgets everything when it stops: paid retainers are put back into it below.
  const [paidRetainers] = await db.query(
    `SELECT p.payment_intent_id, p.amount_cents, p.refunded_cents, p.currency, p.customer_id, p.id, p.job_id
       FROM payments p WHERE p.payment_intent_id IS NOT NULL AND p.status IN ('paid', 'partially_refunded', 'refunded')`,
  );
  await db.close();

  step(`Starting maildev (SMTP 127.0.0.1:${SMTP_PORT}, inbox http://127.0.0.1:${MAIL_WEB_PORT})`);
  const maildev = new MailDev({
    smtp: SMTP_PORT,
    ip: "127.0.0.1",
    web: MAIL_WEB_PORT,
    webIp: "127.0.0.1",
    mailDirectory: path.join(dataDir, "mail"),
    silent: true,
  } as ConstructorParameters<typeof MailDev>[0]);
  await maildev.start();

  const appUrl = process.env.APP_URL ?? `http://127.0.0.1:${APP_PORT}`;
  step(`Starting the Stripe fake (API and payment page http://127.0.0.1:${STRIPE_PORT})`);
  const stripeWebhookSecret = `whsec_${localSecret("stripe-webhook-secret")}`;
  const stripeFake = await startStripeFake({ port: STRIPE_PORT, webhookUrl: `${appUrl}/webhooks/stripe`, webhookSecret: stripeWebhookSecret });
  for (const p of paidRetainers as {
    payment_intent_id: string;
    amount_cents: string;
    refunded_cents: string;
    currency: string;
    customer_id: string | null;
    id: string;
    job_id: string;
  }[]) {
    stripeFake.restorePaid({
      paymentIntentId: p.payment_intent_id,
      amount: Number(p.amount_cents),
      amountRefunded: Number(p.refunded_cents),
      currency: p.currency,
      customer: p.customer_id,
      metadata: { payment_id: p.id, job_id: p.job_id },
    });
  }

  step(`Starting the S3 fake (files in .data/s3, http://127.0.0.1:${S3_PORT}, bucket tenderflow-files)`);
  const s3Fake = await startS3Fake({ port: S3_PORT, directory: path.join(dataDir, "s3"), bucket: "tenderflow-files" });
  const imported = await importLocalUploads(path.join(dataDir, "uploads"), s3Fake.settings);
  if (imported) console.log(`  copied ${imported} files from .data/uploads (kept as .data/uploads-copied-to-s3)`);

  const env = {
    ...process.env,
    ...s3Fake.env,
    NODE_ENV: "production",
    DATABASE_URL: databaseUrl,
    SESSION_SECRET: process.env.SESSION_SECRET ?? localSecret("session-secret"),
    APP_URL: appUrl,
    SMTP_HOST: "127.0.0.1",
    SMTP_PORT: String(SMTP_PORT),
    STRIPE_SECRET_KEY: "sk_test_tenderflowLocal",
    STRIPE_WEBHOOK_SECRET: stripeWebhookSecret,
    STRIPE_API_URL: stripeFake.url,
  };

  step("Building the app");
  await run("node_modules/.bin/react-router", ["build"], env, true);

  step("Serving the app");
  const app = await serveBuild(APP_PORT, env, (line) => process.stdout.write(`  [app] ${line}`));

  console.log(`
Tenderflow is running.

  App            http://127.0.0.1:${APP_PORT}
  Mail inbox     http://127.0.0.1:${MAIL_WEB_PORT}   (every e-mail the app sends lands here)
  Card payments  ${stripeFake.url}  (Stripe fake: card 4242 4242 4242 4242 pays, 4000 0000 0000 0002 is declined)
  Stored files   ${s3Fake.url}  (S3 fake, bucket tenderflow-files; kept in .data/s3)

Demo sign-ins (password for all: ${DEMO_PASSWORD})
${DEMO_SIGN_INS.map((u) => `  ${ROLE_LABELS[u.role].padEnd(18)} ${u.email.padEnd(30)} ${u.name}, ${u.organisation}`).join("\n")}

Press Ctrl-C to stop.`);

  let stopping = false;
  const shutdown = async () => {
    if (stopping) return;
    stopping = true;
    console.log("\nStopping…");
    await stop(app);
    await stripeFake.close();
    await s3Fake.close();
    await maildev.stop();
    if (cluster) stopCluster(cluster);
    process.exit(0);
  };
  process.on("SIGINT", shutdown);
  process.on("SIGTERM", shutdown);
  app.on("exit", (code) => {
    if (!stopping) {
      console.error(`The app server stopped (exit code ${code}).`);
      void shutdown();
    }
  });
}

main().catch((error) => {
  console.error(`\nTenderflow could not start:\n${error instanceof Error ? error.message : error}`);
  process.exit(1);
});
