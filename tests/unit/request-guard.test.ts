// The root middleware's checks, one by one: request bounds, the origin check, the redirect
// after sign-in and the security headers. tests/integration/attack.test.ts sends the same
// attacks over HTTP to the built app, to show every route is behind them.
import { describe, expect, it } from "vitest";
import { safeRedirect } from "~/auth/permissions.server";
import { REQUEST_LIMITS, checkRequestBounds } from "~/http/request-bounds.server";
import { checkSameOrigin } from "~/http/same-origin.server";
import { applySecurityHeaders, contentSecurityPolicy } from "~/http/security-headers.server";

const APP = "http://127.0.0.1:3000"; // APP_URL in tests/setup/each-file.ts

function form(body: string, init: { path?: string; headers?: Record<string, string> } = {}) {
  return new Request(`${APP}${init.path ?? "/sign-in"}`, {
    method: "POST",
    headers: { "Content-Type": "application/x-www-form-urlencoded", ...init.headers },
    body,
  });
}

/** A body sent in chunks with no Content-Length, as a client streaming a huge upload would. */
function chunked(bytes: number, type = "application/x-www-form-urlencoded") {
  const chunk = new TextEncoder().encode("a".repeat(64 * 1024));
  let sent = 0;
  const body = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (sent >= bytes) return controller.close();
      sent += chunk.byteLength;
      controller.enqueue(chunk);
    },
  });
  return new Request(`${APP}/sign-in`, { method: "POST", headers: { "Content-Type": type }, body, duplex: "half" } as RequestInit);
}

describe("request bounds", () => {
  it("refuses list indexes no form of ours has, before any parser builds the list", async () => {
    // The attack that grew the server to 4 GB: conform would build a 10-million-slot array.
    expect(await checkRequestBounds(form("email[10000000]=x&password=y"))).toMatchObject({
      status: 400,
      message: expect.stringContaining("points past the end"),
    });
    expect(await checkRequestBounds(form("lines[10000000].key=x"))).toMatchObject({ status: 400 });
    expect(await checkRequestBounds(form(`lines[${REQUEST_LIMITS.listIndex}].key=x`))).toBeNull();
  });

  it("refuses too many fields, odd field names and a field sent twice", async () => {
    const many = Array.from({ length: REQUEST_LIMITS.fields + 1 }, (_, i) => `f${i}=1`).join("&");
    expect(await checkRequestBounds(form(many))).toMatchObject({ status: 413 });
    expect(await checkRequestBounds(form("__proto__[x]=1&a%5B%5D=2"))).toMatchObject({ status: 400 });
    expect(await checkRequestBounds(form("email=a@example.test&email=b@example.test"))).toMatchObject({
      status: 400,
      message: expect.stringContaining("more than once"),
    });
  });

  it("refuses a NUL character in a form, a query or a path", async () => {
    expect(await checkRequestBounds(form("title=Press%00ram"))).toMatchObject({ status: 400, message: expect.stringContaining("NUL") });
    expect(await checkRequestBounds(new Request(`${APP}/open-specs?q=%00`))).toMatchObject({ status: 400 });
    expect(await checkRequestBounds(new Request(`${APP}/specs/%00`))).toMatchObject({ status: 400 });
  });

  it("refuses bodies over the limit, declared or streamed without a length", async () => {
    expect(await checkRequestBounds(form("x=1", { headers: { "Content-Length": String(REQUEST_LIMITS.formBytes + 1) } }))).toMatchObject({ status: 413 });
    expect(await checkRequestBounds(chunked(REQUEST_LIMITS.formBytes * 4))).toMatchObject({ status: 413 });
    expect(await checkRequestBounds(chunked(REQUEST_LIMITS.jsonBytes * 2, "application/json"))).toMatchObject({ status: 413 });
  });

  it("leaves the body for the route to read after checking a copy", async () => {
    const request = form("email=a%40example.test&password=pw");
    expect(await checkRequestBounds(request)).toBeNull();
    expect((await request.formData()).get("email")).toBe("a@example.test");
  });

  it("takes multipart only where files are uploaded, and refuses other body types", async () => {
    const multipart = (path: string) => new Request(`${APP}${path}`, { method: "POST", body: new FormData() });
    expect(await checkRequestBounds(multipart("/sign-in"))).toMatchObject({ status: 415 });
    expect(await checkRequestBounds(multipart("/specs/5d0c6a4e-0000-4000-8000-000000000000/attachments"))).toBeNull();
    const xml = new Request(`${APP}/sign-in`, { method: "POST", headers: { "Content-Type": "application/xml" }, body: "<a/>" });
    expect(await checkRequestBounds(xml)).toMatchObject({ status: 415 });
    // A PUT with no body and no type once reached the sign-in action's formData() and gave a 500.
    expect(await checkRequestBounds(new Request(`${APP}/sign-in`, { method: "PUT" }))).toMatchObject({ status: 415 });
  });

  it("refuses an overlong query", async () => {
    expect(await checkRequestBounds(new Request(`${APP}/open-specs?q=${"a".repeat(REQUEST_LIMITS.queryLength)}`))).toMatchObject({ status: 413 });
  });
});

