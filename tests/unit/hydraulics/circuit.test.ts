/**
 * The circuit as data holds every component the design calls for, joined as the trade joins it
 * (sizing contract, "the circuit as data"; the facts below are common practice in fluid-power
 * textbooks and valve makers' catalogues, ISO 1219-1 for the port letters).
 */
import { describe, expect, it } from "vitest";
import { sizeCircuit, type Design, type RequirementsInput } from "~/hydraulics";
import { oilNets } from "~/hydraulics/port-nets";
import { HANGING_PRESS, LONG_FEED } from "../../support/hydraulics";

const DUTY = { strokeMm: 400, extendSpeedMmS: 100, retractSpeedMmS: 150, mounting: "fixed-pinned", cyclesPerHour: 60, hoursPerDay: 8, supplyHz: 50 } as const;

/** Axes that really call for each part, through the engine's own rules. */
const AXES = {
  // held longer than a few minutes: leak-tight holding (pilot-operated checks)
  "a hanging load held for 30 min": { ...DUTY, orientation: "vertical", rodDirection: "down", massKg: 1200, processForceN: 60000, holdMinutes: 30 },
  "a lifted load held for 30 min": { ...DUTY, orientation: "vertical", rodDirection: "up", massKg: 2000, holdMinutes: 30 },
  "a clamp held for 30 min": { ...DUTY, orientation: "horizontal", massKg: 200, processForceN: 40000, holdMinutes: 30 },
  "a slide held in place for 30 min": { ...DUTY, orientation: "horizontal", massKg: 500, holdMinutes: 30 },
  // a hot duty: long dwell at force, many cycles, warm shop
  "a hot press": { ...DUTY, orientation: "horizontal", massKg: 800, processForceN: 80000, dwellS: 20, cyclesPerHour: 120, hoursPerDay: 16, ambientC: 40 },
  // the press: 2 t platen hanging from the rod, 150 kN over the last 50 mm, fast approach
  "the press with a double pump": { ...HANGING_PRESS, pumpType: "double" },
  "the press with a compensated pump": { ...HANGING_PRESS, pumpType: "compensated" },
  "a horizontal press with a fixed pump": { ...HANGING_PRESS, orientation: "horizontal", massKg: 500, pumpType: "fixed" },
  // regenerating (see regenerative.test.ts): a long feed with its force at the end of the stroke
  // (a pressure switch ends the approach), the same with a 20 mm pressing stroke (the limit switch
  // does), and the feed clamped for 30 min (a cap-end check beside the regeneration valve)
  "a long feed that regenerates": LONG_FEED,
  "a long feed that regenerates, with a pressing stroke": { ...LONG_FEED, pressStrokeMm: 20, pressSpeedMmS: 10, pumpType: "fixed" },
  "a long feed that regenerates, clamped for 30 min": { ...LONG_FEED, holdMinutes: 30 },
} satisfies Record<string, RequirementsInput>;
const designs = Object.entries(AXES).map(([name, req]) => [name, sizeCircuit(req)] as const);
const design = (name: keyof typeof AXES) => designs.find(([n]) => n === name)![1];

/** Ports joined by lines other than pilots and shafts, directly or through a chain, share a net. */
const nets = (d: Design) => oilNets(d.circuit);
const component = (d: Design, id: string) => d.circuit.components.find((c) => c.id === id);
const pilotInto = (d: Design, port: string) => {
  const pilot = d.circuit.connections.find((c) => c.line === "pilot" && (c.to === port || c.from === port));
  return pilot && (pilot.to === port ? pilot.from : pilot.to);
};

describe("the designs really call for the parts under test", () => {
  it("holding, cooler, decompression, each pump type and the pressing-speed control all occur", () => {
    expect(design("a hanging load held for 30 min").holding?.side).toBe("rod");
    expect(design("a hanging load held for 30 min").counterbalance?.side).toBe("rod");
    expect(design("a lifted load held for 30 min").holding?.side).toBe("cap");
    expect(design("a slide held in place for 30 min").holding?.side).toBe("both");
    expect(design("a hot press").cooler).not.toBeNull();
    expect(design("the press with a double pump").pump.type).toBe("double");
    expect(design("the press with a double pump").decompression.needed).toBe(true);
    expect(design("the press with a compensated pump").pump.type).toBe("compensated");
    expect(design("a horizontal press with a fixed pump").pressSpeedControl).not.toBeNull();
    expect(design("a long feed that regenerates").regeneration).toMatchObject({ endsBy: "pressure-switch", switchBar: 25 });
    expect(design("a long feed that regenerates, with a pressing stroke").regeneration).toMatchObject({ endsBy: "limit-switch", switchBar: null });
    expect(design("a long feed that regenerates, with a pressing stroke").pressSpeedControl).not.toBeNull();
    expect(design("a long feed that regenerates, clamped for 30 min").regenerative).toBe(true);
    expect(design("a long feed that regenerates, clamped for 30 min").holding?.side).toBe("cap");
  });
});

