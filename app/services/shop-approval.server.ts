import { Organisation, User, sequelize } from "~/models/index.server";
import type { Approval } from "~/content/shop-approval";
import { FieldErrors, notFound, requireId } from "./errors.server";
import { authorize, viewerOf } from "~/auth/access-policy.server";
import { recordAudit } from "./audit.server";
import { enqueueMail } from "./mail.server";
import { shopApprovedMail, shopRefusedMail } from "./mail-templates.server";

// An admin approves or refuses each new shop organisation before it reads any spec
// (spec-access.server.ts applies the decision). The shop's people are mailed either way, in the
// transaction of the decision. A refused shop can still be approved later (things change); an
// approved one stays approved.

export interface ApprovalState {
  approval: Approval;
  reason: string | null;
  decidedAt: string | null;
}

/** Where the user's shop stands, for its home page; null for other kinds of organisation. */
export async function approvalStateOf(user: User): Promise<ApprovalState | null> {
  const organisation = await Organisation.findByPk(user.organisationId, { attributes: ["kind", "approval", "approvalReason", "approvalDecidedAt"] });
  if (!organisation || organisation.kind !== "shop" || !organisation.approval) return null;
  return {
    approval: organisation.approval,
    // The reason is the shop's to read only when it was refused; an approval note stays internal.
    reason: organisation.approval === "refused" ? organisation.approvalReason : null,
    decidedAt: organisation.approvalDecidedAt?.toISOString() ?? null,
  };
}

export interface WaitingShop {
  id: string;
  name: string;
  signedUpAt: string;
  people: { name: string; email: string }[];
  approval: Approval;
  reason: string | null;
}

/** Shops waiting for a decision, oldest first, with the people who signed them up. */
export async function shopsAwaitingApproval(admin: User, limit = 50): Promise<WaitingShop[]> {
  authorize(await viewerOf(admin), "platform.administer", null);
  const shops = await Organisation.findAll({
    where: { kind: "shop", approval: "pending" },
    include: [{ model: User, as: "users", attributes: ["name", "email"], required: false }],
    order: [
      ["createdAt", "ASC"],
      ["id", "ASC"],
    ],
    limit,
  });
  return shops.map((o) => ({
    id: o.id,
    name: o.name,
    signedUpAt: o.createdAt.toISOString(),
    people: ((o as Organisation & { users?: User[] }).users ?? []).map((u) => ({ name: u.name, email: u.email })),
    approval: o.approval!,
    reason: o.approvalReason,
  }));
}

export type ShopDecision = { decision: "approve" } | { decision: "refuse"; reason: string };

/**
 * Records an admin's decision on a shop and queues the mail to its people. A pending shop can
 * be approved or refused; a refused one approved. Anything else changes nothing (a clear
 * error), so two admins deciding at once cannot both win: the row is locked first.
 */
export async function decideShop(admin: User, organisationId: string, choice: ShopDecision): Promise<Organisation> {
  requireId(organisationId);
  return sequelize.transaction(async (transaction) => {
    const shop = await Organisation.findOne({ where: { id: organisationId, kind: "shop" }, lock: transaction.LOCK.UPDATE, transaction });
    if (!shop) notFound("No such shop.");
    authorize(await viewerOf(admin, transaction), "shop.decide", shop);
    const approving = choice.decision === "approve";
    if (approving && shop.approval === "approved") throw new FieldErrors({ "": [`${shop.name} is already approved.`] });
    if (!approving && shop.approval !== "pending") {
      throw new FieldErrors({ "": [`${shop.name} is no longer waiting for a decision (it is ${shop.approval}).`] });
    }
    const reason = approving ? null : choice.reason.trim();
    if (!approving && !reason) throw new FieldErrors({ reason: ["Say why the shop is refused; the shop reads it."] });
    await shop.update(
      { approval: approving ? "approved" : "refused", approvalReason: reason, approvalDecidedById: admin.id, approvalDecidedAt: new Date() },
      { transaction },
    );
    await recordAudit(
      {
        actor: admin,
        action: approving ? "shop-approved" : "shop-refused",
        subject: { type: "organisation", id: shop.id, label: shop.name },
        details: reason ? { reason } : {},
      },
      transaction,
    );
    const people = await User.findAll({ where: { organisationId: shop.id, active: true }, order: [["email", "ASC"]], transaction });
    for (const person of people) {
      const mail =
        reason === null ? shopApprovedMail({ name: person.name, shopName: shop.name }) : shopRefusedMail({ name: person.name, shopName: shop.name, reason });
      await enqueueMail({ to: person.email, ...mail, priority: "account" }, transaction);
    }
    return shop;
  });
}

/** How many shops wait for a decision (the admin's organisations page shows it). */
export async function countWaitingShops(admin: User) {
  authorize(await viewerOf(admin), "platform.administer", null);
  return Organisation.count({ where: { kind: "shop", approval: "pending" } });
}
