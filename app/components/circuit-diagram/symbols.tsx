import type { DcvPositions, SolenoidValvePositions } from "~/hydraulics/design";
import {
  BOX,
  CBV_HALF_H,
  CBV_HALF_W,
  CBV_PILOT_DY,
  CHECK_HALF,
  DECOMPRESSION_STUB,
  DIAMOND,
  FC_HALF_H,
  FC_HALF_W,
  GAUGE_R,
  INLINE_PILOT_DY,
  MOTOR_R,
  POC_HALF_H,
  POC_HALF_W,
  PUMP_R,
  REDUCING_CHECK_DX,
  REDUCING_CHECK_DY,
  REDUCING_DRAIN_DX,
  REDUCING_DRAIN_DY,
  REDUCING_HALF_H,
  REGEN_BOX,
  REGEN_PORT3_DX,
  RELIEF_BOX,
  RELIEF_VENT_DY,
  SWITCH_HALF,
  TANK_H,
  TANK_W,
  UNLOADING_STUB,
  VENT_BOX,
  type CylinderPlace,
  type Point,
} from "./layout";
import { ACC_H, ACC_STEM, ACC_W, BLOCK_H, BLOCK_LINE_DY, BLOCK_T_DX, BLOCK_W } from "./accumulator-layout";
import { blockedPorts, boxDrawing, pairsLabel } from "./valve-positions";

/**
 * ISO 1219-1 style symbols, drawn in Tenderflow's own line weights. Every symbol strokes in
 * currentColor, so the diagram takes the ink colour of whatever page or export holds it.
 */

export const STROKE = { symbol: 1.6, thin: 1.1, heavy: 2 } as const;
export const DASH = { pilot: "5 3", enclosure: "9 3 2 3", element: "3 2", strainer: "1 2.5" } as const;

const outline = { fill: "none", stroke: "currentColor", strokeWidth: STROKE.symbol } as const;
const thin = { fill: "none", stroke: "currentColor", strokeWidth: STROKE.thin } as const;
const pilot = { ...thin, strokeDasharray: DASH.pilot } as const;

const pts = (points: Point[]) => points.map((p) => `${p.x},${p.y}`).join(" ");

/** Filled arrowhead at `to`, pointing away from `from`. */
function ArrowHead({ from, to, length = 8, half = 3.5 }: { from: Point; to: Point; length?: number; half?: number }) {
  const dx = to.x - from.x;
  const dy = to.y - from.y;
  const d = Math.hypot(dx, dy) || 1;
  const ux = dx / d;
  const uy = dy / d;
  const base = { x: to.x - ux * length, y: to.y - uy * length };
  const corners = [to, { x: base.x - uy * half, y: base.y + ux * half }, { x: base.x + uy * half, y: base.y - ux * half }];
  return <polygon points={pts(corners)} fill="currentColor" stroke="none" />;
}

function Arrow({ from, to }: { from: Point; to: Point }) {
  return (
    <>
      <line x1={from.x} y1={from.y} x2={to.x} y2={to.y} {...thin} />
      <ArrowHead from={from} to={to} />
    </>
  );
}

/** A compression spring as a zigzag from a to b. */
function Spring({ a, b, turns = 4, amplitude = 5 }: { a: Point; b: Point; turns?: number; amplitude?: number }) {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const d = Math.hypot(dx, dy) || 1;
  const nx = -dy / d;
  const ny = dx / d;
  const points: Point[] = [a];
  for (let i = 0; i < turns * 2; i++) {
    const t = (i + 0.5) / (turns * 2);
    const side = i % 2 === 0 ? 1 : -1;
    points.push({ x: a.x + dx * t + nx * amplitude * side, y: a.y + dy * t + ny * amplitude * side });
  }
  points.push(b);
  return <polyline points={pts(points)} {...thin} />;
}

/** The diagonal arrow that marks a spring as adjustable (a setting). */
function Adjustable({ centre, span = 12 }: { centre: Point; span?: number }) {
  const from = { x: centre.x - span, y: centre.y + span };
  const to = { x: centre.x + span, y: centre.y - span };
  return <Arrow from={from} to={to} />;
}

// ---- Text ---------------------------------------------------------------------------------

type Anchor = "start" | "middle" | "end";

/** A component's name and its values, one per line. */
export function Caption({ x, y, anchor = "start", name, values }: { x: number; y: number; anchor?: Anchor; name: string; values: string[] }) {
  return (
    <text x={x} y={y} textAnchor={anchor} fontSize={11.5} fill="currentColor" stroke="none">
      <tspan x={x} className="fill-ink-800" fontWeight={600}>
        {name}
      </tspan>
      {values.map((v, i) => (
        <tspan key={i} x={x} dy={14} className="fill-flow-700">
          {v}
        </tspan>
      ))}
    </text>
  );
}

/** A port label as the trade marks it (P, T, A, B; 1, 2, 3; cap, rod). */
export function PortLabel({ x, y, anchor = "middle", port, children }: { x: number; y: number; anchor?: Anchor; port: string; children: string }) {
  return (
    <text x={x} y={y} textAnchor={anchor} data-port={port} fontSize={11} fontWeight={700} fill="currentColor" stroke="none" className="fill-ink-600">
      {children}
    </text>
  );
}

// ---- Actuator -------------------------------------------------------------------------------

/** Double-acting single-rod cylinder: barrel, piston, rod leaving through the rod end. */
export function CylinderSymbol({ id, place }: { id: string; place: CylinderPlace }) {
  const { left, right, top, bottom, rodEnd } = place;
  const midY = (top + bottom) / 2;
  const pistonX = left + (right - left) * 0.3;
  const rodHalf = 6;
  return (
    <g data-component={id} data-kind="cylinder">
      <rect x={left} y={top} width={right - left} height={bottom - top} {...outline} />
      <rect x={pistonX - 3} y={top} width={6} height={bottom - top} fill="currentColor" stroke="none" />
      {/* the white rod body hides the end wall where the rod passes through the gland */}
      <rect
        x={pistonX + 3}
        y={midY - rodHalf}
        width={rodEnd - pistonX - 3}
        height={rodHalf * 2}
        fill="white"
        {...{ stroke: "currentColor", strokeWidth: STROKE.symbol }}
      />
      <line x1={right} y1={top} x2={right} y2={midY - rodHalf} {...outline} />
      <line x1={right} y1={midY + rodHalf} x2={right} y2={bottom} {...outline} />
      <PortLabel x={place.capX - 7} y={bottom + 15} anchor="end" port={`${id}.cap`}>
        cap
      </PortLabel>
      <PortLabel x={place.rodX + 7} y={bottom + 15} anchor="start" port={`${id}.rod`}>
        rod
      </PortLabel>
    </g>
  );
}

