import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { CircuitDiagram } from "~/components/circuit-diagram";
import { layoutCircuit } from "~/components/circuit-diagram/layout";
import { junctions, routeConnections } from "~/components/circuit-diagram/routes";
import type { CircuitComponent } from "~/hydraulics/design";
import { sizeCircuit, type Design } from "~/hydraulics/index";
import { dcvPositions } from "~/hydraulics/valves";
import { HANGING_PRESS, LONG_FEED } from "../support/hydraulics";

// Three axes that exercise the three circuit shapes: no counterbalance valve, one on the rod
// side (the load pulls the rod out), one on the cap side (the load pushes the rod in).
const duty = { strokeMm: 400, extendSpeedMmS: 100, retractSpeedMmS: 150, mounting: "fixed-pinned", cyclesPerHour: 60, hoursPerDay: 8, supplyHz: 50 } as const;
const feed = sizeCircuit({ ...duty, orientation: "horizontal", massKg: 800, processForceN: 20000 });
const press = sizeCircuit({ ...duty, orientation: "vertical", rodDirection: "down", massKg: 1200, processForceN: 60000 });
const lift = sizeCircuit({ ...duty, orientation: "inclined", inclineDeg: 35, rodDirection: "up", massKg: 2000 });

const render = (design: Design, units?: "metric" | "us") => renderToStaticMarkup(<CircuitDiagram design={design} units={units} />);
const attrs = (html: string, selector: RegExp) => [...html.matchAll(selector)];

/** The attributes of the position box of the 4/3 valve, e.g. { paths: "A-T,B-T", blocked: "P" }. */
function positionBox(html: string, position: "left" | "center" | "right") {
  const m = html.match(new RegExp(`data-position="${position}" data-paths="([^"]*)" data-blocked="([^"]*)"`));
  if (!m) throw new Error(`no ${position} box`);
  return { paths: m[1], blocked: m[2] };
}

/** A copy of a design with another centre condition, to check the drawing follows the data. */
const withCentre = (design: Design, center: "closed" | "open"): Design => ({
  ...design,
  circuit: { ...design.circuit, dcvPositions: dcvPositions(center) },
});

