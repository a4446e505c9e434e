import fc from "fast-check";
import { describe, expect, it } from "vitest";

import * as machines from "~/routes/api.v1.machines.sizing";
import { call, serverContext } from "../support/routes";
import { expectInvalidAt } from "../support/sizing-api";

const CLAMP = {
  name: "Clamp",
  orientation: "vertical",
  rodDirection: "down",
  massKg: 50,
  processForceN: 20_000,
  strokeMm: 100,
  extendSpeedMmS: 50,
  retractSpeedMmS: 80,
  mounting: "fixed-pinned",
  dwellS: 5,
};
const PRESS = {
  name: "Press",
  orientation: "vertical",
  rodDirection: "down",
  massKg: 400,
  processForceN: 150_000,
  strokeMm: 300,
  extendSpeedMmS: 100,
  retractSpeedMmS: 120,
  pressStrokeMm: 20,
  pressSpeedMmS: 10,
  dwellS: 2,
  mounting: "fixed-pinned",
};
const GOOD = { axes: [CLAMP, PRESS], cyclesPerHour: 60, hoursPerDay: 16, supplyHz: 50, maxPressureBar: 200 };

let client = 0;
/** Each request from its own address, so the sizing allowance per client never decides a test. */
function post(body: unknown) {
  const request = new Request("http://127.0.0.1:3000/api/v1/machines/sizing", {
    method: "POST",
    headers: { "Content-Type": "application/json" },
    body: typeof body === "string" ? body : JSON.stringify(body),
  });
  client += 1;
  return call(machines.action, request, {}, serverContext(`10.14.${Math.floor(client / 250)}.${client % 250}`));
}

describe("POST /api/v1/machines/sizing", () => {
  it("sizes a good machine: one power unit, every axis, the cycle, the bill and the circuit", async () => {
    const res = await post(GOOD);
    expect(res.status).toBe(200);
    const m = res.data;
    expect(m.axes.map((a: { name: string }) => a.name)).toEqual(["Clamp", "Press"]);
    for (const field of ["step", "axes", "demandLpm", "pressureBar", "pumpFlowLpm", "durationS", "hydraulicKw"]) expect(m.cycle[0]).toHaveProperty(field);
    expect(m.pump.displacementCcRev).toBeGreaterThan(0);
    expect(m.motor.ratedKw).toBeGreaterThan(0);
    expect(m.bom.filter((l: { key: string }) => l.key === "pump")).toHaveLength(1);
    expect(m.bom.map((l: { key: string }) => l.key)).toEqual(expect.arrayContaining(["cylinder:Clamp", "cylinder:Press"]));
    expect(m.circuit.components.filter((c: { kind: string }) => c.kind === "dcv").map((c: { axis: string }) => c.axis)).toEqual(["Clamp", "Press"]);
  });

  it.each([
    ["a bad axis field", { ...GOOD, axes: [CLAMP, { ...PRESS, strokeMm: 0 }] }, "axes.1.strokeMm"],
    ["an axis without its name", { ...GOOD, axes: [CLAMP, (({ name: _, ...rest }) => rest)(PRESS)] }, "axes.1.name"],
    ["two axes of one name", { ...GOOD, axes: [CLAMP, { ...PRESS, name: "Clamp" }] }, "axes.1.name"],
    [
      "a step naming no axis",
      {
        ...GOOD,
        sequence: [
          [
            { axis: "Clamp", motion: "extend" },
            { axis: "Ram", motion: "extend" },
          ],
        ],
      },
      "sequence.0.1.axis",
    ],
    ["an unknown motion", { ...GOOD, sequence: [[{ axis: "Clamp", motion: "wiggle" }]] }, "sequence.0.0.motion"],
    ["duty given on an axis", { ...GOOD, axes: [{ ...CLAMP, cyclesPerHour: 10 }, PRESS] }, "axes.0.cyclesPerHour"],
    ["a bad machine duty", { ...GOOD, hoursPerDay: 25 }, "hoursPerDay"],
    ["no axes", { ...GOOD, axes: [] }, "axes"],
    ["nine axes", { ...GOOD, axes: Array.from({ length: 9 }, (_, i) => ({ ...CLAMP, name: `Clamp ${i + 1}` })) }, "axes"],
  ])("answers %s with 400 naming the path", async (_label, body, path) => {
    expectInvalidAt(await post(body), path);
  });

  it("names the axis a load cannot be sized for", async () => {
    // 1.5 MN at 20 bar: even the largest bore would need far more (as in the axis API's test).
    const res = await post({ ...GOOD, axes: [CLAMP, { ...PRESS, processForceN: 1_500_000 }], maxPressureBar: 20 });
    expect(res.status).toBe(400);
    expect(res.data.fieldErrors.maxPressureBar[0]).toMatch(/^Press: .*at least \d+ bar/);
  });

  it.each([
    ["malformed JSON", "{ not json"],
    ["a JSON array", "[1, 2]"],
    ["JSON null", "null"],
    ["a string for the axes", JSON.stringify({ ...GOOD, axes: "Clamp" })],
    ["a prototype key", '{"axes":[{"__proto__":{"strokeMm":1}}],"cyclesPerHour":1,"hoursPerDay":1,"supplyHz":50}'],
    ["a number beyond double range", JSON.stringify(GOOD).replace('"massKg":50', '"massKg":1e400')],
    ["steps that are not lists", JSON.stringify({ ...GOOD, sequence: [1, "x", null] })],
  ])("answers %s with 400", async (_label, body) => {
    expect((await post(body)).status).toBe(400);
  });

  it("never answers 500 to hostile JSON (fast-check)", async () => {
    await fc.assert(
      fc.asyncProperty(fc.oneof(fc.jsonValue(), fc.record({ axes: fc.array(fc.jsonValue(), { maxLength: 3 }), sequence: fc.jsonValue() })), async (body) => {
        const res = await post(body);
        expect([200, 400]).toContain(res.status);
      }),
      { numRuns: 60 },
    );
  });

  it("answers GET with 405", async () => {
    expect((await call(machines.loader, new Request("http://127.0.0.1:3000/api/v1/machines/sizing"))).status).toBe(405);
  });
});