// ---- Valves ---------------------------------------------------------------------------------

/**
 * Counterbalance valve: a pilot-assisted, normally closed pressure valve (1 → 2) with its
 * integral check in parallel (free flow 2 → 1), drawn in a dash-dot enclosure. Inside, the
 * pressure element's spring is on the far side from the pilots; `pilotSide` says which wall
 * port 3 is on, so the pilot line runs straight to the opposite work line.
 */
export function CbvSymbol({ id, centre, pilotSide }: { id: string; centre: Point; pilotSide: "left" | "right" }) {
  // Local geometry is drawn with the pilot wall on the left; s mirrors it for the right.
  const s = pilotSide === "left" ? 1 : -1;
  const P = (x: number, y: number): Point => ({ x: centre.x + s * x, y: centre.y + y });
  const L = (...points: [number, number][]) => <polyline points={pts(points.map(([x, y]) => P(x, y)))} {...outline} />;
  const valveX = -16;
  const checkX = 44;
  const half = RELIEF_BOX / 2;
  const square = [P(valveX - half, -half), P(valveX + half, half)];
  const ballY = -4;
  const ballR = 6;
  const far = (x: number): Anchor => (s * x > 0 ? "start" : "end");
  return (
    <g data-component={id} data-kind="cbv">
      <rect x={centre.x - CBV_HALF_W} y={centre.y - CBV_HALF_H} width={CBV_HALF_W * 2} height={CBV_HALF_H * 2} {...thin} strokeDasharray={DASH.enclosure} />
      {L([0, -CBV_HALF_H], [0, -40])}
      {L([0, CBV_HALF_H], [0, 40])}
      {L([valveX, -40], [checkX, -40])}
      {L([valveX, 40], [checkX, 40])}
      {/* pressure element, normally closed: the flow arrow stands off the port line */}
      {L([valveX, -40], [valveX, -half])}
      {L([valveX, half], [valveX, 40])}
      <rect x={Math.min(square[0].x, square[1].x)} y={centre.y - half} width={RELIEF_BOX} height={RELIEF_BOX} {...outline} fill="white" />
      <Arrow from={P(valveX + 8, -13)} to={P(valveX + 8, 13)} />
      <Spring a={P(valveX + half, 0)} b={P(valveX + half + 22, 0)} />
      <Adjustable centre={P(valveX + half + 11, 0)} span={10} />
      {/* integral check: ball on its seat, free flow from 2 up to 1 */}
      {L([checkX, 40], [checkX, ballY + 13])}
      {L([checkX - 8, ballY + 1], [checkX, ballY + 13], [checkX + 8, ballY + 1])}
      <circle cx={P(checkX, 0).x} cy={centre.y + ballY} r={ballR} {...outline} />
      {L([checkX, ballY - ballR], [checkX, -40])}
      {/* pilots on the side opposite the spring: internal from port 1, external from port 3 */}
      <polyline points={pts([P(valveX, -30), P(-46, -30), P(-46, -6), P(valveX - half, -6)])} {...pilot} />
      <polyline points={pts([P(-CBV_HALF_W, CBV_PILOT_DY), P(valveX - half, CBV_PILOT_DY)])} {...pilot} />
      <circle cx={P(0, -40).x} cy={centre.y - 40} r={2.4} fill="currentColor" />
      <circle cx={P(0, 40).x} cy={centre.y + 40} r={2.4} fill="currentColor" />
      <PortLabel x={P(7, 0).x} y={centre.y - CBV_HALF_H - 6} anchor={far(7)} port={`${id}.1`}>
        1
      </PortLabel>
      <PortLabel x={P(7, 0).x} y={centre.y + CBV_HALF_H + 15} anchor={far(7)} port={`${id}.2`}>
        2
      </PortLabel>
      <PortLabel x={P(-CBV_HALF_W - 6, 0).x} y={centre.y + CBV_PILOT_DY - 5} anchor={far(-1)} port={`${id}.3`}>
        3
      </PortLabel>
    </g>
  );
}

/**
 * Pressure-relief valve: normally closed, spring set, piloted from its inlet (1, top) to tank (2).
 * A vented (pilot-operated) relief also shows its vent port X on the left wall.
 */
export function ReliefSymbol({ id, centre, vented = false, kind = "relief" }: { id: string; centre: Point; vented?: boolean; kind?: string }) {
  const half = RELIEF_BOX / 2;
  const { x, y } = centre;
  return (
    <g data-component={id} data-kind={kind} data-vented={vented ? "" : undefined}>
      <rect x={x - half} y={y - half} width={RELIEF_BOX} height={RELIEF_BOX} {...outline} fill="white" />
      <Arrow from={{ x: x + 8, y: y - 13 }} to={{ x: x + 8, y: y + 13 }} />
      <Spring a={{ x: x + half, y }} b={{ x: x + half + 24, y }} />
      <Adjustable centre={{ x: x + half + 12, y }} span={10} />
      <polyline
        points={pts([
          { x, y: y - half - 8 },
          { x: x - half - 12, y: y - half - 8 },
          { x: x - half - 12, y },
          { x: x - half, y },
        ])}
        {...pilot}
      />
      <circle cx={x} cy={y - half - 8} r={2.4} fill="currentColor" />
      {vented ? (
        <PortLabel x={x - half - 4} y={y + RELIEF_VENT_DY + 13} anchor="end" port={`${id}.X`}>
          X
        </PortLabel>
      ) : null}
    </g>
  );
}

/**
 * Relief vent valve: a 2/2 solenoid valve, spring return, normally open (ISO 1219-1 style).
 * `centre` is the middle of the right-hand box, the spring-held (de-energised) position, which
 * carries the ports: P on top from the relief's vent port X, T below to tank, joined by the
 * open passage. The left box, pushed in by the solenoid, blocks both.
 */