describe("CircuitDiagram", () => {
  it("is an accessible SVG whose title and description summarise the circuit", () => {
    const html = render(press);
    expect(html).toMatch(/^<svg[^>]+role="img"/);
    expect(html).toMatch(/viewBox="0 0 \d+ \d+"/);
    const [, labelledBy] = html.match(/aria-labelledby="([^"]+)"/)!;
    for (const id of labelledBy.split(" ")) expect(html).toContain(`id="${id}"`);
    expect(html).toMatch(/<title[^>]*>Preliminary hydraulic circuit: float centre 4\/3 valve with a counterbalance valve<\/title>/);
    const desc = html.match(/<desc[^>]*>(.*?)<\/desc>/)![1];
    expect(desc).toContain(`Counterbalance valve on the rod side set to ${Math.round(press.counterbalance!.settingBar)} bar with pilot ratio 3:1`);
    expect(desc).toContain("In neutral it joins A to T and B to T; P is blocked");
    expect(desc).toContain(`Relief valve set to ${press.pressuresBar.reliefSetting} bar`);
  });

  it("draws no counterbalance valve, and none of its ports 1, 2, 3, when the design has none", () => {
    expect(feed.counterbalance).toBeNull();
    const html = render(feed);
    expect(html).not.toContain('data-kind="cbv"');
    expect(html).not.toMatch(/data-port="cbv\.[123]"/);
    expect(html).not.toContain('data-line="pilot"');
    expect(html).toContain("without a counterbalance valve");
  });

  it("draws the counterbalance valve with ports 1, 2, 3 and a dashed pilot to the opposite work line", () => {
    for (const [design, pilotFrom] of [
      [press, "dcv.A"],
      [lift, "dcv.B"],
    ] as const) {
      const html = render(design);
      expect(html).toContain('data-component="cbv" data-kind="cbv"');
      for (const port of ["1", "2", "3"]) expect(html).toMatch(new RegExp(`data-port="cbv\\.${port}"[^>]*>${port}<`));
      const pilot = html.match(/<path[^>]*data-line="pilot"[^>]*>/)![0];
      expect(pilot).toContain(`data-from="${pilotFrom}"`);
      expect(pilot).toContain('data-to="cbv.3"');
      expect(pilot).toMatch(/stroke-dasharray="[\d.]+ [\d.]+"/);
    }
  });

  it("puts the valve on the side the data names: rod side for the press, cap side for the lift", () => {
    expect(render(press)).toMatch(/data-from="cbv.1" data-to="cylinder.rod"/);
    expect(render(lift)).toMatch(/data-from="cbv.1" data-to="cylinder.cap"/);
  });

  it("draws every connection of the circuit as a path between its two ports", () => {
    for (const design of [feed, press, lift]) {
      const html = render(design);
      const drawn = attrs(html, /<path[^>]*data-from="([^"]+)" data-to="([^"]+)" data-line="([^"]+)"/g).map((m) => `${m[1]}>${m[2]}:${m[3]}`);
      const expected = design.circuit.connections.map((c) => `${c.from}>${c.to}:${c.line}`);
      expect(drawn.sort()).toEqual(expected.sort());
    }
  });

  it("draws a tank symbol at each line that ends at the reservoir", () => {
    const html = render(feed);
    const toTank = feed.circuit.connections.filter((c) => c.from.startsWith("tank.") || c.to.startsWith("tank.")).length;
    expect(attrs(html, /data-kind="tank"/g)).toHaveLength(toTank);
  });

  it("draws the float centre with A and B to T and P blocked (T-stop)", () => {
    const html = render(press);
    expect(positionBox(html, "center")).toEqual({ paths: "A-T,B-T", blocked: "P" });
    expect(html).toMatch(/data-position="center"[^>]*>(?:(?!data-position).)*data-blocked-port="P"/);
  });

  it("draws the tandem centre with P to T and A, B blocked", () => {
    const html = render(feed);
    expect(positionBox(html, "center")).toEqual({ paths: "P-T", blocked: "A,B" });
  });

  it("follows the centre condition in the data, whatever it is", () => {
    expect(positionBox(render(withCentre(feed, "closed")), "center")).toEqual({ paths: "", blocked: "P,T,A,B" });
    expect(positionBox(render(withCentre(feed, "open")), "center")).toEqual({ paths: "P-T,A-T,B-T", blocked: "" });
  });

  it("draws the shifted positions as parallel (P→A, B→T) and crossed (P→B, A→T) flow", () => {
    const html = render(press);
    expect(positionBox(html, "left")).toEqual({ paths: "P-A,B-T", blocked: "" });
    expect(positionBox(html, "right")).toEqual({ paths: "P-B,A-T", blocked: "" });
  });

  it("labels the valve ports P, T, A, B and the cylinder's cap and rod ports", () => {
    const html = render(feed);
    for (const port of ["P", "T", "A", "B"]) expect(html).toMatch(new RegExp(`data-port="dcv\\.${port}"[^>]*>${port}<`));
    expect(html).toMatch(/data-port="cylinder.cap"[^>]*>cap</);
    expect(html).toMatch(/data-port="cylinder.rod"[^>]*>rod</);
  });

  it("draws the solenoid vent valve beside a relief that the data vents: dashed from port X, solid to its own tank", () => {
    // Float centre blocks P, so the engine vents the relief (common practice); the drawing follows the data.
    for (const design of [press, lift]) {
      const vent = design.circuit.components.find((c) => c.kind === "vent")!;
      expect(vent.ports).toEqual(["P", "T"]);
      const html = render(design);
      expect(html).toContain('data-component="vent" data-kind="vent"');
      for (const port of ["P", "T"]) expect(html).toMatch(new RegExp(`data-port="vent\\.${port}"[^>]*>${port}<`));
      expect(html).toMatch(/data-port="relief\.X"[^>]*>X</);
      // ISO 1219-1 style 2/2: a solenoid, a return spring, the normal box open P-T, the energised box blocking both
      const symbol = html.match(/<g data-component="vent" data-kind="vent">(.*?)<\/g><text/)![1];
      expect(symbol).toContain('data-actuator="solenoid"');
      expect(symbol).toMatch(/data-position="normal" data-paths="P-T" data-blocked=""/);
      expect(symbol).toMatch(/data-position="energised" data-paths="" data-blocked="P,T"/);
      expect(symbol).toMatch(/<polyline[^>]*points="[^"]+"/); // the spring
      const ventLine = html.match(/<path[^>]*data-from="relief.X"[^>]*>/)![0];
      expect(ventLine).toContain('data-to="vent.P"');
      expect(ventLine).toContain('data-line="pilot"');
      expect(ventLine).toMatch(/stroke-dasharray="[\d.]+ [\d.]+"/);
      const toTank = html.match(/<path[^>]*data-from="vent.T"[^>]*>/)![0];
      expect(toTank).toContain('data-to="tank.return"');
      expect(toTank).not.toContain("stroke-dasharray");
      // a tank symbol under the vent valve's T line, at its x
      const tx = Number(toTank.match(/d="M([\d.]+) /)![1]);
      expect(html).toMatch(new RegExp(`data-kind="tank"><polyline points="${tx - 20},`));
      expect(html).toContain("Vent valve");
      expect(html).toContain("2/2, normally open");
      expect(html).toContain(`vents at ${design.reliefVent!.ventPressureBar} bar`);
      const desc = html.match(/<desc[^>]*>(.*?)<\/desc>/)![1];
      expect(desc).toContain("Normally open 2/2 solenoid vent valve on the relief&#x27;s vent port X");
    }
  });

  it("draws no vent valve and no port X when the centre unloads the pump (tandem)", () => {
    expect(feed.reliefVent).toBeNull();
    const html = render(feed);
    expect(html).not.toContain('data-kind="vent"');
    expect(html).not.toContain('data-port="relief.X"');
    expect(html).not.toContain("Vent valve");
  });

  it("shows the sized values beside the symbols", () => {
    const html = render(press);
    const { boreMm, rodMm, strokeMm } = press.cylinder;
    expect(html).toContain(`Ø${boreMm} / Ø${rodMm} × ${strokeMm} mm`);
    expect(html).toContain(`set ${press.pressuresBar.reliefSetting} bar`);
    expect(html).toContain(`ISO 4401-${press.directionalValve.iso4401Size}`);
    expect(html).toContain("float centre");
    expect(html).toContain(`${press.pump.displacementCcRev} cm³/rev`);
    expect(html).toContain(`${press.motor.ratedKw} kW`);
    expect(html).toContain("pilot ratio 3:1");
  });

  it("shows US customary values when asked (1 bar = 14.5038 psi, 1 in = 25.4 mm)", () => {
    const html = render(press, "us");
    const psi = Math.round(press.pressuresBar.reliefSetting * 14.5038).toLocaleString("en-GB");
    expect(html).toContain(`set ${psi} psi`);
    // The cylinder is a metric catalogue size: the metric bore and rod first, inches beside them.
    expect(html).toContain(
      `Ø${press.cylinder.boreMm} / Ø${press.cylinder.rodMm} mm (${(press.cylinder.boreMm / 25.4).toFixed(2)} / ${(press.cylinder.rodMm / 25.4).toFixed(2)} in)`,
    );
    expect(html).toContain(`stroke ${(press.cylinder.strokeMm / 25.4).toFixed(2)} in`);
    // The motor is an IEC rating in kW, with hp beside it (1 hp = 0.74569987 kW).
    expect(html).toContain(`${press.motor.ratedKw} kW (${(press.motor.ratedKw / 0.74569987).toFixed(2)} hp)`);
    expect(html).toContain("gpm");
    expect(html).not.toContain(" bar<");
  });

  it("leaves out a component the circuit does not list, with its lines", () => {
    const noGauge: Design = {
      ...feed,
      circuit: {
        ...feed.circuit,
        components: feed.circuit.components.filter((c) => c.kind !== "gauge"),
        connections: feed.circuit.connections.filter((c) => !c.to.startsWith("gauge.")),
      },
    };
    const html = render(noGauge);
    expect(html).not.toContain('data-kind="gauge"');
    expect(html).not.toContain('data-to="gauge.port"');
    expect(html).toContain('data-kind="pump"');
  });
});

