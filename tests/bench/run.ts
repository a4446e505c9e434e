// `npm run bench`: how fast the engine sizes designs, what the sizing API adds over a bare
// JSON route on the same server, how throughput grows from one server worker to one per core,
// and how the open-specs table's queries fare at 100 000 specs.
// Prints figures and ratios measured in this run; asserts nothing (targets belong here, not in
// timed tests that fail on a slow machine).
import { mkdtempSync, rmSync, chmodSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import pg from "pg";
import { Sequelize } from "sequelize";
import { freePort, removeCluster, startCluster, stopCluster } from "../../db/cluster";
import { migrator } from "../../db/migrator";
import { run, serveBuild, stop } from "../../fakes/processes";
import { REQUESTS } from "./mix";

async function engine() {
  console.log("\n== Sizing engine (one core, in process) ==");
  await run("node_modules/.bin/tsx", ["tests/bench/engine.bench.ts"]);
}

function percentile(sorted: number[], p: number) {
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
}

async function timeRequests(label: string, count: number, send: (i: number) => Promise<Response>) {
  for (let i = 0; i < 30; i++) await (await send(i)).arrayBuffer(); // warm-up
  const times: number[] = [];
  for (let i = 0; i < count; i++) {
    const start = performance.now();
    const response = await send(i);
    await response.arrayBuffer();
    if (!response.ok) throw new Error(`${label}: status ${response.status}`);
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  const p50 = percentile(times, 50);
  console.log(`${label.padEnd(28)} p50 ${p50.toFixed(2)} ms   p95 ${percentile(times, 95).toFixed(2)} ms   (${count} sequential requests)`);
  return p50;
}

/** Requests/s and p97.5 with `concurrency` clients sending back to back for `seconds`. */
async function underLoad(url: string, concurrency: number, seconds: number) {
  const times: number[] = [];
  const until = performance.now() + seconds * 1000;
  const client = async () => {
    while (performance.now() < until) {
      const start = performance.now();
      const response = await fetch(url);
      await response.arrayBuffer();
      if (!response.ok) throw new Error(`${url}: status ${response.status}`);
      times.push(performance.now() - start);
    }
  };
  await Promise.all(Array.from({ length: concurrency }, client));
  times.sort((a, b) => a - b);
  return { perSecond: times.length / seconds, p975: percentile(times, 97.5) };
}

/** The same pages served by one worker and by one per core, under the same load. */
async function workers(env: NodeJS.ProcessEnv) {
  const cores = os.availableParallelism();
  console.log(`\n== One worker vs one per core (${cores}), 50 concurrent clients, 5 s per route ==`);
  const paths = ["/api/v1/health", "/quick-sizing"];
  const results: Record<string, Record<number, { perSecond: number; p975: number }>> = {};
  for (const count of [1, cores]) {
    const port = await freePort();
    const server = await serveBuild(port, { ...env, WEB_CONCURRENCY: String(count) });
    try {
      for (const p of paths) {
        await underLoad(`http://127.0.0.1:${port}${p}`, 10, 1); // warm-up
        (results[p] ??= {})[count] = await underLoad(`http://127.0.0.1:${port}${p}`, 50, 5);
      }
    } finally {
      await stop(server);
    }
  }
  for (const p of paths) {
    const [one, all] = [results[p][1], results[p][cores]];
    console.log(
      `${p.padEnd(20)} 1 worker ${one.perSecond.toFixed(0).padStart(5)}/s p97.5 ${one.p975.toFixed(0).padStart(5)} ms   ` +
        `${cores} workers ${all.perSecond.toFixed(0).padStart(5)}/s p97.5 ${all.p975.toFixed(0).padStart(5)} ms   throughput ×${(all.perSecond / one.perSecond).toFixed(2)}`,
    );
  }
}

async function openSpecs() {
  console.log("\n== Open-specs table at 100 000 specs (indexes vs a sequential-scan baseline) ==");
  await run("node_modules/.bin/tsx", ["tests/bench/open-specs.bench.ts"]);
}

async function api() {
  console.log("\n== Sizing API vs a bare JSON route (same server, loopback) ==");
  const root = mkdtempSync(path.join(os.tmpdir(), "tenderflow-bench-"));
  chmodSync(root, 0o755);
  const cluster = startCluster({ dataDir: path.join(root, "pg"), port: await freePort(), ephemeral: true });
  let server: Awaited<ReturnType<typeof serveBuild>> | undefined;
  try {
    const admin = new pg.Client({ connectionString: cluster.url() });
    await admin.connect();
    await admin.query("CREATE DATABASE bench");
    await admin.end();
    const db = new Sequelize(cluster.url("bench"), { dialect: "postgres", dialectModule: pg, logging: false });
    await migrator(db).up();
    await db.close();

    await run("node_modules/.bin/react-router", ["build"], process.env, true);
    const port = await freePort();
    const env = {
      ...process.env,
      DATABASE_URL: cluster.url("bench"),
      SESSION_SECRET: "benchmark-secret-benchmark-secret-0123",
      SIZING_REQUESTS_PER_MINUTE: "1000000",
      // Required at boot; the sizing routes never call the card service.
      STRIPE_SECRET_KEY: "sk_test_benchmark",
      STRIPE_WEBHOOK_SECRET: "whsec_benchmark",
    };
    // The sequential figures compare routes within one process.
    server = await serveBuild(port, { ...env, WEB_CONCURRENCY: "1" });
    const base = `http://127.0.0.1:${port}`;
    const count = 400;
    const bare = await timeRequests("GET /api/v1/health", count, () => fetch(`${base}/api/v1/health`));
    const sized = await timeRequests("POST /api/v1/sizing", count, (i) =>
      fetch(`${base}/api/v1/sizing`, {
        method: "POST",
        headers: { "Content-Type": "application/json" },
        body: JSON.stringify(REQUESTS[i % REQUESTS.length]),
      }),
    );
    console.log(`ratio sizing / bare (p50): ${(sized / bare).toFixed(2)}×`);
    await stop(server);
    server = undefined;
    await workers(env);
  } finally {
    await stop(server);
    stopCluster(cluster, "immediate");
    removeCluster(cluster);
    rmSync(root, { recursive: true, force: true });
  }
}

// `npm run bench -- api` runs only the named sections (engine, api, open-specs); none runs all.
const SECTIONS = { engine, api, "open-specs": openSpecs } as const;
const asked = process.argv.slice(2).filter((name): name is keyof typeof SECTIONS => name in SECTIONS);
for (const [name, section] of Object.entries(SECTIONS)) if (asked.length === 0 || asked.includes(name as keyof typeof SECTIONS)) await section();
