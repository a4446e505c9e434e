/**
 * The machine's circuit as data: the power unit once, then each axis's directional valve,
 * cylinder and in-line valves with the axis named on every component (and, where the shared
 * pump gives more than the axis takes, its P-line flow control; where its cylinder is rated below
 * the relief, its pressure-reducing valve). Every directional valve
 * takes P from the pump line and returns T through the return filter to the tank; an axis's
 * parts connect only among themselves and to the power unit, so each valve reaches only its own
 * cylinder. The diagram drawing of a machine is not made here.
 */
import { buildCircuit } from "./circuit";
import { connect } from "./circuit-parts";
import type { CircuitConnection, Design } from "./design";
import type { MachineAccumulator, MachineCircuit, MachineCircuitComponent, MachineDesign } from "./machine-design";
import { reducingSettingBar } from "./machine-bom";
import { gaugeRangeBar, POWER_UNIT_IDS, powerUnitDesign } from "./machine-unit";
import { dcvPositions } from "./valves";

/** Component id of an axis's part: the axis's place in the list and the part's own id ("a2:dcv"). */
export const axisPartId = (index: number, id: string): string => `a${index + 1}:${id}`;

const componentOf = (end: string): string => end.slice(0, end.lastIndexOf("."));
const portOf = (end: string): string => end.slice(end.lastIndexOf(".") + 1);

export function machineCircuit(m: MachineDesign, designs: Design[]): MachineCircuit {
  const gauge = gaugeRangeBar(m.pressuresBar.reliefSetting);
  const unit = buildCircuit(powerUnitDesign(m, designs[0]), gauge);
  const components: MachineCircuitComponent[] = unit.components.filter((c) => POWER_UNIT_IDS.has(c.id));
  const connections: CircuitConnection[] = unit.connections.filter((c) => POWER_UNIT_IDS.has(componentOf(c.from)) && POWER_UNIT_IDS.has(componentOf(c.to)));
  const present = new Set(components.map((c) => c.id));
  // How the machine's pump joins a valve's P (a double pump's large section through its check as well).
  let feeds = unit.connections.filter((c) => c.to === "dcv.P" && POWER_UNIT_IDS.has(componentOf(c.from)));
  if (m.accumulator) {
    const acc = accumulatorParts(m.accumulator, m.pressuresBar.reliefSetting);
    components.push(...acc.components);
    connections.push(...acc.connections);
    // The valves take P past the check, where the accumulator stands.
    feeds = [{ from: "pump-check.outlet", to: "dcv.P", line: "pressure" }];
  }
  m.axes.forEach((axis, i) => {
    const center = axis.directionalValve.center;
    const own = buildCircuit(
      {
        ...designs[i],
        directionalValve: axis.directionalValve,
        reliefVent: m.reliefVent,
        pressuresBar: { ...designs[i].pressuresBar, reliefSetting: m.pressuresBar.reliefSetting },
      },
      gauge,
      dcvPositions(center),
    );
    const rename = (end: string): string => (POWER_UNIT_IDS.has(componentOf(end)) ? end : `${axisPartId(i, componentOf(end))}.${portOf(end)}`);
    for (const c of own.components) {
      if (POWER_UNIT_IDS.has(c.id)) continue;
      components.push({
        ...c,
        id: axisPartId(i, c.id),
        axis: axis.name,
        label: `${c.label ?? c.kind}, ${axis.name}`,
        ...(c.kind === "dcv" ? { dcvPositions: own.dcvPositions } : {}),
      });
    }
    const joined = new Set<string>();
    const join = (c: CircuitConnection) => {
      const key = `${c.from}>${c.to}`;
      if (!joined.has(key)) connections.push(c);
      joined.add(key);
    };
    // The axis's P line, from the pump's feed up to its valve's P: its own P-line flow control where
    // it is on a larger shared pump, then its reducing valve where its cylinder is rated below the
    // relief (both billed in machine-bom.ts). Each part's inlet and outlet port, in the order the oil passes them.
    const pLine: { id: string; inlet: string; outlet: string }[] = [];
    if (axis.speedControl) {
      const id = axisPartId(i, "speed-control");
      components.push({
        id,
        kind: "flow-control",
        ports: ["1", "2"],
        axis: axis.name,
        label: `Flow control, P line (meter-in), pressure-compensated, ${axis.name}`,
        values: { settingLpm: axis.speedControl.flowLpm, compensated: "yes" },
      });
      pLine.push({ id, inlet: "2", outlet: "1" });
    }
    const reducing = reducingSettingBar(axis.cylinder.ratedPressureBar, m.pressuresBar.reliefSetting, designs[i].pressuresBar.reliefSetting);
    if (reducing !== null) {
      const id = axisPartId(i, "reducing");
      // P in from the pump line, A out to the valve's P, Y the external drain of its spring chamber to tank.
      components.push({
        id,
        kind: "reducing",
        ports: ["P", "A", "Y"],
        axis: axis.name,
        label: `Pressure-reducing valve, P line, externally drained, ${axis.name}`,
        values: { settingBar: reducing, cylinderRatedBar: axis.cylinder.ratedPressureBar, reliefBar: m.pressuresBar.reliefSetting },
      });
      pLine.push({ id, inlet: "P", outlet: "A" });
      join({ from: `${id}.Y`, to: "tank.return", line: "return" });
    }
    for (const c of feeds) join({ ...c, to: pLine.length > 0 ? `${pLine[0].id}.${pLine[0].inlet}` : rename(c.to) });
    pLine.forEach((part, k) => {
      const next = pLine[k + 1];
      join({ from: `${part.id}.${part.outlet}`, to: next ? `${next.id}.${next.inlet}` : rename("dcv.P"), line: "pressure" });
    });
    for (const c of own.connections) {
      const ends = [componentOf(c.from), componentOf(c.to)];
      if (ends.every((id) => POWER_UNIT_IDS.has(id))) continue;
      // The axis alone may have had parts of a power unit the machine does not (its own double pump's check): its P comes from `feeds`.
      if (ends.some((id) => POWER_UNIT_IDS.has(id) && !present.has(id))) continue;
      if (c.to === "dcv.P" && POWER_UNIT_IDS.has(componentOf(c.from))) continue;
      join({ ...c, from: rename(c.from), to: rename(c.to) });
    }
  });
  return { components, connections };
}

