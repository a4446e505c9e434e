import type { Transaction, WhereOptions } from "sequelize";
import { Organisation, type User } from "~/models/index.server";
import { OPERATOR_ROLES, type Role } from "./roles";

// Who is looking, as the access policy needs to know it: the role, the organisation, the buyer
// accounts they manage and, for a shop, whether an admin has approved it. Built once per service
// call, so every rule below is a plain function of the viewer and the record.

export interface Viewer {
  readonly id: string;
  readonly role: Role;
  readonly organisationId: string;
  /** The buyer accounts this viewer manages: every one (admin), those assigned (account manager), none. */
  readonly accounts: "all" | readonly string[];
  /** A shop an admin has approved: only such a shop reads specs. */
  readonly approvedShop: boolean;
}

export const isOperator = (viewer: Pick<Viewer, "role">) => (OPERATOR_ROLES as readonly Role[]).includes(viewer.role);

/**
 * The one answer to "which buyer accounts does this person manage", as a where-clause on
 * organisations: an admin every buyer account, an account manager the accounts assigned to them
 * (organisations.account_manager_id), anyone else none (null).
 */
export function managedAccountsWhere(person: Pick<Viewer, "id" | "role">): WhereOptions<Organisation> | null {
  if (person.role === "admin") return { kind: "buyer" };
  if (person.role === "account_manager") return { kind: "buyer", accountManagerId: person.id };
  return null;
}

/** Whether the viewer manages the buyer account `organisationId`. */
export const manages = (viewer: Viewer, organisationId: string) => viewer.accounts === "all" || viewer.accounts.includes(organisationId);

type UserWithOrganisation = User & { organisation?: Organisation | null };

/** The viewer a signed-in user is; the organisation the session loaded is used when present. */
export async function viewerOf(user: UserWithOrganisation, transaction?: Transaction): Promise<Viewer> {
  const managed = managedAccountsWhere(user);
  let accounts: Viewer["accounts"] = [];
  if (user.role === "admin") accounts = "all";
  else if (managed) accounts = (await Organisation.findAll({ where: managed, attributes: ["id"], transaction })).map((o) => o.id);

  let approvedShop = false;
  if (user.role === "shop") {
    const loaded = user.organisation && user.organisation.id === user.organisationId ? user.organisation : null;
    const organisation = loaded ?? (await Organisation.findByPk(user.organisationId, { attributes: ["id", "approval"], transaction }));
    approvedShop = organisation?.approval === "approved";
  }
  return { id: user.id, role: user.role, organisationId: user.organisationId, accounts, approvedShop };
}