export function VentValveSymbol({ id, centre }: { id: string; centre: Point }) {
  const b = VENT_BOX;
  const { x, y } = centre;
  const top = y - b / 2;
  const bottom = y + b / 2;
  const leftBox = x - (3 * b) / 2;
  const blockedX = x - b;
  const solenoid = { w: 16, h: 18 };
  return (
    <g data-component={id} data-kind="vent">
      <g data-position="energised" data-paths="" data-blocked="P,T">
        <rect x={leftBox} y={top} width={b} height={b} {...outline} />
        {[
          { from: top, to: top + 8 },
          { from: bottom, to: bottom - 8 },
        ].map((stop, i) => (
          <g key={i} data-blocked-port={i === 0 ? "P" : "T"}>
            <line x1={blockedX} y1={stop.from} x2={blockedX} y2={stop.to} {...thin} />
            <line x1={blockedX - 5} y1={stop.to} x2={blockedX + 5} y2={stop.to} {...outline} />
          </g>
        ))}
      </g>
      <g data-position="normal" data-paths="P-T" data-blocked="">
        <rect x={x - b / 2} y={top} width={b} height={b} {...outline} />
        <Arrow from={{ x, y: top }} to={{ x, y: bottom }} />
      </g>
      <g data-actuator="solenoid">
        <rect x={leftBox - solenoid.w} y={y - solenoid.h / 2} width={solenoid.w} height={solenoid.h} {...outline} />
        <line x1={leftBox - solenoid.w} y1={y + solenoid.h / 2} x2={leftBox} y2={y - solenoid.h / 2} {...thin} />
      </g>
      <Spring a={{ x: x + b / 2, y }} b={{ x: x + b / 2 + 18, y }} turns={3} amplitude={4} />
      <PortLabel x={x + 5} y={top - 5} anchor="start" port={`${id}.P`}>
        P
      </PortLabel>
      <PortLabel x={x + 5} y={bottom + 13} anchor="start" port={`${id}.T`}>
        T
      </PortLabel>
    </g>
  );
}

/**
 * 4/3 directional valve, solenoid operated and spring centred. Each box is drawn from the
 * port pairs of its position; the work and supply lines meet the centre box.
 */
export function DcvSymbol({ id, cx, top, positions }: { id: string; cx: number; top: number; positions: DcvPositions }) {
  const boxes = [
    { position: "left", x: cx - BOX * 1.5, pairs: positions.left, style: "arrows" },
    { position: "center", x: cx - BOX / 2, pairs: positions.center, style: "passages" },
    { position: "right", x: cx + BOX / 2, pairs: positions.right, style: "arrows" },
  ] as const;
  const leftEnd = cx - BOX * 1.5;
  const rightEnd = cx + BOX * 1.5;
  const solenoid = { w: 22, h: 26, y: top + 8 };
  const springY = top + BOX - 16;
  return (
    <g data-component={id} data-kind="dcv">
      {boxes.map(({ position, x, pairs, style }) => {
        const drawing = boxDrawing(pairs, style);
        const at = (p: Point): Point => ({ x: x + p.x, y: top + p.y });
        return (
          <g key={position} data-position={position} data-paths={pairsLabel(pairs)} data-blocked={blockedPorts(pairs).join(",")}>
            <rect x={x} y={top} width={BOX} height={BOX} {...outline} />
            {drawing.arrows.map((a, i) => (
              <Arrow key={`a${i}`} from={at(a.from)} to={at(a.to)} />
            ))}
            {drawing.passages.map((line, i) => (
              <polyline key={`p${i}`} points={pts(line.map(at))} {...thin} />
            ))}
            {drawing.dots.map((d, i) => (
              <circle key={`d${i}`} cx={at(d).x} cy={at(d).y} r={2.2} fill="currentColor" />
            ))}
            {drawing.blocked.map(({ port, at: p }) => {
              const inward = p.y === 0 ? 11 : -11;
              const end = at({ x: p.x, y: p.y + inward });
              return (
                <g key={port} data-blocked-port={port}>
                  <line x1={at(p).x} y1={at(p).y} x2={end.x} y2={end.y} {...thin} />
                  <line x1={end.x - 6} y1={end.y} x2={end.x + 6} y2={end.y} {...outline} />
                </g>
              );
            })}
          </g>
        );
      })}
      {/* solenoid a drives the left box in (extend), solenoid b the right (retract) */}
      {[
        { x: leftEnd - solenoid.w, springTo: leftEnd - 24, from: leftEnd, label: "a", lx: leftEnd - solenoid.w - 5, anchor: "end" as const },
        { x: rightEnd, springTo: rightEnd + 24, from: rightEnd, label: "b", lx: rightEnd + solenoid.w + 5, anchor: "start" as const },
      ].map((end) => (
        <g key={end.label} data-actuator={`solenoid-${end.label}`}>
          <rect x={end.x} y={solenoid.y} width={solenoid.w} height={solenoid.h} {...outline} />
          <line x1={end.x} y1={solenoid.y + solenoid.h} x2={end.x + solenoid.w} y2={solenoid.y} {...thin} />
          <Spring a={{ x: end.from, y: springY }} b={{ x: end.springTo, y: springY }} turns={3} amplitude={5} />
          <text x={end.lx} y={solenoid.y + 17} textAnchor={end.anchor} fontSize={11} fontStyle="italic" fill="currentColor" className="fill-ink-600">
            {end.label}
          </text>
        </g>
      ))}
      <PortLabel x={cx - BOX / 2 + 12} y={top - 6} anchor="end" port={`${id}.A`}>
        A
      </PortLabel>
      <PortLabel x={cx + BOX / 2 - 12} y={top - 6} anchor="start" port={`${id}.B`}>
        B
      </PortLabel>
      <PortLabel x={cx - BOX / 2 + 12} y={top + BOX + 15} anchor="end" port={`${id}.P`}>
        P
      </PortLabel>
      <PortLabel x={cx + BOX / 2 - 12} y={top + BOX + 15} anchor="start" port={`${id}.T`}>
        T
      </PortLabel>
    </g>
  );
}

// ---- Power unit -----------------------------------------------------------------------------

/** Right of a compensated pump: the compensator's spring and its pilot from the pump's own outlet. */
export const COMPENSATOR_W = 46;

/**
 * Hydraulic pump: one filled triangle pointing out at the outlet. A variable pump carries the
 * diagonal arrow across its circle; a pressure-compensated one also its compensator beside it:
 * an adjustable spring holding the stroke, and a pilot from the pump's own outlet against it.
 */
export function PumpSymbol({ id, centre, variable = false, compensated = false }: { id: string; centre: Point; variable?: boolean; compensated?: boolean }) {
  const { x, y } = centre;
  const tip = { x, y: y - PUMP_R };
  const k = PUMP_R + 6;
  const stem = x + PUMP_R + 14;
  const pilotY = y - PUMP_R - 10;
  return (
    <g data-component={id} data-kind="pump" data-variable={variable ? "" : undefined} data-compensated={compensated ? "" : undefined}>
      <circle cx={x} cy={y} r={PUMP_R} {...outline} fill="white" />
      <polygon points={pts([tip, { x: x - 8, y: y - PUMP_R + 13 }, { x: x + 8, y: y - PUMP_R + 13 }])} fill="currentColor" />
      {variable ? <Arrow from={{ x: x - k * 0.75, y: y + k * 0.75 }} to={{ x: x + k * 0.75, y: y - k * 0.75 }} /> : null}
      {compensated ? (
        <g data-compensator="">
          <line x1={x + PUMP_R} y1={y} x2={stem - 5} y2={y} {...thin} />
          <rect x={stem - 5} y={y - 9} width={10} height={18} {...outline} fill="white" />
          <Spring a={{ x: stem + 5, y }} b={{ x: stem + 27, y }} turns={3} amplitude={5} />
          <Adjustable centre={{ x: stem + 16, y }} span={9} />
          {/* pilot from the outlet onto the compensator piston, against the spring */}
          <polyline
            points={pts([
              { x, y: pilotY },
              { x: stem, y: pilotY },
              { x: stem, y: y - 9 },
            ])}
            {...pilot}
          />
          <circle cx={x} cy={pilotY} r={2.4} fill="currentColor" />
        </g>
      ) : null}
    </g>
  );
}

