// The diagram of a machine, drawn from real sizeMachine results: the power unit once (with the
// accumulator, its safety block and charging valve where the engine fits one), each axis's valve
// and cylinder in its own labelled column, every valve on the common pressure and tank rails.
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { CircuitDiagram } from "~/components/circuit-diagram";
import { displayUnits } from "~/components/circuit-diagram/format";
import { layoutMachine, pLinePort } from "~/components/circuit-diagram/machine-layout";
import { meetings, routeConnections, type Route } from "~/components/circuit-diagram/routes";
import { sizeMachine, type MachineDesign } from "~/hydraulics";
import { accumulatorParts } from "~/hydraulics/machine-circuit";
import { CLAMP, FEED, PRESS } from "../support/machines";

/** A 300 kN press: a 250 bar cylinder and a relief above the 160 bar a light clamp's cylinder is rated for. */
const HEAVY_PRESS = { ...PRESS, name: "Heavy press", processForceN: 300_000 };
/** A vertical ram whose load overruns on the way down: it gets a counterbalance valve. */
const RAM = {
  orientation: "vertical",
  rodDirection: "down",
  mounting: "fixed-pinned",
  name: "Ram",
  massKg: 1200,
  processForceN: 60_000,
  strokeMm: 400,
  extendSpeedMmS: 100,
  retractSpeedMmS: 150,
};
const DUTY = { cyclesPerHour: 120, hoursPerDay: 16, supplyHz: 50, maxPressureBar: 160 } as const;
/** A heavy feed that runs out fast and a clamp, 60 cycles an hour: the engine's worked example of an accumulator carrying the feed's peak. */
const FAST_FEED = {
  name: "Fast feed",
  orientation: "horizontal",
  mounting: "fixed-pinned",
  massKg: 1500,
  processForceN: 0,
  strokeMm: 1000,
  extendSpeedMmS: 400,
  retractSpeedMmS: 400,
} as const;
const SMALL_CLAMP = {
  name: "Small clamp",
  orientation: "horizontal",
  mounting: "fixed-pinned",
  massKg: 50,
  processForceN: 40_000,
  strokeMm: 50,
  extendSpeedMmS: 50,
  retractSpeedMmS: 100,
} as const;

const componentOf = (end: string) => end.slice(0, end.lastIndexOf("."));

const MACHINES: Record<string, MachineDesign> = {
  "clamp and press": sizeMachine({ axes: [CLAMP, PRESS], ...DUTY }),
  "feed, ram and clamp": sizeMachine({ axes: [FEED, RAM, CLAMP], ...DUTY }),
  "feed and press on a double pump": sizeMachine({ axes: [FEED, PRESS], ...DUTY, pumpType: "double" }),
  "ram and press on a fixed pump": sizeMachine({ axes: [RAM, PRESS], ...DUTY, pumpType: "fixed" }),
  "eight axes, the most a machine may have": sizeMachine({
    axes: Array.from({ length: 8 }, (_, i) => ({ ...[CLAMP, FEED, RAM, PRESS][i % 4], name: `Station ${i + 1}` })),
    ...DUTY,
  }),
  "clamp on a reducing valve beside a heavy press": sizeMachine({ axes: [CLAMP, HEAVY_PRESS], ...DUTY }),
  "clamp and feed on reducing valves beside a heavy press": sizeMachine({ axes: [CLAMP, FEED, HEAVY_PRESS], ...DUTY }),
  "feed, ram and clamp together": sizeMachine({
    axes: [FEED, RAM, CLAMP],
    ...DUTY,
    sequence: [["Feed", "Ram", "Clamp"].map((axis) => ({ axis, motion: "extend" })), ["Feed", "Ram", "Clamp"].map((axis) => ({ axis, motion: "retract" }))],
  }),
  "a fast feed and a clamp on an accumulator": sizeMachine({ axes: [SMALL_CLAMP, FAST_FEED], cyclesPerHour: 60, hoursPerDay: 16, supplyHz: 50 }),
};

/**
 * Beside the engine's own accumulator machine: a real fixed-pump machine (its relief vented, as
 * the engine never pairs with an accumulator) given the accumulator parts and lines from the
 * engine's own accumulatorParts (machine-circuit.ts), its valves fed from past the check, so the drawing
 * is held on a busier power unit too. Invented figures, for the drawing only.
 */
