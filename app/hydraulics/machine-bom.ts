/**
 * One bill for the machine: the power unit's lines once, then each axis's own lines with the
 * axis in the key (`cylinder:Clamp`) and the item, so a shop prices every axis separately.
 */
import { buildBom } from "./bom";
import type { BomLine, Design } from "./design";
import { A } from "./assumptions";
import { num } from "./format";
import type { MachineDesign } from "./machine-design";
import { gaugeRangeBar, POWER_UNIT_KEYS, powerUnitDesign } from "./machine-unit";

/** Oil held by a hose, L. */
const hoseL = (l: { innerDiameterMm: number; lengthM: number }): number => (((Math.PI * l.innerDiameterMm ** 2) / 4) * l.lengthM) / 1000;

export function machineBom(m: MachineDesign, designs: Design[]): BomLine[] {
  const gauge = gaugeRangeBar(m.pressuresBar.reliefSetting);
  const relief = m.pressuresBar.reliefSetting;
  const unit = buildBom(powerUnitDesign(m, designs[0]), gauge).filter((l) => POWER_UNIT_KEYS.has(l.key));
  // First fill: the tank, every cap end and every hose.
  const fillL = Math.ceil(
    m.reservoir.volumeL +
      designs.reduce((s, d) => s + (d.cylinder.capAreaMm2 * d.cylinder.strokeMm) / 1e6 + hoseL(d.lines.capWork) + hoseL(d.lines.rodWork), 0) +
      hoseL(m.lines.pressure) +
      hoseL(m.lines.return) +
      hoseL(m.lines.suction),
  );
  const lines = unit.map((l) =>
    l.key === "fluid-fill" ? { ...l, specification: `about ${fillL} L: reservoir, every cylinder and hose`, rating: { ...l.rating, value: fillL } } : l,
  );
  if (m.accumulator) lines.push(...accumulatorLines(m));
  m.axes.forEach((axis, i) => {
    const own = { ...designs[i], directionalValve: axis.directionalValve, pressuresBar: { ...designs[i].pressuresBar, reliefSetting: relief } };
    const tag = (l: BomLine): BomLine => ({ ...l, key: `${l.key}:${axis.name}`, item: `${l.item}, ${axis.name}` });
    lines.push(
      ...buildBom(own, gauge)
        .filter((l) => !POWER_UNIT_KEYS.has(l.key))
        .map(tag),
    );
    if (axis.speedControl) {
      lines.push(
        tag({
          key: "speed-control",
          item: "Flow control valve, pressure-compensated, modular (sandwich) in the P line under the directional valve",
          quantity: 1,
          specification: `set to about ${num(axis.speedControl.flowLpm)} L/min, the flow a pump of the axis's own size would give, so both strokes keep the speeds the axis was sized at on the shared pump; rated for at least ${relief} bar`,
          rating: { value: axis.speedControl.flowLpm, unit: "L/min", label: "set flow" },
        }),
      );
    }
    const prv = reducingSettingBar(axis.cylinder.ratedPressureBar, relief, designs[i].pressuresBar.reliefSetting);
    if (prv !== null) {
      lines.push(
        tag({
          key: "reducing-valve",
          item: "Pressure-reducing valve, modular (sandwich) under the directional valve, P line, externally drained",
          quantity: 1,
          specification: `set to ${num(prv)} bar so the ${axis.cylinder.ratedPressureBar} bar cylinder never sees the ${relief} bar relief; with a check for the free return flow`,
          rating: { value: prv, unit: "bar", label: "setting" },
        }),
      );
    }
  });
  return lines;
}

/**
 * An axis whose cylinder is rated below the machine's relief gets a pressure-reducing valve in
 * its P line, set where its own relief would be (p_working × 1.1): "use reducing valves, not a
 * second relief, to get two pressures" (several-actuator practice, fluid-power textbooks). Null where none is needed.
 */
export function reducingSettingBar(ratedBar: number, machineReliefBar: number, ownReliefBar: number): number | null {
  return machineReliefBar > ratedBar + 1e-9 ? Math.min(ownReliefBar, ratedBar) : null;
}

/** The accumulator and what charges, protects and vents it (sources §11.6; ISO 4413 venting). */
function accumulatorLines(m: MachineDesign): BomLine[] {
  const acc = m.accumulator!;
  const relief = m.pressuresBar.reliefSetting;
  return [
    {
      key: "accumulator",
      item: "Bladder accumulator",
      quantity: 1,
      specification: `${num(acc.nominalL)} L nominal gas volume (${num(acc.gasVolumeL, 2)} L needed to give ${num(acc.usableL, 2)} L of oil between ${num(acc.minBar)} and ${num(acc.maxBar)} bar), nitrogen precharge ${num(acc.prechargeBar)} bar at working temperature, rated for at least ${num(relief)} bar`,
      rating: { value: acc.nominalL, unit: "L", label: "gas volume" },
    },
    {
      key: "accumulator-safety-block",
      item: "Accumulator safety and shut-off block",
      quantity: 1,
      specification: `shut-off valve, type-tested safety relief valve set at ${num(relief)} bar, 2/2 solenoid discharge valve normally open to tank (${A.coilVoltage.value} V DC; open whenever the power unit is switched off, so the accumulator is vented automatically, ISO 4413), gauge port`,
      rating: { value: relief, unit: "bar", label: "safety valve setting" },
    },
    {
      key: "accumulator-charging-valve",
      item: "Accumulator charging valve (pump unloading valve)",
      quantity: 1,
      specification: `unloads the pump to tank when the accumulator reaches ${num(acc.maxBar)} bar and loads it again at ${num(acc.minBar)} bar, piloted from the accumulator line; for ${num(m.flowsLpm.pump)} L/min`,
      rating: { value: acc.maxBar, unit: "bar", label: "cut-out" },
    },
    {
      key: "accumulator-check-valve",
      item: "Check valve, pump to accumulator and valves",
      quantity: 1,
      specification: `for ${num(m.flowsLpm.pump)} L/min, rated for at least ${num(relief)} bar; keeps the accumulator from discharging through the unloaded pump`,
      rating: { value: m.flowsLpm.pump, unit: "L/min", label: "flow" },
    },
  ];
}