export function MotorSymbol({ id, centre }: { id: string; centre: Point }) {
  return (
    <g data-component={id} data-kind="motor">
      <circle cx={centre.x} cy={centre.y} r={MOTOR_R} {...outline} fill="white" />
      <text x={centre.x} y={centre.y + 6} textAnchor="middle" fontSize={17} fontWeight={700} fill="currentColor">
        M
      </text>
    </g>
  );
}

/** Pressure gauge: a circle with a pointer arrow across it. */
export function GaugeSymbol({ id, centre }: { id: string; centre: Point }) {
  const r = GAUGE_R;
  const k = r * 0.8;
  return (
    <g data-component={id} data-kind="gauge">
      <circle cx={centre.x} cy={centre.y} r={r} {...outline} fill="white" />
      <Arrow from={{ x: centre.x - k, y: centre.y + k }} to={{ x: centre.x + k, y: centre.y - k }} />
    </g>
  );
}

/** The diamond of a fluid conditioner (ISO 1219-1: filter, strainer, cooler) across the flow at its centre. */
function Diamond({ centre: { x, y } }: { centre: Point }) {
  const d = DIAMOND;
  return (
    <polygon
      points={pts([
        { x, y: y - d },
        { x: x + d, y },
        { x, y: y + d },
        { x: x - d, y },
      ])}
      {...outline}
      fill="white"
    />
  );
}

/** Filter or strainer: a diamond across the flow with its element line (dashed or dotted). */
export function FilterSymbol({ id, centre, kind }: { id: string; centre: Point; kind: "filter" | "strainer" }) {
  const { x, y } = centre;
  const d = DIAMOND;
  return (
    <g data-component={id} data-kind={kind}>
      <Diamond centre={centre} />
      <line
        x1={x - d}
        y1={y}
        x2={x + d}
        y2={y}
        {...thin}
        strokeDasharray={kind === "filter" ? DASH.element : DASH.strainer}
        strokeWidth={kind === "filter" ? STROKE.thin : STROKE.symbol}
      />
    </g>
  );
}

/** Reservoir at atmospheric pressure: an open-top box; the line ends below its rim. */
export function TankSymbol({ id, x, top }: { id: string; x: number; top: number }) {
  return (
    <g data-component={id} data-kind="tank">
      <polyline
        points={pts([
          { x: x - TANK_W / 2, y: top },
          { x: x - TANK_W / 2, y: top + TANK_H },
          { x: x + TANK_W / 2, y: top + TANK_H },
          { x: x + TANK_W / 2, y: top },
        ])}
        {...outline}
      />
    </g>
  );
}

// ---- Valves a design adds ---------------------------------------------------------------------

/**
 * Check valve in a vertical line, ball and seat: free flow from `inlet` (below, the seat's apex
 * side) up to `outlet`; flow the other way presses the ball onto its seat.
 */
export function CheckSymbol({ id, centre }: { id: string; centre: Point }) {
  const { x, y } = centre;
  return (
    <g data-component={id} data-kind="check" data-free-flow="inlet-outlet">
      <rect x={x - 11} y={y - CHECK_HALF} width={22} height={CHECK_HALF * 2} fill="white" stroke="none" />
      <line x1={x} y1={y + CHECK_HALF} x2={x} y2={y + 8} {...outline} />
      <polyline
        points={pts([
          { x: x - 8, y: y - 3 },
          { x, y: y + 8 },
          { x: x + 8, y: y - 3 },
        ])}
        {...outline}
      />
      <circle cx={x} cy={y - 6} r={6} {...outline} />
      <line x1={x} y1={y - 12} x2={x} y2={y - CHECK_HALF} {...outline} />
    </g>
  );
}

/**
 * Pilot-operated check valve (ISO 1219-1 style): a check with free flow from 2 (the valve side,
 * below) to 1 (the cylinder, above), closed the other way until pressure at pilot port X lifts
 * the ball off its seat. The pilot enters on `pilotSide`, towards the opposite work line.
 */
export function PocSymbol({
  id,
  centre,
  pilotSide,
  pilotY = centre.y + INLINE_PILOT_DY,
}: {
  id: string;
  centre: Point;
  pilotSide: "left" | "right";
  pilotY?: number;
}) {
  const { x, y } = centre;
  const s = pilotSide === "left" ? -1 : 1;
  const ballY = y - 4;
  return (
    <g data-component={id} data-kind="poc" data-free-flow="2-1">
      <rect x={x - POC_HALF_W} y={y - POC_HALF_H} width={POC_HALF_W * 2} height={POC_HALF_H * 2} {...outline} fill="white" />
      <line x1={x} y1={y + POC_HALF_H} x2={x} y2={ballY + 13} {...outline} />
      <polyline
        points={pts([
          { x: x - 8, y: ballY + 1 },
          { x, y: ballY + 13 },
          { x: x + 8, y: ballY + 1 },
        ])}
        {...outline}
      />
      <circle cx={x} cy={ballY} r={6} {...outline} />
      <line x1={x} y1={ballY - 6} x2={x} y2={y - POC_HALF_H} {...outline} />
      {/* the pilot piston that lifts the ball */}
      <polyline
        points={pts([
          { x: x + s * POC_HALF_W, y: pilotY },
          { x: x + s * 11, y: pilotY },
          { x: x + s * 11, y: Math.min(pilotY, ballY + 4) },
        ])}
        {...pilot}
      />
      <PortLabel x={x - s * 7} y={y - POC_HALF_H - 6} anchor={s > 0 ? "end" : "start"} port={`${id}.1`}>
        1
      </PortLabel>
      <PortLabel x={x - s * 7} y={y + POC_HALF_H + 15} anchor={s > 0 ? "end" : "start"} port={`${id}.2`}>
        2
      </PortLabel>
      <PortLabel x={x + s * (POC_HALF_W + 5)} y={pilotY - 5} anchor={s > 0 ? "start" : "end"} port={`${id}.X`}>
        X
      </PortLabel>
    </g>
  );
}

