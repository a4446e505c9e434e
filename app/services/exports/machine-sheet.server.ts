import type ExcelJS from "exceljs";
import type { MachineDesign } from "~/hydraulics";
import { addTableSheet, quantityFormat, styleBodyRow, writeTableHeader, type Column, type HeaderBlock } from "./sheet-layout.server";

// A machine's key sizes at a glance, in SI as the engine gives them: one row per axis (what a
// shop quotes a cylinder and a valve from), then the one power unit. Every figure is also in the
// bill's lines and the design values; this sheet puts them side by side.

const AXIS_COLUMNS: Column[] = [
  { header: "Axis", width: 18, wrap: true },
  { header: "Bore, mm", width: 9, align: "right", numFmt: "0" },
  { header: "Rod, mm", width: 9, align: "right", numFmt: "0" },
  { header: "Stroke, mm", width: 10, align: "right", numFmt: "0" },
  { header: "Extend pressure, bar", width: 12, align: "right", wrap: true },
  { header: "Retract pressure, bar", width: 12, align: "right", wrap: true },
  { header: "Flow out, L/min", width: 11, align: "right", wrap: true },
  { header: "Flow back, L/min", width: 11, align: "right", wrap: true },
  { header: "Valve, ISO 4401", width: 10, align: "right", wrap: true },
  { header: "Centre", width: 10, indent: 1 },
  { header: "Load holding", width: 34, wrap: true },
];

function holdingText(axis: MachineDesign["axes"][number]): string {
  const parts: string[] = [];
  if (axis.counterbalance)
    parts.push(`counterbalance valve, ${axis.counterbalance.side} side, set ${axis.counterbalance.settingBar} bar, pilot ${axis.counterbalance.pilotRatio}:1`);
  if (axis.holding)
    parts.push(`pilot-operated checks, ${axis.holding.side === "both" ? "both sides" : `${axis.holding.side} side`}, pilot ${axis.holding.pilotRatio}:1`);
  return parts.join("; ") || "none needed";
}

/** The power unit's figures, each with its unit, for the lower table. */
function powerUnitRows(m: MachineDesign): [string, number | string, string][] {
  const rows: [string, number | string, string][] = [
    ["Pump", m.pump.type, ""],
    ["Pump displacement", m.pump.displacementsCcRev.join(" + "), "cm³/rev"],
    ["Pump delivery", m.flowsLpm.pump, "L/min"],
    ["Drive speed", m.pump.speedRpm, "rpm"],
  ];
  if (m.pump.compensatorBar !== undefined) rows.push(["Compensator setting", m.pump.compensatorBar, "bar"]);
  if (m.pump.unloadingBar !== undefined) rows.push(["Large section unloads above", m.pump.unloadingBar, "bar"]);
  rows.push(
    ["Relief setting", m.pressuresBar.reliefSetting, "bar"],
    ["Motor rating", m.motor.ratedKw, "kW"],
    ["Motor power needed", m.motor.requiredKw, "kW"],
    ["Reservoir, usable", m.reservoir.volumeL, "L"],
    ["Cooler", m.cooler ? m.cooler.kw : "none needed", m.cooler ? "kW" : ""],
    ["Return filter, rated flow", m.returnFilter.ratedFlowLpm, "L/min"],
    ["Pressure line, bore", m.lines.pressure.innerDiameterMm, "mm"],
    ["Return line, bore", m.lines.return.innerDiameterMm, "mm"],
    ["Suction line, bore", m.lines.suction.innerDiameterMm, "mm"],
    ["Average heat", m.heat.averageLossKw, "kW"],
  );
  return rows;
}

export function addMachineSheet(workbook: ExcelJS.Workbook, machine: MachineDesign, block: HeaderBlock) {
  const { sheet, head } = addTableSheet(workbook, "Machine", AXIS_COLUMNS, block);
  let at = head;
  for (const axis of machine.axes) {
    const row = sheet.getRow(++at);
    const p = axis.pressuresBar;
    row.values = [
      axis.name,
      axis.cylinder.boreMm,
      axis.cylinder.rodMm,
      axis.cylinder.strokeMm,
      // With a pressing stroke, the pressing pressure: the higher of its two.
      p.press ?? p.extend,
      p.retract,
      axis.flowsLpm.extend,
      axis.flowsLpm.retract,
      axis.directionalValve.iso4401Size,
      axis.directionalValve.center,
      holdingText(axis),
    ];
    for (const c of [5, 6, 7, 8]) row.getCell(c).numFmt = quantityFormat(row.getCell(c).value as number);
    styleBodyRow(row, AXIS_COLUMNS);
  }
  at += 2;
  const unitColumns = AXIS_COLUMNS.slice(0, 3);
  writeTableHeader(sheet, at, ["The power unit, shared by every axis", "Value", "Unit"]);
  for (const [label, value, unit] of powerUnitRows(machine)) {
    const row = sheet.getRow(++at);
    row.values = [label, value, unit];
    if (typeof value === "number") row.getCell(2).numFmt = quantityFormat(value);
    styleBodyRow(row, [unitColumns[0], { ...unitColumns[1], numFmt: undefined }, { header: "Unit", width: 9, indent: 1 }]);
  }
  return sheet;
}
