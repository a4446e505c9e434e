import ExcelJS from "exceljs";
import { CIRCUIT_CAUTIONS } from "~/content/cautions";
import type { Warning } from "~/hydraulics";
import { warningTitle } from "~/content/warning-titles";
import { formatDay } from "~/content/dates";

// The look every workbook shares: a header block naming the document and the spec, one styled
// table header row that stays frozen (and repeats on printed pages), widths chosen per column,
// row heights worked out for wrapped text, and the cautions. Plain and neutral, no logo: these
// sheets end up inside other companies' files.

export const XLSX_TYPE = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";

export interface Column {
  header: string;
  /** In characters of the default font. */
  width: number;
  wrap?: boolean;
  numFmt?: string;
  align?: "left" | "right" | "center";
  /** Left indent in characters: keeps text clear of a right-aligned number beside it. */
  indent?: number;
}

export interface HeaderBlock {
  /** What the document is: "Bill of materials". */
  document: string;
  specTitle: string;
  facts: [label: string, value: string][];
}

const FILL_HEAD = "FFE4E9EF";
const FILL_NOTE = "FFFFF2CC";
const FILL_GOOD = "FFD9EAD3";
const INK_MUTED = "FF5B6573";
const thin = { style: "thin" as const, color: { argb: "FFB7C0CC" } };

/** Fonts are named in full: a cell given only { bold } would lose the workbook's font. */
export const font = (extra: Partial<ExcelJS.Font> = {}): Partial<ExcelJS.Font> => ({ name: "Calibri", size: 11, ...extra });

export const fill = (argb: string): ExcelJS.Fill => ({ type: "pattern", pattern: "solid", fgColor: { argb } });
export const FILLS = { head: fill(FILL_HEAD), note: fill(FILL_NOTE), good: fill(FILL_GOOD) };

export function newWorkbook(): ExcelJS.Workbook {
  const workbook = new ExcelJS.Workbook();
  workbook.creator = "Tenderflow";
  workbook.created = new Date();
  workbook.calcProperties.fullCalcOnLoad = true;
  return workbook;
}

/** A sheet with its columns set; `landscape` for wide tables. */
export function addSheet(workbook: ExcelJS.Workbook, name: string, columns: Column[], landscape = true) {
  const sheet = workbook.addWorksheet(name, {
    pageSetup: {
      paperSize: 9,
      orientation: landscape ? "landscape" : "portrait",
      fitToPage: true,
      fitToWidth: 1,
      fitToHeight: 0,
      margins: { left: 0.5, right: 0.5, top: 0.6, bottom: 0.6, header: 0.3, footer: 0.3 },
    },
    headerFooter: { oddFooter: `&L&8${name}&R&8Page &P of &N` },
    views: [{ showGridLines: false }],
  });
  // exceljs leaves out a column whose width equals its default (9), which Excel then shows at
  // 8.43: nudge such a width so every column keeps the width chosen for it.
  sheet.columns = columns.map((c) => ({ width: c.width === 9 ? 9.01 : c.width }));
  return sheet;
}

/** The header fact naming the sizing engine's version a document's figures come from. */
export const engineFact = (version: string): [string, string] => ["Sizing engine", `version ${version}`];

/** Writes the header block from row 1; returns the row the table header goes on. */
export function writeHeaderBlock(sheet: ExcelJS.Worksheet, block: HeaderBlock): number {
  sheet.getCell("A1").value = block.document;
  sheet.getCell("A1").font = font({ bold: true, size: 14 });
  sheet.getCell("A2").value = block.specTitle || "Untitled spec";
  sheet.getCell("A2").font = font({ bold: true, size: 12 });
  let row = 3;
  for (const [label, value] of block.facts) {
    sheet.getCell(row, 1).value = label;
    sheet.getCell(row, 1).font = font({ color: { argb: INK_MUTED } });
    sheet.getCell(row, 2).value = value;
    row++;
  }
  return row + 1;
}

/** Styles one table header row: the columns' labels, aligned like their values, wrapped to fit. */
export function writeTableHeader(sheet: ExcelJS.Worksheet, rowNumber: number, labels: string[], columns?: Column[]) {
  const row = sheet.getRow(rowNumber);
  labels.forEach((label, i) => {
    const cell = row.getCell(1 + i);
    cell.value = label;
    styleHeadCell(cell, columns?.[i]);
  });
  if (columns)
    fitHeight(
      row,
      columns.map((c) => ({ ...c, wrap: true })),
    );
  row.height = Math.max(row.height ?? 0, 20);
  return row;
}

