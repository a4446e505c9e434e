// The throwaway stack a server bench runs against: its own PostgreSQL cluster on a free port,
// migrated (and, when asked, holding the demo scenario), and a production build in its own
// folder, so a bench never touches `npm start`'s data or build.
import { chmodSync, mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import pg from "pg";
import { Sequelize } from "sequelize";
import { freePort, removeCluster, startCluster, stopCluster } from "../../db/cluster";
import { migrator } from "../../db/migrator";
import { seedDemo } from "../../db/seeds/demo";
import { run } from "../../fakes/processes";

export const BENCH_BUILD_DIR = "build/bench";

export interface BenchStack {
  /** The environment a served build needs, pointing at this stack's database. */
  env: NodeJS.ProcessEnv;
  buildDir: string;
  db: Sequelize;
}

/** Builds the app once into build/bench (production React, as users get it). */
export async function buildForBench() {
  await run("node_modules/.bin/react-router", ["build"], { ...process.env, NODE_ENV: "production", TENDERFLOW_BUILD_DIR: BENCH_BUILD_DIR }, true);
  return BENCH_BUILD_DIR;
}

export async function withBenchStack<T>({ demo }: { demo: boolean }, measure: (stack: BenchStack) => Promise<T>): Promise<T> {
  const root = mkdtempSync(path.join(os.tmpdir(), "tenderflow-bench-"));
  chmodSync(root, 0o755);
  const cluster = startCluster({ dataDir: path.join(root, "pg"), port: await freePort(), ephemeral: true });
  let db: Sequelize | undefined;
  try {
    const admin = new pg.Client({ connectionString: cluster.url() });
    await admin.connect();
    await admin.query("CREATE DATABASE bench");
    await admin.end();
    db = new Sequelize(cluster.url("bench"), { dialect: "postgres", dialectModule: pg, logging: false });
    await migrator(db).up();
    if (demo) await seedDemo(db);
    const buildDir = await buildForBench();
    const env: NodeJS.ProcessEnv = {
      ...process.env,
      DATABASE_URL: cluster.url("bench"),
      SESSION_SECRET: "benchmark-secret-benchmark-secret-0123",
      SIZING_REQUESTS_PER_MINUTE: "1000000",
      // Required at boot; no benched route calls the card service or stores a file.
      S3_BUCKET: "tenderflow-bench",
      STRIPE_SECRET_KEY: "sk_test_benchmark",
      STRIPE_WEBHOOK_SECRET: "whsec_benchmark",
    };
    return await measure({ env, buildDir, db });
  } finally {
    await db?.close();
    stopCluster(cluster, "immediate");
    removeCluster(cluster);
    rmSync(root, { recursive: true, force: true });
  }
}
