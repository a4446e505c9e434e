import type ExcelJS from "exceljs";
import type { Warning } from "~/hydraulics";
import { BID_STATUS_LABELS } from "~/content/bid-status";
import { formatMoney } from "~/content/money";
import type { compareBids } from "../bid-comparison";
import {
  addTableSheet,
  engineFact,
  DAY_FORMAT,
  FILLS,
  addCautionsSheet,
  addSheet,
  currencyFormat,
  excelDay,
  font,
  freezeAt,
  headerDay,
  labelCell,
  money,
  newWorkbook,
  ranges,
  styleBodyRow,
  styleHeadCell,
  topRule,
  writeHeaderBlock,
  writeTableHeader,
  type Column,
} from "./sheet-layout.server";

// The buyer's comparison as a workbook: the bill's lines down, each offer across (unit price, a
// live line total and the alternative offered), the lowest of each line, then per offer the
// set total (SUM), the bill for every unit wanted, the work beyond the bill by kind and the
// shop's own lines, the offer total (a formula over them), the like-for-like figure and the
// difference to the cheapest complete offer on it, lead time, validity, the terms, what each
// leaves out and the flags the page shows. The marks are the comparison
// service's, so the sheet and the page never disagree about what is lowest.

export type Comparison = ReturnType<typeof compareBids>;

export interface ComparisonInput {
  title: string;
  revision: number;
  engineVersion: string;
  buyerName: string;
  currency: string;
  comparison: Comparison;
  /** Per bid id: what the comparison leaves out. */
  offers: Record<string, { units: number; notes: string }>;
  warnings: Warning[];
  exportedAt: Date;
}

const COMPARISON_SHEETS = ["Comparison", "Offers", "Cautions"] as const;
const FIXED = 4;
const PER_SHOP = 3;

/** Columns of offer `i` (0-based): unit price, line total, alternative. */
const shopColumns = (i: number) => ({ unit: FIXED + 1 + PER_SHOP * i, total: FIXED + 2 + PER_SHOP * i, alternative: FIXED + 3 + PER_SHOP * i });

function comparisonColumns(shops: number, fmt: string, machine: boolean): Column[] {
  const perShop: Column[] = [
    { header: "Unit price", width: 13, align: "right", numFmt: fmt },
    { header: "Line total", width: 14, align: "right", numFmt: fmt },
    { header: "Alternative offered", width: 20, wrap: true, indent: 1 },
  ];
  return [
    { header: "Line key", width: 20 },
    { header: "Item", width: 28, wrap: true },
    { header: "Qty", width: 6, align: "right", numFmt: "0" },
    // A machine's lines say which axis (or the power unit) they serve here.
    { header: machine ? "Serves; note" : "Note", width: machine ? 18 : 14, wrap: true, indent: 1 },
    ...Array.from({ length: shops }, () => perShop).flat(),
    ...(shops ? [{ header: "Lowest line total", width: 14, align: "right" as const, numFmt: fmt }] : []),
  ];
}

function comparisonFacts(input: ComparisonInput): [string, string][] {
  return [
    ["Current revision", String(input.revision)],
    engineFact(input.engineVersion),
    ["Machine builder", input.buyerName],
    ["Prices in", input.currency],
    ["Exported", headerDay(input.exportedAt)],
  ];
}

const MARKS: [string, string] = [
  "Marks",
  "Green: the lowest price of a line, the cheapest complete offer, the shortest lead time. Yellow: alternatives, earlier revisions, missing lines.",
];

