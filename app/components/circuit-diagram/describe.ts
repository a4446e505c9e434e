import type { Circuit, CircuitComponent, DcvCenter, PortPair } from "~/hydraulics/design";
import type { DisplayUnits } from "./format";
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
  const pump = get("pump");
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
  const sentences = [
    tank && phrase("Reservoir", n(tank, "volumeL", u.volume), get("strainer") && "with a suction strainer", "feeds the pump"),
    pump && phrase(
      "Fixed-displacement pump",
      n(pump, "displacementCcRev", u.displacement),
      n(pump, "flowLpm", (q) => `delivering ${u.flow(q)}`),
      motor && phrase("driven by an electric motor", n(motor, "ratedKw", (k) => `rated ${u.power(k)}`)),
    ),
    relief && phrase("Relief valve", n(relief, "settingBar", (p) => `set to ${u.pressure(p)}`), "protects the pump line and returns to tank"),
    vent && [
      phrase(
        "Normally open 2/2 solenoid vent valve on the relief's vent port X",
        n(vent, "ventPressureBar", (p) => `vents the relief to tank in neutral, so the pump circulates at ${u.pressure(p)}`),
      ),
      phrase("it is energised with solenoid a or b", textValue(vent, "coilVoltage") && `(${textValue(vent, "coilVoltage")} coil)`),
    ].join("; "),
    gauge && phrase("Pressure gauge", n(gauge, "rangeBar", (r) => `0 to ${u.pressure(r)}`), "on the pump line"),
    dcv && phrase(
      `${capitalise(centreName(textValue(dcv, "center")))} 4/3 solenoid directional valve`,
      textValue(dcv, "iso4401Size") && `ISO 4401-${textValue(dcv, "iso4401Size")}`,
      `with spring centring: solenoid a joins ${joins(circuit.dcvPositions.left)}, solenoid b joins ${joins(circuit.dcvPositions.right)}`,
    ),
    dcv && centreSentence(circuit),
    cbv && phrase(
      "Counterbalance valve",
      side && `on the ${side} side`,
      n(cbv, "settingBar", (p) => `set to ${u.pressure(p)}`),
      n(cbv, "pilotRatio", (r) => `with pilot ratio ${r}:1`),
      "and an integral check for free flow to the cylinder; its pilot port 3 is joined to the opposite work line",
    ),
    cylinder && ["Double-acting cylinder", [
      n(cylinder, "boreMm", (d) => `bore ${u.length(d)}`),
      n(cylinder, "rodMm", (d) => `rod ${u.length(d)}`),
      n(cylinder, "strokeMm", (d) => `stroke ${u.length(d)}`),
    ].filter(Boolean).join(", ")].filter(Boolean).join(": "),
    filter && phrase("Return filter", n(filter, "ratedFlowLpm", (q) => `rated for ${u.flow(q)}`), "between valve port T and the tank"),
  ];
  return sentences.filter(Boolean).map((s) => `${s}.`).join(" ");
}

const joins = (pairs: PortPair[]) => (pairs.length ? pairs.map(([a, b]) => `${a} to ${b}`).join(" and ") : "no ports");

function centreSentence(circuit: Circuit): string {
  const pairs = circuit.dcvPositions.center;
  const blocked = blockedPorts(pairs);
  const joined = pairs.length ? `In neutral it joins ${joins(pairs)}` : "In neutral it joins no ports";
  return `${joined}${blocked.length ? `; ${blocked.join(" and ")} ${blocked.length > 1 ? "are" : "is"} blocked` : ""}`;
}

const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