/**
 * One-way flow control in a dash-dot enclosure: an adjustable throttle sets the flow from 2 (the
 * valve) to 1 (the cylinder), with the small arrow of pressure compensation where it holds that
 * flow whatever the load; its check in parallel lets the return flow from 1 to 2 pass freely.
 */
export function FlowControlSymbol({ id, centre, compensated = false }: { id: string; centre: Point; compensated?: boolean }) {
  const { x, y } = centre;
  const branch = x + 18;
  const top = y - 22;
  const bottom = y + 22;
  const ballY = y + 2;
  return (
    <g data-component={id} data-kind="flow-control" data-controlled="2-1" data-free-flow="1-2">
      <rect x={x - FC_HALF_W} y={y - FC_HALF_H} width={FC_HALF_W * 2} height={FC_HALF_H * 2} {...thin} strokeDasharray={DASH.enclosure} fill="white" />
      <line x1={x} y1={y - FC_HALF_H} x2={x} y2={top} {...outline} />
      <line x1={x} y1={y + FC_HALF_H} x2={x} y2={bottom} {...outline} />
      <polyline
        points={pts([
          { x: x - 12, y: top },
          { x: branch, y: top },
        ])}
        {...outline}
      />
      <polyline
        points={pts([
          { x: x - 12, y: bottom },
          { x: branch, y: bottom },
        ])}
        {...outline}
      />
      {/* throttle: two arcs narrowing the line, with the setting arrow across */}
      <line x1={x - 12} y1={top} x2={x - 12} y2={bottom} {...outline} />
      <path d={`M${x - 18} ${y - 12} Q${x - 13} ${y} ${x - 18} ${y + 12}`} {...outline} />
      <path d={`M${x - 6} ${y - 12} Q${x - 11} ${y} ${x - 6} ${y + 12}`} {...outline} />
      <Arrow from={{ x: x - 24, y: y + 12 }} to={{ x: x, y: y - 12 }} />
      {/* pressure compensation: the small arrow along the controlled flow */}
      {compensated ? <Arrow from={{ x: x - 27, y: y + 9 }} to={{ x: x - 27, y: y - 9 }} /> : null}
      {/* free-flow check: apex towards 1 (above), so flow from 1 down to 2 lifts the ball */}
      <line x1={branch} y1={top} x2={branch} y2={ballY - 12} {...outline} />
      <polyline
        points={pts([
          { x: branch - 7, y: ballY - 1 },
          { x: branch, y: ballY - 12 },
          { x: branch + 7, y: ballY - 1 },
        ])}
        {...outline}
      />
      <circle cx={branch} cy={ballY + 4} r={5.5} {...outline} />
      <line x1={branch} y1={ballY + 9.5} x2={branch} y2={bottom} {...outline} />
      <circle cx={x} cy={top} r={2.2} fill="currentColor" />
      <circle cx={x} cy={bottom} r={2.2} fill="currentColor" />
      <PortLabel x={x + 7} y={y - FC_HALF_H - 6} anchor="start" port={`${id}.1`}>
        1
      </PortLabel>
      <PortLabel x={x + 7} y={y + FC_HALF_H + 15} anchor="start" port={`${id}.2`}>
        2
      </PortLabel>
    </g>
  );
}

/**
 * Pressure-reducing valve (ISO 1219-1 style) in a vertical P line: normally open (the arrow in
 * line with its ports, oil from P below up to A), piloted from its outlet A onto the left wall
 * against the adjustable spring on the right, so it throttles as A reaches the setting; the
 * spring chamber's external drain Y runs from the spring's end down to tank. The check beside
 * it (left) lets oil back from A to P freely, as the bill's valve has.
 */
export function ReducingValveSymbol({ id, centre }: { id: string; centre: Point }) {
  const half = RELIEF_BOX / 2;
  const { x, y } = centre;
  const tapY = y - half - 8;
  const drainX = x + REDUCING_DRAIN_DX;
  const checkX = x - REDUCING_CHECK_DX;
  return (
    <g data-component={id} data-kind="reducing" data-normally="open" data-pilot="A" data-drain="external" data-free-flow="A-P">
      <line x1={x} y1={y - REDUCING_HALF_H} x2={x} y2={y - half} {...outline} />
      <line x1={x} y1={y + half} x2={x} y2={y + REDUCING_HALF_H} {...outline} />
      <rect x={x - half} y={y - half} width={RELIEF_BOX} height={RELIEF_BOX} {...outline} fill="white" />
      <Arrow from={{ x, y: y + 13 }} to={{ x, y: y - 13 }} />
      <Spring a={{ x: x + half, y }} b={{ x: drainX, y }} />
      <Adjustable centre={{ x: x + half + 12, y }} span={10} />
      <polyline
        points={pts([
          { x, y: tapY },
          { x: x - half - 12, y: tapY },
          { x: x - half - 12, y },
          { x: x - half, y },
        ])}
        {...pilot}
      />
      <circle cx={x} cy={tapY} r={2.4} fill="currentColor" />
      <line x1={drainX} y1={y} x2={drainX} y2={y + REDUCING_DRAIN_DY} {...pilot} />
      {/* the return check: seat apex up towards A, so oil from A pushes the ball off its seat down to P */}
      <polyline
        points={pts([
          { x, y: y - REDUCING_CHECK_DY },
          { x: checkX, y: y - REDUCING_CHECK_DY },
          { x: checkX, y: y - 10 },
        ])}
        {...outline}
      />
      <polyline
        points={pts([
          { x: checkX - 7, y: y + 1 },
          { x: checkX, y: y - 10 },
          { x: checkX + 7, y: y + 1 },
        ])}
        {...outline}
      />
      <circle cx={checkX} cy={y + 4} r={5.5} {...outline} />
      <polyline
        points={pts([
          { x: checkX, y: y + 9.5 },
          { x: checkX, y: y + REDUCING_CHECK_DY },
          { x, y: y + REDUCING_CHECK_DY },
        ])}
        {...outline}
      />
      <circle cx={x} cy={y - REDUCING_CHECK_DY} r={2.2} fill="currentColor" />
      <circle cx={x} cy={y + REDUCING_CHECK_DY} r={2.2} fill="currentColor" />
      <PortLabel x={x + 7} y={y - REDUCING_HALF_H - 6} anchor="start" port={`${id}.A`}>
        A
      </PortLabel>
      {/* P on the left, clear of the port label of a part below it */}
      <PortLabel x={x - 7} y={y + REDUCING_HALF_H + 15} anchor="end" port={`${id}.P`}>
        P
      </PortLabel>
      <PortLabel x={drainX + 6} y={y + REDUCING_DRAIN_DY - 2} anchor="start" port={`${id}.Y`}>
        Y
      </PortLabel>
    </g>
  );
}