function addComparisonSheet(workbook: ExcelJS.Workbook, input: ComparisonInput) {
  const { columns: offers, rows, cheapestCompleteId } = input.comparison;
  const fmt = currencyFormat(input.currency);
  const columns = comparisonColumns(
    offers.length,
    fmt,
    rows.some((r) => r.serves !== null),
  );
  const sheet = addSheet(workbook, COMPARISON_SHEETS[0], columns);
  const shopsRow = writeHeaderBlock(sheet, { document: "Comparison of the offers", specTitle: input.title, facts: [...comparisonFacts(input), MARKS] });
  const head = shopsRow + 1;
  writeTableHeader(
    sheet,
    head,
    columns.map((c) => c.header),
    columns,
  );
  // The row above the sub-headers names each offer's shop across its three columns.
  for (let c = 1; c <= columns.length; c++) styleHeadCell(sheet.getCell(shopsRow, c));
  sheet.getCell(shopsRow, 1).value = `Bill of materials, revision ${input.revision}`;
  sheet.mergeCells(shopsRow, 1, shopsRow, FIXED);
  sheet.getRow(shopsRow).height = 20;
  offers.forEach((offer, i) => {
    const { unit, alternative } = shopColumns(i);
    sheet.getCell(shopsRow, unit).value = offer.shop;
    sheet.mergeCells(shopsRow, unit, shopsRow, alternative);
    sheet.getCell(shopsRow, unit).alignment = { horizontal: "center", vertical: "bottom", wrapText: true };
  });
  freezeAt(sheet, head, { firstHeaderRow: shopsRow, columns: 2 });

  const first = head + 1;
  const last = first + rows.length - 1;
  const lowestColumn = FIXED + PER_SHOP * offers.length + 1;
  rows.forEach((line, r) => {
    const at = first + r;
    const row = sheet.getRow(at);
    row.values = [line.key, line.item, line.quantity, [line.serves, line.inCurrentBill ? null : "Only in an earlier revision"].filter(Boolean).join("; ")];
    line.cells.forEach((cell, i) => {
      const c = shopColumns(i);
      if (!cell) {
        row.getCell(c.total).value = "not priced";
        return;
      }
      // A bid made on an earlier revision may have priced another quantity of the line.
      const quantity = cell.unitPriceCents ? cell.lineTotalCents / cell.unitPriceCents : line.quantity;
      const qtyRef = quantity === line.quantity ? `C${at}` : String(quantity);
      row.getCell(c.unit).value = money(cell.unitPriceCents);
      row.getCell(c.total).value = { formula: `${qtyRef}*${sheet.getColumn(c.unit).letter}${at}`, result: money(cell.lineTotalCents) };
      if (cell.alternative) row.getCell(c.alternative).value = cell.alternativeDescription || "yes";
    });
    const present = line.cells.filter((c) => c !== null);
    if (offers.length && present.length) {
      const refs = offers.map((_, i) => `${sheet.getColumn(shopColumns(i).total).letter}${at}`).join(",");
      row.getCell(lowestColumn).value = { formula: `MIN(${refs})`, result: money(Math.min(...present.map((c) => c.lineTotalCents))) };
    }
    styleBodyRow(row, columns);
    line.cells.forEach((cell, i) => {
      const c = shopColumns(i);
      if (!cell) row.getCell(c.total).font = font({ italic: true, color: { argb: "FF8A94A3" } });
      if (cell?.lowest) for (const k of [c.unit, c.total]) row.getCell(k).fill = FILLS.good;
      if (cell?.lowest) row.getCell(c.total).font = font({ bold: true });
      if (cell?.alternative) row.getCell(c.alternative).fill = FILLS.note;
    });
    if (!line.inCurrentBill) row.getCell(4).fill = FILLS.note;
  });

  const footer = writeOfferFooter(sheet, input, { first, last, cheapestCompleteId, fmt, width: columns.length });
  writeSubtotals(sheet, input, { first, fmt, after: footer.alternatives });
  // A rule down the left of each offer (and of the lowest column) keeps the shops apart.
  const starts = [...offers.map((_, i) => shopColumns(i).unit), ...(offers.length ? [lowestColumn] : [])];
  for (let r = shopsRow; r <= footer.alternatives; r++) {
    for (const c of starts) {
      const cell = sheet.getCell(r, c);
      cell.border = { ...cell.border, left: { style: "thin", color: { argb: "FFB7C0CC" } } };
    }
  }
  return { sheet, first, last };
}

