// Two app servers on one database and one object store, behind a small round-robin proxy on
// loopback: what a load balancer in front of several servers does, so a test can prove that no
// request depends on which server answers it. APP_URL is the proxy's address for both servers
// (links in mail, the origin check and the card service's way back all name the front door), and
// both trust the proxy's X-Forwarded-For (TRUSTED_PROXIES), as the README asks of a balancer.
import http from "node:http";
import type { AddressInfo } from "node:net";
import { freePort } from "../../db/cluster";
import { startHttpApp, type HttpApp } from "./http-app";

export interface ServerPair {
  /** The proxy's address: the only one the browser and the fakes are given. */
  baseUrl: string;
  servers: HttpApp[];
  /** Requests each server answered (by index), pages and data alike. */
  answered: number[];
  /** Stops one server: the proxy sends everything to the other from then on. */
  stopServer(index: number): Promise<void>;
  close(): Promise<void>;
}

// Bodies are held so a request refused by a stopped server can go to the other one; larger than
// any upload the app accepts.
const MAX_BODY = 64 * 1024 * 1024;

export async function startServerPair(env: NodeJS.ProcessEnv = {}): Promise<ServerPair> {
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  // One after the other: two servers booting at once on a loaded two-core machine can each
  // outlast the wait for the first answer. One that started is stopped if the next does not.
  const servers: HttpApp[] = [];
  try {
    for (let i = 0; i < 2; i++) servers.push(await startHttpApp({ APP_URL: baseUrl, TRUSTED_PROXIES: "loopback", ...env }));
  } catch (error) {
    await Promise.all(servers.map((s) => s.close()));
    throw error;
  }
  const live = servers.map(() => true);
  const answered = servers.map(() => 0);
  let turn = 0;

  const forward = (index: number, req: http.IncomingMessage, body: Buffer, res: http.ServerResponse, tried: number) => {
    const target = new URL(servers[index].baseUrl);
    // The balancer names the client, so rate limits count the browser, not the proxy.
    const forwardedFor = [req.headers["x-forwarded-for"], req.socket.remoteAddress].filter(Boolean).join(", ");
    const headers = { ...req.headers, "x-forwarded-for": forwardedFor };
    const upstream = http.request({ host: target.hostname, port: target.port, method: req.method, path: req.url, headers }, (answer) => {
      answered[index] += 1;
      res.writeHead(answer.statusCode ?? 502, answer.headers);
      answer.pipe(res);
    });
    upstream.on("error", (error: NodeJS.ErrnoException) => {
      // Two failures where the server never saw the request, so another may take it: a refused
      // connection (that server is down), and a reset of a kept-alive socket the server closed as
      // idle just as the request went out (the race Node's docs describe under request.reusedSocket).
      const refused = error.code === "ECONNREFUSED";
      const closedIdle = upstream.reusedSocket && error.code === "ECONNRESET";
      if ((refused || closedIdle) && tried <= servers.length && !res.headersSent) {
        if (refused) live[index] = false;
        const other = nextLive();
        if (other !== undefined) return forward(other, req, body, res, tried + 1);
      }
      if (!res.headersSent) res.writeHead(502, { "content-type": "text/plain" });
      res.end(`proxy: ${error.code ?? error.message}`);
    });
    upstream.end(body);
  };

  const nextLive = () => {
    for (let i = 0; i < servers.length; i++) {
      const index = turn++ % servers.length;
      if (live[index]) return index;
    }
    return undefined;
  };

  const proxy = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    let size = 0;
    req.on("data", (chunk: Buffer) => {
      size += chunk.length;
      if (size > MAX_BODY) req.destroy();
      else chunks.push(chunk);
    });
    req.on("end", () => {
      const index = nextLive();
      if (index === undefined) {
        res.writeHead(503, { "content-type": "text/plain" }).end("proxy: no server");
        return;
      }
      forward(index, req, Buffer.concat(chunks), res, 1);
    });
  });
  await new Promise<void>((resolve) => proxy.listen(port, "127.0.0.1", resolve));
  if ((proxy.address() as AddressInfo).port !== port) throw new Error("the proxy did not get its port");

  return {
    baseUrl,
    servers,
    answered,
    async stopServer(index) {
      live[index] = false;
      await servers[index].close();
    },
    async close() {
      proxy.closeAllConnections();
      await new Promise<void>((resolve) => proxy.close(() => resolve()));
      await Promise.all(servers.map((s) => s.close()));
    },
  };
}
