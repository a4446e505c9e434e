// The running app attacked over HTTP, as a hostile shop, buyer or stranger would: the
// production build behind the app's own server, seeded with the demo scenario. Every route
// comes from app/routes.ts, so a route added later is attacked too.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import pg from "pg";
import { Sequelize } from "sequelize";
import routes from "~/routes";
import { DEMO_PASSWORD, seedDemo } from "../../db/seeds/demo";
import { User } from "~/models/index.server";
import { makePublishedSpec } from "../support/factories";
import { startHttpApp, type HttpApp } from "../support/http-app";

let app: HttpApp;
let db: Sequelize;
const ids: Record<string, string> = {};

beforeAll(async () => {
  db = new Sequelize(process.env.DATABASE_URL!, { dialect: "postgres", dialectModule: pg, logging: false });
  await seedDemo(db);
  const one = async (sql: string) => ((await db.query(sql, { plain: true })) as Record<string, string>).id;
  ids.openSpec = await one(`SELECT id FROM specs WHERE status = 'open' ORDER BY created_at LIMIT 1`);
  ids.job = await one(`SELECT id FROM jobs ORDER BY created_at LIMIT 1`);
  ids.payment = await one(`SELECT id FROM payments ORDER BY created_at LIMIT 1`);
  ids.organisation = await one(`SELECT id FROM organisations WHERE kind = 'buyer' ORDER BY created_at LIMIT 1`);
  app = await startHttpApp({ SIZING_REQUESTS_PER_MINUTE: "6" });
}, 240_000);

afterAll(async () => {
  await app?.close();
  await db?.close();
});

/** A browser of one person: keeps its cookie, sends our Origin unless told otherwise. */
class Client {
  cookie = "";
  email = "";
  async send(path: string, init: RequestInit & { origin?: string | null } = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    if (this.cookie) headers.set("Cookie", this.cookie);
    const origin = init.origin === undefined ? app.baseUrl : init.origin;
    if (origin) headers.set("Origin", origin);
    let response: Response;
    try {
      response = await fetch(`${app.baseUrl}${path}`, { ...init, headers, redirect: "manual" });
    } catch (error) {
      // A kept-alive connection the server had just closed; a crashed server fails the retry too.
      if ((error as { cause?: { code?: string } }).cause?.code !== "ECONNRESET") throw error;
      response = await fetch(`${app.baseUrl}${path}`, { ...init, headers, redirect: "manual" });
    }
    // One session cookie; a cleared one (empty value) signs the browser out.
    const set = response.headers.getSetCookie().at(-1);
    if (set) this.cookie = /^[^=]+=;|expires=thu, 01 jan 1970/i.test(set) ? "" : set.split(";")[0];
    return response;
  }
  form(path: string, body: string, init: { origin?: string | null } = {}) {
    return this.send(path, { method: "POST", body, headers: { "Content-Type": "application/x-www-form-urlencoded" }, ...init });
  }
  async signIn(email: string) {
    this.email = email;
    const response = await this.form("/sign-in", new URLSearchParams({ email, password: DEMO_PASSWORD }).toString());
    expect(response.status, `sign-in of ${email}`).toBe(302);
    return this;
  }
}

/** Every route of app/routes.ts, its params filled with the demo's own records. */
function routePaths() {
  const param: Record<string, string> = {
    specId: ids.openSpec,
    jobId: ids.job,
    paymentId: ids.payment,
    organisationId: ids.organisation,
    attachmentId: "00000000-0000-4000-8000-000000000000",
    questionId: "00000000-0000-4000-8000-000000000000",
    invitationId: "00000000-0000-4000-8000-000000000000",
    token: "not-a-real-token",
    step: "machine",
  };
  return routes.map((r) => ({
    file: r.file,
    path: `/${(r.path ?? "").replace(/:(\w+)/g, (_, name: string) => param[name] ?? "x")}`.replace(/\/$/, "") || "/?index",
  }));
}

