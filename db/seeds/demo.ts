// Demo data of Tenderflow's own invented scenario: two machine builders, three fluid-power shops
// and the portal's operator. Every name, company and address here is made up (.test domains).
import { randomBytes } from "node:crypto";
import bcrypt from "bcryptjs";
import { QueryTypes, type Sequelize, type Transaction } from "sequelize";
import { ENGINE_VERSION, sizeCircuit, sizeMachine } from "~/hydraulics";
import { toRequirementsInput } from "~/content/requirement-fields";
import { machineInput } from "~/content/machine-input";
import { readDraft } from "~/content/spec-draft";
import { headlineFigures } from "~/services/published-design";
import { MILESTONES, TARGET_SHARES, type MilestoneKey } from "~/content/job-milestones";
import { retainerCents } from "~/content/money";
import { offerTotals } from "~/content/offer-terms";
import { demoAlternativeCircuit, demoOfferParts } from "./demo-offers";
import { buildOrderDocument, orderNumber } from "~/content/order-document";
import { offerSummary, type OfferSummary } from "~/services/offer-summary";
import { targetDates } from "~/services/job-schedule";
import type { OrganisationProfile } from "~/components/organisation-profile";

export const DEMO_PASSWORD = "tenderflow-demo";

interface DemoOrganisation {
  name: string;
  kind: "buyer" | "shop" | "operator";
  region: string;
  users: { name: string; email: string; role: "buyer" | "shop" | "account_manager" | "admin" }[];
  managedBy?: string;
  /** A shop that signed up lately and waits for an admin (the demo's "waiting for approval"). */
  pending?: boolean;
  /** A machine builder that signed up lately and has no account manager yet (the demo's "unassigned"). */
  recent?: boolean;
  /** The company profile (settings): address, tax number, who answers about quotes. */
  profile?: { address: string; taxNumber: string; contact: [name: string, email: string, phone: string] };
}

export const DEMO_ORGANISATIONS: DemoOrganisation[] = [
  {
    name: "Tenderflow Operations",
    kind: "operator",
    region: "United Kingdom",
    users: [
      { name: "Felix Ortmann", email: "felix@tenderflow.test", role: "admin" },
      { name: "Nadia Brennan", email: "nadia@tenderflow.test", role: "account_manager" },
    ],
  },
  {
    name: "Kestrel Forming Machines",
    kind: "buyer",
    region: "UK — West Midlands",
    managedBy: "nadia@tenderflow.test",
    profile: {
      address: "Unit 7, Forge Lane Trading Estate\nCradley Heath B64 6AA",
      taxNumber: "GB 204 7731 56",
      contact: ["Priya Raman", "buying@kestrel-forming.test", "+44 1384 496 021"],
    },
    users: [
      { name: "Priya Raman", email: "priya@kestrel-forming.test", role: "buyer" },
      { name: "Owen Talbot", email: "owen@kestrel-forming.test", role: "buyer" },
    ],
  },
  {
    name: "Marlow Deck Systems",
    kind: "buyer",
    region: "UK — South East",
    managedBy: "nadia@tenderflow.test",
    users: [{ name: "Tom Hadley", email: "tom@marlow-decks.test", role: "buyer" }],
  },
  {
    name: "Ironbridge Fluid Power",
    kind: "shop",
    region: "UK — West Midlands",
    profile: {
      address: "3 Severn Wharf\nIronbridge TF8 7JP",
      taxNumber: "GB 318 5520 04",
      contact: ["Aled Morgan", "quotes@ironbridge-fluid.test", "+44 1952 496 310"],
    },
    users: [{ name: "Aled Morgan", email: "aled@ironbridge-fluid.test", role: "shop" }],
  },
  {
    name: "Northgate Hydraulics",
    kind: "shop",
    region: "UK — North West",
    profile: {
      address: "Northgate Works, Dee Road\nChester CH1 4AB",
      taxNumber: "GB 552 0194 77",
      contact: ["Sofia Lindqvist", "sales@northgate-hyd.test", "+44 1244 496 118"],
    },
    users: [{ name: "Sofia Lindqvist", email: "sofia@northgate-hyd.test", role: "shop" }],
  },
  {
    name: "Coldharbour Power Units",
    kind: "shop",
    region: "UK — South East",
    users: [{ name: "Ben Achebe", email: "ben@coldharbour-pu.test", role: "shop" }],
  },
  {
    name: "Penhallow Packaging Lines",
    kind: "buyer",
    region: "UK — South West",
    recent: true,
    users: [{ name: "Morwenna Hicks", email: "morwenna@penhallow-pack.test", role: "buyer" }],
  },
  {
    name: "Saltmarsh Hydraulic Works",
    kind: "shop",
    region: "UK — East Anglia",
    pending: true,
    users: [{ name: "Greta Pohl", email: "greta@saltmarsh-hw.test", role: "shop" }],
  },
];

const inDays = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
const daysAgo = (days: number) => new Date(Date.now() - days * 86_400_000);

type DemoStatus = "draft" | "open" | "awarded";
interface DemoSpec {
  organisation: string;
  author: string;
  status: DemoStatus;
  /** Days since publication (published specs). */
  publishedDaysAgo?: number;
  answers: Record<string, Record<string, string>>;
}

