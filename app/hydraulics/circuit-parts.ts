/**
 * The parts of the circuit that a design adds beyond the basic power unit and valve: the valves
 * in each work line (pressing-speed control, counterbalance, leak-tight holding), the double
 * pump's unloading valve and check, the compensated pump's settings, the cooler and the
 * decompression valve. Port names as the trade marks them; every port listed is joined.
 */
import type { CircuitComponent, CircuitConnection, Design, SolenoidValvePositions } from "./design";

/** Connections carrying one kind of line, each written [from, to] ("componentId.port"), in order. */
export const connect = (line: CircuitConnection["line"], ...ends: [from: string, to: string][]): CircuitConnection[] =>
  ends.map(([from, to]) => ({ from, to, line }));

export interface CircuitPart {
  components: CircuitComponent[];
  connections: CircuitConnection[];
}

const flowOf = (d: Design, ccRev: number) => (ccRev * d.pump.speedRpm * d.pump.volumetricEfficiency) / 1000;

/**
 * The pump as the design chose it. A double pump is two sections on one shaft: "pump" is the
 * small section, which feeds the system line directly (so pump.outlet is the system line for
 * every pump type), and "pump-large" the large one, which feeds it through a check valve and is
 * dumped to tank by an unloading valve piloted from the system line once the pressing pressure
 * passes its setting (high-low circuit, common practice).
 */
export function pumpParts(d: Design): CircuitPart {
  const p = d.pump;
  if (p.type === "double" && p.displacementsCcRev.length === 2 && p.unloadingBar !== undefined) {
    const [large, small] = p.displacementsCcRev;
    return {
      components: [
        {
          id: "pump",
          kind: "pump",
          ports: ["inlet", "outlet", "shaft"],
          label: "Double pump, small section",
          values: { type: "double", section: "small", displacementCcRev: small, flowLpm: flowOf(d, small), totalFlowLpm: d.flowsLpm.pump },
        },
        {
          id: "pump-large",
          kind: "pump",
          ports: ["inlet", "outlet", "shaft"],
          label: "Double pump, large section",
          values: { type: "double", section: "large", displacementCcRev: large, flowLpm: flowOf(d, large), unloadingBar: p.unloadingBar },
        },
        {
          id: "unloading",
          kind: "unloading",
          ports: ["1", "2", "X"],
          label: "Unloading valve, externally piloted from the system line",
          values: { settingBar: p.unloadingBar, ...(p.unloadedDropBar !== undefined ? { unloadedDropBar: p.unloadedDropBar } : {}) },
        },
        { id: "pump-check", kind: "check", ports: ["inlet", "outlet"], label: "Check valve, large pump section to system" },
      ],
      connections: [
        ...connect("shaft", ["pump.shaft", "pump-large.shaft"]),
        ...connect("suction", ["strainer.outlet", "pump-large.inlet"]),
        ...connect("pressure", ["pump-large.outlet", "pump-check.inlet"], ["pump-check.outlet", "dcv.P"], ["pump-large.outlet", "unloading.1"]),
        ...connect("return", ["unloading.2", "tank.return"]),
        // the pilot senses the system line, past the check, so the small section's pressure unloads the large one
        ...connect("pilot", ["pump-check.outlet", "unloading.X"]),
      ],
    };
  }
  const values: Record<string, number | string> = { type: p.type, displacementCcRev: p.displacementCcRev, flowLpm: d.flowsLpm.pump };
  if (p.type === "compensated") {
    if (p.compensatorBar !== undefined) values.compensatorBar = p.compensatorBar;
    if (p.powerLimitKw !== undefined) values.powerLimitKw = p.powerLimitKw;
  }
  const label = p.type === "compensated" ? "Pressure-compensated variable-displacement pump" : "Fixed-displacement pump";
  return { components: [{ id: "pump", kind: "pump", ports: ["inlet", "outlet", "shaft"], label, values }], connections: [] };
}

/**
 * The two work lines from the directional valve to the cylinder, with their in-line valves.
 * Each in-line valve has port 2 towards the directional valve and 1 towards the cylinder.
 * Order from the valve: the regeneration valve (rod line, at the valve stack), the meter-in flow
 * control (cap line), the counterbalance valve, the pilot-operated check. The check sits on the cylinder port because its poppet seat is what
 * holds the load without drift: nothing that leaks (the counterbalance valve's seat, hose
 * joints) may sit between it and the cylinder. The counterbalance valve, between it and the
 * directional valve, still meters the lowering, since all the oil passes both.
 */