let buyer: Client, shop: Client, admin: Client, manager: Client;
beforeAll(async () => {
  [buyer, shop, admin, manager] = await Promise.all([
    new Client().signIn("priya@kestrel-forming.test"),
    new Client().signIn("aled@ironbridge-fluid.test"),
    new Client().signIn("felix@tenderflow.test"),
    new Client().signIn("nadia@tenderflow.test"),
  ]);
  // A draft of the buyer's own, for the form steps.
  const created = await buyer.form("/specs/new", "");
  ids.draftSpec = /\/specs\/([0-9a-f-]{36})\//.exec(created.headers.get("Location") ?? "")![1];
}, 60_000);

const count = async (table: string) => Number(((await db.query(`SELECT count(*)::int AS n FROM ${table}`, { plain: true })) as { n: number }).n);

describe("behind a trusted proxy", () => {
  it("counts the client the proxy names, so each client keeps its own allowance", async () => {
    // This server believes X-Forwarded-For from loopback, where the test stands in for the proxy.
    const proxied = await startHttpApp({ SIZING_REQUESTS_PER_MINUTE: "2", TRUSTED_PROXIES: "loopback" });
    try {
      const post = (client: string) =>
        fetch(`${proxied.baseUrl}/api/v1/sizing`, { method: "POST", headers: { "Content-Type": "application/json", "X-Forwarded-For": client }, body: "{}" });
      const first = [await post("198.51.100.1"), await post("198.51.100.1"), await post("198.51.100.1")].map((r) => r.status);
      expect(first).toEqual([400, 400, 429]);
      expect((await post("198.51.100.2")).status).toBe(400);
      // A client can't add its own entry in front: the proxy's last hop is what counts.
      expect((await post("203.0.113.7, 198.51.100.1")).status).toBe(429);
    } finally {
      await proxied.close();
    }
  }, 60_000);
});

// First: the other tests post to the API too, and would spend this minute's allowance.
describe("the sizing API's rate limit", () => {
  it("ignores the X-Forwarded-For a client sends when no proxy is trusted", async () => {
    const post = (forwarded: string) =>
      fetch(`${app.baseUrl}/api/v1/sizing`, { method: "POST", headers: { "Content-Type": "application/json", "X-Forwarded-For": forwarded }, body: "{}" });
    const statuses: number[] = [];
    for (let i = 0; i < 8; i++) statuses.push((await post(`198.51.100.${i}`)).status);
    // Six a minute (this server's setting), then 429, whatever address each request claimed.
    expect(statuses.slice(0, 6).every((s) => s === 400)).toBe(true);
    expect(statuses.slice(6)).toEqual([429, 429]);
  });
});

describe("cross-site requests", () => {
  it("every route refuses a state change sent from another origin, for every signed-in role", async () => {
    const specsBefore = await count("specs");
    const foreign = ["http://127.0.0.1:4000", "https://elsewhere.example", "null"];
    for (const client of [buyer, shop, admin, manager]) {
      for (const { path, file } of routePaths()) {
        for (const origin of foreign) {
          const response = await client.form(path, "intent=save&title=Forged", { origin });
          // React Router refuses a page's form from another host itself (a plain 400) before our
          // middleware (403, with a message) sees it; resource routes reach ours.
          expect([400, 403], `${file} from ${origin}`).toContain(response.status);
        }
      }
    }
    // A form on another port of the same host used to create a draft in the buyer's account.
    expect(await count("specs")).toBe(specsBefore);
  });

  it("still takes the same forms from our own pages", async () => {
    const response = await buyer.form("/specs/new", "");
    expect(response.status).toBe(302);
    expect(response.headers.get("Location")).toMatch(/^\/specs\/[0-9a-f-]{36}\/edit/);
  });
});