function withAccumulator(m: MachineDesign): MachineDesign {
  const accumulator = { nominalL: 10, prechargeBar: 108, minBar: 120, maxBar: 145 };
  const axisParts = new Set(m.circuit.components.filter((c) => c.axis !== undefined).map((c) => c.id));
  const feeds = m.circuit.connections.map((c) => (c.from === "pump.outlet" && axisParts.has(componentOf(c.to)) ? { ...c, from: "pump-check.outlet" } : c));
  const parts = accumulatorParts(accumulator, m.pressuresBar.reliefSetting);
  return {
    ...m,
    circuit: { components: [...m.circuit.components, ...parts.components], connections: [...feeds, ...parts.connections] },
  };
}
MACHINES["clamp and press charging an accumulator (parts as the engine lists them)"] = withAccumulator(
  sizeMachine({ axes: [CLAMP, PRESS], ...DUTY, pumpType: "fixed" }),
);
const hasAccumulator = (m: MachineDesign) => m.circuit.components.some((c) => c.kind === "accumulator");
const ACCUMULATOR_MACHINES = Object.entries(MACHINES).filter(([, m]) => hasAccumulator(m));
/** The power unit's line to the valves: past the accumulator's check where there is one. */
const feedPort = (m: MachineDesign) => (hasAccumulator(m) ? "pump-check.outlet" : "pump.outlet");

const render = (m: MachineDesign, units: "metric" | "us" = "metric") => renderToStaticMarkup(<CircuitDiagram circuit={m.circuit} units={units} />);
const desc = (html: string) => html.match(/<desc[^>]*>(.*?)<\/desc>/)![1].replaceAll("&#x27;", "'");

interface Box {
  name: string;
  left: number;
  right: number;
  top: number;
  bottom: number;
}

/** The outermost groups of the symbols layer, each with the box of every point it draws. */
function symbolBoxes(html: string): Box[] {
  const layer = html.slice(html.indexOf('<g data-layer="symbols">') + '<g data-layer="symbols">'.length);
  const boxes: Box[] = [];
  let depth = 0;
  let start = -1;
  let name = "";
  for (const m of layer.matchAll(/<g(?: data-component="([^"]+)")?[^>]*>|<\/g>/g)) {
    if (m[0] === "</g>") {
      depth -= 1;
      if (depth === 0 && start >= 0) {
        boxes.push(boxOf(name, layer.slice(start, m.index)));
        start = -1;
      }
      if (depth < 0) break;
    } else {
      if (depth === 0 && m[1]) {
        start = m.index;
        name = m[1];
      }
      depth += 1;
    }
  }
  return boxes;
}

function boxOf(name: string, markup: string): Box {
  const xs: number[] = [];
  const ys: number[] = [];
  const pair = (...points: [number, number][]) => {
    for (const [x, y] of points) {
      xs.push(x);
      ys.push(y);
    }
  };
  for (const m of markup.matchAll(/<(rect|line|circle|polyline|polygon|path)\b([^>]*)>/g)) {
    const a = (k: string) => Number(m[2].match(new RegExp(` ${k}="([-\\d.]+)"`))?.[1]);
    if (m[1] === "rect") pair([a("x"), a("y")], [a("x") + a("width"), a("y") + a("height")]);
    if (m[1] === "line") pair([a("x1"), a("y1")], [a("x2"), a("y2")]);
    if (m[1] === "circle") pair([a("cx") - a("r"), a("cy") - a("r")], [a("cx") + a("r"), a("cy") + a("r")]);
    const list = m[2].match(/ (?:points|d)="([^"]+)"/)?.[1];
    if (list) {
      const n = [...list.matchAll(/-?[\d.]+/g)].map(Number);
      for (let i = 0; i + 1 < n.length; i += 2) pair([n[i], n[i + 1]]);
    }
  }
  return { name, left: Math.min(...xs), right: Math.max(...xs), top: Math.min(...ys), bottom: Math.max(...ys) };
}

