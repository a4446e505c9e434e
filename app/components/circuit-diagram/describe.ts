import type { Circuit, CircuitComponent, DcvCenter, PortPair } from "~/hydraulics/design";
import type { MachineCircuit } from "~/hydraulics/machine-design";
import type { DisplayUnits } from "./format";
import { axesOf, pLineControls, pLineParts, pLineReducers, subCircuit } from "./machine-layout";
import { blockedPorts } from "./valve-positions";

/** Trade names of the centre conditions, for captions, the description and the panels. */
export const CENTRE_NAMES: Record<DcvCenter, string> = {
  float: "float centre",
  closed: "closed centre",
  tandem: "tandem centre",
  open: "open centre",
};

export const centreName = (center: unknown) =>
  typeof center === "string" && center in CENTRE_NAMES ? CENTRE_NAMES[center as DcvCenter] : `${String(center)} centre`;

export function numberValue(c: CircuitComponent | undefined, key: string): number | undefined {
  const v = c?.values?.[key];
  return typeof v === "number" && Number.isFinite(v) ? v : undefined;
}

export function textValue(c: CircuitComponent | undefined, key: string): string | undefined {
  const v = c?.values?.[key];
  return v === undefined ? undefined : String(v);
}

const find = (circuit: Circuit, kind: CircuitComponent["kind"]) => circuit.components.find((c) => c.kind === kind);

/** Joins only the parts that exist, so a missing value never prints "undefined". */
const phrase = (...parts: (string | false | undefined)[]) => parts.filter(Boolean).join(" ");

export function circuitTitle(circuit: Circuit): string {
  const dcv = find(circuit, "dcv");
  const cbv = find(circuit, "cbv");
  return phrase(
    "Preliminary hydraulic circuit:",
    dcv ? `${centreName(textValue(dcv, "center"))} 4/3 valve` : "no directional valve",
    cbv ? "with a counterbalance valve" : "without a counterbalance valve",
  );
}

/** One sentence per component, in the order a reader follows the oil from the tank. */
export function circuitDescription(circuit: Circuit, u: DisplayUnits): string {
  const get = (kind: CircuitComponent["kind"]) => find(circuit, kind);
  const motor = get("motor");
  const relief = get("relief");
  const vent = get("vent");
  const dcv = get("dcv");
  const cbv = get("cbv");
  const cylinder = get("cylinder");
  const filter = get("filter");
  const gauge = get("gauge");
  const tank = get("tank");
  const n = (c: CircuitComponent | undefined, key: string, fmt: (x: number) => string) => {
    const v = numberValue(c, key);
    return v === undefined ? undefined : fmt(v);
  };
  const side = textValue(cbv, "side");
  const drive =
    motor &&
    phrase(
      "driven by an electric motor",
      n(motor, "ratedKw", (k) => `rated ${u.motorRating(k)}`),
    );
  const sentences = [
    tank && phrase("Reservoir", n(tank, "volumeL", u.volume), get("strainer") && "with a suction strainer", "feeds the pump"),
    ...pumpSentences(circuit, u, drive),

    relief &&
      phrase(
        "Relief valve",
        n(relief, "settingBar", (p) => `set to ${u.pressure(p)}`),
        "protects the pump line and returns to tank",
      ),
    vent &&
      [
        phrase(
          "Normally open 2/2 solenoid vent valve on the relief's vent port X",
          n(vent, "ventPressureBar", (p) => `vents the relief to tank in neutral, so the pump circulates at ${u.pressure(p)}`),
        ),
        phrase("it is energised with solenoid a or b", textValue(vent, "coilVoltage") && `(${textValue(vent, "coilVoltage")} coil)`),
      ].join("; "),
    gauge &&
      phrase(
        "Pressure gauge",
        n(gauge, "rangeBar", (r) => `0 to ${u.pressure(r)}`),
        "on the pump line",
      ),
    ...accumulatorSentences(circuit, u),
    dcv &&
      phrase(
        `${capitalise(centreName(textValue(dcv, "center")))} 4/3 solenoid directional valve`,
        textValue(dcv, "iso4401Size") && `ISO 4401-${textValue(dcv, "iso4401Size")}`,
        `with spring centring: solenoid a joins ${joins(circuit.dcvPositions.left)}, solenoid b joins ${joins(circuit.dcvPositions.right)}`,
      ),
    dcv && centreSentence(circuit),
    cbv &&
      phrase(
        "Counterbalance valve",
        side && `on the ${side} side`,
        n(cbv, "settingBar", (p) => `set to ${u.pressure(p)}`),
        n(cbv, "pilotRatio", (r) => `with pilot ratio ${r}:1`),
        "and an integral check for free flow to the cylinder; its pilot port 3 is joined to the opposite work line",
      ),
    ...workLineSentences(circuit, u),
    cylinder &&
      [
        "Double-acting cylinder",
        [
          n(cylinder, "boreMm", (d) => `bore ${u.length(d)}`),
          n(cylinder, "rodMm", (d) => `rod ${u.length(d)}`),
          n(cylinder, "strokeMm", (d) => `stroke ${u.length(d)}`),
        ]
          .filter(Boolean)
          .join(", "),
      ]
        .filter(Boolean)
        .join(": "),
    get("decompression") &&
      phrase(
        "Decompression valve, a normally closed 2/2 solenoid valve with an orifice, joined to the cap port: it lets",
        n(get("decompression"), "releaseCm3", (v) => `about ${u.smallVolume(v)} of`),
        "compressed oil out to tank before the return stroke",
      ),
    filter &&
      phrase(
        "Return filter",
        n(filter, "ratedFlowLpm", (q) => `rated for ${u.flow(q)}`),
        // a machine's power unit (no valve of its own) takes every valve's T
        `between ${dcv ? "valve port T" : "the valves' T ports"} and ${get("cooler") ? "the oil cooler" : "the tank"}`,
      ),
    get("cooler") &&
      phrase(
        "Oil cooler after the return filter",
        n(get("cooler"), "kw", (k) => `sheds ${u.power(Math.ceil(k * 10) / 10)}`),
        "before the oil reaches the tank",
      ),
  ];
  return sentences
    .filter(Boolean)
    .map((s) => `${s}.`)
    .join(" ");
}

