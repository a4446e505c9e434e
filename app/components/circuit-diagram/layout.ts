import type { Circuit, CircuitComponent } from "~/hydraulics/design";

/**
 * Where each symbol and port sits. The layout is fixed and conventional — cylinder at the
 * top, the counterbalance valve (when there is one) in its work line, the directional valve
 * below, the power unit at the bottom — and rows close up when a component is absent.
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
  dcv: { cx: number; top: number; bottom: number };
  /** y of the open top of every tank symbol */
  tankY: number;
  /** anchors by "componentId.port" */
  ports: Record<string, Anchor>;
}

const byKind = (components: CircuitComponent[], kind: CircuitComponent["kind"]) =>
  components.find((c) => c.kind === kind);

/** Side the counterbalance valve sits on: the work line its port 1 feeds. */
export function cbvSide(circuit: Circuit): "rod" | "cap" | null {
  const cbv = byKind(circuit.components, "cbv");
  if (!cbv) return null;
  if (cbv.values?.side === "rod" || cbv.values?.side === "cap") return cbv.values.side;
  const toCylinder = circuit.connections.find((c) => c.from === `${cbv.id}.1` || c.to === `${cbv.id}.1`);
  return toCylinder && /\.rod$/.test(toCylinder.from + toCylinder.to) ? "rod" : "cap";
}

export function layoutCircuit(circuit: Circuit): Layout {
  const at: Record<string, Point> = {};
  const ports: Record<string, Anchor> = {};
  const put = (kind: CircuitComponent["kind"], point: Point, anchors: Record<string, Anchor>) => {
    const c = byKind(circuit.components, kind);
    if (!c) return;
    at[c.id] = point;
    for (const [port, anchor] of Object.entries(anchors)) ports[`${c.id}.${port}`] = anchor;
  };

  // Row 1: the cylinder, cap end left, rod leaving to the right, both ports underneath.
  const cylinder: CylinderPlace = { capX: CAP_X, rodX: ROD_X, left: CAP_X - 30, right: ROD_X + 30, top: 96, bottom: 148, rodEnd: ROD_X + 110 };
  let y = cylinder.bottom;

  // Row 2: the counterbalance valve in the work line it guards; its pilot port faces the other line.
  const side = cbvSide(circuit);
  const cbvCx = side === "rod" ? ROD_X : CAP_X;
  const pilotSide = side === "rod" ? "left" : "right";
  let cbvCy = 0;
  if (side) {
    cbvCy = y + 44 + CBV_HALF_H;
    y = cbvCy + CBV_HALF_H;
  }

  // Row 3: the directional valve, its work lines turning along one channel above it.
  const channelY = y + 40;
  const dcvTop = channelY + 40;
  const dcvBottom = dcvTop + BOX;

  // Row 4: the power unit. Branches leave the pump line at fixed heights below the valve.
  const returnY = dcvBottom + 30;
  const reliefJunctionY = dcvBottom + 60;
  const gaugeY = dcvBottom + 100;
  const pumpY = dcvBottom + 176;
  const strainerY = pumpY + PUMP_R + 12 + DIAMOND;
  const tankY = strainerY + DIAMOND + 28;
  const reliefCy = reliefJunctionY + 30 + RELIEF_BOX / 2;
  const filterCy = returnY + 56;

  put("cylinder", { x: (CAP_X + ROD_X) / 2, y: (cylinder.top + cylinder.bottom) / 2 }, {
    cap: { x: CAP_X, y: cylinder.bottom, dir: "down", channelY },
    rod: { x: ROD_X, y: cylinder.bottom, dir: "down", channelY },
  });
  if (side) {
    const wallX = pilotSide === "left" ? cbvCx - CBV_HALF_W : cbvCx + CBV_HALF_W;
    put("cbv", { x: cbvCx, y: cbvCy }, {
      "1": { x: cbvCx, y: cbvCy - CBV_HALF_H, dir: "up" },
      "2": { x: cbvCx, y: cbvCy + CBV_HALF_H, dir: "down", channelY },
      "3": { x: wallX, y: cbvCy + CBV_PILOT_DY, dir: pilotSide },
    });
  }
  put("dcv", { x: DCV_CX, y: dcvTop + BOX / 2 }, {
    A: { x: A_X, y: dcvTop, dir: "up" },
    B: { x: B_X, y: dcvTop, dir: "up" },
    P: { x: A_X, y: dcvBottom, dir: "down" },
    T: { x: B_X, y: dcvBottom, dir: "down" },
  });
  put("relief", { x: RELIEF_X, y: reliefCy }, {
    "1": { x: RELIEF_X, y: reliefCy - RELIEF_BOX / 2, dir: "up", channelY: reliefJunctionY },
    "2": { x: RELIEF_X, y: reliefCy + RELIEF_BOX / 2, dir: "down" },
    // vent port X of a pilot-operated relief, drawn only when the data lists it
    ...(byKind(circuit.components, "relief")?.ports.includes("X")
      ? { X: { x: RELIEF_X - RELIEF_BOX / 2, y: reliefCy + RELIEF_VENT_DY, dir: "left" as const } }
      : {}),
  });
  // The vent valve sits below and left of the relief, its normal box over its own tank line.
  const ventCy = reliefCy + 44;
  put("vent", { x: VENT_X, y: ventCy }, {
    P: { x: VENT_X, y: ventCy - VENT_BOX / 2, dir: "up" },
    T: { x: VENT_X, y: ventCy + VENT_BOX / 2, dir: "down" },
  });
  put("gauge", { x: GAUGE_X, y: gaugeY }, { port: { x: GAUGE_X - GAUGE_R, y: gaugeY, dir: "left" } });
  put("filter", { x: FILTER_X, y: filterCy }, {
    inlet: { x: FILTER_X, y: filterCy - DIAMOND, dir: "up", channelY: returnY },
    outlet: { x: FILTER_X, y: filterCy + DIAMOND, dir: "down" },
  });
  put("pump", { x: A_X, y: pumpY }, {
    outlet: { x: A_X, y: pumpY - PUMP_R, dir: "up" },
    inlet: { x: A_X, y: pumpY + PUMP_R, dir: "down" },
    shaft: { x: A_X - PUMP_R, y: pumpY, dir: "left" },
  });
  put("motor", { x: MOTOR_X, y: pumpY }, { shaft: { x: MOTOR_X + MOTOR_R, y: pumpY, dir: "right" } });
  put("strainer", { x: A_X, y: strainerY }, {
    outlet: { x: A_X, y: strainerY - DIAMOND, dir: "up" },
    inlet: { x: A_X, y: strainerY + DIAMOND, dir: "down" },
  });
  // Tanks are drawn where each line ends (see routes.ts), so the reservoir has no single place.
  const tank = byKind(circuit.components, "tank");
  if (tank) at[tank.id] = { x: A_X, y: tankY };

  return {
    width: WIDTH,
    height: tankY + TANK_H + 36,
    at,
    cylinder,
    cbv: side ? { side, pilotSide } : null,
    dcv: { cx: DCV_CX, top: dcvTop, bottom: dcvBottom },
    tankY,
    ports,
  };
}
