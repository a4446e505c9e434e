// Child processes of the local stack and the browser tests: started, awaited until they answer,
// and stopped with them.
import { spawn, type ChildProcess } from "node:child_process";

export async function waitForHttp(url: string, timeoutMs = 30_000, child?: ChildProcess) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    if (child && child.exitCode !== null) throw new Error(`${url}: the process exited with code ${child.exitCode}`);
    try {
      const response = await fetch(url, { redirect: "manual" });
      if (response.status < 500) return;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error(`${url} did not answer within ${timeoutMs / 1000} s`);
    await new Promise((r) => setTimeout(r, 150));
  }
}

/** Runs a command to completion, its output passed through; rejects on a non-zero exit. */
export function run(command: string, args: string[], env: NodeJS.ProcessEnv = process.env, quiet = false) {
  return new Promise<void>((resolve, reject) => {
    const child = spawn(command, args, { env, stdio: quiet ? "pipe" : "inherit" });
    let output = "";
    child.stdout?.on("data", (d) => (output += d));
    child.stderr?.on("data", (d) => (output += d));
    child.on("error", reject);
    child.on("exit", (code) => (code === 0 ? resolve() : reject(new Error(`${command} ${args.join(" ")} exited with ${code}\n${output}`))));
  });
}

/** Serves a production build with the app's own server (app/serve.server.ts) on 127.0.0.1 only. */
export async function serveBuild(port: number, env: NodeJS.ProcessEnv, log: (line: string) => void = () => {}, buildDir = "build") {
  // node itself with tsx's loader (no tsx wrapper process), so signals reach the server directly.
  const child = spawn(process.execPath, ["--import", "tsx", "app/serve.server.ts", `${buildDir}/server/index.js`], {
    env: { ...env, PORT: String(port), HOST: "127.0.0.1", NODE_ENV: env.NODE_ENV ?? "production" },
    stdio: ["ignore", "pipe", "pipe"],
  });
  child.stdout!.on("data", (d: Buffer) => log(d.toString()));
  child.stderr!.on("data", (d: Buffer) => log(d.toString()));
  await waitForHttp(`http://127.0.0.1:${port}/`, 30_000, child);
  return child;
}

export function stop(child: ChildProcess | undefined) {
  if (!child || child.exitCode !== null) return Promise.resolve();
  return new Promise<void>((resolve) => {
    child.once("exit", () => resolve());
    child.kill("SIGTERM");
    // The server exits by itself within 3 s; this only guards against a hung process.
    setTimeout(() => child.kill("SIGKILL"), 5_000).unref();
  });
}
