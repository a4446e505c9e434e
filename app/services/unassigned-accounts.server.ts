import { authorize, viewerOf } from "~/auth/access-policy.server";
import { Organisation, User } from "~/models/index.server";

// Buyer organisations no account manager follows yet, oldest first: shown on the admin's home
// (with a way to assign one) and on every account manager's dashboard until someone is assigned.

const SHOWN = 20;

export interface UnassignedAccount {
  id: string;
  name: string;
  signedUpAt: string;
  people: { name: string; email: string }[];
}

export async function unassignedAccounts(viewer: User): Promise<{ accounts: UnassignedAccount[]; total: number }> {
  authorize(await viewerOf(viewer), "account.seeUnassigned", null);
  const where = { kind: "buyer" as const, accountManagerId: null };
  const [rows, total] = await Promise.all([
    Organisation.findAll({
      where,
      include: [{ model: User, as: "users", attributes: ["name", "email"], required: false }],
      order: [
        ["createdAt", "ASC"],
        ["id", "ASC"],
      ],
      limit: SHOWN,
    }),
    Organisation.count({ where }),
  ]);
  return {
    total,
    accounts: rows.map((o) => ({
      id: o.id,
      name: o.name,
      signedUpAt: o.createdAt.toISOString(),
      people: ((o as Organisation & { users?: User[] }).users ?? []).map((u) => ({ name: u.name, email: u.email })),
    })),
  };
}