function writeOfferFooter(
  sheet: ExcelJS.Worksheet,
  input: ComparisonInput,
  at: { first: number; last: number; cheapestCompleteId: string | null; fmt: string; width: number },
) {
  const offers = input.comparison.columns;
  const { extraRows } = input.comparison;
  let next = at.last;
  const row = () => ++next;
  const [set, units, bill] = [row(), row(), row()];
  const extras = extraRows.map(() => row());
  const [own, total, like, more, lead, valid, delivery, payment, warranty, leaves, status, revision, complete, alternatives, circuit] = Array.from(
    { length: 15 },
    row,
  );
  const labels: [number, string, boolean][] = [
    [set, "Set total, one of each line", true],
    [units, "Units", false],
    [bill, "The bill for every unit", false],
    ...extraRows.map((r, k): [number, string, boolean] => [extras[k], `${r.name} (whole order)`, false]),
    [own, "The shop's own lines (whole order)", false],
    [total, "Offer total", true],
    [like, "Like for like: the bill and the work every offer covers", true],
    [more, "More than the cheapest complete offer, like for like", false],
    [lead, "Lead time (weeks)", false],
    [valid, "Valid until", false],
    [delivery, "Delivery (Incoterms 2020)", false],
    [payment, "Payment", false],
    [warranty, "Warranty", false],
    [leaves, "Leaves out", false],
    [status, "Status", false],
    [revision, "Revision priced", false],
    [complete, "Every current line priced", false],
    [alternatives, "Alternative parts", false],
    [circuit, "Alternative circuit, every unit (not like for like)", false],
  ];
  for (const [r, label, bold] of labels) labelCell(sheet, r, label, bold);
  for (let c = 1; c <= at.width; c++) topRule(sheet.getCell(set, c));
  const cheapestIndex = offers.findIndex((o) => o.id === at.cheapestCompleteId);
  const letter = (i: number) => sheet.getColumn(shopColumns(i).total).letter;

  offers.forEach((offer, i) => {
    const col = shopColumns(i).total;
    const L = letter(i);
    const cell = (r: number, value: ExcelJS.CellValue, numFmt?: string) => {
      const target = sheet.getCell(r, col);
      target.value = value;
      target.alignment = { horizontal: "right", wrapText: typeof value === "string" };
      if (numFmt) target.numFmt = numFmt;
      return target;
    };
    const units_ = input.offers[offer.id]?.units ?? 1;
    cell(set, { formula: `SUM(${L}${at.first}:${L}${at.last})`, result: money(offer.setTotalCents) }, at.fmt).font = font({ bold: true });
    cell(units, units_, "0");
    cell(bill, { formula: `${L}${set}*${L}${units}`, result: money(offer.totalCents - offer.extrasCents) }, at.fmt);
    extraRows.forEach((r, k) => {
      const answer = r.cells[i];
      const target =
        answer.answer === "priced"
          ? cell(extras[k], money(answer.priceCents ?? 0), at.fmt)
          : cell(extras[k], answer.answer === "included" ? "Included" : "Not offered");
      if (answer.lowest) target.fill = FILLS.good;
      if (answer.answer === "not_offered") target.fill = FILLS.note;
    });
    cell(own, money(offer.ownLines.reduce((sum, l) => sum + l.priceCents, 0)), at.fmt);
    const totalCell = cell(total, { formula: `${L}${bill}+SUM(${L}${extras[0] ?? own}:${L}${own})`, result: money(offer.totalCents) }, at.fmt);
    totalCell.font = font({ bold: true });
    const likeCell = cell(like, money(offer.likeForLikeCents), at.fmt);
    likeCell.font = font({ bold: true });
    if (offer.cheapestComplete) likeCell.fill = FILLS.good;
    if (cheapestIndex >= 0 && i !== cheapestIndex) {
      const cheapest = offers[cheapestIndex];
      cell(more, { formula: `${L}${like}-$${letter(cheapestIndex)}$${like}`, result: money(offer.likeForLikeCents - cheapest.likeForLikeCents) }, at.fmt);
    }
    if (offer.leadTimeWeeks !== null) {
      const weeks = cell(lead, offer.leadTimeWeeks, "0");
      if (offer.shortestLead) weeks.fill = FILLS.good;
    }
    if (offer.validUntil) cell(valid, excelDay(offer.validUntil), DAY_FORMAT);
    cell(delivery, offer.delivery ?? "not stated");
    cell(payment, offer.payment ?? "not stated");
    cell(warranty, offer.warranty ?? "not stated");
    if (offer.leavesOut.length) cell(leaves, offer.leavesOut.join("; ")).fill = FILLS.note;
    cell(status, BID_STATUS_LABELS[offer.status]);
    const rev = cell(revision, offer.olderRevision ? `${offer.specRevision} (earlier)` : String(offer.specRevision));
    if (offer.olderRevision) rev.fill = FILLS.note;
    const done = cell(complete, offer.complete ? "Yes" : "No, lines missing");
    if (!offer.complete) done.fill = FILLS.note;
    const alts = cell(alternatives, offer.alternatives, "0");
    if (offer.alternatives) alts.fill = FILLS.note;
    if (offer.alternativeCircuit) cell(circuit, money(offer.alternativeCircuit.totalCents), at.fmt).fill = FILLS.note;
  });
  return { set, units, total, more, lead, valid, status, revision, complete, alternatives: circuit };
}

