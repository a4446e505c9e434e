import type { Circuit } from "~/hydraulics/design";
import type { MachineCircuit, MachineCircuitComponent } from "~/hydraulics/machine-design";
import { ACCUMULATOR_DROP, ACCUMULATOR_RETURN_DX, chargesAccumulator, placeAccumulator } from "./accumulator-layout";
import { FC_HALF_H, layoutCircuit, REDUCING_DRAIN_DX, REDUCING_DRAIN_DY, REDUCING_HALF_H, type Anchor, type Layout, type Point } from "./layout";

/**
 * A machine's circuit laid out from its data: each axis's parts are laid out as an axis alone
 * (layout.ts) in a column of their own, side by side, the directional valves brought to one row
 * as on a common manifold; below them the common pressure rail and the common tank rail that
 * every valve's P and T lines join; below those the power unit, laid out once as for an axis.
 * An axis's P-line parts (a flow control where it is on a larger shared pump, a reducing valve
 * where its cylinder is rated below the relief) stand under its valve's P port, in the order the
 * data joins them, the one joined to P on top.
 */

/** Width of one axis's column: the width an axis alone is drawn in. */
export const COLUMN_W = 760;
/** Room above the columns for each axis's name. */
const LABEL_ROW = 34;
/** Gap from the valve row to the first P-line part, and between two of them. */
const CONTROL_GAP = 30;
/** The P-line parts stand left of their valve's P port, clear of the T line. */
const CONTROL_DX = -56;
/** Pressure rail below the valve row (or the lowest P-line part); the tank rail below it. */
const RAIL_GAP = 30;
const RAIL_PITCH = 22;
/** How far right of an axis's return column the machine's filter and cooler stand. */
const RETURN_DX = 120;

const componentOf = (end: string) => end.slice(0, end.lastIndexOf("."));

export interface MachineColumn {
  axis: string;
  /** x of the column's centre line and y of the axis name above its cylinder */
  labelX: number;
  labelY: number;
  left: number;
  right: number;
}

/** One part of the drawing: which components it holds and the layout they are drawn from. */
export interface MachinePart {
  circuit: Circuit;
  layout: Layout;
}

export interface MachineLayout {
  width: number;
  height: number;
  columns: MachineColumn[];
  /** the layout each component is drawn from (its axis's column, or the power unit), by id */
  partOf: Record<string, MachinePart>;
  /** every port and centre in sheet coordinates, for routing the connections */
  merged: Layout;
  /** y of the common pressure and tank rails */
  rails: { pressureY: number; tankY: number };
}

/** A MachineCircuit has no valve positions of its own: each directional valve carries them. */
export const isMachineCircuit = (circuit: Circuit | MachineCircuit): circuit is MachineCircuit => !("dcvPositions" in circuit);

/** The machine's axes in the order the data lists them. */
export function axesOf(circuit: MachineCircuit): string[] {
  return [...new Set(circuit.components.flatMap((c) => (c.axis === undefined ? [] : [c.axis])))];
}

/** The parts that may stand in a valve's P line, with the port the oil enters by and the one it leaves by. */
const P_LINE_PORTS: Partial<Record<MachineCircuitComponent["kind"], { inlet: string; outlet: string }>> = {
  "flow-control": { inlet: "2", outlet: "1" },
  reducing: { inlet: "P", outlet: "A" },
};

/** Where oil enters (inlet) or leaves (outlet) a P-line part, as "id.port". */
export const pLinePort = (c: MachineCircuitComponent, end: "inlet" | "outlet"): string => `${c.id}.${P_LINE_PORTS[c.kind]?.[end] ?? ""}`;

/**
 * Each valve's P-line parts (an axis's share of a shared pump, its reducing valve), by valve id,
 * nearest the valve first: followed from the valve's P, each part's outlet joined to the port
 * above it, so the drawing keeps the order the data joins them in.
 */
export function pLineParts(circuit: MachineCircuit): Map<string, MachineCircuitComponent[]> {
  const byId = new Map(circuit.components.map((c) => [c.id, c]));
  const found = new Map<string, MachineCircuitComponent[]>();
  for (const dcv of circuit.components.filter((c) => c.kind === "dcv")) {
    const chain: MachineCircuitComponent[] = [];
    let end = `${dcv.id}.P`;
    for (;;) {
      const next = circuit.connections
        .flatMap((c) => (c.to === end ? [c.from] : c.from === end ? [c.to] : []))
        .map((other) => ({ other, part: byId.get(componentOf(other)) }))
        .find(({ other, part }) => part !== undefined && P_LINE_PORTS[part.kind] && other === pLinePort(part, "outlet") && !chain.includes(part))?.part;
      if (!next) break;
      chain.push(next);
      end = pLinePort(next, "inlet");
    }
    if (chain.length > 0) found.set(dcv.id, chain);
  }
  return found;
}

