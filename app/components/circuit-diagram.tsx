import { useId } from "react";
import type { Circuit, CircuitComponent, CircuitConnection, DcvPositions, Design } from "~/hydraulics/design";
import type { MachineCircuit } from "~/hydraulics/machine-design";
import type { UnitSystem } from "~/units/systems";
import {
  centreName,
  circuitDescription,
  circuitTitle,
  machineCircuitDescription,
  machineCircuitTitle,
  numberValue,
  textValue,
} from "./circuit-diagram/describe";
import { displayUnits, type DisplayUnits } from "./circuit-diagram/format";
import {
  BOX,
  CBV_HALF_W,
  DECOMPRESSION_STUB,
  DIAMOND,
  FC_HALF_W,
  GAUGE_R,
  MOTOR_R,
  POC_HALF_W,
  PUMP_R,
  REDUCING_CHECK_DX,
  REGEN_BOX,
  RELIEF_BOX,
  SWITCH_HALF,
  TANK_H,
  UNLOADING_STUB,
  VENT_BOX,
  layoutCircuit,
  type Layout,
} from "./circuit-diagram/layout";
import { ACC_W, BLOCK_H, BLOCK_W } from "./circuit-diagram/accumulator-layout";
import { isMachineCircuit, layoutMachine, pLineControls, type MachineColumn } from "./circuit-diagram/machine-layout";
import { junctions, meetings, pathData, routeConnections, type Route } from "./circuit-diagram/routes";
import {
  AccumulatorBlockSymbol,
  AccumulatorSymbol,
  COMPENSATOR_W,
  Caption,
  CbvSymbol,
  CheckSymbol,
  CoolerSymbol,
  CylinderSymbol,
  DASH,
  DcvSymbol,
  DecompressionSymbol,
  FilterSymbol,
  FlowControlSymbol,
  GaugeSymbol,
  LimitSwitchSymbol,
  MotorSymbol,
  PocSymbol,
  PortLabel,
  PressureSwitchSymbol,
  PumpSymbol,
  ReducingValveSymbol,
  RegenValveSymbol,
  ReliefSymbol,
  STROKE,
  SolenoidValve22,
  TankSymbol,
  UnloadingSymbol,
  VentValveSymbol,
} from "./circuit-diagram/symbols";

/** What the diagram draws: an axis's design (or its circuit), or a machine's circuit. */
export type DiagramSubject = { design: Design; circuit?: undefined } | { circuit: Circuit | MachineCircuit; design?: undefined };
export type CircuitDiagramProps = { units?: UnitSystem; className?: string } & DiagramSubject;

/** The drawing's width in its own units, so a viewer can zoom it to scale. */
export function diagramWidth(circuit: Circuit | MachineCircuit): number {
  return sheetOf(circuit).width;
}

// A circuit's layout and routes, worked out once per circuit object: the viewer asks for the
// width and the diagram for the rest in the same render, and a published revision's design is
// one object a server worker shares between every view of it (never changed once sized).
const sheets = new WeakMap<Circuit | MachineCircuit, Sheet>();
const descriptions = new WeakMap<Circuit | MachineCircuit, Map<UnitSystem, string>>();

function sheetOf(circuit: Circuit | MachineCircuit): Sheet {
  let sheet = sheets.get(circuit);
  if (!sheet) {
    sheet = isMachineCircuit(circuit) ? machineSheet(circuit) : axisSheet(circuit);
    sheets.set(circuit, sheet);
  }
  return sheet;
}

/** The diagram's description for screen readers, in `units`. */
function descriptionOf(circuit: Circuit | MachineCircuit, units: UnitSystem): string {
  let byUnits = descriptions.get(circuit);
  if (!byUnits) descriptions.set(circuit, (byUnits = new Map()));
  let text = byUnits.get(units);
  if (text === undefined) {
    const u = displayUnits(units);
    text = isMachineCircuit(circuit) ? machineCircuitDescription(circuit, u) : circuitDescription(circuit, u);
    byUnits.set(units, text);
  }
  return text;
}

/**
 * The preliminary circuit as an ISO 1219-1 style diagram, drawn from `design.circuit`:
 * only the components it lists, every connection it lists, and the valve's positions as the
 * data gives them. A machine's circuit is drawn the same way, each axis in a column of its own
 * over one power unit (machine-layout.ts). Pure rendering (no effects, no browser APIs), so the
 * server and the exports can render it with renderToStaticMarkup.
 */
