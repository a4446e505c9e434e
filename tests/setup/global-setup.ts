// Starts what every test file shares: a throwaway PostgreSQL cluster with a migrated template
// database (each file clones its own database from it), a maildev inbox, the Stripe fake
// (for API calls; a file that needs webhooks delivered starts its own fake pointed at its app)
// and an S3 fake for uploaded files (each file makes its own bucket in it).
import { execFileSync } from "node:child_process";
import { existsSync, mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { MailDev } from "maildev";
import pg from "pg";
import { Sequelize } from "sequelize";
import type { TestProject } from "vitest/node";
import { freePort, removeCluster, startCluster, stopCluster } from "../../db/cluster";
import { migrator } from "../../db/migrator";
import { startS3Fake, type S3FakeEnv } from "../../fakes/s3";
import { startStripeFake } from "../../fakes/stripe";

export const TEMPLATE_DB = "tenderflow_template";

declare module "vitest" {
  export interface ProvidedContext {
    postgresUrl: string;
    templateDb: string;
    smtpPort: number;
    maildevUrl: string;
    stripeUrl: string;
    stripeWebhookSecret: string;
    /** The S3 fake's settings; S3_BUCKET is each file's own. */
    s3Env: S3FakeEnv;
    /** Where browser tests build the app, once per run (built by the first that needs it). */
    buildDir: string;
  }
}

const CHROMIUM = "/usr/bin/chromium";

/** Browser tests drive Debian's chromium (never a browser download); installed here when missing. */
function ensureChromium() {
  if (existsSync(CHROMIUM)) return;
  if (process.getuid?.() !== 0) {
    console.warn("Browser tests need Debian's chromium: sudo apt-get install -y chromium");
    return;
  }
  console.log("Installing Debian's chromium for the browser tests (apt-get install -y chromium)…");
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  execFileSync("apt-get", ["update", "-qq"], { stdio: "inherit", env });
  execFileSync("apt-get", ["install", "-y", "-qq", "chromium"], { stdio: "inherit", env });
}

export default async function setup(project: TestProject) {
  ensureChromium();
  const root = mkdtempSync(path.join(os.tmpdir(), "tenderflow-test-"));
  // PostgreSQL (running as the postgres user) must be able to enter the folder.
  await import("node:fs").then((fs) => fs.chmodSync(root, 0o755));
  const cluster = startCluster({ dataDir: path.join(root, "pg"), port: await freePort(), ephemeral: true });

  const admin = new pg.Client({ connectionString: cluster.url() });
  await admin.connect();
  await admin.query(`CREATE DATABASE ${TEMPLATE_DB}`);
  await admin.end();
  const sequelize = new Sequelize(cluster.url(TEMPLATE_DB), { dialect: "postgres", dialectModule: pg, logging: false });
  await migrator(sequelize).up();
  await sequelize.close();

  const smtpPort = await freePort();
  const webPort = await freePort();
  const maildev = new MailDev({
    smtp: smtpPort,
    ip: "127.0.0.1",
    web: webPort,
    webIp: "127.0.0.1",
    mailDirectory: path.join(root, "mail"),
    silent: true,
  } as ConstructorParameters<typeof MailDev>[0]);
  await maildev.start();

  const stripeWebhookSecret = "whsec_tenderflowTests";
  const stripe = await startStripeFake({ webhookSecret: stripeWebhookSecret });
  const s3 = await startS3Fake({ directory: path.join(root, "s3"), bucket: "tenderflow-tests" });

  project.provide("stripeUrl", stripe.url);
  project.provide("stripeWebhookSecret", stripeWebhookSecret);
  project.provide("s3Env", s3.env);
  // Inside the project (git-ignored build/), so the server build resolves node_modules.
  const buildDir = path.resolve("build", `test-${path.basename(root)}`);
  project.provide("buildDir", buildDir);
  project.provide("postgresUrl", cluster.url());
  project.provide("templateDb", TEMPLATE_DB);
  project.provide("smtpPort", smtpPort);
  project.provide("maildevUrl", `http://127.0.0.1:${webPort}`);

  return async () => {
    await stripe.close();
    await s3.close();
    await maildev.stop();
    stopCluster(cluster, "immediate");
    removeCluster(cluster);
    rmSync(root, { recursive: true, force: true });
    rmSync(buildDir, { recursive: true, force: true });
  };
}
