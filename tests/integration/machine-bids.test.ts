// A machine of two axes, published, through every reader of its design: the spec page, the
// shop's bid priced line by line against the machine's bill, the buyer's comparison with each
// part's subtotal, the award, and the three workbooks (bill with the axis each line serves,
// requirements with the duty once and one block per axis, comparison and priced bill with a
// subtotal per part worked out from their formulas).
import type ExcelJS from "exceljs";
import { beforeAll, describe, expect, it } from "vitest";
import * as bidRoute from "~/routes/spec-bid";
import * as bidsRoute from "~/routes/spec-bids";
import * as specPage from "~/routes/spec";
import * as billXlsx from "~/routes/spec-bill.xlsx";
import * as bidsXlsx from "~/routes/spec-bids.xlsx";
import * as pricedXlsx from "~/routes/job-priced-bill.xlsx";
import type { BomLine, MachineDesign } from "~/hydraulics";
import { Bid, Job, SpecRevision, type Spec, type User } from "~/models/index.server";
import { bomOf } from "~/services/bids.server";
import { POWER_UNIT_LABEL } from "~/services/published-design";
import { bidFields, postBid } from "../support/bid-form";
import { makeMember, makePublishedMachineSpec, makePublishedSpec } from "../support/factories";
import { clampAndPress } from "../support/machines";
import { Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";
import { centsAt, evaluate, openWorkbook, rowOf } from "../support/workbooks";

const machine: MachineDesign = clampAndPress();
/** The part a machine line serves, by hand: the axis after the key's colon, else the power unit. */
const partOf = (key: string) => (key.includes(":") ? key.slice(key.indexOf(":") + 1) : POWER_UNIT_LABEL);
const PARTS = [POWER_UNIT_LABEL, "Clamp", "Press"];

let buyer: User;
let spec: Spec;
let bom: BomLine[];
let buyerVisitor: Visitor;
const shops: { user: User; visitor: Visitor; price: (i: number) => string }[] = [];

beforeAll(async () => {
  buyer = await makeMember("buyer");
  spec = await makePublishedMachineSpec(buyer, machine, { machine: { title: "Clamp and press cell" } });
  bom = await bomOf(spec);
  buyerVisitor = await signedIn(buyer);
  for (const price of [(i: number) => String(100 + 10 * i), (i: number) => String(95 + 11 * i)]) {
    const user = await makeMember("shop");
    shops.push({ user, visitor: await signedIn(user), price });
  }
});

describe("a machine's spec", () => {
  it("is priced against the machine's bill: the power unit once, then each axis's own lines", async () => {
    expect(bom.map((l) => l.key)).toEqual(machine.bom.map((l) => l.key));
    expect(bom.filter((l) => l.key === "pump")).toHaveLength(1);
    expect(bom.some((l) => l.key === "cylinder:Clamp")).toBe(true);
    expect(bom.some((l) => l.key === "cylinder:Press")).toBe(true);
  });

  it("shows the machine on the spec page, to the buyer and to a shop", async () => {
    for (const visitor of [buyerVisitor, shops[0].visitor]) {
      const page = await visitor.get(specPage.loader, `/specs/${spec.id}`, { specId: spec.id });
      expect(page.status).toBe(200);
      expect(page.data.published.kind).toBe("machine");
      expect(page.data.published.design.axes.map((a: { name: string }) => a.name)).toEqual(["Clamp", "Press"]);
      expect(page.data.published.design.flowsLpm.pump).toBe(machine.flowsLpm.pump);
    }
  });

  it("gives the shop's form every machine line with the part it serves", async () => {
    const form = await shops[0].visitor.get(bidRoute.loader, `/specs/${spec.id}/bid`, { specId: spec.id });
    expect(form.status).toBe(200);
    expect(form.data.spec.axes).toEqual(["Clamp", "Press"]);
    expect(form.data.bill.map((l: { key: string }) => l.key)).toEqual(machine.bom.map((l) => l.key));
    for (const line of form.data.bill as { key: string; serves: string }[]) expect(line.serves).toBe(partOf(line.key));
  });
});

describe("bids, comparison and award on a machine", () => {
  beforeAll(async () => {
    for (const shop of shops) {
      const sent = await postBid(
        shop.visitor,
        spec.id,
        bidFields(bom, (_, i) => shop.price(i), { intent: "submit" }),
      );
      expect(sent.status).toBe(302);
    }
  });

  it("keeps each bid's lines in the machine bill's order, priced as typed", async () => {
    const bid = await Bid.findOne({ where: { specId: spec.id, organisationId: shops[0].user.organisationId }, rejectOnEmpty: true });
    expect(bid.status).toBe("submitted");
    expect(bid.lines.map((l) => l.key)).toEqual(machine.bom.map((l) => l.key));
    const set = machine.bom.reduce((sum, l, i) => sum + l.quantity * (100 + 10 * i) * 100, 0);
    expect(bid.setTotalCents).toBe(set);
  });

  it("compares the offers line by line, each line naming its part, with a subtotal per part", async () => {
    const page = await buyerVisitor.get(bidsRoute.loader, `/specs/${spec.id}/bids`, { specId: spec.id });
    expect(page.status).toBe(200);
    const { rows, columns, subtotals } = page.data.comparison;
    expect(columns).toHaveLength(2);
    expect(rows.map((r: { serves: string }) => r.serves)).toEqual(machine.bom.map((l) => partOf(l.key)));
    expect(subtotals.map((g: { serves: string }) => g.serves)).toEqual(PARTS);
    // Worked by hand from each shop's price rule: the sum of quantity × price over the part's lines.
    columns.forEach((column: { id: string; shop: string; setTotalCents: number }, c: number) => {
      const shop = shops.find((s) => column.setTotalCents === machine.bom.reduce((sum, l, i) => sum + l.quantity * Number(s.price(i)) * 100, 0))!;
      for (const part of PARTS) {
        const expected = machine.bom.reduce((sum, l, i) => (partOf(l.key) === part ? sum + l.quantity * Number(shop.price(i)) * 100 : sum), 0);
        expect(subtotals.find((g: { serves: string }) => g.serves === part).cents[c]).toBe(expected);
      }
      expect(subtotals.reduce((sum: number, g: { cents: number[] }) => sum + g.cents[c], 0)).toBe(column.setTotalCents);
    });
  });

  it("awards a machine bid: the job carries the machine's lines", async () => {
    const winner = await Bid.findOne({ where: { specId: spec.id, organisationId: shops[1].user.organisationId }, rejectOnEmpty: true });
    const award = await buyerVisitor.post(bidsRoute.action, `/specs/${spec.id}/bids`, { bidId: winner.id, confirm: "on" }, { specId: spec.id });
    expect(award.status).toBe(302);
    const job = await Job.findOne({ where: { specId: spec.id }, rejectOnEmpty: true });
    expect(job.totalCents).toBe(winner.totalCents);
    expect((await winner.reload()).status).toBe("won");
  });
});

// Route loaders take the framework's own argument type; tests pass what they read.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type Loader = (args: any) => unknown;
async function download(visitor: Visitor, loader: Loader, path: string, params: Record<string, string>) {
  const response = (await loader({ request: visitor.request(path), params, context: {} })) as Response;
  expect(response.status).toBe(200);
  return openWorkbook(new Uint8Array(await response.arrayBuffer()));
}
const headerRowOf = (sheet: ExcelJS.Worksheet) => rowOf(sheet, "Line key");

describe("a machine's workbooks", () => {
  it("bill: every machine line with the part it serves", async () => {
    const workbook = await download(shops[0].visitor, billXlsx.loader, `/specs/${spec.id}/bill.xlsx`, { specId: spec.id });
    const sheet = workbook.getWorksheet("Bill of materials")!;
    const head = headerRowOf(sheet);
    expect(sheet.getCell(head, 2).text).toBe("Serves");
    machine.bom.forEach((line, i) => {
      expect(sheet.getCell(head + 1 + i, 1).text).toBe(line.key);
      expect(sheet.getCell(head + 1 + i, 2).text).toBe(partOf(line.key));
      expect(sheet.getCell(head + 1 + i, 3).text).toBe(line.item);
      expect(sheet.getCell(head + 1 + i, 6).value).toBe(line.rating.value);
    });
    // The machine's trail and warnings, not an axis's.
    const trail = workbook.getWorksheet("Design values")!;
    expect(trail.getCell(rowOf(trail, "Quantity") + machine.trail.length, 1).text).toBe(machine.trail[machine.trail.length - 1].quantity);
  });

  it("bill: a Machine sheet with each axis's key sizes and the power unit once", async () => {
    const workbook = await download(buyerVisitor, billXlsx.loader, `/specs/${spec.id}/bill.xlsx`, { specId: spec.id });
    expect(workbook.worksheets.map((s) => s.name)).toEqual(["Bill of materials", "Machine", "Design values", "Requirements", "Cautions"]);
    const sheet = workbook.getWorksheet("Machine")!;
    const head = rowOf(sheet, "Axis");
    machine.axes.forEach((axis, i) => {
      const r = head + 1 + i;
      expect(sheet.getCell(r, 1).text).toBe(axis.name);
      expect([2, 3, 4].map((c) => sheet.getCell(r, c).value)).toEqual([axis.cylinder.boreMm, axis.cylinder.rodMm, axis.cylinder.strokeMm]);
      expect(sheet.getCell(r, 6).value).toBe(axis.pressuresBar.retract);
      expect(sheet.getCell(r, 9).text).toBe(axis.directionalValve.iso4401Size);
    });
    const figureOf = (label: string) => sheet.getCell(rowOf(sheet, label), 2).value;
    expect(figureOf("Pump delivery")).toBe(machine.flowsLpm.pump);
    expect(figureOf("Relief setting")).toBe(machine.pressuresBar.reliefSetting);
    expect(figureOf("Motor rating")).toBe(machine.motor.ratedKw);
    expect(figureOf("Reservoir, usable")).toBe(machine.reservoir.volumeL);
  });

  it("requirements: the duty once, the cycle in words, then one block per axis with what was typed", async () => {
    const workbook = await download(buyerVisitor, billXlsx.loader, `/specs/${spec.id}/bill.xlsx`, { specId: spec.id });
    const sheet = workbook.getWorksheet("Requirements")!;
    const duty = rowOf(sheet, "The machine: duty and site, for every axis");
    const cycle = rowOf(sheet, "The machine cycle, step by step");
    const clamp = rowOf(sheet, "Axis 1: Clamp");
    const press = rowOf(sheet, "Axis 2: Press");
    expect(duty).toBeLessThan(cycle);
    expect(cycle).toBeLessThan(clamp);
    expect(clamp).toBeLessThan(press);
    const between = (from: number, to: number) => Array.from({ length: to - from - 1 }, (_, i) => sheet.getCell(from + 1 + i, 1).text).filter(Boolean);
    expect(between(duty, cycle)).toContain("Cycles per hour");
    expect(between(clamp, press)).not.toContain("Cycles per hour");
    // The default cycle: each axis out and back in turn.
    expect([1, 2, 3, 4].map((i) => sheet.getCell(cycle + i, 2).text)).toEqual(["Clamp extends", "Clamp returns", "Press extends", "Press returns"]);
    // The stroke as typed and as sized, per axis: the first "Stroke" row of each block.
    const strokeAt = (from: number) => {
      for (let r = from + 1; r < from + 40; r++) if (sheet.getCell(r, 1).text === "Stroke") return r;
      throw new Error(`No stroke after row ${from}`);
    };
    expect(sheet.getCell(strokeAt(clamp), 2).value).toBe(50);
    expect(sheet.getCell(strokeAt(clamp), 4).value).toBe(50);
    expect(strokeAt(press)).toBeGreaterThan(press);
    expect(sheet.getCell(strokeAt(press), 2).value).toBe(200);
    expect(sheet.getCell(strokeAt(press), 4).value).toBe(200);
  });

  it("comparison: each line's part, and a subtotal per part that its formula works out", async () => {
    const workbook = await download(buyerVisitor, bidsXlsx.loader, `/specs/${spec.id}/bids.xlsx`, { specId: spec.id });
    const sheet = workbook.getWorksheet("Comparison")!;
    const head = headerRowOf(sheet);
    expect(sheet.getCell(head, 4).text).toBe("Serves; note");
    machine.bom.forEach((line, i) => expect(sheet.getCell(head + 1 + i, 4).text).toBe(partOf(line.key)));
    const page = await buyerVisitor.get(bidsRoute.loader, `/specs/${spec.id}/bids`, { specId: spec.id });
    const { subtotals } = page.data.comparison;
    for (const part of PARTS) {
      const r = rowOf(sheet, `${part}, one set`);
      const expected = subtotals.find((g: { serves: string }) => g.serves === part).cents;
      // Each offer's line-total column: 6, 9, … (four fixed columns, three per offer).
      expected.forEach((cents: number, i: number) => expect(centsAt(sheet, sheet.getCell(r, 6 + 3 * i).address)).toBe(cents));
    }
  });

  it("priced bill: the awarded lines with their part, and the parts adding up to the set total", async () => {
    const job = await Job.findOne({ where: { specId: spec.id }, rejectOnEmpty: true });
    const workbook = await download(buyerVisitor, pricedXlsx.loader, `/jobs/${job.id}/priced-bill.xlsx`, { jobId: job.id });
    const sheet = workbook.getWorksheet("Priced bill")!;
    const head = headerRowOf(sheet);
    expect(sheet.getCell(head, 9).text).toBe("Serves");
    machine.bom.forEach((line, i) => expect(sheet.getCell(head + 1 + i, 9).text).toBe(partOf(line.key)));
    const winnerPrice = shops[1].price;
    let sum = 0;
    for (const part of PARTS) {
      const expected = machine.bom.reduce((s, l, i) => (partOf(l.key) === part ? s + l.quantity * Number(winnerPrice(i)) * 100 : s), 0);
      expect(centsAt(sheet, `F${rowOf(sheet, `${part}, one set`)}`)).toBe(expected);
      sum += expected;
    }
    expect(centsAt(sheet, `F${rowOf(sheet, "Set total, one of each line")}`)).toBe(sum);
    expect(evaluate(sheet, `F${rowOf(sheet, "Set total, one of each line")}`)).toBe(sum / 100);
  });
});

describe("a one-axis spec revised into a machine", () => {
  it("marks the bid made on the one axis as made on an older revision, and prices the machine's bill next", async () => {
    const owner = await makeMember("buyer");
    const single = await makePublishedSpec(owner, { machine: { title: "Press, before the clamp was added" } });
    const oneAxisBill = await bomOf(single);
    const shop = await makeMember("shop");
    const shopVisitor = await signedIn(shop);
    const sent = await postBid(
      shopVisitor,
      single.id,
      bidFields(oneAxisBill, () => "100", { intent: "submit" }),
    );
    expect(sent.status).toBe(302);

    // Revision 2 adds an axis: the revision stores the machine, as publishing a machine does.
    const first = await SpecRevision.findOne({ where: { specId: single.id, number: 1 }, rejectOnEmpty: true });
    await SpecRevision.create({
      specId: single.id,
      number: 2,
      axes: machine.axes.map((a) => ({ name: a.name, requirements: a.requirements, design: a })),
      machine,
      answers: first.answers,
      unitSystem: "metric",
      engineVersion: machine.engineVersion,
      createdById: owner.id,
    });
    await single.update({ currentRevision: 2 });

    // The shop's form now lists the machine's bill, and says the offer was made on revision 1.
    const form = await shopVisitor.get(bidRoute.loader, `/specs/${single.id}/bid`, { specId: single.id });
    expect(form.data.bill.map((l: { key: string }) => l.key)).toEqual(machine.bom.map((l) => l.key));
    expect(form.data.bid).toMatchObject({ specRevision: 1 });
    expect(form.data.spec.revision).toBe(2);

    // The buyer's comparison: the offer is on an older revision, not complete, and its old lines name no part.
    const page = await (await signedIn(owner)).get(bidsRoute.loader, `/specs/${single.id}/bids`, { specId: single.id });
    const [column] = page.data.comparison.columns;
    expect(column).toMatchObject({ olderRevision: true, complete: false, specRevision: 1 });
    const old = page.data.comparison.rows.filter((r: { inCurrentBill: boolean }) => !r.inCurrentBill);
    expect(old.length).toBeGreaterThan(0);
    expect(old.every((r: { serves: string | null }) => r.serves === null)).toBe(true);
  });
});
