import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { CycleChart, PHASE_NAMES } from "~/components/cycle-chart";
import { DesignReport } from "~/components/design-report";
import { sizeCircuit, type Design } from "~/hydraulics";
import { formatQuantity } from "~/units";
import { reportPage } from "../support/report-page";
import { REFERENCE_PRESS } from "../support/hydraulics";

// A two-speed press with a double pump and a dwell, 30 cycles an hour: every phase, a long idle.
const press = sizeCircuit({ ...REFERENCE_PRESS, dwellS: 3, cyclesPerHour: 30, pumpType: "double" });
const cycle = press.cycle!;

const count = (html: string, pattern: RegExp) => [...html.matchAll(pattern)].length;
const escaped = (s: string) => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;");

/** The points of an SVG path made of M and L commands. */
const pathPoints = (d: string) => [...d.matchAll(/[ML]([\d.-]+),([\d.-]+)/g)].map((m) => [Number(m[1]), Number(m[2])]);

describe("CycleChart", () => {
  const html = renderToStaticMarkup(<CycleChart cycle={cycle} />);

  it("draws pressure, flow and power on the server, once for phones and once for wider screens and print", () => {
    // three panels in each of the two sizes, each a complete SVG before any JavaScript runs
    expect(count(html, /<svg[^>]*data-cycle-panel=""/g)).toBe(6);
    expect(html).toContain('class="hidden md:block print:block" data-cycle-size="wide"');
    expect(html).toContain('class="overflow-x-auto md:hidden print:hidden" data-cycle-size="narrow"');
    // four lines per size: pressure, pump delivery, cylinder demand (dashed), power
    expect(count(html, /data-cycle-line=""/g)).toBe(8);
    expect(count(html, /stroke-dasharray="5 3"[^>]*data-cycle-line=""/g)).toBe(2);
  });

  it("draws steps: each phase holds its value, so every segment is level or upright", () => {
    const paths = [...html.matchAll(/data-cycle-line="" d="([^"]+)"/g)].map((m) => m[1]);
    expect(paths.length).toBe(8);
    for (const d of paths) {
      const pts = pathPoints(d);
      // one level run per phase: at least 2 points per phase
      expect(pts.length).toBeGreaterThanOrEqual(2 * cycle.length);
      for (let i = 1; i < pts.length; i++) {
        const level = Math.abs(pts[i][1] - pts[i - 1][1]) < 1e-6;
        const upright = Math.abs(pts[i][0] - pts[i - 1][0]) < 1e-6;
        expect(level || upright).toBe(true);
      }
    }
  });

  it("hides the drawing from screen readers and gives them every number in a table with plain phase names", () => {
    expect(html).toMatch(/<div aria-hidden="true" class="mt-2">/);
    expect(count(html, /<tr data-cycle-phase=/g)).toBe(cycle.length);
    expect(html).toContain("<caption");
    expect(count(html, /<th scope="col"/g)).toBe(6);
    for (const ph of cycle) {
      const row = html.match(new RegExp(`<tr data-cycle-phase="${ph.phase}">(.*?)</tr>`))![1];
      expect(row).toContain('<th scope="row"');
      expect(row).toContain(escaped(PHASE_NAMES[ph.phase]));
      expect(row).toContain(formatQuantity("pressure", ph.pressureBar, "metric"));
      expect(row).toContain(formatQuantity("flow", ph.pumpFlowLpm, "metric"));
      expect(row).toContain(formatQuantity("power", ph.hydraulicKw, "metric"));
    }
    expect(html).toContain("Dwell at force");
    expect(html).toContain("Idle, valve in neutral");
  });

  it("says the idle time is drawn shortened and how long it really is", () => {
    const idle = cycle.find((ph) => ph.phase === "neutral")!;
    expect(idle.shownS).toBeLessThan(idle.durationS);
    // 3600 / 30 = 120 s a cycle, less the strokes and the dwell
    expect(html).toContain(`it lasts ${Math.round(idle.durationS)}\u00a0s`);
  });

  it("shows US customary units when asked", () => {
    const us = renderToStaticMarkup(<CycleChart cycle={cycle} units="us" />);
    expect(us).toContain("psi");
    expect(us).toContain("US gpm");
    expect(us).toContain(" hp");
    expect(us).not.toMatch(/\d bar</);
  });
});

describe("a design stored before the engine listed its cycle", () => {
  // Published specs keep the design of the engine they were published with (JSON in the database).
  const stored = JSON.parse(JSON.stringify(press)) as Design;
  delete stored.cycle;
  stored.engineVersion = "2.9.0";

  it("shows no chart and does not fail", () => {
    expect(renderToStaticMarkup(<CycleChart cycle={stored.cycle} />)).toBe("");
    expect(renderToStaticMarkup(<CycleChart cycle={[]} />)).toBe("");
    const report = reportPage(<DesignReport design={stored} units="metric" />);
    expect(report).not.toContain("data-cycle-chart");
    expect(report).toContain("Key sizes");
  });

  it("while a current design shows the chart beside the key sizes", () => {
    const report = reportPage(<DesignReport design={press} units="metric" />);
    expect(report).toContain("data-cycle-chart");
    expect(report.indexOf("Key sizes")).toBeLessThan(report.indexOf("data-cycle-chart"));
  });
});
