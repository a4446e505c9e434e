// `npm run bench -- pages`: every main page under 50 concurrent users (autocannon on loopback,
// the demo scenario, signed in with real session cookies), served twice in the same run:
// "before" with the switchable improvements off (one worker, no render cache) and "after" as
// `npm start` serves, beside issue 16's figures from before the rest of the work (the SVG cycle
// chart, the folded detail, the split script cannot be switched off). Prints requests/s, p97.5,
// p97.5 ÷ the bare JSON route's, and the server's CPU time per view (from /proc: the figure that
// moves least when other work shares the machine); asserts nothing.
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import os from "node:os";
import autocannon from "autocannon";
import { QueryTypes, type Sequelize } from "sequelize";
import { freePort } from "../../db/cluster";
import { DEMO_PASSWORD } from "../../db/seeds/demo";
import { serveBuild, stop } from "../../fakes/processes";
import { withBenchStack } from "./stack";

const CONNECTIONS = 50;
const SECONDS = 7;
const WARM_UP_SECONDS = 3;

type Role = "buyer" | "shop" | null;
interface BenchRoute {
  label: string;
  path: string;
  as: Role;
  /** Issue 16's figures, measured before this work in another run: requests/s and p97.5 ÷ bare. */
  issue: string;
}

const BUYER = "priya@kestrel-forming.test";
const SHOP = "aled@ironbridge-fluid.test";

/** The demo records the pages show: the buyer's panel press (one axis, bids on it) and a job of the shop's. */
export async function benchRoutes(db: Sequelize): Promise<BenchRoute[]> {
  const one = async (sql: string, replacements: Record<string, string>) => {
    const [row] = await db.query<{ id: string }>(sql, { replacements, type: QueryTypes.SELECT });
    if (!row) throw new Error(`The demo data has no row for: ${sql}`);
    return row.id;
  };
  const specId = await one(
    `SELECT s.id FROM specs s JOIN users u ON u.organisation_id = s.organisation_id
      WHERE u.email = :email AND s.status = 'open'
      ORDER BY (SELECT count(*) FROM bids b WHERE b.spec_id = s.id AND b.status = 'submitted') DESC, s.id LIMIT 1`,
    { email: BUYER },
  );
  const jobId = await one(`SELECT j.id FROM jobs j JOIN users u ON u.organisation_id = j.shop_organisation_id WHERE u.email = :email ORDER BY j.id LIMIT 1`, {
    email: SHOP,
  });
  return [
    { label: "bare JSON route", path: "/api/v1/health", as: null, issue: "650–900/s 1×" },
    { label: "quick sizing (anonymous)", path: "/quick-sizing", as: null, issue: "23–24/s 36–45×" },
    { label: "a spec with its design (buyer)", path: `/specs/${specId}`, as: "buyer", issue: "18/s 23–41×" },
    { label: "the bid comparison", path: `/specs/${specId}/bids`, as: "buyer", issue: "40–47/s 13–16×" },
    { label: "the buyer's list of specs", path: "/specs", as: "buyer", issue: "71–75/s 15–28×" },
    { label: "open specs (shop)", path: "/open-specs", as: "shop", issue: "79–86/s 8.5–11×" },
    { label: "jobs dashboard (shop)", path: "/jobs", as: "shop", issue: "35–48/s 10–20×" },
    { label: "a job (shop)", path: `/jobs/${jobId}`, as: "shop", issue: "35–48/s 10–20×" },
    { label: "the bill workbook (buyer)", path: `/specs/${specId}/bill.xlsx`, as: "buyer", issue: "18–19/s 22–36×" },
  ];
}

/** A real session: the sign-in form posted as a browser posts it, its cookie kept. */
async function signIn(base: string, email: string): Promise<string> {
  const response = await fetch(`${base}/sign-in`, {
    method: "POST",
    redirect: "manual",
    headers: { "Content-Type": "application/x-www-form-urlencoded", Origin: base },
    body: new URLSearchParams({ email, password: DEMO_PASSWORD }),
  });
  const cookie = response.headers.get("set-cookie")?.split(";")[0];
  if (response.status !== 302 || !cookie) throw new Error(`Signing in as ${email}: status ${response.status}`);
  return cookie;
}

interface Figures {
  perSecond: number;
  p975: number;
  failed: number;
  /** Server CPU time per request, ms (the primary and its workers). */
  cpuPerView: number;
}

const TICKS_PER_SECOND = Number(execFileSync("getconf", ["CLK_TCK"]).toString().trim()) || 100;

