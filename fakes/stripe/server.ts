// The HTTP side of the fake: Stripe's API under /v1 (secret-key auth, form-encoded parameters,
// idempotency keys, Stripe's error bodies) and the hosted payment pages beside it.
import { createServer, type IncomingMessage, type ServerResponse } from "node:http";
import { StripeFakeError, unauthorized } from "./errors";
import type { EventCause } from "./events";
import { parseParams } from "./form-body";
import { ParamReader } from "./params";
import { newId, type Store } from "./store";

export type ApiRequest = { params: ParamReader; path: Record<string, string>; cause: EventCause };
export type ApiRoute = { method: "GET" | "POST"; pattern: string; handle: (request: ApiRequest) => unknown };

export type PageAnswer = { status: number; html: string } | { redirect: string };
export type PageRoute = {
  method: "GET" | "POST";
  pattern: string;
  handle: (request: { path: Record<string, string>; form: URLSearchParams }) => PageAnswer;
};

export type ServerOptions = {
  store: Store;
  apiRoutes: ApiRoute[];
  pageRoutes: PageRoute[];
  /** When set, only this secret key is accepted; otherwise any well-formed test key is. */
  secretKey?: string;
  apiVersion: string;
  log?: (line: string) => void;
};

type StoredAnswer = { fingerprint: string; status: number; body: string };

export function createFakeServer(options: ServerOptions) {
  const api = options.apiRoutes.map((route) => ({ ...route, match: compile(route.pattern) }));
  const pages = options.pageRoutes.map((route) => ({ ...route, match: compile(route.pattern) }));
  const idempotent = new Map<string, StoredAnswer>();

  function answerApi(request: IncomingMessage, url: URL, body: string, response: ServerResponse) {
    const requestId = newId("req");
    const idempotencyKey = headerValue(request, "idempotency-key");
    response.setHeader("Request-Id", requestId);
    response.setHeader("Stripe-Version", headerValue(request, "stripe-version") ?? options.apiVersion);
    if (idempotencyKey) response.setHeader("Idempotency-Key", idempotencyKey);
    const send = (status: number, json: string) => response.writeHead(status, { "Content-Type": "application/json" }).end(json);
    try {
      const apiKey = authenticate(request.headers.authorization, options.secretKey);
      const found = findRoute(api, request.method!, url.pathname);
      if (!found) {
        throw new StripeFakeError(404, "invalid_request_error", `Unrecognized request URL (${request.method}: ${url.pathname}).`);
      }
      const isWrite = request.method === "POST";
      const slot = isWrite && idempotencyKey ? `${apiKey} ${idempotencyKey}` : undefined;
      // Stripe compares the parameters of a repeated key; the SDK encodes them the same way each
      // time, so the method, path and body bytes stand for them.
      const fingerprint = `${request.method} ${url.pathname}\n${body}`;
      const earlier = slot ? idempotent.get(slot) : undefined;
      if (earlier && earlier.fingerprint !== fingerprint) {
        throw new StripeFakeError(
          400,
          "idempotency_error",
          `Keys for idempotent requests can only be used with the same parameters they were first used with. ` +
            `Try using a key other than '${idempotencyKey}' if you meant to execute a different request.`,
        );
      }
      if (earlier) {
        response.setHeader("Idempotent-Replayed", "true");
        return send(earlier.status, earlier.body);
      }
      const params = new ParamReader(parseParams(isWrite ? body : url.search.slice(1)));
      const cause = { id: requestId, idempotency_key: idempotencyKey ?? null };
      const result = found.route.handle({ params, path: found.path, cause });
      const json = JSON.stringify(options.store.expand(result, params.expand()), null, 2);
      // Stripe keeps no result for a request that failed validation, and every error the fake
      // gives is one, so only successes are remembered.
      if (slot) idempotent.set(slot, { fingerprint, status: 200, body: json });
      send(200, json);
    } catch (error) {
      if (error instanceof StripeFakeError) return send(error.status, JSON.stringify(error.toJSON(), null, 2));
      options.log?.(`stripe fake: ${request.method} ${url.pathname} failed: ${error instanceof Error ? error.stack : error}`);
      send(500, JSON.stringify({ error: { type: "api_error", message: "The Stripe fake failed on this request." } }));
    }
  }

  function answerPage(request: IncomingMessage, url: URL, body: string, response: ServerResponse) {
    const found = findRoute(pages, request.method!, url.pathname);
    if (!found) return response.writeHead(404, { "Content-Type": "text/plain" }).end("Not found");
    const answer = found.route.handle({ path: found.path, form: new URLSearchParams(body) });
    if ("redirect" in answer) return response.writeHead(303, { Location: answer.redirect }).end();
    response.writeHead(answer.status, { "Content-Type": "text/html; charset=utf-8" }).end(answer.html);
  }

  return createServer((request, response) => {
    const chunks: Buffer[] = [];
    request.on("data", (chunk: Buffer) => chunks.push(chunk));
    request.on("end", () => {
      const url = new URL(request.url ?? "/", "http://fake.invalid");
      const body = Buffer.concat(chunks).toString("utf8");
      options.log?.(`stripe fake: ${request.method} ${url.pathname}`);
      try {
        if (url.pathname.startsWith("/v1/")) answerApi(request, url, body, response);
        else answerPage(request, url, body, response);
      } catch (error) {
        options.log?.(`stripe fake: ${url.pathname} failed: ${error instanceof Error ? error.stack : error}`);
        if (!response.headersSent) response.writeHead(500, { "Content-Type": "text/plain" }).end("The Stripe fake failed.");
      }
    });
  });
}

/** The API key from `Authorization: Bearer sk_test_…` (or Basic, as curl -u sends it). */
function authenticate(header: string | undefined, onlyKey: string | undefined) {
  if (!header) {
    throw unauthorized(
      "You did not provide an API key. Send your secret key in the Authorization header, using Bearer auth " +
        "(for example 'Authorization: Bearer sk_test_…').",
    );
  }
  const [scheme, credentials = ""] = header.split(" ");
  const key =
    scheme.toLowerCase() === "basic" ? Buffer.from(credentials, "base64").toString("utf8").split(":")[0] : scheme.toLowerCase() === "bearer" ? credentials : "";
  const wellFormed = /^(sk|rk)_test_[A-Za-z0-9_]{8,}$/.test(key);
  if (!wellFormed || (onlyKey !== undefined && key !== onlyKey)) {
    const shown = key.length > 12 ? `${key.slice(0, 8)}${"*".repeat(8)}${key.slice(-4)}` : key;
    throw unauthorized(`Invalid API Key provided: ${shown || "(empty)"}`);
  }
  return key;
}

function headerValue(request: IncomingMessage, name: string) {
  const value = request.headers[name];
  return Array.isArray(value) ? value[0] : value;
}

function compile(pattern: string) {
  const names: string[] = [];
  const source = pattern.replace(/:(\w+)/g, (_, name: string) => {
    names.push(name);
    return "([^/]+)";
  });
  const regex = new RegExp(`^${source}$`);
  return (pathname: string) => {
    const found = regex.exec(pathname);
    return found ? Object.fromEntries(names.map((name, i) => [name, decodeURIComponent(found[i + 1])])) : undefined;
  };
}

function findRoute<R extends { method: string; match: (pathname: string) => Record<string, string> | undefined }>(
  routes: R[],
  method: string,
  pathname: string,
) {
  for (const route of routes) {
    const path = route.method === method ? route.match(pathname) : undefined;
    if (path) return { route, path };
  }
  return undefined;
}