export function workLines(d: Design): CircuitPart {
  const components: CircuitComponent[] = [];
  const connections: CircuitConnection[] = [];
  const cb = d.counterbalance;
  const h = d.holding;
  const control = d.pressSpeedControl;
  const chain: Record<"cap" | "rod", string[]> = { cap: [], rod: [] };
  const pilots: CircuitConnection[] = [];
  /** the valve port feeding the other work line: a pilot from there opens a valve in this one */
  const opposite = (side: "cap" | "rod") => (side === "cap" ? "dcv.B" : "dcv.A");

  const regen = regenerationValve(d);
  if (regen) {
    // first in the rod line from the valve: it sits at the valve stack
    components.push(regen);
    chain.rod.push(regen.id);
    connections.push({ from: `${regen.id}.3`, to: "dcv.A", line: "work" });
  }
  if (control) {
    // Meter-in: the control sets the flow 2 → 1 into the cap end; its check lets the return out freely.
    components.push(
      {
        id: "press-flow",
        kind: "flow-control",
        ports: ["1", "2"],
        label: "Flow control, pressing speed (meter-in), pressure-compensated",
        values: { settingLpm: control.settingLpm, compensated: "yes" },
      },
      {
        id: "press-bypass",
        kind: "bypass",
        ports: ["1", "2"],
        label: "Bypass valve, 2/2 solenoid, normally closed",
        values: { normally: "closed", energised: "during the approach" },
      },
    );
    chain.cap.push("press-flow");
    connections.push({ from: "press-flow.2", to: "press-bypass.2", line: "work" }, { from: "press-flow.1", to: "press-bypass.1", line: "work" });
  }
  if (cb) {
    components.push({
      id: "cbv",
      kind: "cbv",
      ports: ["1", "2", "3"],
      label: "Counterbalance valve",
      values: { side: cb.side, settingBar: cb.settingBar, pilotRatio: cb.pilotRatio },
    });
    chain[cb.side].push("cbv");
    // pilot 3 to the opposite work line
    pilots.push({ from: opposite(cb.side), to: "cbv.3", line: "pilot" });
  }
  if (h) {
    for (const side of h.side === "both" ? (["cap", "rod"] as const) : [h.side]) {
      const id = `poc-${side}`;
      components.push({
        id,
        kind: "poc",
        ports: ["1", "2", "X"],
        label: `Pilot-operated check valve, ${side} port`,
        values: { side, pilotRatio: h.pilotRatio, pilotOpeningBar: h.pilotOpeningBar },
      });
      chain[side].push(id);
      // pilot X from the opposite work line: pressure there, to move the rod, opens this port's check
      pilots.push({ from: opposite(side), to: `${id}.X`, line: "pilot" });
    }
  }
  // The cap line first, then the rod line, as a reader follows the extension.
  const lines = (["cap", "rod"] as const).flatMap((side) => {
    const ends = [side === "cap" ? "dcv.A" : "dcv.B", ...chain[side].flatMap((id) => [`${id}.2`, `${id}.1`]), `cylinder.${side}`];
    const line: CircuitConnection[] = [];
    for (let i = 0; i < ends.length; i += 2) line.push({ from: ends[i], to: ends[i + 1], line: "work" });
    return line;
  });
  return { components, connections: [...lines, ...connections, ...pilots] };
}

/**
 * Regeneration valve, a 3/2 solenoid valve with spring return in the rod line at the valve stack
 * (textbook regenerative circuit with a separate regeneration valve). Ports:
 * - 1 to the cylinder's rod port,
 * - 2 to the directional valve's port B,
 * - 3 to the cap work line (joined to port A).
 * De-energised it joins 1 to 2 and blocks 3: the rod line works as if the valve were not there.
 * Energised (the regenerative approach) it joins 1 to 3 and blocks 2, so the rod end's outflow
 * joins the pump flow into the cap end instead of reaching tank through B (which the
 * directional valve joins to T while it extends).
 */
