/**
 * The one pump of a machine: the pump choice of an axis (pump-choice.ts) asked for the machine's
 * phases instead of one axis's, and what that pump does in each phase of the machine cycle.
 * For a machine of one axis every input is that axis's own, so it gets the axis's own pump.
 */
import { A } from "./assumptions";
import type { Design } from "./design";
import type { TimelinePhase } from "./machine-timeline";
import { choosePump, compensatorLeakLpm, type PhaseDemand, type PumpChoice, type PumpPhase, type PumpType } from "./pump-choice";
import { hydraulicPowerKw, pumpDeliveryLpm, requiredDisplacementCc, selectDisplacementCc } from "./pump-motor";
import { reliefSettingBar } from "./valves";

export interface MachinePump {
  choice: PumpChoice;
  demand: PhaseDemand;
  /** largest sum of flows at the asked speeds the axes moving together draw: what the pump is sized for */
  requiredLpm: number;
  requiredDisplacementCc: number;
  inSeries: boolean;
  qpLpm: number;
  speedRpm: number;
  /** double pump: the small section's delivery */
  smallLpm: number | null;
  /** the axis whose working pressure is the highest (the relief and compensator follow it) */
  governingAxis: string;
}

/** A phase's pump: its pressure, delivery and hydraulic power (p·Q/600, a dumping section included), and the shaft power. */
export interface MachinePumpPhase extends PumpPhase {
  shaftKw: number;
}

const TOL = 1e-6;

/** Phase demand of the machine: the highest pressure any axis needs in each kind of phase, the pressing flow, the relief. */
export function machinePhaseDemand(
  designs: Design[],
  timeline: TimelinePhase[],
  pumpSize: { requiredCc: number; displacementCc: number; noDouble?: boolean },
  qp: number,
  speedRpm: number,
): { demand: PhaseDemand; governing: Design } {
  const governing = designs.reduce((a, b) => (b.cylinder.workingPressureBar > a.cylinder.workingPressureBar ? b : a));
  const pressing = designs.filter((d) => d.flowsLpm.press !== undefined);
  const pressFlow = Math.max(0, ...pressing.map((d) => d.flowsLpm.press!), ...timeline.filter((p) => p.kind === "pressing").map((p) => p.sizingLpm));
  const workingBar = governing.cylinder.workingPressureBar;
  return {
    governing,
    demand: {
      approachBar: Math.max(...designs.map((d) => d.pressuresBar.extendMoving)),
      retractBar: Math.max(...designs.map((d) => d.pressuresBar.retract)),
      press: pressing.length > 0 ? { bar: Math.max(...pressing.map((d) => d.pressuresBar.extendPress)), flowLpm: pressFlow } : null,
      // 10 % over the highest working pressure (the axis rule, valves.ts): one relief protects every axis.
      reliefBar: reliefSettingBar(workingBar),
      workingBar,
      ratedBar: governing.cylinder.ratedPressureBar,
      requiredDisplacementCc: pumpSize.requiredCc,
      displacementCc: pumpSize.displacementCc,
      pumpFlowLpm: qp,
      speedRpm,
      noDouble: pumpSize.noDouble,
    },
  };
}

/**
 * Sizes the pump: displacement for the largest flow the axes moving together draw at the asked
 * speeds (Q_p ≥ max over the steps of ΣQ_i: in a pure sequence only the largest single axis
 * counts), and never less than any axis alone needs; then the type. Unasked, where an axis moving alone draws clearly less than the pump
 * delivers, a fixed or double pump would push the surplus over the relief in every such phase,
 * so a pressure-compensated pump (with a power limiter) is chosen [CP].
 */
