import { Op, type WhereOptions } from "sequelize";
import { ROLES_BY_KIND, type OrganisationKind, type Role } from "~/auth/roles";
import type { Approval } from "~/content/shop-approval";
import { Organisation, User, UserSession, sequelize } from "~/models/index.server";
import { FieldErrors, notFound } from "./errors.server";
import { accountsWhere, authorize, viewerOf } from "~/auth/access-policy.server";

const PAGE_SIZE = 20;

export interface ListQuery {
  q?: string;
  page?: number;
}

function pageOf(query: ListQuery) {
  const page = Math.max(1, Math.floor(query.page ?? 1) || 1);
  return { page, offset: (page - 1) * PAGE_SIZE, limit: PAGE_SIZE };
}

// ILIKE wildcards typed by a person are matched literally.
const likePattern = (q: string) => `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/** Users with their organisations, searched by name, e-mail or organisation, newest first. */
export async function listUsers(admin: User, query: ListQuery) {
  await mayAdminister(admin);
  const { page, offset, limit } = pageOf(query);
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
    order: [
      ["createdAt", "DESC"],
      ["id", "ASC"],
    ],
    offset,
    limit,
  });
  return { users: rows, total: count, page, pageCount: Math.max(1, Math.ceil(count / PAGE_SIZE)) };
}

export async function listOrganisations(admin: User, query: ListQuery & { kind?: OrganisationKind; approval?: Approval }) {
  await mayAdminister(admin);
  const { page, offset, limit } = pageOf(query);
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
    order: [
      ["name", "ASC"],
      ["id", "ASC"],
    ],
    offset,
    limit,
  });
  const memberCounts = await User.count({
    where: { organisationId: rows.map((o) => o.id) },
    group: ["organisationId"],
  });
  const members = new Map(memberCounts.map((c) => [c.organisationId as string, Number(c.count)]));
  return {
    organisations: rows.map((o) => ({ organisation: o, memberCount: members.get(o.id) ?? 0 })),
    total: count,
    page,
    pageCount: Math.max(1, Math.ceil(count / PAGE_SIZE)),
  };
}

/** Changes to people and organisations are the admins' (the access policy's platform.administer). */
const mayAdminister = async (user: User) => authorize(await viewerOf(user), "platform.administer", null);

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
  await user.update({ role });
  return user;
}

export async function setActive(admin: User, userId: string, active: boolean) {
  await mayAdminister(admin);
  const user = await userWithOrg(userId);
  if (user.id === admin.id && !active) throw new FieldErrors({ active: ["You cannot deactivate yourself."] });
  await sequelize.transaction(async (transaction) => {
    await user.update({ active }, { transaction });
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
  await organisation.update({ accountManagerId: managerId });
}

/** The buyer accounts a viewer follows (the access policy's accountsWhere). */
export async function accountsOf(viewer: User) {
  const organisations = await Organisation.findAll({
    where: accountsWhere(await viewerOf(viewer)),
    include: [{ model: User, as: "accountManager", required: false }],
    order: [["name", "ASC"]],
  });
  const counts = await User.count({ where: { organisationId: organisations.map((o) => o.id) }, group: ["organisationId"] });
  const members = new Map(counts.map((c) => [c.organisationId as string, Number(c.count)]));
  return organisations.map((organisation) => ({ organisation, memberCount: members.get(organisation.id) ?? 0 }));
}

/** One account of the viewer's; an account they do not follow is "not found". */
export async function accountOf(viewer: User, organisationId: string) {
  const organisation = await Organisation.findOne({
    where: { [Op.and]: [accountsWhere(await viewerOf(viewer)), { id: organisationId }] },
    include: [{ model: User, as: "users" }],
  });
  if (!organisation) notFound("No such account.");
  return organisation;
}