/** The scenario's specs: a press and a two-axis hemming cell open for bids, two awarded jobs and a tilting deck in draft. */
function demoSpecs(): DemoSpec[] {
  const specs: DemoSpec[] = [
    {
      organisation: "Kestrel Forming Machines",
      author: "priya@kestrel-forming.test",
      status: "open",
      publishedDaysAgo: 3,
      answers: {
        machine: {
          title: "Panel press, main ram",
          purpose: "Forms steel door panels over a die; the ram comes down onto the blank.",
          orientation: "vertical",
          rodDirection: "down",
          mounting: "pinned-pinned",
        },
        motion: {
          massKg: "650",
          processForceN: "60000",
          frictionCoefficient: "0.1",
          strokeMm: "350",
          extendSpeedMmS: "80",
          retractSpeedMmS: "120",
          accelTimeS: "0.2",
        },
        duty: {
          cyclesPerHour: "90",
          hoursPerDay: "16",
          ambientC: "28",
          supplyHz: "50",
          maxPressureBar: "160",
          supplyVoltage: "400 V three-phase",
          fluid: "ISO VG 46",
        },
        quotation: {
          unitsWanted: "2",
          bidDeadline: inDays(18),
          dateNeeded: inDays(75),
          deliveryRegion: "UK — West Midlands",
          currency: "GBP",
          retainerPercent: "20",
          notes: "Power unit beside the press frame; blue RAL 5010 paint.",
        },
      },
    },
    {
      // A machine of two axes on one power unit, stored as the spec form stores it (per axis).
      organisation: "Kestrel Forming Machines",
      author: "priya@kestrel-forming.test",
      status: "open",
      publishedDaysAgo: 2,
      answers: {
        machine: {
          title: "Hemming cell, clamp and hemming ram",
          purpose: "Holds a door skin on the anvil with a clamp, then the hemming ram folds its edge; the clamp lets go after the ram is back.",
          axes: "clamp1 hemram",
          "name-clamp1": "Clamp",
          "name-hemram": "Hemming ram",
        },
        "clamp1-mounting": { orientation: "vertical", rodDirection: "down", mounting: "fixed-pinned" },
        "clamp1-motion": {
          massKg: "40",
          processForceN: "15000",
          strokeMm: "60",
          extendSpeedMmS: "50",
          retractSpeedMmS: "80",
          accelTimeS: "0.2",
          holdMinutes: "0",
        },
        "hemram-mounting": { orientation: "vertical", rodDirection: "down", mounting: "pinned-pinned" },
        "hemram-motion": {
          massKg: "300",
          processForceN: "45000",
          strokeMm: "250",
          extendSpeedMmS: "90",
          retractSpeedMmS: "140",
          accelTimeS: "0.2",
          holdMinutes: "0",
        },
        // Clamp, hem, ram back, unclamp.
        cycle: { "extend-clamp1": "1", "extend-hemram": "2", "retract-hemram": "3", "retract-clamp1": "4" },
        duty: {
          cyclesPerHour: "120",
          hoursPerDay: "16",
          ambientC: "26",
          supplyHz: "50",
          maxPressureBar: "160",
          supplyVoltage: "400 V three-phase",
          fluid: "ISO VG 46",
        },
        quotation: {
          unitsWanted: "1",
          bidDeadline: inDays(20),
          dateNeeded: inDays(80),
          deliveryRegion: "UK — West Midlands",
          currency: "GBP",
          retainerPercent: "15",
          notes: "One power unit for both cylinders, on the floor behind the cell.",
        },
      },
    },
    {
      organisation: "Kestrel Forming Machines",
      author: "owen@kestrel-forming.test",
      status: "awarded",
      publishedDaysAgo: 30,
      answers: {
        machine: {
          title: "Coil clamp, hold-down cylinder",
          purpose: "Holds a steel coil on the decoiler mandrel while the band is cut.",
          orientation: "vertical",
          rodDirection: "down",
          mounting: "fixed-pinned",
        },
        motion: {
          massKg: "60",
          processForceN: "18000",
          frictionCoefficient: "0.1",
          strokeMm: "150",
          extendSpeedMmS: "60",
          retractSpeedMmS: "90",
          accelTimeS: "0.15",
        },
        duty: {
          cyclesPerHour: "30",
          hoursPerDay: "16",
          ambientC: "25",
          supplyHz: "50",
          maxPressureBar: "160",
          supplyVoltage: "400 V three-phase",
          fluid: "ISO VG 46",
        },
        quotation: {
          unitsWanted: "1",
          bidDeadline: inDays(-6),
          dateNeeded: inDays(60),
          deliveryRegion: "UK — West Midlands",
          currency: "GBP",
          retainerPercent: "25",
          notes: "",
        },
      },
    },
    {
      organisation: "Marlow Deck Systems",
      author: "tom@marlow-decks.test",
      status: "awarded",
      publishedDaysAgo: 100,
      answers: {
        machine: {
          title: "Scissor lift table, main cylinder",
          purpose: "Raises a loading table with pallets to the mezzanine floor.",
          orientation: "vertical",
          rodDirection: "up",
          mounting: "pinned-pinned",
        },
        motion: {
          massKg: "1800",
          processForceN: "0",
          frictionCoefficient: "0.05",
          strokeMm: "800",
          extendSpeedMmS: "50",
          retractSpeedMmS: "60",
          accelTimeS: "0.3",
        },
        duty: {
          cyclesPerHour: "20",
          hoursPerDay: "10",
          ambientC: "20",
          supplyHz: "50",
          maxPressureBar: "160",
          supplyVoltage: "400 V three-phase",
          fluid: "ISO VG 32",
        },
        quotation: {
          unitsWanted: "3",
          bidDeadline: inDays(-75),
          dateNeeded: inDays(10),
          deliveryRegion: "UK — South East",
          currency: "GBP",
          retainerPercent: "15",
          notes: "Indoor warehouse; low noise wanted.",
        },
      },
    },
    {
      organisation: "Marlow Deck Systems",
      author: "tom@marlow-decks.test",
      status: "draft",
      answers: {
        machine: {
          title: "Tilting deck, lift cylinder",
          purpose: "Tilts a vehicle deck up to 35° for unloading.",
          orientation: "inclined",
          inclineDeg: "35",
          rodDirection: "up",
          mounting: "pinned-pinned",
        },
        motion: {
          massKg: "4200",
          processForceN: "0",
          frictionCoefficient: "0.05",
          strokeMm: "900",
          extendSpeedMmS: "40",
          retractSpeedMmS: "50",
          accelTimeS: "0.3",
        },
      },
    },
  ];
  // After the award: a dock leveller handed over and waiting for Tom's acceptance, and a tail lift
  // accepted, its balance paid by bank transfer. Same duty as the lift table, their own titles.
  const lift = specs.find((x) => x.answers.machine.title.startsWith("Scissor"))!;
  const after = (title: string, publishedDaysAgo: number): DemoSpec => ({
    ...lift,
    publishedDaysAgo,
    answers: {
      ...lift.answers,
      machine: { ...lift.answers.machine, title },
      quotation: { ...lift.answers.quotation, bidDeadline: inDays(-publishedDaysAgo + 25) },
    },
  });
  specs.push(after("Dock leveller, lift cylinder", 130), after("Tail lift, platform cylinder", 170));
  return specs;
}