/**
 * The accumulator on the pressure line: the pump charges it through a check valve; the charging
 * valve, piloted from past the check, dumps the pump to tank at p2 and loads it at p1; the safety
 * and shut-off block stands between the line and the accumulator and vents it to tank (sources
 * §11.6; ISO 4413 automatic venting).
 */
export function accumulatorParts(
  acc: Pick<MachineAccumulator, "nominalL" | "prechargeBar" | "minBar" | "maxBar">,
  reliefSettingBar: number,
): { components: MachineCircuitComponent[]; connections: CircuitConnection[] } {
  return {
    components: [
      {
        id: "charging-valve",
        kind: "unloading",
        ports: ["1", "2", "X"],
        label: "Accumulator charging valve, unloads the pump at p2 and loads it again at p1",
        values: { cutOutBar: acc.maxBar, cutInBar: acc.minBar },
      },
      { id: "pump-check", kind: "check", ports: ["inlet", "outlet"], label: "Check valve, pump to accumulator and valves" },
      {
        id: "accumulator-block",
        kind: "accumulator-block",
        ports: ["P", "A", "T"],
        label: "Accumulator safety and shut-off block",
        values: { safetyBar: reliefSettingBar, discharge: "normally open solenoid" },
      },
      {
        id: "accumulator",
        kind: "accumulator",
        ports: ["P"],
        label: "Bladder accumulator",
        values: { nominalL: acc.nominalL, prechargeBar: acc.prechargeBar },
      },
    ],
    connections: [
      ...connect("pressure", ["pump.outlet", "pump-check.inlet"], ["pump.outlet", "charging-valve.1"]),
      ...connect("return", ["charging-valve.2", "tank.return"]),
      ...connect("pilot", ["pump-check.outlet", "charging-valve.X"]),
      ...connect("pressure", ["pump-check.outlet", "accumulator-block.P"], ["accumulator-block.A", "accumulator.P"]),
      ...connect("return", ["accumulator-block.T", "tank.return"]),
    ],
  };
}
