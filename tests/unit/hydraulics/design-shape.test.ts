/** The Design carries every contract field, stable BOM keys and a sourced trail for each kind of axis. */
import { describe, expect, it } from "vitest";
import { ENGINE_VERSION, WARNING_CODES, sizeCircuit, type RequirementsInput } from "~/hydraulics";
import { num } from "~/hydraulics/format";

const BASE = {
  massKg: 1200,
  strokeMm: 500,
  extendSpeedMmS: 100,
  retractSpeedMmS: 120,
  mounting: "fixed-pinned",
  cyclesPerHour: 30,
  hoursPerDay: 8,
  supplyHz: 50,
} as const;
const AXES: Record<string, RequirementsInput> = {
  horizontal: { ...BASE, orientation: "horizontal", processForceN: 20000 },
  "vertical rod down": { ...BASE, orientation: "vertical", rodDirection: "down" },
  "vertical rod up": { ...BASE, orientation: "vertical", rodDirection: "up" },
  "inclined rod up": { ...BASE, orientation: "inclined", inclineDeg: 40, rodDirection: "up" },
};
const BOM_KEYS = [
  "pump",
  "motor",
  "coupling-bellhousing",
  "reservoir",
  "suction-strainer",
  "return-filter",
  "relief-valve",
  "directional-valve",
  "cylinder",
  "hose-pressure",
  "hose-cap",
  "hose-rod",
  "hose-return",
  "hose-suction",
  "gauge",
  "fluid-fill",
];

describe.each(Object.entries(AXES))("%s", (_name, req) => {
  const d = sizeCircuit(req);

  it("carries the engine version (semver)", () => {
    expect(d.engineVersion).toBe(ENGINE_VERSION);
    expect(ENGINE_VERSION).toMatch(/^\d+\.\d+\.\d+$/);
  });

  it("has one BOM line per component with stable keys, each with a rating for its own column", () => {
    const keys = d.bom.map((l) => l.key);
    for (const key of BOM_KEYS) expect(keys).toContain(key);
    expect(keys.includes("counterbalance-valve")).toBe(d.counterbalance !== null);
    // a centre that blocks P gets a solenoid-vented relief, bought as its own line [CP]
    const blocksP = !d.circuit.dcvPositions.center.some((pair) => pair.includes("P"));
    expect(keys.includes("relief-vent-valve")).toBe(blocksP);
    expect(d.reliefVent !== null).toBe(blocksP);
    if (blocksP) {
      expect(d.bom.find((l) => l.key === "relief-vent-valve")!.specification).toContain("24 V DC");
      expect(d.bom.find((l) => l.key === "relief-valve")!.specification).toContain("vented through port X");
    }
    for (const line of d.bom) {
      expect(line.quantity).toBeGreaterThan(0);
      expect(line.specification.length).toBeGreaterThan(10);
      expect(Number.isFinite(line.rating.value)).toBe(true);
      expect(line.rating.unit.length).toBeGreaterThan(0);
    }
    expect(d.bom.find((l) => l.key === "directional-valve")!.specification).toContain("24 V DC");
  });

  it("has a trail entry with formula, inputs { value, unit } and a source for the key numbers", () => {
    const byName = new Map(d.trail.map((t) => [t.quantity, t]));
    for (const q of [
      "bore",
      "rod",
      "pump displacement",
      "motor rating",
      "relief setting",
      "ISO 4401 size",
      "directional valve centre",
      "pressure line inner diameter",
      "reservoir volume",
      "average heat loss",
      "buckling safety factor",
    ]) {
      expect(byName.has(q), q).toBe(true);
    }
    expect(byName.get("relief setting")!.source).toContain("common practice");
    expect(byName.get("bore")!.value).toBe(d.cylinder.boreMm);
    expect(byName.get("relief setting")!.value).toBe(d.pressuresBar.reliefSetting);
    if (d.counterbalance) expect(byName.get("pilot opening pressure")!.formula).toContain("full balance");
    if (d.reliefVent) {
      expect(byName.get("relief vent pressure")!.value).toBe(d.reliefVent.ventPressureBar);
      expect(byName.get("relief vent pressure")!.source).toContain("[CP]");
      expect(byName.get("heat in neutral")!.inputs.p.value).toBe(d.reliefVent.ventPressureBar);
    }
    for (const t of d.trail) {
      for (const input of Object.values(t.inputs)) {
        expect(typeof input.unit).toBe("string");
        expect(["number", "string"]).toContain(typeof input.value);
      }
    }
  });

  it("uses only stable warning codes", () => {
    for (const w of d.warnings) {
      expect(WARNING_CODES).toContain(w.code);
      expect(w.message.length).toBeGreaterThan(20);
    }
  });
});

describe("number text for specifications", () => {
  it("matches toFixed rounding, with trailing zeros dropped", () => {
    for (const [x, k] of [
      [27.55, 1],
      [6.35, 2],
      [20, 1],
      [3.15, 2],
      [0.049, 2],
      [1234.5678, 3],
      [0.5, 0],
    ] as const) {
      expect(num(x, k)).toBe(String(Number(x.toFixed(k))));
    }
    expect(num(-1.26, 1)).toBe("-1.3");
  });
});

describe("version-2 answers not yet sized are named, never dropped", () => {
  it("a pressing phase and a double pump, both sized now, leave no such warning", () => {
    const d = sizeCircuit({
      ...AXES.horizontal,
      pressStrokeMm: 30,
      pressSpeedMmS: 10,
      pumpType: "double",
      holdMinutes: 20,
      mountingStyle: "rear-flange",
      decelTimeS: 0.5,
    });
    expect(d.warnings.some((x) => x.code === "REQUIREMENT_NOT_YET_SIZED")).toBe(false);
    expect(d.pump.type).toBe(d.warnings.some((x) => x.code === "PUMP_TYPE_NOT_SUITED") ? "fixed" : "double");
  });
  it("a version-1 request gets no such warning", () => {
    expect(sizeCircuit(AXES.horizontal).warnings.some((x) => x.code === "REQUIREMENT_NOT_YET_SIZED")).toBe(false);
  });
});
