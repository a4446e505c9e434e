// The spec form of a machine: axes added, named, copied, moved and removed; each axis's answers
// saved on its own steps; the cycle; a machine published with its MachineDesign; a published
// one-axis spec revised into a machine. Bad input never reaches a service or loses an answer.
import { describe, expect, it } from "vitest";
import * as specNew from "~/routes/spec-new";
import * as resume from "~/routes/spec-resume";
import * as step from "~/routes/spec-step";
import * as revise from "~/routes/spec-revise";
import { Spec, SpecRevision } from "~/models/index.server";
import { checkRequestBounds } from "~/http/request-bounds.server";
import { changeAxes } from "~/services/specs.server";
import { comparisonOf } from "~/services/bids.server";
import { inDays, makeMember, makePublishedSpec, makeSubmittedBid, SPEC_ANSWERS } from "../support/factories";
import { Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";

// An invented machine: a horizontal clamp holds the part, then a vertical ram presses it.
const CLAMP = {
  mounting: { orientation: "horizontal", mounting: "fixed-fixed" },
  motion: { massKg: "60", processForceN: "20000", frictionCoefficient: "0.1", strokeMm: "80", extendSpeedMmS: "60", retractSpeedMmS: "100", accelTimeS: "0.2" },
};
const RAM = {
  mounting: { orientation: "vertical", rodDirection: "down", mounting: "pinned-pinned" },
  motion: { massKg: "800", processForceN: "50000", strokeMm: "400", extendSpeedMmS: "100", retractSpeedMmS: "150", accelTimeS: "0.2" },
};
const DUTY = SPEC_ANSWERS.duty;
const QUOTATION = {
  unitsWanted: "1",
  bidDeadline: inDays(21),
  dateNeeded: inDays(90),
  deliveryRegion: "NL — Noord-Brabant",
  currency: "EUR",
  retainerPercent: "20",
  notes: "",
};

const post = (visitor: Visitor, id: string, name: string, fields: Record<string, string>) =>
  visitor.post(step.action, `/specs/${id}/edit/${name}`, fields, { specId: id, step: name });
const load = (visitor: Visitor, id: string, name: string) => visitor.get(step.loader, `/specs/${id}/edit/${name}`, { specId: id, step: name });
const reload = (id: string) => Spec.findByPk(id, { rejectOnEmpty: true });
const axisIds = (spec: Spec) => spec.answers.machine.axes.split(" ");
/** The cycle step's answers: for each axis, the step it extends in and the step it retracts in. */
const cycleAnswers = (steps: Record<string, [extend: number, retract: number]>) =>
  Object.fromEntries(
    Object.entries(steps).flatMap(([axis, [out, back]]) => [
      [`extend-${axis}`, String(out)],
      [`retract-${axis}`, String(back)],
    ]),
  );

async function newDraft(visitor: Visitor) {
  const created = await visitor.post(specNew.action, "/specs/new", {});
  return created.location!.split("/")[2];
}

/** A draft with a clamp and a main ram, both named; returns the ram's id. */
async function twoAxisDraft(visitor: Visitor, id: string) {
  const added = await post(visitor, id, "machine", { intent: "add", title: "Clamp-and-press cell", "name-axis01": "Clamp" });
  expect(added.status).toBe(302);
  const ram = axisIds(await reload(id))[1];
  expect(added.location).toBe(`/specs/${id}/edit/machine#axes`);
  const named = await post(visitor, id, "machine", { intent: "next", title: "Clamp-and-press cell", "name-axis01": "Clamp", [`name-${ram}`]: "Main ram" });
  expect(named.location).toBe(`/specs/${id}/edit/axis01-mounting`);
  return ram;
}

async function answerAxis(visitor: Visitor, id: string, axis: string, answers: typeof CLAMP | typeof RAM) {
  expect((await post(visitor, id, `${axis}-mounting`, { intent: "next", ...answers.mounting })).status).toBe(302);
  expect((await post(visitor, id, `${axis}-motion`, { intent: "next", ...answers.motion })).status).toBe(302);
}

describe("the axes of a machine", () => {
  it("adds, names, duplicates, moves and removes axes, keeping every answer typed", async () => {
    const visitor = await signedIn(await makeMember("buyer"));
    const id = await newDraft(visitor);
    const ram = await twoAxisDraft(visitor, id);
    await answerAxis(visitor, id, "axis01", CLAMP);

    let spec = await reload(id);
    expect(spec.title).toBe("Clamp-and-press cell");
    expect(spec.answers.machine).toMatchObject({ axes: `axis01 ${ram}`, "name-axis01": "Clamp", [`name-${ram}`]: "Main ram" });
    expect(spec.answers["axis01-motion"].strokeMm).toBe("80");
    expect(spec.completedSteps).toEqual(["machine", "axis01-mounting", "axis01-motion"]);
    // The progress lists each axis with its own steps; the cycle appears with the second axis.
    const page = await load(visitor, id, `${ram}-motion`);
    expect(page.data.steps.map((s: { id: string }) => s.id)).toEqual([
      "machine",
      "axis01-mounting",
      "axis01-motion",
      `${ram}-mounting`,
      `${ram}-motion`,
      "cycle",
      "duty",
      "quotation",
      "review",
    ]);
    expect(page.data.stepTitle).toBe("Main ram: Load and motion");
    expect((await visitor.get(resume.loader, `/specs/${id}/edit`, { specId: id })).location).toBe(`/specs/${id}/edit/${ram}-mounting`);

    // A copy takes the answers and the completed steps of its original, under a name of its own;
    // a title typed meanwhile is saved with the button.
    const copied = await post(visitor, id, "machine", {
      intent: "duplicate:axis01",
      title: "Clamp-and-press cell, line 2",
      "name-axis01": "Clamp",
      [`name-${ram}`]: "Main ram",
    });
    expect(copied.location).toBe(`/specs/${id}/edit/machine#axes`);
    spec = await reload(id);
    const copy = axisIds(spec)[1];
    expect(axisIds(spec)).toEqual(["axis01", copy, ram]);
    expect(spec.title).toBe("Clamp-and-press cell, line 2");
    expect(spec.answers.machine[`name-${copy}`]).toBe("Clamp (copy)");
    expect(spec.answers[`${copy}-motion`]).toEqual(spec.answers["axis01-motion"]);
    expect(spec.completedSteps).toContain(`${copy}-motion`);

    // Moving down and up changes only the order.
    const names = { title: "Clamp-and-press cell", "name-axis01": "Clamp", [`name-${copy}`]: "Clamp (copy)", [`name-${ram}`]: "Main ram" };
    await post(visitor, id, "machine", { intent: `down:${copy}`, ...names });
    expect(axisIds(await reload(id))).toEqual(["axis01", ram, copy]);
    await post(visitor, id, "machine", { intent: `up:${ram}`, ...names, [`name-${ram}`]: "Press ram" });
    spec = await reload(id);
    expect(axisIds(spec)).toEqual([ram, "axis01", copy]);
    expect(spec.answers.machine[`name-${ram}`]).toBe("Press ram");

    // A second tab opened before the copy was made posts no name for it: the copy keeps its own.
    await post(visitor, id, "machine", { intent: "next", title: "Clamp-and-press cell", "name-axis01": "Clamp", [`name-${ram}`]: "Press ram" });
    expect((await reload(id)).answers.machine[`name-${copy}`]).toBe("Clamp (copy)");

    // Removing takes the axis, its answers and its steps.
    await post(visitor, id, "machine", { intent: `remove:${copy}`, ...names });
    spec = await reload(id);
    expect(axisIds(spec)).toEqual([ram, "axis01"]);
    expect(spec.answers[`${copy}-motion`]).toBeUndefined();
    expect(spec.completedSteps.some((s) => s.startsWith(copy))).toBe(false);
    // A tab still on the removed axis's page is sent to the list of axes, told why, and changes nothing.
    const stale = await post(visitor, id, `${copy}-motion`, { intent: "next", ...CLAMP.motion });
    expect(stale.location).toBe(`/specs/${id}/edit/machine#axes`);
    expect((await reload(id)).answers).toEqual(spec.answers);
    expect((await load(visitor, id, "zzzzzz-motion")).status).toBe(302);
    expect((await load(visitor, id, "payment")).status).toBe(404);
  });

  it("refuses empty and repeated names, a ninth axis and the last one removed, and names the axis in its errors", async () => {
    const buyer = await makeMember("buyer");
    const visitor = await signedIn(buyer);
    const id = await newDraft(visitor);
    const ram = await twoAxisDraft(visitor, id);
    const before = await reload(id);

    const empty = await post(visitor, id, "machine", { intent: "next", title: "Cell", "name-axis01": "  ", [`name-${ram}`]: "Main ram" });
    expect(empty.status).toBe(400);
    expect(empty.data.result.error["name-axis01"][0]).toMatch(/Name the axis/);
    const same = await post(visitor, id, "machine", { intent: "next", title: "Cell", "name-axis01": "Main ram", [`name-${ram}`]: "main ram " });
    expect(same.status).toBe(400);
    expect(same.data.result.error[`name-${ram}`][0]).toMatch(/Another axis is already called “main ram”/);
    const long = await post(visitor, id, "machine", { intent: "add", title: "Cell", "name-axis01": "x".repeat(81), [`name-${ram}`]: "Main ram" });
    expect(long.status).toBe(400);
    expect(long.data.result.error["name-axis01"][0]).toMatch(/Keep it under 81/);
    // Nothing of the refused posts was saved.
    expect((await reload(id)).answers).toEqual(before.answers);

    // A cycle that moves one axis both ways at once is refused with the axis's name.
    await answerAxis(visitor, id, "axis01", CLAMP);
    await answerAxis(visitor, id, ram, RAM);
    const clash = await post(visitor, id, "cycle", { intent: "next", ...cycleAnswers({ axis01: [1, 1], [ram]: [2, 3] }) });
    expect(clash.status).toBe(400);
    expect(clash.data.result.error["retract-axis01"][0]).toMatch(/“Clamp” cannot extend and retract in the same step/);
    const past = await post(visitor, id, "cycle", { intent: "next", ...cycleAnswers({ axis01: [9, 2], [ram]: [3, 4] }) });
    expect(past.data.result.error["extend-axis01"][0]).toMatch(/from 1 to 4/);

    // An axis step's error is beside its field, on that axis's page, and the other axis keeps its answers.
    const bad = await post(visitor, id, `${ram}-motion`, { intent: "next", ...RAM.motion, strokeMm: "long" });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.data.result.error)).toEqual(["strokeMm"]);
    expect((await reload(id)).answers["axis01-motion"].strokeMm).toBe("80");

    // At most eight axes: the ninth is refused and said on the machine step.
    for (let i = 2; i < 8; i++) await changeAxes(buyer, id, { change: { op: "add" }, machine: {}, complete: true });
    expect(axisIds(await reload(id))).toHaveLength(8);
    const ninth = await post(visitor, id, "machine", { intent: "add", title: "Cell" });
    expect(ninth.status).toBe(302);
    expect(ninth.location).toBe(`/specs/${id}/edit/machine#axes`);
    expect(ninth.setCookie).toBeTruthy(); // the message travels as a toast
    expect(axisIds(await reload(id))).toHaveLength(8);
    await expect(changeAxes(buyer, id, { change: { op: "duplicate", axisId: ram }, machine: {}, complete: true })).rejects.toThrow(/at most 8 axes/);

    // At least one: the last axis stays.
    const lone = await newDraft(visitor);
    await expect(changeAxes(buyer, lone, { change: { op: "remove", axisId: "axis01" }, machine: {}, complete: false })).rejects.toThrow(/at least one axis/);
    // An axis button naming no axis of this spec changes nothing.
    await expect(changeAxes(buyer, lone, { change: { op: "remove", axisId: "zzzzzz" }, machine: {}, complete: false })).rejects.toThrow(
      /no longer in this spec/,
    );
  });

  it("stops a NUL character and a field sent twice before the form sees them", async () => {
    const visitor = await signedIn(await makeMember("buyer"));
    const id = await newDraft(visitor);
    const form = (body: string) =>
      visitor.request(`/specs/${id}/edit/machine`, { method: "POST", body, headers: { "Content-Type": "application/x-www-form-urlencoded" } });
    expect(await checkRequestBounds(form("intent=next&title=Cell&name-axis01=Cl%00amp"))).toMatchObject({ status: 400, message: expect.stringMatching(/NUL/) });
    expect(await checkRequestBounds(form("intent=add&name-axis01=Clamp&name-axis01=Ram"))).toMatchObject({
      status: 400,
      message: expect.stringMatching(/more than once/),
    });
    // The form's own names pass.
    expect(await checkRequestBounds(form("intent=duplicate%3Aaxis01&title=Cell&name-axis01=Clamp&extend-axis01=1"))).toBeNull();
  });
});

