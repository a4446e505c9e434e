// Test data made through the app's own services, so tests exercise the real rules.
import { randomBytes } from "node:crypto";
import { Bid, Organisation, SpecRevision, User, sequelize, type Spec } from "~/models/index.server";
import { MACHINE_DUTY_FIELDS, type MachineDesign } from "~/hydraulics";
import { hashPassword, signUp } from "~/services/accounts.server";
import type { Role } from "~/auth/roles";

export const PASSWORD = "correct-horse-battery";

export const uniqueEmail = (label = "user") => `${label}-${randomBytes(4).toString("hex")}@example.test`;

/**
 * A new organisation and its first user, signed up through the app. A shop signed up waits for
 * an admin's approval; here it is approved at once unless the test asks for `pending: true`.
 */
export async function makeMember(kind: "buyer" | "shop", overrides: Partial<{ email: string; organisationName: string; pending: boolean }> = {}) {
  const user = await signUp({
    kind,
    organisationName: overrides.organisationName ?? `${kind === "buyer" ? "Builder" : "Shop"} ${randomBytes(3).toString("hex")}`,
    name: `Test ${kind}`,
    email: overrides.email ?? uniqueEmail(kind),
    password: PASSWORD,
  });
  if (kind === "shop" && !overrides.pending) {
    await Organisation.update({ approval: "approved", approvalDecidedAt: new Date() }, { where: { id: user.organisationId } });
  }
  return user;
}

/** Operator staff can't sign up; the seed or an admin makes them. */
export async function makeOperatorUser(role: Extract<Role, "admin" | "account_manager">) {
  const organisation = await Organisation.create({
    name: `Operator ${randomBytes(3).toString("hex")}`,
    kind: "operator",
    region: null,
    accountManagerId: null,
  });
  return User.create({
    organisationId: organisation.id,
    email: uniqueEmail(role),
    name: `Test ${role}`,
    passwordHash: await hashPassword(PASSWORD),
    role,
    lastSignInAt: null,
  });
}

export const inDays = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

/** Answers of a complete spec (a vertical press ram), per step, as a buyer would type them. */
export const SPEC_ANSWERS = {
  machine: { title: "Bending press, main ram", purpose: "Presses sheet over a die.", orientation: "vertical", rodDirection: "down", mounting: "pinned-pinned" },
  motion: {
    massKg: "800",
    processForceN: "50000",
    frictionCoefficient: "0.1",
    strokeMm: "500",
    extendSpeedMmS: "100",
    retractSpeedMmS: "150",
    accelTimeS: "0.2",
  },
  duty: {
    cyclesPerHour: "60",
    hoursPerDay: "16",
    ambientC: "25",
    supplyHz: "50",
    maxPressureBar: "160",
    supplyVoltage: "400 V three-phase",
    fluid: "ISO VG 46",
  },
  quotation: {
    unitsWanted: "2",
    bidDeadline: inDays(21),
    dateNeeded: inDays(90),
    deliveryRegion: "UK — West Midlands",
    currency: "GBP",
    retainerPercent: "20",
    notes: "",
  },
};

type SpecOverrides = Partial<{ [K in keyof typeof SPEC_ANSWERS]: Partial<(typeof SPEC_ANSWERS)[K]> }>;

/** A draft with every step answered and saved through the app's own services, ready to publish. */
export async function makeCompleteDraft(buyer: User, overrides: SpecOverrides = {}) {
  const { createDraft, saveStep } = await import("~/services/specs.server");
  const draft = await createDraft(buyer);
  for (const step of Object.keys(SPEC_ANSWERS) as (keyof typeof SPEC_ANSWERS)[]) {
    await saveStep(buyer, draft.id, { step, answers: { ...SPEC_ANSWERS[step], ...overrides[step] } as Record<string, string>, complete: true });
  }
  return draft;
}

/** A spec published through the app's own services (revision 1, open for bids). */
export async function makePublishedSpec(buyer: User, overrides: SpecOverrides = {}) {
  const { publish } = await import("~/services/specs.server");
  const draft = await makeCompleteDraft(buyer, overrides);
  return publish(buyer, draft.id, { cautionsRead: true });
}

