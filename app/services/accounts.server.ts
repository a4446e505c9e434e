import bcrypt from "bcryptjs";
import { Op, UniqueConstraintError } from "sequelize";
import { env } from "~/env.server";
import { ROLES_BY_KIND, type Role } from "~/auth/roles";
import { Invitation, Organisation, PasswordReset, User, sequelize } from "~/models/index.server";
import { FieldErrors, notFound, forbidden } from "./errors.server";
import { enqueueMail } from "./mail.server";
import { hashToken, newToken } from "./tokens.server";

const RESET_LINK_HOURS = 1;
const INVITATION_DAYS = 7;
const DUPLICATE_EMAIL = "An account with this e-mail address already exists. Sign in, or reset your password.";

export const hashPassword = (password: string) => bcrypt.hash(password, env().BCRYPT_COST);

// Compared against when the e-mail is unknown, so a wrong e-mail takes as long as a wrong password.
let dummyHash: string | undefined;
const dummy = () => (dummyHash ??= bcrypt.hashSync("no account has this password", env().BCRYPT_COST));

export type SignInFailure = "invalid" | "deactivated";

export class SignInError extends Error {
  constructor(public readonly reason: SignInFailure) {
    super(reason === "invalid" ? "The e-mail address or password is not right." : "This account has been deactivated.");
  }
}

export async function verifyCredentials(email: string, password: string): Promise<User> {
  const user = await User.findOne({ where: { email: email.toLowerCase() } });
  const ok = await bcrypt.compare(password, user?.passwordHash ?? dummy());
  if (!user || !ok) throw new SignInError("invalid");
  if (!user.active) throw new SignInError("deactivated");
  await user.update({ lastSignInAt: new Date() });
  return user;
}

export interface SignUpInput {
  kind: "buyer" | "shop";
  organisationName: string;
  name: string;
  email: string;
  password: string;
}

