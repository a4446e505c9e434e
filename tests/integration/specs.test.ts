import { Op } from "sequelize";
import { describe, expect, it } from "vitest";
import * as specNew from "~/routes/spec-new";
import * as resume from "~/routes/spec-resume";
import * as step from "~/routes/spec-step";
import * as specPage from "~/routes/spec";
import * as specList from "~/routes/specs";
import * as del from "~/routes/spec-delete";
import * as revise from "~/routes/spec-revise";
import { OutboxMail, Spec, SpecRevision } from "~/models/index.server";
import { deliverDueMail } from "~/services/mail.server";
import { waitForMail } from "../support/mailbox";
import { SPEC_ANSWERS, makeMember } from "../support/factories";
import { Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";
import { REQUIREMENT_FIELDS, answerInWords, fieldApplies, requirementsInWords } from "~/content/requirement-fields";
import { ENGINE_KEYS_BY_STEP, FORM_STEPS } from "~/content/spec-steps";

// The factories' complete spec (a vertical press ram) as the form's steps take it. A new draft's
// one axis is `axis01` (FIRST_AXIS_ID) until the buyer adds others. The quotation leaves the
// currency at the form's default, as an older form stored none (see the last test below).
const { title, purpose, orientation, rodDirection, mounting } = SPEC_ANSWERS.machine;
const { currency: _currency, ...quotation } = SPEC_ANSWERS.quotation;
const ANSWERS = {
  machine: { intent: "next", title, purpose, "name-axis01": "Main ram" },
  "axis01-mounting": { intent: "next", orientation, rodDirection, mounting },
  "axis01-motion": { intent: "next", ...SPEC_ANSWERS.motion },
  duty: { intent: "next", ...SPEC_ANSWERS.duty },
  quotation: { intent: "next", ...quotation },
};

/** The spec page's design of one axis (the page names it `published` since machines; `design` before). */
const pageDesign = (data: { published?: { design: unknown }; design?: unknown }) =>
  (data.published?.design ?? data.design) as { cylinder: { boreMm: number }; requirements: Record<string, unknown> };

async function newDraft(visitor: Visitor) {
  const created = await visitor.post(specNew.action, "/specs/new", {});
  expect(created.status).toBe(302);
  const id = created.location!.split("/")[2];
  return id;
}

/** A buyer signed in on a new draft, and a shop that is told when it is published. */
async function draftAndShop() {
  const visitor = await signedIn(await makeMember("buyer"));
  const shop = await makeMember("shop");
  return { shop, visitor, id: await newDraft(visitor) };
}

const stepPost = (visitor: Visitor, id: string, name: string, fields: Record<string, string>) =>
  visitor.post(step.action, `/specs/${id}/edit/${name}`, fields, { specId: id, step: name });

describe("the spec form", () => {
  it("saves each step, resumes where the buyer left, and publishes with mail to the shops", async () => {
    const { shop, visitor, id } = await draftAndShop();

    for (const [name, fields] of Object.entries(ANSWERS).slice(0, 3)) {
      const res = await stepPost(visitor, id, name, fields);
      expect(res.status).toBe(302);
    }
    const spec = await Spec.findByPk(id, { rejectOnEmpty: true });
    expect(spec.title).toBe("Bending press, main ram");
    expect(spec.completedSteps).toEqual(["machine", "axis01-mounting", "axis01-motion"]);
    expect(spec.answers["axis01-motion"].strokeMm).toBe("500");
    expect(spec.answers.machine).toMatchObject({ axes: "axis01", "name-axis01": "Main ram" });

    // Leaving and coming back resumes at the first step not done.
    const back = await visitor.get(resume.loader, `/specs/${id}/edit`, { specId: id });
    expect(back.location).toBe(`/specs/${id}/edit/duty`);

    for (const [name, fields] of Object.entries(ANSWERS).slice(3)) {
      expect((await stepPost(visitor, id, name, fields)).status).toBe(302);
    }
    const review = await visitor.get(step.loader, `/specs/${id}/edit/review`, { specId: id, step: "review" });
    expect(review.data.review.published.kind).toBe("axis");
    expect(review.data.review.published.design.cylinder.strokeMm).toBe(500);
    expect(review.data.review.published.design.counterbalance.side).toBe("rod");

    // Publishing needs the cautions read.
    const refused = await stepPost(visitor, id, "review", { intent: "publish" });
    expect(refused.status).toBe(400);
    expect(refused.data.publishError).toMatch(/cautions/);
    expect((await spec.reload()).status).toBe("draft");

    const published = await stepPost(visitor, id, "review", { intent: "publish", cautionsRead: "on" });
    expect(published.status).toBe(302);
    await spec.reload();
    expect(spec.status).toBe("open");
    expect(spec.currentRevision).toBe(1);
    expect(spec.retainerPercent).toBe("20.00");
    const revision = await SpecRevision.findOne({ where: { specId: id }, rejectOnEmpty: true });
    expect(revision.axes).toHaveLength(1);
    expect(revision.axes[0].name).toBe("Main ram");
    expect(revision.machine).toBeNull();
    expect(revision.engineVersion).toMatch(/^\d+\.\d+\.\d+$/);
    expect(await OutboxMail.count({ where: { to: shop.email } })).toBe(1);
    await deliverDueMail(100);
    const mail = await waitForMail(shop.email, "New spec open for bids");
    expect(mail.subject).toContain("Bending press, main ram");

    // A second publish makes no second revision.
    const again = await stepPost(visitor, id, "review", { intent: "publish", cautionsRead: "on" });
    expect(again.status).toBe(400);
    expect(again.data.publishError).toMatch(/already published/);
    expect(await SpecRevision.count({ where: { specId: id } })).toBe(1);

    const page = await visitor.get(specPage.loader, `/specs/${id}`, { specId: id });
    expect(page.data.status).toBe("open");
    const shopVisitor = await signedIn(shop);
    const shopView = await shopVisitor.get(specPage.loader, `/specs/${id}`, { specId: id });
    expect(shopView.status).toBe(200);
    const { loader: openSpecs } = await import("~/routes/open-specs");
    const open = await shopVisitor.get(openSpecs, "/open-specs");
    expect(open.data.specs.map((s: { id: string }) => s.id)).toContain(id);
  });

  it("returns field errors for bad answers and saves nothing of them", async () => {
    const visitor = await signedIn(await makeMember("buyer"));
    const id = await newDraft(visitor);
    const res = await stepPost(visitor, id, "machine", { intent: "next", title: "", "name-axis01": " " });
    expect(res.status).toBe(400);
    expect(Object.keys(res.data.result.error).sort()).toEqual(["name-axis01", "title"]);
    const mounting = await stepPost(visitor, id, "axis01-mounting", { intent: "next", orientation: "inclined", mounting: "glued" });
    expect(mounting.status).toBe(400);
    expect(Object.keys(mounting.data.result.error).sort()).toEqual(["inclineDeg", "mounting", "rodDirection"]);
    const spec = await Spec.findByPk(id, { rejectOnEmpty: true });
    expect(spec.answers).toEqual({});
    expect(spec.completedSteps).toEqual([]);

    const motion = await stepPost(visitor, id, "axis01-motion", { ...ANSWERS["axis01-motion"], strokeMm: "long", massKg: "-3" });
    expect(Object.keys(motion.data.result.error).sort()).toEqual(["massKg", "strokeMm"]);
  });

  it("keeps what was typed when the buyer goes back, without marking the step done", async () => {
    const visitor = await signedIn(await makeMember("buyer"));
    const id = await newDraft(visitor);
    await stepPost(visitor, id, "machine", ANSWERS.machine);
    const res = await stepPost(visitor, id, "axis01-motion", { ...ANSWERS["axis01-motion"], intent: "back", strokeMm: "" });
    expect(res.location).toBe(`/specs/${id}/edit/axis01-mounting`);
    const spec = await Spec.findByPk(id, { rejectOnEmpty: true });
    expect(spec.answers["axis01-motion"].massKg).toBe("800");
    expect(spec.completedSteps).toEqual(["machine"]);
  });

  it("reads US customary answers in inches and pounds and sizes them in SI", async () => {
    const buyer = await makeMember("buyer");
    await buyer.update({ unitSystem: "us" });
    const visitor = await signedIn(buyer);
    const id = await newDraft(visitor);
    await stepPost(visitor, id, "machine", ANSWERS.machine);
    await stepPost(visitor, id, "axis01-mounting", ANSWERS["axis01-mounting"]);
    await stepPost(visitor, id, "axis01-motion", {
      ...ANSWERS["axis01-motion"],
      massKg: "1764",
      processForceN: "11240",
      strokeMm: "19.69",
      extendSpeedMmS: "3.94",
      retractSpeedMmS: "5.91",
    });
    await stepPost(visitor, id, "duty", { ...ANSWERS.duty, ambientC: "77", maxPressureBar: "2320" });
    const review = await visitor.get(step.loader, `/specs/${id}/edit/review`, { specId: id, step: "review" });
    const req = review.data.review.published.design.requirements;
    expect(req.strokeMm).toBeCloseTo(500.1, 0); // 19.69 in × 25.4
    expect(req.massKg).toBeCloseTo(800.1, 0); // 1764 lb × 0.45359237
    expect(req.ambientC).toBeCloseTo(25, 5); // (77 − 32) × 5/9
    expect(req.maxPressureBar).toBeCloseTo(160, 0); // 2320 psi × 0.0689476
  });

  it("lists, filters and deletes drafts; another organisation sees nothing", async () => {
    const buyer = await makeMember("buyer");
    const stranger = await makeMember("buyer");
    const visitor = await signedIn(buyer);
    const id = await newDraft(visitor);
    await stepPost(visitor, id, "machine", ANSWERS.machine);
    const list = await visitor.get(specList.loader, "/specs");
    expect(list.data.specs.map((s: { id: string }) => s.id)).toEqual([id]);
    const open = await visitor.get(specList.loader, "/specs?status=open");
    expect(open.data.specs).toEqual([]);

    const other = await signedIn(stranger);
    expect((await other.get(step.loader, "/x", { specId: id, step: "machine" })).status).toBe(404);
    expect((await other.post(step.action, "/x", ANSWERS.machine, { specId: id, step: "machine" })).status).toBe(404);
    expect((await other.get(specPage.loader, "/x", { specId: id })).status).toBe(404);
    expect((await other.post(del.action, "/x", {}, { specId: id })).status).toBe(404);
    expect((await other.get(specList.loader, "/specs")).data.specs).toEqual([]);
    const shop = await signedIn(await makeMember("shop"));
    expect((await shop.get(specPage.loader, "/x", { specId: id })).status).toBe(404); // drafts are private

    expect((await visitor.post(del.action, "/x", {}, { specId: id })).status).toBe(302);
    expect(await Spec.findByPk(id)).toBeNull();
  });

  it("rejects an unknown step and a deadline in the past", async () => {
    const visitor = await signedIn(await makeMember("buyer"));
    const id = await newDraft(visitor);
    expect((await visitor.get(step.loader, "/x", { specId: id, step: "payment" })).status).toBe(404);
    const res = await stepPost(visitor, id, "quotation", { ...ANSWERS.quotation, bidDeadline: "2020-01-01" });
    expect(res.status).toBe(400);
    expect(res.data.result.error.bidDeadline[0]).toMatch(/after today/);
  });
});

describe("revising a published spec", () => {
  it("makes revision 2 with a fresh design, keeps revision 1 viewable, and tells the shops", async () => {
    const { shop, visitor, id } = await draftAndShop();
    for (const [name, fields] of Object.entries(ANSWERS)) await stepPost(visitor, id, name, fields);
    await stepPost(visitor, id, "review", { intent: "publish", cautionsRead: "on" });

    expect((await visitor.post(revise.action, "/x", {}, { specId: id })).location).toBe(`/specs/${id}/edit/machine`);
    // While revising, shops keep seeing revision 1.
    const shopVisitor = await signedIn(shop);
    expect((await shopVisitor.get(specPage.loader, `/specs/${id}`, { specId: id })).data.revision.number).toBe(1);

    await stepPost(visitor, id, "axis01-motion", { ...ANSWERS["axis01-motion"], massKg: "3000", processForceN: "120000" });
    const published = await stepPost(visitor, id, "review", { intent: "publish", cautionsRead: "on" });
    expect(published.status).toBe(302);

    const revisions = await SpecRevision.findAll({ where: { specId: id }, order: [["number", "ASC"]] });
    expect(revisions.map((r) => r.number)).toEqual([1, 2]);
    const bore = (r: SpecRevision) => (r.axes[0].design as { cylinder: { boreMm: number } }).cylinder.boreMm;
    expect(bore(revisions[1])).toBeGreaterThan(bore(revisions[0])); // 120 kN needs a larger bore than 50 kN
    const spec = await Spec.findByPk(id, { rejectOnEmpty: true });
    expect(spec.currentRevision).toBe(2);
    expect(spec.revising).toBe(false);

    const latest = await shopVisitor.get(specPage.loader, `/specs/${id}`, { specId: id });
    expect(latest.data.revision.number).toBe(2);
    const older = await shopVisitor.get(specPage.loader, `/specs/${id}?revision=1`, { specId: id });
    expect(older.data.revision.number).toBe(1);
    expect(pageDesign(older.data).cylinder.boreMm).toBe(bore(revisions[0]));
    expect(await OutboxMail.count({ where: { to: shop.email, subject: { [Op.like]: "Spec revised (revision 2)%" } } })).toBe(1);
  });

  it("refuses to revise a draft and edits of a published spec not being revised", async () => {
    const visitor = await signedIn(await makeMember("buyer"));
    const id = await newDraft(visitor);
    expect((await visitor.post(revise.action, "/x", {}, { specId: id })).status).toBe(302);
    expect((await Spec.findByPk(id, { rejectOnEmpty: true })).revising).toBe(false);
    for (const [name, fields] of Object.entries(ANSWERS)) await stepPost(visitor, id, name, fields);
    await stepPost(visitor, id, "review", { intent: "publish", cautionsRead: "on" });
    const edit = await visitor.get(step.loader, "/x", { specId: id, step: "axis01-motion" });
    expect(edit.location).toBe(`/specs/${id}`);
  });
});

describe("the axis questions of sizing contract 2", () => {
  const words = (requirements: Record<string, unknown>) => Object.fromEntries(requirementsInWords(requirements, "metric").map((r) => [r.label, r.value]));

  it("asks each new question on its step, saves and sizes the answers, and shows them in words", async () => {
    const visitor = await signedIn(await makeMember("buyer"));
    const id = await newDraft(visitor);
    const steps = {
      ...ANSWERS,
      "axis01-mounting": { ...ANSWERS["axis01-mounting"], mountingStyle: "front-flange" },
      "axis01-motion": { ...ANSWERS["axis01-motion"], pressStrokeMm: "30", pressSpeedMmS: "10", dwellS: "2", decelTimeS: "0.3", holdMinutes: "45" },
      duty: { ...ANSWERS.duty, pumpType: "double" },
    };
    for (const [name, fields] of Object.entries(steps)) expect((await stepPost(visitor, id, name, fields)).status).toBe(302);
    const spec = await Spec.findByPk(id, { rejectOnEmpty: true });
    expect(spec.answers["axis01-mounting"].mountingStyle).toBe("front-flange");
    expect(spec.answers["axis01-motion"]).toMatchObject({ pressStrokeMm: "30", pressSpeedMmS: "10", dwellS: "2", decelTimeS: "0.3", holdMinutes: "45" });
    expect(spec.answers.duty).toMatchObject({ pumpType: "double" });

    const review = await visitor.get(step.loader, `/specs/${id}/edit/review`, { specId: id, step: "review" });
    expect(review.data.review.published.design.requirements).toMatchObject({
      mountingStyle: "front-flange",
      pressStrokeMm: 30,
      pressSpeedMmS: 10,
      dwellS: 2,
      decelTimeS: 0.3,
      holdMinutes: 45,
      pumpType: "double",
    });
    expect((await stepPost(visitor, id, "review", { intent: "publish", cautionsRead: "on" })).status).toBe(302);

    // The spec page lists what the axis must do in words and units, not as codes.
    const page = await visitor.get(specPage.loader, `/specs/${id}`, { specId: id });
    expect(words(pageDesign(page.data).requirements)).toMatchObject({
      "How the cylinder body is fixed": "Front flange",
      "Pressing stroke": "30 mm",
      "Pressing speed": "10 mm/s",
      "Dwell at force": "2 s",
      "Time to stop": "0.3 s",
      "Time the load is held at rest": "45 min",
      Pump: "Double (high-low)",
      "Mains frequency": "50 Hz",
      "How the cylinder is held": "Pivots at both ends",
    });
    // Large figures grouped as the rest of the page writes them; a phase left out reads "none".
    expect(words({ ...pageDesign(page.data).requirements, processForceN: 400000, pressStrokeMm: 0, dwellS: 0 })).toMatchObject({
      "Pressing stroke": "none",
      "Dwell at force": "none",
    });
    expect(Object.values(words({ ...pageDesign(page.data).requirements, processForceN: 400000 }))).toContain("400,000 N");
  });

  it("resumes, validates and publishes a draft saved before the new questions existed", async () => {
    const visitor = await signedIn(await makeMember("buyer"));
    const id = await newDraft(visitor);
    const strip = ({ intent: _intent, ...fields }: Record<string, string>) => fields;
    // Exactly what an older form stored: no mounting style, phases, holding or pump.
    await Spec.update(
      {
        title: ANSWERS.machine.title,
        answers: {
          machine: { title: ANSWERS.machine.title, purpose: ANSWERS.machine.purpose, ...strip(ANSWERS["axis01-mounting"]) },
          motion: strip(ANSWERS["axis01-motion"]),
          duty: { ...strip(ANSWERS.duty), holdMinutes: "0" },
          quotation: strip(ANSWERS.quotation),
        },
        completedSteps: ["machine", "motion", "duty", "quotation"],
      },
      { where: { id } },
    );
    expect((await visitor.get(resume.loader, `/specs/${id}/edit`, { specId: id })).location).toBe(`/specs/${id}/edit/review`);
    // Read as its one axis, with every answer where the form now asks it.
    const motion = await visitor.get(step.loader, `/specs/${id}/edit/axis01-motion`, { specId: id, step: "axis01-motion" });
    expect(motion.status).toBe(200);
    expect(motion.data.stepAnswers).toMatchObject({ strokeMm: "500", holdMinutes: "0" });
    const mounting = await visitor.get(step.loader, `/specs/${id}/edit/axis01-mounting`, { specId: id, step: "axis01-mounting" });
    expect(mounting.data.stepAnswers).toMatchObject({ orientation: "vertical", rodDirection: "down" });
    // The old motion step's address leads to the axis's, and an old tab's post there is saved onto it.
    expect((await visitor.get(step.loader, `/specs/${id}/edit/motion`, { specId: id, step: "motion" })).location).toBe(`/specs/${id}/edit/axis01-motion`);
    expect((await stepPost(visitor, id, "motion", { ...ANSWERS["axis01-motion"], strokeMm: "510" })).status).toBe(302);
    expect((await Spec.findByPk(id, { rejectOnEmpty: true })).answers["axis01-motion"].strokeMm).toBe("510");
    // A tab still showing the old form posts the old fields only: they validate and save.
    expect((await stepPost(visitor, id, "axis01-motion", strip(ANSWERS["axis01-motion"]))).status).toBe(302);
    expect((await stepPost(visitor, id, "review", { intent: "publish", cautionsRead: "on" })).status).toBe(302);

    const revision = await SpecRevision.findOne({ where: { specId: id }, rejectOnEmpty: true });
    const requirements = revision.axes[0].requirements as Record<string, unknown>;
    // Blank means the default: no phases, no hold, stopping as fast as starting, the engine's pump.
    expect(requirements).toMatchObject({ pressStrokeMm: 0, dwellS: 0, holdMinutes: 0, decelTimeS: 0.2 });
    expect(requirements.pumpType).toBeUndefined();
    expect(requirements.mountingStyle).toBeUndefined();
    expect(words(requirements)).toMatchObject({ Pump: "Let the sizing choose", "How the cylinder body is fixed": "Not known yet" });
    expect(words(requirements)).not.toHaveProperty("Pressing speed");
  });

  it("asks the pressing speed only with a pressing stroke, and says beside it that it is needed", async () => {
    const visitor = await signedIn(await makeMember("buyer"));
    const id = await newDraft(visitor);
    await stepPost(visitor, id, "machine", ANSWERS.machine);
    await stepPost(visitor, id, "axis01-mounting", ANSWERS["axis01-mounting"]);

    const missing = await stepPost(visitor, id, "axis01-motion", { ...ANSWERS["axis01-motion"], pressStrokeMm: "30", pressSpeedMmS: "" });
    expect(missing.status).toBe(400);
    expect(Object.keys(missing.data.result.error)).toEqual(["pressSpeedMmS"]);
    expect(missing.data.result.error.pressSpeedMmS.join(" ")).toMatch(/pressing speed.*needed when there is a pressing stroke/i);
    // The field shows (with that message) because the posted pressing stroke asks for it.
    expect(fieldApplies("pressSpeedMmS", { pressStrokeMm: "30" })).toBe(true);
    expect(fieldApplies("pressSpeedMmS", { pressStrokeMm: "0" })).toBe(false);
    expect(fieldApplies("pressSpeedMmS", {})).toBe(false);
    expect((await Spec.findByPk(id, { rejectOnEmpty: true })).answers["axis01-motion"]).toEqual({});

    const tooFast = await stepPost(visitor, id, "axis01-motion", { ...ANSWERS["axis01-motion"], pressStrokeMm: "30", pressSpeedMmS: "120" });
    expect(tooFast.data.result.error.pressSpeedMmS.join(" ")).toMatch(/no more than the extend/);

    // Without a pressing stroke a leftover pressing speed is neither judged nor kept.
    expect((await stepPost(visitor, id, "axis01-motion", { ...ANSWERS["axis01-motion"], pressStrokeMm: "0", pressSpeedMmS: "fast" })).status).toBe(302);
    expect((await Spec.findByPk(id, { rejectOnEmpty: true })).answers["axis01-motion"].pressSpeedMmS).toBe("");
  });

  it("asks every question the engine takes on exactly one step", () => {
    const asked = FORM_STEPS.flatMap((s) => ENGINE_KEYS_BY_STEP[s]);
    expect([...asked].sort()).toEqual(Object.keys(REQUIREMENT_FIELDS).sort());
    expect(new Set(asked).size).toBe(asked.length);
  });

  it("reads choices back by the form's labels and numbers with their units", () => {
    expect(answerInWords("mounting", "fixed-fixed", "metric")).toBe("Flange, rod end fixed and guided");
    expect(answerInWords("supplyHz", "60", "us")).toBe("60 Hz");
    expect(answerInWords("accelTimeS", "0.2", "metric")).toBe("0.2 s");
    expect(answerInWords("strokeMm", "19.69", "us")).toBe("19.69 in");
    expect(answerInWords("pumpType", "", "metric")).toBe("Let the sizing choose");
    expect(answerInWords("decelTimeS", undefined, "metric")).toBe("Same as the time to reach speed");
    expect(answerInWords("massKg", "", "metric")).toBeNull();
  });
});