describe.each(designs)("%s", (_name, d) => {
  it("lists only existing ports in its connections and joins every port of every component", () => {
    const ports = new Map(d.circuit.components.map((c) => [c.id, new Set(c.ports)]));
    const used = new Set<string>();
    for (const conn of d.circuit.connections) {
      for (const end of [conn.from, conn.to]) {
        const [id, port] = end.split(".");
        expect(ports.get(id)?.has(port), end).toBe(true);
        used.add(end);
      }
    }
    for (const c of d.circuit.components) for (const p of c.ports) expect(used.has(`${c.id}.${p}`), `${c.id}.${p}`).toBe(true);
    expect(new Set(d.circuit.components.map((c) => c.id)).size).toBe(d.circuit.components.length);
  });

  it("has a component for every bill line that is a valve, pump section or cooler", () => {
    const kinds = d.circuit.components.map((c) => c.kind);
    const count = (kind: string) => kinds.filter((k) => k === kind).length;
    const line = (key: string) => d.bom.find((l) => l.key === key);
    expect(count("poc")).toBe(line("holding-valve")?.quantity ?? 0);
    expect(count("cbv")).toBe(line("counterbalance-valve") ? 1 : 0);
    expect(count("cooler")).toBe(line("cooler") ? 1 : 0);
    expect(count("decompression")).toBe(line("decompression-valve") ? 1 : 0);
    expect(count("unloading")).toBe(line("unloading-valve") ? 1 : 0);
    expect(count("check")).toBe(line("pump-check-valve") ? 1 : 0);
    expect(count("pump")).toBe(d.pump.type === "double" ? 2 : 1);
    expect(count("flow-control")).toBe(line("press-flow-control") ? 1 : 0);
    expect(count("bypass")).toBe(line("press-bypass-valve") ? 1 : 0);
    expect(count("flow-control")).toBe(d.pressSpeedControl ? 1 : 0);
    expect(count("regen")).toBe(line("regeneration-valve") ? 1 : 0);
  });

  it("has a component for every bill line that is a switch, with the line's key as its id", () => {
    const switches = d.bom.filter((l) => /switch$/.test(l.key));
    for (const l of switches) {
      expect(l.quantity, l.key).toBe(1);
      expect(component(d, l.key)?.kind, l.key).toBe(/pressure-switch$/.test(l.key) ? "pressure-switch" : "limit-switch");
    }
    const drawn = d.circuit.components.filter((c) => c.kind === "pressure-switch" || c.kind === "limit-switch");
    expect(drawn.map((c) => c.id).sort()).toEqual(switches.map((l) => l.key).sort());
  });

  it("keeps the work lines whole: each valve port feeds its cylinder port through the in-line valves only", () => {
    const find = nets(d);
    // the directional valve's ports never share a net with the cylinder's across an in-line valve
    for (const [valvePort, cylPort] of [
      ["dcv.A", "cylinder.cap"],
      ["dcv.B", "cylinder.rod"],
    ] as const) {
      const inLine = d.circuit.components.filter((c) => ["cbv", "poc", "flow-control", "regen"].includes(c.kind) && find(`${c.id}.1`) !== find(`${c.id}.2`));
      const onThisLine = inLine.filter((c) => find(`${c.id}.2`) === find(valvePort) || find(`${c.id}.1`) === find(cylPort));
      expect(find(valvePort) === find(cylPort)).toBe(onThisLine.length === 0);
    }
    expect(find("dcv.A")).not.toBe(find("dcv.B"));
    expect(find("pump.outlet")).toBe(find("dcv.P"));
    expect(find("dcv.T")).toBe(find("filter.inlet"));
  });
});

