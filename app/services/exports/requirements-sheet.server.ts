import type ExcelJS from "exceljs";
import { REQUIREMENT_FIELDS, fieldApplies, typedNumber, type RequirementField } from "~/content/requirement-fields";
import { MACHINE_DUTY_FIELDS, type Requirements } from "~/hydraulics";
import { stepInWords } from "~/content/machine-words";
import { UNITS, UNIT_SYSTEM_LABELS, roundForDisplay, toDisplay, unitLabel, type UnitSystem } from "~/units";
import type { BillInput } from "./bill-workbook.server";
import { addTableSheet, headerDay, quantityFormat, styleBodyRow, writeTableHeader, writeTextRow, type Column, type HeaderBlock } from "./sheet-layout.server";

// The axis requirements twice over: as the buyer typed them (their unit system) and as the
// engine sized them (the units its fields name), plus the reader's units when those differ,
// so nobody has to convert by hand to check a number. A machine: its duty once, its cycle in
// words, then one block per axis. The spec's other answers follow.

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

const DUTY = new Set<string>(MACHINE_DUTY_FIELDS);

/**
 * What the buyer typed for one axis of a machine, found by its name in the draft's layout
 * (content/spec-draft.ts: `machine.axes` lists the ids, `name-<id>` names each, `<id>-mounting`
 * and `<id>-motion` hold its answers). Null where the answers do not say, and the sheet shows
 * the sized value in the units the spec was entered in instead.
 */
function typedOfAxis(answers: BillInput["answers"], name: string): Record<string, string> | null {
  const machine = answers.machine ?? {};
  const id = (machine.axes ?? "").split(/\s+/).find((id) => id && machine[`name-${id}`]?.trim() === name);
  return id ? { ...answers[`${id}-mounting`], ...answers[`${id}-motion`] } : null;
}

function requirementRows(
  input: Pick<BillInput, "enteredIn" | "readerUnits"> & {
    requirements: Requirements;
    /** as typed, by field key; null: not known, the sized value in the entered units stands in */
    typed: Record<string, string> | null;
    keep?: (key: string) => boolean;
  },
): RequirementRow[] {
  const typed = input.typed ?? {};
  const rows: RequirementRow[] = [];
  // Sized by a contract that asks the optional choices (pump, mounting style): a blank one is listed by what it meant.
  const asksOptional = input.requirements.holdMinutes !== undefined;
  for (const field of Object.values(REQUIREMENT_FIELDS)) {
    if (!fieldApplies(field.key, input.requirements) || (input.keep && !input.keep(field.key))) continue;
    const si = input.requirements[field.key as keyof Requirements];
    if (si === undefined) {
      if (asksOptional && field.kind === "choice" && field.emptyLabel) {
        rows.push({ label: field.label, entered: field.emptyLabel, enteredUnit: "", si: "", siUnit: "", reader: null });
      }
      continue;
    }
    const label = field.kind === "choice" ? (field.options.find((o) => o.value === String(si))?.label ?? String(si)) : null;
    const asSized =
      field.kind === "number" && field.quantity && typeof si === "number"
        ? roundForDisplay(toDisplay(field.quantity, si, input.enteredIn), UNITS[field.quantity][input.enteredIn].decimals)
        : si;
    const entered =
      field.kind === "choice" ? (label ?? String(si)) : input.typed === null ? asSized : (typedValue(typed[field.key]) ?? field.emptyLabel ?? "(default)");
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
  const enteredIn: [string, string] = ["Entered in", `${UNIT_SYSTEM_LABELS[input.enteredIn]}; "(default)": left blank, sized with the default`];
  const { sheet, head } = addTableSheet(workbook, "Requirements", columns, { ...block, facts: [...block.facts, enteredIn] }, false);
  let at = head;
  const write = (rows: RequirementRow[]) => {
    for (const r of rows) {
      const row = sheet.getRow(++at);
      row.values = [r.label, r.entered, r.enteredUnit, r.si, r.siUnit, ...(r.reader ? [r.reader.value, r.reader.unit] : [])];
      for (const col of [2, 4, 6]) {
        const v = row.getCell(col).value;
        if (typeof v === "number") row.getCell(col).numFmt = quantityFormat(v);
      }
      styleBodyRow(row, columns);
    }
  };
  /** A block's title across the table, a row below the last. */
  const section = (title: string) => {
    at += at === head ? 1 : 2;
    writeTableHeader(sheet, at, [title]);
    sheet.mergeCells(at, 1, at, columns.length);
  };
  const { published } = input;
  if (published.kind === "axis") {
    write(requirementRows({ ...input, requirements: published.design.requirements, typed: Object.assign({}, ...Object.values(input.answers)) }));
  } else {
    const m = published.design;
    section("The machine: duty and site, for every axis");
    write(requirementRows({ ...input, requirements: m.requirements as unknown as Requirements, typed: input.answers.duty ?? null, keep: (k) => DUTY.has(k) }));
    section("The machine cycle, step by step");
    m.sequence.forEach((step, i) => writeTextRow(sheet, ++at, `Step ${i + 1}`, stepInWords(step), columns));
    m.axes.forEach((axis, i) => {
      section(`Axis ${i + 1}: ${axis.name}`);
      write(requirementRows({ ...input, requirements: axis.requirements, typed: typedOfAxis(input.answers, axis.name), keep: (k) => !DUTY.has(k) }));
    });
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
