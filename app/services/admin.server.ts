import { Op, type Order, type WhereOptions } from "sequelize";
import { ROLES_BY_KIND, type OrganisationKind, type Role } from "~/auth/roles";
import type { Approval } from "~/content/shop-approval";
import type { SortOf } from "~/schemas/list-sort";
import { Organisation, User, UserSession, sequelize } from "~/models/index.server";
import { recordAudit } from "./audit.server";
import { FieldErrors, notFound } from "./errors.server";
import { caseless, likePattern, pageCountOf, pageOf } from "./list-query.server";
import { accountsWhere, authorize, viewerOf } from "~/auth/access-policy.server";

const PAGE_SIZE = 20;

export interface ListQuery<S> {
  q?: string;
  page?: number;
  /** Newest first when not given. */
  sort?: S;
}

// Each order ends on the id, so a page boundary never shows a row twice or skips one.
const USER_ORDERS: Record<SortOf<"users">, Order> = {
  newest: [
    ["createdAt", "DESC"],
    ["id", "ASC"],
  ],
  name: [
    [caseless("User.name"), "ASC"],
    ["id", "ASC"],
  ],
  "last-sign-in": [
    ["lastSignInAt", "DESC NULLS LAST"],
    ["id", "ASC"],
  ],
};

const ORGANISATION_ORDERS: Record<SortOf<"organisations" | "accounts">, Order> = {
  newest: [
    ["createdAt", "DESC"],
    ["id", "ASC"],
  ],
  name: [
    [caseless("Organisation.name"), "ASC"],
    ["id", "ASC"],
  ],
};

/** Users with their organisations, searched by name, e-mail or organisation, in the order asked. */
export async function listUsers(admin: User, query: ListQuery<SortOf<"users">>) {
  await mayAdminister(admin);
  const { page, offset, limit } = pageOf(query.page, PAGE_SIZE);
  const q = query.q?.trim();
  const where: WhereOptions = q
    ? {
        [Op.or]: [
          { name: { [Op.iLike]: likePattern(q) } },
          { email: { [Op.iLike]: likePattern(q) } },
          { "$organisation.name$": { [Op.iLike]: likePattern(q) } },
        ],
      }
    : {};
  const { rows, count } = await User.findAndCountAll({
    where,
    include: [{ model: Organisation, as: "organisation", required: true }],
    order: USER_ORDERS[query.sort ?? "newest"],
    offset,
    limit,
  });
  return { users: rows, total: count, page, pageCount: pageCountOf(count, PAGE_SIZE) };
}

/** How many people each organisation has, by id. */
async function memberCounts(organisations: Organisation[]) {
  const counts = await User.count({ where: { organisationId: organisations.map((o) => o.id) }, group: ["organisationId"] });
  const members = new Map(counts.map((c) => [c.organisationId as string, Number(c.count)]));
  return organisations.map((organisation) => ({ organisation, memberCount: members.get(organisation.id) ?? 0 }));
}

export async function listOrganisations(admin: User, query: ListQuery<SortOf<"organisations">> & { kind?: OrganisationKind; approval?: Approval }) {
  await mayAdminister(admin);
  const { page, offset, limit } = pageOf(query.page, PAGE_SIZE);
  const q = query.q?.trim();
  const where: WhereOptions = {
    ...(q ? { name: { [Op.iLike]: likePattern(q) } } : {}),
    ...(query.kind ? { kind: query.kind } : {}),
    // Only shops have an approval, so this filter lists shops.
    ...(query.approval ? { approval: query.approval } : {}),
  };
  const { rows, count } = await Organisation.findAndCountAll({
    where,
    include: [{ model: User, as: "accountManager", required: false }],
    order: ORGANISATION_ORDERS[query.sort ?? "newest"],
    offset,
    limit,
  });
  return { organisations: await memberCounts(rows), total: count, page, pageCount: pageCountOf(count, PAGE_SIZE) };
}

/** Changes to people and organisations are the admins' (the access policy's platform.administer). */
const mayAdminister = async (user: User) => authorize(await viewerOf(user), "platform.administer", null);

const userSubject = (user: User) => ({ type: "user" as const, id: user.id, label: `${user.name} (${user.email})` });

async function userWithOrg(userId: string) {
  const user = await User.findByPk(userId, { include: [{ model: Organisation, as: "organisation" }] });
  if (!user?.organisation) notFound("No such user.");
  return user as User & { organisation: Organisation };
}

/** The user whose role would change, if the change is allowed: checked before asking for a password. */
export async function roleChangeTarget(admin: User, userId: string, role: Role) {
  await mayAdminister(admin);
  const user = await userWithOrg(userId);
  if (!ROLES_BY_KIND[user.organisation.kind].includes(role)) {
    throw new FieldErrors({ role: [`A member of a ${user.organisation.kind} organisation cannot have that role.`] });
  }
  if (user.id === admin.id && role !== "admin") {
    throw new FieldErrors({ role: ["You cannot take away your own administrator role."] });
  }
  return user;
}

/** A role must fit the user's organisation: operator staff switch between manager and admin. */
export async function changeRole(admin: User, userId: string, role: Role) {
  const user = await roleChangeTarget(admin, userId, role);
  const before = user.role;
  await sequelize.transaction(async (transaction) => {
    await user.update({ role }, { transaction });
    await recordAudit({ actor: admin, action: "role-changed", subject: userSubject(user), details: { from: before, to: role } }, transaction);
  });
  return user;
}

export async function setActive(admin: User, userId: string, active: boolean) {
  await mayAdminister(admin);
  const user = await userWithOrg(userId);
  if (user.id === admin.id && !active) throw new FieldErrors({ active: ["You cannot deactivate yourself."] });
  await sequelize.transaction(async (transaction) => {
    await user.update({ active }, { transaction });
    await recordAudit({ actor: admin, action: active ? "user-reactivated" : "user-deactivated", subject: userSubject(user) }, transaction);
    // Deactivated means signed out everywhere: reactivating later brings no old session back.
    if (!active) await UserSession.revokeAllOf(user.id, transaction);
  });
  return user;
}

export async function listAccountManagers(admin: User) {
  await mayAdminister(admin);
  return User.findAll({ where: { role: "account_manager", active: true }, order: [["name", "ASC"]] });
}

export async function assignAccountManager(admin: User, organisationId: string, { managerId }: { managerId: string | null }) {
  await mayAdminister(admin);
  const organisation = await Organisation.findByPk(organisationId);
  if (!organisation || organisation.kind !== "buyer") notFound("No such buyer organisation.");
  if (managerId) {
    const manager = await User.findOne({ where: { id: managerId, role: "account_manager", active: true } });
    if (!manager) throw new FieldErrors({ managerId: ["Choose an active account manager."] });
  }
  const manager = managerId ? await User.findByPk(managerId) : null;
  await sequelize.transaction(async (transaction) => {
    await organisation.update({ accountManagerId: managerId }, { transaction });
    await recordAudit(
      {
        actor: admin,
        action: "account-manager-assigned",
        subject: { type: "organisation", id: organisation.id, label: organisation.name },
        details: { manager: manager?.name ?? "Nobody" },
      },
      transaction,
    );
  });
}

/** The buyer accounts a viewer follows (the access policy's accountsWhere), in the order asked. */
export async function accountsOf(viewer: User, sort: SortOf<"accounts"> = "name") {
  const organisations = await Organisation.findAll({
    where: accountsWhere(await viewerOf(viewer)),
    include: [{ model: User, as: "accountManager", required: false }],
    order: ORGANISATION_ORDERS[sort],
  });
  return memberCounts(organisations);
}
