// `npm run bench`: how fast the engine sizes designs, what the sizing API adds over a bare
// JSON route on the same server, how throughput grows from one server worker to one per core,
// every main page under 50 concurrent users before and after the speed-ups (pages.ts), and how
// the open-specs table's queries fare at 100 000 specs.
// Prints figures and ratios measured in this run; asserts nothing (targets belong here, not in
// timed tests that fail on a slow machine).
import http from "node:http";
import os from "node:os";
import { freePort } from "../../db/cluster";
import { run, serveBuild, stop } from "../../fakes/processes";
import { REQUESTS } from "./mix";
import { bundle } from "./bundle";
import { pages } from "./pages";
import { withBenchStack } from "./stack";

async function engine() {
  console.log("\n== Sizing engine (one core, in process) ==");
  await run("node_modules/.bin/tsx", ["tests/bench/engine.bench.ts"]);
}

function percentile(sorted: number[], p: number) {
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
}

/** Sends one request on a kept-alive connection and reads its body as sent: compressed bytes are
 * not decoded (a browser decodes natively; fetch's streamed gunzip took 3 ms of a 45 kB design). */
function sendRaw(url: string, init: { method?: string; body?: string } = {}): Promise<number> {
  return new Promise((resolve, reject) => {
    const headers = { "Accept-Encoding": "gzip, deflate", ...(init.body ? { "Content-Type": "application/json" } : {}) };
    const request = http.request(url, { method: init.method ?? "GET", agent: keptAlive, headers }, (response) => {
      response.on("data", () => {});
      response.on("end", () => resolve(response.statusCode ?? 0));
    });
    request.on("error", reject);
    request.end(init.body);
  });
}
const keptAlive = new http.Agent({ keepAlive: true, maxSockets: 1 });

/**
 * Times each labelled request `count` times, one of each in turn, so a change in the machine's
 * load (other work on a shared machine) falls on all of them alike; prints p50 and p95 of each.
 */
async function timeInTurn(count: number, requests: Record<string, { send: (i: number) => Promise<number>; status: number }>) {
  const times: Record<string, number[]> = Object.fromEntries(Object.keys(requests).map((label) => [label, []]));
  for (let i = -30; i < count; i++) {
    for (const [label, { send, status }] of Object.entries(requests)) {
      const start = performance.now();
      const got = await send(i + 30);
      if (got !== status) throw new Error(`${label}: status ${got}, expected ${status}`);
      if (i >= 0) times[label].push(performance.now() - start); // the first 30 rounds warm up
    }
  }
  const p50: Record<string, number> = {};
  for (const [label, list] of Object.entries(times)) {
    list.sort((a, b) => a - b);
    p50[label] = percentile(list, 50);
    console.log(`${label.padEnd(48)} p50 ${p50[label].toFixed(2)} ms   p95 ${percentile(list, 95).toFixed(2)} ms`);
  }
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
async function workers(env: NodeJS.ProcessEnv, buildDir: string) {
  const cores = os.availableParallelism();
  console.log(`\n== One worker vs one per core (${cores}), 50 concurrent clients, 5 s per route ==`);
  const paths = ["/api/v1/health", "/quick-sizing"];
  const results: Record<string, Record<number, { perSecond: number; p975: number }>> = {};
  for (const count of [1, cores]) {
    const port = await freePort();
    const server = await serveBuild(port, { ...env, WEB_CONCURRENCY: String(count) }, () => {}, buildDir);
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
  await withBenchStack({ demo: false }, async ({ env, buildDir }) => {
    // The sequential figures compare routes within one process.
    const port = await freePort();
    const server = await serveBuild(port, { ...env, WEB_CONCURRENCY: "1" }, () => {}, buildDir);
    try {
      const base = `http://127.0.0.1:${port}`;
      const design = (i: number) => JSON.stringify(REQUESTS[i % REQUESTS.length]);
      const post = (body: string) => ({ method: "POST", body });
      const p50 = await timeInTurn(400, {
        "GET /api/v1/health": { send: () => sendRaw(`${base}/api/v1/health`), status: 200 },
        "POST /api/v1/sizing": { send: (i) => sendRaw(`${base}/api/v1/sizing`, post(design(i))), status: 200 },
        // The same path up to the engine (bounds, origin, rate limit, body read), refused there.
        "POST /api/v1/sizing, refused before the engine": { send: () => sendRaw(`${base}/api/v1/sizing`, post("{}")), status: 400 },
        // As Node's fetch sees it: its own gunzip of the design counted too.
        "POST /api/v1/sizing with fetch's decoding": {
          send: async (i) => {
            const response = await fetch(`${base}/api/v1/sizing`, { ...post(design(i)), headers: { "Content-Type": "application/json" } });
            await response.arrayBuffer();
            return response.status;
          },
          status: 200,
        },
      });
      const bare = p50["GET /api/v1/health"];
      console.log(`ratio sizing / bare (p50): ${(p50["POST /api/v1/sizing"] / bare).toFixed(2)}×`);
      console.log(`ratio refused before the engine / bare (p50): ${(p50["POST /api/v1/sizing, refused before the engine"] / bare).toFixed(2)}×`);
    } finally {
      await stop(server);
    }
    await workers(env, buildDir);
  });
}

// `npm run bench -- api` runs only the named sections (engine, api, pages, bundle, open-specs); none runs all.
const SECTIONS = { engine, api, pages, bundle, "open-specs": openSpecs } as const;
const asked = process.argv.slice(2).filter((name): name is keyof typeof SECTIONS => name in SECTIONS);
for (const [name, section] of Object.entries(SECTIONS)) if (asked.length === 0 || asked.includes(name as keyof typeof SECTIONS)) await section();