// ---- Every component a design calls for -------------------------------------------------------

const held = sizeCircuit({ ...duty, orientation: "vertical", rodDirection: "down", massKg: 1200, processForceN: 60000, holdMinutes: 30 });
const heldBoth = sizeCircuit({ ...duty, orientation: "horizontal", massKg: 500, holdMinutes: 30 });
const hot = sizeCircuit({
  ...duty,
  orientation: "horizontal",
  massKg: 800,
  processForceN: 80000,
  dwellS: 20,
  cyclesPerHour: 120,
  hoursPerDay: 16,
  ambientC: 40,
});
const double = sizeCircuit({ ...HANGING_PRESS, pumpType: "double" });
const compensated = sizeCircuit({ ...HANGING_PRESS, pumpType: "compensated" });
const fixedPress = sizeCircuit({ ...HANGING_PRESS, orientation: "horizontal", massKg: 500, pumpType: "fixed" });
/** 1.6 m horizontal feed, 50 kN at the end, 200 mm/s both ways: it regenerates, ended by a pressure switch (regenerative.test.ts). */
const longFeed = sizeCircuit(LONG_FEED);
const ALL = { feed, press, lift, held, heldBoth, hot, double, compensated, fixedPress, longFeed };

/**
 * Every kind the circuit may hold; `satisfies` makes the compiler ask for a new kind here.
 * "machine": only a machine's circuit holds it, drawn in tests/unit/machine-circuit-diagram.test.tsx.
 */