/**
 * A machine's accumulator charging circuit (kinds only a machine's power unit has): the charging
 * valve with its check, the accumulator, and the safety block that vents it when the unit stops.
 */
function accumulatorSentences(circuit: Circuit, u: DisplayUnits): (string | undefined)[] {
  const accumulator = find(circuit, "accumulator");
  if (!accumulator) return [];
  const charging = circuit.components.find((c) => c.kind === "unloading" && numberValue(c, "cutOutBar") !== undefined);
  const block = find(circuit, "accumulator-block");
  const bar = (c: CircuitComponent | undefined, key: string) => {
    const v = numberValue(c, key);
    return v === undefined ? undefined : u.pressure(v);
  };
  return [
    charging &&
      phrase(
        "Accumulator charging valve on the pump line, piloted from the accumulator line: it unloads the pump to tank",
        bar(charging, "cutOutBar") ? `once the accumulator is charged to ${bar(charging, "cutOutBar")}` : "once the accumulator is charged",
        bar(charging, "cutInBar") ? `and loads it again when the pressure falls to ${bar(charging, "cutInBar")}` : "and loads it again as the pressure falls",
        find(circuit, "check") && "; a check valve after the pump keeps the accumulator's oil from flowing back while the pump is unloaded",
      ).replace(" ;", ";"),
    phrase(
      "Bladder accumulator",
      numberValue(accumulator, "nominalL") !== undefined && `of ${u.volume(numberValue(accumulator, "nominalL")!)}`,
      bar(accumulator, "prechargeBar") && `with a gas precharge of ${bar(accumulator, "prechargeBar")}`,
      "on the accumulator line: it gives the valves oil through the cycle's flow peaks and is charged again between them",
    ),
    block &&
      phrase(
        "Accumulator safety and shut-off block between the accumulator line and the accumulator: a shut-off valve, a gauge port,",
        bar(block, "safetyBar") ? `a safety relief valve set to ${bar(block, "safetyBar")}` : "a safety relief valve",
        "and a normally open 2/2 solenoid discharge valve that vents the accumulator to tank whenever the power unit is switched off",
      ),
  ];
}

const joins = (pairs: PortPair[]) => (pairs.length ? pairs.map(([a, b]) => `${a} to ${b}`).join(" and ") : "no ports");

function centreSentence(circuit: Circuit): string {
  const pairs = circuit.dcvPositions.center;
  const blocked = blockedPorts(pairs);
  const joined = pairs.length ? `In neutral it joins ${joins(pairs)}` : "In neutral it joins no ports";
  return `${joined}${blocked.length ? `; ${blocked.join(" and ")} ${blocked.length > 1 ? "are" : "is"} blocked` : ""}`;
}

