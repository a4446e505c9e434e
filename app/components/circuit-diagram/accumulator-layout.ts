import type { Circuit, CircuitComponent } from "~/hydraulics/design";
import { CHECK_HALF, RELIEF_BOX, UNLOADING_STUB, type Layout } from "./layout";

/**
 * Where a machine's accumulator charging circuit stands in its power unit: the pump's check on
 * the pump line above the relief's branch, the charging valve teed onto the pump line to the
 * right below the gauge, and beside it the safety and shut-off block with the accumulator
 * upright at its right. The block's line leaves the check's outlet (the accumulator line) to
 * the right above the check, and the charging valve's pilot rises from its spring end onto it.
 * The power unit is drawn lower by ACCUMULATOR_DROP so all of it stands below the rails, and
 * its return column moves right of the accumulator.
 */

/** Accumulator: an upright capsule ACC_W × ACC_H, its port ACC_STEM below the capsule. */
export const ACC_W = 32;
export const ACC_H = 66;
export const ACC_STEM = 12;
/** Safety block: a dashed frame BLOCK_W × BLOCK_H; its line from P to A runs BLOCK_LINE_DY below the top. */
export const BLOCK_W = 280;
export const BLOCK_H = 136;
export const BLOCK_LINE_DY = 26;
/** The block's T port, this far right of its left wall, on the bottom wall. */
export const BLOCK_T_DX = 183;

/** How much lower the power unit stands, and where its return column moves to, with an accumulator. */
export const ACCUMULATOR_DROP = 160;
export const ACCUMULATOR_RETURN_DX = 690;

/** Below the unit's valve-bottom line (layout.ts's rows, where the relief tees off at +60 and the gauge at +100). */
const CHECK_DY = 30;
const CHARGING_DX = 238;
const CHARGING_DY = 130;
const BLOCK_DX = 358;
const BLOCK_LINE_Y = -10;
const ACC_DX = 50;

const byKind = (circuit: Pick<Circuit, "components">, kind: CircuitComponent["kind"]) => circuit.components.find((c) => c.kind === kind);

/** A power unit that charges an accumulator: the engine lists the accumulator among its parts. */
export const chargesAccumulator = (circuit: Pick<Circuit, "components">) => byKind(circuit, "accumulator") !== undefined;

/**
 * Places the check, charging valve, block and accumulator of a power unit already laid out as
 * layout.ts lays one out (`unit`, changed in place): the pump line is the pump's outlet column.
 */
export function placeAccumulator(unit: Layout, circuit: Pick<Circuit, "components">): void {
  const outlet = unit.ports["pump.outlet"];
  if (!outlet) return;
  const x = outlet.x;
  const base = unit.dcv.bottom;
  const place = (kind: CircuitComponent["kind"], at: { x: number; y: number }, ports: Layout["ports"]) => {
    const c = byKind(circuit, kind);
    if (!c) return;
    unit.at[c.id] = at;
    for (const [port, anchor] of Object.entries(ports)) unit.ports[`${c.id}.${port}`] = anchor;
  };
  const accumulatorLineY = base + BLOCK_LINE_Y;

  const checkY = base + CHECK_DY;
  place(
    "check",
    { x, y: checkY },
    {
      inlet: { x, y: checkY + CHECK_HALF, dir: "down" },
      // the valves' P lines run up to the pressure rail, the block's line turns right on its way
      outlet: { x, y: checkY - CHECK_HALF, dir: "up" },
    },
  );

  const cx = x + CHARGING_DX;
  const cy = base + CHARGING_DY;
  place(
    "unloading",
    { x: cx, y: cy },
    {
      "1": { x: cx - RELIEF_BOX / 2, y: cy, dir: "left", tap: true },
      "2": { x: cx + RELIEF_BOX / 2 + UNLOADING_STUB, y: cy, dir: "right", tankTop: cy + 22 },
      X: { x: cx, y: cy - RELIEF_BOX / 2, dir: "up", tap: true },
    },
  );

  const left = x + BLOCK_DX;
  const right = left + BLOCK_W;
  const top = accumulatorLineY - BLOCK_LINE_DY;
  place(
    "accumulator-block",
    { x: left + BLOCK_W / 2, y: top + BLOCK_H / 2 },
    {
      P: { x: left, y: accumulatorLineY, dir: "left" },
      A: { x: right, y: accumulatorLineY, dir: "right" },
      T: { x: left + BLOCK_T_DX, y: top + BLOCK_H, dir: "down", tankTop: top + BLOCK_H + 12 },
    },
  );

  const ax = right + ACC_DX;
  const portY = accumulatorLineY - 20;
  place("accumulator", { x: ax, y: portY - ACC_STEM - ACC_H / 2 }, { P: { x: ax, y: portY, dir: "down" } });
}
