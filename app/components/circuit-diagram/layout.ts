import type { Circuit, CircuitComponent } from "~/hydraulics/design";

/**
 * Where each symbol and port sits. The layout is fixed and conventional — cylinder at the
 * top, the valves of each work line stacked in its column in the order the data joins them
 * (the holding check at the cylinder, then the counterbalance valve, then the pressing-speed
 * control; the regeneration valve nearest the directional valve in the rod column), the
 * directional valve below, the power unit at the bottom — and rows close up when a component is
 * absent. Switches: the pressure switch beside the line it senses, a limit switch at the rod.
 */

export type Direction = "up" | "down" | "left" | "right";

export interface Point {
  x: number;
  y: number;
}

/** A port: where a line meets the symbol, and which way the line leaves it. */
export interface Anchor extends Point {
  dir: Direction;
  /** y of the horizontal run a line takes before it turns into this port */
  channelY?: number;
  /** a tee: the line runs straight out of this port to the nearest line of the net it joins */
  tap?: boolean;
  /** a line from this port to the reservoir ends at a tank symbol of its own, open top at this y */
  tankTop?: number;
}

export const WIDTH = 760;

/** Directional valve: three position boxes of BOX × BOX around the centre box. */
export const BOX = 72;
const DCV_CX = 380;
/** Port offsets in a position box: A and P on the left quarter, B and T on the right. */
export const PORT_INSET = 18;
const A_X = DCV_CX - BOX / 2 + PORT_INSET;
const B_X = DCV_CX + BOX / 2 - PORT_INSET;

const CAP_X = 270;
const ROD_X = 490;
const RELIEF_X = 180;
const GAUGE_X = 450;
const FILTER_X = 600;
const MOTOR_X = 280;
/** the decompression valve sits left of the cap port, below the cylinder's left end */
const DECOMPRESSION_X = 215;
/** a double pump's large section sits this far right of the small one, and the right-hand columns move over */
const LARGE_SECTION_DX = 108;
const DOUBLE_PUMP_SHIFT = 100;

export const PUMP_R = 24;
export const MOTOR_R = 22;
export const GAUGE_R = 14;
export const DIAMOND = 15;
export const RELIEF_BOX = 36;
export const CBV_HALF_W = 62;
export const CBV_HALF_H = 56;
/** pilot port 3 sits this far below the counterbalance valve's centre */
export const CBV_PILOT_DY = 12;
/** Relief vent valve: two position boxes of VENT_BOX, ports under the right (normal) box. */
export const VENT_BOX = 26;
const VENT_X = 130;
/** the relief's vent port X leaves its left wall this far below the centre */
export const RELIEF_VENT_DY = 12;
/** Pilot-operated check: body half width and half height; pilot X this far below the centre. */
export const POC_HALF_W = 24;
export const POC_HALF_H = 30;
export const INLINE_PILOT_DY = 12;
/** between two valves of one work line: room for both port numbers */
const IN_LINE_GAP = 44;
/**
 * Where a pilot port sits below its valve's centre. A check on the rod port takes its pilot a
 * little higher than one on the cap port, so two crossed pilots (checks on both ports) never
 * share a run and never seem joined.
 */
const pilotDy = (kind: CircuitComponent["kind"], side: "cap" | "rod") =>
  kind === "cbv" ? CBV_PILOT_DY : side === "rod" ? INLINE_PILOT_DY - 10 : INLINE_PILOT_DY;
/** Flow control with its free-flow check: half width and half height of the enclosure. */
export const FC_HALF_W = 32;
export const FC_HALF_H = 34;
/**
 * Pressure-reducing valve in a machine axis's P line: a RELIEF_BOX square whose ports A (above)
 * and P (below) stand REDUCING_HALF_H from its centre; its return check REDUCING_CHECK_DX to
 * the left, joined to both lines REDUCING_CHECK_DY above and below the centre; its drain Y leaves
 * the end of its spring, REDUCING_DRAIN_DX right of and REDUCING_DRAIN_DY below the centre,
 * down to a tank of its own.
 */
export const REDUCING_HALF_H = 44;
export const REDUCING_CHECK_DX = 48;
export const REDUCING_CHECK_DY = 36;
export const REDUCING_DRAIN_DX = RELIEF_BOX / 2 + 24;
export const REDUCING_DRAIN_DY = 24;
/** The bypass valve sits this far beside the flow control, its normal box in line with it. */
const BYPASS_DX = 70;
/**
 * Regeneration valve, a 3/2 valve: position boxes of REGEN_BOX; in each, ports 1 (top) and 2
 * (bottom) sit on the work-line column, a quarter box from the outer wall, and port 3 (bottom)
 * a half box towards the other column, where its line leaves for the cap line.
 */
