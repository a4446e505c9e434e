import type { PortPair } from "~/hydraulics/design";
import { BOX, PORT_INSET, type Point } from "./layout";

/**
 * Geometry of one position box of the 4/3 valve, from the port pairs joined in that
 * position. Ports sit where ISO 1219 puts them: A and B on top, P and T underneath.
 * Shifted positions draw each pair as a flow arrow (parallel P→A, B→T or crossed P→B,
 * A→T); the centre draws its joined ports as passages, and every port left out is blocked.
 */

export const BOX_PORTS = ["P", "T", "A", "B"] as const;
type BoxPort = (typeof BOX_PORTS)[number];

const PORT_AT: Record<BoxPort, Point> = {
  A: { x: PORT_INSET, y: 0 },
  B: { x: BOX - PORT_INSET, y: 0 },
  P: { x: PORT_INSET, y: BOX },
  T: { x: BOX - PORT_INSET, y: BOX },
};

const isBoxPort = (p: string): p is BoxPort => p in PORT_AT;
const onTop = (p: BoxPort) => PORT_AT[p].y === 0;

export interface BoxDrawing {
  /** straight flow arrows, head at `to` */
  arrows: { from: Point; to: Point }[];
  /** open polylines for passages without a direction */
  passages: Point[][];
  /** ports closed in this position, each drawn as a T-stop */
  blocked: { port: BoxPort; at: Point }[];
  dots: Point[];
}

export const pairsLabel = (pairs: PortPair[]) => pairs.map(([a, b]) => `${a}-${b}`).join(",");

export function blockedPorts(pairs: PortPair[]): BoxPort[] {
  const joined = new Set(pairs.flat());
  return BOX_PORTS.filter((p) => !joined.has(p));
}

/** Ports joined directly or through a shared port, e.g. A-T and B-T make one passage A, B, T. */
function groups(pairs: PortPair[]): BoxPort[][] {
  const result: Set<BoxPort>[] = [];
  for (const [a, b] of pairs) {
    if (!isBoxPort(a) || !isBoxPort(b)) continue;
    const hits = result.filter((g) => g.has(a) || g.has(b));
    const merged = new Set<BoxPort>([a, b, ...hits.flatMap((g) => [...g])]);
    for (const h of hits) result.splice(result.indexOf(h), 1);
    result.push(merged);
  }
  return result.map((g) => BOX_PORTS.filter((p) => g.has(p)));
}

/** A passage: a stub from each port to a common run, and the run between them. */
function passage(ports: BoxPort[], runY: number): { lines: Point[][]; dots: Point[] } {
  const xs = ports.map((p) => PORT_AT[p].x);
  const lines: Point[][] = ports.map((p) => [PORT_AT[p], { x: PORT_AT[p].x, y: runY }]);
  const minX = Math.min(...xs);
  const maxX = Math.max(...xs);
  if (maxX > minX)
    lines.push([
      { x: minX, y: runY },
      { x: maxX, y: runY },
    ]);
  // A dot where three or more passage ends meet (a port column shared by top and bottom, or a tee).
  const dots: Point[] = [];
  for (const x of new Set(xs)) {
    const stubEnds = ports.filter((p) => PORT_AT[p].x === x).length;
    const runEnds = maxX === minX ? 0 : x === minX || x === maxX ? 1 : 2;
    if (stubEnds + runEnds >= 3) dots.push({ x, y: runY });
  }
  return { lines, dots };
}

export function boxDrawing(pairs: PortPair[], style: "arrows" | "passages"): BoxDrawing {
  const drawing: BoxDrawing = { arrows: [], passages: [], blocked: [], dots: [] };
  const valid = pairs.filter((pair): pair is [BoxPort, BoxPort] => isBoxPort(pair[0]) && isBoxPort(pair[1]));
  const asArrows = style === "arrows" ? valid.filter(([a, b]) => onTop(a) !== onTop(b)) : [];
  for (const [a, b] of asArrows) drawing.arrows.push({ from: PORT_AT[a], to: PORT_AT[b] });

  const rest = valid.filter((pair) => !asArrows.includes(pair));
  const passageGroups = groups(rest);
  passageGroups.forEach((g, i) => {
    // One group runs across the middle; a group on one side only stays near that side.
    const sides = new Set(g.map(onTop));
    const runY = sides.size === 2 ? BOX / 2 : sides.has(true) ? BOX * 0.32 : BOX * 0.68;
    const offset = passageGroups.length > 1 ? (i - (passageGroups.length - 1) / 2) * 10 : 0;
    const { lines, dots } = passage(g, runY + offset);
    drawing.passages.push(...lines);
    drawing.dots.push(...dots);
  });

  for (const port of blockedPorts(pairs)) drawing.blocked.push({ port, at: PORT_AT[port] });
  return drawing;
}