const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** The pump as the data gives it: fixed, pressure-compensated, or a double pump with its unloading valve and check. */
function pumpSentences(circuit: Circuit, u: DisplayUnits, drive: string | undefined): (string | undefined)[] {
  const pumps = circuit.components.filter((c) => c.kind === "pump");
  const pump = pumps.find((c) => textValue(c, "section") !== "large");
  if (!pump) return [];
  const n = (c: CircuitComponent | undefined, key: string, fmt: (x: number) => string) => {
    const v = numberValue(c, key);
    return v === undefined ? undefined : fmt(v);
  };
  const type = textValue(pump, "type");
  if (type === "double") {
    const large = pumps.find((c) => textValue(c, "section") === "large");
    const unloading = find(circuit, "unloading");
    return [
      phrase(
        "Double (high-low) pump, two sections on one shaft:",
        n(large, "displacementCcRev", (v) => `a large section of ${u.displacement(v)}`),
        n(pump, "displacementCcRev", (v) => `and a small section of ${u.displacement(v)}`),
        n(pump, "totalFlowLpm", (q) => `delivering ${u.flow(q)} together`),
        drive && `, ${drive}`,
      ).replace(" ,", ","),
      phrase(
        "The small section feeds the system line directly; the large one feeds it through a check valve that lets oil pass only from the large section into the system line",
        unloading &&
          phrase(
            "and is dumped to tank by an unloading valve, piloted from the system line,",
            n(unloading, "settingBar", (p) => `once the system pressure passes ${u.pressure(p)}`),
          ),
      ),
    ];
  }
  if (type === "compensated") {
    return [
      phrase(
        "Pressure-compensated variable-displacement pump",
        n(pump, "displacementCcRev", u.displacement),
        n(pump, "flowLpm", (q) => `delivering up to ${u.flow(q)}`),
        drive && `, ${drive}`,
      ).replace(" ,", ","),
      phrase(
        "Its compensator, piloted from the pump's own outlet,",
        n(pump, "compensatorBar", (p) => `reduces the delivery as the pressure nears ${u.pressure(p)}`) ??
          "reduces the delivery as the pressure nears its setting",
        n(pump, "powerLimitKw", (k) => `and a power limiter holds the drive to ${u.power(k)}`),
      ),
    ];
  }
  return [
    phrase(
      "Fixed-displacement pump",
      n(pump, "displacementCcRev", u.displacement),
      n(pump, "flowLpm", (q) => `delivering ${u.flow(q)}`),
      drive,
    ),
  ];
}

/** The valves between the directional valve and the cylinder other than the counterbalance valve. */
function workLineSentences(circuit: Circuit, u: DisplayUnits): (string | false | undefined)[] {
  const of = (kind: CircuitComponent["kind"]) => circuit.components.filter((c) => c.kind === kind);
  const control = find(circuit, "flow-control");
  const bypass = find(circuit, "bypass");
  const regen = find(circuit, "regen");
  const pocs = of("poc");
  const ratio = numberValue(pocs[0], "pilotRatio");
  return [
    control &&
      phrase(
        textValue(control, "compensated") === "yes" ? "Pressure-compensated meter-in flow control in the cap line" : "Meter-in flow control in the cap line",
        numberValue(control, "settingLpm") !== undefined && `sets the pressing speed at ${u.flow(numberValue(control, "settingLpm")!)}`,
        "and lets the return pass freely through its check",
        bypass && `; a normally ${textValue(bypass, "normally") === "open" ? "open" : "closed"} 2/2 solenoid valve across it is open for the approach`,
      ).replace(" ;", ";"),
    pocs.length > 0 &&
      phrase(
        pocs.length > 1
          ? "Pilot-operated check valves on the cap and rod ports"
          : `Pilot-operated check valve on the ${textValue(pocs[0], "side") ?? "cylinder"} port`,
        "hold the load leak-tight: oil flows freely from the valve side (2) to the cylinder (1), and back only when pressure at pilot port X, joined to the opposite work line, opens",
        pocs.length > 1 ? "them" : "it",
        ratio !== undefined && `(pilot ratio ${ratio}:1)`,
      ).replace(/^(Pilot-operated check valve on the \w+ port) hold/, "$1 holds"),
    regen && regenSentence(regen),
    ...switchSentences(circuit, u),
  ];
}

/** What each port of the regeneration valve is joined to (circuit-parts.ts names them so). */
const REGEN_PORTS: Record<string, string> = { "1": "the cylinder's rod port (1)", "2": "valve port B (2)", "3": "the cap line (3)" };

