// All models and their associations, loaded together so every association exists before use.
import { Organisation } from "./organisation.server";
import { User } from "./user.server";
import { Invitation, PasswordReset } from "./token.server";
import { OutboxMail } from "./outbox.server";
import { Spec, SpecAttachment, SpecRevision } from "./spec.server";

Organisation.hasMany(User, { foreignKey: "organisationId", as: "users" });
User.belongsTo(Organisation, { foreignKey: "organisationId", as: "organisation" });
Organisation.belongsTo(User, { foreignKey: "accountManagerId", as: "accountManager" });
PasswordReset.belongsTo(User, { foreignKey: "userId", as: "user" });
Invitation.belongsTo(Organisation, { foreignKey: "organisationId", as: "organisation" });
Invitation.belongsTo(User, { foreignKey: "invitedById", as: "invitedBy" });
Spec.belongsTo(Organisation, { foreignKey: "organisationId", as: "organisation" });
Spec.hasMany(SpecRevision, { foreignKey: "specId", as: "revisions" });
Spec.hasMany(SpecAttachment, { foreignKey: "specId", as: "attachments" });
SpecRevision.belongsTo(Spec, { foreignKey: "specId", as: "spec" });
SpecAttachment.belongsTo(Spec, { foreignKey: "specId", as: "spec" });

export { sequelize } from "~/db.server";
export { Organisation, User, Invitation, PasswordReset, OutboxMail, Spec, SpecRevision, SpecAttachment };