const KINDS = {
  pump: true,
  motor: true,
  relief: true,
  vent: true,
  dcv: true,
  cbv: true,
  cylinder: true,
  tank: true,
  filter: true,
  gauge: true,
  strainer: true,
  regen: true,
  poc: true,
  cooler: true,
  decompression: true,
  unloading: true,
  check: true,
  "flow-control": true,
  reducing: "machine",
  accumulator: "machine",
  "accumulator-block": "machine",
  bypass: true,
  "pressure-switch": true,
  "limit-switch": true,
} satisfies Record<CircuitComponent["kind"], true | "machine">;

const desc = (html: string) => html.match(/<desc[^>]*>(.*?)<\/desc>/)![1].replaceAll("&#x27;", "'");

describe("CircuitDiagram: every component the design calls for", () => {
  it("the designs under test hold every kind of component an axis may have", () => {
    const kinds = new Set(Object.values(ALL).flatMap((d) => d.circuit.components.map((c) => c.kind)));
    expect([...kinds].sort()).toEqual(
      Object.keys(KINDS)
        .filter((k) => KINDS[k as keyof typeof KINDS] === true)
        .sort(),
    );
  });

  it.each(Object.entries(ALL))("%s: draws each component with its own symbol (none left out, no stand-in box)", (_name, design) => {
    const html = render(design);
    for (const c of design.circuit.components) {
      if (c.kind === "tank") continue; // drawn at each line that ends at the reservoir
      expect(html, c.id).toContain(`data-component="${c.id}" data-kind="${c.kind}"`);
    }
    const drawn = attrs(html, /<path[^>]*data-from="([^"]+)" data-to="([^"]+)"/g).map((m) => `${m[1]}>${m[2]}`);
    expect(drawn.sort()).toEqual(design.circuit.connections.map((c) => `${c.from}>${c.to}`).sort());
  });

  it.each(Object.entries(ALL))("%s: joins every line to its ports: at the port itself, or as a tee onto a line of the same net", (_name, design) => {
    const layout = layoutCircuit(design.circuit);
    const routes = routeConnections(design.circuit, layout);
    expect(routes).toHaveLength(design.circuit.connections.length);
    const same = (a: { x: number; y: number }, b: { x: number; y: number }) => Math.abs(a.x - b.x) < 0.01 && Math.abs(a.y - b.y) < 0.01;
    const onLine = (p: { x: number; y: number }, others: typeof routes) =>
      others.some((r) =>
        r.points.some((q, i) => {
          if (i === 0) return false;
          const a = r.points[i - 1];
          return (
            (Math.abs(a.x - q.x) < 0.01 && Math.abs(p.x - q.x) < 0.01 && p.y >= Math.min(a.y, q.y) && p.y <= Math.max(a.y, q.y)) ||
            (Math.abs(a.y - q.y) < 0.01 && Math.abs(p.y - q.y) < 0.01 && p.x >= Math.min(a.x, q.x) && p.x <= Math.max(a.x, q.x))
          );
        }),
      );
    for (const r of routes) {
      const first = r.points[0];
      const last = r.points[r.points.length - 1];
      const from = layout.ports[r.connection.from];
      const to = layout.ports[r.connection.to];
      expect(from ?? to, `${r.connection.from} > ${r.connection.to}`).toBeDefined();
      // each end is at its own port, or (a tee) on another drawn line that shares the same port
      for (const [end, port, ref] of [
        [first, from, r.connection.from],
        [last, to, r.connection.to],
      ] as const) {
        if (r.tank && ref.startsWith("tank.")) {
          expect(end.y).toBeCloseTo(r.tank.top + 6);
          continue;
        }
        if (port && same(end, port)) continue;
        const other = ref === r.connection.from ? r.connection.to : r.connection.from;
        const partners = routes.filter((x) => x !== r && x.connection.line !== "pilot" && [x.connection.from, x.connection.to].includes(ref));
        expect(onLine(end, partners), `${ref} (line to ${other})`).toBe(true);
      }
      // orthogonal runs only
      r.points.forEach((q, i) => i > 0 && expect(q.x === r.points[i - 1].x || q.y === r.points[i - 1].y).toBe(true));
    }
  });

  it("draws the pilot-operated check (free flow 2 → 1) with ports 1, 2, X and its pilot teed onto the opposite work line", () => {
    const html = render(held);
    expect(html).toContain('data-component="poc-rod" data-kind="poc" data-free-flow="2-1"');
    for (const port of ["1", "2", "X"]) expect(html).toMatch(new RegExp(`data-port="poc-rod\\.${port}"[^>]*>${port}<`));
    const pilot = html.match(/<path[^>]*data-to="poc-rod.X"[^>]*>/)![0];
    expect(pilot).toContain('data-from="dcv.A"');
    expect(pilot).toContain('data-line="pilot"');
    expect(pilot).toMatch(/stroke-dasharray="[\d.]+ [\d.]+"/);
    // the tee: a straight dashed run from the cap line's column, with a junction dot where it leaves
    const [, x1, y1, x2, y2] = pilot.match(/d="M([\d.]+) ([\d.]+) L([\d.]+) ([\d.]+)"/)!.map(Number);
    expect(y1).toBe(y2);
    expect(html).toContain(`cx="${Math.min(x1, x2)}" cy="${y1}" r="3"`);
    // the check at the cylinder port, the counterbalance valve between it and the valve
    expect(html).toMatch(/data-from="poc-rod.1" data-to="cylinder.rod"/);
    expect(html).toMatch(/data-from="cbv.1" data-to="poc-rod.2"/);
    expect(html).toContain("Pilot-operated check");
    expect(html).toContain(`pilot ratio ${held.holding!.pilotRatio}:1`);
    expect(desc(html)).toContain("Pilot-operated check valve on the rod port holds the load leak-tight");
  });

  it("crosses the two pilots of checks on both ports without a junction dot between them", () => {
    const layout = layoutCircuit(heldBoth.circuit);
    const routes = routeConnections(heldBoth.circuit, layout);
    const pilots = routes.filter((r) => r.connection.line === "pilot" && r.connection.to.startsWith("poc-"));
    expect(pilots.map((r) => `${r.connection.from}>${r.connection.to}`).sort()).toEqual(["dcv.A>poc-rod.X", "dcv.B>poc-cap.X"]);
    const dots = junctions(routes);
    const [a, b] = pilots;
    // no dot lies on both pilots: they cross, they are not joined
    const on = (p: { x: number; y: number }, r: (typeof routes)[number]) =>
      r.points.some(
        (q, i) =>
          i > 0 &&
          ((q.x === r.points[i - 1].x && p.x === q.x && p.y >= Math.min(q.y, r.points[i - 1].y) && p.y <= Math.max(q.y, r.points[i - 1].y)) ||
            (q.y === r.points[i - 1].y && p.y === q.y && p.x >= Math.min(q.x, r.points[i - 1].x) && p.x <= Math.max(q.x, r.points[i - 1].x))),
      );
    expect(dots.filter((p) => on(p, a) && on(p, b))).toEqual([]);
    expect(desc(render(heldBoth))).toContain("Pilot-operated check valves on the cap and rod ports hold the load leak-tight");
  });

  it("draws the double pump: two sections on one shaft, the check into the system line, the unloading valve piloted from it", () => {
    const html = render(double);
    expect(attrs(html, /data-kind="pump"/g)).toHaveLength(2);
    expect(html).toMatch(/<path[^>]*data-from="pump.shaft" data-to="pump-large.shaft" data-line="shaft"/);
    expect(html).toContain('data-component="pump-check" data-kind="check" data-free-flow="inlet-outlet"');
    expect(html).toContain('data-component="unloading" data-kind="unloading" data-pilot="external"');
    const pilot = html.match(/<path[^>]*data-to="unloading.X"[^>]*>/)![0];
    expect(pilot).toContain('data-from="pump-check.outlet"');
    expect(pilot).toMatch(/stroke-dasharray/);
    // the check's inlet is below its outlet: oil rises from the large section into the system line
    const layout = layoutCircuit(double.circuit);
    expect(layout.ports["pump-check.inlet"].y).toBeGreaterThan(layout.ports["pump-check.outlet"].y);
    const [large, small] = double.pump.displacementsCcRev;
    expect(html).toContain(`large ${large} cm³/rev`);
    expect(html).toContain(`small ${small} cm³/rev`);
    expect(html).toContain(`unloads above ${double.pump.unloadingBar} bar`);
    const text = desc(html);
    expect(text).toContain("Double (high-low) pump, two sections on one shaft");
    expect(text).toContain("through a check valve that lets oil pass only from the large section into the system line");
    expect(text).toContain(
      `dumped to tank by an unloading valve, piloted from the system line, once the system pressure passes ${double.pump.unloadingBar} bar`,
    );
  });

  it("draws the compensated pump with the variable arrow and its compensator, and names its settings", () => {
    const html = render(compensated);
    expect(html).toMatch(/data-component="pump" data-kind="pump" data-variable="" data-compensated=""/);
    expect(html).toContain("data-compensator");
    expect(html).toContain(`compensator ${compensated.pump.compensatorBar} bar`);
    if (compensated.pump.powerLimitKw !== undefined) expect(html).toContain("power limit");
    expect(desc(html)).toContain("Pressure-compensated variable-displacement pump");
    expect(desc(html)).toContain("Its compensator, piloted from the pump's own outlet");
    expect(render(feed)).not.toContain("data-variable");
  });

  it("draws the cooler after the return filter and the decompression valve with a tank of its own", () => {
    const html = render(hot);
    expect(html).toContain('data-component="cooler" data-kind="cooler"');
    expect(html).toMatch(/data-from="filter.outlet" data-to="cooler.inlet"/);
    expect(html).toContain("Oil cooler");
    expect(desc(html)).toContain("Oil cooler after the return filter sheds");
    const d = render(double);
    expect(d).toContain('data-component="decompression" data-kind="decompression"');
    expect(d).toContain("Decompression valve");
    const layout = layoutCircuit(double.circuit);
    const toTank = routeConnections(double.circuit, layout).find((r) => r.connection.from === "decompression.2")!;
    expect(toTank.tank!.top).toBeLessThan(layout.tankY); // a short drop beside the cylinder, not down the whole sheet
    expect(desc(d)).toContain("Decompression valve, a normally closed 2/2 solenoid valve with an orifice, joined to the cap port");
  });

  it("draws the pressing-speed control with its normally closed bypass across it", () => {
    const html = render(fixedPress);
    expect(html).toContain('data-component="press-flow" data-kind="flow-control" data-controlled="2-1" data-free-flow="1-2"');
    const bypass = html.match(/<g data-component="press-bypass" data-kind="bypass" data-normally="closed">(.*?)<\/g><text/)![1];
    expect(bypass).toMatch(/data-position="normal" data-paths="" data-blocked="1,2"/);
    expect(bypass).toMatch(/data-position="energised" data-paths="1-2" data-blocked=""/);
    expect(bypass).toContain('data-actuator="solenoid"');
    expect(html).toContain(`set ${Number(fixedPress.pressSpeedControl!.settingLpm.toFixed(1))} L/min`);
    expect(desc(html)).toContain("meter-in flow control in the cap line sets the pressing speed");
  });

  it("the regenerating designs under test really regenerate, one ended by a pressure switch, one by the limit switch", () => {
    expect(longFeed.regeneration).toMatchObject({ endsBy: "pressure-switch", switchBar: 25 });
    expect(fixedPress.regeneration?.endsBy).toBe("limit-switch");
  });

  it.each([
    ["longFeed", longFeed],
    ["fixedPress", fixedPress],
  ] as const)("%s: draws the 3/2 regeneration valve in the rod line, its positions as the data gives them", (_n, design) => {
    const html = render(design);
    const symbol = html.match(/<g data-component="regen" data-kind="regen" data-ports="3\/2">(.*?)<\/g><text/)![1];
    // de-energised 1–2 (rod port to B) with 3 blocked; energised 1–3 (rod port to the cap line) with 2 blocked
    expect(symbol).toMatch(/data-position="normal" data-paths="1-2" data-blocked="3"/);
    expect(symbol).toMatch(/data-position="energised" data-paths="1-3" data-blocked="2"/);
    expect(symbol).toMatch(/data-position="normal"(?:(?!data-position).)*data-blocked-port="3"/);
    expect(symbol).toMatch(/data-position="energised"(?:(?!data-position).)*data-blocked-port="2"/);
    expect(symbol).toContain('data-actuator="solenoid"');
    for (const port of ["1", "2", "3"]) expect(html).toMatch(new RegExp(`data-port="regen\\.${port}"[^>]*>${port}<`));
    const layout = layoutCircuit(design.circuit);
    const routes = routeConnections(design.circuit, layout);
    const route = (from: string, to: string) => routes.find((r) => r.connection.from === from && r.connection.to === to)!;
    // in the rod column: straight up to the rod port, down to B; port 3 across to port A
    const up = route("regen.1", "cylinder.rod").points;
    expect(up).toHaveLength(2);
    expect(up[0].x).toBe(layout.ports["cylinder.rod"].x);
    expect(route("dcv.B", "regen.2").points.at(-1)).toEqual(expect.objectContaining({ x: layout.ports["regen.2"].x, y: layout.ports["regen.2"].y }));
    const across = route("regen.3", "dcv.A").points;
    expect(across.at(-1)).toEqual(expect.objectContaining({ x: layout.ports["dcv.A"].x, y: layout.ports["dcv.A"].y }));
    // port 3's line (cap-line oil) never meets or crosses the B line's: they are different lines
    const segments = (pts: { x: number; y: number }[]) => pts.slice(1).map((q, i) => [pts[i], q] as const);
    const meet = (
      [a, b]: readonly [{ x: number; y: number }, { x: number; y: number }],
      [c, d]: readonly [{ x: number; y: number }, { x: number; y: number }],
    ) =>
      Math.max(Math.min(a.x, b.x), Math.min(c.x, d.x)) <= Math.min(Math.max(a.x, b.x), Math.max(c.x, d.x)) &&
      Math.max(Math.min(a.y, b.y), Math.min(c.y, d.y)) <= Math.min(Math.max(a.y, b.y), Math.max(c.y, d.y));
    for (const s3 of segments(across)) for (const sb of segments(route("dcv.B", "regen.2").points)) expect(meet(s3, sb)).toBe(false);
    // below every other valve: at the valve stack
    expect(layout.at.regen.y).toBeGreaterThan(layout.at["press-flow"]?.y ?? 0);
    expect(html).toContain("Regeneration valve");
    expect(html).toContain(design.regeneration!.switchBar !== null ? `until ${design.regeneration!.switchBar} bar` : "until the limit switch");
    expect(html).not.toMatch(/Regeneration valve<\/tspan><tspan[^>]*>2\/2/);
    const text = desc(html);
    expect(text).toContain(
      "3/2 solenoid regeneration valve in the rod line at the valve stack: de-energised it joins the cylinder's rod port (1) to valve port B (2) and blocks the cap line (3); energised during the approach it joins the cylinder's rod port (1) to the cap line (3) and blocks valve port B (2)",
    );
    expect(text).not.toContain("2/2 solenoid regeneration");
  });

  it("draws the pressure switch on the cap line it senses, teed straight across, with the design's setting", () => {
    const html = render(longFeed);
    expect(html).toContain('data-component="regeneration-pressure-switch" data-kind="pressure-switch"');
    const layout = layoutCircuit(longFeed.circuit);
    const tee = routeConnections(longFeed.circuit, layout).find((r) => r.connection.to === "regeneration-pressure-switch.port")!;
    expect(tee.points).toHaveLength(2);
    expect(tee.points[0].y).toBe(tee.points[1].y);
    expect(tee.points[0].x).toBe(layout.ports["cylinder.cap"].x); // on the cap column, not the rod line
    expect(html).toContain(`cx="${tee.points[0].x}" cy="${tee.points[0].y}" r="3"`); // its junction dot
    expect(html).toContain("set 25 bar");
    expect(desc(html)).toContain("Pressure switch on the cap line set to 25 bar: it de-energises the regeneration valve as the tool meets the work");
    expect(html).not.toContain('data-kind="limit-switch"');
  });

  it("marks the limit switch at the cylinder, beyond the rod end, with what it switches", () => {
    const html = render(fixedPress);
    expect(html).toContain('data-component="press-limit-switch" data-kind="limit-switch"');
    const layout = layoutCircuit(fixedPress.circuit);
    const mark = layout.at["press-limit-switch"];
    expect(mark.x).toBeGreaterThan(layout.cylinder.rodEnd);
    expect(mark.y).toBe((layout.cylinder.top + layout.cylinder.bottom) / 2);
    expect(html).toContain(`${fixedPress.requirements.pressStrokeMm} mm before the end`);
    expect(html).toContain("closes the bypass");
    expect(html).toContain("ends the regeneration");
    expect(desc(html)).toContain(
      `Limit switch at the cylinder ${fixedPress.requirements.pressStrokeMm} mm before the end of the extension: there it closes the bypass valve and de-energises the regeneration valve`,
    );
    // the description never says "pressing stroke": the quick-sizing page finds that field by its label
    expect(desc(html)).not.toMatch(/pressing stroke/i);
    expect(html).not.toContain('data-kind="pressure-switch"');
  });
});

