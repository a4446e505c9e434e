import type { Circuit, CircuitConnection } from "~/hydraulics/design";
import type { Anchor, Layout, Point } from "./layout";

/** One drawn connection: an orthogonal polyline between two ports. */
export interface Route {
  connection: CircuitConnection;
  points: Point[];
  /** the tank symbol drawn at the end of this line, when it ends at the reservoir */
  tank?: { id: string; x: number };
}

const isVertical = (a: Anchor) => a.dir === "up" || a.dir === "down";

/**
 * Orthogonal path from a to b: straight when aligned; two vertical ports turn along the
 * channel of the port being approached (so lines into one symbol share a run); a vertical
 * and a horizontal port make one elbow.
 */
export function orthogonal(a: Anchor, b: Anchor): Point[] {
  if (a.x === b.x || a.y === b.y) return [a, b];
  if (isVertical(a) && isVertical(b)) {
    const y = b.channelY ?? a.channelY ?? (a.y + b.y) / 2;
    return [a, { x: a.x, y }, { x: b.x, y }, b];
  }
  if (isVertical(a)) return [a, { x: a.x, y: b.y }, b];
  if (isVertical(b)) return [a, { x: b.x, y: a.y }, b];
  const x = (a.x + b.x) / 2;
  return [a, { x, y: a.y }, { x, y: b.y }, b];
}

const componentOf = (ref: string) => ref.slice(0, ref.indexOf("."));

/**
 * Routes every connection whose ends are laid out. A line to the reservoir drops straight
 * down from its other end to a tank symbol of its own, as ISO 1219 allows.
 */
export function routeConnections(circuit: Circuit, layout: Layout): Route[] {
  const tankIds = new Set(circuit.components.filter((c) => c.kind === "tank").map((c) => c.id));
  const routes: Route[] = [];
  for (const connection of circuit.connections) {
    const fromTank = tankIds.has(componentOf(connection.from));
    const toTank = tankIds.has(componentOf(connection.to));
    if (fromTank || toTank) {
      const other = layout.ports[fromTank ? connection.to : connection.from];
      if (!other) continue;
      const tankTop: Point = { x: other.x, y: layout.tankY + 6 };
      const id = componentOf(fromTank ? connection.from : connection.to);
      routes.push({ connection, points: fromTank ? [tankTop, other] : [other, tankTop], tank: { id, x: other.x } });
      continue;
    }
    const a = layout.ports[connection.from];
    const b = layout.ports[connection.to];
    if (a && b) routes.push({ connection, points: orthogonal(a, b) });
  }
  return routes;
}

export const pathData = (points: Point[]) =>
  points.map((p, i) => `${i === 0 ? "M" : "L"}${p.x} ${p.y}`).join(" ");

const near = (a: number, b: number) => Math.abs(a - b) < 0.5;

function onSegmentInterior(p: Point, a: Point, b: Point): boolean {
  if (near(p.x, a.x) && near(p.y, a.y)) return false;
  if (near(p.x, b.x) && near(p.y, b.y)) return false;
  if (near(a.x, b.x)) return near(p.x, a.x) && p.y > Math.min(a.y, b.y) && p.y < Math.max(a.y, b.y);
  if (near(a.y, b.y)) return near(p.y, a.y) && p.x > Math.min(a.x, b.x) && p.x < Math.max(a.x, b.x);
  return false;
}

/**
 * Junction dots: a corner or end of one line lying inside another line is a tee where the
 * two are joined (lines that merely cross never share such a point in this layout).
 */
export function junctions(routes: Route[]): Point[] {
  const dots: Point[] = [];
  for (const r of routes) {
    if (r.connection.line === "shaft") continue;
    for (const p of r.points) {
      const tee = routes.some(
        (other) =>
          other !== r &&
          other.connection.line !== "shaft" &&
          other.points.some((q, i) => i > 0 && onSegmentInterior(p, other.points[i - 1], q)),
      );
      if (tee && !dots.some((d) => near(d.x, p.x) && near(d.y, p.y))) dots.push(p);
    }
  }
  return dots;
}