// An indent only works on left- or right-aligned text, so an indented column is left-aligned.
const horizontal = (c?: Column): Partial<ExcelJS.Alignment> =>
  c?.indent ? { horizontal: c.align ?? "left", indent: c.indent } : c?.align ? { horizontal: c.align } : {};

export function styleHeadCell(cell: ExcelJS.Cell, column?: Column) {
  cell.font = font({ bold: true });
  cell.fill = FILLS.head;
  cell.border = { bottom: thin, top: thin };
  cell.alignment = { vertical: "middle", wrapText: true, ...horizontal(column) };
}

/** Alignment, wrapping and number format of each body cell from its column; then the height. */
export function styleBodyRow(row: ExcelJS.Row, columns: Column[]) {
  columns.forEach((c, i) => {
    const cell = row.getCell(i + 1);
    cell.alignment = { vertical: "top", wrapText: c.wrap ?? false, ...horizontal(c) };
    if (c.numFmt && !cell.numFmt) cell.numFmt = c.numFmt;
    cell.border = { bottom: { style: "hair", color: { argb: "FFD5DBE3" } } };
  });
  fitHeight(row, columns);
}

/**
 * Excel keeps a row at its stored height, so rows with wrapped text are given one: the most
 * lines any wrapped cell needs at its column's width (the width unit is one digit of the default
 * font; text averages about 0.85 of it, which leaves room for words moved to the next line).
 */
function fitHeight(row: ExcelJS.Row, columns: Column[]) {
  let lines = 1;
  columns.forEach((c, i) => {
    if (!c.wrap) return;
    const text = String(row.getCell(i + 1).text ?? "");
    const room = Math.max(1, c.width - (c.indent ?? 0));
    const needed = text.split("\n").reduce((sum, part) => sum + Math.max(1, Math.ceil((part.length * 0.85) / room)), 0);
    lines = Math.max(lines, needed);
  });
  if (lines > 1) row.height = lines * 15 + 3;
}

/**
 * Freezes everything down to `headerRow` (and the first `columns` columns, for wide tables) and
 * repeats the table's header rows on every printed page.
 */
export function freezeAt(sheet: ExcelJS.Worksheet, headerRow: number, options: { firstHeaderRow?: number; columns?: number } = {}) {
  const columns = options.columns ?? 0;
  const topLeft = `${sheet.getColumn(columns + 1).letter}${headerRow + 1}`;
  sheet.views = [{ state: "frozen", xSplit: columns, ySplit: headerRow, topLeftCell: topLeft, showGridLines: false }];
  sheet.pageSetup.printTitlesRow = `${options.firstHeaderRow ?? headerRow}:${headerRow}`;
}

/**
 * A sheet holding one table: its columns, the header block, and the table's header row (the
 * columns' labels) frozen and repeated on printed pages. Returns the sheet and the number of that
 * header row; the table's rows follow it.
 */
export function addTableSheet(workbook: ExcelJS.Workbook, name: string, columns: Column[], block: HeaderBlock, landscape = true) {
  const sheet = addSheet(workbook, name, columns, landscape);
  const head = writeHeaderBlock(sheet, block);
  writeTableHeader(
    sheet,
    head,
    columns.map((c) => c.header),
    columns,
  );
  freezeAt(sheet, head);
  return { sheet, head };
}

/** A label in the first column and a value further right, for footers and totals. */
export function labelCell(sheet: ExcelJS.Worksheet, rowNumber: number, label: string, bold = false) {
  const cell = sheet.getCell(rowNumber, 1);
  cell.value = label;
  cell.font = font({ bold });
  return cell;
}

export const topRule = (cell: ExcelJS.Cell) => {
  cell.border = { ...cell.border, top: { style: "thin", color: { argb: "FF6B7684" } } };
};

/** A day of the header block, written as every page and e-mail writes it. */
export const headerDay = (moment: Date | string) => formatDay(moment);

/** A calendar day (YYYY-MM-DD) as the date Excel stores: midnight UTC, which exceljs writes as the day. */
export const excelDay = (day: string) => new Date(`${day.slice(0, 10)}T00:00:00Z`);
export const DAY_FORMAT = "d mmm yyyy";

/**
 * The cautions shown with every preliminary circuit, and the engine's warnings for this design,
 * on a sheet of their own (product brief: "in every export").
 */