/** Demo offers: per spec title, each shop's price level (a factor on a list price per line). */
const DEMO_BIDS: Record<
  string,
  {
    shop: string;
    author: string;
    factor: number;
    status: "draft" | "submitted" | "won" | "not_selected";
    leadTimeWeeks: number;
    revised?: boolean;
    alternativeOn?: string;
  }[]
> = {
  "Panel press, main ram": [
    { shop: "Ironbridge Fluid Power", author: "aled@ironbridge-fluid.test", factor: 1.0, status: "submitted", leadTimeWeeks: 12 },
    {
      shop: "Northgate Hydraulics",
      author: "sofia@northgate-hyd.test",
      factor: 0.93,
      status: "submitted",
      leadTimeWeeks: 14,
      revised: true,
      alternativeOn: "pump",
    },
    { shop: "Coldharbour Power Units", author: "ben@coldharbour-pu.test", factor: 0.9, status: "draft", leadTimeWeeks: 10 },
  ],
  "Hemming cell, clamp and hemming ram": [
    { shop: "Northgate Hydraulics", author: "sofia@northgate-hyd.test", factor: 0.96, status: "submitted", leadTimeWeeks: 13 },
    { shop: "Ironbridge Fluid Power", author: "aled@ironbridge-fluid.test", factor: 1.04, status: "submitted", leadTimeWeeks: 11 },
  ],
  "Coil clamp, hold-down cylinder": [
    { shop: "Coldharbour Power Units", author: "ben@coldharbour-pu.test", factor: 0.95, status: "won", leadTimeWeeks: 8 },
    { shop: "Ironbridge Fluid Power", author: "aled@ironbridge-fluid.test", factor: 1.05, status: "not_selected", leadTimeWeeks: 9 },
  ],
  "Dock leveller, lift cylinder": [{ shop: "Northgate Hydraulics", author: "sofia@northgate-hyd.test", factor: 0.99, status: "won", leadTimeWeeks: 10 }],
  "Tail lift, platform cylinder": [{ shop: "Ironbridge Fluid Power", author: "aled@ironbridge-fluid.test", factor: 1.01, status: "won", leadTimeWeeks: 12 }],
  "Scissor lift table, main cylinder": [
    { shop: "Ironbridge Fluid Power", author: "aled@ironbridge-fluid.test", factor: 0.97, status: "won", leadTimeWeeks: 10 },
    { shop: "Northgate Hydraulics", author: "sofia@northgate-hyd.test", factor: 1.02, status: "not_selected", leadTimeWeeks: 11 },
  ],
};

/** An invented list price per bill-of-materials line (pounds), for the demo's offers only. */
function demoListPrice(key: string): number {
  const known: Record<string, number> = {
    cylinder: 1850,
    pump: 640,
    motor: 720,
    "coupling-bellhousing": 180,
    "relief-valve": 210,
    "relief-vent-valve": 160,
    "directional-valve": 480,
    "counterbalance-valve": 290,
    reservoir: 560,
    "return-filter": 140,
    "suction-strainer": 45,
    gauge: 38,
    "fluid-fill": 320,
    "hose-pressure": 85,
    "hose-return": 70,
    "hose-cap": 95,
    "hose-rod": 95,
    "hose-suction": 60,
    cooler: 690,
  };
  return known[key.split(":")[0]] ?? 120;
}

/**
 * What a published demo spec freezes, as publishing does: one axis sized alone (machine null),
 * or a machine of the form's per-axis answers sized over its cycle.
 */
