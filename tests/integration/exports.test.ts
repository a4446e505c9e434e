// The XLSX exports read back as a spreadsheet would read them: sheets, headers, every value,
// formula and number format, totals worked out from the formulas against the server's cents;
// who may download which workbook; and (where LibreOffice is installed) that each file opens
// and recalculates in another spreadsheet program to the same figures.
import { execFile } from "node:child_process";
import { existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { delimiter, join } from "node:path";
import { promisify } from "node:util";
import type ExcelJS from "exceljs";
import { beforeAll, describe, expect, it, onTestFinished } from "vitest";
import * as bidRoute from "~/routes/spec-bid";
import * as bidsRoute from "~/routes/spec-bids";
import * as billXlsx from "~/routes/spec-bill.xlsx";
import * as bidsXlsx from "~/routes/spec-bids.xlsx";
import * as pricedXlsx from "~/routes/job-priced-bill.xlsx";
import * as specPage from "~/routes/spec";
import { warningTitle } from "~/content/warning-titles";
import { CIRCUIT_CAUTIONS } from "~/content/cautions";
import { formatMoney } from "~/content/money";
import { EXTRA_KEYS } from "~/content/offer-terms";
import { ENGINE_VERSION, type BomLine, type Design } from "~/hydraulics";
import { Bid, Job, Organisation, SpecRevision, User, type Spec } from "~/models/index.server";
import { bomOf } from "~/services/bids.server";
import { safeFileStem, workbookFileName } from "~/services/exports/file-name";
import { createDraft, publish, saveStep, startRevision } from "~/services/specs.server";
import { SPEC_ANSWERS, inDays, makeMember, makeOperatorUser, makePublishedSpec } from "../support/factories";
import { Visitor } from "../support/routes";
import { NO_EXTRAS } from "../support/bid-form";
import { signedIn } from "../support/sessions";
import { centsAt, evaluate, factsOf, formulaOf, openWorkbook, parseCsv, rowOf, rowValues } from "../support/workbooks";

const XLSX = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";
const GBP = '"£"#,##0.00;-"£"#,##0.00';
const GREEN = "FFD9EAD3";
// Forbidden characters, an umlaut and a sharp s: the file name must survive all of them.
const TITLE = 'Ram "B/2": Größe <main> | test?';

type Person = "buyer" | "otherBuyer" | "winner" | "loser" | "bystander" | "manager" | "otherManager" | "admin";
const people = {} as Record<Person, User>;
const visitors = {} as Record<Person, Visitor>;
let spec: Spec;
let draft: Spec;
let job: Job;
let firstBom: BomLine[];
let bom: BomLine[];
let design: Design;

const commissioning = EXTRA_KEYS.indexOf("commissioning");
const COMMISSIONING = { [`extras[${commissioning}].answer`]: "priced", [`extras[${commissioning}].price`]: "150" };

async function offer(
  visitor: Visitor,
  lines: BomLine[],
  price: (i: number) => string,
  alternative: { line: number; description: string },
  extra: Record<string, string>,
) {
  const fields: Record<string, string> = { intent: "submit", validUntil: inDays(60), ...NO_EXTRAS, ...extra };
  lines.forEach((line, i) => {
    fields[`lines[${i}].key`] = line.key;
    fields[`lines[${i}].unitPrice`] = price(i);
    if (i === alternative.line) {
      fields[`lines[${i}].alternative`] = "on";
      fields[`lines[${i}].alternativeDescription`] = alternative.description;
    }
  });
  const res = await visitor.post(bidRoute.action, `/specs/${spec.id}/bid`, fields, { specId: spec.id });
  expect(res.status).toBe(302);
}

beforeAll(async () => {
  people.buyer = await makeMember("buyer", { organisationName: "Northgate Presses Ltd" });
  people.otherBuyer = await makeMember("buyer");
  people.winner = await makeMember("shop", { organisationName: "Alder Hydraulics" });
  people.loser = await makeMember("shop", { organisationName: "Birch Fluid Power" });
  people.bystander = await makeMember("shop");
  people.manager = await makeOperatorUser("account_manager");
  people.otherManager = await makeOperatorUser("account_manager");
  people.admin = await makeOperatorUser("admin");
  await Organisation.update({ accountManagerId: people.manager.id }, { where: { id: people.buyer.organisationId } });
  // The winning shop reads in US customary units, so its bill adds a column in them.
  await User.update({ unitSystem: "us" }, { where: { id: people.winner.id } });
  for (const key of Object.keys(people) as Person[]) visitors[key] = await signedIn(people[key]);

  spec = await makePublishedSpec(people.buyer, { machine: { title: TITLE }, quotation: { retainerPercent: "12.5" } });
  firstBom = await bomOf(spec);
  await offer(
    visitors.loser,
    firstBom,
    (i) => String(200 + 10 * i),
    { line: 1, description: "Motor from stock, one frame size up" },
    { leadTimeWeeks: "8", incoterm: "DAP", place: "Derby", balanceDays: "14", warrantyMonths: "12" },
  );

  // Revision 2 turns the ram horizontal: no load to hold, so the counterbalance valve goes.
  await startRevision(people.buyer, spec.id);
  await saveStep(people.buyer, spec.id, { step: "machine", answers: { ...SPEC_ANSWERS.machine, title: TITLE, orientation: "horizontal" }, complete: true });
  spec = await publish(people.buyer, spec.id, { cautionsRead: true });
  bom = await bomOf(spec);
  design = (await SpecRevision.findOne({ where: { specId: spec.id, number: 2 }, rejectOnEmpty: true })).axes[0].design as Design;
  await offer(
    visitors.winner,
    bom,
    (i) => (i === 0 ? "1,234.55" : String(20 + 5 * i)),
    { line: 3, description: "Welded tank, 160 L, powder-coated" },
    // Commissioning on site, 150.00 once for the order, on top of the bill.
    { leadTimeWeeks: "12", incoterm: "EXW", place: "Leeds", balanceDays: "30", warrantyMonths: "12", ...COMMISSIONING },
  );

  const winningBid = await Bid.findOne({ where: { specId: spec.id, organisationId: people.winner.organisationId }, rejectOnEmpty: true });
  const award = await visitors.buyer.post(bidsRoute.action, `/specs/${spec.id}/bids`, { bidId: winningBid.id, confirm: "on" }, { specId: spec.id });
  expect(award.status).toBe(302);
  job = await Job.findOne({ where: { specId: spec.id }, rejectOnEmpty: true });
  draft = await createDraft(people.buyer);
});

// Route loaders take the framework's own argument type; tests pass what they read.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type Loader = (args: any) => unknown;

/** Calls a download route and returns its Response (the bytes untouched). */
async function download(who: Person, loader: Loader, path: string, params: Record<string, string>) {
  const res = await loader({ request: visitors[who].request(path), params, context: {} });
  expect(res).toBeInstanceOf(Response);
  const response = res as Response;
  expect(response.status).toBe(200);
  expect(response.headers.get("Content-Type")).toBe(XLSX);
  const bytes = new Uint8Array(await response.arrayBuffer());
  expect(Number(response.headers.get("Content-Length"))).toBe(bytes.byteLength);
  return { response, bytes, workbook: await openWorkbook(bytes) };
}

const billOf = (who: Person, query = "") => download(who, billXlsx.loader, `/specs/${spec.id}/bill.xlsx${query}`, { specId: spec.id });
const pricedOf = (who: Person) => download(who, pricedXlsx.loader, `/jobs/${job.id}/priced-bill.xlsx`, { jobId: job.id });
const comparisonOf = () => download("buyer", bidsXlsx.loader, `/specs/${spec.id}/bids.xlsx`, { specId: spec.id });

const sheetNames = (workbook: ExcelJS.Workbook) => workbook.worksheets.map((s) => s.name);

function expectFrozenAt(sheet: ExcelJS.Worksheet, row: number) {
  expect(sheet.views[0]).toMatchObject({ state: "frozen", ySplit: row });
}

function expectSensibleWidths(sheet: ExcelJS.Worksheet, count: number) {
  for (let c = 1; c <= count; c++) {
    const width = sheet.getColumn(c).width ?? 0;
    expect(width, `${sheet.name} column ${c}`).toBeGreaterThanOrEqual(6);
    expect(width, `${sheet.name} column ${c}`).toBeLessThanOrEqual(70);
  }
}

function expectCautions(sheet: ExcelJS.Worksheet, warnings: Design["warnings"]) {
  const texts = Array.from({ length: sheet.rowCount }, (_, i) => sheet.getCell(i + 1, 2).text);
  for (const caution of CIRCUIT_CAUTIONS) expect(texts).toContain(caution);
  // Each warning by its title and sentence; the engine's code only in the last column, for reviewers.
  const codes = Array.from({ length: sheet.rowCount }, (_, i) => sheet.getCell(i + 1, 3).text);
  for (const w of warnings) {
    const r = codes.indexOf(w.code) + 1;
    expect(r).toBeGreaterThan(0);
    expect(sheet.getCell(r, 1).text).toBe(warningTitle(w.code));
    expect(sheet.getCell(r, 1).text).not.toMatch(/^[A-Z_]+$/);
    expect(sheet.getCell(r, 2).text).toBe(w.message);
  }
}

describe("file names", () => {
  it("drop what a file system refuses, keep letters, and stay short", () => {
    expect(safeFileStem('a/b\\c:d*e?f"g<h>i|j')).toBe("a b c d e f g h i j");
    expect(safeFileStem("tab\there\u0000nul\u001b")).toBe("tab here nul");
    expect(safeFileStem("  Größe, Ø 80 …  ")).toBe("Größe, Ø 80 …");
    expect(safeFileStem("ends with dots...")).toBe("ends with dots");
    expect(safeFileStem(" / : ")).toBe("Untitled spec");
    expect(safeFileStem("CON")).toBe("CON spec");
    const long = safeFileStem("🔧".repeat(200));
    expect(Array.from(long)).toHaveLength(80);
    expect(long).toBe("🔧".repeat(80));
    expect(workbookFileName(TITLE, 3, "priced bill")).toBe("Ram B 2 Größe main test - rev 3 - priced bill.xlsx");
  });
});

describe("bill of materials", () => {
  it("downloads under a safe name with the exact one in filename*", async () => {
    const { response } = await billOf("buyer");
    expect(response.headers.get("Content-Disposition")).toBe(
      `attachment; filename="Ram B 2 Gro_e main test - rev 2 - bill of materials.xlsx"; filename*=UTF-8''Ram%20B%202%20Gr%C3%B6%C3%9Fe%20main%20test%20-%20rev%202%20-%20bill%20of%20materials.xlsx`,
    );
    expect(response.headers.get("Cache-Control")).toBe("private, no-store");
    expect(response.headers.get("X-Content-Type-Options")).toBe("nosniff");
  });

  it("lists every line with its rating in its own columns under a frozen header block", async () => {
    const { workbook } = await billOf("buyer");
    expect(sheetNames(workbook)).toEqual(["Bill of materials", "Design values", "Requirements", "Cautions"]);
    const sheet = workbook.getWorksheet("Bill of materials")!;
    expect(sheet.getCell("A1").text).toBe("Bill of materials");
    expect(sheet.getCell("A2").text).toBe(TITLE);
    const facts = factsOf(sheet);
    expect(facts).toMatchObject({
      "Sizing engine": `version ${ENGINE_VERSION}`,
      "Machine builder": "Northgate Presses Ltd",
      "Units wanted": "2",
      "Delivered to": "UK — West Midlands",
      "Prices in": "GBP",
    });
    expect(facts.Revision).toMatch(/^2, published \d{1,2} [A-Z][a-z]+ \d{4}$/);
    expect(facts.Status).toMatch(/Cautions sheet/);

    const head = rowOf(sheet, "Line key");
    expect(rowValues(sheet, head, 7)).toEqual(["Line key", "Item", "Qty", "Specification", "Main rating", "Unit", "What is rated"]);
    expectFrozenAt(sheet, head);
    expect(sheet.autoFilter).toBeTruthy();
    expect(bom.length).toBeGreaterThan(8);
    bom.forEach((line, i) => {
      const r = head + 1 + i;
      expect(rowValues(sheet, r, 7)).toEqual([line.key, line.item, line.quantity, line.specification, line.rating.value, line.rating.unit, line.rating.label]);
      expect(sheet.getCell(r, 3).numFmt).toBe("0");
      expect(sheet.getCell(r, 5).numFmt).toBe(
        Number.isInteger(line.rating.value) ? "#,##0" : line.rating.value >= 100 ? "#,##0.0" : line.rating.value >= 1 ? "#,##0.0#" : "0.0###",
      );
    });
    expect(sheet.getCell(head + 1 + bom.length, 1).value).toBeNull();
    expectSensibleWidths(sheet, 7);
    expect(sheet.getColumn(4).width).toBe(Math.max(...[1, 2, 3, 4, 5, 6, 7].map((c) => sheet.getColumn(c).width ?? 0)));
  });

  it("shows every design value with its formula, inputs and source", async () => {
    const { workbook } = await billOf("buyer");
    const sheet = workbook.getWorksheet("Design values")!;
    const head = rowOf(sheet, "Quantity");
    expect(rowValues(sheet, head, 6)).toEqual(["Quantity", "Value", "Unit", "Formula", "Inputs", "Source"]);
    expectFrozenAt(sheet, head);
    expect(design.trail.length).toBeGreaterThan(40);
    design.trail.forEach((entry, i) => {
      const r = head + 1 + i;
      expect(rowValues(sheet, r, 4)).toEqual([entry.quantity, entry.value, entry.unit === "-" ? "" : entry.unit, entry.formula]);
      expect(sheet.getCell(r, 6).text).toBe(entry.source);
      const inputs = sheet.getCell(r, 5).text.split("\n");
      expect(inputs).toHaveLength(Object.keys(entry.inputs).length || 1);
      for (const [name, input] of Object.entries(entry.inputs)) {
        const shown = typeof input.value === "number" ? String(Number(input.value.toPrecision(6))) : input.value;
        expect(inputs).toContain(input.unit && input.unit !== "-" ? `${name} = ${shown} ${input.unit}` : `${name} = ${shown}`);
      }
    });
    expectSensibleWidths(sheet, 6);
  });

  it("gives the requirements as entered and in SI, and in the reader's units when they differ", async () => {
    const own = (await billOf("buyer")).workbook.getWorksheet("Requirements")!;
    const head = rowOf(own, "Requirement");
    expect(rowValues(own, head, 6)).toEqual(["Requirement", "As entered", "Unit", "SI, as sized", "SI unit", null]);
    expectFrozenAt(own, head);
    expect(factsOf(own)["Entered in"]).toMatch(/^Metric \(mm, kg, bar\)/);
    expect(rowValues(own, rowOf(own, "Moving mass"), 5)).toEqual(["Moving mass", 800, "kg", 800, "kg"]);
    expect(rowValues(own, rowOf(own, "Working force at the end of the stroke"), 5)).toEqual(["Working force at the end of the stroke", 50000, "N", 50000, "N"]);
    expect(rowValues(own, rowOf(own, "Direction of travel"), 5)).toEqual(["Direction of travel", "Horizontal", "", "horizontal", ""]);
    expect(rowValues(own, rowOf(own, "Mains frequency"), 5)).toEqual(["Mains frequency", "50 Hz", "", 50, "Hz"]);
    expect(rowValues(own, rowOf(own, "Friction of the guides"), 5)).toEqual(["Friction of the guides", 0.1, "", 0.1, ""]);
    // A vertical axis's rod direction does not apply to a horizontal one.
    expect(() => rowOf(own, "Rod moves when extending")).toThrow();
    // The questions of sizing contract 2, left blank: each listed by what blank meant, with its unit.
    expect(rowValues(own, rowOf(own, "Dwell at force"), 5)).toEqual(["Dwell at force", "(default)", "s", 0, "s"]);
    expect(rowValues(own, rowOf(own, "Time the load is held at rest"), 5)).toEqual(["Time the load is held at rest", "(default)", "min", 0, "min"]);
    expect(rowValues(own, rowOf(own, "Time to stop"), 5)).toEqual(["Time to stop", "Same as the time to reach speed", "s", 0.2, "s"]);
    expect(rowValues(own, rowOf(own, "Pump"), 3)).toEqual(["Pump", "Let the sizing choose", ""]);
    expect(rowValues(own, rowOf(own, "How the cylinder body is fixed"), 2)).toEqual(["How the cylinder body is fixed", "Not known yet"]);
    // No pressing stroke, so no pressing speed.
    expect(() => rowOf(own, "Pressing speed")).toThrow();
    const other = rowOf(own, "Other answers");
    expect(own.getCell(rowOf(own, "Supply voltage"), 2).text).toBe("400 V three-phase");
    expect(own.getCell(rowOf(own, "Retainer share"), 2).text).toBe("12.5 %");
    expect(rowOf(own, "Supply voltage")).toBeGreaterThan(other);

    const theirs = (await billOf("winner")).workbook.getWorksheet("Requirements")!;
    const h = rowOf(theirs, "Requirement");
    expect(rowValues(theirs, h, 7)).toEqual(["Requirement", "As entered", "Unit", "SI, as sized", "SI unit", "In US customary units", "Unit"]);
    // 800 kg = 1763.7 lb; 500 mm = 19.685 in; 160 bar = 2320.6 psi; 25 °C = 77 °F.
    expect(rowValues(theirs, rowOf(theirs, "Moving mass"), 7)).toEqual(["Moving mass", 800, "kg", 800, "kg", 1764, "lb"]);
    expect(rowValues(theirs, rowOf(theirs, "Stroke"), 7)).toEqual(["Stroke", 500, "mm", 500, "mm", 19.69, "in"]);
    expect(rowValues(theirs, rowOf(theirs, "Highest working pressure you accept"), 7)).toEqual([
      "Highest working pressure you accept",
      160,
      "bar",
      160,
      "bar",
      2321,
      "psi",
    ]);
    expect(rowValues(theirs, rowOf(theirs, "Air temperature around the power unit"), 7)).toEqual([
      "Air temperature around the power unit",
      25,
      "°C",
      25,
      "°C",
      77,
      "°F",
    ]);
  });

  it("carries the cautions and the engine's warnings", async () => {
    const { workbook } = await billOf("buyer");
    expectCautions(workbook.getWorksheet("Cautions")!, design.warnings);
  });

  it("exports an earlier revision on request, and nothing for one that does not exist", async () => {
    const { workbook, response } = await billOf("buyer", "?revision=1");
    expect(response.headers.get("Content-Disposition")).toContain("rev 1 - bill of materials");
    const sheet = workbook.getWorksheet("Bill of materials")!;
    const head = rowOf(sheet, "Line key");
    expect(firstBom.map((_, i) => sheet.getCell(head + 1 + i, 1).text)).toEqual(firstBom.map((l) => l.key));
    expect(firstBom.map((l) => l.key)).toContain("counterbalance-valve");
    expect(bom.map((l) => l.key)).not.toContain("counterbalance-valve");
    for (const query of ["?revision=7", "?revision=abc", "?revision=0"]) {
      expect((await visitors.buyer.get(billXlsx.loader, `/specs/${spec.id}/bill.xlsx${query}`, { specId: spec.id })).status).toBe(404);
    }
  });
});

/** Every piece of text a workbook carries: properties, sheet names, headers, each cell's value, formula, result and note. */
function everyText(workbook: ExcelJS.Workbook): string[] {
  const texts: string[] = [];
  const { title, subject, creator, lastModifiedBy, company, manager, description, keywords, category } = workbook;
  texts.push(...[title, subject, creator, lastModifiedBy, company, manager, description, keywords, category].map((t) => String(t ?? "")));
  for (const sheet of workbook.worksheets) {
    texts.push(sheet.name, JSON.stringify(sheet.headerFooter ?? {}));
    sheet.eachRow({ includeEmpty: true }, (row) => {
      row.eachCell({ includeEmpty: true }, (cell) => {
        texts.push(cell.text, JSON.stringify(cell.value ?? null), JSON.stringify(cell.note ?? null));
      });
    });
  }
  return texts;
}

describe("the buyer's name", () => {
  const BUYER = /northgate\s*presses/i;

  it("is nowhere in a shop's bill of materials, whichever revision, as on the shop's spec page", async () => {
    for (const who of ["winner", "loser", "bystander"] as const) {
      for (const query of ["", "?revision=1"]) {
        const { workbook } = await billOf(who, query);
        const texts = everyText(workbook);
        expect(texts.length).toBeGreaterThan(200);
        expect(texts.filter((t) => BUYER.test(t))).toEqual([]);
        expect(factsOf(workbook.getWorksheet("Bill of materials")!)["Machine builder"]).toBe("Not named to shops before the award");
      }
      const page = await visitors[who].get(specPage.loader, `/specs/${spec.id}`, { specId: spec.id });
      expect(page.status).toBe(200);
      expect(page.data.buyerName).toBeNull();
      expect(JSON.stringify(page.data)).not.toMatch(BUYER);
    }
  });

  it("is in the bill for the buyer's own people and operator staff, as on their spec page", async () => {
    for (const who of ["buyer", "manager", "admin"] as const) {
      const { workbook } = await billOf(who);
      expect(factsOf(workbook.getWorksheet("Bill of materials")!)["Machine builder"]).toBe("Northgate Presses Ltd");
      const page = await visitors[who].get(specPage.loader, `/specs/${spec.id}`, { specId: spec.id });
      expect(page.data.buyerName).toBe("Northgate Presses Ltd");
    }
  });
});

describe("priced bill of the awarded bid", () => {
  it("prices each line with a live line total, marks alternatives, and totals by formula to the server's cents", async () => {
    const { workbook, response } = await pricedOf("buyer");
    expect(response.headers.get("Content-Disposition")).toContain(`filename="Ram B 2 Gro_e main test - rev 2 - priced bill.xlsx"`);
    expect(sheetNames(workbook)).toEqual(["Priced bill", "Cautions"]);
    const bid = await Bid.findByPk(job.bidId, { rejectOnEmpty: true });
    expect(bid.status).toBe("won");
    const sheet = workbook.getWorksheet("Priced bill")!;
    expect(sheet.getCell("A1").text).toBe("Priced bill of the awarded bid");
    expect(sheet.getCell("A2").text).toBe(TITLE);
    expect(factsOf(sheet)).toMatchObject({
      "Revision priced": "2",
      "Sizing engine": `version ${ENGINE_VERSION}`,
      "Machine builder": "Northgate Presses Ltd",
      "Fluid-power shop": "Alder Hydraulics",
      "Prices in": "GBP",
      "Lead time": "12 weeks from the award",
    });

    const head = rowOf(sheet, "Line key");
    expect(rowValues(sheet, head, 8)).toEqual(["Line key", "Item", "Specification", "Qty", "Unit price", "Line total", "Offered part", "Alternative offered"]);
    expectFrozenAt(sheet, head);
    const first = head + 1;
    const last = head + bid.lines.length;
    bid.lines.forEach((line, i) => {
      const r = first + i;
      expect(rowValues(sheet, r, 5)).toEqual([line.key, line.item, line.specification, line.quantity, line.unitPriceCents! / 100]);
      expect(formulaOf(sheet.getCell(r, 6))).toBe(`D${r}*E${r}`);
      expect(centsAt(sheet, `F${r}`)).toBe(line.quantity * line.unitPriceCents!);
      expect((sheet.getCell(r, 6).value as { result: number }).result).toBe((line.quantity * line.unitPriceCents!) / 100);
      expect(sheet.getCell(r, 5).numFmt).toBe(GBP);
      expect(sheet.getCell(r, 6).numFmt).toBe(GBP);
      expect(rowValues(sheet, r, 8).slice(6)).toEqual(i === 3 ? ["Alternative", "Welded tank, 160 L, powder-coated"] : ["As specified", ""]);
    });
    expect(bid.lines[0].unitPriceCents).toBe(123_455);

    const set = rowOf(sheet, "Set total, one of each line");
    expect(set).toBe(last + 1);
    expect(formulaOf(sheet.getCell(set, 6))).toBe(`SUM(F${first}:F${last})`);
    expect(centsAt(sheet, `F${set}`)).toBe(bid.setTotalCents);
    const units = rowOf(sheet, "Units wanted");
    expect(sheet.getCell(units, 4).value).toBe(2);
    const commissioning = rowOf(sheet, "Commissioning on site (whole order)");
    expect(centsAt(sheet, `F${commissioning}`)).toBe(15_000);
    const total = rowOf(sheet, "Total for 2 units");
    expect(formulaOf(sheet.getCell(total, 6))).toBe(`F${set}*D${units}+SUM(F${commissioning}:F${commissioning})`);
    expect(centsAt(sheet, `F${total}`)).toBe(job.totalCents);
    expect(job.totalCents).toBe(bid.setTotalCents * 2 + 15_000);
    const share = rowOf(sheet, "Retainer share");
    expect(sheet.getCell(share, 5).value).toBe(0.125);
    expect(sheet.getCell(share, 5).numFmt).toBe("0.00%");
    const retainer = rowOf(sheet, "Retainer amount (total × share, rounded to the cent)");
    expect(formulaOf(sheet.getCell(retainer, 6))).toBe(`ROUND(F${total}*E${share},2)`);
    expect(centsAt(sheet, `F${retainer}`)).toBe(job.retainerCents);
    const charged = rowOf(sheet, "Retainer as the portal charges it (exact cents)");
    expect(sheet.getCell(charged, 6).value).toBe(job.retainerCents / 100);
    for (const r of [set, total, retainer, charged]) expect(sheet.getCell(r, 6).numFmt).toBe(GBP);
    // The stored results agree with the formulas, for viewers that never recalculate.
    for (const r of [set, total, retainer]) expect((sheet.getCell(r, 6).value as { result: number }).result).toBe(evaluate(sheet, `F${r}`));
    const retainerShare = Number(job.retainerPercent);
    expect(sheet.getCell(rowOf(sheet, "Terms"), 2).text).toContain(
      `Delivery: EXW Leeds (Ex Works, Incoterms 2020). Payment: ${retainerShare} % with the order (the retainer, paid by card through Tenderflow), ${100 - retainerShare} % 30 days after invoice. 12 months warranty.`,
    );
    expectSensibleWidths(sheet, 8);
    expectCautions(workbook.getWorksheet("Cautions")!, design.warnings);
  });

  it("is the same file for the winning shop, the account manager and an admin", async () => {
    const reference = (await pricedOf("buyer")).workbook.getWorksheet("Priced bill")!;
    for (const who of ["winner", "manager", "admin"] as Person[]) {
      const sheet = (await pricedOf(who)).workbook.getWorksheet("Priced bill")!;
      for (let r = 3; r <= reference.rowCount; r++) {
        if (reference.getCell(r, 1).text === "Exported") continue;
        expect(rowValues(sheet, r, 8)).toEqual(rowValues(reference, r, 8));
      }
    }
  });
});

describe("comparison of the offers", () => {
  it("puts lines down and shops across, marks the lowest per line, and totals by formula to each bid's cents", async () => {
    const { workbook, response } = await comparisonOf();
    expect(response.headers.get("Content-Disposition")).toContain(`filename="Ram B 2 Gro_e main test - rev 2 - comparison of offers.xlsx"`);
    expect(sheetNames(workbook)).toEqual(["Comparison", "Offers", "Cautions"]);
    const sheet = workbook.getWorksheet("Comparison")!;
    expect(sheet.getCell("A1").text).toBe("Comparison of the offers");
    expect(factsOf(sheet)).toMatchObject({ "Current revision": "2", "Machine builder": "Northgate Presses Ltd", "Prices in": "GBP" });

    const bids = await Bid.findAll({ where: { specId: spec.id }, order: [["totalCents", "ASC"]] });
    expect(bids).toHaveLength(2);
    const shopNames = new Map([
      [people.winner.organisationId, "Alder Hydraulics"],
      [people.loser.organisationId, "Birch Fluid Power"],
    ]);
    const head = rowOf(sheet, "Line key");
    expectFrozenAt(sheet, head);
    expect(sheet.views[0]).toMatchObject({ xSplit: 2 });
    // Shop names over their three columns, in the order of their totals.
    const unitCol = (i: number) => 5 + 3 * i;
    bids.forEach((bid, i) => expect(sheet.getCell(head - 1, unitCol(i)).text).toBe(shopNames.get(bid.organisationId)));
    expect(rowValues(sheet, head, 11)).toEqual([
      "Line key",
      "Item",
      "Qty",
      "Note",
      "Unit price",
      "Line total",
      "Alternative offered",
      "Unit price",
      "Line total",
      "Alternative offered",
      "Lowest line total",
    ]);

    const earlierOnly = firstBom.filter((l) => !bom.some((b) => b.key === l.key));
    expect(earlierOnly.length).toBeGreaterThan(0);
    const lines = [...bom, ...earlierOnly];
    const letter = (c: number) => sheet.getColumn(c).letter;
    lines.forEach((line, r0) => {
      const r = head + 1 + r0;
      expect(rowValues(sheet, r, 4)).toEqual([line.key, line.item, line.quantity, bom.includes(line) ? "" : "Only in an earlier revision"]);
      const totals = bids.map((bid) => bid.lines.find((l) => l.key === line.key)).map((l) => (l ? l.quantity * l.unitPriceCents! : null));
      const lowest = Math.min(...totals.filter((t): t is number => t !== null));
      const priced = totals.filter((t) => t !== null).length;
      bids.forEach((bid, i) => {
        const l = bid.lines.find((x) => x.key === line.key);
        const [unit, total, alternative] = [unitCol(i), unitCol(i) + 1, unitCol(i) + 2];
        if (!l) {
          expect(sheet.getCell(r, unit).value).toBeNull();
          expect(sheet.getCell(r, total).value).toBe("not priced");
          return;
        }
        expect(sheet.getCell(r, unit).value).toBe(l.unitPriceCents! / 100);
        expect(formulaOf(sheet.getCell(r, total))).toBe(`C${r}*${letter(unit)}${r}`);
        expect(centsAt(sheet, `${letter(total)}${r}`)).toBe(totals[i]);
        expect(sheet.getCell(r, total).numFmt).toBe(GBP);
        expect(sheet.getCell(r, alternative).value).toBe(l.alternative ? l.alternativeDescription : null);
        const marked = (sheet.getCell(r, total).fill as ExcelJS.FillPattern | undefined)?.fgColor?.argb === GREEN;
        expect(marked, `${line.key} at ${shopNames.get(bid.organisationId)}`).toBe(priced > 1 && totals[i] === lowest);
      });
      expect(formulaOf(sheet.getCell(r, 11))).toBe(`MIN(F${r},I${r})`);
      expect(centsAt(sheet, `K${r}`)).toBe(lowest);
    });

    const last = head + lines.length;
    const row = (label: string) => rowOf(sheet, label);
    const [cheapest] = bids;
    bids.forEach((bid, i) => {
      const L = letter(unitCol(i) + 1);
      expect(formulaOf(sheet.getCell(`${L}${row("Set total, one of each line")}`))).toBe(`SUM(${L}${head + 1}:${L}${last})`);
      expect(centsAt(sheet, `${L}${row("Set total, one of each line")}`)).toBe(bid.setTotalCents);
      expect(sheet.getCell(`${L}${row("Units")}`).value).toBe(bid.units);
      expect(formulaOf(sheet.getCell(`${L}${row("The bill for every unit")}`))).toBe(`${L}${row("Set total, one of each line")}*${L}${row("Units")}`);
      // The offer total adds the work beyond the bill (each kind, then the shop's own lines) to the bill.
      const extrasFrom = row("Assembly and manifold (whole order)");
      expect(formulaOf(sheet.getCell(`${L}${row("Offer total")}`))).toBe(
        `${L}${row("The bill for every unit")}+SUM(${L}${extrasFrom}:${L}${row("The shop's own lines (whole order)")})`,
      );
      expect(centsAt(sheet, `${L}${row("Offer total")}`)).toBe(bid.totalCents);
      expect(Math.round(Number(evaluate(sheet, `${L}${row("Offer total")}`)) * 100)).toBe(bid.totalCents);
      const commissioning = sheet.getCell(`${L}${row("Commissioning on site (whole order)")}`);
      const pricesCommissioning = bid.extras.some((e) => e.kind === "commissioning" && e.answer === "priced");
      if (pricesCommissioning) expect(centsAt(sheet, commissioning.address)).toBe(15_000);
      else expect(commissioning.value).toBe("Not offered");
      expect(sheet.getCell(`${L}${row("Leaves out")}`).text).toContain(pricesCommissioning ? "no training offered" : "no commissioning on site offered");
      expect(sheet.getCell(`${L}${row("Lead time (weeks)")}`).value).toBe(bid.leadTimeWeeks);
      expect(sheet.getCell(`${L}${row("Valid until")}`).value).toEqual(new Date(`${bid.validUntil}T00:00:00Z`));
      expect(sheet.getCell(`${L}${row("Valid until")}`).numFmt).toBe("d mmm yyyy");
      expect(sheet.getCell(`${L}${row("Status")}`).value).toBe(bid.status === "won" ? "Chosen" : "Not chosen");
      expect(sheet.getCell(`${L}${row("Revision priced")}`).value).toBe(bid.specRevision === 2 ? "2" : `${bid.specRevision} (earlier)`);
      const complete = bom.every((l) => bid.lines.some((x) => x.key === l.key));
      expect(sheet.getCell(`${L}${row("Every current line priced")}`).value).toBe(complete ? "Yes" : "No, lines missing");
      expect(sheet.getCell(`${L}${row("Alternative parts")}`).value).toBe(1);
      // Like for like: commissioning is not in every offer, so it is left out of the comparison figure.
      const like = row("Like for like: the bill and the work every offer covers");
      expect(centsAt(sheet, `${L}${like}`)).toBe(bid.setTotalCents * bid.units);
      const more = sheet.getCell(`${L}${row("More than the cheapest complete offer, like for like")}`);
      if (bid === cheapest) expect(more.value).toBeNull();
      else expect(centsAt(sheet, more.address)).toBe(bid.setTotalCents * bid.units - cheapest.setTotalCents * cheapest.units);
    });
    // The cheapest offer here prices the whole current bill, so it is the cheapest complete one.
    expect(cheapest.specRevision).toBe(2);
    expect((sheet.getCell(`F${row("Like for like: the bill and the work every offer covers")}`).fill as ExcelJS.FillPattern).fgColor?.argb).toBe(GREEN);

    const offers = workbook.getWorksheet("Offers")!;
    const oh = rowOf(offers, "Shop");
    expect(rowValues(offers, oh, 14)).toEqual([
      "Shop",
      "Status",
      "Revision priced",
      "Set total",
      "Units",
      "Offer total",
      "Lead time (weeks)",
      "Valid until",
      "Delivery (Incoterms 2020)",
      "Payment",
      "Warranty",
      "Leaves out",
      "Alternative circuit",
      "Notes",
    ]);
    bids.forEach((bid, i) => {
      const r = oh + 1 + i;
      expect(offers.getCell(r, 1).text).toBe(shopNames.get(bid.organisationId));
      expect(centsAt(offers, `F${r}`)).toBe(bid.totalCents);
      expect(offers.getCell(r, 9).text).toBe(
        bid.offerTerms?.incoterm === "EXW" ? "EXW Leeds (Ex Works, Incoterms 2020)" : "DAP Derby (Delivered at Place, Incoterms 2020)",
      );
    });
    expectCautions(workbook.getWorksheet("Cautions")!, design.warnings);
  });
});

describe("who may download what", () => {
  interface ExportRoute {
    name: string;
    loader: Loader;
    path: () => string;
    params: () => Record<string, string>;
    key: string;
    expected: Record<Person, number>;
  }
  const routes: ExportRoute[] = [
    {
      name: "bill of materials",
      loader: billXlsx.loader,
      path: () => `/specs/${spec.id}/bill.xlsx`,
      params: () => ({ specId: spec.id }),
      key: "specId",
      expected: { buyer: 200, otherBuyer: 404, winner: 200, loser: 200, bystander: 200, manager: 200, otherManager: 404, admin: 200 },
    },
    {
      name: "priced bill",
      loader: pricedXlsx.loader,
      path: () => `/jobs/${job.id}/priced-bill.xlsx`,
      params: () => ({ jobId: job.id }),
      key: "jobId",
      expected: { buyer: 200, otherBuyer: 404, winner: 200, loser: 404, bystander: 404, manager: 200, otherManager: 404, admin: 200 },
    },
    {
      name: "comparison",
      loader: bidsXlsx.loader,
      path: () => `/specs/${spec.id}/bids.xlsx`,
      params: () => ({ specId: spec.id }),
      key: "specId",
      expected: { buyer: 200, otherBuyer: 404, winner: 403, loser: 403, bystander: 403, manager: 403, otherManager: 403, admin: 403 },
    },
  ];

  describe.each(routes)("$name", ({ loader, path, params, key, expected }) => {
    it.each(Object.keys(expected) as Person[])("as %s", async (who) => {
      const res = await visitors[who].get(loader, path(), params());
      expect(res.status).toBe(expected[who]);
      if (res.status === 200) expect(res.headers.get("Content-Type")).toBe(XLSX);
      else expect(res.headers.get("Content-Type") ?? "").not.toBe(XLSX);
    });

    it("signed out: sent to sign-in and back", async () => {
      const res = await new Visitor().get(loader, path(), params());
      expect(res.status).toBe(302);
      expect(res.location).toBe(`/sign-in?redirectTo=${encodeURIComponent(path())}`);
    });

    it("forged and malformed IDs are not found", async () => {
      const who = (Object.keys(expected) as Person[]).find((p) => expected[p] === 200)!;
      for (const id of ["00000000-0000-4000-8000-000000000000", "not-a-uuid", "1 OR 1=1", ""]) {
        expect((await visitors[who].get(loader, path().replace(params()[key], id), { [key]: id })).status).toBe(404);
      }
    });
  });

  it("a draft has no bill or comparison, even for its own buyer", async () => {
    for (const who of ["buyer", "winner", "admin"] as Person[]) {
      expect((await visitors[who].get(billXlsx.loader, `/specs/${draft.id}/bill.xlsx`, { specId: draft.id })).status).toBe(404);
    }
    expect((await visitors.buyer.get(bidsXlsx.loader, `/specs/${draft.id}/bids.xlsx`, { specId: draft.id })).status).toBe(404);
  });
});

// ---- LibreOffice ------------------------------------------------------------------------------

const SOFFICE = ["soffice", "libreoffice"]
  .flatMap((name) => (process.env.PATH ?? "").split(delimiter).map((dir) => join(dir, name)))
  .find((path) => existsSync(path));
if (!SOFFICE)
  console.warn(
    "exports.test.ts: LibreOffice (soffice) is not installed, so the LibreOffice check is SKIPPED. Install it with: apt-get install libreoffice-calc-nogui",
  );

// A profile of our own: nothing shared with another soffice, and set to recalculate every
// formula on load, so the figures in the CSV are LibreOffice's own arithmetic, not our results.
function recalculatingProfile() {
  const dir = mkdtempSync(join(tmpdir(), "tenderflow-lo-"));
  mkdirSync(join(dir, "user"), { recursive: true });
  writeFileSync(
    join(dir, "user", "registrymodifications.xcu"),
    `<?xml version="1.0" encoding="UTF-8"?>
<oor:items xmlns:oor="http://openoffice.org/2001/registry" xmlns:xs="http://www.w3.org/2001/XMLSchema" xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance">
<item oor:path="/org.openoffice.Office.Calc/Formula/Load"><prop oor:name="OOXMLRecalcMode" oor:op="fuse"><value>0</value></prop></item>
</oor:items>
`,
  );
  return dir;
}

describe("LibreOffice", () => {
  it.skipIf(!SOFFICE)(
    SOFFICE
      ? "opens every workbook, recalculates it and converts each sheet to CSV with the server's figures"
      : "SKIPPED: LibreOffice (soffice) is not installed here",
    async () => {
      const dir = mkdtempSync(join(tmpdir(), "tenderflow-xlsx-"));
      const files = { bill: (await billOf("buyer")).bytes, priced: (await pricedOf("buyer")).bytes, comparison: (await comparisonOf()).bytes };
      for (const [name, bytes] of Object.entries(files)) writeFileSync(join(dir, `${name}.xlsx`), bytes);
      const profile = recalculatingProfile();
      onTestFinished(() => {
        for (const path of [dir, profile]) rmSync(path, { recursive: true, force: true });
      });
      // CSV filter: comma, double quotes, UTF-8, formatted as shown, and -1: every sheet to its own file.
      const filter = "csv:Text - txt - csv (StarCalc):44,34,76,1,,0,false,true,true,false,false,-1";
      const { stdout, stderr } = await promisify(execFile)(
        SOFFICE!,
        [
          `-env:UserInstallation=file://${profile}`,
          "--headless",
          "--convert-to",
          filter,
          "--outdir",
          dir,
          ...Object.keys(files).map((n) => join(dir, `${n}.xlsx`)),
        ],
        { timeout: 120_000 },
      );
      expect(stderr).not.toMatch(/error|could not be loaded/i);
      const csv = (name: string) => parseCsv(readFileSync(join(dir, `${name}.csv`), "utf8"));
      expect(
        readdirSync(dir)
          .filter((f) => f.endsWith(".csv"))
          .sort(),
      ).toEqual(
        [
          "bill-Bill of materials",
          "bill-Cautions",
          "bill-Design values",
          "bill-Requirements",
          "comparison-Cautions",
          "comparison-Comparison",
          "comparison-Offers",
          "priced-Cautions",
          "priced-Priced bill",
        ].map((n) => `${n}.csv`),
      );
      expect(stdout).toContain("Writing sheet");

      const billRows = csv("bill-Bill of materials");
      for (const line of bom) expect(billRows.find((r) => r[0] === line.key)?.slice(1, 4)).toEqual([line.item, String(line.quantity), line.specification]);
      expect(csv("bill-Cautions").map((r) => r[1])).toEqual(expect.arrayContaining([...CIRCUIT_CAUTIONS]));

      const bid = await Bid.findByPk(job.bidId, { rejectOnEmpty: true });
      const priced = csv("priced-Priced bill");
      const at = (rows: string[][], label: string) => rows.find((r) => r[0] === label)!;
      expect(at(priced, "Set total, one of each line")[5]).toBe(formatMoney(bid.setTotalCents, "GBP"));
      expect(at(priced, "Total for 2 units")[5]).toBe(formatMoney(job.totalCents, "GBP"));
      expect(at(priced, "Retainer amount (total × share, rounded to the cent)")[5]).toBe(formatMoney(job.retainerCents, "GBP"));
      expect(at(priced, "Retainer as the portal charges it (exact cents)")[5]).toBe(formatMoney(job.retainerCents, "GBP"));
      for (const line of bid.lines) expect(priced.find((r) => r[0] === line.key)?.[5]).toBe(formatMoney(line.quantity * line.unitPriceCents!, "GBP"));

      const bids = await Bid.findAll({ where: { specId: spec.id }, order: [["totalCents", "ASC"]] });
      const comparison = csv("comparison-Comparison");
      expect(at(comparison, "Offer total").filter(Boolean).slice(1)).toEqual(bids.map((b) => formatMoney(b.totalCents, "GBP")));
      expect(at(comparison, "Set total, one of each line").filter(Boolean).slice(1)).toEqual(bids.map((b) => formatMoney(b.setTotalCents, "GBP")));
    },
    180_000,
  );
});
