import type { Circuit, CircuitComponent, CircuitConnection, DcvPositions, Design } from "./design";
import { dcvPositions } from "./valves";

/**
 * Components and connections for the diagram; every port the circuit uses is joined. With a
 * vented relief its vent port X is joined by a pilot line to the vent valve's P, and the vent
 * valve's T returns to tank [CP].
 */
export function buildCircuit(d: Design, gaugeRangeBar: number, positions: DcvPositions = dcvPositions(d.directionalValve.center)): Circuit {
  const cb = d.counterbalance;
  const vent = d.reliefVent;
  const components: CircuitComponent[] = [
    { id: "tank", kind: "tank", ports: ["suction", "return"], label: "Reservoir", values: { volumeL: d.reservoir.volumeL } },
    { id: "strainer", kind: "strainer", ports: ["inlet", "outlet"], label: "Suction strainer" },
    { id: "motor", kind: "motor", ports: ["shaft"], label: "Motor", values: { ratedKw: d.motor.ratedKw, speedRpm: d.pump.speedRpm } },
    { id: "pump", kind: "pump", ports: ["inlet", "outlet", "shaft"], label: "Pump", values: { displacementCcRev: d.pump.displacementCcRev, flowLpm: d.flowsLpm.pump } },
    vent
      ? {
          id: "relief", kind: "relief", ports: ["1", "2", "X"], label: "Relief valve, pilot-operated, solenoid-vented",
          values: { settingBar: d.pressuresBar.reliefSetting, vented: "yes", ventPressureBar: vent.ventPressureBar },
        }
      : { id: "relief", kind: "relief", ports: ["1", "2"], label: "Relief valve", values: { settingBar: d.pressuresBar.reliefSetting } },
    { id: "gauge", kind: "gauge", ports: ["port"], label: "Gauge", values: { rangeBar: gaugeRangeBar } },
    {
      id: "dcv", kind: "dcv", ports: ["P", "T", "A", "B"], label: "4/3 directional valve",
      values: { center: d.directionalValve.center, iso4401Size: d.directionalValve.iso4401Size, coilVoltage: d.directionalValve.coilVoltage },
    },
    { id: "filter", kind: "filter", ports: ["inlet", "outlet"], label: "Return filter", values: { ratedFlowLpm: d.returnFilter.ratedFlowLpm } },
    {
      id: "cylinder", kind: "cylinder", ports: ["cap", "rod"], label: "Cylinder",
      values: { boreMm: d.cylinder.boreMm, rodMm: d.cylinder.rodMm, strokeMm: d.cylinder.strokeMm },
    },
  ];
  const connections: CircuitConnection[] = [
    { from: "tank.suction", to: "strainer.inlet", line: "suction" },
    { from: "strainer.outlet", to: "pump.inlet", line: "suction" },
    { from: "motor.shaft", to: "pump.shaft", line: "shaft" },
    { from: "pump.outlet", to: "dcv.P", line: "pressure" },
    { from: "pump.outlet", to: "relief.1", line: "pressure" },
    { from: "pump.outlet", to: "gauge.port", line: "pressure" },
    { from: "relief.2", to: "tank.return", line: "return" },
    { from: "dcv.T", to: "filter.inlet", line: "return" },
    { from: "filter.outlet", to: "tank.return", line: "return" },
  ];
  if (cb) {
    components.push({
      id: "cbv", kind: "cbv", ports: ["1", "2", "3"], label: "Counterbalance valve",
      values: { side: cb.side, settingBar: cb.settingBar, pilotRatio: cb.pilotRatio },
    });
  }
  // Port 1 to the actuator, 2 to the valve, pilot 3 to the opposite work line.
  if (cb?.side === "rod") {
    connections.push(
      { from: "dcv.A", to: "cylinder.cap", line: "work" },
      { from: "dcv.B", to: "cbv.2", line: "work" },
      { from: "cbv.1", to: "cylinder.rod", line: "work" },
      { from: "dcv.A", to: "cbv.3", line: "pilot" },
    );
  } else if (cb?.side === "cap") {
    connections.push(
      { from: "dcv.A", to: "cbv.2", line: "work" },
      { from: "cbv.1", to: "cylinder.cap", line: "work" },
      { from: "dcv.B", to: "cylinder.rod", line: "work" },
      { from: "dcv.B", to: "cbv.3", line: "pilot" },
    );
  } else {
    connections.push(
      { from: "dcv.A", to: "cylinder.cap", line: "work" },
      { from: "dcv.B", to: "cylinder.rod", line: "work" },
    );
  }
  // The vent valve goes last so the work-line connections keep their order for readers.
  if (vent) {
    components.push({
      id: "vent", kind: "vent", ports: ["P", "T"], label: "Relief vent valve, 2/2 solenoid, normally open",
      values: { ventPressureBar: vent.ventPressureBar, coilVoltage: vent.coilVoltage, normally: "open", energised: "with solenoid a or b" },
    });
    connections.push(
      { from: "relief.X", to: "vent.P", line: "pilot" },
      { from: "vent.T", to: "tank.return", line: "return" },
    );
  }
  return { components, connections, dcvPositions: positions };
}