describe("publishing a machine", () => {
  it("publishes a two-axis draft with its machine design, its axes and the cycle the buyer chose", async () => {
    const buyer = await makeMember("buyer");
    const visitor = await signedIn(buyer);
    const id = await newDraft(visitor);
    const ram = await twoAxisDraft(visitor, id);
    await answerAxis(visitor, id, "axis01", CLAMP);
    await answerAxis(visitor, id, ram, RAM);

    // The cycle starts as one after another, and the page sizes the machine beside it.
    const cyclePage = await load(visitor, id, "cycle");
    expect(cyclePage.data.stepAnswers).toEqual(cycleAnswers({ axis01: [1, 2], [ram]: [3, 4] }));
    // The press: clamp, press, ram back, unclamp.
    const cycle = cycleAnswers({ axis01: [1, 4], [ram]: [2, 3] });
    expect((await post(visitor, id, "cycle", { intent: "next", ...cycle })).location).toBe(`/specs/${id}/edit/duty`);
    expect((await post(visitor, id, "duty", { intent: "next", ...DUTY })).status).toBe(302);
    expect((await post(visitor, id, "quotation", { intent: "next", ...QUOTATION })).status).toBe(302);

    const review = await load(visitor, id, "review");
    expect(review.data.review.published.kind).toBe("machine");
    const machine = review.data.review.published.design;
    expect(machine.axes.map((a: { name: string }) => a.name)).toEqual(["Clamp", "Main ram"]);
    expect(machine.sequence).toEqual([
      [{ axis: "Clamp", motion: "extend" }],
      [{ axis: "Main ram", motion: "extend" }],
      [{ axis: "Main ram", motion: "retract" }],
      [{ axis: "Clamp", motion: "retract" }],
    ]);
    expect(review.data.sequence).toEqual(machine.sequence);

    expect((await post(visitor, id, "review", { intent: "publish", cautionsRead: "on" })).status).toBe(302);
    const spec = await reload(id);
    expect(spec.status).toBe("open");
    const revision = await SpecRevision.findOne({ where: { specId: id }, rejectOnEmpty: true });
    expect(revision.machine).not.toBeNull();
    expect(revision.axes.map((a) => a.name)).toEqual(["Clamp", "Main ram"]);
    expect((revision.axes[1].design as { cylinder: { strokeMm: number } }).cylinder.strokeMm).toBe(400);
    expect(revision.machine!.bom.some((line) => line.key.endsWith(":Main ram") || line.key.includes("Main ram"))).toBe(true);
    // The spec row carries the machine's figures for the open-specs filter.
    expect(spec.reliefSettingBar).toBe(revision.machine!.pressuresBar.reliefSetting);
    expect(spec.pumpFlowLpm).toBe(revision.machine!.flowsLpm.pump);
    // The revision keeps the answers per axis, with the quotation facts where every reader looks.
    expect(revision.answers.machine).toMatchObject({ title: "Clamp-and-press cell", "name-axis01": "Clamp" });
    expect(revision.answers.duty.supplyVoltage).toBe("400 V three-phase");
  });

  it("revises a published one-axis spec into a machine of two, marking earlier bids as made on the older revision", async () => {
    const buyer = await makeMember("buyer");
    const shop = await makeMember("shop");
    const spec = await makePublishedSpec(buyer, { machine: { title: "Bending press" } });
    await makeSubmittedBid(spec, shop, { totalCents: 900_000, leadTimeWeeks: 10 });
    const visitor = await signedIn(buyer);
    const id = spec.id;
    expect((await visitor.post(revise.action, "/x", {}, { specId: id })).location).toBe(`/specs/${id}/edit/machine`);

    // The one axis of revision 1 is the first axis ("Axis 1", as it was published); the buyer names it and adds an ejector.
    const machinePage = await load(visitor, id, "machine");
    expect(machinePage.data.stepAnswers).toMatchObject({ title: "Bending press", "name-axis01": "Axis 1" });
    const added = await post(visitor, id, "machine", { intent: "add", title: "Bending press", "name-axis01": "Main ram" });
    expect(added.status).toBe(302);
    const ejector = axisIds(await reload(id))[1];
    await post(visitor, id, "machine", { intent: "next", title: "Bending press", "name-axis01": "Main ram", [`name-${ejector}`]: "Ejector" });
    // Publishing waits for the new axis and the cycle.
    const early = await post(visitor, id, "review", { intent: "publish", cautionsRead: "on" });
    expect(early.status).toBe(400);
    expect(early.data.publishError).toMatch(/Ejector: Mounting, Ejector: Load and motion, Cycle/);
    await answerAxis(visitor, id, ejector, CLAMP);
    expect((await post(visitor, id, "cycle", { intent: "next", ...cycleAnswers({ axis01: [1, 2], [ejector]: [3, 4] }) })).status).toBe(302);
    expect((await post(visitor, id, "review", { intent: "publish", cautionsRead: "on" })).status).toBe(302);

    const revisions = await SpecRevision.findAll({ where: { specId: id }, order: [["number", "ASC"]] });
    expect(revisions.map((r) => [r.number, r.machine ? "machine" : "axis", r.axes.length])).toEqual([
      [1, "axis", 1],
      [2, "machine", 2],
    ]);
    const revised = await reload(id);
    expect(revised.currentRevision).toBe(2);
    expect(revised.pumpFlowLpm).toBe(revisions[1].machine!.flowsLpm.pump);
    // The shop's bid stays on revision 1 and reads as made on an older revision.
    const { comparison } = await comparisonOf(buyer, revised);
    expect(comparison.columns.map((c) => [c.specRevision, c.olderRevision])).toEqual([[1, true]]);
  });
});