/** Captions, estimated as circuit-diagram.test.tsx does: about 0.6 em a character and 14 units a line. */
function captionBoxes(html: string): Box[] {
  return [...html.matchAll(/<text x="([\d.]+)" y="([\d.]+)" text-anchor="(start|middle|end)" font-size="11.5"[^>]*>(.*?)<\/text>/g)].map((m) => {
    const [x, y, anchor, inner] = [Number(m[1]), Number(m[2]), m[3], m[4]];
    const lines = [...inner.matchAll(/<tspan[^>]*>(.*?)<\/tspan>/g)].map((t, i) => t[1].length * 11.5 * (i === 0 ? 0.6 : 0.54));
    const w = Math.max(...lines);
    const left = anchor === "start" ? x : anchor === "end" ? x - w : x - w / 2;
    return { name: inner.match(/<tspan[^>]*>(.*?)<\/tspan>/)![1], left, right: left + w, top: y - 11, bottom: y + 14 * (lines.length - 1) + 3 };
  });
}

const overlap = (a: Box, b: Box) => a.left < b.right && b.left < a.right && a.top < b.bottom && b.top < a.bottom;

describe("the machine's circuit diagram", () => {
  it("the machines under test: two and three axes, a counterbalanced ram, P-line flow controls, a reducing valve and a vented relief among them", () => {
    const all = Object.values(MACHINES).flatMap((m) => m.circuit.components);
    expect(Object.values(MACHINES).map((m) => m.axes.length)).toEqual([2, 3, 2, 2, 8, 2, 3, 3, 2, 2]);
    expect(MACHINES["a fast feed and a clamp on an accumulator"].accumulator).not.toBeNull();
    expect(ACCUMULATOR_MACHINES.length).toBeGreaterThan(1);
    expect(Object.values(MACHINES).filter((m) => !hasAccumulator(m)).length).toBeGreaterThan(3);
    expect(all.some((c) => c.kind === "reducing")).toBe(true);
    expect(all.some((c) => c.kind === "cbv")).toBe(true);
    expect(all.some((c) => c.id.endsWith(":speed-control"))).toBe(true);
    expect(all.some((c) => c.kind === "vent")).toBe(true);
    expect(new Set(Object.values(MACHINES).map((m) => m.pump.type))).toEqual(new Set(["fixed", "compensated", "double"]));
  });

  it.each(Object.entries(MACHINES))("%s: draws one power unit: one pump, one relief, one reservoir", (_name, m) => {
    const html = render(m);
    expect(html).toMatch(/^<svg[^>]+role="img"/);
    const pumps = m.circuit.components.filter((c) => c.kind === "pump");
    expect([...html.matchAll(/data-kind="pump"/g)]).toHaveLength(pumps.length);
    // a double pump is one pump of two sections on one shaft, with one caption
    expect(pumps.length === 1 || pumps.every((p) => p.values?.type === "double")).toBe(true);
    expect([...html.matchAll(/>(Fixed pump|Compensated pump|Double pump)</g)]).toHaveLength(1);
    expect([...html.matchAll(/data-kind="relief"/g)]).toHaveLength(1);
    expect([...html.matchAll(/>Reservoir</g)]).toHaveLength(1);
    // every tank symbol is an end of the one reservoir
    const tanks = [...html.matchAll(/<g data-component="([^"]+)" data-kind="tank"/g)].map((t) => t[1]);
    expect(tanks.length).toBeGreaterThan(0);
    expect(new Set(tanks)).toEqual(new Set(["tank"]));
  });

  it.each(Object.entries(MACHINES))("%s: one valve and one cylinder per axis, in a column under the axis's name", (_name, m) => {
    const html = render(m);
    const layout = layoutMachine(m.circuit);
    expect(html).toContain(`data-machine-axes="${m.axes.length}"`);
    expect(layout.columns.map((c) => c.axis)).toEqual(m.axes.map((a) => a.name));
    for (const [i, axis] of m.axes.entries()) {
      expect(html).toMatch(new RegExp(`<text[^>]*data-axis-label="${axis.name}">${axis.name}</text>`));
      const own = m.circuit.components.filter((c) => c.axis === axis.name);
      expect(own.filter((c) => c.kind === "dcv")).toHaveLength(1);
      expect(own.filter((c) => c.kind === "cylinder")).toHaveLength(1);
      const column = layout.columns[i];
      for (const c of own) {
        const at = layout.merged.at[c.id];
        expect(at, c.id).toBeDefined();
        expect(html, c.id).toContain(`data-component="${c.id}" data-kind="${c.kind}"`);
        expect(at.x, c.id).toBeGreaterThan(column.left);
        expect(at.x, c.id).toBeLessThan(column.right);
        expect(at.y, c.id).toBeGreaterThan(column.labelY);
      }
    }
    // the valves stand in one row, as on one manifold
    const valves = m.circuit.components.filter((c) => c.kind === "dcv").map((c) => layout.merged.at[c.id].y);
    expect(new Set(valves).size).toBe(1);
  });

  it.each(Object.entries(MACHINES))("%s: draws every connection of the data, and each axis's valve reaches only its own cylinder", (_name, m) => {
    const html = render(m);
    const drawn = [...html.matchAll(/<path[^>]*data-from="([^"]+)" data-to="([^"]+)" data-line="([^"]+)"/g)].map((x) => ({ from: x[1], to: x[2], line: x[3] }));
    expect(drawn.map((c) => `${c.from}>${c.to}:${c.line}`).sort()).toEqual(m.circuit.connections.map((c) => `${c.from}>${c.to}:${c.line}`).sort());
    const axisOf = new Map(m.circuit.components.map((c) => [c.id, c.axis]));
    const kindOf = new Map(m.circuit.components.map((c) => [c.id, c.kind]));
    for (const dcv of m.circuit.components.filter((c) => c.kind === "dcv")) {
      // follow the drawn oil lines from A and B, stopping at the power unit
      const seen = new Set<string>([dcv.id]);
      const ends = [`${dcv.id}.A`, `${dcv.id}.B`];
      const queue = drawn
        .filter((c) => c.line !== "pilot" && (ends.includes(c.from) || ends.includes(c.to)))
        .map((c) => (ends.includes(c.from) ? c.to : c.from));
      while (queue.length) {
        const id = componentOf(queue.shift()!);
        if (seen.has(id) || axisOf.get(id) === undefined) continue;
        seen.add(id);
        for (const c of drawn) {
          if (c.line === "pilot" || c.line === "shaft") continue;
          if (componentOf(c.from) === id) queue.push(c.to);
          if (componentOf(c.to) === id) queue.push(c.from);
        }
      }
      const reached = [...seen].filter((id) => axisOf.get(id) !== undefined);
      for (const id of reached) expect(axisOf.get(id), `${dcv.id} reaches ${id}`).toBe(dcv.axis);
      expect(reached.filter((id) => kindOf.get(id) === "cylinder")).toHaveLength(1);
    }
  });

  it.each(Object.entries(MACHINES))("%s: every valve takes P from the common pressure rail and returns T on the common tank rail", (_name, m) => {
    const layout = layoutMachine(m.circuit);
    const routes = routeConnections(m.circuit, layout.merged);
    const { pressureY, tankY } = layout.rails;
    expect(tankY).toBeGreaterThan(pressureY);
    const runsAlong = (points: { x: number; y: number }[], y: number) =>
      points.some((p, i) => i > 0 && p.y === y && points[i - 1].y === y && p.x !== points[i - 1].x);
    const dropsAt = (points: { x: number; y: number }[], y: number) => points.find((p, i) => i > 0 && p.y === y && points[i - 1].y === y)!.x;
    const pumpOutlet = layout.merged.ports[feedPort(m)];
    const pressureDrops: number[] = [];
    const tankDrops: number[] = [];
    for (const dcv of m.circuit.components.filter((c) => c.kind === "dcv")) {
      // P: from the pump (directly, or through the axis's own P-line flow control and reducing valve)
      const byId = new Map(m.circuit.components.map((c) => [c.id, c]));
      const feedOf = (end: string): Route[] => {
        const into = routes.filter((r) => r.connection.to === end);
        expect(into.length, end).toBeGreaterThan(0);
        return into.flatMap((r) => {
          const part = byId.get(componentOf(r.connection.from))!;
          return part.axis === undefined ? [r] : feedOf(pLinePort(part, "inlet"));
        });
      };
      const fromUnit = feedOf(`${dcv.id}.P`);
      expect(fromUnit.map((r) => r.connection.from)).toContain(feedPort(m));
      for (const r of fromUnit.filter((x) => x.connection.from === feedPort(m))) {
        expect(r.points[0]).toMatchObject({ x: pumpOutlet.x, y: pumpOutlet.y });
        expect(runsAlong(r.points, pressureY) || r.points.every((p) => p.x === pumpOutlet.x), `${dcv.id} P`).toBe(true);
        if (runsAlong(r.points, pressureY)) pressureDrops.push(dropsAt(r.points.slice(1), pressureY));
      }
      // T: along the tank rail to the return filter, and on to the tank
      const fromT = routes.filter((r) => r.connection.from === `${dcv.id}.T`);
      expect(fromT).toHaveLength(1);
      expect(m.circuit.components.find((c) => c.id === componentOf(fromT[0].connection.to))?.kind).toBe("filter");
      expect(runsAlong(fromT[0].points, tankY), `${dcv.id} T`).toBe(true);
      tankDrops.push(fromT[0].points[0].x);
    }
    // a junction dot wherever a valve's line leaves a rail between two others
    const dots = meetings(routes);
    const hasDot = (x: number, y: number) => dots.some((d) => Math.abs(d.x - x) < 0.5 && Math.abs(d.y - y) < 0.5);
    const filterX = layout.merged.ports["filter.inlet"].x;
    for (const [drops, y, hub] of [
      [tankDrops, tankY, filterX],
      [pressureDrops, pressureY, pumpOutlet.x],
    ] as const) {
      const all = [...drops, hub];
      for (const x of drops) if (x > Math.min(...all) && x < Math.max(...all)) expect(hasDot(x, y), `dot at ${x}, ${y}`).toBe(true);
    }
  });

  it.each(Object.entries(MACHINES))("%s: no two symbols overlap, no caption overlaps another or a symbol, all on the sheet", (_name, m) => {
    for (const units of ["metric", "us"] as const) {
      const html = render(m, units);
      const [, width, height] = html.match(/viewBox="0 0 (\d+) (\d+)"/)!.map(Number);
      const symbols = symbolBoxes(html).filter((b) => b.name !== "tank" && Number.isFinite(b.left));
      expect(symbols.length).toBeGreaterThan(m.circuit.components.length / 2);
      const captions = captionBoxes(html);
      for (const [i, a] of symbols.entries()) for (const b of symbols.slice(i + 1)) expect(overlap(a, b), `${a.name} / ${b.name}`).toBe(false);
      for (const [i, a] of captions.entries()) {
        expect(a.left, a.name).toBeGreaterThanOrEqual(0);
        expect(a.right, a.name).toBeLessThanOrEqual(width);
        expect(a.bottom, a.name).toBeLessThanOrEqual(height);
        for (const b of captions.slice(i + 1)) expect(overlap(a, b), `${a.name} / ${b.name} (${units})`).toBe(false);
        for (const s of symbols) expect(overlap(a, s), `${a.name} / ${s.name} (${units})`).toBe(false);
      }
    }
  });

  it.each(Object.entries(MACHINES))("%s: the description gives the power unit once, then the machine by axis", (_name, m) => {
    const text = desc(render(m));
    const title = render(m).match(/<title[^>]*>(.*?)<\/title>/)![1];
    expect(title).toContain(`machine of ${m.axes.length} axes`);
    for (const axis of m.axes) {
      expect(title).toContain(axis.name);
      expect(text).toContain(`Axis ${axis.name}: `);
      expect(text).toContain(`bore ${axis.cylinder.boreMm} mm, rod ${axis.cylinder.rodMm} mm`);
    }
    // in the order of the axes, after the power unit
    const at = m.axes.map((a) => text.indexOf(`Axis ${a.name}: `));
    expect([...at].sort((a, b) => a - b)).toEqual(at);
    expect(text.indexOf("Relief valve set to")).toBeLessThan(at[0]);
    expect(text.match(/Relief valve set to/g)).toHaveLength(1);
    expect(text).toContain("each take P from the common pressure line and return T to the common tank line");
    expect(text).toContain(`Relief valve set to ${m.pressuresBar.reliefSetting} bar`);
  });

  it("says what a P-line flow control passes, beside its own symbol under its valve", () => {
    const m = MACHINES["feed, ram and clamp"];
    const control = m.circuit.components.find((c) => c.id.endsWith(":speed-control"))!;
    const html = render(m);
    expect(html).toContain(`data-component="${control.id}" data-kind="flow-control"`);
    expect(html).toContain("P-line flow control");
    const layout = layoutMachine(m.circuit);
    const dcv = m.circuit.components.find((c) => c.kind === "dcv" && c.axis === control.axis)!;
    expect(layout.merged.at[control.id].y).toBeGreaterThan(layout.merged.ports[`${dcv.id}.P`].y);
    expect(layout.merged.at[control.id].y).toBeLessThan(layout.rails.pressureY);
    expect(desc(html)).toContain(`meter-in flow control in its P line passes ${displayUnits("metric").flow(Number(control.values!.settingLpm))}`);
  });

  it("draws an axis's reducing valve in its P line under its valve, drained to a tank of its own, and says what it keeps from the cylinder", () => {
    const m = MACHINES["clamp on a reducing valve beside a heavy press"];
    const reducer = m.circuit.components.find((c) => c.kind === "reducing")!;
    const control = m.circuit.components.find((c) => c.id === "a1:speed-control")!;
    const dcv = m.circuit.components.find((c) => c.kind === "dcv" && c.axis === reducer.axis)!;
    expect(reducer.axis).toBe("Clamp");
    const html = render(m);
    expect(html).toContain(
      `data-component="${reducer.id}" data-kind="reducing" data-normally="open" data-pilot="A" data-drain="external" data-free-flow="A-P"`,
    );
    for (const port of ["P", "A", "Y"]) expect(html).toContain(`data-port="${reducer.id}.${port}"`);
    expect(html).toMatch(/>Pressure-reducing valve<\/tspan><tspan[^>]*>set 150 bar</);
    // in the clamp's column, under its valve and above the pressure rail, nearer the valve than the flow control (as the data joins them)
    const layout = layoutMachine(m.circuit);
    const at = layout.merged.at[reducer.id];
    expect(at.x).toBeGreaterThan(layout.columns[0].left);
    expect(at.x).toBeLessThan(layout.columns[0].right);
    expect(at.y).toBeGreaterThan(layout.merged.ports[`${dcv.id}.P`].y);
    expect(at.y).toBeLessThan(layout.merged.at[control.id].y);
    expect(layout.merged.at[control.id].y).toBeLessThan(layout.rails.pressureY);
    // the oil passes it upwards: inlet P below, outlet A above, each line straight to the next part
    const routes = routeConnections(m.circuit, layout.merged);
    const route = (from: string, to: string) => routes.find((r) => r.connection.from === from && r.connection.to === to)!;
    expect(route("a1:speed-control.1", `${reducer.id}.P`).points.every((p) => p.x === at.x)).toBe(true);
    expect(route(`${reducer.id}.A`, `${dcv.id}.P`).points[0]).toMatchObject({ x: at.x, y: layout.merged.ports[`${reducer.id}.A`].y });
    // the drain drops to a tank of its own beside it, above the rails, clear of every symbol
    const drain = route(`${reducer.id}.Y`, "tank.return");
    expect(drain.tank).toBeDefined();
    expect(drain.points.every((p) => p.x === drain.points[0].x && p.y < layout.rails.pressureY)).toBe(true);
    const tank = { name: "drain tank", left: drain.tank!.x - 20, right: drain.tank!.x + 20, top: drain.tank!.top, bottom: drain.tank!.top + 16 };
    expect(tank.bottom).toBeLessThan(layout.rails.pressureY);
    // (its own symbol's box holds the drain line that ends in it)
    const others = [...symbolBoxes(html), ...captionBoxes(html)].filter((x) => x.name !== "tank" && x.name !== reducer.id);
    expect(others.map((b) => b.name)).toEqual(expect.arrayContaining([control.id, "Pressure-reducing valve", "P-line flow control"]));
    for (const b of others) expect(overlap(tank, b), b.name).toBe(false);
    // the description, in either unit system
    for (const units of ["metric", "us"] as const) {
      const u = displayUnits(units);
      const bar = (key: string) => u.pressure(Number(reducer.values![key]));
      expect(desc(render(m, units))).toContain(
        `A pressure-reducing valve in its P line, piloted from its outlet, drained to tank and with a check for the free return, reduces the pressure to this axis's valve to ${bar("settingBar")}, so its ${bar("cylinderRatedBar")} cylinder never sees the ${bar("reliefBar")} relief.`,
      );
    }
    expect(desc(html)).toContain("to 150 bar, so its 160 bar cylinder never sees the ");
  });

  it.each(ACCUMULATOR_MACHINES)(
    "%s: draws the accumulator, its safety and shut-off block, charging valve and check in the power unit, every line joined",
    (_name, m) => {
      const html = render(m);
      expect(html).toContain('data-component="accumulator" data-kind="accumulator" data-gas-side="top"');
      expect(html).toContain('data-component="pump-check" data-kind="check" data-free-flow="inlet-outlet"');
      expect(html).toContain('data-component="charging-valve" data-kind="unloading" data-pilot="external"');
      // the block: a shut-off valve, a safety relief, a normally open solenoid discharge valve and a gauge port, in one enclosure
      const block = html.match(/<g data-component="accumulator-block" data-kind="accumulator-block" data-discharge="normally open">(.*?)<\/g><text/)![1];
      expect(block).toContain('data-part="shut-off" data-operated="manual"');
      expect(block).toContain('data-kind="safety-relief"');
      expect(block).toMatch(
        /data-kind="discharge-valve" data-normally="open"><g data-position="energised" data-paths="" data-blocked="1,2">.*<g data-position="normal" data-paths="1-2"/,
      );
      expect(block).toContain('data-part="gauge-port"');
      for (const port of ["accumulator-block.P", "accumulator-block.A", "accumulator-block.T", "accumulator.P", "charging-valve.X"])
        expect(html).toContain(`data-port="${port}"`);

      const layout = layoutMachine(m.circuit);
      const routes = routeConnections(m.circuit, layout.merged);
      const route = (from: string, to: string) => routes.find((r) => r.connection.from === from && r.connection.to === to)!;
      const at = (id: string) => layout.merged.at[id];
      const pump = layout.merged.ports["pump.outlet"];
      // all of it in the power unit, below the rails; the check on the pump line between the pump and the rails
      for (const id of ["pump-check", "charging-valve", "accumulator-block", "accumulator"]) expect(at(id).y, id).toBeGreaterThan(layout.rails.tankY);
      expect(at("pump-check").x).toBe(pump.x);
      expect(at("pump-check").y).toBeLessThan(pump.y);
      expect(route("pump.outlet", "pump-check.inlet").points.every((p) => p.x === pump.x)).toBe(true);
      // the charging valve tees onto the pump line below the check, its pilot X onto the accumulator line past it
      const onRoute = (p: { x: number; y: number }, r: Route) =>
        r.points.some(
          (q, i) =>
            i > 0 &&
            Math.min(q.x, r.points[i - 1].x) <= p.x &&
            p.x <= Math.max(q.x, r.points[i - 1].x) &&
            Math.min(q.y, r.points[i - 1].y) <= p.y &&
            p.y <= Math.max(q.y, r.points[i - 1].y),
        );
      const inlet = route("pump.outlet", "charging-valve.1").points[0];
      expect(inlet.x).toBe(pump.x);
      expect(inlet.y).toBeGreaterThan(layout.merged.ports["pump-check.inlet"].y);
      expect(inlet.y).toBeLessThan(pump.y);
      const pilotRoute = route("pump-check.outlet", "charging-valve.X");
      expect(pilotRoute.points).toHaveLength(2);
      expect(onRoute(pilotRoute.points[0], route("pump-check.outlet", "accumulator-block.P"))).toBe(true);
      // the accumulator stands on the block's A; the block and the valve drain to tanks of their own, clear of everything
      expect(route("accumulator-block.A", "accumulator.P").points.at(-1)).toMatchObject(layout.merged.ports["accumulator.P"]);
      expect(at("accumulator").x).toBeGreaterThan(at("accumulator-block").x);
      const drawn = [...symbolBoxes(html), ...captionBoxes(html)].filter((b) => b.name !== "tank");
      for (const from of ["accumulator-block.T", "charging-valve.2"]) {
        const drain = route(from, "tank.return");
        expect(drain.tank, from).toBeDefined();
        const tank = { name: `${from} tank`, left: drain.tank!.x - 20, right: drain.tank!.x + 20, top: drain.tank!.top, bottom: drain.tank!.top + 16 };
        // (its own symbol's box holds the stub its drain leaves from)
        for (const b of drawn.filter((x) => x.name !== componentOf(from))) expect(overlap(tank, b), `${from} tank / ${b.name}`).toBe(false);
      }
      // a junction dot where each branch leaves its line
      const dots = meetings(routes);
      for (const p of [inlet, pilotRoute.points[0], route("pump-check.outlet", "accumulator-block.P").points[1]])
        expect(
          dots.some((d) => d.x === p.x && d.y === p.y),
          `dot at ${p.x}, ${p.y}`,
        ).toBe(true);
    },
  );

  it.each(ACCUMULATOR_MACHINES)("%s: the description gives the accumulator, its block and charging valve in the viewer's units", (_name, m) => {
    const value = (id: string, key: string) => Number(m.circuit.components.find((c) => c.id === id)!.values![key]);
    const acc = {
      maxBar: value("charging-valve", "cutOutBar"),
      minBar: value("charging-valve", "cutInBar"),
      nominalL: value("accumulator", "nominalL"),
      prechargeBar: value("accumulator", "prechargeBar"),
      safetyBar: value("accumulator-block", "safetyBar"),
    };
    // the engine's figures, where the engine fitted it
    if (m.accumulator)
      expect(acc).toMatchObject({
        maxBar: m.accumulator.maxBar,
        minBar: m.accumulator.minBar,
        nominalL: m.accumulator.nominalL,
        prechargeBar: m.accumulator.prechargeBar,
      });
    for (const units of ["metric", "us"] as const) {
      const u = displayUnits(units);
      const text = desc(render(m, units));
      expect(text).toContain(
        `Accumulator charging valve on the pump line, piloted from the accumulator line: it unloads the pump to tank once the accumulator is charged to ${u.pressure(acc.maxBar)} and loads it again when the pressure falls to ${u.pressure(acc.minBar)}; a check valve after the pump keeps the accumulator's oil from flowing back while the pump is unloaded.`,
      );
      expect(text).toContain(
        `Bladder accumulator of ${u.volume(acc.nominalL)} with a gas precharge of ${u.pressure(acc.prechargeBar)} on the accumulator line`,
      );
      expect(text).toContain(
        `a safety relief valve set to ${u.pressure(acc.safetyBar)} and a normally open 2/2 solenoid discharge valve that vents the accumulator to tank whenever the power unit is switched off.`,
      );
      // in the power unit, before the axes
      expect(text.indexOf("Bladder accumulator")).toBeLessThan(text.indexOf("Axis "));
      const caption = render(m, units);
      expect(caption).toMatch(
        new RegExp(
          `>Accumulator charging valve</tspan><tspan[^>]*>unloads the pump at ${u.pressure(acc.maxBar)}</tspan><tspan[^>]*>loads it again at ${u.pressure(acc.minBar)}<`,
        ),
      );
      expect(caption).toMatch(
        new RegExp(
          `>Bladder accumulator</tspan><tspan[^>]*>${u.volume(acc.nominalL)} nominal</tspan><tspan[^>]*>gas precharge ${u.pressure(acc.prechargeBar)}<`,
        ),
      );
    }
  });

  it("a machine without an accumulator keeps its power unit where it was: no accumulator parts, pump and return column as before", () => {
    for (const m of Object.values(MACHINES).filter((x) => !hasAccumulator(x))) {
      const html = render(m);
      for (const kind of ["accumulator", "accumulator-block"]) expect(html).not.toContain(`data-kind="${kind}"`);
      const layout = layoutMachine(m.circuit);
      const double = m.pump.type === "double";
      // layout.ts's rows: the pump 176 (double 236) below the unit's valve line, its return run on the tank rail 30 below that line
      expect(layout.merged.at["pump"].y - layout.rails.tankY).toBe((double ? 236 : 176) - 30);
      expect(layout.merged.ports["filter.inlet"].x).toBe((double ? 700 : 600) + 120);
    }
  });

  it("draws a machine of one axis as one labelled column", () => {
    const m = sizeMachine({ axes: [RAM], ...DUTY });
    const html = render(m);
    expect(html).toContain('data-machine-axes="1"');
    expect(html).toContain('data-axis-label="Ram"');
    expect(desc(html)).toContain("Axis Ram: ");
    expect(html).toMatch(/<title[^>]*>[^<]*machine of 1 axis \(Ram\)/);
  });
});
