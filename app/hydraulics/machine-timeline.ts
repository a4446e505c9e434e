/**
 * The machine cycle before the pump is known: each step of the sequence cut into phases at
 * every moment one of its axes changes what it does (starts pressing, dwells, stops), with the
 * flow the moving axes draw together and the highest pressure any of them needs. Each axis's
 * motion comes from its own cycle (cycle.ts), so an axis does in the machine what it does alone.
 */
import type { CyclePhaseName } from "./cycle";
import type { Design } from "./design";
import type { MachineMotion } from "./machine-requirements";
import { phaseFlowLpm } from "./phases";

export type MachinePhaseName = CyclePhaseName | "together";
/** What the pump must do in a phase: feed motion, hold a pressing stroke, or hold force at rest. */
export type PhaseKind = "fast" | "pressing" | "dwell";

/** One axis's part in a phase. */
export interface AxisSegment {
  axis: string;
  phase: CyclePhaseName;
  durationS: number;
  /** cylinder flow drawn from the pump in the machine */
  drawLpm: number;
  /** the same at the asked speed: what the pump is sized for */
  sizingLpm: number;
  /** pump pressure the axis needs (its own lines and valves included) */
  needBar: number;
  /** flow back to tank through the axis's valve */
  returnLpm: number;
  /** work done on the load, kW (negative while an overrunning load is lowered) */
  usefulKw: number;
  /** heat the axis alone makes in this phase on its own pump (its steady-speed heat balance) */
  aloneLossKw: number;
  moving: boolean;
}

export interface TimelinePhase {
  step: number;
  phase: MachinePhaseName;
  kind: PhaseKind;
  durationS: number;
  /** every axis taking part (moving, pressing or dwelling) */
  segments: AxisSegment[];
  axes: string[];
  demandLpm: number;
  sizingLpm: number;
  needBar: number;
  returnLpm: number;
}

const EPS = 1e-9;

/**
 * The segments of one motion of an axis, from its own cycle. `shared`: other axes move in the
 * same step, so the axis runs at the speed asked (its meter-in control holds it there) rather
 * than the speed its own pump would give it; the stroke then lasts s / v_asked.
 */
export function axisSegments(d: Design, motion: MachineMotion["motion"], shared: boolean): AxisSegment[] {
  const name = d.requirements.name!;
  const step = motion === "extend" ? 0 : 1;
  const c = d.cylinder;
  const s = d.speedsMmS;
  // Regenerating, the pump fills only the rod's displacement during the approach (continuity), A_rod·v as evaluate.ts.
  const approachAskedLpm = d.regenerative ? phaseFlowLpm(d.regeneration?.rodAreaMm2 ?? c.capAreaMm2 - c.annulusAreaMm2, s.extendRequested) : d.flowsLpm.extend;
  const phi = c.areaRatio;
  return (d.cycle ?? [])
    .filter((ph) => ph.step === step)
    .map((ph): AxisSegment => {
      const p = ph.phase;
      const fast = p === "approach" || p === "extend" || p === "retract";
      const askedMmS = p === "retract" ? s.retractRequested : s.extendRequested;
      const actualMmS = p === "retract" ? s.retractActual : s.extendActual;
      const sizingLpm = p === "retract" ? d.flowsLpm.retract : p === "pressing" ? d.flowsLpm.press! : p === "dwell" ? 0 : approachAskedLpm;
      const slow = shared && fast;
      const drawLpm = slow ? sizingLpm : ph.demandLpm;
      const speedMmS = fast ? (slow ? askedMmS : actualMmS) : p === "pressing" ? d.requirements.pressSpeedMmS! : 0;
      const forceN = p === "retract" ? d.loads.retractSteadyN : p === "pressing" ? d.loads.extendPressN : d.loads.extendSteadyN;
      const needBar = p === "retract" ? d.pressuresBar.retract : p === "approach" || p === "extend" ? d.pressuresBar.extendMoving : d.pressuresBar.extendPress;
      // Retracting, the cap end returns φ·Q; extending, the rod end Q/φ (a regenerative approach sends it to the cap end).
      const returnLpm = p === "retract" ? drawLpm * phi : p === "dwell" || (d.regenerative && p !== "pressing") ? 0 : ph.demandLpm === 0 ? 0 : drawLpm / phi;
      const aloneLossKw =
        p === "retract" ? d.heat.retractLossKw : p === "pressing" ? d.heat.pressLossKw : p === "dwell" ? d.heat.dwellLossKw : d.heat.extendLossKw;
      return {
        axis: name,
        phase: p,
        durationS: slow ? (ph.durationS * actualMmS) / askedMmS : ph.durationS,
        drawLpm,
        sizingLpm,
        needBar,
        returnLpm,
        usefulKw: (forceN * speedMmS) / 1e6,
        aloneLossKw,
        moving: p !== "dwell",
      };
    });
}

/** One step: every axis's segments laid side by side from the step's start, cut where any changes. */
export function stepPhases(step: number, motions: MachineMotion[], designs: Map<string, Design>): TimelinePhase[] {
  const shared = motions.length > 1;
  const tracks = motions.map((m) => axisSegments(designs.get(m.axis)!, m.motion, shared));
  // One axis alone: its own phases as they are (no cutting, so even the shortest dwell stays).
  if (!shared) return tracks[0].map((seg) => phaseOf(step, [seg], seg.durationS));
  const cuts = new Set<number>([0]);
  for (const track of tracks) {
    let t = 0;
    for (const seg of track) cuts.add((t += seg.durationS));
  }
  const times = [...cuts].sort((a, b) => a - b);
  const phases: TimelinePhase[] = [];
  for (let i = 0; i + 1 < times.length; i++) {
    const [t0, t1] = [times[i], times[i + 1]];
    if (t1 - t0 <= EPS) continue;
    const mid = (t0 + t1) / 2;
    const segments = tracks.flatMap((track) => {
      let t = 0;
      for (const seg of track) {
        if (mid < t + seg.durationS) return [seg];
        t += seg.durationS;
      }
      return [];
    });
    if (segments.length > 0) phases.push(phaseOf(step, segments, t1 - t0));
  }
  return phases;
}

/** A phase from what each axis taking part does in it. */
function phaseOf(step: number, segments: AxisSegment[], durationS: number): TimelinePhase {
  const moving = segments.filter((s) => s.moving);
  const names = new Set(segments.map((s) => s.phase));
  return {
    step,
    phase: names.size === 1 ? segments[0].phase : "together",
    kind: segments.some((s) => s.phase === "pressing") ? "pressing" : segments.some((s) => s.phase === "dwell") ? "dwell" : "fast",
    durationS,
    segments,
    axes: moving.map((s) => s.axis),
    demandLpm: moving.reduce((sum, s) => sum + s.drawLpm, 0),
    sizingLpm: moving.reduce((sum, s) => sum + s.sizingLpm, 0),
    needBar: Math.max(...segments.map((s) => s.needBar)),
    returnLpm: segments.reduce((sum, s) => sum + s.returnLpm, 0),
  };
}

/** The whole cycle, step after step, in time order. */
export function machineTimeline(sequence: MachineMotion[][], designs: Map<string, Design>): TimelinePhase[] {
  return sequence.flatMap((motions, k) => stepPhases(k, motions, designs));
}
