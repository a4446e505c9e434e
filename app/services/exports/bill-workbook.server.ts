import type ExcelJS from "exceljs";
import type { TrailEntry } from "~/hydraulics";
import { axisNamesOf, servedBy, type PublishedDesign } from "../published-design";
import type { QuotationFacts } from "~/content/quotation-facts";
import type { SpecAnswers } from "~/models/spec.server";
import type { UnitSystem } from "~/units";
import { addMachineSheet } from "./machine-sheet.server";
import { addRequirementsSheet } from "./requirements-sheet.server";
import {
  addTableSheet,
  engineFact,
  addCautionsSheet,
  headerDay,
  newWorkbook,
  quantityFormat,
  shortNumber,
  styleBodyRow,
  type Column,
  type HeaderBlock,
} from "./sheet-layout.server";

// The bill of materials of one published revision, as buyers and shops take it into their own
// spreadsheets and ERP systems: the lines with their main rating in separate columns (so a
// filter or a lookup can use the number), how every design value was reached, the requirements
// as the buyer typed them and as the engine sized them, and the cautions.

export interface BillInput {
  title: string;
  revision: number;
  publishedAt: Date;
  engineVersion: string;
  /** Null when the reader is a shop: the buyer is not named to shops (buyerNameFor). */
  buyerName: string | null;
  /** One axis or a machine of several (publishedDesignOf). */
  published: PublishedDesign;
  /** The step answers frozen into the revision, as typed, in `enteredIn` units. */
  answers: SpecAnswers;
  enteredIn: UnitSystem;
  /** The reader's own unit system, added beside the entered values when it differs. */
  readerUnits: UnitSystem;
  quotation: QuotationFacts;
  exportedAt: Date;
}

const BILL_SHEETS = ["Bill of materials", "Design values", "Requirements", "Cautions"] as const;

const BOM_COLUMNS: Column[] = [
  { header: "Line key", width: 22 },
  { header: "Item", width: 34, wrap: true },
  { header: "Qty", width: 6, align: "right", numFmt: "0" },
  { header: "Specification", width: 62, wrap: true, indent: 1 },
  { header: "Main rating", width: 12, align: "right" },
  { header: "Unit", width: 10, indent: 1 },
  { header: "What is rated", width: 18, wrap: true },
];

const TRAIL_COLUMNS: Column[] = [
  { header: "Quantity", width: 34, wrap: true },
  // Wrapped: a few values are words ("ISO 6020-2 (160 bar)"), which must not be cut off.
  { header: "Value", width: 13, align: "right", wrap: true },
  { header: "Unit", width: 10, indent: 1 },
  { header: "Formula", width: 46, wrap: true },
  { header: "Inputs", width: 30, wrap: true },
  { header: "Source", width: 40, wrap: true },
];

/** The facts every sheet of the workbook opens with; the first sheet adds the quotation. */
function billFacts(input: BillInput): [string, string][] {
  return [
    ["Revision", `${input.revision}, published ${headerDay(input.publishedAt)}`],
    engineFact(input.engineVersion),
    ["Machine builder", input.buyerName ?? "Not named to shops before the award"],
    ["Exported", headerDay(input.exportedAt)],
  ];
}

function quotationFacts(q: QuotationFacts): [string, string][] {
  const facts: [string, string | null][] = [
    ["Units wanted", q.unitsWanted],
    ["Needed by", q.dateNeeded && headerDay(q.dateNeeded)],
    ["Delivered to", q.deliveryRegion],
    ["Prices in", q.currency],
  ];
  return facts.filter((f): f is [string, string] => f[1] !== null);
}

const STATUS_FACT: [string, string] = ["Status", "Preliminary circuit for quotation: see the Cautions sheet before anyone builds from it."];

/** A machine's bill names the axis each line serves, beside its key. */
const SERVES_COLUMN: Column = { header: "Serves", width: 16, wrap: true };

function addBomSheet(workbook: ExcelJS.Workbook, input: BillInput) {
  const axes = axisNamesOf(input.published);
  const columns = axes.length ? [BOM_COLUMNS[0], SERVES_COLUMN, ...BOM_COLUMNS.slice(1)] : BOM_COLUMNS;
  const bom = input.published.design.bom;
  const block: HeaderBlock = {
    document: "Bill of materials",
    specTitle: input.title,
    facts: [...billFacts(input), ...quotationFacts(input.quotation), STATUS_FACT],
  };
  const { sheet, head } = addTableSheet(workbook, BILL_SHEETS[0], columns, block);
  bom.forEach((line, i) => {
    const row = sheet.getRow(head + 1 + i);
    const serves = servedBy(line.key, axes);
    row.values = [
      line.key,
      ...(serves === null ? [] : [serves]),
      line.item,
      line.quantity,
      line.specification,
      line.rating.value,
      line.rating.unit,
      line.rating.label,
    ];
    row.getCell(serves === null ? 5 : 6).numFmt = quantityFormat(line.rating.value);
    styleBodyRow(row, columns);
  });
  // A filter on the header row: readers narrow the bill to hoses, valves… or to one axis.
  sheet.autoFilter = { from: { row: head, column: 1 }, to: { row: head + bom.length, column: columns.length } };
}

/** "m = 800 kg", one input a line. */
function inputsText(inputs: TrailEntry["inputs"]): string {
  return Object.entries(inputs)
    .map(([name, input]) => {
      const value = typeof input.value === "number" ? shortNumber(input.value) : input.value;
      return input.unit && input.unit !== "-" ? `${name} = ${value} ${input.unit}` : `${name} = ${value}`;
    })
    .join("\n");
}

function addTrailSheet(workbook: ExcelJS.Workbook, input: BillInput) {
  const block = { document: "Design values and how each was reached", specTitle: input.title, facts: billFacts(input) };
  const { sheet, head } = addTableSheet(workbook, BILL_SHEETS[1], TRAIL_COLUMNS, block);
  input.published.design.trail.forEach((entry, i) => {
    const row = sheet.getRow(head + 1 + i);
    row.values = [entry.quantity, entry.value, entry.unit === "-" ? "" : entry.unit, entry.formula, inputsText(entry.inputs), entry.source];
    if (typeof entry.value === "number") row.getCell(2).numFmt = quantityFormat(entry.value);
    styleBodyRow(row, TRAIL_COLUMNS);
  });
}

export function buildBillWorkbook(input: BillInput): ExcelJS.Workbook {
  const workbook = newWorkbook();
  workbook.title = `${input.title} - revision ${input.revision} - bill of materials`;
  addBomSheet(workbook, input);
  if (input.published.kind === "machine") {
    addMachineSheet(workbook, input.published.design, {
      document: "The machine: each axis and the power unit",
      specTitle: input.title,
      facts: billFacts(input),
    });
  }
  addTrailSheet(workbook, input);
  addRequirementsSheet(workbook, input, { document: "Requirements", specTitle: input.title, facts: billFacts(input) });
  addCautionsSheet(workbook, { document: "", specTitle: input.title, facts: billFacts(input) }, input.published.design.warnings);
  return workbook;
}