/**
 * A machine: below the footer, what each offer asks for the power unit and for each axis (one
 * set), each a SUM over that part's lines of the current bill, with the comparison's own sum as result.
 */
function writeSubtotals(sheet: ExcelJS.Worksheet, input: ComparisonInput, at: { first: number; fmt: string; after: number }) {
  const { rows, subtotals, columns: offers } = input.comparison;
  let r = at.after + 1;
  for (const part of subtotals) {
    const lines = rows.flatMap((row, i) => (row.inCurrentBill && row.serves === part.serves ? [at.first + i] : []));
    labelCell(sheet, ++r, `${part.serves}, one set`);
    offers.forEach((_, i) => {
      const cents = part.cents[i];
      if (cents === null) return;
      const col = shopColumns(i).total;
      const cell = sheet.getCell(r, col);
      cell.value = { formula: `SUM(${ranges(sheet.getColumn(col).letter, lines)})`, result: money(cents) };
      cell.numFmt = at.fmt;
      cell.alignment = { horizontal: "right" };
    });
  }
}

const OFFER_COLUMNS = (fmt: string): Column[] => [
  { header: "Shop", width: 28, wrap: true },
  { header: "Status", width: 12 },
  { header: "Revision priced", width: 10, align: "right", wrap: true },
  { header: "Set total", width: 14, align: "right", numFmt: fmt },
  { header: "Units", width: 7, align: "right", numFmt: "0" },
  { header: "Offer total", width: 15, align: "right", numFmt: fmt },
  { header: "Lead time (weeks)", width: 10, align: "right", numFmt: "0", wrap: true },
  { header: "Valid until", width: 13, align: "right", numFmt: DAY_FORMAT },
  { header: "Delivery (Incoterms 2020)", width: 28, wrap: true, indent: 1 },
  { header: "Payment", width: 30, wrap: true },
  { header: "Warranty", width: 14, wrap: true },
  { header: "Leaves out", width: 30, wrap: true },
  { header: "Alternative circuit", width: 40, wrap: true },
  { header: "Notes", width: 40, wrap: true },
];

function addOffersSheet(workbook: ExcelJS.Workbook, input: ComparisonInput) {
  const columns = OFFER_COLUMNS(currencyFormat(input.currency));
  const block = { document: "The offers and their terms", specTitle: input.title, facts: comparisonFacts(input) };
  const { sheet, head } = addTableSheet(workbook, COMPARISON_SHEETS[1], columns, block);
  input.comparison.columns.forEach((offer, i) => {
    const r = head + 1 + i;
    const extra = input.offers[offer.id] ?? { units: 1, notes: "" };
    const circuit = offer.alternativeCircuit;
    const row = sheet.getRow(r);
    row.values = [
      offer.shop,
      BID_STATUS_LABELS[offer.status],
      offer.specRevision,
      money(offer.setTotalCents),
      extra.units,
      money(offer.totalCents),
      offer.leadTimeWeeks ?? "",
      offer.validUntil ? excelDay(offer.validUntil) : "",
      offer.delivery ?? "",
      offer.payment ?? "",
      offer.warranty ?? "",
      offer.leavesOut.join("; "),
      circuit ? `${circuit.description} (${formatMoney(circuit.totalCents, input.currency)})` : "",
      extra.notes,
    ];
    styleBodyRow(row, columns);
  });
}

export function buildComparisonWorkbook(input: ComparisonInput): ExcelJS.Workbook {
  const workbook = newWorkbook();
  workbook.title = `${input.title} - revision ${input.revision} - comparison of offers`;
  addComparisonSheet(workbook, input);
  addOffersSheet(workbook, input);
  addCautionsSheet(workbook, { document: "", specTitle: input.title, facts: comparisonFacts(input).slice(0, 3) }, input.warnings);
  return workbook;
}