describe("CircuitDiagram: readable at the page's and the report's size", () => {
  /**
   * The captions' boxes, estimated from their text: about 0.6 em a character (Open Sans,
   * bold a little wider) and 14 units a line, as the Caption component sets them.
   */
  function captionBoxes(html: string) {
    const svg = html.match(/viewBox="0 0 (\d+) (\d+)"/)!;
    const boxes = attrs(html, /<text x="([\d.]+)" y="([\d.]+)" text-anchor="(start|middle|end)" font-size="11.5"[^>]*>(.*?)<\/text>/g).map((m) => {
      const [x, y, anchor, inner] = [Number(m[1]), Number(m[2]), m[3], m[4]];
      const lines = [...inner.matchAll(/<tspan[^>]*>(.*?)<\/tspan>/g)].map((t, i) => t[1].length * 11.5 * (i === 0 ? 0.6 : 0.54));
      const w = Math.max(...lines);
      const left = anchor === "start" ? x : anchor === "end" ? x - w : x - w / 2;
      return { name: inner.match(/<tspan[^>]*>(.*?)<\/tspan>/)![1], left, right: left + w, top: y - 11, bottom: y + 14 * (lines.length - 1) + 3 };
    });
    return { boxes, width: Number(svg[1]), height: Number(svg[2]) };
  }

  it.each(Object.entries(ALL))("%s: no caption overlaps another, and all stay on the sheet", (_name, design) => {
    for (const units of ["metric", "us"] as const) {
      const { boxes, width, height } = captionBoxes(render(design, units));
      expect(boxes.length).toBeGreaterThan(8);
      for (const b of boxes) {
        expect(b.left, `${b.name} (${units})`).toBeGreaterThanOrEqual(0);
        expect(b.right, `${b.name} (${units})`).toBeLessThanOrEqual(width);
        expect(b.bottom, `${b.name} (${units})`).toBeLessThanOrEqual(height);
      }
      for (const [i, a] of boxes.entries()) {
        for (const b of boxes.slice(i + 1)) {
          const overlap = a.left < b.right && b.left < a.right && a.top < b.bottom && b.top < a.bottom;
          expect(overlap, `${a.name} / ${b.name} (${units})`).toBe(false);
        }
      }
    }
  });
});

describe("CircuitDiagram: US customary values for the new parts", () => {
  it("gives the decompression volume in in³ (1 in³ = 2.54³ cm³) and the settings in psi", () => {
    const html = render(double, "us");
    const in3 = Math.round((double.decompression.releaseCm3 / 2.54 ** 3) * 10) / 10;
    expect(html).toContain(`releases about ${in3.toLocaleString("en-GB")} in³`);
    // Only the pump's catalogue displacement is given in cm³ (with in³/rev beside it).
    expect(html.replaceAll(/[\d.,]+ cm³\/rev \([\d.,]+ in³\/rev\)/g, "")).not.toContain("cm³");
    expect(html).toContain(`unloads above ${Math.round(double.pump.unloadingBar! * 14.5038).toLocaleString("en-GB")} psi`);
  });
});
