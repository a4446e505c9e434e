import { DataTypes, type CreationOptional, type ForeignKey } from "sequelize";
import { ChangingRow, initRow, stringColumn, uuidColumn } from "./columns.server";
import { ORGANISATION_KINDS, type OrganisationKind } from "~/auth/roles";
import { APPROVALS, type Approval } from "~/content/shop-approval";

export class Organisation extends ChangingRow<Organisation> {
  declare name: string;
  declare kind: OrganisationKind;
  declare region: string | null;
  /** The operator's account manager who follows this buyer account. */
  declare accountManagerId: ForeignKey<string> | null;
  /** The Stripe customer of a buyer organisation, made with its first payment. */
  declare stripeCustomerId: CreationOptional<string | null>;
  /** A shop's approval (a new shop starts pending); null for buyer and operator organisations. */
  declare approval: CreationOptional<Approval | null>;
  /** Why the shop was refused, shown to the shop; the admin's optional note on an approval. */
  declare approvalReason: CreationOptional<string | null>;
  declare approvalDecidedById: CreationOptional<ForeignKey<string> | null>;
  declare approvalDecidedAt: CreationOptional<Date | null>;
  /** The company profile (settings): postal address, tax number and who answers about quotes. */
  declare address: CreationOptional<string | null>;
  declare taxNumber: CreationOptional<string | null>;
  declare quoteContactName: CreationOptional<string | null>;
  declare quoteContactEmail: CreationOptional<string | null>;
  declare quoteContactPhone: CreationOptional<string | null>;
}

function defaultApproval(organisation: Organisation) {
  if (organisation.kind === "shop") organisation.approval ??= "pending";
  else organisation.approval = null;
}

initRow(
  Organisation,
  "organisations",
  {
    name: stringColumn(120),
    kind: { type: DataTypes.ENUM(...ORGANISATION_KINDS), allowNull: false },
    region: stringColumn(80, { allowNull: true }),
    accountManagerId: uuidColumn({ allowNull: true }),
    stripeCustomerId: stringColumn(255, { allowNull: true }),
    approval: { type: DataTypes.ENUM(...APPROVALS), allowNull: true },
    approvalReason: { type: DataTypes.TEXT, allowNull: true },
    approvalDecidedById: uuidColumn({ allowNull: true }),
    approvalDecidedAt: { type: DataTypes.DATE, allowNull: true },
    address: stringColumn(300, { allowNull: true }),
    taxNumber: stringColumn(40, { allowNull: true }),
    quoteContactName: stringColumn(120, { allowNull: true }),
    quoteContactEmail: stringColumn(254, { allowNull: true }),
    quoteContactPhone: stringColumn(40, { allowNull: true }),
  },
  {
    hooks: {
      // Safe by default: a shop made anywhere (sign-up, a script) waits for an admin, unless
      // whoever makes it decides otherwise; other kinds never carry an approval.
      beforeCreate: defaultApproval,
      beforeBulkCreate: (organisations) => organisations.forEach(defaultApproval),
    },
  },
);