/** The part of one kind in each valve's P line, by valve id. */
function pLinePartsOfKind(circuit: MachineCircuit, kind: MachineCircuitComponent["kind"]): Map<string, MachineCircuitComponent> {
  const found = new Map<string, MachineCircuitComponent>();
  for (const [dcv, parts] of pLineParts(circuit)) {
    const part = parts.find((c) => c.kind === kind);
    if (part) found.set(dcv, part);
  }
  return found;
}

/** A flow control in a valve's P line: the axis's share of a shared pump, by valve id. */
export const pLineControls = (circuit: MachineCircuit) => pLinePartsOfKind(circuit, "flow-control");

/** A reducing valve in a valve's P line, by valve id. */
export const pLineReducers = (circuit: MachineCircuit) => pLinePartsOfKind(circuit, "reducing");

/** The components of one axis (or of the power unit, axis undefined) as a circuit of their own. */
export function subCircuit(circuit: MachineCircuit, axis: string | undefined, leaveOut: Set<string> = new Set()): Circuit {
  const components = circuit.components.filter((c) => c.axis === axis && !leaveOut.has(c.id));
  const ids = new Set(components.map((c) => c.id));
  const dcv = components.find((c) => c.kind === "dcv") as MachineCircuitComponent | undefined;
  return {
    components,
    connections: circuit.connections.filter((c) => ids.has(componentOf(c.from)) && ids.has(componentOf(c.to))),
    dcvPositions: dcv?.dcvPositions ?? { left: [], center: [], right: [] },
  };
}

const shiftAnchor = (a: Anchor, dx: number, dy: number): Anchor => ({
  ...a,
  x: a.x + dx,
  y: a.y + dy,
  ...(a.channelY !== undefined ? { channelY: a.channelY + dy } : {}),
  ...(a.tankTop !== undefined ? { tankTop: a.tankTop + dy } : {}),
});

/** A layout moved across and down the sheet, every place in it alike. */
export function shiftLayout(l: Layout, dx: number, dy: number): Layout {
  const move = (p: Point): Point => ({ x: p.x + dx, y: p.y + dy });
  return {
    ...l,
    width: l.width + dx,
    height: l.height + dy,
    at: Object.fromEntries(Object.entries(l.at).map(([id, p]) => [id, move(p)])),
    cylinder: {
      capX: l.cylinder.capX + dx,
      rodX: l.cylinder.rodX + dx,
      left: l.cylinder.left + dx,
      right: l.cylinder.right + dx,
      rodEnd: l.cylinder.rodEnd + dx,
      top: l.cylinder.top + dy,
      bottom: l.cylinder.bottom + dy,
    },
    dcv: { cx: l.dcv.cx + dx, top: l.dcv.top + dy, bottom: l.dcv.bottom + dy },
    returnX: l.returnX + dx,
    tankY: l.tankY + dy,
    ports: Object.fromEntries(Object.entries(l.ports).map(([k, a]) => [k, shiftAnchor(a, dx, dy)])),
  };
}

/** Half the height of a P-line part, centre to port. */
const pLineHalfH = (c: MachineCircuitComponent): number => (c.kind === "reducing" ? REDUCING_HALF_H : FC_HALF_H);

