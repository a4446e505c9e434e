import type { Circuit, CircuitConnection } from "~/hydraulics/design";
import { oilNets } from "~/hydraulics/port-nets";
import type { Anchor, Layout, Point } from "./layout";

/** What routing reads of a circuit: an axis's or a machine's alike. */
export type Net = Pick<Circuit, "components" | "connections">;

/** One drawn connection: an orthogonal polyline between two ports. */
export interface Route {
  connection: CircuitConnection;
  points: Point[];
  /** the tank symbol drawn at the end of this line, when it ends at the reservoir */
  tank?: { id: string; x: number; top: number };
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
 * Where a line leaving `a` straight in its direction first meets a drawn line of the net
 * `net`: the tee of a branch (a pilot, a decompression or regeneration valve) onto a line
 * already drawn. Undefined when the ray meets none.
 */
function teePoint(a: Anchor, net: string, drawn: Route[], netOf: (port: string) => string): Point | undefined {
  let best: { p: Point; d: number } | undefined;
  const horizontal = !isVertical(a);
  const sign = a.dir === "right" || a.dir === "down" ? 1 : -1;
  for (const r of drawn) {
    if (r.tank || r.connection.line === "pilot" || r.connection.line === "shaft") continue;
    if (netOf(r.connection.from) !== net) continue;
    r.points.forEach((q, i) => {
      if (i === 0) return;
      const p0 = r.points[i - 1];
      let hit: Point | undefined;
      if (horizontal && p0.x === q.x && a.y >= Math.min(p0.y, q.y) && a.y <= Math.max(p0.y, q.y)) hit = { x: q.x, y: a.y };
      if (!horizontal && p0.y === q.y && a.x >= Math.min(p0.x, q.x) && a.x <= Math.max(p0.x, q.x)) hit = { x: a.x, y: q.y };
      if (!hit) return;
      const d = sign * (horizontal ? hit.x - a.x : hit.y - a.y);
      if (d > 0 && (!best || d < best.d)) best = { p: hit, d };
    });
  }
  return best?.p;
}

/**
 * Routes every connection whose ends are laid out. A line to the reservoir drops straight
 * down from its other end to a tank symbol of its own, as ISO 1219 allows (at the bottom, or
 * just below a port that asks for its own). A port marked as a tap is joined by a straight
 * tee onto the line it belongs to, drawn after the others; where no such line is in reach
 * the connection is routed port to port.
 */
export function routeConnections(circuit: Net, layout: Layout): Route[] {
  const tankIds = new Set(circuit.components.filter((c) => c.kind === "tank").map((c) => c.id));
  const netOf = oilNets(circuit);
  const routes = new Map<CircuitConnection, Route>();
  const taps: CircuitConnection[] = [];
  for (const connection of circuit.connections) {
    const fromTank = tankIds.has(componentOf(connection.from));
    const toTank = tankIds.has(componentOf(connection.to));
    if (fromTank || toTank) {
      const other = layout.ports[fromTank ? connection.to : connection.from];
      if (!other) continue;
      const top = other.tankTop ?? layout.tankY;
      const tankTop: Point = { x: other.x, y: top + 6 };
      const id = componentOf(fromTank ? connection.from : connection.to);
      routes.set(connection, { connection, points: fromTank ? [tankTop, other] : [other, tankTop], tank: { id, x: other.x, top } });
      continue;
    }
    const a = layout.ports[connection.from];
    const b = layout.ports[connection.to];
    if (!a || !b) continue;
    if (a.tap || b.tap) taps.push(connection);
    else routes.set(connection, { connection, points: orthogonal(a, b) });
  }
  const drawn = [...routes.values()];
  for (const connection of taps) {
    const a = layout.ports[connection.from];
    const b = layout.ports[connection.to];
    const tapFrom = a.tap === true;
    const port = tapFrom ? a : b;
    const hit = teePoint(port, netOf(tapFrom ? connection.to : connection.from), drawn, netOf);
    const points = hit ? (tapFrom ? [port, hit] : [hit, port]) : orthogonal(a, b);
    routes.set(connection, { connection, points });
  }
  // in the order of the data, for readers of the markup
  return circuit.connections.flatMap((c) => routes.get(c) ?? []);
}

export const pathData = (points: Point[]) => points.map((p, i) => `${i === 0 ? "M" : "L"}${p.x} ${p.y}`).join(" ");

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
        (other) => other !== r && other.connection.line !== "shaft" && other.points.some((q, i) => i > 0 && onSegmentInterior(p, other.points[i - 1], q)),
      );
      if (tee && !dots.some((d) => near(d.x, p.x) && near(d.y, p.y))) dots.push(p);
    }
  }
  return dots;
}

const directionOf = (from: Point, to: Point): string => (near(from.x, to.x) ? (to.y > from.y ? "down" : "up") : to.x > from.x ? "right" : "left");

/**
 * Junction dots where lines of one net meet, also where several lines turn at one point (the
 * rails of a machine, where the lines of the valves leave the common pressure and tank lines):
 * a corner or end of a line from which lines leave in three or more directions. Lines that only
 * cross meet at no corner, so they get no dot.
 */
export function meetings(routes: Route[]): Point[] {
  const lines = routes.filter((r) => r.connection.line !== "shaft");
  const dots: Point[] = [];
  for (const r of lines) {
    for (const p of r.points) {
      if (dots.some((d) => near(d.x, p.x) && near(d.y, p.y))) continue;
      const ways = new Set<string>();
      for (const other of lines) {
        other.points.forEach((q, i) => {
          if (i === 0) return;
          const a = other.points[i - 1];
          if (onSegmentInterior(p, a, q)) {
            ways.add(directionOf(p, a));
            ways.add(directionOf(p, q));
          } else if (near(p.x, a.x) && near(p.y, a.y) && !(near(a.x, q.x) && near(a.y, q.y))) ways.add(directionOf(p, q));
          else if (near(p.x, q.x) && near(p.y, q.y) && !(near(a.x, q.x) && near(a.y, q.y))) ways.add(directionOf(p, a));
        });
      }
      if (ways.size >= 3) dots.push(p);
    }
  }
  return dots;
}