export function CircuitDiagram({ units = "metric", className = "", ...props }: CircuitDiagramProps) {
  const id = useId();
  const circuit = props.design ? props.design.circuit : props.circuit;
  const u = displayUnits(units);
  const titleId = `${id}-title`;
  const descId = `${id}-desc`;
  const machine = isMachineCircuit(circuit);
  const sheet = sheetOf(circuit);
  return (
    <svg
      role="img"
      aria-labelledby={`${titleId} ${descId}`}
      viewBox={`0 0 ${sheet.width} ${sheet.height}`}
      xmlns="http://www.w3.org/2000/svg"
      fontFamily="'Open Sans', ui-sans-serif, system-ui, sans-serif"
      className={`h-auto w-full text-ink-800 ${className}`}
      data-circuit-diagram=""
      data-machine-axes={machine ? sheet.columns.length : undefined}
    >
      <title id={titleId}>{machine ? machineCircuitTitle(circuit) : circuitTitle(circuit)}</title>
      <desc id={descId}>{descriptionOf(circuit, units)}</desc>
      <rect x={0} y={0} width={sheet.width} height={sheet.height} fill="white" />
      <Legend />
      {sheet.columns.map((col) => (
        <text key={col.axis} x={col.labelX} y={col.labelY} textAnchor="middle" fontSize={15} fontWeight={700} fill="currentColor" data-axis-label={col.axis}>
          {col.axis}
        </text>
      ))}
      <g data-layer="lines">
        {sheet.routes.map((r) => (
          <Line key={`${r.connection.from}>${r.connection.to}`} route={r} />
        ))}
        {sheet.dots.map((p) => (
          <circle key={`${p.x},${p.y}`} cx={p.x} cy={p.y} r={3} fill="currentColor" data-junction="" />
        ))}
      </g>
      <g data-layer="tanks">
        {sheet.routes.map((r) => (r.tank ? <TankSymbol key={`${r.connection.from}>${r.connection.to}`} id={r.tank.id} x={r.tank.x} top={r.tank.top} /> : null))}
      </g>
      <g data-layer="symbols">
        {circuit.components.map((c) => {
          const part = sheet.partOf(c.id);
          return part ? <ComponentSymbol key={c.id} component={c} layout={part.layout} circuit={part.circuit} u={u} pLine={sheet.pLine.has(c.id)} /> : null;
        })}
      </g>
    </svg>
  );
}

interface Sheet {
  width: number;
  height: number;
  routes: Route[];
  dots: { x: number; y: number }[];
  columns: MachineColumn[];
  partOf: (id: string) => { layout: Layout; circuit: Circuit } | undefined;
  pLine: Set<string>;
}

function axisSheet(circuit: Circuit): Sheet {
  const layout = layoutCircuit(circuit);
  const routes = routeConnections(circuit, layout);
  return { width: layout.width, height: layout.height, routes, dots: junctions(routes), columns: [], partOf: () => ({ layout, circuit }), pLine: new Set() };
}

function machineSheet(circuit: MachineCircuit): Sheet {
  const layout = layoutMachine(circuit);
  const routes = routeConnections(circuit, layout.merged);
  return {
    width: layout.width,
    height: layout.height,
    routes,
    dots: meetings(routes),
    columns: layout.columns,
    partOf: (id) => layout.partOf[id],
    pLine: new Set([...pLineControls(circuit).values()].map((c) => c.id)),
  };
}

/** Line weight and dash by what the line carries. */
const LINE_STYLE: Record<CircuitConnection["line"], { width: number; dash?: string }> = {
  pressure: { width: STROKE.heavy },
  work: { width: STROKE.heavy },
  return: { width: STROKE.thin },
  suction: { width: STROKE.thin },
  pilot: { width: STROKE.thin, dash: DASH.pilot },
  shaft: { width: 6 },
};

function Line({ route }: { route: Route }) {
  const { connection, points } = route;
  const style = LINE_STYLE[connection.line];
  const d = pathData(points);
  return (
    <>
      <path
        d={d}
        fill="none"
        stroke="currentColor"
        strokeWidth={style.width}
        strokeDasharray={style.dash}
        strokeLinejoin="round"
        data-from={connection.from}
        data-to={connection.to}
        data-line={connection.line}
      />
      {/* a shaft is a double line: a white core inside a wide stroke */}
      {connection.line === "shaft" ? <path d={d} fill="none" stroke="white" strokeWidth={2.4} aria-hidden="true" /> : null}
    </>
  );
}