describe("same-origin check", () => {
  const post = (headers: Record<string, string>, path = "/specs/new") => new Request(`${APP}${path}`, { method: "POST", headers });

  it("lets our own pages change state", () => {
    expect(checkSameOrigin(post({ Origin: APP }))).toBeNull();
    expect(checkSameOrigin(post({ "Sec-Fetch-Site": "same-origin" }))).toBeNull();
    expect(checkSameOrigin(post({ Referer: `${APP}/specs` }))).toBeNull();
  });

  it("refuses another site, another port of the same host and opaque origins", () => {
    expect(checkSameOrigin(post({ Origin: "https://elsewhere.example" }))).toMatchObject({ status: 403 });
    // SameSite=Lax cookies go along with this one: same site, other origin.
    expect(checkSameOrigin(post({ Origin: "http://127.0.0.1:4000" }))).toMatchObject({ status: 403, message: expect.stringContaining("127.0.0.1:4000") });
    expect(checkSameOrigin(post({ Origin: "null" }))).toMatchObject({ status: 403 });
    expect(checkSameOrigin(post({ "Sec-Fetch-Site": "same-site" }))).toMatchObject({ status: 403 });
    expect(checkSameOrigin(post({ Referer: "http://127.0.0.1:4000/form.html" }))).toMatchObject({ status: 403 });
  });

  it("checks every state-changing method, not reads, and lets signed webhooks through", () => {
    for (const method of ["POST", "PUT", "PATCH", "DELETE"]) {
      expect(checkSameOrigin(new Request(`${APP}/specs/x/delete`, { method, headers: { Origin: "https://elsewhere.example" } }))).not.toBeNull();
    }
    expect(checkSameOrigin(new Request(`${APP}/specs`, { headers: { Origin: "https://elsewhere.example" } }))).toBeNull();
    expect(checkSameOrigin(post({ Origin: "https://elsewhere.example" }, "/webhooks/stripe"))).toBeNull();
  });
});

describe("the redirect after sign-in", () => {
  // Values as the form field carries them, already percent-decoded.
  it.each([
    ["/\t/other-host", "a tab (sent as %09), which browsers drop, leaving //other-host"],
    ["/\n/other-host", "a line break (was a 500: an invalid Location header)"],
    ["//other-host", "a protocol-relative address"],
    ["/\\other-host", "a backslash, which browsers read as a slash"],
    ["https://other-host/", "an absolute address"],
    ["javascript:alert(1)", "a script address"],
    ["", "nothing"],
  ])("refuses %j (%s)", (to) => {
    expect(safeRedirect(to, "/home")).toBe("/home");
  });

  it("keeps our own paths, queries and anchors, and an encoded tab stays a path of ours", () => {
    expect(safeRedirect("/specs/42/bids?sort=price#questions")).toBe("/specs/42/bids?sort=price#questions");
    const encoded = safeRedirect("/%09/other-host");
    expect(new URL(encoded, APP).origin).toBe(APP);
  });
});

describe("security headers", () => {
  it("allow only our own origin, with this response's nonce for inline scripts", () => {
    const csp = contentSecurityPolicy("abc123", false);
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("script-src 'self' 'nonce-abc123'");
    const scripts = csp.split("; ").find((d) => d.startsWith("script-src"));
    expect(scripts).not.toContain("unsafe-inline");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("object-src 'none'");
  });

  it("keep signed-in responses out of every cache and forbid sniffing and framing", () => {
    const response = applySecurityHeaders(new Response("x", { headers: { "Cache-Control": "public, max-age=600" } }), { nonce: "n", withCookie: true });
    expect(response.headers.get("Cache-Control")).toBe("private, no-store");
    expect(response.headers.get("X-Content-Type-Options")).toBe("nosniff");
    expect(response.headers.get("X-Frame-Options")).toBe("DENY");
    expect(response.headers.get("Referrer-Policy")).toBe("same-origin");
    // Over plain http (the tests' APP_URL) there is no HSTS; over https there is.
    expect(response.headers.has("Strict-Transport-Security")).toBe(false);
  });
});
