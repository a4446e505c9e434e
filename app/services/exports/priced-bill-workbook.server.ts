import type ExcelJS from "exceljs";
import type { Warning } from "~/hydraulics";
import type { BidLine } from "~/models/bid.server";
import { lineTotalCents } from "~/content/money";
import { servedBy } from "../published-design";
import {
  addTableSheet,
  engineFact,
  FILLS,
  addCautionsSheet,
  currencyFormat,
  font,
  headerDay,
  labelCell,
  money,
  newWorkbook,
  ranges,
  styleBodyRow,
  topRule,
  writeTextRow,
  type Column,
} from "./sheet-layout.server";

// The awarded bid, line by line, for the buyer's purchase order, the shop's order book and the
// account manager's file. Line totals and totals are live formulas (a buyer who changes a
// quantity sees the total follow), each carrying the result the portal worked out, so viewers
// that never recalculate still show the right figures. The retainer appears twice: worked by
// formula from the total, and as the portal charges it in exact cents, so the two can be compared.

export interface PricedBillInput {
  title: string;
  /** The revision the bid priced (not necessarily the spec's latest). */
  revision: number;
  engineVersion: string;
  buyerName: string;
  shopName: string;
  awardedAt: Date;
  currency: string;
  lines: BidLine[];
  units: number;
  setTotalCents: number;
  totalCents: number;
  /** DECIMAL(5,2) as PostgreSQL returns it, e.g. "12.50". */
  retainerPercent: string;
  retainerCents: number;
  leadTimeWeeks: number | null;
  validUntil: string | null;
  terms: string;
  /** The work beyond the bill and the shop's own lines the offer charges, each once for the order. */
  beyondBill: { name: string; cents: number }[];
  notes: string;
  /** A machine's axes (none for one axis): each line then says what it serves, and each part has its subtotal. */
  axisNames: string[];
  warnings: Warning[];
  exportedAt: Date;
}

const PRICED_SHEETS = ["Priced bill", "Cautions"] as const;

// Last, so the money columns keep their letters (E, F) whatever the bill is.
const SERVES_COLUMN: Column = { header: "Serves", width: 16, wrap: true };

function pricedColumns(currency: string, machine: boolean): Column[] {
  const fmt = currencyFormat(currency);
  return [
    { header: "Line key", width: 22 },
    { header: "Item", width: 30, wrap: true },
    { header: "Specification", width: 54, wrap: true, indent: 1 },
    { header: "Qty", width: 6, align: "right", numFmt: "0" },
    { header: "Unit price", width: 14, align: "right", numFmt: fmt },
    { header: "Line total", width: 15, align: "right", numFmt: fmt },
    { header: "Offered part", width: 14, indent: 1 },
    { header: "Alternative offered", width: 34, wrap: true },
    ...(machine ? [SERVES_COLUMN] : []),
  ];
}

function pricedFacts(input: PricedBillInput): [string, string][] {
  return [
    ["Revision priced", String(input.revision)],
    engineFact(input.engineVersion),
    ["Machine builder", input.buyerName],
    ["Fluid-power shop", input.shopName],
    ["Awarded", headerDay(input.awardedAt)],
    ["Prices in", input.currency],
    ["Lead time", input.leadTimeWeeks === null ? "not given" : `${input.leadTimeWeeks} weeks from the award`],
    ["Offer valid until", input.validUntil ? headerDay(input.validUntil) : "not given"],
    ["Exported", headerDay(input.exportedAt)],
  ];
}