export function layoutMachine(circuit: MachineCircuit): MachineLayout {
  const chains = pLineParts(circuit);
  const chainIds = new Set([...chains.values()].flat().map((c) => c.id));
  const axes = axesOf(circuit).map((axis) => {
    const own = subCircuit(circuit, axis, chainIds);
    return { axis, circuit: own, layout: layoutCircuit(own) };
  });
  // Valves on one row: each column moves down by what its valve stands above the lowest one.
  const valveRow = Math.max(...axes.map((a) => a.layout.dcv.bottom));
  const partOf: Record<string, MachinePart> = {};
  const columns: MachineColumn[] = [];
  const shifted = axes.map((a, i) => {
    const dx = i * COLUMN_W;
    const dy = LABEL_ROW + valveRow - a.layout.dcv.bottom;
    const layout = shiftLayout(a.layout, dx, dy);
    for (const c of a.circuit.components) partOf[c.id] = { circuit: a.circuit, layout };
    columns.push({ axis: a.axis, labelX: layout.dcv.cx, labelY: layout.cylinder.top - 56, left: dx, right: dx + COLUMN_W });
    return { ...a, layout };
  });
  const dcvBottom = LABEL_ROW + valveRow;

  // Each valve's P-line parts stacked under its P port, outlet up to the part above, inlet down;
  // the lowest inlet runs to the pressure rail, below the longest stack (a gap above each part).
  const controlTop = dcvBottom + CONTROL_GAP;
  const stackHeight = (parts: MachineCircuitComponent[]) => parts.reduce((h, c) => h + CONTROL_GAP + 2 * pLineHalfH(c), 0);
  const pressureY = dcvBottom + Math.max(0, ...[...chains.values()].map(stackHeight)) + RAIL_GAP;
  const tankY = pressureY + RAIL_PITCH;
  const extraPorts: Record<string, Anchor> = {};
  const extraAt: Record<string, Point> = {};
  for (const a of shifted) {
    const dcv = a.circuit.components.find((c) => c.kind === "dcv");
    if (!dcv) continue;
    const p = a.layout.ports[`${dcv.id}.P`];
    const t = a.layout.ports[`${dcv.id}.T`];
    const parts = chains.get(dcv.id) ?? [];
    if (p) p.channelY = parts.length > 0 ? (dcvBottom + controlTop) / 2 : pressureY;
    if (t) t.channelY = tankY;
    if (!p) continue;
    const x = p.x + CONTROL_DX;
    let top = controlTop;
    const own: Record<string, Anchor> = {};
    const ownAt: Record<string, Point> = {};
    parts.forEach((c, k) => {
      const half = pLineHalfH(c);
      const cy = top + half;
      ownAt[c.id] = { x, y: cy };
      own[pLinePort(c, "outlet")] = { x, y: cy - half, dir: "up" };
      own[pLinePort(c, "inlet")] = { x, y: cy + half, dir: "down", ...(k === parts.length - 1 ? { channelY: pressureY } : {}) };
      // the drain from the end of the reducing valve's spring to a tank of its own beside it
      if (c.kind === "reducing") own[`${c.id}.Y`] = { x: x + REDUCING_DRAIN_DX, y: cy + REDUCING_DRAIN_DY, dir: "down", tankTop: cy + REDUCING_DRAIN_DY + 4 };
      top = cy + half + CONTROL_GAP;
    });
    Object.assign(extraPorts, own);
    Object.assign(extraAt, ownAt);
    for (const c of parts)
      partOf[c.id] = { circuit: a.circuit, layout: { ...a.layout, at: { ...a.layout.at, ...ownAt }, ports: { ...a.layout.ports, ...own } } };
  }

  // The power unit once, under the first column, its return line's run on the tank rail.
  const unitCircuit = subCircuit(circuit, undefined);
  const alone = layoutCircuit(unitCircuit);
  // An accumulator's charging circuit stands between the pump and the rails, right of the pump line.
  const accumulator = chargesAccumulator(unitCircuit);
  // Without a valve, layout.ts puts the unit's "valve bottom" at alone.dcv.bottom; its return run is 30 below.
  const unit = shiftLayout(alone, 0, tankY - 30 - alone.dcv.bottom + (accumulator ? ACCUMULATOR_DROP : 0));
  if (accumulator) placeAccumulator(unit, unitCircuit);
  // The return column moves right, where a machine has room, clear of a long pump caption (and of an accumulator).
  const returnDx = accumulator ? ACCUMULATOR_RETURN_DX : RETURN_DX;
  const returnParts = unitCircuit.components.filter((c) => c.kind === "filter" || c.kind === "cooler").map((c) => c.id);
  for (const id of returnParts) {
    if (unit.at[id]) unit.at[id] = { ...unit.at[id], x: unit.at[id].x + returnDx };
    for (const port of Object.keys(unit.ports).filter((k) => componentOf(k) === id))
      unit.ports[port] = { ...unit.ports[port], x: unit.ports[port].x + returnDx };
  }
  unit.returnX += returnDx;
  for (const c of unitCircuit.components) partOf[c.id] = { circuit: unitCircuit, layout: unit };
  const filterInlet = Object.keys(unit.ports).find(
    (k) => k.endsWith(".inlet") && unitCircuit.components.some((c) => c.kind === "filter" && `${c.id}.inlet` === k),
  );
  if (filterInlet) unit.ports[filterInlet] = { ...unit.ports[filterInlet], channelY: tankY };

  const width = Math.max(axes.length * COLUMN_W, alone.width + returnDx);
  const merged: Layout = {
    ...unit,
    width,
    at: Object.assign({}, unit.at, ...shifted.map((a) => a.layout.at), extraAt),
    ports: Object.assign({}, unit.ports, ...shifted.map((a) => a.layout.ports), extraPorts),
  };
  return { width, height: unit.height, columns, partOf, merged, rails: { pressureY, tankY } };
}
