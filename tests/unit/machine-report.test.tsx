import { renderToStaticMarkup } from "react-dom/server";
import { createRoutesStub } from "react-router";
import { describe, expect, it } from "vitest";
import { MachineReport, machinePhaseName } from "~/components/machine-report";
import { PublishedReport } from "~/components/design-report";
import { stepInWords } from "~/content/machine-words";
import { sizeCircuit } from "~/hydraulics";
import { warningTitle } from "~/content/warning-titles";
import { POWER_UNIT_LABEL, servedBy, summaryOf, type PublishedDesign } from "~/services/published-design";
import { formatQuantity } from "~/units";
import { CLAMP_AND_PRESS, clampAndPress } from "../support/machines";
import { UNFOLDED, reportPage } from "../support/report-page";

const machine = clampAndPress();
const html = reportPage(<MachineReport design={machine} units="metric" componentsTitle="Bill of materials" />, UNFOLDED);
const usHtml = reportPage(<MachineReport design={machine} units="us" />, UNFOLDED);

const escaped = (s: string) => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;").replace(/'/g, "&#x27;");
/** The markup of the one element that carries `attribute`, up to the end of its section. */
const sectionOf = (source: string, attribute: string) => {
  const start = source.indexOf(attribute);
  expect(start, attribute).toBeGreaterThan(-1);
  return source.slice(start, source.indexOf("</section>", start));
};
/** The value shown under a key-size label inside some markup. */
const figure = (source: string, label: string) => source.match(new RegExp(`data-key-size="${escaped(label)}"><dt[^>]*>[^<]*</dt><dd[^>]*>([^<]*)</dd>`))?.[1];

