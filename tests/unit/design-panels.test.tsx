import { warningTitle } from "~/content/warning-titles";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { CalculationTrail, CautionsPanel, ComponentTable, KeySizes, WarningsList } from "~/components/design-panels";
import { CIRCUIT_CAUTIONS } from "~/content/cautions";
import { sizeCircuit } from "~/hydraulics/index";
import { REFERENCE_PRESS } from "../support/hydraulics";

const duty = { strokeMm: 400, extendSpeedMmS: 100, retractSpeedMmS: 150, mounting: "fixed-pinned", cyclesPerHour: 60, hoursPerDay: 8, supplyHz: 50 } as const;
const press = sizeCircuit({ ...duty, orientation: "vertical", rodDirection: "down", massKg: 1200, processForceN: 60000 });
const feed = sizeCircuit({ ...duty, orientation: "horizontal", massKg: 800, processForceN: 20000 });

/** React escapes text; compare against the escaped form. */
const escaped = (s: string) => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;").replace(/'/g, "&#x27;");
const count = (html: string, pattern: RegExp) => [...html.matchAll(pattern)].length;

describe("ComponentTable", () => {
  const html = renderToStaticMarkup(<ComponentTable design={press} />);

  it("lists every bill-of-materials line with item, quantity, specification and rating", () => {
    expect(count(html, /data-bom-key="/g)).toBe(press.bom.length);
    for (const line of press.bom) {
      const row = html.match(new RegExp(`<tr data-bom-key="${line.key}">(.*?)</tr>`))![1];
      expect(row).toContain(`<th scope="row"`);
      expect(row).toContain(escaped(line.item));
      expect(row).toContain(escaped(line.specification));
      expect(row).toContain(`>${line.quantity}<`);
      expect(row).toContain(escaped(line.rating.label));
    }
  });

  it("has column headers a screen reader can announce", () => {
    expect(count(html, /<th scope="col"/g)).toBe(4);
    expect(html).toContain("<caption");
  });
});

describe("WarningsList", () => {
  it("shows each warning's title and message, not its code", () => {
    const html = renderToStaticMarkup(<WarningsList warnings={press.warnings} />);
    expect(press.warnings.length).toBeGreaterThan(0);
    expect(count(html, /data-warning="/g)).toBe(press.warnings.length);
    for (const w of press.warnings) {
      expect(html).toContain(escaped(warningTitle(w.code)));
      expect(html).not.toContain(`>${w.code}<`);
      expect(html).toContain(escaped(w.message));
    }
  });

  it("says all clear when there are none", () => {
    const html = renderToStaticMarkup(<WarningsList warnings={[]} />);
    expect(html).toContain("No warnings");
    expect(html).not.toContain("data-warning=");
  });
});

describe("CalculationTrail", () => {
  const html = renderToStaticMarkup(<CalculationTrail trail={press.trail} />);

  it("has one row per trail entry, with its quantity, formula and source", () => {
    expect(count(html, /<tr data-trail-row="">/g)).toBe(press.trail.length);
    for (const entry of press.trail) {
      expect(html).toContain(escaped(entry.quantity));
      expect(html).toContain(escaped(entry.formula));
      expect(html).toContain(escaped(entry.source));
    }
  });

  it("shows values with their units and the inputs by name", () => {
    const relief = press.trail.find((t) => t.quantity === "relief setting")!;
    expect(html).toContain(`${relief.value} bar`);
    expect(html).toContain(">p_extend</span>");
    expect(html).toContain("3:1");
  });
});

describe("CautionsPanel", () => {
  it("shows every caution under its heading", () => {
    const html = renderToStaticMarkup(<CautionsPanel />);
    expect(html).toContain("Before anyone builds this");
    expect(count(html, /<li>/g)).toBe(CIRCUIT_CAUTIONS.length);
    for (const text of CIRCUIT_CAUTIONS) expect(html).toContain(escaped(text));
  });
});

describe("KeySizes", () => {
  it("shows the headline numbers, with the counterbalance setting only when there is one", () => {
    const html = renderToStaticMarkup(<KeySizes design={press} />);
    expect(html).toContain(`Ø${press.cylinder.boreMm} / Ø${press.cylinder.rodMm} mm`);
    expect(html).toContain(`${press.pressuresBar.reliefSetting} bar`);
    expect(html).toContain(`${press.motor.ratedKw} kW`);
    expect(html).toContain(`ISO 4401-${press.directionalValve.iso4401Size}`);
    expect(html).toContain("float centre");
    expect(html).toContain(`${press.reservoir.volumeL} L`);
    expect(html).toContain('data-key-size="Counterbalance setting"');
    expect(renderToStaticMarkup(<KeySizes design={feed} />)).not.toContain("Counterbalance");
  });

  it("converts to US customary units when asked", () => {
    const html = renderToStaticMarkup(<KeySizes design={press} units="us" />);
    expect(html).toContain(`${Math.round(press.pressuresBar.reliefSetting * 14.5038).toLocaleString("en-GB")} psi`);
    expect(html).toContain("gpm");
    expect(html).not.toMatch(/\d bar</);
  });

  it("gives a US reader the metric catalogue sizes with inches and hp beside them (1 in = 25.4 mm, 1 hp = 0.74569987 kW)", () => {
    const html = renderToStaticMarkup(<KeySizes design={press} units="us" />);
    const inch = (mm: number) => (mm / 25.4).toFixed(2);
    expect(html).toContain(`>Ø${press.cylinder.boreMm} / Ø${press.cylinder.rodMm} mm<`);
    expect(html).toContain(`${inch(press.cylinder.boreMm)} / ${inch(press.cylinder.rodMm)} in · stroke`);
    expect(html).toContain(`${press.motor.ratedKw} kW (${(press.motor.ratedKw / 0.74569987).toFixed(2)} hp)`);
    expect(html).toContain(`${press.pump.displacementCcRev} cm³/rev (`);
  });
});

describe("KeySizes names the pump a shop prices", () => {
  it("says fixed, compensated or double, with each section of a double pump", () => {
    expect(renderToStaticMarkup(<KeySizes design={feed} />)).toContain(`fixed pump, ${feed.pump.displacementCcRev} cm³/rev`);
    const double = sizeCircuit({ ...REFERENCE_PRESS, pumpType: "double" });
    expect(double.pump.type).toBe("double");
    const [large, small] = double.pump.displacementsCcRev;
    expect(renderToStaticMarkup(<KeySizes design={double} />)).toContain(`double pump, ${large} cm³/rev + ${small} cm³/rev`);
    expect(renderToStaticMarkup(<KeySizes design={sizeCircuit({ ...REFERENCE_PRESS, pumpType: "compensated" })} />)).toContain("compensated pump, ");
  });
});