function addPricedSheet(workbook: ExcelJS.Workbook, input: PricedBillInput) {
  const columns = pricedColumns(input.currency, input.axisNames.length > 0);
  const fmt = currencyFormat(input.currency);
  const block = { document: "Priced bill of the awarded bid", specTitle: input.title, facts: pricedFacts(input) };
  const { sheet, head } = addTableSheet(workbook, PRICED_SHEETS[0], columns, block);

  const first = head + 1;
  input.lines.forEach((line, i) => {
    const r = first + i;
    const row = sheet.getRow(r);
    const unitCents = line.unitPriceCents ?? 0;
    row.values = [
      line.key,
      line.item,
      line.specification,
      line.quantity,
      money(unitCents),
      { formula: `D${r}*E${r}`, result: money(lineTotalCents({ quantity: line.quantity, unitPriceCents: unitCents })) },
      line.alternative ? "Alternative" : "As specified",
      line.alternative ? line.alternativeDescription : "",
      ...(input.axisNames.length ? [servedBy(line.key, input.axisNames)] : []),
    ];
    styleBodyRow(row, columns);
    if (line.alternative) for (const c of [7, 8]) row.getCell(c).fill = FILLS.note;
  });
  const last = first + input.lines.length - 1;

  // Totals: each figure a formula over the cells above, with the portal's own figure as result.
  const set = last + 1;
  const units = set + 1;
  const extras = input.beyondBill.map((_, i) => units + 1 + i);
  const total = units + 1 + extras.length;
  const share = total + 1;
  const retainer = total + 2;
  const charged = total + 3;
  const put = (r: number, label: string, value: ExcelJS.CellValue, column = 6, bold = false) => {
    labelCell(sheet, r, label, bold);
    const cell = sheet.getCell(r, column);
    cell.value = value;
    cell.font = font({ bold });
    cell.alignment = { horizontal: "right" };
    return cell;
  };
  put(set, "Set total, one of each line", { formula: `SUM(F${first}:F${last})`, result: money(input.setTotalCents) }).numFmt = fmt;
  for (let c = 1; c <= columns.length; c++) topRule(sheet.getCell(set, c));
  put(units, "Units wanted", input.units, 4).numFmt = "0";
  input.beyondBill.forEach((extra, i) => (put(extras[i], `${extra.name} (whole order)`, money(extra.cents)).numFmt = fmt));
  const totalCell = put(
    total,
    `Total for ${input.units} unit${input.units === 1 ? "" : "s"}`,
    { formula: `F${set}*D${units}${extras.length ? `+SUM(F${extras[0]}:F${extras[extras.length - 1]})` : ""}`, result: money(input.totalCents) },
    6,
    true,
  );
  totalCell.numFmt = fmt;
  totalCell.fill = FILLS.head;
  put(share, "Retainer share", Number(input.retainerPercent) / 100, 5).numFmt = "0.00%";
  put(retainer, "Retainer amount (total × share, rounded to the cent)", {
    formula: `ROUND(F${total}*E${share},2)`,
    result: money(input.retainerCents),
  }).numFmt = fmt;
  put(charged, "Retainer as the portal charges it (exact cents)", money(input.retainerCents)).numFmt = fmt;

  let at = charged + 2;
  // A machine: what the power unit and each axis cost in one set, each a SUM over its own lines.
  const parts = new Map<string, number[]>();
  input.lines.forEach((line, i) => {
    const serves = servedBy(line.key, input.axisNames);
    if (serves !== null) parts.set(serves, [...(parts.get(serves) ?? []), first + i]);
  });
  for (const [serves, rows] of parts) {
    const cents = rows.reduce(
      (sum, r) => sum + lineTotalCents({ quantity: input.lines[r - first].quantity, unitPriceCents: input.lines[r - first].unitPriceCents ?? 0 }),
      0,
    );
    put(at++, `${serves}, one set`, { formula: `SUM(${ranges("F", rows)})`, result: money(cents) }).numFmt = fmt;
  }
  if (parts.size) at++;
  if (input.terms.trim()) writeTextRow(sheet, at++, "Terms", input.terms.trim(), columns);
  if (input.notes.trim()) writeTextRow(sheet, at++, "Notes", input.notes.trim(), columns);
  return { sheet, first, last, set, units, total, share, retainer, charged };
}

export function buildPricedBillWorkbook(input: PricedBillInput): ExcelJS.Workbook {
  const workbook = newWorkbook();
  workbook.title = `${input.title} - revision ${input.revision} - priced bill`;
  addPricedSheet(workbook, input);
  addCautionsSheet(workbook, { document: "", specTitle: input.title, facts: pricedFacts(input).slice(0, 4) }, input.warnings);
  return workbook;
}
