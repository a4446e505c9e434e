// Demo data of Tenderflow's own invented scenario: two machine builders, three fluid-power shops
// and the portal's operator. Every name, company and address here is made up (.test domains).
import bcrypt from "bcryptjs";
import { QueryTypes, type Sequelize, type Transaction } from "sequelize";
import { ENGINE_VERSION, sizeCircuit } from "~/hydraulics";
import { toRequirementsInput } from "~/content/requirement-fields";

export const DEMO_PASSWORD = "tenderflow-demo";

interface DemoOrganisation {
  name: string;
  kind: "buyer" | "shop" | "operator";
  region: string;
  users: { name: string; email: string; role: "buyer" | "shop" | "account_manager" | "admin" }[];
  managedBy?: string;
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
    users: [{ name: "Aled Morgan", email: "aled@ironbridge-fluid.test", role: "shop" }],
  },
  {
    name: "Northgate Hydraulics",
    kind: "shop",
    region: "UK — North West",
    users: [{ name: "Sofia Lindqvist", email: "sofia@northgate-hyd.test", role: "shop" }],
  },
  {
    name: "Coldharbour Power Units",
    kind: "shop",
    region: "UK — South East",
    users: [{ name: "Ben Achebe", email: "ben@coldharbour-pu.test", role: "shop" }],
  },
];

const inDays = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

/** Two specs of the scenario: a press open for bids, and a tilting deck still in draft. */
function demoSpecs() {
  return [
    {
      organisation: "Kestrel Forming Machines",
      author: "priya@kestrel-forming.test",
      status: "open" as const,
      answers: {
        machine: { title: "Panel press, main ram", purpose: "Forms steel door panels over a die; the ram comes down onto the blank.", orientation: "vertical", rodDirection: "down", mounting: "pinned-pinned" },
        motion: { massKg: "650", processForceN: "60000", frictionCoefficient: "0.1", strokeMm: "350", extendSpeedMmS: "80", retractSpeedMmS: "120", accelTimeS: "0.2" },
        duty: { cyclesPerHour: "90", hoursPerDay: "16", ambientC: "28", supplyHz: "50", maxPressureBar: "160", supplyVoltage: "400 V three-phase", fluid: "ISO VG 46" },
        quotation: { unitsWanted: "2", bidDeadline: inDays(18), dateNeeded: inDays(75), deliveryRegion: "UK — West Midlands", retainerPercent: "20", notes: "Power unit beside the press frame; blue RAL 5010 paint." },
      },
    },
    {
      organisation: "Marlow Deck Systems",
      author: "tom@marlow-decks.test",
      status: "draft" as const,
      answers: {
        machine: { title: "Tilting deck, lift cylinder", purpose: "Tilts a vehicle deck up to 35° for unloading.", orientation: "inclined", inclineDeg: "35", rodDirection: "up", mounting: "pinned-pinned" },
        motion: { massKg: "4200", processForceN: "0", frictionCoefficient: "0.05", strokeMm: "900", extendSpeedMmS: "40", retractSpeedMmS: "50", accelTimeS: "0.3" },
      },
    },
  ];
}

async function seedSpecs(sequelize: Sequelize, transaction: Transaction, userIds: Map<string, string>, orgIds: Map<string, string>) {
  for (const spec of demoSpecs()) {
    const flat = Object.assign({}, ...Object.values(spec.answers)) as Record<string, string>;
    const published = spec.status === "open";
    const [row] = await sequelize.query<{ id: string }>(
      `INSERT INTO specs (organisation_id, created_by_id, title, status, answers, unit_system, completed_steps, current_revision,
         bid_deadline, retainer_percent, delivery_region, published_at)
       VALUES (:org, :author, :title, :status, :answers, 'metric', :steps, :revision, :deadline, :retainer, :region, :publishedAt) RETURNING id`,
      {
        replacements: {
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
          publishedAt: published ? new Date() : null,
        },
        transaction,
        type: QueryTypes.SELECT,
      },
    );
    if (!published) continue;
    const design = sizeCircuit(toRequirementsInput(flat, "metric"));
    await sequelize.query(
      `INSERT INTO spec_revisions (spec_id, number, axes, answers, unit_system, engine_version, created_by_id)
       VALUES (:spec, 1, :axes, :answers, 'metric', :version, :author)`,
      {
        replacements: {
          spec: row.id,
          axes: JSON.stringify([{ name: "Axis 1", requirements: design.requirements, design }]),
          answers: JSON.stringify(spec.answers),
          version: ENGINE_VERSION,
          author: userIds.get(spec.author),
        },
        transaction,
      },
    );
  }
}

/** The demo sign-ins, one per role, as `npm start` prints them. */
export const DEMO_SIGN_INS = DEMO_ORGANISATIONS.flatMap((o) =>
  o.users.map((u) => ({ role: u.role, email: u.email, name: u.name, organisation: o.name })),
);

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
      // INSERT … RETURNING read as a SELECT gives the new rows.
      const [row] = await sequelize.query<{ id: string }>(
        "INSERT INTO organisations (name, kind, region) VALUES (:name, :kind, :region) RETURNING id",
        { replacements: { name: org.name, kind: org.kind, region: org.region }, transaction, type: QueryTypes.SELECT },
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
  });
  return true;
}