describe("leak-tight holding: pilot-operated checks (free flow 2 → 1, pilot to open)", () => {
  const held = designs.filter(([, d]) => d.holding);

  it.each(held)("%s: port 2 faces the valve, 1 the cylinder, and pilot X is joined to the opposite work line", (_n, d) => {
    const find = nets(d);
    const sides = d.holding!.side === "both" ? (["cap", "rod"] as const) : [d.holding!.side];
    for (const side of sides) {
      const id = `poc-${side}`;
      const c = component(d, id)!;
      expect(c.kind).toBe("poc");
      expect(c.ports).toEqual(["1", "2", "X"]);
      expect(c.values?.pilotRatio).toBe(d.holding!.pilotRatio);
      // the check sits on the cylinder port: its seat is the last thing between the load and the oil
      expect(find(`${id}.1`)).toBe(find(`cylinder.${side}`));
      expect(find(`${id}.1`)).not.toBe(find(`${id}.2`));
      // 2 towards the directional valve port of the same line (through any valve between them)
      const valvePort = side === "cap" ? "dcv.A" : "dcv.B";
      const next = d.circuit.connections.find((x) => x.from === `${id}.2` || x.to === `${id}.2`)!;
      const towards = next.from === `${id}.2` ? next.to : next.from;
      expect([valvePort, "cbv.1"]).toContain(towards);
      // pilot: pressure in the other work line (to move the rod) opens the check for the outflow
      const pilot = pilotInto(d, `${id}.X`)!;
      expect(find(pilot)).toBe(find(side === "cap" ? "dcv.B" : "dcv.A"));
    }
  });

  it("with a counterbalance valve in the same line: the check at the cylinder, the counterbalance valve between it and the directional valve", () => {
    for (const name of ["a hanging load held for 30 min", "a lifted load held for 30 min"] as const) {
      const d = design(name);
      const find = nets(d);
      const side = d.counterbalance!.side;
      expect(d.holding!.side).toBe(side);
      expect(find(`poc-${side}.2`)).toBe(find("cbv.1"));
      expect(find("cbv.2")).toBe(find(side === "cap" ? "dcv.A" : "dcv.B"));
      // both pilots come from the opposite work line
      expect(find(pilotInto(d, "cbv.3")!)).toBe(find(pilotInto(d, `poc-${side}.X`)!));
    }
  });

  it("a design without holding has no pilot-operated check", () => {
    for (const [, d] of designs.filter(([, x]) => !x.holding)) expect(d.circuit.components.some((c) => c.kind === "poc")).toBe(false);
  });
});

describe("double (high-low) pump: unloading valve and check (high-low circuit, common practice)", () => {
  const d = design("the press with a double pump");
  const find = nets(d);

  it("has two sections on one shaft, the large first in the design, each with its displacement", () => {
    const [large, small] = d.pump.displacementsCcRev;
    expect(component(d, "pump-large")!.values).toMatchObject({ section: "large", displacementCcRev: large, unloadingBar: d.pump.unloadingBar });
    expect(component(d, "pump")!.values).toMatchObject({ section: "small", displacementCcRev: small });
    expect(d.circuit.connections).toContainEqual({ from: "motor.shaft", to: "pump.shaft", line: "shaft" });
    expect(d.circuit.connections).toContainEqual({ from: "pump.shaft", to: "pump-large.shaft", line: "shaft" });
    // Q = V·n·η_v per section (positive-displacement pump, textbook); the two make the pump flow
    const flows = ["pump", "pump-large"].map((id) => Number(component(d, id)!.values!.flowLpm));
    expect(flows[0] + flows[1]).toBeCloseTo(d.flowsLpm.pump, 0);
    expect(find("strainer.outlet")).toBe(find("pump-large.inlet"));
  });

  it("the check passes oil only from the large section into the system line", () => {
    expect(component(d, "pump-check")!.kind).toBe("check");
    expect(find("pump-check.inlet")).toBe(find("pump-large.outlet"));
    expect(find("pump-check.outlet")).toBe(find("dcv.P"));
    // nothing else joins the large section to the system line
    expect(find("pump-large.outlet")).not.toBe(find("dcv.P"));
    // the small section feeds the system line directly
    expect(find("pump.outlet")).toBe(find("dcv.P"));
  });

  it("the unloading valve is piloted from the system line and dumps the large section to tank", () => {
    const u = component(d, "unloading")!;
    expect(u.values?.settingBar).toBe(d.pump.unloadingBar);
    expect(find("unloading.1")).toBe(find("pump-large.outlet"));
    expect(find("unloading.2")).toBe(find("tank.return"));
    expect(find(pilotInto(d, "unloading.X")!)).toBe(find("dcv.P"));
    // the small section's pressure cannot escape through it: the check stands between
    expect(find("unloading.1")).not.toBe(find("pump.outlet"));
  });
});