/**
 * A 2/2 solenoid valve with spring return (ISO 1219-1 style), drawn in a local frame where the
 * normal (spring-held) box carries the ports above and below its centre and the energised box
 * sits on the solenoid's side. `ports` "vertical" draws that frame as it is (boxes side by
 * side, solenoid left); "horizontal" turns it a quarter (boxes stacked, solenoid on top, ports
 * left and right). A normally closed valve's normal box blocks both ports and its energised box
 * joins them; a normally open one the other way round.
 */
export function SolenoidValve22({
  id,
  kind,
  centre,
  ports,
  normally,
  portNames,
  flowFrom = portNames[0],
}: {
  id: string;
  kind: string;
  centre: Point;
  ports: "vertical" | "horizontal";
  normally: "open" | "closed";
  /** names of the ports at the frame's top and bottom (left and right when horizontal) */
  portNames: [string, string];
  /** the port the oil comes from when the valve is open: the arrow points away from it */
  flowFrom?: string;
}) {
  const b = VENT_BOX;
  const map = ([u, v]: [number, number]): Point => (ports === "vertical" ? { x: centre.x + u, y: centre.y + v } : { x: centre.x + v, y: centre.y + u });
  const poly = (corners: [number, number][], extra: object = outline) => <polygon points={pts(corners.map(map))} {...extra} />;
  const box = (u0: number) =>
    poly(
      [
        [u0, -b / 2],
        [u0 + b, -b / 2],
        [u0 + b, b / 2],
        [u0, b / 2],
      ],
      { ...outline, fill: "white" },
    );
  const into = flowFrom === portNames[0] ? 1 : -1;
  const open = (u: number) => <Arrow from={map([u, (-into * b) / 2])} to={map([u, (into * b) / 2])} />;
  const blocked = (u: number) => (
    <>
      {[
        [-b / 2, -b / 2 + 8],
        [b / 2, b / 2 - 8],
      ].map(([from, to], i) => (
        <g key={i}>
          <line x1={map([u, from]).x} y1={map([u, from]).y} x2={map([u, to]).x} y2={map([u, to]).y} {...thin} />
          <line x1={map([u - 5, to]).x} y1={map([u - 5, to]).y} x2={map([u + 5, to]).x} y2={map([u + 5, to]).y} {...outline} />
        </g>
      ))}
    </>
  );
  const sol = { w: 16, h: 18 };
  const solU = -1.5 * b - sol.w;
  const [first, second] = portNames;
  const normalPaths = normally === "open" ? `${first}-${second}` : "";
  const energisedPaths = normally === "open" ? "" : `${first}-${second}`;
  return (
    <g data-component={id} data-kind={kind} data-normally={normally}>
      <g data-position="energised" data-paths={energisedPaths} data-blocked={energisedPaths ? "" : `${first},${second}`}>
        {box(-1.5 * b)}
        {normally === "open" ? blocked(-b) : open(-b)}
      </g>
      <g data-position="normal" data-paths={normalPaths} data-blocked={normalPaths ? "" : `${first},${second}`}>
        {box(-b / 2)}
        {normally === "open" ? open(0) : blocked(0)}
      </g>
      <g data-actuator="solenoid">
        {poly([
          [solU, -sol.h / 2],
          [solU + sol.w, -sol.h / 2],
          [solU + sol.w, sol.h / 2],
          [solU, sol.h / 2],
        ])}
        <line
          x1={map([solU, sol.h / 2]).x}
          y1={map([solU, sol.h / 2]).y}
          x2={map([solU + sol.w, -sol.h / 2]).x}
          y2={map([solU + sol.w, -sol.h / 2]).y}
          {...thin}
        />
      </g>
      <Spring a={map([b / 2, 0])} b={map([b / 2 + 18, 0])} turns={3} amplitude={4} />
    </g>
  );
}

/** Fixed orifice: two arcs pinching the line between a and b (horizontal). */
function Orifice({ a, b }: { a: Point; b: Point }) {
  const mx = (a.x + b.x) / 2;
  return (
    <>
      <line x1={a.x} y1={a.y} x2={b.x} y2={b.y} {...outline} />
      <path d={`M${mx - 5} ${a.y - 8} Q${mx} ${a.y} ${mx - 5} ${a.y + 8}`} {...outline} />
      <path d={`M${mx + 5} ${a.y - 8} Q${mx} ${a.y} ${mx + 5} ${a.y + 8}`} {...outline} />
    </>
  );
}

/**
 * Decompression valve: a normally closed 2/2 solenoid valve from the cap line (1, right) through
 * a fixed orifice to tank (2, left), so the compressed oil bleeds off at a controlled rate.
 */
export function DecompressionSymbol({ id, centre }: { id: string; centre: Point }) {
  const wall = { x: centre.x - VENT_BOX / 2, y: centre.y };
  const end = { x: wall.x - DECOMPRESSION_STUB, y: centre.y };
  return (
    <g data-component={id} data-kind="decompression">
      <Orifice a={end} b={wall} />
      <SolenoidValve22 id={`${id}-valve`} kind="decompression-valve" centre={centre} ports="horizontal" normally="closed" portNames={["2", "1"]} flowFrom="1" />
      <PortLabel x={centre.x + VENT_BOX / 2 + 4} y={centre.y - 5} anchor="start" port={`${id}.1`}>
        1
      </PortLabel>
      <PortLabel x={end.x - 5} y={centre.y - 4} anchor="end" port={`${id}.2`}>
        2
      </PortLabel>
    </g>
  );
}

/**
 * Unloading valve: a normally closed pressure valve on its side, inlet 1 from the large pump
 * section (left), outlet 2 to tank (right); its spring below and the external pilot X from the
 * system line above. It opens, unloading the large section, when the system pressure at X
 * passes the spring setting.
 */
export function UnloadingSymbol({ id, centre }: { id: string; centre: Point }) {
  const half = RELIEF_BOX / 2;
  const { x, y } = centre;
  return (
    <g data-component={id} data-kind="unloading" data-pilot="external">
      <rect x={x - half} y={y - half} width={RELIEF_BOX} height={RELIEF_BOX} {...outline} fill="white" />
      <Arrow from={{ x: x - 13, y: y + 8 }} to={{ x: x + 13, y: y + 8 }} />
      <Spring a={{ x, y: y + half }} b={{ x, y: y + half + 22 }} turns={3} amplitude={5} />
      <Adjustable centre={{ x, y: y + half + 11 }} span={9} />
      <line x1={x + half} y1={y} x2={x + half + UNLOADING_STUB} y2={y} {...outline} />
      <PortLabel x={x - half - 4} y={y - 5} anchor="end" port={`${id}.1`}>
        1
      </PortLabel>
      <PortLabel x={x + half + UNLOADING_STUB + 4} y={y - 5} anchor="start" port={`${id}.2`}>
        2
      </PortLabel>
      <PortLabel x={x + 5} y={y - half - 5} anchor="start" port={`${id}.X`}>
        X
      </PortLabel>
    </g>
  );
}