function Legend() {
  const rows: { label: string; line: CircuitConnection["line"] }[] = [
    { label: "pressure and work lines", line: "pressure" },
    { label: "return and suction lines", line: "return" },
    { label: "pilot lines", line: "pilot" },
    { label: "shaft", line: "shaft" },
  ];
  return (
    <g data-legend="" fontSize={10.5}>
      {rows.map((row, i) => {
        const y = 22 + i * 16;
        const style = LINE_STYLE[row.line];
        return (
          <g key={row.label}>
            <line x1={20} y1={y} x2={56} y2={y} stroke="currentColor" strokeWidth={style.width} strokeDasharray={style.dash} />
            {row.line === "shaft" ? <line x1={20} y1={y} x2={56} y2={y} stroke="white" strokeWidth={2.4} /> : null}
            <text x={64} y={y + 3.5} fill="currentColor" className="fill-ink-600">
              {row.label}
            </text>
          </g>
        );
      })}
    </g>
  );
}

function ComponentSymbol({
  component: c,
  layout,
  circuit,
  u,
  pLine,
}: {
  component: CircuitComponent & { dcvPositions?: DcvPositions };
  layout: Layout;
  circuit: Circuit;
  u: DisplayUnits;
  pLine: boolean;
}) {
  const at = layout.at[c.id];
  if (!at) return null;
  const v = (key: string, fmt: (x: number) => string) => {
    const n = numberValue(c, key);
    return n === undefined ? [] : [fmt(n)];
  };
  switch (c.kind) {
    case "cylinder": {
      const cyl = layout.cylinder;
      const bore = numberValue(c, "boreMm");
      const rod = numberValue(c, "rodMm");
      const stroke = numberValue(c, "strokeMm");
      // Metric: "Ø80 / Ø36 × 400 mm"; US: the metric bore and rod with inches beside, the stroke in inches.
      const size =
        bore === undefined || rod === undefined
          ? []
          : u.system === "us"
            ? [u.boreRod(bore, rod), ...(stroke !== undefined ? [`stroke ${u.length(stroke)}`] : [])]
            : [`Ø${u.lengthValue(bore)} / Ø${u.lengthValue(rod)}${stroke !== undefined ? ` × ${u.lengthValue(stroke)}` : ""} ${u.lengthUnit}`];
      return (
        <>
          <CylinderSymbol id={c.id} place={cyl} />
          {/* raised by the lines it takes, so a US reader's second line stays clear of the barrel */}
          <Caption
            x={(cyl.left + cyl.right) / 2}
            y={cyl.top - 12 - 14 * Math.max(1, size.length)}
            anchor="middle"
            name="Cylinder, bore / rod × stroke"
            values={size}
          />
        </>
      );
    }
    case "cbv": {
      const pilotSide = layout.cbv?.pilotSide ?? "left";
      const captionLeft = pilotSide === "right";
      return (
        <>
          <CbvSymbol id={c.id} centre={at} pilotSide={pilotSide} />
          <Caption
            x={captionLeft ? at.x - CBV_HALF_W - 12 : at.x + CBV_HALF_W + 12}
            y={at.y - 20}
            anchor={captionLeft ? "end" : "start"}
            name="Counterbalance valve"
            values={[...v("settingBar", (p) => `set ${u.pressure(p)}`), ...v("pilotRatio", (r) => `pilot ratio ${r}:1`)]}
          />
        </>
      );
    }
    case "dcv": {
      const size = textValue(c, "iso4401Size");
      const coil = textValue(c, "coilVoltage");
      return (
        <>
          <DcvSymbol id={c.id} cx={layout.dcv.cx} top={layout.dcv.top} positions={c.dcvPositions ?? circuit.dcvPositions} />
          <Caption
            x={layout.dcv.cx + BOX * 1.5 + 44}
            y={layout.dcv.top + 16}
            name="4/3 directional valve"
            values={[size ? `ISO 4401-${size}` : "", centreName(textValue(c, "center")), coil ? `${coil} coils` : ""].filter(Boolean)}
          />
        </>
      );
    }
    case "relief": {
      // a vented relief's caption moves up to leave room for the vent line below it
      const vented = c.ports.includes("X");
      return (
        <>
          <ReliefSymbol id={c.id} centre={at} vented={vented} />
          <Caption
            x={at.x - RELIEF_BOX / 2 - 22}
            y={vented ? at.y - 14 : at.y - 6}
            anchor="end"
            name={vented ? "Relief valve, vented" : "Relief valve"}
            values={v("settingBar", (p) => `set ${u.pressure(p)}`)}
          />
        </>
      );
    }
    case "vent": {
      const coil = textValue(c, "coilVoltage");
      return (
        <>
          <VentValveSymbol id={c.id} centre={at} />
          <Caption
            x={at.x - 8}
            y={at.y + VENT_BOX / 2 + 18}
            anchor="end"
            name="Vent valve"
            values={["2/2, normally open", ...v("ventPressureBar", (p) => `vents at ${u.pressure(p)}`), ...(coil ? [`${coil} coil`] : [])]}
          />
        </>
      );
    }
    case "pump":
      return <PumpWithCaption component={c} at={at} u={u} circuit={circuit} />;
    case "poc": {
      const side = layout.pilotSide[c.id] ?? "left";
      // the caption goes on the side away from the pilot, outside the columns
      const captionLeft = side === "right";
      return (
        <>
          <PocSymbol id={c.id} centre={at} pilotSide={side} pilotY={layout.ports[`${c.id}.X`]?.y} />
          <Caption
            x={captionLeft ? at.x - POC_HALF_W - 14 : at.x + POC_HALF_W + 14}
            y={at.y - 12}
            anchor={captionLeft ? "end" : "start"}
            name="Pilot-operated check"
            values={["holds the load leak-tight", ...v("pilotRatio", (r) => `pilot ratio ${r}:1`)]}
          />
        </>
      );
    }
    case "flow-control":
      if (pLine)
        return (
          <>
            <FlowControlSymbol id={c.id} centre={at} compensated={textValue(c, "compensated") === "yes"} />
            <Caption
              x={at.x - FC_HALF_W - 12}
              y={at.y - 8}
              anchor="end"
              name="P-line flow control"
              values={[textValue(c, "compensated") === "yes" ? "meter-in, compensated" : "meter-in", ...v("settingLpm", (q) => `set ${u.flow(q)}`)]}
            />
          </>
        );
      return (
        <>
          <FlowControlSymbol id={c.id} centre={at} compensated={textValue(c, "compensated") === "yes"} />
          <Caption
            x={at.x + FC_HALF_W + 12}
            y={at.y - 8}
            name="Pressing-speed control"
            values={[
              textValue(c, "compensated") === "yes" ? "meter-in, compensated" : "meter-in",
              "free return",
              ...v("settingLpm", (q) => `set ${u.flow(q)}`),
            ]}
          />
        </>
      );
    case "reducing":
      // the caption on the left, beyond its return check; the drain and its tank are on the right
      return (
        <>
          <ReducingValveSymbol id={c.id} centre={at} />
          <Caption
            x={at.x - REDUCING_CHECK_DX - 20}
            y={at.y - 8}
            anchor="end"
            name="Pressure-reducing valve"
            values={[...v("settingBar", (p) => `set ${u.pressure(p)}`), "drained to tank", "free return"]}
          />
        </>
      );
    case "bypass":
      return (
        <>
          <SolenoidValve22
            id={c.id}
            kind="bypass"
            centre={at}
            ports="vertical"
            normally={textValue(c, "normally") === "open" ? "open" : "closed"}
            portNames={["1", "2"]}
            flowFrom="2"
          />
          <PortLabel x={at.x + 5} y={at.y - VENT_BOX / 2 - 5} anchor="start" port={`${c.id}.1`}>
            1
          </PortLabel>
          <PortLabel x={at.x + 5} y={at.y + VENT_BOX / 2 + 13} anchor="start" port={`${c.id}.2`}>
            2
          </PortLabel>
          <Caption
            x={at.x - VENT_BOX * 1.5 - 24}
            y={at.y - 8}
            anchor="end"
            name="Bypass valve"
            values={[`2/2, normally ${textValue(c, "normally") === "open" ? "open" : "closed"}`, "open for the approach"]}
          />
        </>
      );
    case "regen": {
      // the 3/2 valve is drawn from its positions; a stored design from before they were data has none
      const positions = c.positions;
      if (!positions) return null;
      const port3Side = layout.pilotSide[c.id] ?? "left";
      // how long it stays energised: to the pressure switch's setting, the limit switch, or the whole extension
      const endsBy = textValue(c, "endsBy");
      const until =
        numberValue(c, "switchBar") !== undefined
          ? [`until ${u.pressure(numberValue(c, "switchBar")!)}`]
          : endsBy === "limit-switch"
            ? ["until the limit switch"]
            : endsBy === "end-of-extension"
              ? ["for the whole extension"]
              : [];
      return (
        <>
          <RegenValveSymbol id={c.id} centre={at} port3Side={port3Side} positions={positions} />
          <Caption
            x={port3Side === "left" ? at.x + REGEN_BOX / 4 + 30 : at.x - REGEN_BOX / 4 - 30}
            y={at.y - 8}
            anchor={port3Side === "left" ? "start" : "end"}
            name="Regeneration valve"
            values={["3/2; energised, the rod end", "feeds the cap line", ...until]}
          />
        </>
      );
    }
    case "pressure-switch":
      return (
        <>
          <PressureSwitchSymbol id={c.id} centre={at} />
          <Caption
            x={at.x - SWITCH_HALF - 30}
            y={at.y - 4}
            anchor="end"
            name="Pressure switch"
            values={[...v("settingBar", (p) => `set ${u.pressure(p)}`), "ends the regeneration"]}
          />
        </>
      );
    case "limit-switch": {
      const off = (textValue(c, "switchesOff") ?? "").split(",").map((x) => x.trim());
      return (
        <>
          <LimitSwitchSymbol id={c.id} at={at} rodEnd={layout.cylinder.rodEnd} />
          <Caption
            x={layout.width - 12}
            y={28}
            anchor="end"
            name="Limit switch"
            values={[
              ...v("beforeEndMm", (mm) => `${u.length(mm)} before the end`),
              ...(off.includes("press-bypass") ? ["closes the bypass"] : []),
              ...(off.includes("regen") ? ["ends the regeneration"] : []),
            ]}
          />
        </>
      );
    }
    case "decompression":
      return (
        <>
          <DecompressionSymbol id={c.id} centre={at} />
          <Caption
            x={at.x - VENT_BOX / 2 - DECOMPRESSION_STUB - 28}
            y={at.y - 26}
            anchor="end"
            name="Decompression valve"
            values={["2/2, orifice to tank", ...v("releaseCm3", (cm3) => `releases about ${u.smallVolume(cm3)}`)]}
          />
        </>
      );
    case "unloading":
      // an accumulator's charging valve carries its cut-out and cut-in pressures; its caption goes right, past its tank
      if (numberValue(c, "cutOutBar") !== undefined)
        return (
          <>
            <UnloadingSymbol id={c.id} centre={at} />
            <Caption
              x={at.x + RELIEF_BOX / 2 + UNLOADING_STUB + 30}
              y={at.y - 4}
              name="Accumulator charging valve"
              values={[...v("cutOutBar", (p) => `unloads the pump at ${u.pressure(p)}`), ...v("cutInBar", (p) => `loads it again at ${u.pressure(p)}`)]}
            />
          </>
        );
      return (
        <>
          <UnloadingSymbol id={c.id} centre={at} />
          <Caption x={at.x + 12} y={at.y - RELIEF_BOX / 2 - 48} name="Unloading valve" values={v("settingBar", (p) => `unloads above ${u.pressure(p)}`)} />
        </>
      );
    case "check":
      return (
        <>
          <CheckSymbol id={c.id} centre={at} />
          <Caption x={at.x - 14} y={at.y + 4} anchor="end" name="Check valve" values={[]} />
        </>
      );
    case "accumulator":
      return (
        <>
          <AccumulatorSymbol id={c.id} centre={at} />
          <Caption
            x={at.x + ACC_W / 2 + 14}
            y={at.y - 10}
            name="Bladder accumulator"
            values={[...v("nominalL", (l) => `${u.volume(l)} nominal`), ...v("prechargeBar", (p) => `gas precharge ${u.pressure(p)}`)]}
          />
        </>
      );
    case "accumulator-block": {
      const left = at.x - BLOCK_W / 2;
      const top = at.y - BLOCK_H / 2;
      return (
        <>
          <AccumulatorBlockSymbol id={c.id} left={left} top={top} />
          <Caption
            x={left}
            y={top - 40}
            name="Accumulator safety and shut-off block"
            values={[...v("safetyBar", (p) => `safety relief ${u.pressure(p)}`), "discharge valve normally open"]}
          />
        </>
      );
    }
    case "cooler":
      return (
        <>
          <CoolerSymbol id={c.id} centre={at} />
          <Caption x={at.x + DIAMOND + 10} y={at.y - 3} name="Oil cooler" values={v("kw", (k) => `sheds ${u.power(Math.ceil(k * 10) / 10)}`)} />
        </>
      );
    case "motor":
      return (
        <>
          <MotorSymbol id={c.id} centre={at} />
          {/* under the motor: beside it a US rating's longer line would reach the relief's vent valve */}
          <Caption
            x={at.x}
            y={at.y + MOTOR_R + 16}
            anchor="middle"
            name="Motor"
            values={[...v("ratedKw", u.motorRating), ...v("speedRpm", (n) => `${n} rpm`)]}
          />
        </>
      );
    case "gauge":
      return (
        <>
          <GaugeSymbol id={c.id} centre={at} />
          {/* the caption goes on the side away from the gauge's line */}
          <Caption
            x={layout.ports[`${c.id}.port`]?.dir === "right" ? at.x - GAUGE_R - 10 : at.x + GAUGE_R + 10}
            y={at.y - 3}
            anchor={layout.ports[`${c.id}.port`]?.dir === "right" ? "end" : "start"}
            name="Gauge"
            values={v("rangeBar", (r) => `0–${u.pressure(r)}`)}
          />
        </>
      );
    case "filter":
    case "strainer":
      return (
        <>
          <FilterSymbol id={c.id} centre={at} kind={c.kind} />
          <Caption
            x={at.x + DIAMOND + 10}
            y={at.y - 3}
            name={c.kind === "filter" ? "Return filter" : "Suction strainer"}
            values={v("ratedFlowLpm", (q) => `rated ${u.flow(q)}`)}
          />
        </>
      );
    case "tank":
      // The tank symbols sit at the line ends; the reservoir's caption goes beside the suction tank.
      return <Caption x={at.x + 28} y={layout.tankY + TANK_H - 2} name="Reservoir" values={v("volumeL", u.volume)} />;
    default:
      return null;
  }
}

