import type { Circuit, CircuitComponent, CircuitConnection, DcvPositions, Design } from "./design";
import { connect, decompressionParts, pumpParts, returnLine, switchParts, workLines } from "./circuit-parts";
import { dcvPositions } from "./valves";

/**
 * Components and connections for the diagram; every port the circuit uses is joined. With a
 * vented relief its vent port X is joined by a pilot line to the vent valve's P, and the vent
 * valve's T returns to tank [CP].
 */
export function buildCircuit(d: Design, gaugeRangeBar: number, positions: DcvPositions = dcvPositions(d.directionalValve.center)): Circuit {
  const vent = d.reliefVent;
  const pump = pumpParts(d);
  const work = workLines(d);
  const back = returnLine(d);
  const decompression = decompressionParts(d);
  const components: CircuitComponent[] = [
    { id: "tank", kind: "tank", ports: ["suction", "return"], label: "Reservoir", values: { volumeL: d.reservoir.volumeL } },
    { id: "strainer", kind: "strainer", ports: ["inlet", "outlet"], label: "Suction strainer" },
    { id: "motor", kind: "motor", ports: ["shaft"], label: "Motor", values: { ratedKw: d.motor.ratedKw, speedRpm: d.pump.speedRpm } },
    ...pump.components,
    vent
      ? {
          id: "relief",
          kind: "relief",
          ports: ["1", "2", "X"],
          label: "Relief valve, pilot-operated, solenoid-vented",
          values: { settingBar: d.pressuresBar.reliefSetting, vented: "yes", ventPressureBar: vent.ventPressureBar },
        }
      : { id: "relief", kind: "relief", ports: ["1", "2"], label: "Relief valve", values: { settingBar: d.pressuresBar.reliefSetting } },
    { id: "gauge", kind: "gauge", ports: ["port"], label: "Gauge", values: { rangeBar: gaugeRangeBar } },
    {
      id: "dcv",
      kind: "dcv",
      ports: ["P", "T", "A", "B"],
      label: "4/3 directional valve",
      values: { center: d.directionalValve.center, iso4401Size: d.directionalValve.iso4401Size, coilVoltage: d.directionalValve.coilVoltage },
    },
    { id: "filter", kind: "filter", ports: ["inlet", "outlet"], label: "Return filter", values: { ratedFlowLpm: d.returnFilter.ratedFlowLpm } },
    {
      id: "cylinder",
      kind: "cylinder",
      ports: ["cap", "rod"],
      label: "Cylinder",
      values: { boreMm: d.cylinder.boreMm, rodMm: d.cylinder.rodMm, strokeMm: d.cylinder.strokeMm },
    },
  ];
  const connections: CircuitConnection[] = [
    ...connect("suction", ["tank.suction", "strainer.inlet"], ["strainer.outlet", "pump.inlet"]),
    ...connect("shaft", ["motor.shaft", "pump.shaft"]),
    ...connect("pressure", ["pump.outlet", "dcv.P"], ["pump.outlet", "relief.1"], ["pump.outlet", "gauge.port"]),
    ...connect("return", ["relief.2", "tank.return"], ["dcv.T", "filter.inlet"]),
    ...back.connections,
  ];
  components.push(...back.components, ...work.components, ...decompression.components);
  // the work lines with their in-line valves (the regeneration valve among them) and pilots (circuit-parts.ts)
  connections.push(...work.connections, ...decompression.connections);
  // The vent valve goes last so the work-line connections keep their order for readers.
  if (vent) {
    components.push({
      id: "vent",
      kind: "vent",
      ports: ["P", "T"],
      label: "Relief vent valve, 2/2 solenoid, normally open",
      values: { ventPressureBar: vent.ventPressureBar, coilVoltage: vent.coilVoltage, normally: "open", energised: "with solenoid a or b" },
    });
    connections.push({ from: "relief.X", to: "vent.P", line: "pilot" }, { from: "vent.T", to: "tank.return", line: "return" });
  }
  // the double pump's large section, check and unloading valve after the rest, as the vent valve
  connections.push(...pump.connections);
  // the switches that end the approach, after the parts they switch off (circuit-parts.ts)
  const switches = switchParts(d);
  components.push(...switches.components);
  connections.push(...switches.connections);
  return { components, connections, dcvPositions: positions };
}