export const regenerationValvePositions = (): SolenoidValvePositions => ({ normal: [["1", "2"]], energised: [["1", "3"]] });

function regenerationValve(d: Design): CircuitComponent | null {
  const rg = d.regeneration;
  if (!rg) return null;
  return {
    id: "regen",
    kind: "regen",
    ports: ["1", "2", "3"],
    label: "Regeneration valve, 3/2 solenoid, spring return, in the rod line",
    positions: regenerationValvePositions(),
    values: {
      normally: "rod port to B",
      endsBy: rg.endsBy,
      energised:
        rg.endsBy === "pressure-switch"
          ? "during the approach, until the pressure switch trips"
          : rg.endsBy === "limit-switch"
            ? "during the approach, until the limit switch where the pressing stroke starts"
            : "with solenoid a, for the whole extension",
      capInflowLpm: rg.capInflowLpm,
      rodOutflowLpm: rg.rodOutflowLpm,
      ...(rg.switchBar !== null ? { switchBar: rg.switchBar } : {}),
      coilVoltage: d.directionalValve.coilVoltage,
    },
  };
}

/**
 * The switches the control needs, one component for each billed switch, with the bill's key as
 * its id. The pressure switch is drawn on the line it senses, the cap line (joined at valve port
 * A, where the rod end's oil joins it), as ISO 1219-1 draws a pressure switch. A limit switch is
 * worked by the rod, not by the oil, so it has no port: a fluid-power diagram marks it at the
 * cylinder, at the point of the stroke where it is worked (common practice).
 */
export function switchParts(d: Design): CircuitPart {
  const rg = d.regeneration;
  const components: CircuitComponent[] = [];
  const connections: CircuitConnection[] = [];
  const byLimit = rg?.endsBy === "limit-switch";
  const beforeEndMm = d.requirements.pressStrokeMm;
  if (d.pressSpeedControl) {
    components.push({
      id: "press-limit-switch",
      kind: "limit-switch",
      ports: [],
      label: "Limit switch, start of the pressing stroke",
      values: { beforeEndMm, switchesOff: byLimit ? "press-bypass, regen" : "press-bypass" },
    });
  } else if (byLimit) {
    components.push({
      id: "regeneration-limit-switch",
      kind: "limit-switch",
      ports: [],
      label: "Limit switch, end of the regenerative approach",
      values: { beforeEndMm, switchesOff: "regen" },
    });
  }
  if (rg && rg.switchBar !== null) {
    components.push({
      id: "regeneration-pressure-switch",
      kind: "pressure-switch",
      ports: ["port"],
      label: "Pressure switch on the cap line, ends the regenerative approach",
      values: { settingBar: rg.switchBar, switchesOff: "regen", latched: "until the return stroke" },
    });
    connections.push({ from: "dcv.A", to: "regeneration-pressure-switch.port", line: "work" });
  }
  return { components, connections };
}

/** Return line: the filter, then the cooler where the tank cannot shed the heat, then the tank. */
export function returnLine(d: Design): CircuitPart {
  if (!d.cooler) return { components: [], connections: [{ from: "filter.outlet", to: "tank.return", line: "return" }] };
  return {
    components: [
      { id: "cooler", kind: "cooler", ports: ["inlet", "outlet"], label: "Oil cooler (air blast), in the return line", values: { kw: d.cooler.kw } },
    ],
    connections: [...connect("return", ["filter.outlet", "cooler.inlet"], ["cooler.outlet", "tank.return"])],
  };
}

/**
 * Decompression: a valve that lets the cap end's compressed oil out to tank through an orifice
 * before the return stroke. Joined to the cylinder's cap port itself, so a check valve holding
 * the cap end cannot trap the pressure it must release.
 */
export function decompressionParts(d: Design): CircuitPart {
  if (!d.decompression.needed) return { components: [], connections: [] };
  return {
    components: [
      {
        id: "decompression",
        kind: "decompression",
        ports: ["1", "2"],
        label: "Decompression valve for the cap line",
        values: { releaseCm3: d.decompression.releaseCm3, pressureBar: d.decompression.pressureBar },
      },
    ],
    connections: [
      { from: "cylinder.cap", to: "decompression.1", line: "work" },
      { from: "decompression.2", to: "tank.return", line: "return" },
    ],
  };
}