describe("pressure-compensated pump", () => {
  it("carries its compensator setting and power limit, piloted from its own outlet (drawn in its symbol)", () => {
    const d = design("the press with a compensated pump");
    const pump = component(d, "pump")!;
    expect(pump.values?.type).toBe("compensated");
    expect(pump.values?.compensatorBar).toBe(d.pump.compensatorBar);
    if (d.pump.powerLimitKw !== undefined) expect(pump.values?.powerLimitKw).toBe(d.pump.powerLimitKw);
    expect(d.circuit.components.filter((c) => c.kind === "pump")).toHaveLength(1);
    expect(d.circuit.components.some((c) => c.kind === "unloading")).toBe(false);
  });
  it("a fixed pump says so", () => {
    expect(component(design("a hot press"), "pump")!.values?.type).toBe("fixed");
  });
});

describe("cooler, decompression and the pressing-speed control", () => {
  it("the cooler sits in the return line after the filter, before the tank", () => {
    const d = design("a hot press");
    const find = nets(d);
    expect(component(d, "cooler")!.values?.kw).toBe(d.cooler!.kw);
    expect(d.circuit.connections).toContainEqual({ from: "filter.outlet", to: "cooler.inlet", line: "return" });
    expect(find("cooler.outlet")).toBe(find("tank.return"));
    expect(find("filter.outlet")).not.toBe(find("tank.return"));
    const noCooler = designs.find(([, x]) => !x.cooler)![1];
    expect(nets(noCooler)("filter.outlet")).toBe(nets(noCooler)("tank.return"));
  });

  it("the decompression valve joins the cap port itself to tank, so no check can trap the pressure it releases", () => {
    for (const [, d] of designs.filter(([, x]) => x.decompression.needed)) {
      const find = nets(d);
      expect(component(d, "decompression")!.values?.releaseCm3).toBe(d.decompression.releaseCm3);
      expect(find("decompression.1")).toBe(find("cylinder.cap"));
      expect(find("decompression.2")).toBe(find("tank.return"));
    }
  });

  it("the meter-in control sits in the cap line with its bypass across it", () => {
    for (const [, d] of designs.filter(([, x]) => x.pressSpeedControl)) {
      const find = nets(d);
      expect(component(d, "press-flow")!.values?.settingLpm).toBe(d.pressSpeedControl!.settingLpm);
      // meter-in: the controlled flow goes from the valve (2) towards the cap end (1)
      expect(find("press-flow.2")).toBe(find("dcv.A"));
      expect(find("press-flow.1")).not.toBe(find("dcv.A"));
      // the bypass joins the two sides of the control: open, it carries the approach flow past it
      expect(find("press-bypass.1")).toBe(find("press-flow.1"));
      expect(find("press-bypass.2")).toBe(find("press-flow.2"));
      expect(component(d, "press-bypass")!.values?.normally).toBe("closed");
    }
  });
});

/**
 * Where oil can go from a port with the valves in given positions: along the lines (not pilots)
 * and through the passages the directional valve and the regeneration valve open in those
 * positions. Every other valve counts as closed, so a path found here is there for certain.
 */
function reach(d: Design, start: string, dcv: "left" | "center" | "right", regen: "normal" | "energised"): Set<string> {
  const links: [string, string][] = d.circuit.connections.filter((c) => c.line !== "pilot" && c.line !== "shaft").map((c) => [c.from, c.to]);
  for (const [a, b] of d.circuit.dcvPositions[dcv]) links.push([`dcv.${a}`, `dcv.${b}`]);
  const valve = component(d, "regen");
  for (const [a, b] of valve?.positions?.[regen] ?? []) links.push([`regen.${a}`, `regen.${b}`]);
  const seen = new Set([start]);
  const todo = [start];
  while (todo.length) {
    const port = todo.pop()!;
    for (const [a, b] of links) {
      const next = a === port ? b : b === port ? a : null;
      if (next && !seen.has(next)) {
        seen.add(next);
        todo.push(next);
      }
    }
  }
  return seen;
}