describe("MachineReport", () => {
  it("shows one card per axis, named, with that axis's own cylinder and valve", () => {
    expect(machine.axes.map((a) => a.name)).toEqual(["Clamp", "Press"]);
    for (const axis of machine.axes) {
      const card = sectionOf(html, `data-axis="${axis.name}"`);
      expect(card).toContain(`>${axis.name}</h3>`);
      expect(figure(card, "Bore / rod")).toBe(`Ø${axis.cylinder.boreMm} / Ø${axis.cylinder.rodMm} mm`);
      expect(card).toContain(`stroke ${formatQuantity("length", axis.cylinder.strokeMm, "metric")}`);
      expect(figure(card, "Directional valve")).toBe(`ISO 4401-${axis.directionalValve.iso4401Size}`);
      expect(figure(card, "Retract pressure")).toBe(formatQuantity("pressure", axis.pressuresBar.retract, "metric"));
      expect(figure(card, "Flow out")).toBe(formatQuantity("flow", axis.flowsLpm.extend, "metric"));
      expect(figure(card, "Flow back")).toBe(formatQuantity("flow", axis.flowsLpm.retract, "metric"));
      expect(figure(card, "Speed out")).toBe(formatQuantity("speed", axis.speedsMmS.extendActual, "metric"));
    }
    // The press has a pressing stroke: both its pressures are shown; the clamp has one extend pressure.
    const press = machine.axes[1];
    expect(figure(sectionOf(html, 'data-axis="Press"'), "Approach / press pressure")).toBe(
      `${formatQuantity("pressure", press.pressuresBar.approach!, "metric")} / ${formatQuantity("pressure", press.pressuresBar.press!, "metric")}`,
    );
    expect(figure(sectionOf(html, 'data-axis="Clamp"'), "Extend pressure")).toBe(formatQuantity("pressure", machine.axes[0].pressuresBar.extend, "metric"));
  });

  it("shows the power unit once, with the design's own figures", () => {
    expect(html.split("data-power-unit=").length - 1).toBe(1);
    const unit = sectionOf(html, "data-power-unit=");
    expect(figure(unit, "Pump")).toBe(formatQuantity("flow", machine.flowsLpm.pump, "metric"));
    const kind = { fixed: "fixed pump", compensated: "compensated pump", double: "double pump" }[machine.pump.type];
    expect(unit).toContain(`${kind}, ${machine.pump.displacementsCcRev.map((cc) => formatQuantity("displacement", cc, "metric")).join(" + ")}`);
    expect(figure(unit, "Motor rating")).toBe(formatQuantity("power", machine.motor.ratedKw, "metric"));
    expect(figure(unit, "Relief setting")).toBe(formatQuantity("pressure", machine.pressuresBar.reliefSetting, "metric"));
    if (machine.pump.compensatorBar !== undefined) expect(figure(unit, "Compensator")).toBe(formatQuantity("pressure", machine.pump.compensatorBar, "metric"));
    expect(figure(unit, "Reservoir")).toBe(formatQuantity("volume", machine.reservoir.volumeL, "metric"));
    expect(figure(unit, "Cooler")).toBe(machine.cooler ? formatQuantity("power", machine.cooler.kw, "metric") : "None needed");
    expect(figure(unit, "Pressure line")).toContain(`${Math.round(machine.lines.pressure.innerDiameterMm)} mm bore`);
  });

  it("converts to the reader's units", () => {
    const unit = sectionOf(usHtml, "data-power-unit=");
    expect(figure(unit, "Pump")).toBe(formatQuantity("flow", machine.flowsLpm.pump, "us"));
    expect(figure(unit, "Relief setting")).toBe(formatQuantity("pressure", machine.pressuresBar.reliefSetting, "us"));
    expect(sectionOf(usHtml, 'data-axis="Press"')).toContain(" in");
  });

  it("names who moves in every phase of the cycle", () => {
    const rows = [...html.matchAll(/<tr data-cycle-phase="[^"]*"><th[^>]*><span[^>]*>\d+<\/span>([^<]*)<\/th>/g)].map((m) => m[1]);
    expect(rows).toEqual(machine.cycle.map((ph) => escaped(machinePhaseName(ph))));
    expect(rows).toEqual(["Clamp extends", "Clamp returns", "Press approaches", "Press presses", "Press returns", "Idle, every valve in neutral"]);
    expect(html).toContain("Axes draw");
  });

  it("lists every warning, each naming its axis or the power unit", () => {
    expect(html.split("data-warning=").length - 1).toBe(machine.warnings.length);
    for (const w of machine.warnings) {
      expect(html).toContain(escaped(w.message));
      expect(html).toContain(escaped(warningTitle(w.code)));
    }
    expect(machine.warnings.some((w) => w.message.startsWith("Clamp: "))).toBe(true);
  });

  it("bills every line with the axis it serves, the power unit's lines as such", () => {
    const bill = html.slice(html.indexOf('id="bill"'));
    expect(bill.split("data-bom-key=").length - 1).toBe(machine.bom.length);
    for (const line of machine.bom) {
      const row = bill.match(new RegExp(`<tr data-bom-key="${escaped(line.key)}">(.*?)</tr>`))![1];
      const serves = row.match(/data-serves="">([^<]*)</)![1];
      expect(serves).toBe(line.key.includes(":") ? line.key.split(":")[1] : POWER_UNIT_LABEL);
    }
    expect(bill).toContain('data-bom-key="cylinder:Clamp"');
    expect(bill).toContain('data-bom-key="cylinder:Press"');
    expect(bill).toContain('data-bom-key="pump"');
  });

  it("folds the calculation trail with every step", () => {
    const trail = html.slice(html.indexOf('id="calculation-trail"'));
    expect(trail.split("data-trail-row=").length - 1).toBe(machine.trail.length);
  });

  it("draws the folded bill and trail only when opened: a link opens them without JavaScript", () => {
    const folded = reportPage(<MachineReport design={machine} units="metric" />, "/quick-sizing?bore=80");
    expect(folded).not.toContain("data-trail-row=");
    expect(folded).not.toContain("data-bom-key=");
    expect(folded).toContain('href="?bore=80&amp;show=calculation-trail#calculation-trail"');
    expect(folded).toContain('href="?bore=80&amp;show=bill#bill"');
    expect(folded).toContain(`Show ${machine.trail.length} steps`);
  });
});

describe("servedBy", () => {
  it("names the axis after the key's first colon, the power unit without one, and nothing for a design of one axis", () => {
    expect(servedBy("cylinder:Clamp", ["Clamp", "Main Clamp"])).toBe("Clamp");
    expect(servedBy("cylinder:Main Clamp", ["Clamp", "Main Clamp"])).toBe("Main Clamp");
    expect(servedBy("cylinder:A:B", ["B", "A:B"])).toBe("A:B");
    expect(servedBy("pump", ["Clamp"])).toBe(POWER_UNIT_LABEL);
    expect(servedBy("pump", [])).toBeNull();
  });
});

/** A published report as the spec page renders it (its folded detail loads through a fetcher, so inside a router). */
function publishedPage(published: PublishedDesign) {
  const lazy = { bill: { href: "/specs/s1?detail=bill", html: null }, trail: { href: "/specs/s1?detail=trail", html: null } };
  const Page = createRoutesStub([{ path: "/", Component: () => <PublishedReport published={summaryOf(published)} units="metric" lazy={lazy} /> }]);
  return renderToStaticMarkup(<Page />);
}

describe("PublishedReport", () => {
  it("shows a machine's requirements (the duty once, the cycle, each axis's own answers) and its MachineReport", () => {
    const page = publishedPage({ kind: "machine", design: machine });
    expect(page).toContain("data-machine-report");
    expect(page).toContain("What the machine must do");
    const duty = sectionOf(page, "data-machine-duty");
    expect(duty).toContain("Cycles per hour");
    expect([...duty.matchAll(/<li>([^<]*)<\/li>/g)].map((m) => m[1])).toEqual(["Clamp extends", "Clamp returns", "Press extends", "Press returns"]);
    for (const name of ["Clamp", "Press"]) {
      const asks = sectionOf(page, `data-axis-requirements="${name}"`);
      expect(asks).toContain("Stroke");
      expect(asks).not.toContain("Cycles per hour");
    }
  });

  it("shows one axis as before", () => {
    const axis = sizeCircuit({ ...CLAMP_AND_PRESS.axes[0], cyclesPerHour: 60, hoursPerDay: 8, supplyHz: 50 });
    const page = publishedPage({ kind: "axis", design: axis });
    expect(page).not.toContain("data-machine-report");
    expect(page).toContain("What the axis must do");
    expect(page).toContain('data-key-size="Bore / rod"');
  });

  it("leaves the bill and the trail out of the page, counted, each behind a link that loads it", () => {
    const axis = sizeCircuit({ ...CLAMP_AND_PRESS.axes[0], cyclesPerHour: 60, hoursPerDay: 8, supplyHz: 50 });
    for (const page of [publishedPage({ kind: "axis", design: axis }), publishedPage({ kind: "machine", design: machine })]) {
      expect(page).not.toContain("data-trail-row");
      expect(page).not.toContain("data-bom-key");
      expect(page).toContain('href="/specs/s1?detail=bill#bill"');
      expect(page).toContain('href="/specs/s1?detail=trail#calculation-trail"');
    }
    expect(publishedPage({ kind: "axis", design: axis })).toContain(`Show ${axis.trail.length} steps`);
    expect(publishedPage({ kind: "machine", design: machine })).toContain(`Show all ${machine.bom.length} lines`);
  });
});

describe("stepInWords", () => {
  it("says who moves together and who returns meanwhile", () => {
    expect(stepInWords([{ axis: "Feed", motion: "extend" }])).toBe("Feed extends");
    expect(
      stepInWords([
        { axis: "Clamp A", motion: "extend" },
        { axis: "Clamp B", motion: "extend" },
        { axis: "Feed", motion: "retract" },
      ]),
    ).toBe("Clamp A and Clamp B extend while Feed returns");
  });
});
