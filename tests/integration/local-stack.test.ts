// A start that works on a fresh machine: the cluster lives where the postgres user can reach it
// even when the project sits in a folder closed to others (root's home is 700 on Debian), and
// the app's server stops once, cleanly, on Ctrl-C.
import { chmodSync, mkdirSync, mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import pg from "pg";
import { spawn } from "node:child_process";
import { afterAll, describe, expect, it } from "vitest";
import { clusterDirFor, freePort, removeCluster, startCluster, stopCluster } from "../../db/cluster";
import { waitForHttp } from "../../fakes/processes";
import { buildOnce } from "../support/http-app";

const isRoot = process.getuid?.() === 0;
const made: string[] = [];
afterAll(() => made.forEach((dir) => rmSync(dir, { recursive: true, force: true })));

function tempDir(mode: number) {
  const dir = mkdtempSync(path.join(os.tmpdir(), "tenderflow-stack-"));
  chmodSync(dir, mode);
  made.push(dir);
  return dir;
}

describe("where the project's cluster lives", () => {
  it("stays under the project when the postgres user can reach it", () => {
    const preferred = path.join(tempDir(0o755), "project", ".data", "postgres");
    expect(clusterDirFor(preferred)).toMatchObject({ dir: preferred, moved: false });
  });

  // Only root runs PostgreSQL as another user (postgres); anyone else runs it as themselves.
  it.runIf(isRoot)(
    "moves to a folder of the project's own when the checkout sits in a closed home folder, and starts there",
    async () => {
      const home = tempDir(0o700); // like /root on a fresh Debian machine
      const preferred = path.join(home, "tenderflow", ".data", "postgres");
      mkdirSync(path.dirname(preferred), { recursive: true });
      const fallbackRoot = tempDir(0o755);
      const first = clusterDirFor(preferred, fallbackRoot);
      expect(first).toMatchObject({ moved: true, blocked: home });
      expect(first.dir.startsWith(`${fallbackRoot}/tenderflow-`)).toBe(true);
      // The same checkout always finds the same cluster; another checkout gets its own.
      expect(clusterDirFor(preferred, fallbackRoot).dir).toBe(first.dir);
      expect(clusterDirFor(path.join(home, "other", ".data", "postgres"), fallbackRoot).dir).not.toBe(first.dir);

      const cluster = startCluster({ dataDir: first.dir, port: await freePort(), ephemeral: true });
      try {
        const client = new pg.Client({ connectionString: cluster.url() });
        await client.connect();
        expect((await client.query("SELECT 1 AS one")).rows[0].one).toBe(1);
        await client.end();
      } finally {
        stopCluster(cluster, "immediate");
        removeCluster(cluster);
      }
    },
    60_000,
  );
});

describe("stopping the app's server", () => {
  it("stops once on Ctrl-C, even when the stack sends SIGTERM after it, with no error", async () => {
    const buildDir = await buildOnce();
    const port = await freePort();
    const child = spawn(process.execPath, ["--import", "tsx", "app/serve.server.ts", `${buildDir}/server/index.js`], {
      env: { ...process.env, NODE_ENV: "production", PORT: String(port), HOST: "127.0.0.1", APP_URL: `http://127.0.0.1:${port}` },
      stdio: ["ignore", "pipe", "pipe"],
    });
    let output = "";
    child.stdout!.on("data", (d) => (output += d));
    child.stderr!.on("data", (d) => (output += d));
    await waitForHttp(`http://127.0.0.1:${port}/`, 30_000, child);
    const exited = new Promise<number | null>((resolve) => child.once("exit", (code) => resolve(code)));
    // The terminal's Ctrl-C reaches every process of the group; npm start then sends SIGTERM.
    child.kill("SIGINT");
    child.kill("SIGTERM");
    expect(await exited).toBe(0);
    expect(output).not.toMatch(/ERR_SERVER_NOT_RUNNING|Error/);
    expect(output).toContain("stopping the HTTP server");
  }, 240_000);
});