/**
 * A published spec whose revision 1 is a machine of several axes (`sizeMachine`'s design), as
 * publishing a machine stores it: `spec_revisions.machine` the MachineDesign, `axes` one entry per
 * axis, the answers in the draft's machine layout (content/spec-draft.ts). Published through the
 * real services first, so deadlines, mail and status are the app's own.
 */
export async function makePublishedMachineSpec(buyer: User, machine: MachineDesign, overrides: SpecOverrides = {}) {
  const spec = await makePublishedSpec(buyer, overrides);
  const ids = machine.axes.map((_, i) => `ax${String(i + 1).padStart(4, "0")}`);
  const typed = (v: unknown) => (v === undefined || v === null ? "" : String(v));
  const answers: Record<string, Record<string, string>> = {
    ...spec.answers,
    machine: { ...spec.answers.machine, axes: ids.join(" "), ...Object.fromEntries(machine.axes.map((a, i) => [`name-${ids[i]}`, a.name])) },
    duty: { ...spec.answers.duty, ...Object.fromEntries(MACHINE_DUTY_FIELDS.map((k) => [k, typed(machine.requirements[k])])) },
  };
  machine.axes.forEach((a, i) => {
    const r = a.requirements as unknown as Record<string, unknown>;
    answers[`${ids[i]}-mounting`] = Object.fromEntries(["orientation", "inclineDeg", "rodDirection", "mounting", "mountingStyle"].map((k) => [k, typed(r[k])]));
    answers[`${ids[i]}-motion`] = Object.fromEntries(
      ["massKg", "processForceN", "frictionCoefficient", "strokeMm", "extendSpeedMmS", "retractSpeedMmS", "pressStrokeMm", "pressSpeedMmS", "accelTimeS"].map(
        (k) => [k, typed(r[k])],
      ),
    );
  });
  await SpecRevision.update(
    { machine, axes: machine.axes.map((a) => ({ name: a.name, requirements: a.requirements, design: a })), answers, unitSystem: "metric" },
    { where: { specId: spec.id, number: 1 } },
  );
  await spec.update({ answers, reliefSettingBar: machine.pressuresBar.reliefSetting, pumpFlowLpm: machine.flowsLpm.pump });
  return spec;
}

/** A submitted one-line offer of `shop` on `spec` (written directly: tests of what follows a bid). */
export async function makeSubmittedBid(spec: Spec, shop: User, options: { totalCents?: number; leadTimeWeeks?: number | null } = {}) {
  const totalCents = options.totalCents ?? 1_234_567;
  return Bid.create({
    specId: spec.id,
    organisationId: shop.organisationId,
    createdById: shop.id,
    status: "submitted",
    specRevision: 1,
    currency: spec.currency,
    lines: [
      {
        key: "power-unit",
        item: "Power unit",
        quantity: 1,
        specification: "7.5 kW, 40 l tank",
        unitPriceCents: totalCents,
        alternative: false,
        alternativeDescription: "",
      },
    ],
    units: 1,
    setTotalCents: totalCents,
    totalCents,
    leadTimeWeeks: options.leadTimeWeeks === undefined ? 12 : options.leadTimeWeeks,
    validUntil: inDays(30),
    offerTerms: { incoterm: "EXW", place: "Works", retainerPercent: null, onDeliveryPercent: null, balanceDays: 30, warrantyMonths: 12 },
    notes: "",
    submittedAt: new Date(),
  });
}

let jobSerial = 0;
/** A published spec of `buyer`, a submitted one-line bid of `shop` on it, and the job its award opens. */
export async function makeJob(buyer: User, shop: User, options: { totalCents?: number; leadTimeWeeks?: number | null; title?: string } = {}) {
  const { openJob } = await import("~/services/job-opening.server");
  const spec = await makePublishedSpec(buyer, { machine: { title: options.title ?? `Scissor lift table ${++jobSerial}` } });
  const bid = await makeSubmittedBid(spec, shop, options);
  const job = await sequelize.transaction((transaction) => openJob(transaction, { spec, bid, awardedBy: buyer }));
  return { spec: spec as Spec, bid, job };
}
