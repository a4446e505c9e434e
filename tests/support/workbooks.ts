// Reading exported workbooks back in tests: open the bytes with exceljs, find rows by their
// label, and work formulas out from the cells they reference (never from the results the
// exporter stored beside them), so a test sees what a spreadsheet would compute.
import ExcelJS from "exceljs";

export async function openWorkbook(bytes: Uint8Array) {
  const workbook = new ExcelJS.Workbook();
  await workbook.xlsx.load(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer);
  return workbook;
}

/** The number of the first row whose cell in `column` reads `text`; fails when there is none. */
export function rowOf(sheet: ExcelJS.Worksheet, text: string, column = 1): number {
  for (let r = 1; r <= sheet.rowCount; r++) if (sheet.getCell(r, column).text === text) return r;
  throw new Error(`No row reads "${text}" in column ${column} of ${sheet.name}`);
}

/** The header block's facts: label in column A, value in column B, up to the first empty row. */
export function factsOf(sheet: ExcelJS.Worksheet): Record<string, string> {
  const facts: Record<string, string> = {};
  for (let r = 3; sheet.getCell(r, 1).text; r++) facts[sheet.getCell(r, 1).text] = sheet.getCell(r, 2).text;
  return facts;
}

export const rowValues = (sheet: ExcelJS.Worksheet, r: number, width: number) =>
  Array.from({ length: width }, (_, i) => {
    const v = sheet.getCell(r, i + 1).value;
    return v === undefined ? null : v;
  });

type Value = number | string | Date | null;

/** A formula cell's formula text, or null. */
export function formulaOf(cell: ExcelJS.Cell): string | null {
  const v = cell.value;
  return v && typeof v === "object" && "formula" in v && typeof v.formula === "string" ? v.formula : null;
}

/** What the cell holds, formulas worked out from their references. */
export function evaluate(sheet: ExcelJS.Worksheet, address: string): Value {
  const cell = sheet.getCell(address.replace(/\$/g, ""));
  const formula = formulaOf(cell);
  if (formula !== null) return evaluateFormula(sheet, formula);
  const v = cell.value;
  if (v === null || v === undefined) return null;
  if (typeof v === "number" || typeof v === "string" || v instanceof Date) return v;
  return cell.text;
}

// Excel's ROUND works on the decimal figures it shows (15 significant digits), half away from zero.
function excelRound(x: number, digits: number) {
  const scaled = Number((Number(x.toPrecision(15)) * 10 ** digits).toPrecision(15));
  return (Math.sign(scaled) * Math.round(Math.abs(scaled))) / 10 ** digits;
}

const TOKEN = /\s*(\$?[A-Z]{1,3}\$?\d+(?::\$?[A-Z]{1,3}\$?\d+)?|\d+(?:\.\d+)?|[A-Z]+(?=\()|[-+*/(),])/y;

/** A small evaluator for the formulas the exports write: + - * /, SUM, MIN, ROUND, cells and ranges. */
export function evaluateFormula(sheet: ExcelJS.Worksheet, formula: string): number {
  const tokens: string[] = [];
  TOKEN.lastIndex = 0;
  let m: RegExpExecArray | null;
  while (TOKEN.lastIndex < formula.length && (m = TOKEN.exec(formula))) tokens.push(m[1]);
  if (tokens.join("") !== formula.replace(/\s/g, "")) throw new Error(`Cannot read formula ${formula}`);
  let at = 0;
  const peek = () => tokens[at];
  const take = (expected?: string) => {
    const t = tokens[at++];
    if (expected && t !== expected) throw new Error(`Expected ${expected} in ${formula}`);
    return t;
  };
  const numberAt = (ref: string) => {
    const v = evaluate(sheet, ref);
    if (v === null) return 0;
    if (typeof v !== "number") throw new Error(`#VALUE!: ${ref} holds ${String(v)} in ${formula}`);
    return v;
  };
  // Function arguments: references and ranges give every number they hold (text is skipped).
  const numbersOf = (): number[] => {
    const t = peek();
    if (/^\$?[A-Z]+\$?\d+:/.test(t)) {
      take();
      const [from, to] = t
        .replace(/\$/g, "")
        .split(":")
        .map((a) => sheet.getCell(a));
      const list: number[] = [];
      for (let r = Number(from.row); r <= Number(to.row); r++) {
        for (let c = Number(from.col); c <= Number(to.col); c++) {
          const v = evaluate(sheet, sheet.getCell(r, c).address);
          if (typeof v === "number") list.push(v);
        }
      }
      return list;
    }
    if (/^\$?[A-Z]+\$?\d+$/.test(t) && [",", ")"].includes(tokens[at + 1])) {
      take();
      const v = evaluate(sheet, t);
      return typeof v === "number" ? [v] : [];
    }
    return [expression()];
  };
  const call = (name: string): number => {
    take("(");
    const args: number[][] = [];
    while (peek() !== ")") {
      args.push(numbersOf());
      if (peek() === ",") take(",");
    }
    take(")");
    const all = args.flat();
    if (name === "SUM") return all.reduce((s, x) => s + x, 0);
    if (name === "MIN") return all.length ? Math.min(...all) : 0;
    if (name === "ROUND") return excelRound(args[0][0], args[1][0]);
    throw new Error(`Unknown function ${name} in ${formula}`);
  };
  const primary = (): number => {
    const t = take();
    if (t === "-") return -primary();
    if (t === "(") {
      const v = expression();
      take(")");
      return v;
    }
    if (/^\d/.test(t)) return Number(t);
    if (/^[A-Z]+$/.test(t) && peek() === "(") return call(t);
    if (/^\$?[A-Z]+\$?\d+$/.test(t)) return numberAt(t);
    throw new Error(`Unexpected ${t} in ${formula}`);
  };
  const term = (): number => {
    let v = primary();
    while (peek() === "*" || peek() === "/") v = take() === "*" ? v * primary() : v / primary();
    return v;
  };
  function expression(): number {
    let v = term();
    while (peek() === "+" || peek() === "-") v = take() === "+" ? v + term() : v - term();
    return v;
  }
  const value = expression();
  if (at !== tokens.length) throw new Error(`Left over in ${formula}: ${tokens.slice(at).join("")}`);
  return value;
}

/** A money cell's worked-out value in whole cents. */
export const centsAt = (sheet: ExcelJS.Worksheet, address: string) => Math.round((evaluate(sheet, address) as number) * 100);

/** RFC 4180 CSV: quoted fields may hold commas, quotes ("") and line breaks. */
export function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let field = "";
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') {
        field += '"';
        i++;
      } else if (c === '"') quoted = false;
      else field += c;
    } else if (c === '"') quoted = true;
    else if (c === ",") {
      row.push(field);
      field = "";
    } else if (c === "\n" || c === "\r") {
      if (c === "\r" && text[i + 1] === "\n") i++;
      row.push(field);
      rows.push(row);
      row = [];
      field = "";
    } else field += c;
  }
  if (field || row.length) rows.push([...row, field]);
  return rows;
}
