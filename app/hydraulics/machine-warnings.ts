/**
 * The machine's warnings: each axis's own (its cylinder, valves and speeds), with the axis named,
 * and the power unit's, worked out once over the machine cycle.
 */
import type { Design } from "./design";
import { num } from "./format";
import { reducingSettingBar } from "./machine-bom";
import type { MachineDesign } from "./machine-design";
import type { MachinePump } from "./machine-pump";
import type { Warning, WarningCode } from "./warnings";

/** Axis warnings about the power unit: the machine judges these once, for its own pump, motor and tank. */
const POWER_UNIT_CODES = new Set<WarningCode>([
  "HEAT_COOLER_NEEDED",
  "PUMP_BEYOND_SERIES",
  "MOTOR_BEYOND_SERIES",
  "DUTY_CYCLE_OVERLOAD",
  "PUMP_TYPE_NOT_SUITED",
  "PUMP_ON_RELIEF_IN_NEUTRAL",
  "RELIEF_VENTED_IN_NEUTRAL",
]);

export function machineWarnings(m: MachineDesign, designs: Design[], mp: MachinePump, motorInSeries: boolean): Warning[] {
  const list: Warning[] = [];
  const add = (code: WarningCode, message: string) => list.push({ code, message });
  const several = designs.length > 1;
  designs.forEach((d, i) => {
    const name = m.axes[i].name;
    for (const w of d.warnings) {
      // One valve on its own pump: its neutral arrangement is the machine's, so its note stands.
      if (POWER_UNIT_CODES.has(w.code) && (several || !["PUMP_ON_RELIEF_IN_NEUTRAL", "RELIEF_VENTED_IN_NEUTRAL"].includes(w.code))) continue;
      // The axis's own message blames its own pump; on a shared pump the flow it gets is what its speeds follow from.
      const message = several && w.code === "PUMP_SPEED_MISMATCH" ? sharedSpeedMessage(d) : w.message;
      list.push({ code: w.code, message: `${name}: ${message}` });
    }
    const prv = reducingSettingBar(d.cylinder.ratedPressureBar, m.pressuresBar.reliefSetting, d.pressuresBar.reliefSetting);
    if (prv !== null) {
      add(
        "AXIS_PRESSURE_REDUCED",
        `${name}: its ${d.cylinder.ratedPressureBar} bar cylinder shares a pump relieved at ${num(m.pressuresBar.reliefSetting)} bar, so a pressure-reducing valve in its P line holds it to ${num(prv)} bar; the pressure it drops becomes heat while the axis moves.`,
      );
    }
  });
  // With an accumulator the pump gives less than the peaks by design; the accumulator gives the rest.
  for (const ph of m.accumulator ? [] : m.cycle) {
    if (ph.demandLpm > ph.pumpFlowLpm * (1 + 1e-6)) {
      add(
        "MACHINE_FLOW_SHORT",
        `While ${ph.axes.join(" and ")} move${ph.axes.length === 1 ? "s" : ""} (step ${(ph.step ?? 0) + 1}), they draw ${num(ph.demandLpm)} L/min but the ${m.pump.type} pump delivers only ${num(ph.pumpFlowLpm)} L/min at ${num(ph.pressureBar)} bar: those axes will be slower than asked. Move them in separate steps, or size the pump for them together.`,
      );
    }
  }
  const acc = m.accumulator;
  if (acc) {
    add(
      "ACCUMULATOR_STORED_ENERGY",
      `The ${num(acc.nominalL)} L accumulator holds about ${num(acc.oilAtMaxL, 2)} L of oil at up to ${num(acc.maxBar)} bar, precharged with nitrogen to ${num(acc.prechargeBar)} bar: its safety block's normally open discharge valve vents it to tank whenever the power unit is switched off (ISO 4413), and the gauge must read zero before anyone opens the circuit. Accumulators fall under pressure-equipment rules: check the local ones.`,
    );
  }
  if (!mp.inSeries)
    add(
      "PUMP_BEYOND_SERIES",
      `The flow needs more than the largest displacement in the series (${m.pump.displacementCcRev} cm³/rev); use several pumps or a larger unit.`,
    );
  if (!motorInSeries) add("MOTOR_BEYOND_SERIES", `The drive needs ${num(m.motor.requiredKw)} kW, more than the largest motor listed.`);
  if (m.heat.cycleS !== null && m.heat.busyS > m.heat.cycleS + 1e-9) {
    add(
      "DUTY_CYCLE_OVERLOAD",
      `One machine cycle takes ${num(m.heat.busyS)} s of movement, more than the ${num(m.heat.cycleS)} s the cycles per hour allow; the heat is worked out for continuous movement.`,
    );
  }
  if (m.cooler) {
    add(
      "HEAT_COOLER_NEEDED",
      `On average ${num(m.heat.averageLossKw)} kW becomes heat, but a ${m.reservoir.volumeL} L tank sheds only about ${num(m.heat.tankDissipationKw, 2)} kW at ${m.requirements.ambientC} °C ambient with oil at 60 °C. The bill has a cooler for at least ${num(m.cooler.kw)} kW.`,
    );
  }
  if (m.requirements.pumpType !== undefined && m.requirements.pumpType !== m.pump.type)
    add("PUMP_TYPE_NOT_SUITED", `The pump asked for is not sized: ${m.pump.reason}.`);
  if (several && m.reliefVent) {
    add(
      "RELIEF_VENTED_IN_NEUTRAL",
      `Every directional valve blocks P in neutral, so the relief is solenoid-vented: the control must energise its normally open vent valve whenever any axis's valve is shifted, or no axis can build pressure. With every valve in neutral the pump circulates at about ${num(m.reliefVent.ventPressureBar)} bar.`,
    );
  }
  return list;
}

/** PUMP_SPEED_MISMATCH in words that fit an axis on a shared pump. */
function sharedSpeedMessage(d: Design): string {
  const s = d.speedsMmS;
  return `moving alone it extends at ${Math.round(s.extendActual)} mm/s (asked ${s.extendRequested}) and retracts at ${Math.round(s.retractActual)} mm/s (asked ${s.retractRequested}): the ${num(d.flowsLpm.pump)} L/min it is sized to take (the smallest pump of the series that gives its speeds) feeds both strokes. Where it shares the pump its meter-in flow control holds that flow, and can be set down to the asked speeds.`;
}