function demoDesign(answers: Record<string, Record<string, string>>, flat: Record<string, string>) {
  if (!answers.machine?.axes) {
    const design = sizeCircuit(toRequirementsInput(flat, "metric"));
    return {
      axes: [{ name: "Axis 1", requirements: design.requirements, design }],
      machine: null,
      bill: design.bom,
      figures: headlineFigures({ kind: "axis", design }),
    };
  }
  const machine = sizeMachine(machineInput(readDraft(answers).draft, "metric"));
  return {
    axes: machine.axes.map((axis) => ({ name: axis.name, requirements: axis.requirements, design: axis })),
    machine,
    bill: machine.bom,
    figures: headlineFigures({ kind: "machine", design: machine }),
  };
}

async function insert<T extends object>(sequelize: Sequelize, transaction: Transaction, sql: string, replacements: Record<string, unknown>): Promise<T> {
  // INSERT … RETURNING read as a SELECT gives the new rows.
  const [row] = await sequelize.query<T>(sql, { replacements, transaction, type: QueryTypes.SELECT });
  if (!row) throw new Error(`Nothing inserted: ${sql.slice(0, 40)}`);
  return row;
}

async function seedSpecs(sequelize: Sequelize, transaction: Transaction, userIds: Map<string, string>, orgIds: Map<string, string>) {
  for (const spec of demoSpecs()) {
    const flat = Object.assign({}, ...Object.values(spec.answers)) as Record<string, string>;
    const published = spec.status !== "draft";
    const design = published ? demoDesign(spec.answers, flat) : null;
    const publishedAt = published ? daysAgo(spec.publishedDaysAgo ?? 1) : null;
    const row = await insert<{ id: string }>(
      sequelize,
      transaction,
      `INSERT INTO specs (organisation_id, created_by_id, title, status, answers, unit_system, completed_steps, current_revision,
         bid_deadline, retainer_percent, delivery_region, published_at, currency, units_wanted, relief_setting_bar, pump_flow_lpm)
       VALUES (:org, :author, :title, :status, :answers, 'metric', :steps, :revision, :deadline, :retainer, :region, :publishedAt,
         :currency, :units, :relief, :flow) RETURNING id`,
      {
        org: orgIds.get(spec.organisation),
        author: userIds.get(spec.author),
        title: flat.title,
        status: spec.status,
        answers: JSON.stringify(spec.answers),
        steps: `{${Object.keys(spec.answers).join(",")}}`,
        revision: published ? 1 : 0,
        deadline: flat.bidDeadline ? `${flat.bidDeadline}T23:59:59Z` : null,
        retainer: flat.retainerPercent ?? null,
        region: flat.deliveryRegion ?? null,
        publishedAt,
        currency: flat.currency ?? "EUR",
        units: flat.unitsWanted ? Number(flat.unitsWanted) : null,
        relief: design?.figures.reliefSettingBar ?? null,
        flow: design?.figures.pumpFlowLpm ?? null,
      },
    );
    if (!design) continue;
    await sequelize.query(
      `INSERT INTO spec_revisions (spec_id, number, axes, machine, answers, unit_system, engine_version, created_by_id, created_at)
       VALUES (:spec, 1, :axes, :machine, :answers, 'metric', :version, :author, :publishedAt)`,
      {
        replacements: {
          spec: row.id,
          axes: JSON.stringify(design.axes),
          machine: design.machine ? JSON.stringify(design.machine) : null,
          answers: JSON.stringify(spec.answers),
          version: ENGINE_VERSION,
          author: userIds.get(spec.author),
          publishedAt,
        },
        transaction,
      },
    );
    const units = Number(flat.unitsWanted ?? 1);
    for (const offer of DEMO_BIDS[flat.title] ?? []) {
      const lines = design.bill.map((l) => ({
        key: l.key,
        item: l.item,
        quantity: l.quantity,
        specification: l.specification,
        unitPriceCents: Math.round(demoListPrice(l.key) * offer.factor) * 100,
        alternative: l.key === offer.alternativeOn,
        alternativeDescription: l.key === offer.alternativeOn ? "Internal gear pump of the same displacement, quieter at 1500 rpm" : "",
      }));
      const parts = demoOfferParts(offer.shop, offer.factor);
      const alternativeCircuit = offer.alternativeOn && flat.title === "Panel press, main ram" ? demoAlternativeCircuit(units) : null;
      const totals = offerTotals(lines, units, parts.extras, parts.ownLines);
      const offered = offer.status !== "draft";
      const version = offered ? (offer.revised ? 2 : 1) : 0;
      const submittedAt = offered ? daysAgo(Math.max(1, (spec.publishedDaysAgo ?? 2) - 2)) : null;
      const bid = await insert<{ id: string }>(
        sequelize,
        transaction,
        `INSERT INTO bids (spec_id, organisation_id, created_by_id, status, spec_revision, version, currency, lines, units, set_total_cents,
           total_cents, lead_time_weeks, valid_until, extras, own_lines, offer_terms, alternative_circuit, notes, submitted_at)
         VALUES (:spec, :org, :author, :status, 1, :version, :currency, :lines, :units, :set, :total, :lead, :valid, :extras, :ownLines, :offerTerms,
           :alternativeCircuit, :notes, :submittedAt) RETURNING id`,
        {
          spec: row.id,
          org: orgIds.get(offer.shop),
          author: userIds.get(offer.author),
          status: offer.status,
          version,
          currency: flat.currency,
          lines: JSON.stringify(lines),
          units,
          set: totals.setTotalCents,
          total: totals.totalCents,
          lead: offer.leadTimeWeeks,
          valid: inDays(45),
          extras: JSON.stringify(parts.extras),
          ownLines: JSON.stringify(parts.ownLines),
          offerTerms: parts.offerTerms && JSON.stringify(parts.offerTerms),
          alternativeCircuit: alternativeCircuit && JSON.stringify(alternativeCircuit),
          notes: offer.alternativeOn ? "We offer a quieter pump; the catalogue part is available at the same price on request." : "",
          submittedAt,
        },
      );
      for (let v = 1; v <= version; v++) {
        const offerRecord = {
          lines,
          units,
          setTotalCents: totals.setTotalCents,
          totalCents: totals.totalCents,
          currency: flat.currency,
          leadTimeWeeks: offer.leadTimeWeeks,
          validUntil: inDays(45),
          ...parts,
          alternativeCircuit,
          notes: "",
        };
        if (v < version) offerRecord.leadTimeWeeks += 2;
        await sequelize.query(
          `INSERT INTO bid_versions (bid_id, version, event, spec_revision, offer, created_by_id, created_at) VALUES (:bid, :v, 'submitted', 1, :offer, :author, :at)`,
          { replacements: { bid: bid.id, v, offer: JSON.stringify(offerRecord), author: userIds.get(offer.author), at: submittedAt }, transaction },
        );
      }
      if (offer.status === "won")
        await seedJob(sequelize, transaction, {
          specId: row.id,
          bidId: bid.id,
          spec,
          offer,
          totalCents: totals.totalCents,
          userIds,
          orgIds,
          flat,
          summary: offerSummary(
            { lines, units, currency: flat.currency, leadTimeWeeks: offer.leadTimeWeeks, validUntil: inDays(45), notes: "", ...parts },
            flat.retainerPercent ?? null,
          ),
        });
    }
    if (flat.title === "Panel press, main ram") await seedQuestions(sequelize, transaction, row.id, userIds, orgIds);
  }
}

