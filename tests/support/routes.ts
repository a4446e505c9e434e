// Calls route loaders and actions with real Requests, the way the framework does, and reads what
// they return or throw (a Response, a data() result, or plain data) into one shape.
interface DataWithInit {
  type: "DataWithResponseInit";
  data: unknown;
  init: ResponseInit | null;
}
// What data() returns; recognised by its tag, as the framework itself does.
const isDataWithInit = (v: unknown): v is DataWithInit => typeof v === "object" && v !== null && (v as { type?: unknown }).type === "DataWithResponseInit";

import { RouterContextProvider } from "react-router";
import { clientAddressContext } from "~/http/request-context.server";

const ORIGIN = "http://127.0.0.1:3000";

export interface Outcome<T = unknown> {
  status: number;
  headers: Headers;
  location: string | null;
  setCookie: string | null;
  data: T;
}

// Route args carry more than tests need; one cast here keeps the tests typed on what they use.
// What a route answers is typed by each test that reads it (call<T>), so the default is open.
/* eslint-disable @typescript-eslint/no-explicit-any */
type RouteFunction = (args: any) => unknown;

async function settle(value: unknown): Promise<Outcome<any>> {
  if (value instanceof Response) {
    const type = value.headers.get("Content-Type") ?? "";
    const body = type.includes("json") ? await value.json() : await value.text();
    return { status: value.status, headers: value.headers, location: value.headers.get("Location"), setCookie: value.headers.get("Set-Cookie"), data: body };
  }
  if (isDataWithInit(value)) {
    const headers = new Headers(value.init?.headers);
    return { status: value.init?.status ?? 200, headers, location: headers.get("Location"), setCookie: headers.get("Set-Cookie"), data: value.data };
  }
  return { status: 200, headers: new Headers(), location: null, setCookie: null, data: value };
}

/** The context the app's HTTP server gives every request: here, the client's address. */
export function serverContext(clientAddress: string | null = "127.0.0.1") {
  const context = new RouterContextProvider();
  context.set(clientAddressContext, clientAddress);
  return context;
}

export async function call<T = any>(fn: RouteFunction, request: Request, params: Record<string, string> = {}, context = serverContext()): Promise<Outcome<T>> {
  try {
    return await settle(await fn({ request, params, context }));
  } catch (thrown) {
    if (thrown instanceof Response || isDataWithInit(thrown)) return settle(thrown);
    throw thrown;
  }
}

/** A person's browser: keeps the session cookie between requests. */
export class Visitor {
  private cookie = "";

  get signedIn() {
    return this.cookie.length > 0;
  }

  request(path: string, init: RequestInit = {}) {
    const headers = new Headers(init.headers);
    if (this.cookie) headers.set("Cookie", this.cookie);
    return new Request(new URL(path, ORIGIN), { ...init, headers });
  }

  private remember(outcome: Outcome) {
    if (!outcome.setCookie) return;
    const [pair, ...attributes] = outcome.setCookie.split(";");
    const expired = attributes.some((a) => /expires=thu, 01 jan 1970/i.test(a.trim())) || /^[^=]+=$/.test(pair.trim());
    this.cookie = expired ? "" : pair.trim();
  }

  async get<T = any>(fn: RouteFunction, path: string, params: Record<string, string> = {}) {
    const outcome = await call<T>(fn, this.request(path), params);
    this.remember(outcome);
    return outcome;
  }

  async post<T = any>(fn: RouteFunction, path: string, fields: Record<string, string>, params: Record<string, string> = {}) {
    const body = new URLSearchParams(fields);
    const outcome = await call<T>(fn, this.request(path, { method: "POST", body }), params);
    this.remember(outcome);
    return outcome;
  }
}