/** Creates the organisation and its first user together, or neither. */
export async function signUp(input: SignUpInput): Promise<User> {
  const passwordHash = await hashPassword(input.password);
  try {
    return await sequelize.transaction(async (transaction) => {
      const organisation = await Organisation.create(
        { name: input.organisationName, kind: input.kind, region: null, accountManagerId: null },
        { transaction },
      );
      return User.create(
        {
          organisationId: organisation.id,
          email: input.email,
          name: input.name,
          passwordHash,
          role: input.kind,
          lastSignInAt: new Date(),
        },
        { transaction },
      );
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw new FieldErrors({ email: [DUPLICATE_EMAIL] });
    throw error;
  }
}

/** Always behaves the same whether or not the address is known, so it reveals no accounts. */
export async function requestPasswordReset(email: string): Promise<void> {
  const user = await User.findOne({ where: { email, active: true } });
  if (!user) return;
  const { token, tokenHash } = newToken();
  await sequelize.transaction(async (transaction) => {
    await PasswordReset.create(
      { userId: user.id, tokenHash, expiresAt: new Date(Date.now() + RESET_LINK_HOURS * 3_600_000), usedAt: null },
      { transaction },
    );
    const link = `${env().APP_URL}/reset-password/${token}`;
    await enqueueMail(
      {
        to: user.email,
        subject: "Reset your Tenderflow password",
        priority: "account",
        text: `Hello ${user.name},\n\nSomeone asked to reset the password of your Tenderflow account. To choose a new one, open this link within ${RESET_LINK_HOURS} hour:\n\n${link}\n\nThe link works once. If you did not ask for this, ignore this message; your password stays as it is.`,
      },
      transaction,
    );
  });
}

export async function findUsableReset(token: string) {
  return PasswordReset.findOne({
    where: { tokenHash: hashToken(token), usedAt: null, expiresAt: { [Op.gt]: new Date() } },
  });
}

/** Uses a reset link once: the UPDATE … WHERE used_at IS NULL makes a second use a no-op. */
export async function resetPassword(token: string, password: string): Promise<User> {
  const passwordHash = await hashPassword(password);
  return sequelize.transaction(async (transaction) => {
    const [count, rows] = await PasswordReset.update(
      { usedAt: new Date() },
      {
        where: { tokenHash: hashToken(token), usedAt: null, expiresAt: { [Op.gt]: new Date() } },
        returning: true,
        transaction,
      },
    );
    if (count === 0) throw new FieldErrors({ token: ["This reset link has expired or was already used. Ask for a new one."] });
    const user = await User.findByPk(rows[0].userId, { transaction, rejectOnEmpty: true });
    if (!user.active) throw new FieldErrors({ token: ["This account has been deactivated."] });
    await user.update({ passwordHash }, { transaction });
    return user;
  });
}

/** Invites a colleague into the actor's organisation with a role that organisation may hold. */
export async function inviteColleague(actor: User, email: string, requestedRole?: Role) {
  const organisation = await Organisation.findByPk(actor.organisationId, { rejectOnEmpty: true });
  const allowed = ROLES_BY_KIND[organisation.kind];
  const role = requestedRole ?? allowed[0];
  if (!allowed.includes(role)) throw new FieldErrors({ role: ["That role does not belong to this organisation."] });
  // Only an admin may bring account managers and admins in.
  if (organisation.kind === "operator" && actor.role !== "admin") forbidden();
  if (await User.findOne({ where: { email } })) {
    throw new FieldErrors({ email: ["This person already has a Tenderflow account."] });
  }
  const { token, tokenHash } = newToken();
  return sequelize.transaction(async (transaction) => {
    const invitation = await Invitation.create(
      {
        organisationId: organisation.id,
        invitedById: actor.id,
        email,
        role,
        tokenHash,
        expiresAt: new Date(Date.now() + INVITATION_DAYS * 86_400_000),
        acceptedAt: null,
        revokedAt: null,
      },
      { transaction },
    );
    await enqueueMail(
      {
        to: email,
        subject: `${actor.name} invited you to ${organisation.name} on Tenderflow`,
        priority: "account",
        text: `Hello,\n\n${actor.name} invited you to join ${organisation.name} on Tenderflow.\n\nTo accept, open this link within ${INVITATION_DAYS} days and choose your password:\n\n${env().APP_URL}/join/${token}\n`,
      },
      transaction,
    );
    return invitation;
  });
}

export async function findOpenInvitation(token: string) {
  return Invitation.findOne({
    where: { tokenHash: hashToken(token), acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } },
    include: [{ model: Organisation, as: "organisation" }],
  });
}

/** Accepts an invitation once, creating the user in the inviting organisation. */
export async function acceptInvitation(token: string, name: string, password: string): Promise<User> {
  const passwordHash = await hashPassword(password);
  try {
    return await sequelize.transaction(async (transaction) => {
      const [count, rows] = await Invitation.update(
        { acceptedAt: new Date() },
        {
          where: { tokenHash: hashToken(token), acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } },
          returning: true,
          transaction,
        },
      );
      if (count === 0) throw new FieldErrors({ token: ["This invitation has expired, was revoked or was already used."] });
      const invitation = rows[0];
      return User.create(
        {
          organisationId: invitation.organisationId,
          email: invitation.email,
          name,
          passwordHash,
          role: invitation.role,
          lastSignInAt: new Date(),
        },
        { transaction },
      );
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw new FieldErrors({ token: [DUPLICATE_EMAIL] });
    throw error;
  }
}

/** Revokes an invitation of the actor's own organisation; any other is "not found". */
export async function revokeInvitation(actor: User, invitationId: string) {
  const invitation = await Invitation.findOne({
    where: { id: invitationId, organisationId: actor.organisationId, acceptedAt: null, revokedAt: null },
  });
  if (!invitation) notFound("This invitation does not exist or was already used.");
  await invitation.update({ revokedAt: new Date() });
}

export async function teamOf(actor: User) {
  const [members, invitations] = await Promise.all([
    User.findAll({ where: { organisationId: actor.organisationId }, order: [["name", "ASC"]] }),
    Invitation.findAll({
      where: { organisationId: actor.organisationId, acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } },
      order: [["createdAt", "DESC"]],
    }),
  ]);
  return { members, invitations };
}

export async function updateSettings(actor: User, settings: { name: string; unitSystem: User["unitSystem"] }) {
  await actor.update(settings);
}