async function seedQuestions(sequelize: Sequelize, transaction: Transaction, specId: string, userIds: Map<string, string>, orgIds: Map<string, string>) {
  const questions = [
    {
      shop: "Ironbridge Fluid Power",
      by: "aled@ironbridge-fluid.test",
      body: "Can the counterbalance valve be flanged straight onto the cylinder's rod port, or is there only room for a line-mounted valve?",
      answer: "Flanged on the port, please: there is 120 mm of clearance beside the cylinder, on the operator's side.",
    },
    {
      shop: "Northgate Hydraulics",
      by: "sofia@northgate-hyd.test",
      body: "Is a water-glycol fluid required for fire safety at this site, or is mineral oil acceptable?",
      answer: null,
    },
  ];
  for (const q of questions) {
    await sequelize.query(
      `INSERT INTO spec_questions (spec_id, organisation_id, asked_by_id, body, answer, answered_by_id, answered_at, created_at, updated_at)
       VALUES (:spec, :org, :by, :body, :answer, :answeredBy, :answeredAt, :askedAt, :askedAt)`,
      {
        replacements: {
          spec: specId,
          org: orgIds.get(q.shop),
          by: userIds.get(q.by),
          body: q.body,
          answer: q.answer,
          answeredBy: q.answer ? userIds.get("priya@kestrel-forming.test") : null,
          answeredAt: q.answer ? daysAgo(1) : null,
          askedAt: daysAgo(2),
        },
        transaction,
      },
    );
  }
}