describe("request bounds", () => {
  it("answers huge list indexes with a short 400, not a 4 GB server", async () => {
    const anonymous = new Client();
    const signIn = await anonymous.form("/sign-in", "email[10000000]=x&password=y");
    expect(signIn.status).toBe(400);
    expect((await signIn.text()).length).toBeLessThan(50_000);
    const bid = await shop.form(`/specs/${ids.openSpec}/bid`, "intent=save&lines[10000000].key=x");
    expect(bid.status).toBe(400);
    expect(await bid.text()).toContain("points past the end of any list");
  });

  it("answers an endless body with 413 as soon as it passes the limit", async () => {
    let sent = 0;
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        // Stops by itself at 64 MB; the server should have refused it long before.
        if ((sent += 65_536) > 64 * 1024 * 1024) return controller.close();
        controller.enqueue(new Uint8Array(65_536).fill(97));
      },
    });
    const response = await fetch(`${app.baseUrl}/sign-in`, {
      method: "POST",
      headers: { "Content-Type": "application/x-www-form-urlencoded", Origin: app.baseUrl },
      body,
      duplex: "half",
    } as RequestInit);
    expect(response.status).toBe(413);
    expect(sent).toBeLessThan(16 * 1024 * 1024);
  });

  it("answers the JSON API over its limit with a JSON 413", async () => {
    const response = await new Client().send("/api/v1/sizing", { method: "POST", headers: { "Content-Type": "application/json" }, body: "x".repeat(200_000) });
    expect(response.status).toBe(413);
    expect(await response.json()).toMatchObject({ message: expect.stringContaining("too large") });
  });
});

describe("no input ends in a 500", () => {
  const hostileBodies = [
    "title=Press%00ram&purpose=x&notes=a%00b&deliveryRegion=%00&terms=%00",
    "email=a%40example.test&email=b%40example.test&title=A&title=B&intent=save&intent=submit",
    "lines=single&intent=save",
    "lines[0].key=x&lines[7].key=y&intent=save",
    `title=${"x".repeat(300_000)}`,
    "validUntil=9999-99-99&bidDeadline=2099-13-45&dateNeeded=2099-02-30&targetDate=0000-00-00&intent=save",
    "%ZZ=%ZZ&=&&&===",
  ];

  it("every route, for every role, answers hostile forms with 2xx–4xx", async () => {
    const failures: string[] = [];
    const people = ["priya@kestrel-forming.test", "aled@ironbridge-fluid.test", "felix@tenderflow.test", "nadia@tenderflow.test"];
    for (const email of [null, ...people]) {
      const client = new Client();
      for (const { path, file } of [...routePaths(), { path: `/specs/${ids.draftSpec}/edit/quotation`, file: "draft quotation" }]) {
        for (const body of hostileBodies) {
          // Sign-out is one of the routes: sign in again, so each route is attacked signed in.
          if (email && !client.cookie) await client.signIn(email);
          try {
            const response = await client.form(path, body);
            if (response.status >= 500) failures.push(`${response.status} ${file} ${body.slice(0, 60)}`);
          } catch (error) {
            failures.push(`${(error as Error).cause ?? error} ${file} ${body.slice(0, 60)}`);
          }
        }
        for (const method of ["PUT", "PATCH", "DELETE"]) {
          const bare = await client.send(path, { method });
          if (bare.status >= 500) failures.push(`${bare.status} ${method} ${file} with no body`);
        }
        const query = await client.send(`${path}${path.includes("?") ? "&" : "?"}q=%00&sort=%00&page=-1&from=2099-02-30`);
        if (query.status >= 500) failures.push(`${query.status} GET ${file} with a hostile query`);
      }
    }
    expect(failures).toEqual([]);
  }, 120_000);
});