export function chooseMachinePump(designs: Design[], timeline: TimelinePhase[], asked: PumpType | undefined): MachinePump {
  const etaV = A.volumetricEfficiency.value;
  const speedRpm = designs[0].pump.speedRpm;
  // Never less than any axis alone needs: an axis whose whole extension is a pressing stroke still
  // has its approach speed asked, and its own sizing counted it.
  const ownCc = Math.max(...designs.map((d) => d.pump.requiredDisplacementCcRev));
  const requiredLpm = Math.max(...timeline.map((p) => p.sizingLpm), pumpDeliveryLpm(ownCc, speedRpm, etaV));
  const needCc = Math.max(requiredDisplacementCc(Math.max(...timeline.map((p) => p.sizingLpm)), speedRpm, etaV), ownCc);
  const { displacementCc: catalogueCc, inSeries } = selectDisplacementCc(needCc);
  // The pump at a total displacement: its delivery, the phase demand, and the choice.
  // A double pump's sections cover the flow the axes draw at the speeds they were sized at, too.
  const drawnCc = requiredDisplacementCc(Math.max(...timeline.filter((p) => p.kind === "fast").map((p) => p.demandLpm), 0), speedRpm, etaV);
  const pumpAt = (displacementCc: number, noDouble = false) => {
    const qp = pumpDeliveryLpm(displacementCc, speedRpm, etaV);
    const { demand, governing } = machinePhaseDemand(designs, timeline, { requiredCc: Math.max(needCc, drawnCc), displacementCc, noDouble }, qp, speedRpm);
    return { qp, demand, governing, choice: choosePump(demand, asked) };
  };
  // A double pump's two catalogue sections set its delivery (as for an axis, evaluate.ts).
  let sized = pumpAt(catalogueCc);
  if (sized.choice.type === "double") {
    const totalCc = sized.choice.displacementsCcRev.reduce((a, b) => a + b, 0);
    if (Math.abs(totalCc - catalogueCc) > 1e-9) {
      const atSections = pumpAt(totalCc);
      sized = atSections.choice.type === "double" ? atSections : pumpAt(catalogueCc, true);
    }
  }
  // The surplus is judged against the delivery of the pump chosen (a double pump's sections may
  // total less than the catalogue size), so an axis that draws all of its own double pump keeps it.
  const surplus = timeline.filter((p) => p.kind === "fast" && p.demandLpm < sized.qp * (1 - A.speedTolerance.value));
  if (asked === undefined && surplus.length > 0 && sized.choice.type !== "compensated") {
    const atCatalogue = pumpAt(catalogueCc);
    const who = [...new Set(surplus.flatMap((p) => p.axes))].join(", ");
    sized = {
      ...atCatalogue,
      choice: {
        ...choosePump(atCatalogue.demand, "compensated"),
        reason: `a pressure-compensated pump with a power limiter: the axes draw different flows (${who} alone draw${surplus.length === 1 && !who.includes(",") ? "s" : ""} less than the ${Math.round(atCatalogue.qp * 10) / 10} L/min the pump must deliver when the most flow is drawn), and a fixed pump would push the surplus over the relief as heat`,
      },
    };
  }
  const { qp, demand, governing, choice } = sized;
  const smallLpm = choice.type === "double" ? pumpDeliveryLpm(choice.displacementsCcRev[1], speedRpm, etaV) : null;
  return { choice, demand, requiredLpm, requiredDisplacementCc: needCc, inSeries, qpLpm: qp, speedRpm, smallLpm, governingAxis: governing.requirements.name! };
}

const at = (bar: number, lpm: number, kw = hydraulicPowerKw(bar, lpm)): PumpPhase => ({ bar, lpm, kw });

/**
 * What the pump does in one phase of the machine cycle. With every axis it feeds drawing its
 * whole delivery it runs at the highest pressure they need; with less drawn (an axis moving
 * alone on a larger pump, its meter-in control holding its speed), a fixed pump pushes the
 * surplus over the relief, a compensated one destrokes at its setting, and a double pump drops
 * its large section once the pressure passes the unloading setting. Pressing and dwelling
 * follow the pump choice's own pressing and dwell phases (pump-choice.ts).
 */
export function pumpInPhase(ph: TimelinePhase, mp: MachinePump): MachinePumpPhase {
  const { choice, qpLpm: qp } = mp;
  const etaO = A.overallEfficiency.value;
  const full = ph.demandLpm >= qp * (1 - TOL);
  let p: PumpPhase;
  if (choice.type === "compensated") {
    const pc = choice.compensatorBar!;
    if (ph.kind === "fast" && full) p = at(ph.needBar, qp);
    else if (ph.demandLpm > 0) p = at(pc, ph.demandLpm);
    // at rest against a force: standby, delivering only its leakage; no efficiency at zero delivery
    else return { ...at(pc, compensatorLeakLpm(qp)), shaftKw: hydraulicPowerKw(pc, compensatorLeakLpm(qp)) };
  } else if (choice.type === "double") {
    const qS = mp.smallLpm!;
    const dumpKw = hydraulicPowerKw(A.unloadedDropBar.value, qp - qS);
    const belowUnloading = ph.needBar <= choice.unloadingBar! + TOL;
    if (ph.kind === "pressing" && ph.needBar <= choice.phases.press!.bar + TOL) p = choice.phases.press!;
    else if (ph.kind === "fast" && full && belowUnloading) p = at(ph.needBar, qp);
    // more than the small section and less than both: both deliver near the unloading setting
    else if (belowUnloading && ph.demandLpm > qS * (1 + TOL)) p = at(choice.unloadingBar!, qp);
    // above the unloading setting only the small section delivers, up to the relief
    else p = at(choice.reliefBar, qS, hydraulicPowerKw(choice.reliefBar, qS) + dumpKw);
  } else {
    p = ph.kind === "fast" && full ? at(ph.needBar, qp) : at(choice.reliefBar, qp);
  }
  return { ...p, shaftKw: p.kw / etaO };
}
