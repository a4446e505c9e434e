import { gunzipSync } from "node:zlib";
import { describe, expect, it, vi } from "vitest";

// A small allowance so the limit can be reached in a test; set before the app reads its env.
vi.hoisted(() => {
  process.env.SIZING_REQUESTS_PER_MINUTE = "12";
});

import * as sizing from "~/routes/api.v1.sizing";
import { Visitor, call, serverContext } from "../support/routes";
import { signedIn } from "../support/sessions";
import { makeMember } from "../support/factories";
import { expectInvalidAt } from "../support/sizing-api";

const GOOD = {
  orientation: "vertical",
  rodDirection: "down",
  massKg: 800,
  processForceN: 20_000,
  strokeMm: 400,
  extendSpeedMmS: 80,
  retractSpeedMmS: 120,
  mounting: "fixed-pinned",
  cyclesPerHour: 60,
  hoursPerDay: 16,
  supplyHz: 50,
};

let client = 0;
/**
 * Each test asks from its own address (as the HTTP server saw it), so the limit of one test
 * doesn't spill into another. `headers` are what the client itself sends.
 */
function post(body: unknown, address = `10.0.0.${++client}`, headers: Record<string, string> = {}, visitor?: Visitor) {
  const init = {
    method: "POST",
    headers: { "Content-Type": "application/json", ...headers },
    body: typeof body === "string" ? body : JSON.stringify(body),
  };
  const request = visitor ? visitor.request("/api/v1/sizing", init) : new Request("http://127.0.0.1:3000/api/v1/sizing", init);
  return call(sizing.action, request, {}, serverContext(address));
}

describe("POST /api/v1/sizing", () => {
  it("sizes a good request and returns every contract field", async () => {
    const res = await post(GOOD);
    expect(res.status).toBe(200);
    const design = res.data;
    expect(design.cylinder).toMatchObject({ strokeMm: 400 });
    for (const field of ["boreMm", "rodMm", "extendForceN", "retractForceN", "bucklingSafetyFactor"]) {
      expect(typeof design.cylinder[field]).toBe("number");
    }
    expect(design.counterbalance.side).toBe("rod"); // rod down: the load overruns on extension
    expect(design.directionalValve.center).toBe("float");
    expect(Object.keys(design.pressuresBar)).toEqual(expect.arrayContaining(["extend", "retract", "reliefSetting"]));
    expect(Object.keys(design.flowsLpm)).toEqual(expect.arrayContaining(["extend", "retract", "pump", "returnMax"]));
    expect(design.bom.length).toBeGreaterThan(5);
    expect(design.trail.length).toBeGreaterThan(5);
    expect(design.circuit.components.length).toBeGreaterThan(5);
  });

  it.each([
    ["a wrong type", { ...GOOD, massKg: "heavy" }, "massKg"],
    ["a missing field", (({ strokeMm: _, ...rest }) => rest)(GOOD), "strokeMm"],
    ["a value out of range", { ...GOOD, hoursPerDay: 25 }, "hoursPerDay"],
    ["an unknown enum", { ...GOOD, mounting: "glued" }, "mounting"],
    ["an inclined axis without its angle", { ...GOOD, orientation: "inclined" }, "inclineDeg"],
    ["a vertical axis without its rod direction", (({ rodDirection: _, ...rest }) => ({ ...rest, orientation: "vertical" }))(GOOD), "rodDirection"],
  ])("answers %s with 400 naming the field", async (_label, body, field) => {
    expectInvalidAt(await post(body), field);
  });

  it("answers 400 naming the pressure limit when no cylinder of the series can work within it", async () => {
    // 1.5 MN at 20 bar: even the largest bore would need far more; the engine says how much.
    const res = await post({ ...GOOD, processForceN: 1_500_000, maxPressureBar: 20 });
    expect(res.status).toBe(400);
    expect(res.data.error).toBe("invalid_requirements");
    expect(res.data.fieldErrors.maxPressureBar[0]).toMatch(/at least \d+ bar/i);
  });

  it("lists every bad field at once", async () => {
    const res = await post({ ...GOOD, massKg: -1, strokeMm: 0, supplyHz: 55 });
    expect(Object.keys(res.data.fieldErrors).sort()).toEqual(["massKg", "strokeMm", "supplyHz"]);
  });

  it.each([
    ["malformed JSON", "{ not json"],
    ["a JSON array", "[1, 2]"],
    ["JSON null", "null"],
  ])("answers %s with 400", async (_label, body) => {
    const res = await post(body);
    expect(res.status).toBe(400);
  });

  it("sends the design gzipped to a client that takes gzip, and as plain JSON to one that does not", async () => {
    const send = (acceptEncoding: string) => {
      const init = { method: "POST", headers: { "Content-Type": "application/json", "Accept-Encoding": acceptEncoding }, body: JSON.stringify(GOOD) };
      return sizing.action({
        request: new Request("http://127.0.0.1:3000/api/v1/sizing", init),
        params: {},
        context: serverContext(`10.1.0.${++client}`),
      } as never);
    };
    const plain = (await post(GOOD, undefined, { "Accept-Encoding": "identity" })) as { headers: Headers; data: unknown };
    expect(plain.headers.get("Content-Encoding")).toBeNull();
    const zipped = await send("br, gzip;q=0.8");
    expect(zipped.status).toBe(200);
    expect(zipped.headers.get("Content-Encoding")).toBe("gzip");
    expect(zipped.headers.get("Vary")).toBe("Accept-Encoding");
    expect(JSON.parse(gunzipSync(Buffer.from(await zipped.arrayBuffer())).toString("utf8"))).toEqual(plain.data);
    expect((await send("*")).headers.get("Content-Encoding")).toBe("gzip");
    expect((await send("gzip;q=0, *")).headers.get("Content-Encoding")).toBeNull();
    expect((await send("deflate")).headers.get("Content-Encoding")).toBeNull();
  });

  it("answers GET with 405", async () => {
    const res = await call(sizing.loader, new Request("http://127.0.0.1:3000/api/v1/sizing"));
    expect(res.status).toBe(405);
  });

  it("limits requests per client, with Retry-After, without affecting other clients", async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 14; i++) statuses.push((await post(GOOD, "192.0.2.7")).status);
    expect(statuses.slice(0, 12).every((s) => s === 200)).toBe(true);
    expect(statuses.slice(12)).toEqual([429, 429]);
    const limited = await post(GOOD, "192.0.2.7");
    expect(limited.data.error).toBe("rate_limited");
    expect(Number(limited.headers.get("Retry-After"))).toBeGreaterThan(0);
    expect((await post(GOOD, "192.0.2.8")).status).toBe(200);
  });

  it("ignores the X-Forwarded-For a client sends: it cannot pick a fresh allowance", async () => {
    for (let i = 0; i < 12; i++) await post(GOOD, "203.0.113.9", { "X-Forwarded-For": `198.51.100.${i}` });
    expect((await post(GOOD, "203.0.113.9", { "X-Forwarded-For": "198.51.100.99" })).status).toBe(429);
  });

  it("counts a signed-in person by account, not by the address they share with colleagues", async () => {
    const office = "203.0.113.50";
    for (let i = 0; i < 12; i++) await post(GOOD, office);
    expect((await post(GOOD, office)).status).toBe(429);
    const { email } = await makeMember("buyer");
    const colleague = await signedIn({ email });
    expect(colleague.signedIn).toBe(true);
    expect((await post(GOOD, office, {}, colleague)).status).toBe(200);
  });
});
