import type ExcelJS from "exceljs";
import { REQUIREMENT_FIELDS, fieldApplies, typedNumber, type RequirementField } from "~/content/requirement-fields";
import type { Requirements } from "~/hydraulics";
import { UNITS, UNIT_SYSTEM_LABELS, roundForDisplay, toDisplay, unitLabel, type UnitSystem } from "~/units";
import type { BillInput } from "./bill-workbook.server";
import {
  addSheet,
  freezeAt,
  headerDay,
  quantityFormat,
  styleBodyRow,
  writeHeaderBlock,
  writeTableHeader,
  writeTextRow,
  type Column,
  type HeaderBlock,
} from "./sheet-layout.server";

// The axis requirements twice over: as the buyer typed them (their unit system) and as the
// engine sized them (the units its fields name), plus the reader's units when those differ,
// so nobody has to convert by hand to check a number. The spec's other answers follow.

const SYSTEM_NAMES: Record<UnitSystem, string> = { metric: "metric", us: "US customary" };

const siUnit = (field: RequirementField) => (field.kind === "number" && field.quantity ? UNITS[field.quantity].metric.label : (field.unit ?? ""));
// A choice is entered as its label ("50 Hz"), which needs no unit beside it.
const typedUnit = (field: RequirementField, system: UnitSystem) =>
  field.kind === "choice" ? "" : field.quantity ? unitLabel(field.quantity, system) : siUnit(field);

/** What a person typed, as a number when it is one ("1 234,5" included), else as typed. */
function typedValue(raw: string | undefined): number | string | null {
  const text = raw?.trim();
  if (!text) return null;
  const number = typedNumber(text);
  return Number.isFinite(number) ? number : text;
}

export interface RequirementRow {
  label: string;
  entered: number | string;
  enteredUnit: string;
  si: number | string;
  siUnit: string;
  /** The value in the reader's unit system, when it is not the one entered. */
  reader: { value: number | string; unit: string } | null;
}

function requirementRows(input: Pick<BillInput, "answers" | "enteredIn" | "readerUnits"> & { requirements: Requirements }): RequirementRow[] {
  const typed: Record<string, string> = Object.assign({}, ...Object.values(input.answers));
  const rows: RequirementRow[] = [];
  // Sized by a contract that asks the optional choices (pump, mounting style): a blank one is listed by what it meant.
  const asksOptional = input.requirements.holdMinutes !== undefined;
  for (const field of Object.values(REQUIREMENT_FIELDS)) {
    if (!fieldApplies(field.key, input.requirements)) continue;
    const si = input.requirements[field.key as keyof Requirements];
    if (si === undefined) {
      if (asksOptional && field.kind === "choice" && field.emptyLabel) {
        rows.push({ label: field.label, entered: field.emptyLabel, enteredUnit: "", si: "", siUnit: "", reader: null });
      }
      continue;
    }
    const label = field.kind === "choice" ? (field.options.find((o) => o.value === String(si))?.label ?? String(si)) : null;
    const entered = field.kind === "choice" ? (label ?? String(si)) : (typedValue(typed[field.key]) ?? field.emptyLabel ?? "(default)");
    let reader: RequirementRow["reader"] = null;
    if (input.readerUnits !== input.enteredIn && field.kind === "number" && field.quantity && typeof si === "number") {
      const value = roundForDisplay(toDisplay(field.quantity, si, input.readerUnits), UNITS[field.quantity][input.readerUnits].decimals);
      reader = { value, unit: unitLabel(field.quantity, input.readerUnits) };
    } else if (input.readerUnits !== input.enteredIn) {
      reader = { value: label ?? si, unit: typedUnit(field, input.readerUnits) };
    }
    rows.push({ label: field.label, entered, enteredUnit: typedUnit(field, input.enteredIn), si, siUnit: siUnit(field), reader });
  }
  return rows;
}

/** The answers besides the axis: the machine, the site, the quotation. */
function otherAnswers(answers: BillInput["answers"]): [string, string][] {
  const m = answers.machine ?? {};
  const d = answers.duty ?? {};
  const q = answers.quotation ?? {};
  const day = (v: string | undefined) => (v ? headerDay(v) : undefined);
  const pairs: [string, string | undefined][] = [
    ["What the machine does", m.purpose],
    ["Supply voltage", d.supplyVoltage],
    ["Fluid", d.fluid],
    ["Units wanted", q.unitsWanted],
    ["Needed by", day(q.dateNeeded)],
    ["Bids until", day(q.bidDeadline)],
    ["Delivered to", q.deliveryRegion],
    ["Prices in", q.currency],
    ["Retainer share", q.retainerPercent ? `${q.retainerPercent} %` : undefined],
    ["Notes", q.notes],
  ];
  return pairs.filter((p): p is [string, string] => typeof p[1] === "string" && p[1].trim() !== "").map(([l, v]) => [l, v.trim()]);
}

export function addRequirementsSheet(workbook: ExcelJS.Workbook, input: BillInput, block: HeaderBlock) {
  const rows = requirementRows({ ...input, requirements: input.design.requirements });
  const withReader = input.readerUnits !== input.enteredIn;
  const columns: Column[] = [
    { header: "Requirement", width: 36, wrap: true },
    { header: "As entered", width: 14, align: "right", wrap: true },
    { header: "Unit", width: 10, indent: 1 },
    { header: "SI, as sized", width: 14, align: "right", wrap: true },
    { header: "SI unit", width: 10, indent: 1 },
    ...(withReader
      ? [
          { header: `In ${SYSTEM_NAMES[input.readerUnits]} units`, width: 14, align: "right" as const, wrap: true },
          { header: "Unit", width: 10, indent: 1 },
        ]
      : []),
  ];
  const sheet = addSheet(workbook, "Requirements", columns, false);
  const head = writeHeaderBlock(sheet, {
    ...block,
    facts: [...block.facts, ["Entered in", `${UNIT_SYSTEM_LABELS[input.enteredIn]}; "(default)": left blank, sized with the default`]],
  });
  writeTableHeader(
    sheet,
    head,
    columns.map((c) => c.header),
    columns,
  );
  freezeAt(sheet, head);
  let at = head;
  for (const r of rows) {
    const row = sheet.getRow(++at);
    row.values = [r.label, r.entered, r.enteredUnit, r.si, r.siUnit, ...(r.reader ? [r.reader.value, r.reader.unit] : [])];
    for (const col of [2, 4, 6]) {
      const v = row.getCell(col).value;
      if (typeof v === "number") row.getCell(col).numFmt = quantityFormat(v);
    }
    styleBodyRow(row, columns);
  }
  const others = otherAnswers(input.answers);
  if (others.length) {
    at += 2;
    writeTableHeader(sheet, at, ["Other answers", "As given"]);
    if (columns.length > 2) sheet.mergeCells(at, 2, at, columns.length);
    for (const [label, text] of others) writeTextRow(sheet, ++at, label, text, columns);
  }
  return sheet;
}