/** The 3/2 regeneration valve, its two positions read from the data. */
function regenSentence(regen: CircuitComponent): string | undefined {
  const p = regen.positions;
  if (!p) return undefined;
  const say = (pairs: PortPair[]) => {
    const joined = new Set(pairs.flat());
    const blocked = regen.ports.filter((x) => !joined.has(x)).map((x) => REGEN_PORTS[x] ?? x);
    const joins = pairs.map(([a, b]) => `${REGEN_PORTS[a] ?? a} to ${REGEN_PORTS[b] ?? b}`).join(" and ");
    return `joins ${joins || "no ports"}${blocked.length ? ` and blocks ${blocked.join(" and ")}` : ""}`;
  };
  return phrase(
    "3/2 solenoid regeneration valve in the rod line at the valve stack: de-energised it",
    `${say(p.normal)};`,
    "energised during the approach it",
    say(p.energised),
    ", so the rod end's oil joins the pump flow into the cap end instead of going to tank",
  ).replace(" ,", ",");
}

/** The switches the control reads: a pressure switch on the line it senses, a limit switch at the cylinder. */
function switchSentences(circuit: Circuit, u: DisplayUnits): (string | undefined)[] {
  return circuit.components.map((c) => {
    const off = (textValue(c, "switchesOff") ?? "").split(",").map((x) => x.trim());
    const acts = [off.includes("press-bypass") && "closes the bypass valve", off.includes("regen") && "de-energises the regeneration valve"]
      .filter(Boolean)
      .join(" and ");
    if (c.kind === "pressure-switch") {
      return phrase(
        "Pressure switch on the cap line",
        numberValue(c, "settingBar") !== undefined && `set to ${u.pressure(numberValue(c, "settingBar")!)}`,
        acts && `: it ${acts} as the tool meets the work, so the force is built on the full area`,
      ).replace(" :", ":");
    }
    if (c.kind === "limit-switch") {
      return phrase(
        "Limit switch at the cylinder",
        numberValue(c, "beforeEndMm") !== undefined && `${u.length(numberValue(c, "beforeEndMm")!)} before the end of the extension`,
        acts && `: there it ${acts}, where pressing begins`,
      ).replace(" :", ":");
    }
    return undefined;
  });
}

const list = (names: string[]) => (names.length > 1 ? `${names.slice(0, -1).join(", ")} and ${names.at(-1)}` : (names[0] ?? ""));

export function machineCircuitTitle(circuit: MachineCircuit): string {
  const axes = axesOf(circuit);
  return `Preliminary hydraulic circuit of a machine of ${axes.length} ${axes.length === 1 ? "axis" : "axes"} (${list(axes)}) on one power unit`;
}

/**
 * The machine by axis: the power unit once, how every valve joins the common pressure and tank
 * lines, then each axis's own valve, load holding and cylinder as an axis alone is described.
 */
export function machineCircuitDescription(circuit: MachineCircuit, u: DisplayUnits): string {
  const controls = pLineControls(circuit);
  const reducers = pLineReducers(circuit);
  const pLineIds = new Set([...pLineParts(circuit).values()].flat().map((c) => c.id));
  const axes = axesOf(circuit);
  const unit = circuitDescription(subCircuit(circuit, undefined), u);
  const rails = `The directional valves of ${list(axes)} each take P from the common pressure line and return T to the common tank line, through the return filter.`;
  const perAxis = axes.map((axis) => {
    const own = subCircuit(circuit, axis, pLineIds);
    const dcv = own.components.find((c) => c.kind === "dcv");
    const control = dcv && controls.get(dcv.id);
    const share =
      control &&
      phrase(
        textValue(control, "compensated") === "yes" ? "A pressure-compensated meter-in flow control in its P line" : "A meter-in flow control in its P line",
        numberValue(control, "settingLpm") !== undefined && `passes ${u.flow(numberValue(control, "settingLpm")!)}`,
        "so the axis keeps its own speed on the shared pump",
      );
    const reducer = dcv && reducers.get(dcv.id);
    const reduced = reducer && reducingSentence(reducer, u);
    return `Axis ${axis}: ${circuitDescription(own, u)}${share ? ` ${share}.` : ""}${reduced ? ` ${reduced}.` : ""}`;
  });
  return [unit, rails, ...perAxis].join(" ");
}

/** An axis's reducing valve: the pressure its valve gets, and why (its cylinder's rating under the relief). */
function reducingSentence(reducer: CircuitComponent, u: DisplayUnits): string {
  const at = (key: string) => {
    const bar = numberValue(reducer, key);
    return bar === undefined ? undefined : u.pressure(bar);
  };
  const [setting, rated, relief] = [at("settingBar"), at("cylinderRatedBar"), at("reliefBar")];
  return phrase(
    "A pressure-reducing valve in its P line, piloted from its outlet, drained to tank and with a check for the free return,",
    setting ? `reduces the pressure to this axis's valve to ${setting}` : "reduces the pressure to this axis's valve",
    rated && relief && `, so its ${rated} cylinder never sees the ${relief} relief`,
  ).replace(" ,", ",");
}