/** The pump as the data gives it: fixed, compensated (with its settings) or one section of a double pump. */
function PumpWithCaption({ component: c, at, u, circuit }: { component: CircuitComponent; at: { x: number; y: number }; u: DisplayUnits; circuit: Circuit }) {
  const type = textValue(c, "type");
  const v = (key: string, fmt: (x: number) => string) => {
    const n = numberValue(c, key);
    return n === undefined ? [] : [fmt(n)];
  };
  if (type === "double") {
    // One caption for both sections, beside the large one (the small one has the strainer below it).
    if (textValue(c, "section") !== "large") return <PumpSymbol id={c.id} centre={at} />;
    const small = circuit.components.find((p) => p.kind === "pump" && p !== c);
    return (
      <>
        <PumpSymbol id={c.id} centre={at} />
        <Caption
          x={at.x + PUMP_R + 14}
          y={at.y + 10}
          name="Double pump"
          values={[
            ...v("displacementCcRev", (n) => `large ${u.displacement(n)}`),
            ...(numberValue(small, "displacementCcRev") !== undefined ? [`small ${u.displacement(numberValue(small, "displacementCcRev")!)}`] : []),
            ...(numberValue(small, "totalFlowLpm") !== undefined ? [`together ${u.flow(numberValue(small, "totalFlowLpm")!)}`] : []),
          ]}
        />
      </>
    );
  }
  const compensated = type === "compensated";
  return (
    <>
      <PumpSymbol id={c.id} centre={at} variable={compensated} compensated={compensated} />
      {compensated ? (
        <Caption
          x={at.x + PUMP_R + COMPENSATOR_W + 14}
          y={at.y - 30}
          name="Compensated pump"
          values={[
            ...v("displacementCcRev", u.displacement),
            ...v("flowLpm", (q) => `up to ${u.flow(q)}`),
            ...v("compensatorBar", (p) => `compensator ${u.pressure(p)}`),
            ...v("powerLimitKw", (k) => `power limit ${u.power(k)}`),
          ]}
        />
      ) : (
        <Caption x={at.x + PUMP_R + 14} y={at.y - 8} name="Fixed pump" values={[...v("displacementCcRev", u.displacement), ...v("flowLpm", u.flow)]} />
      )}
    </>
  );
}