export function addCautionsSheet(workbook: ExcelJS.Workbook, block: HeaderBlock, warnings: Warning[]) {
  const columns: Column[] = [
    { header: "", width: 30, wrap: true },
    { header: "", width: 100, wrap: true },
    { header: "", width: 26 },
  ];
  const sheet = addSheet(workbook, "Cautions", columns, false);
  let row = writeHeaderBlock(sheet, { ...block, document: "Cautions and warnings" });
  writeTableHeader(sheet, row, ["Caution", "Before anyone builds this"]);
  freezeAt(sheet, row);
  CIRCUIT_CAUTIONS.forEach((text, i) => {
    const r = sheet.getRow(++row);
    r.values = [`Caution ${i + 1}`, text];
    styleBodyRow(r, columns);
  });
  row += 2;
  writeTableHeader(sheet, row, ["Warning", "From the sizing engine, for the reviewing engineer", "Code"]);
  if (!warnings.length) {
    const r = sheet.getRow(++row);
    r.values = ["None", "Nothing in this design is flagged beyond the cautions above."];
    styleBodyRow(r, columns);
  }
  for (const w of warnings) {
    const r = sheet.getRow(++row);
    r.values = [warningTitle(w.code), w.message, w.code];
    styleBodyRow(r, columns);
  }
  return sheet;
}

/** "£"#,##0.00: the currency as the app writes it (formatMoney, en-GB), as an Excel format. */
export function currencyFormat(currency: string): string {
  const parts = new Intl.NumberFormat("en-GB", { style: "currency", currency }).formatToParts(1);
  const at = parts.findIndex((p) => p.type === "integer");
  const text = (list: Intl.NumberFormatPart[]) =>
    list
      .map((p) => p.value)
      .join("")
      .replace(/\u00a0/g, " ")
      .replace(/"/g, "");
  const before = text(parts.slice(0, at));
  const after = text(parts.slice(parts.findIndex((p) => p.type === "fraction") + 1));
  const quoted = (s: string) => (s ? `"${s}"` : "");
  const body = `${quoted(before)}#,##0.00${quoted(after)}`;
  return `${body};-${body}`;
}

/** Integer cents as the number a money cell holds. */
export const money = (cents: number) => cents / 100;

/**
 * Rating and trail values keep their full precision in the cell; the format shows whole
 * numbers as such and fractions with the figures a reader needs (0.0042 is not shown as 0.00).
 */
export function quantityFormat(value: number): string {
  const abs = Math.abs(value);
  if (Number.isInteger(value)) return "#,##0";
  if (abs >= 100) return "#,##0.0";
  if (abs >= 1) return "#,##0.0#";
  return "0.0###";
}

/** Input values in a trail's text: six significant figures are plenty to follow a formula. */
export const shortNumber = (value: number) => String(Number(value.toPrecision(6)));

/** The workbook's file, as bytes a Response can carry. */
export async function xlsxBytes(workbook: ExcelJS.Workbook): Promise<Uint8Array<ArrayBuffer>> {
  const written = new Uint8Array(await workbook.xlsx.writeBuffer());
  const bytes = new Uint8Array(written.byteLength);
  bytes.set(written);
  return bytes;
}

/** A label and a long text spanning the rest of the table's width, wrapped (notes, purposes). */
export function writeTextRow(sheet: ExcelJS.Worksheet, rowNumber: number, label: string, text: string, columns: Column[]) {
  const row = sheet.getRow(rowNumber);
  row.getCell(1).value = label;
  row.getCell(1).alignment = { vertical: "top", wrapText: true };
  row.getCell(2).value = text;
  row.getCell(2).alignment = { vertical: "top", wrapText: true };
  if (columns.length > 2) sheet.mergeCells(rowNumber, 2, rowNumber, columns.length);
  const rest = columns.slice(1).reduce((sum, c) => sum + c.width, 0);
  fitHeight(row, [
    { ...columns[0], wrap: true },
    { header: "", width: rest, wrap: true },
  ]);
  return row;
}

/** "F3:F10,F14": the rows as few ranges of one column. */
export function ranges(column: string, rows: number[]): string {
  const runs: [number, number][] = [];
  for (const r of rows) {
    const run = runs[runs.length - 1];
    if (run && r === run[1] + 1) run[1] = r;
    else runs.push([r, r]);
  }
  return runs.map(([a, b]) => (a === b ? `${column}${a}` : `${column}${a}:${column}${b}`)).join(",");
}
