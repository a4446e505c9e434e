/**
 * The open-specs table at 100 000 specs: `npx tsx tests/bench/open-specs.bench.ts` (also part of
 * `npm run bench`). Fills a throwaway cluster with specs of every status, then times a few
 * typical searches of a shop through the app's own service (count + one page, as the page runs
 * them) and runs each statement under EXPLAIN ANALYZE twice: as planned, and with index and
 * bitmap scans switched off, the sequential-scan baseline measured in the same run. Prints
 * figures, ratios and the indexes each plan used; asserts nothing.
 */
import { chmodSync, mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import pg from "pg";
import { Sequelize } from "sequelize";
import { freePort, removeCluster, startCluster, stopCluster } from "../../db/cluster";
import { migrator } from "../../db/migrator";

const SPECS = 100_000;
const ROUNDS = 7;

const REGIONS = [
  "UK — West Midlands",
  "UK — North West",
  "UK — South East",
  "UK — Yorkshire",
  "Scotland — Central Belt",
  "Wales — South",
  "Ireland — Munster",
  "Ireland — Leinster",
  "Germany — Bavaria",
  "Germany — Saxony",
  "Germany — Lower Saxony",
  "Netherlands — North Brabant",
  "Belgium — Flanders",
  "France — Auvergne-Rhône-Alpes",
  "France — Grand Est",
  "Spain — Basque Country",
  "Italy — Lombardy",
  "Italy — Emilia-Romagna",
  "Austria — Upper Austria",
  "Switzerland — Aargau",
  "Poland — Silesia",
  "Czechia — Moravia",
  "Sweden — Västra Götaland",
  "Norway — Rogaland",
  "Denmark — Jutland",
  "Finland — Pirkanmaa",
  "USA — Ohio",
  "USA — Michigan",
  "Canada — Ontario",
  "Portugal — Norte",
];
const MACHINES = [
  "Panel press",
  "Scissor lift",
  "Tilting deck",
  "Clamp",
  "Feed axis",
  "Coil car",
  "Bending ram",
  "Die cushion",
  "Stacker",
  "Turntable",
  "Baler ram",
  "Log splitter",
];
const PARTS = ["main ram", "return stroke", "left side", "right side", "upper tool", "lower tool", "line 2", "plant B", "retrofit", "prototype"];

const sqlArray = (values: string[]) => `ARRAY[${values.map((v) => `'${v.replace(/'/g, "''")}'`).join(", ")}]`;