describe("regeneration valve: a 3/2 solenoid valve in the rod line (textbook regenerative circuit with a separate valve)", () => {
  const regenerating = designs.filter(([, x]) => x.regeneration);

  it("occurs in the designs that regenerate, and only there", () => {
    const names = regenerating.map(([n]) => n);
    for (const n of [
      "a long feed that regenerates",
      "a long feed that regenerates, with a pressing stroke",
      "a long feed that regenerates, clamped for 30 min",
    ]) {
      expect(names).toContain(n);
    }
    for (const [, d] of designs) expect(d.circuit.components.some((c) => c.kind === "regen")).toBe(d.regenerative);
  });

  it.each(regenerating)("%s: 1 to the rod port, 2 to valve port B, 3 to the cap line; de-energised 1–2, energised 1–3 with 2 blocked", (_n, d) => {
    const find = nets(d);
    const valve = component(d, "regen")!;
    expect(valve.ports).toEqual(["1", "2", "3"]);
    expect(valve.positions).toEqual({ normal: [["1", "2"]], energised: [["1", "3"]] });
    expect(valve.values?.endsBy).toBe(d.regeneration!.endsBy);
    expect(find("regen.1")).toBe(find("cylinder.rod"));
    expect(find("regen.2")).toBe(find("dcv.B"));
    expect(find("regen.3")).toBe(find("dcv.A"));
    // the three ports are three different lines: the valve, not a pipe, decides where the rod oil goes
    expect(new Set(["regen.1", "regen.2", "regen.3"].map(find)).size).toBe(3);
  });

  it.each(regenerating)("%s: extending, energised, the rod end's oil reaches the cap line and the pump line, never port B or tank", (_n, d) => {
    // solenoid a: P→A, B→T (ISO 1219-1 port letters); the rod end's oil must not take B→T
    const from = reach(d, "cylinder.rod", "left", "energised");
    expect(from.has("dcv.A")).toBe(true);
    expect(from.has("dcv.P")).toBe(true);
    for (const port of ["dcv.B", "dcv.T", "filter.inlet"]) expect(from.has(port), port).toBe(false);
    if (!d.holding && !d.pressSpeedControl) expect(from.has("cylinder.cap")).toBe(true);
  });

  it.each(regenerating)("%s: de-energised, the rod port works through B: to tank while extending, from the pump while retracting", (_n, d) => {
    const extending = reach(d, "cylinder.rod", "left", "normal");
    expect(extending.has("dcv.B")).toBe(true);
    expect(extending.has("filter.inlet")).toBe(true); // B→T, on through the return filter to tank
    expect(extending.has("dcv.A")).toBe(false);
    const retracting = reach(d, "pump.outlet", "right", "normal");
    expect(retracting.has("cylinder.rod")).toBe(true);
    // in neutral the valve changes nothing: the rod port reaches what B reaches, and no more
    const neutral = reach(d, "cylinder.rod", "center", "normal");
    expect([...neutral].filter((p) => !p.startsWith("regen.") && p !== "cylinder.rod").sort()).toEqual(
      [...reach(d, "dcv.B", "center", "normal")].filter((p) => !p.startsWith("regen.") && p !== "cylinder.rod").sort(),
    );
  });
});

describe("the switches that end the regenerative approach and start the pressing stroke (common practice)", () => {
  it("the long feed: a pressure switch on the cap line at 25 bar, the setting of the design, switching off the regeneration valve", () => {
    const d = design("a long feed that regenerates");
    const find = nets(d);
    const sw = component(d, "regeneration-pressure-switch")!;
    expect(sw.kind).toBe("pressure-switch");
    expect(sw.values?.settingBar).toBe(d.regeneration!.switchBar);
    expect(sw.values?.settingBar).toBe(25);
    expect(sw.values?.switchesOff).toBe("regen");
    // it senses the cap line, where the pressure rises as the tool meets the work, not the pump or rod line
    expect(find("regeneration-pressure-switch.port")).toBe(find("dcv.A"));
    expect(find("regeneration-pressure-switch.port")).not.toBe(find("dcv.P"));
    expect(d.circuit.components.some((c) => c.kind === "limit-switch")).toBe(false);
  });

  it("with a pressing stroke: one limit switch 20 mm before the end switches off both the bypass and the regeneration valve", () => {
    const d = design("a long feed that regenerates, with a pressing stroke");
    const sw = component(d, "press-limit-switch")!;
    expect(sw).toMatchObject({ kind: "limit-switch", ports: [], values: { beforeEndMm: 20, switchesOff: "press-bypass, regen" } });
    expect(d.circuit.components.some((c) => c.kind === "pressure-switch")).toBe(false);
    // a press without regeneration: the limit switch switches the bypass only
    const plain = designs.find(([, x]) => x.pressSpeedControl && !x.regeneration)![1];
    expect(component(plain, "press-limit-switch")!.values).toMatchObject({ beforeEndMm: plain.requirements.pressStrokeMm, switchesOff: "press-bypass" });
  });
});