export const REGEN_BOX = 32;
export const REGEN_PORT3_DX = REGEN_BOX / 2;
/** Pressure switch: box half size; it sits left of the cap column, its port on its right wall. */
export const SWITCH_HALF = 12;
const PRESSURE_SWITCH_DX = 62;
/** Check valve in a line: half length along the flow. */
export const CHECK_HALF = 14;
/** Unloading valve outlet stub, from its wall to where the tank line drops. */
export const UNLOADING_STUB = 14;
/** Decompression valve: the orifice and stub from its wall to where the tank line drops. */
export const DECOMPRESSION_STUB = 26;
export const TANK_W = 40;
export const TANK_H = 16;

export interface CylinderPlace {
  capX: number;
  rodX: number;
  left: number;
  right: number;
  top: number;
  bottom: number;
  rodEnd: number;
}

export interface Layout {
  width: number;
  height: number;
  /** centre of each drawn component, by id */
  at: Record<string, Point>;
  cylinder: CylinderPlace;
  cbv: { side: "rod" | "cap"; pilotSide: "left" | "right" } | null;
  /** the wall each in-line valve's pilot port is on: towards the other work line */
  pilotSide: Record<string, "left" | "right">;
  dcv: { cx: number; top: number; bottom: number };
  /** the return column (filter, cooler) */
  returnX: number;
  /** y of the open top of the tank symbols at the bottom */
  tankY: number;
  /** anchors by "componentId.port" */
  ports: Record<string, Anchor>;
}

const byKind = (components: CircuitComponent[], kind: CircuitComponent["kind"]) => components.find((c) => c.kind === kind);

/** Side the counterbalance valve sits on: the work line its port 1 feeds. */
export function cbvSide(circuit: Pick<Circuit, "components" | "connections">): "rod" | "cap" | null {
  const cbv = byKind(circuit.components, "cbv");
  if (!cbv) return null;
  if (cbv.values?.side === "rod" || cbv.values?.side === "cap") return cbv.values.side;
  const toCylinder = circuit.connections.find((c) => c.from === `${cbv.id}.1` || c.to === `${cbv.id}.1`);
  return toCylinder && /\.rod$/.test(toCylinder.from + toCylinder.to) ? "rod" : "cap";
}

/** Valves drawn in a work line: port 1 towards the cylinder, 2 towards the directional valve. */
const IN_LINE: Partial<Record<CircuitComponent["kind"], { halfW: number; halfH: number; pilot?: string }>> = {
  cbv: { halfW: CBV_HALF_W, halfH: CBV_HALF_H, pilot: "3" },
  poc: { halfW: POC_HALF_W, halfH: POC_HALF_H, pilot: "X" },
  "flow-control": { halfW: FC_HALF_W, halfH: FC_HALF_H },
  regen: { halfW: REGEN_BOX, halfH: REGEN_BOX / 2 },
};

/**
 * The in-line valves of one work line, from the cylinder port towards the directional valve,
 * found by following the connections from port 1 to port 2 of each (so the drawing keeps the
 * order the data gives).
 */
export function inLineValves(circuit: Pick<Circuit, "components" | "connections">, side: "cap" | "rod"): CircuitComponent[] {
  const cylinder = byKind(circuit.components, "cylinder");
  if (!cylinder) return [];
  const byId = new Map(circuit.components.map((c) => [c.id, c]));
  const found: CircuitComponent[] = [];
  let port = `${cylinder.id}.${side}`;
  for (;;) {
    const next = circuit.connections
      .filter((c) => c.line !== "pilot" && (c.from === port || c.to === port))
      .map((c) => (c.from === port ? c.to : c.from))
      .map((end) => ({ end, c: byId.get(end.slice(0, end.indexOf("."))) }))
      .find(({ end, c }) => c && IN_LINE[c.kind] && end === `${c.id}.1` && !found.includes(c));
    if (!next?.c) return found;
    found.push(next.c);
    port = `${next.c.id}.2`;
  }
}