/** Cooler: a diamond across the flow with arrows pointing out of it (heat leaving the oil). */
export function CoolerSymbol({ id, centre }: { id: string; centre: Point }) {
  const { x, y } = centre;
  const d = DIAMOND;
  return (
    <g data-component={id} data-kind="cooler">
      <Diamond centre={centre} />
      <line x1={x - d + 3} y1={y} x2={x + d - 3} y2={y} {...thin} />
      <ArrowHead from={{ x: x - 4, y }} to={{ x: x - d - 6, y }} length={7} half={3.5} />
      <ArrowHead from={{ x: x + 4, y }} to={{ x: x + d + 6, y }} length={7} half={3.5} />
    </g>
  );
}

// ---- The regenerative approach and its switches ------------------------------------------------

/**
 * Regeneration valve: a 3/2 solenoid valve with spring return (ISO 1219-1 style) standing in a
 * work-line column. `centre.x` is the column, where ports 1 (top, to the cylinder) and 2 (bottom,
 * to the directional valve) sit a quarter box from the outer wall of the spring-held box; port 3
 * (bottom) sits a half box nearer `port3Side`, the other column. The energised box and the
 * solenoid lie on that side, the spring on the outer one. Each box is drawn from the data's port
 * pairs: an arrow for each pair, a T-stop on each port left out.
 */
export function RegenValveSymbol({
  id,
  centre,
  port3Side,
  positions,
}: {
  id: string;
  centre: Point;
  port3Side: "left" | "right";
  positions: SolenoidValvePositions;
}) {
  const b = REGEN_BOX;
  const t = port3Side === "left" ? -1 : 1;
  const top = centre.y - b / 2;
  const bottom = centre.y + b / 2;
  // u runs from the column towards the other column; the spring-held box spans u = −b/4 … 3b/4
  const X = (u: number) => centre.x + t * u;
  const portU: Record<string, { u: number; y: number }> = { "1": { u: 0, y: top }, "2": { u: 0, y: bottom }, "3": { u: REGEN_PORT3_DX, y: bottom } };
  const ports = Object.keys(portU);
  const boxes = [
    { position: "energised", u0: b, pairs: positions.energised },
    { position: "normal", u0: 0, pairs: positions.normal },
  ] as const;
  const sol = { w: 16, h: 18 };
  const solU = 2 * b - b / 4;
  return (
    <g data-component={id} data-kind="regen" data-ports="3/2">
      {boxes.map(({ position, u0, pairs }) => {
        const joined = new Set(pairs.flat());
        const at = (port: string): Point => ({ x: X(u0 + portU[port].u), y: portU[port].y });
        return (
          <g
            key={position}
            data-position={position}
            data-paths={pairs.map(([a, c]) => `${a}-${c}`).join(",")}
            data-blocked={ports.filter((p) => !joined.has(p)).join(",")}
          >
            <rect x={Math.min(X(u0 - b / 4), X(u0 + (3 * b) / 4))} y={top} width={b} height={b} {...outline} fill="white" />
            {pairs
              .filter(([a, c]) => a in portU && c in portU)
              .map(([a, c]) => (
                <Arrow key={`${a}-${c}`} from={at(a)} to={at(c)} />
              ))}
            {ports
              .filter((p) => !joined.has(p))
              .map((p) => {
                const from = at(p);
                const end = { x: from.x, y: from.y + (from.y === top ? 9 : -9) };
                return (
                  <g key={p} data-blocked-port={p}>
                    <line x1={from.x} y1={from.y} x2={end.x} y2={end.y} {...thin} />
                    <line x1={end.x - 5} y1={end.y} x2={end.x + 5} y2={end.y} {...outline} />
                  </g>
                );
              })}
          </g>
        );
      })}
      <g data-actuator="solenoid">
        <rect x={Math.min(X(solU), X(solU + sol.w))} y={centre.y - sol.h / 2} width={sol.w} height={sol.h} {...outline} />
        <line x1={X(solU)} y1={centre.y + sol.h / 2} x2={X(solU + sol.w)} y2={centre.y - sol.h / 2} {...thin} />
      </g>
      <Spring a={{ x: X(-b / 4), y: centre.y }} b={{ x: X(-b / 4 - 18), y: centre.y }} turns={3} amplitude={4} />
      <PortLabel x={X(-5)} y={top - 5} anchor={t < 0 ? "start" : "end"} port={`${id}.1`}>
        1
      </PortLabel>
      <PortLabel x={X(-5)} y={bottom + 13} anchor={t < 0 ? "start" : "end"} port={`${id}.2`}>
        2
      </PortLabel>
      <PortLabel x={X(REGEN_PORT3_DX + 5)} y={bottom + 13} anchor={t < 0 ? "end" : "start"} port={`${id}.3`}>
        3
      </PortLabel>
    </g>
  );
}

/**
 * Pressure switch (ISO 1219-1 style): the oil from its port (right) pushes against an adjustable
 * spring (left) and works an electrical contact (on top) when the pressure passes the setting.
 */
export function PressureSwitchSymbol({ id, centre }: { id: string; centre: Point }) {
  const h = SWITCH_HALF;
  const { x, y } = centre;
  return (
    <g data-component={id} data-kind="pressure-switch">
      <rect x={x - h} y={y - h} width={2 * h} height={2 * h} {...outline} fill="white" />
      {/* the sensing pilot inside, from the port to the element */}
      <line x1={x + h} y1={y} x2={x - 2} y2={y} {...pilot} />
      <line x1={x - 2} y1={y - 7} x2={x - 2} y2={y + 7} {...outline} />
      <Spring a={{ x: x - h, y }} b={{ x: x - h - 20, y }} turns={3} amplitude={4} />
      <Adjustable centre={{ x: x - h - 10, y }} span={8} />
      {/* electrical contact: a lead and an open switch blade */}
      <g data-contact="">
        <line x1={x} y1={y - h} x2={x} y2={y - h - 6} {...thin} />
        <line x1={x} y1={y - h - 6} x2={x + 8} y2={y - h - 15} {...outline} />
        <line x1={x + 10} y1={y - h - 10} x2={x + 10} y2={y - h - 18} {...thin} />
        <circle cx={x} cy={y - h - 6} r={1.8} fill="currentColor" />
      </g>
    </g>
  );
}

/**
 * Limit switch marked at the cylinder (common practice: a position switch is drawn where the
 * rod's travel works it, not in the oil circuit): a dotted run of the rod's travel out to a tick,
 * and over the tick the switch, a roller on a lever working an electrical contact.
 */