/** An awarded job with its milestones: the lift table is under way and late; the clamp awaits its retainer. */
async function seedJob(
  sequelize: Sequelize,
  transaction: Transaction,
  a: {
    specId: string;
    bidId: string;
    spec: DemoSpec;
    offer: { shop: string; author: string; leadTimeWeeks: number };
    totalCents: number;
    userIds: Map<string, string>;
    orgIds: Map<string, string>;
    flat: Record<string, string>;
    summary: OfferSummary;
  },
) {
  const awardedDaysAgo = (a.spec.publishedDaysAgo ?? 1) - 26;
  const awardedAt = daysAgo(awardedDaysAgo);
  // The lift table is under way; the dock leveller and the tail lift are handed over (the tail lift accepted, its balance paid).
  const handedOver = a.flat.title.startsWith("Dock") || a.flat.title.startsWith("Tail");
  const closed = a.flat.title.startsWith("Tail");
  const underway = a.flat.title.startsWith("Scissor") || handedOver;
  // Demo progress: the lift table has its retainer, drawings and build done; its test is overdue.
  const reached: MilestoneKey[] = handedOver ? MILESTONES.map((m) => m.key) : underway ? ["retainer_received", "drawings_agreed", "in_build"] : [];
  const buyerAuthor = a.userIds.get(a.spec.author)!;
  const shopAuthor = a.userIds.get(a.offer.author)!;
  const job = await insert<{ id: string }>(
    sequelize,
    transaction,
    `INSERT INTO jobs (spec_id, bid_id, buyer_organisation_id, shop_organisation_id, awarded_by_id, awarded_at, currency, total_cents,
       retainer_percent, retainer_cents, retainer_paid_at, stage)
     VALUES (:spec, :bid, :buyer, :shop, :by, :at, :currency, :total, :percent, :retainer, :paidAt, :stage) RETURNING id`,
    {
      spec: a.specId,
      bid: a.bidId,
      buyer: a.orgIds.get(a.spec.organisation),
      shop: a.orgIds.get(a.offer.shop),
      by: buyerAuthor,
      at: awardedAt,
      currency: a.flat.currency,
      total: a.totalCents,
      percent: a.flat.retainerPercent,
      retainer: retainerCents(a.totalCents, a.flat.retainerPercent),
      paidAt: underway ? daysAgo(awardedDaysAgo - 2) : null,
      stage: reached.at(-1) ?? null,
    },
  );
  const awarded = {
    bidId: a.bidId,
    totalCents: a.totalCents,
    currency: a.flat.currency,
    retainerPercent: a.flat.retainerPercent,
    retainerCents: retainerCents(a.totalCents, a.flat.retainerPercent),
    leadTimeWeeks: a.offer.leadTimeWeeks,
  };
  await sequelize.query(`INSERT INTO job_events (job_id, user_id, kind, detail, created_at) VALUES (:job, :by, 'awarded', :detail, :at)`, {
    replacements: { job: job.id, by: buyerAuthor, detail: JSON.stringify(awarded), at: awardedAt },
    transaction,
  });
  await seedOrderConfirmation(sequelize, transaction, { ...a, jobId: job.id, awardedAt, awardedBy: a.spec.author });
  if (underway) {
    // Paid by card in the scenario's past; `npm start` puts this payment back into the Stripe fake.
    const paidAt = daysAgo(awardedDaysAgo - 2);
    const amount = retainerCents(a.totalCents, a.flat.retainerPercent);
    const payment = await insert<{ id: string }>(
      sequelize,
      transaction,
      `INSERT INTO payments (job_id, buyer_organisation_id, created_by_id, status, amount_cents, currency, checkout_session_id, payment_intent_id, paid_at, created_at)
       VALUES (:job, :buyer, :by, 'paid', :amount, :currency, :session, :intent, :paidAt, :paidAt) RETURNING id`,
      {
        job: job.id,
        buyer: a.orgIds.get(a.spec.organisation),
        by: buyerAuthor,
        amount,
        currency: a.flat.currency,
        session: `cs_test_demo${randomBytes(10).toString("hex")}`,
        intent: `pi_demo${randomBytes(10).toString("hex")}`,
        paidAt,
      },
    );
    await sequelize.query(
      `INSERT INTO job_events (job_id, user_id, kind, milestone, detail, created_at) VALUES (:job, :by, 'retainer_paid', 'retainer_received', :detail, :at)`,
      {
        replacements: {
          job: job.id,
          by: buyerAuthor,
          detail: JSON.stringify({ paymentId: payment.id, amountCents: amount, currency: a.flat.currency }),
          at: paidAt,
        },
        transaction,
      },
    );
  }
  const leadDays = a.offer.leadTimeWeeks * 7;
  for (const [position, m] of MILESTONES.entries()) {
    const rule = TARGET_SHARES[m.key];
    const target = new Date(awardedAt.getTime() + (Math.round(leadDays * rule.share) + rule.plusDays) * 86_400_000).toISOString().slice(0, 10);
    const done = reached.includes(m.key);
    const reachedAt = done ? new Date(Math.min(Date.now() - 86_400_000, new Date(`${target}T12:00:00Z`).getTime())) : null;
    const by = m.key === "retainer_received" ? buyerAuthor : shopAuthor;
    await sequelize.query(
      `INSERT INTO job_milestones (job_id, key, position, target_date, reached_at, reached_by_id) VALUES (:job, :key, :position, :target, :reachedAt, :by)`,
      { replacements: { job: job.id, key: m.key, position, target, reachedAt, by: done ? by : null }, transaction },
    );
    if (done && m.key !== "retainer_received") {
      await sequelize.query(
        `INSERT INTO job_events (job_id, user_id, kind, milestone, body, created_at) VALUES (:job, :by, 'milestone_reached', :key, :body, :at)`,
        {
          replacements: { job: job.id, by, key: m.key, body: m.key === "in_build" ? "Manifold machined; the tank is at the painter's." : "", at: reachedAt },
          transaction,
        },
      );
    }
  }
  if (closed)
    await seedClosing(sequelize, transaction, {
      jobId: job.id,
      buyerAuthor,
      manager: a.userIds.get("nadia@tenderflow.test")!,
      totalCents: a.totalCents,
      flat: a.flat,
    });
  if (underway && !handedOver) {
    await sequelize.query(
      `INSERT INTO job_events (job_id, user_id, kind, body, visibility, created_at) VALUES (:job, :by, 'manager_note', :body, 'operator', :at)`,
      {
        replacements: {
          job: job.id,
          by: a.userIds.get("nadia@tenderflow.test"),
          body: "Called Aled: test bench booked for next week, motor delivery slipped.",
          at: daysAgo(2),
        },
        transaction,
      },
    );
  }
}