export function layoutCircuit(circuit: Pick<Circuit, "components" | "connections">): Layout {
  const at: Record<string, Point> = {};
  const ports: Record<string, Anchor> = {};
  const pilotSide: Record<string, "left" | "right"> = {};
  const place = (c: CircuitComponent | undefined, point: Point, anchors: Record<string, Anchor>) => {
    if (!c) return;
    at[c.id] = point;
    for (const [port, anchor] of Object.entries(anchors)) ports[`${c.id}.${port}`] = anchor;
  };
  const put = (kind: CircuitComponent["kind"], point: Point, anchors: Record<string, Anchor>) => place(byKind(circuit.components, kind), point, anchors);
  const has = (kind: CircuitComponent["kind"]) => byKind(circuit.components, kind) !== undefined;

  // Row 1: the cylinder, cap end left, rod leaving to the right, both ports underneath.
  const cylinder: CylinderPlace = { capX: CAP_X, rodX: ROD_X, left: CAP_X - 30, right: ROD_X + 30, top: 96, bottom: 148, rodEnd: ROD_X + 110 };

  // Row 2: each work line's valves stacked in its column, pilots facing the other column.
  // The cap line leaves room under the cylinder for the decompression valve's tee.
  // A pilot tees straight across onto the other work line, so where only one column has
  // piloted valves, that column starts below the other's valves (and their bypass tees).
  const columns = { cap: inLineValves(circuit, "cap"), rod: inLineValves(circuit, "rod") };
  const piloted = (side: "cap" | "rod") => columns[side].some((c) => IN_LINE[c.kind]?.pilot);
  const stackHeight = (side: "cap" | "rod") => columns[side].reduce((h, c, i) => h + (i > 0 ? IN_LINE_GAP : 44) + 2 * IN_LINE[c.kind]!.halfH, 0);
  const firstGap = { cap: has("decompression") ? 100 : 44, rod: 44 };
  for (const [side, other] of [
    ["cap", "rod"],
    ["rod", "cap"],
  ] as const) {
    if (piloted(side) && !piloted(other) && columns[other].length > 0) {
      const otherBottom = firstGap[other] - 44 + stackHeight(other) + 14;
      firstGap[side] = Math.max(firstGap[side], otherBottom + 30);
    }
  }
  const centres: { c: CircuitComponent; x: number; cy: number; side: "cap" | "rod" }[] = [];
  let bottom = cylinder.bottom;
  for (const side of ["cap", "rod"] as const) {
    const x = side === "cap" ? CAP_X : ROD_X;
    let y = cylinder.bottom;
    columns[side].forEach((c, i) => {
      const { halfH } = IN_LINE[c.kind]!;
      y += i > 0 ? IN_LINE_GAP : firstGap[side];
      centres.push({ c, x, cy: y + halfH, side });
      y += 2 * halfH;
    });
    bottom = Math.max(bottom, y);
  }

  // The regeneration valve, nearest the directional valve, moves down below both stacks (to the
  // valve stack, clear of the other column's captions), unless a pilot from the other column
  // must tee onto the line below it.
  const regen = centres.find((e) => e.c.kind === "regen");
  if (regen && !piloted(regen.side === "rod" ? "cap" : "rod")) {
    const others = centres.filter((e) => e !== regen).map((e) => e.cy + IN_LINE[e.c.kind]!.halfH);
    const halfH = IN_LINE.regen!.halfH;
    regen.cy = Math.max(regen.cy, Math.max(cylinder.bottom, ...others) + 24 + halfH);
    bottom = Math.max(bottom, regen.cy + halfH);
  }

  // Row 4: the directional valve, its work lines turning along one channel above it (lower
  // where a pressure switch needs room beside the cap line).
  const channelY = bottom + 40 + (has("pressure-switch") ? 24 : 0);
  const dcvTop = channelY + 40;
  const dcvBottom = dcvTop + BOX;

  put(
    "cylinder",
    { x: (CAP_X + ROD_X) / 2, y: (cylinder.top + cylinder.bottom) / 2 },
    {
      cap: { x: CAP_X, y: cylinder.bottom, dir: "down", channelY },
      rod: { x: ROD_X, y: cylinder.bottom, dir: "down", channelY },
    },
  );
  for (const { c, x, cy, side } of centres) {
    const { halfW, halfH, pilot } = IN_LINE[c.kind]!;
    const towards = side === "rod" ? "left" : "right";
    pilotSide[c.id] = towards;
    place(
      c,
      { x, y: cy },
      {
        "1": { x, y: cy - halfH, dir: "up" },
        "2": { x, y: cy + halfH, dir: "down", channelY },
        // the regeneration valve's port 3 drops to its own channel, above the work lines', and on to port A
        ...(c.kind === "regen"
          ? { "3": { x: towards === "left" ? x - REGEN_PORT3_DX : x + REGEN_PORT3_DX, y: cy + halfH, dir: "down" as const, channelY: channelY - 14 } }
          : {}),
        ...(pilot ? { [pilot]: { x: towards === "left" ? x - halfW : x + halfW, y: cy + pilotDy(c.kind, side), dir: towards, tap: true } } : {}),
      },
    );
  }
  // The bypass valve beside the flow control, joined above and below it.
  const control = centres.find((e) => e.c.kind === "flow-control");
  if (control) {
    const bx = control.x + (control.side === "cap" ? -BYPASS_DX : BYPASS_DX);
    put(
      "bypass",
      { x: bx, y: control.cy },
      {
        "1": { x: bx, y: control.cy - VENT_BOX / 2, dir: "up", channelY: control.cy - FC_HALF_H - 14 },
        "2": { x: bx, y: control.cy + VENT_BOX / 2, dir: "down", channelY: control.cy + FC_HALF_H + 14 },
      },
    );
  }
  const decompressionY = cylinder.bottom + 34;
  put(
    "decompression",
    { x: DECOMPRESSION_X, y: decompressionY },
    {
      "1": { x: DECOMPRESSION_X + VENT_BOX / 2, y: decompressionY, dir: "right", tap: true },
      "2": { x: DECOMPRESSION_X - VENT_BOX / 2 - DECOMPRESSION_STUB, y: decompressionY, dir: "down", tankTop: decompressionY + 22 },
    },
  );
  // The pressure switch tees straight across onto the cap line, below every valve in it.
  const switchX = CAP_X - PRESSURE_SWITCH_DX;
  const switchY = channelY - 24;
  put("pressure-switch", { x: switchX, y: switchY }, { port: { x: switchX + SWITCH_HALF, y: switchY, dir: "right", tap: true } });
  // A limit switch has no port: it is marked beyond the rod end, where the rod's travel reaches it.
  for (const c of circuit.components.filter((x) => x.kind === "limit-switch")) at[c.id] = { x: cylinder.rodEnd + 44, y: (cylinder.top + cylinder.bottom) / 2 };
  put(
    "dcv",
    { x: DCV_CX, y: dcvTop + BOX / 2 },
    {
      A: { x: A_X, y: dcvTop, dir: "up" },
      B: { x: B_X, y: dcvTop, dir: "up" },
      P: { x: A_X, y: dcvBottom, dir: "down" },
      T: { x: B_X, y: dcvBottom, dir: "down" },
    },
  );

  // Row 5: the power unit. Branches leave the pump line at fixed heights below the valve. A
  // double pump's large section, check and unloading valve take the space right of the pump
  // line, so the gauge moves left and the return column moves right.
  const double = circuit.components.some((c) => c.kind === "pump" && c.values?.section === "large");
  const shift = double ? DOUBLE_PUMP_SHIFT : 0;
  const returnX = FILTER_X + shift;
  const returnY = dcvBottom + 30;
  const reliefJunctionY = dcvBottom + 60;
  const pumpY = dcvBottom + (double ? 236 : 176);
  const strainerY = pumpY + PUMP_R + 12 + DIAMOND;
  const tankY = strainerY + DIAMOND + 28;
  const reliefCy = reliefJunctionY + 30 + RELIEF_BOX / 2;
  const filterCy = returnY + 56;
  const coolerCy = filterCy + 58;

  put(
    "relief",
    { x: RELIEF_X, y: reliefCy },
    {
      "1": { x: RELIEF_X, y: reliefCy - RELIEF_BOX / 2, dir: "up", channelY: reliefJunctionY },
      "2": { x: RELIEF_X, y: reliefCy + RELIEF_BOX / 2, dir: "down" },
      // vent port X of a pilot-operated relief, drawn only when the data lists it
      ...(byKind(circuit.components, "relief")?.ports.includes("X")
        ? { X: { x: RELIEF_X - RELIEF_BOX / 2, y: reliefCy + RELIEF_VENT_DY, dir: "left" as const } }
        : {}),
    },
  );
  // The vent valve sits below and left of the relief, its normal box over its own tank line.
  const ventCy = reliefCy + 44;
  put(
    "vent",
    { x: VENT_X, y: ventCy },
    {
      P: { x: VENT_X, y: ventCy - VENT_BOX / 2, dir: "up" },
      T: { x: VENT_X, y: ventCy + VENT_BOX / 2, dir: "down" },
    },
  );
  if (double) {
    const gaugeY = dcvBottom + 150;
    put("gauge", { x: 300, y: gaugeY }, { port: { x: 300 + GAUGE_R, y: gaugeY, dir: "right" } });
  } else {
    const gaugeY = dcvBottom + 100;
    put("gauge", { x: GAUGE_X, y: gaugeY }, { port: { x: GAUGE_X - GAUGE_R, y: gaugeY, dir: "left" } });
  }
  put(
    "filter",
    { x: returnX, y: filterCy },
    {
      inlet: { x: returnX, y: filterCy - DIAMOND, dir: "up", channelY: returnY },
      outlet: { x: returnX, y: filterCy + DIAMOND, dir: "down" },
    },
  );
  put(
    "cooler",
    { x: returnX, y: coolerCy },
    {
      inlet: { x: returnX, y: coolerCy - DIAMOND, dir: "up" },
      outlet: { x: returnX, y: coolerCy + DIAMOND, dir: "down" },
    },
  );
  const pumps = circuit.components.filter((c) => c.kind === "pump");
  const small = pumps.find((c) => c.id === "pump") ?? pumps.find((c) => c.values?.section !== "large");
  const large = pumps.find((c) => c !== small);
  place(
    small,
    { x: A_X, y: pumpY },
    {
      outlet: { x: A_X, y: pumpY - PUMP_R, dir: "up" },
      inlet: { x: A_X, y: pumpY + PUMP_R, dir: "down" },
      shaft: { x: A_X - PUMP_R, y: pumpY, dir: "left" },
    },
  );
  if (large) {
    const lx = A_X + LARGE_SECTION_DX;
    const checkY = dcvBottom + 150;
    const ux = lx + 70;
    const uy = dcvBottom + 190;
    place(
      large,
      { x: lx, y: pumpY },
      {
        outlet: { x: lx, y: pumpY - PUMP_R, dir: "up" },
        inlet: { x: lx, y: pumpY + PUMP_R, dir: "down" },
        shaft: { x: lx - PUMP_R, y: pumpY, dir: "left" },
      },
    );
    put(
      "check",
      { x: lx, y: checkY },
      {
        inlet: { x: lx, y: checkY + CHECK_HALF, dir: "down" },
        outlet: { x: lx, y: checkY - CHECK_HALF, dir: "up", channelY: dcvBottom + 84 },
      },
    );
    put(
      "unloading",
      { x: ux, y: uy },
      {
        "1": { x: ux - RELIEF_BOX / 2, y: uy, dir: "left", tap: true },
        "2": { x: ux + RELIEF_BOX / 2 + UNLOADING_STUB, y: uy, dir: "right", tankTop: uy + 22 },
        X: { x: ux, y: uy - RELIEF_BOX / 2, dir: "up", channelY: dcvBottom + 112 },
      },
    );
  }
  put("motor", { x: MOTOR_X, y: pumpY }, { shaft: { x: MOTOR_X + MOTOR_R, y: pumpY, dir: "right" } });
  put(
    "strainer",
    { x: A_X, y: strainerY },
    {
      outlet: { x: A_X, y: strainerY - DIAMOND, dir: "up" },
      inlet: { x: A_X, y: strainerY + DIAMOND, dir: "down" },
    },
  );
  // Tanks are drawn where each line ends (see routes.ts), so the reservoir has no single place.
  const tank = byKind(circuit.components, "tank");
  if (tank) at[tank.id] = { x: A_X, y: tankY };

  const cbv = byKind(circuit.components, "cbv");
  const side = cbvSide(circuit);
  return {
    width: WIDTH + shift,
    height: tankY + TANK_H + 36,
    at,
    cylinder,
    cbv: side && cbv ? { side, pilotSide: pilotSide[cbv.id] ?? (side === "rod" ? "left" : "right") } : null,
    pilotSide,
    dcv: { cx: DCV_CX, top: dcvTop, bottom: dcvBottom },
    returnX,
    tankY,
    ports,
  };
}