export function LimitSwitchSymbol({ id, at, rodEnd }: { id: string; at: Point; rodEnd: number }) {
  const { x, y } = at;
  return (
    <g data-component={id} data-kind="limit-switch">
      <line x1={rodEnd + 4} y1={y} x2={x - 6} y2={y} {...thin} strokeDasharray={DASH.strainer} />
      <ArrowHead from={{ x: x - 14, y }} to={{ x: x - 4, y }} length={7} half={3} />
      <line x1={x} y1={y - 6} x2={x} y2={y + 8} {...outline} />
      <circle cx={x} cy={y - 11} r={4.5} {...outline} fill="white" />
      <line x1={x} y1={y - 15.5} x2={x} y2={y - 24} {...thin} />
      <rect x={x - 10} y={y - 38} width={20} height={14} {...outline} fill="white" />
      <line x1={x - 6} y1={y - 28} x2={x + 6} y2={y - 35} {...thin} />
    </g>
  );
}

// ---- Accumulator ------------------------------------------------------------------------------

/**
 * Gas-loaded (bladder) accumulator, ISO 1219-1 style: an upright capsule, the separating element
 * drawn across it and the gas side above it marked by an open triangle (an open triangle marks a
 * gas, a filled one oil); the oil port leaves the bottom.
 */
export function AccumulatorSymbol({ id, centre }: { id: string; centre: Point }) {
  const { x, y } = centre;
  const top = y - ACC_H / 2;
  const bottom = y + ACC_H / 2;
  const divider = top + ACC_H * 0.45;
  const mark = top + ACC_H * 0.22;
  return (
    <g data-component={id} data-kind="accumulator" data-gas-side="top">
      <rect x={x - ACC_W / 2} y={top} width={ACC_W} height={ACC_H} rx={ACC_W / 2} ry={ACC_W / 2} {...outline} fill="white" />
      <line x1={x - ACC_W / 2} y1={divider} x2={x + ACC_W / 2} y2={divider} {...outline} />
      <polygon
        data-gas-mark=""
        points={pts([
          { x, y: mark - 6 },
          { x: x - 6, y: mark + 5 },
          { x: x + 6, y: mark + 5 },
        ])}
        {...thin}
      />
      <line x1={x} y1={bottom} x2={x} y2={bottom + ACC_STEM} {...outline} />
      <PortLabel x={x + 6} y={bottom + ACC_STEM - 1} anchor="start" port={`${id}.P`}>
        P
      </PortLabel>
    </g>
  );
}

/** Shut-off valve (a manual stop valve): two triangles tip to tip across the line, its handle above. */
function ShutOff({ centre }: { centre: Point }) {
  const { x, y } = centre;
  return (
    <g data-part="shut-off" data-operated="manual">
      <polygon
        points={pts([
          { x: x - 12, y: y - 8 },
          { x: x - 12, y: y + 8 },
          { x, y },
          { x: x + 12, y: y - 8 },
          { x: x + 12, y: y + 8 },
          { x, y },
        ])}
        {...outline}
        fill="white"
      />
      <line x1={x} y1={y} x2={x} y2={y - 14} {...thin} />
      <line x1={x - 7} y1={y - 14} x2={x + 7} y2={y - 14} {...outline} />
    </g>
  );
}

/**
 * Accumulator safety and shut-off block in a dashed enclosure, frame `left`/`top`: from P (left)
 * through the manual shut-off valve to A (right, the accumulator); on the accumulator side a
 * plugged gauge port, the safety relief valve and a normally open 2/2 solenoid discharge valve,
 * both to the block's T. Held energised while the power unit runs, the discharge valve opens
 * when it stops and vents the accumulator to tank (ISO 4413 asks for that automatic venting).
 */
export function AccumulatorBlockSymbol({ id, left, top }: { id: string; left: number; top: number }) {
  const y = top + BLOCK_LINE_DY;
  const right = left + BLOCK_W;
  const bottom = top + BLOCK_H;
  const shutX = left + 36;
  const gaugeX = left + 76;
  const reliefX = left + 130;
  const dischargeX = left + 236;
  const valveY = y + 46;
  const tankLineY = y + 92;
  const tX = left + BLOCK_T_DX;
  const half = RELIEF_BOX / 2;
  return (
    <g data-component={id} data-kind="accumulator-block" data-discharge="normally open">
      <rect x={left} y={top} width={BLOCK_W} height={BLOCK_H} {...thin} strokeDasharray={DASH.enclosure} />
      <line x1={left} y1={y} x2={right} y2={y} {...outline} />
      <ShutOff centre={{ x: shutX, y }} />
      <g data-part="gauge-port">
        <line x1={gaugeX} y1={y} x2={gaugeX} y2={y - 14} {...outline} />
        <line x1={gaugeX - 5} y1={y - 14} x2={gaugeX + 5} y2={y - 14} {...outline} />
        <text x={gaugeX + 8} y={y - 10} fontSize={9} fill="currentColor" stroke="none" className="fill-ink-600">
          gauge
        </text>
      </g>
      <line x1={reliefX} y1={y} x2={reliefX} y2={valveY - half} {...outline} />
      <line x1={reliefX} y1={valveY + half} x2={reliefX} y2={tankLineY} {...outline} />
      <ReliefSymbol id={`${id}-relief`} kind="safety-relief" centre={{ x: reliefX, y: valveY }} />
      <line x1={dischargeX} y1={y} x2={dischargeX} y2={valveY - VENT_BOX / 2} {...outline} />
      <line x1={dischargeX} y1={valveY + VENT_BOX / 2} x2={dischargeX} y2={tankLineY} {...outline} />
      <SolenoidValve22
        id={`${id}-discharge`}
        kind="discharge-valve"
        centre={{ x: dischargeX, y: valveY }}
        ports="vertical"
        normally="open"
        portNames={["1", "2"]}
        flowFrom="1"
      />
      <line x1={reliefX} y1={tankLineY} x2={dischargeX} y2={tankLineY} {...thin} />
      <line x1={tX} y1={tankLineY} x2={tX} y2={bottom} {...thin} />
      {[gaugeX, reliefX, dischargeX].map((jx) => (
        <circle key={jx} cx={jx} cy={y} r={2.6} fill="currentColor" />
      ))}
      <circle cx={tX} cy={tankLineY} r={2.6} fill="currentColor" />
      <PortLabel x={left + 6} y={y - 6} anchor="start" port={`${id}.P`}>
        P
      </PortLabel>
      <PortLabel x={right - 6} y={y - 6} anchor="end" port={`${id}.A`}>
        A
      </PortLabel>
      <PortLabel x={tX + 6} y={bottom - 5} anchor="start" port={`${id}.T`}>
        T
      </PortLabel>
    </g>
  );
}
