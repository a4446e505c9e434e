// The production HTTP server: serves the client files and hands every other request to the
// React Router build, with the client's address in the request context. Run as
// `node --import tsx app/serve.server.ts build/server/index.js` (`npm run serve`; npm start and
// the tests do the same).
//
// It replaces react-router-serve for two reasons: the rate limits need the client's address,
// which only the socket knows (X-Forwarded-For is believed only from TRUSTED_PROXIES), and
// Ctrl-C must stop it once, cleanly.
//
// One worker process per core (node:cluster; WEB_CONCURRENCY sets another count, 1 serves in
// this process alone): the workers share the port, and nothing in the app lives in one
// process's memory (sessions, rate limits, mail and background jobs are in PostgreSQL, the jobs
// claimed with SKIP LOCKED), so any worker answers any request.
import cluster from "node:cluster";
import { readdirSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { createRequestHandler } from "@react-router/express";
import compression from "compression";
import express from "express";
import morgan from "morgan";
import { RouterContextProvider, type RouterContext, type ServerBuild } from "react-router";

const buildPath = path.resolve(process.argv[2] ?? "build/server/index.js");
const port = Number(process.env.PORT ?? 3000);
const host = process.env.HOST ?? "127.0.0.1";

/**
 * Express's "trust proxy" from TRUSTED_PROXIES: addresses or CIDR ranges of our own load
 * balancers ("loopback", "10.0.0.0/8"), or none. Only hops from these may name the client.
 */
function trustedProxies(value = process.env.TRUSTED_PROXIES?.trim()): string[] | false {
  if (!value) return false;
  return value
    .split(",")
    .map((v) => v.trim())
    .filter(Boolean);
}

/** How many processes serve: WEB_CONCURRENCY when set (at least 1), else one per core. */
function workerCount(value = process.env.WEB_CONCURRENCY?.trim()): number {
  const asked = value ? Number.parseInt(value, 10) : Number.NaN;
  return Number.isInteger(asked) && asked >= 1 ? Math.min(asked, 64) : os.availableParallelism();
}

const workers = workerCount();
if (cluster.isPrimary && workers > 1) {
  superviseWorkers(workers);
} else {
  await serve();
}

/** The primary: starts the workers, replaces one that dies, and stops them all once on a signal. */
function superviseWorkers(count: number) {
  let stopping = false;
  let listening = 0;
  const started = new Set<number>();
  const fork = () => {
    const worker = cluster.fork();
    worker.on("message", (message) => {
      if (message !== "listening") return;
      started.add(worker.id);
      if (++listening === count) console.log(`Tenderflow is listening on http://${host}:${port} (${count} workers)`);
    });
  };
  for (let i = 0; i < count; i++) fork();
  cluster.on("exit", (worker, code, signal) => {
    if (stopping) {
      if (Object.keys(cluster.workers ?? {}).length === 0) process.exit(0);
      return;
    }
    // One that never listened (a broken build, a port in use) would only fail again.
    if (!started.has(worker.id)) {
      console.error(`A worker stopped before it could serve (${signal ?? `exit code ${code}`}); stopping.`);
      process.exit(1);
    }
    console.error(`A worker stopped (${signal ?? `exit code ${code}`}); starting another.`);
    fork();
  });
  const stop = (signal: NodeJS.Signals) => {
    if (stopping) return;
    stopping = true;
    console.log(`${signal}: stopping ${count} workers`);
    for (const worker of Object.values(cluster.workers ?? {})) worker?.process.kill(signal);
    setTimeout(() => process.exit(0), 5_000).unref();
  };
  process.on("SIGINT", () => stop("SIGINT"));
  process.on("SIGTERM", () => stop("SIGTERM"));
}

async function serve() {
  const build = (await import(pathToFileURL(buildPath).href)) as ServerBuild;
  // The context key lives in the build (keys compare by identity), exported by entry.server.
  const clientAddressContext = (build.entry.module as { clientAddressContext?: RouterContext<string | null> }).clientAddressContext;
  if (!clientAddressContext) throw new Error(`${buildPath} does not export clientAddressContext from its entry.server`);

  const app = express();
  app.disable("x-powered-by");
  app.set("trust proxy", trustedProxies());
  app.use(compression());
  const noSniff = (res: express.Response) => res.setHeader("X-Content-Type-Options", "nosniff");
  const clientDir = path.resolve(path.dirname(buildPath), "..", "client");
  // Hashed file names never change, so browsers keep them for a year.
  app.use("/assets", express.static(path.join(clientDir, "assets"), { immutable: true, maxAge: "1y", setHeaders: noSniff }));
  // The rest of public/ (the icon) by name: a static handler asked about every page's path would
  // look for it on disk, and miss, on each request.
  const publicFiles = new Set(
    readdirSync(clientDir)
      .filter((name) => name !== "assets")
      .map((name) => `/${name}`),
  );
  const publicStatic = express.static(clientDir, { maxAge: "1h", setHeaders: noSniff });
  app.use((req, res, next) => (publicFiles.has(req.path.split("/", 2).join("/")) ? publicStatic(req, res, next) : next()));
  app.use(morgan("tiny"));
  app.all(
    "*",
    createRequestHandler({
      build,
      mode: process.env.NODE_ENV,
      getLoadContext(req) {
        const context = new RouterContextProvider();
        context.set(clientAddressContext, req.ip ?? null);
        return context;
      },
    }),
  );

  const server = app.listen(port, host, () => {
    if (cluster.isPrimary) console.log(`Tenderflow is listening on http://${host}:${port}`);
    else process.send?.("listening");
  });

  let stopping = false;
  function stop(signal: string) {
    if (stopping) return;
    stopping = true;
    console.log(`${signal}: stopping the HTTP server`);
    // Running jobs finish, or go back to the queue for another server (pg-boss), before the exit.
    const stopWork = (build.entry.module as { stopBackgroundWork?: () => Promise<void> }).stopBackgroundWork?.().catch((error) => console.error(error));
    server.close(() => void Promise.resolve(stopWork).then(() => process.exit(0)));
    server.closeIdleConnections();
    // Streams still open after a few seconds (a stalled download) do not hold the stop up.
    setTimeout(() => process.exit(0), 3_000).unref();
  }
  process.on("SIGINT", () => stop("SIGINT"));
  process.on("SIGTERM", () => stop("SIGTERM"));
}