/** 100 000 specs over 200 buyers: half open with the deadline ahead, the rest lapsed, drafts, closed and awarded. */
async function fill(client: pg.Client) {
  await client.query("SELECT setseed(0.42)");
  await client.query(`
    INSERT INTO organisations (id, name, kind, region)
    SELECT gen_random_uuid(), 'Bench builder ' || n, 'buyer', (${sqlArray(REGIONS)})[1 + n % ${REGIONS.length}]
    FROM generate_series(1, 200) AS n`);
  // An approved shop: a pending one reads no specs (migration 0011).
  await client.query(
    `INSERT INTO organisations (id, name, kind, region, approval) VALUES (gen_random_uuid(), 'Bench shop', 'shop', 'UK — West Midlands', 'approved')`,
  );
  await client.query(`
    INSERT INTO users (id, organisation_id, email, name, password_hash, role)
    SELECT gen_random_uuid(), o.id, 'user-' || o.id || '@bench.test', 'Bench user', 'x', CASE o.kind WHEN 'shop' THEN 'shop' ELSE 'buyer' END::enum_users_role
    FROM organisations o`);
  await client.query(`
    WITH buyers AS (SELECT o.id AS org, u.id AS author, row_number() OVER (ORDER BY o.name) - 1 AS k
                    FROM organisations o JOIN users u ON u.organisation_id = o.id WHERE o.kind = 'buyer'),
         rows AS (SELECT n, n % 10 AS kind FROM generate_series(1, ${SPECS}) AS n)
    INSERT INTO specs (id, organisation_id, created_by_id, title, status, bid_deadline, retainer_percent, delivery_region,
                       published_at, current_revision, currency, units_wanted, relief_setting_bar, pump_flow_lpm)
    SELECT gen_random_uuid(), b.org, b.author,
           (${sqlArray(MACHINES)})[1 + floor(random() * ${MACHINES.length})::int] || ', ' || (${sqlArray(PARTS)})[1 + floor(random() * ${PARTS.length})::int] || ' ' || r.n,
           (CASE WHEN r.kind < 6 THEN 'open' WHEN r.kind < 8 THEN 'draft' WHEN r.kind = 8 THEN 'closed' ELSE 'awarded' END)::enum_specs_status,
           CASE WHEN r.kind < 5 THEN now() + (1 + floor(random() * 60)) * interval '1 day'
                WHEN r.kind < 6 THEN now() - (1 + floor(random() * 60)) * interval '1 day'
                WHEN r.kind < 8 THEN NULL ELSE now() - (1 + floor(random() * 300)) * interval '1 day' END,
           CASE WHEN r.kind < 6 OR r.kind > 7 THEN 20 END,
           CASE WHEN r.kind < 6 OR r.kind > 7 THEN (${sqlArray(REGIONS)})[1 + floor(random() * ${REGIONS.length})::int] END,
           CASE WHEN r.kind < 6 OR r.kind > 7 THEN now() - floor(random() * 365) * interval '1 day' END,
           CASE WHEN r.kind < 6 OR r.kind > 7 THEN 1 ELSE 0 END,
           'EUR', 1 + floor(random() * 10)::int,
           CASE WHEN r.kind < 6 OR r.kind > 7 THEN 40 + floor(random() * 276) END,
           CASE WHEN r.kind < 6 OR r.kind > 7 THEN round((2 + random() * 298)::numeric, 1) END
    FROM rows r JOIN buyers b ON b.k = r.n % 200`);
  // The shop has a bid on one open spec in fifty.
  await client.query(`
    INSERT INTO bids (id, spec_id, organisation_id, created_by_id, status, spec_revision, currency)
    SELECT gen_random_uuid(), s.id, o.id, u.id, 'submitted', 1, 'EUR'
    FROM specs s, organisations o JOIN users u ON u.organisation_id = o.id
    WHERE o.kind = 'shop' AND s.status = 'open' AND random() < 0.02`);
  await client.query("VACUUM ANALYZE");
  const counts = await client.query(
    "SELECT count(*) FILTER (WHERE status = 'open' AND bid_deadline > now()) AS open, count(*) AS total, (SELECT count(*) FROM bids) AS bids FROM specs",
  );
  return counts.rows[0] as { open: string; total: string; bids: string };
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

/** Execution time of one statement under EXPLAIN ANALYZE (median of rounds), its plan and the indexes it used. */
async function explain(client: pg.Client, sql: string, baseline: boolean) {
  const times: number[] = [];
  let plan: string[] = [];
  await client.query("BEGIN");
  try {
    if (baseline) await client.query("SET LOCAL enable_indexscan = off; SET LOCAL enable_bitmapscan = off; SET LOCAL enable_indexonlyscan = off");
    for (let i = 0; i < ROUNDS; i++) {
      const result = await client.query(`EXPLAIN (ANALYZE, COSTS OFF, TIMING OFF, SUMMARY ON) ${sql}`);
      plan = result.rows.map((r: Record<string, string>) => r["QUERY PLAN"]);
      const line = plan.find((l) => l.startsWith("Execution Time"));
      times.push(Number(line?.match(/([\d.]+) ms/)?.[1] ?? NaN));
    }
  } finally {
    await client.query("ROLLBACK");
  }
  const indexes = [
    ...new Set(plan.flatMap((l) => [...l.matchAll(/(?:Index Scan|Index Only Scan|Bitmap Index Scan)(?: Backward)? (?:using|on) (\w+)/g)].map((m) => m[1]))),
  ];
  return { ms: median(times), plan, indexes };
}

async function main() {
  const root = mkdtempSync(path.join(os.tmpdir(), "tenderflow-bench-"));
  chmodSync(root, 0o755);
  const cluster = startCluster({ dataDir: path.join(root, "pg"), port: await freePort(), ephemeral: true });
  let closeApp: (() => Promise<void>) | undefined;
  try {
    const admin = new pg.Client({ connectionString: cluster.url() });
    await admin.connect();
    await admin.query("CREATE DATABASE bench");
    await admin.end();
    const db = new Sequelize(cluster.url("bench"), { dialect: "postgres", dialectModule: pg, logging: false });
    await migrator(db).up();
    await db.close();

    const client = new pg.Client({ connectionString: cluster.url("bench") });
    await client.connect();
    const fillStart = performance.now();
    const counts = await fill(client);
    console.log(
      `${Number(counts.total).toLocaleString("en-GB")} specs (${Number(counts.open).toLocaleString("en-GB")} open with the deadline ahead), ` +
        `${Number(counts.bids).toLocaleString("en-GB")} bids of the shop; filled and analysed in ${((performance.now() - fillStart) / 1000).toFixed(1)} s`,
    );

    // The app reads its settings once, on first use: set them before its modules load.
    Object.assign(process.env, {
      DATABASE_URL: cluster.url("bench"),
      SESSION_SECRET: "benchmark-secret-benchmark-secret-0123",
      NODE_ENV: "production",
      STRIPE_SECRET_KEY: "sk_test_benchmark",
      STRIPE_WEBHOOK_SECRET: "whsec_benchmark",
    });
    const { sequelize, User } = await import("~/models/index.server");
    const { listOpenSpecsForShop } = await import("~/services/open-specs.server");
    const { readOpenSpecsQuery } = await import("~/schemas/open-specs");
    closeApp = () => sequelize.close();
    const shop = await User.findOne({ where: { role: "shop" }, rejectOnEmpty: true });
    const inDays = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);

    const searches: [string, string][] = [
      ["every open spec, by deadline", ""],
      ["page 40 of every open spec", "page=40"],
      ["region contains 'midlands'", "region=midlands"],
      ["title contains 'press', closing in 14 days", `q=press&deadline=${inDays(14)}`],
      ["150-210 bar and 20-60 L/min, by pressure", "pressureMin=150&pressureMax=210&flowMin=20&flowMax=60&sort=pressure"],
      ["title contains 'coil car, line 2', newest", "q=coil%20car%2C%20line%202&sort=newest"],
      ["rare title 'turntable, prototype 777'", "q=turntable%2C%20prototype%20777"],
    ];

    console.log(`\nservice = listOpenSpecsForShop end to end (count + page of 25), median of ${ROUNDS}`);
    console.log("SQL = EXPLAIN ANALYZE execution time of the count and the page query, as planned vs with index and bitmap scans off\n");
    const header = `${"search".padEnd(46)} ${"rows".padStart(6)} ${"service".padStart(9)} ${"SQL".padStart(9)} ${"seq scan".padStart(9)} ${"ratio".padStart(7)}  indexes used`;
    console.log(header);
    console.log("-".repeat(header.length + 30));
    const ratios: number[] = [];
    const plans: [string, string[]][] = [];
    for (const [label, search] of searches) {
      const { query } = readOpenSpecsQuery(new URLSearchParams(search));
      await listOpenSpecsForShop(shop, query); // warm-up
      const times: number[] = [];
      let total = 0;
      for (let i = 0; i < ROUNDS; i++) {
        const start = performance.now();
        total = (await listOpenSpecsForShop(shop, query)).total;
        times.push(performance.now() - start);
      }
      // The statements the service ran, captured from Sequelize's log of one more call.
      // Sequelize reads its logging option on every query; its typings leave `options` out.
      const statements: string[] = [];
      const options = (sequelize as unknown as { options: { logging: unknown } }).options;
      const logging = options.logging;
      options.logging = (sql: string) => statements.push(sql.replace(/^Executing \([^)]*\): /, ""));
      await listOpenSpecsForShop(shop, query);
      options.logging = logging;

      let planned = 0;
      let baseline = 0;
      const indexes = new Set<string>();
      for (const sql of statements) {
        const indexed = await explain(client, sql, false);
        const seq = await explain(client, sql, true);
        planned += indexed.ms;
        baseline += seq.ms;
        indexed.indexes.forEach((i) => indexes.add(i));
        if (!sql.startsWith("SELECT count")) plans.push([label, indexed.plan]);
      }
      ratios.push(baseline / planned);
      console.log(
        `${label.padEnd(46)} ${String(total).padStart(6)} ${median(times).toFixed(2).padStart(6)} ms ${planned.toFixed(2).padStart(6)} ms ${baseline.toFixed(2).padStart(6)} ms ${(baseline / planned).toFixed(1).padStart(6)}×  ${[...indexes].join(", ") || "none"}`,
      );
    }
    console.log(`\nmedian ratio sequential scan / planned: ${median(ratios).toFixed(1)}×`);
    console.log("\nPlans of the page queries (EXPLAIN ANALYZE, costs and timing left out):");
    for (const [label, plan] of plans) {
      console.log(`\n-- ${label}`);
      for (const line of plan.filter((l) => !/^(Planning|Execution) Time/.test(l))) console.log(`   ${line}`);
    }
    await client.end();
  } finally {
    await closeApp?.();
    stopCluster(cluster, "immediate");
    removeCluster(cluster);
    rmSync(root, { recursive: true, force: true });
  }
}

await main();