describe("impossible dates and stale tabs", () => {
  it("refuses impossible dates on the spec form with the field's message, and stores nothing", async () => {
    const draft = `/specs/${ids.draftSpec}/edit/quotation`;
    const before = await db.query(`SELECT answers FROM specs WHERE id = '${ids.draftSpec}'`, { plain: true });
    for (const [deadline, needed] of [
      ["2099-13-45", "2099-12-01"],
      ["2099-02-30", "2099-12-01"],
    ]) {
      const body = new URLSearchParams({
        intent: "next",
        unitsWanted: "1",
        bidDeadline: deadline,
        dateNeeded: needed,
        deliveryRegion: "Somewhere",
        currency: "EUR",
        retainerPercent: "10",
      });
      const response = await buyer.form(draft, body.toString());
      expect(response.status).toBe(400);
      expect(await response.text()).toContain("Enter the last day shops can bid.");
    }
    expect(await db.query(`SELECT answers FROM specs WHERE id = '${ids.draftSpec}'`, { plain: true })).toEqual(before);
  });

  it("a step saved from a tab opened before the spec was published changes nothing", async () => {
    const priya = await User.findOne({ where: { email: "priya@kestrel-forming.test" }, rejectOnEmpty: true });
    const spec = await makePublishedSpec(priya, { machine: { title: "Published meanwhile" } });
    const body = new URLSearchParams({ intent: "next", title: "Changed in an old tab", orientation: "horizontal", mounting: "pinned-pinned" });
    const response = await buyer.form(`/specs/${spec.id}/edit/machine`, body.toString());
    expect(response.status).toBe(302);
    expect(response.headers.get("Location")).toBe(`/specs/${spec.id}`);
    await spec.reload();
    expect(spec.title).toBe("Published meanwhile");
  });

  it("refuses a bid valid until 9999-99-99", async () => {
    const response = await shop.form(`/specs/${ids.openSpec}/bid`, "intent=save&validUntil=9999-99-99");
    expect(response.status).toBe(400);
  });
});

describe("security headers", () => {
  it("every page carries a content security policy whose nonce is on every inline script", async () => {
    const pages: [Client, string][] = [
      [new Client(), "/"],
      [new Client(), "/quick-sizing"],
      [new Client(), "/sign-in"],
      [buyer, "/specs"],
      [shop, "/open-specs"],
    ];
    for (const [client, path] of pages) {
      const response = await client.send(path);
      expect(response.status, path).toBe(200);
      const csp = response.headers.get("Content-Security-Policy") ?? "";
      const nonce = /'nonce-([^']+)'/.exec(csp)?.[1];
      expect(nonce, path).toBeTruthy();
      expect(csp).toContain("frame-ancestors 'none'");
      const html = await response.text();
      const scripts = [...html.matchAll(/<script\b([^>]*)>/g)].map((m) => m[1]);
      expect(scripts.length).toBeGreaterThan(0);
      for (const attributes of scripts) expect(attributes).toContain(`nonce="${nonce}"`);
      expect(response.headers.get("X-Content-Type-Options")).toBe("nosniff");
      expect(response.headers.get("Referrer-Policy")).toBe("same-origin");
      if (client.cookie) expect(response.headers.get("Cache-Control")).toBe("private, no-store");
    }
  });

  it("a new nonce for every response, and headers on static files too", async () => {
    const nonces = await Promise.all(
      [1, 2].map(async () => /'nonce-([^']+)'/.exec((await new Client().send("/sign-in")).headers.get("Content-Security-Policy")!)![1]),
    );
    expect(nonces[0]).not.toBe(nonces[1]);
    const favicon = await fetch(`${app.baseUrl}/favicon.svg`);
    expect(favicon.headers.get("X-Content-Type-Options")).toBe("nosniff");
  });
});

describe("the redirect after sign-in", () => {
  it.each([["/\t/other-host"], ["//other-host"], ["/\\other-host"], ["/\n/x"], ["https://other-host"]])("never leaves the site for %j", async (redirectTo) => {
    const client = new Client();
    const body = new URLSearchParams({ email: "owen@kestrel-forming.test", password: DEMO_PASSWORD, redirectTo });
    const response = await client.form("/sign-in", body.toString());
    expect(response.status).toBe(302);
    const location = response.headers.get("Location")!;
    expect(new URL(location, app.baseUrl).origin).toBe(app.baseUrl);
    expect(location).toBe("/specs");
  });
});

afterAll(() => {
  // A 500 anywhere shows in the server's log: say so, whatever the test that caused it.
  const errors = app?.logs.filter((l) => / 500 /.test(l)) ?? [];
  expect(errors).toEqual([]);
});