/** The buyer accepted the handover yesterday; Nadia recorded the balance's bank transfer today. */
async function seedClosing(
  sequelize: Sequelize,
  transaction: Transaction,
  a: { jobId: string; buyerAuthor: string; manager: string; totalCents: number; flat: Record<string, string> },
) {
  const balance = a.totalCents - retainerCents(a.totalCents, a.flat.retainerPercent);
  const reference = "BACS MARLOW 0412";
  await sequelize.query(
    `UPDATE jobs SET accepted_at = :accepted, accepted_by_id = :buyer, balance_paid_at = :paid, balance_method = 'bank_transfer', balance_reference = :reference WHERE id = :job`,
    { replacements: { accepted: daysAgo(1), buyer: a.buyerAuthor, paid: daysAgo(0), reference, job: a.jobId }, transaction },
  );
  await sequelize.query(
    `INSERT INTO job_events (job_id, user_id, kind, milestone, detail, created_at) VALUES (:job, :buyer, 'handover_accepted', 'handed_over', '{}', :accepted),
       (:job, :manager, 'balance_paid', NULL, :detail, :paid)`,
    {
      replacements: {
        job: a.jobId,
        buyer: a.buyerAuthor,
        manager: a.manager,
        accepted: daysAgo(1),
        paid: daysAgo(0),
        detail: JSON.stringify({ method: "bank_transfer", reference, amountCents: balance, currency: a.flat.currency, paymentId: null }),
      },
      transaction,
    },
  );
}

/** The order confirmation the award made, as job-opening's makeOrderConfirmation builds it. */
async function seedOrderConfirmation(
  sequelize: Sequelize,
  transaction: Transaction,
  a: {
    jobId: string;
    specId: string;
    awardedAt: Date;
    awardedBy: string;
    spec: DemoSpec;
    offer: { shop: string };
    totalCents: number;
    orgIds: Map<string, string>;
    flat: Record<string, string>;
    summary: OfferSummary;
  },
) {
  const profile = async (name: string): Promise<OrganisationProfile> => {
    const o = await sequelize.query<Record<string, string | null>>(
      `SELECT name, kind, address, region, tax_number, quote_contact_name, quote_contact_email, quote_contact_phone FROM organisations WHERE id = :id`,
      { replacements: { id: a.orgIds.get(name) }, type: QueryTypes.SELECT, transaction, plain: true },
    );
    const contact = o!.quote_contact_name || o!.quote_contact_email || o!.quote_contact_phone;
    return {
      name: o!.name!,
      kind: o!.kind as OrganisationProfile["kind"],
      address: o!.address,
      region: o!.region,
      taxNumber: o!.tax_number,
      quoteContact: contact ? { name: o!.quote_contact_name, email: o!.quote_contact_email, phone: o!.quote_contact_phone } : null,
    };
  };
  const [{ serial }] = await sequelize.query<{ serial: string }>("SELECT nextval('order_number_seq') AS serial", { type: QueryTypes.SELECT, transaction });
  const number = orderNumber(a.awardedAt.getUTCFullYear(), Number(serial));
  const retainer = retainerCents(a.totalCents, a.flat.retainerPercent);
  const document = buildOrderDocument({
    number,
    issuedAt: a.awardedAt,
    spec: { id: a.specId, title: a.flat.title, revision: 1 },
    buyer: await profile(a.spec.organisation),
    shop: await profile(a.offer.shop),
    awardedBy: DEMO_ORGANISATIONS.flatMap((o) => o.users).find((u) => u.email === a.awardedBy)?.name ?? a.awardedBy,
    offer: a.summary,
    totalCents: a.totalCents,
    retainerPercent: a.flat.retainerPercent,
    retainerCents: retainer,
    handoverBy: targetDates(a.awardedAt.toISOString().slice(0, 10), a.summary.terms.leadTimeWeeks).handed_over,
  });
  await sequelize.query(`INSERT INTO order_confirmations (job_id, number, document, created_at) VALUES (:job, :number, :document, :at)`, {
    replacements: { job: a.jobId, number, document: JSON.stringify(document), at: a.awardedAt },
    transaction,
  });
}

/** The demo sign-ins, one per role, as `npm start` prints them. */
export const DEMO_SIGN_INS = DEMO_ORGANISATIONS.flatMap((o) => o.users.map((u) => ({ role: u.role, email: u.email, name: u.name, organisation: o.name })));