/** CPU time (ms) the server has used so far: the process `serveBuild` started and its workers (Linux /proc). */
function serverCpuMs(primary: number): number {
  let children: number[] = [];
  try {
    children = execFileSync("pgrep", ["-P", String(primary)])
      .toString()
      .trim()
      .split("\n")
      .map(Number);
  } catch {
    // pgrep exits 1 when there are none: one worker serves in the primary itself.
  }
  let ticks = 0;
  for (const pid of [primary, ...children]) {
    // Fields after the command's closing parenthesis: utime and stime are the 12th and 13th.
    const fields = readFileSync(`/proc/${pid}/stat`, "utf8").split(") ")[1].split(" ");
    ticks += Number(fields[11]) + Number(fields[12]);
  }
  return (ticks * 1000) / TICKS_PER_SECOND;
}

function load(url: string, cookie: string | undefined, seconds: number, server: number): Promise<Figures> {
  const cpuBefore = serverCpuMs(server);
  return new Promise((resolve, reject) => {
    autocannon({ url, connections: CONNECTIONS, duration: seconds, headers: cookie ? { cookie } : {} }, (error, result) => {
      if (error) return reject(error);
      resolve({
        perSecond: result.requests.average,
        p975: result.latency.p97_5,
        failed: result.non2xx + result.errors + result.timeouts,
        cpuPerView: (serverCpuMs(server) - cpuBefore) / Math.max(1, result.requests.total),
      });
    });
  });
}

/** One server's figures for every route, each route warmed up for a second first. */
export async function measure(env: NodeJS.ProcessEnv, buildDir: string, routes: BenchRoute[]) {
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const server = await serveBuild(port, { ...env, APP_URL: base }, () => {}, buildDir);
  try {
    const cookies: Record<string, string> = { buyer: await signIn(base, BUYER), shop: await signIn(base, SHOP) };
    const figures = new Map<string, Figures>();
    for (const route of routes) {
      const cookie = route.as ? cookies[route.as] : undefined;
      // Warmed up until the JIT has compiled the route's code: a cold first second queues 50 users
      // behind unoptimised renders and would show in p97.5 as a start-up cost, not a steady one.
      await load(base + route.path, cookie, WARM_UP_SECONDS, server.pid!);
      figures.set(route.path, await load(base + route.path, cookie, SECONDS, server.pid!));
    }
    return figures;
  } finally {
    await stop(server);
  }
}

const cell = (f: Figures, bare: Figures) =>
  `${f.perSecond.toFixed(0).padStart(6)}/s ${(f.p975 / 1000).toFixed(2).padStart(6)} s ${`${(f.p975 / bare.p975).toFixed(1)}×`.padStart(7)} ${f.cpuPerView.toFixed(1).padStart(5)} ms${f.failed ? ` (${f.failed} failed)` : ""}`;

export async function pages() {
  const cores = os.availableParallelism();
  console.log(`\n== Pages under ${CONNECTIONS} concurrent users, ${SECONDS} s per route (demo data, loopback) ==`);
  console.log(`before: WEB_CONCURRENCY=1 RENDER_CACHE=off; after: one worker per core (${cores}), render cache on`);
  await withBenchStack({ demo: true }, async ({ env, buildDir, db }) => {
    const routes = await benchRoutes(db);
    const before = await measure({ ...env, WEB_CONCURRENCY: "1", RENDER_CACHE: "off" }, buildDir, routes);
    const after = await measure({ ...env, WEB_CONCURRENCY: String(cores), RENDER_CACHE: "on" }, buildDir, routes);
    const [bareBefore, bareAfter] = [before.get(routes[0].path)!, after.get(routes[0].path)!];
    console.log(
      `${"route".padEnd(32)} ${"before: req/s  p97.5  ÷bare  CPU/view".padEnd(39)} ${"after: req/s  p97.5  ÷bare  CPU/view".padEnd(39)} issue 16 (before this work)`,
    );
    for (const route of routes) {
      console.log(
        `${route.label.padEnd(32)} ${cell(before.get(route.path)!, bareBefore).padEnd(39)} ${cell(after.get(route.path)!, bareAfter).padEnd(39)} ${route.issue}`,
      );
    }
    // With every user waiting in turn, a view's latency is about users × CPU per view ÷ cores: the
    // CPU a page may spend and still answer within 5× the bare route's p97.5 at this load.
    const budget = (5 * bareAfter.p975 * cores) / CONNECTIONS;
    console.log(`5× the bare route's p97.5 at ${CONNECTIONS} users on ${cores} cores leaves a page about ${budget.toFixed(1)} ms of server CPU per view.`);
  });
}
