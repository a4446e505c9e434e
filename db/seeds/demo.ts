// Demo data of Tenderflow's own invented scenario: two machine builders, three fluid-power shops
// and the portal's operator. Every name, company and address here is made up (.test domains).
import bcrypt from "bcryptjs";
import { QueryTypes, type Sequelize } from "sequelize";

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
  });
  return true;
}