/** Seeds the demo scenario into an empty database; does nothing when organisations exist. */
export async function seedDemo(sequelize: Sequelize): Promise<boolean> {
  const [{ count }] = await sequelize.query<{ count: number }>("SELECT count(*)::int AS count FROM organisations", {
    type: QueryTypes.SELECT,
  });
  if (count > 0) return false;
  const passwordHash = await bcrypt.hash(DEMO_PASSWORD, 10);
  await sequelize.transaction(async (transaction) => {
    const userIds = new Map<string, string>();
    const orgIds = new Map<string, string>();
    for (const org of DEMO_ORGANISATIONS) {
      // Customers of long standing (the scenario's jobs go back months), their shops approved
      // long ago; a pending shop signed up yesterday.
      const approval = org.kind !== "shop" ? null : org.pending ? "pending" : "approved";
      const since = org.pending || org.recent ? daysAgo(1) : daysAgo(420);
      const [row] = await sequelize.query<{ id: string }>(
        `INSERT INTO organisations (name, kind, region, approval, approval_decided_at, created_at, updated_at,
           address, tax_number, quote_contact_name, quote_contact_email, quote_contact_phone)
         VALUES (:name, :kind, :region, :approval, :decidedAt, :since, :since, :address, :taxNumber, :contactName, :contactEmail, :contactPhone) RETURNING id`,
        {
          replacements: {
            name: org.name,
            kind: org.kind,
            region: org.region,
            approval,
            decidedAt: approval === "approved" ? daysAgo(419) : null,
            since,
            address: org.profile?.address ?? null,
            taxNumber: org.profile?.taxNumber ?? null,
            contactName: org.profile?.contact[0] ?? null,
            contactEmail: org.profile?.contact[1] ?? null,
            contactPhone: org.profile?.contact[2] ?? null,
          },
          transaction,
          type: QueryTypes.SELECT,
        },
      );
      orgIds.set(org.name, row.id);
      for (const user of org.users) {
        const [u] = await sequelize.query<{ id: string }>(
          `INSERT INTO users (organisation_id, email, name, password_hash, role)
           VALUES (:organisationId, :email, :name, :passwordHash, :role) RETURNING id`,
          { replacements: { ...user, organisationId: row.id, passwordHash }, transaction, type: QueryTypes.SELECT },
        );
        userIds.set(user.email, u.id);
      }
    }
    for (const org of DEMO_ORGANISATIONS.filter((o) => o.managedBy)) {
      await sequelize.query("UPDATE organisations SET account_manager_id = :managerId WHERE id = :id", {
        replacements: { managerId: userIds.get(org.managedBy!), id: orgIds.get(org.name) },
        transaction,
      });
    }
    await seedSpecs(sequelize, transaction, userIds, orgIds);
    await seedOperatorSide(sequelize, transaction, userIds, orgIds);
  });
  return true;
}

/**
 * The operator's side: notes on Kestrel's account and an audit log with history in it (shops
 * approved and accounts assigned when the scenario began, each award, a recent failed sign-in),
 * written as the app writes them (audit.server.ts keeps names, not references).
 */
async function seedOperatorSide(sequelize: Sequelize, transaction: Transaction, userIds: Map<string, string>, orgIds: Map<string, string>) {
  const nadia = userIds.get("nadia@tenderflow.test")!;
  const notes: [string, number][] = [
    ["Priya prefers a call before any quotation goes out; Owen signs off the budget.", 30],
    ["Panel press is their first on Tenderflow: check in once the bids are in.", 3],
  ];
  for (const [body, days] of notes) {
    await sequelize.query("INSERT INTO account_notes (organisation_id, body, author_id, created_at, updated_at) VALUES (:org, :body, :author, :at, :at)", {
      replacements: { org: orgIds.get("Kestrel Forming Machines"), body, author: nadia, at: daysAgo(days) },
      transaction,
    });
  }
  const felix = { id: userIds.get("felix@tenderflow.test"), name: "Felix Ortmann", email: "felix@tenderflow.test" };
  const entries: { at: Date; action: string; actor: typeof felix | null; email?: string; subject: [string, string, string] | null; details: object }[] = [];
  for (const org of DEMO_ORGANISATIONS) {
    const id = orgIds.get(org.name)!;
    if (org.kind === "shop" && !org.pending)
      entries.push({ at: daysAgo(419), action: "shop-approved", actor: felix, subject: ["organisation", id, org.name], details: {} });
    if (org.managedBy) {
      entries.push({
        at: daysAgo(419),
        action: "account-manager-assigned",
        actor: felix,
        subject: ["organisation", id, org.name],
        details: { manager: "Nadia Brennan" },
      });
    }
  }
  const awards = await sequelize.query<{
    specId: string;
    title: string;
    shop: string;
    awardedAt: Date;
    byId: string;
    byName: string;
    byEmail: string;
    jobId: string;
  }>(
    `SELECT s.id AS "specId", s.title, o.name AS shop, j.awarded_at AS "awardedAt", u.id AS "byId", u.name AS "byName", u.email AS "byEmail", j.id AS "jobId"
       FROM jobs j JOIN specs s ON s.id = j.spec_id JOIN organisations o ON o.id = j.shop_organisation_id JOIN users u ON u.id = j.awarded_by_id`,
    { type: QueryTypes.SELECT, transaction },
  );
  for (const a of awards) {
    const actor = { id: a.byId, name: a.byName, email: a.byEmail };
    entries.push({ at: a.awardedAt, action: "bid-awarded", actor, subject: ["spec", a.specId, a.title], details: { shop: a.shop, jobId: a.jobId } });
  }
  entries.push({ at: daysAgo(1), action: "sign-in-failed", actor: null, email: "owen@kestrel-forming.test", subject: null, details: { reason: "invalid" } });
  for (const e of entries) {
    await sequelize.query(
      `INSERT INTO audit_events (at, action, actor_id, actor_name, actor_email, subject_type, subject_id, subject_label, details)
       VALUES (:at, :action, :actorId, :actorName, :actorEmail, :subjectType, :subjectId, :subjectLabel, :details)`,
      {
        replacements: {
          at: e.at,
          action: e.action,
          actorId: e.actor?.id ?? null,
          actorName: e.actor?.name ?? "Unknown visitor",
          actorEmail: e.actor?.email ?? e.email ?? null,
          subjectType: e.subject?.[0] ?? null,
          subjectId: e.subject?.[1] ?? null,
          subjectLabel: e.subject?.[2] ?? null,
          details: JSON.stringify(e.details),
        },
        transaction,
      },
    );
  }
}
