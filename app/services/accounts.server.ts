import bcrypt from "bcryptjs";
import { Op, UniqueConstraintError, type Transaction } from "sequelize";
import { env } from "~/env.server";
import { ROLES_BY_KIND, type Role } from "~/auth/roles";
import { Invitation, Organisation, PasswordReset, User, UserSession, sequelize } from "~/models/index.server";
import { FieldErrors, notFound } from "./errors.server";
import { authorize, viewerOf } from "~/auth/access-policy.server";
import { enqueueMail } from "./mail.server";
import { invitationMail, invitationToTakenAddressMail, newBuyerUnassignedMail, passwordResetMail } from "./mail-templates.server";
import { throttleInvitations, mayMail, throttledPasswordCheck } from "./throttle.server";
import { hashToken, newToken } from "./tokens.server";

const RESET_LINK_HOURS = 1;
const INVITATION_DAYS = 7;
export const DUPLICATE_EMAIL = "An account with this e-mail address already exists. Sign in, or reset your password.";

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

const WRONG_OWN_PASSWORD = "That is not your password.";

/**
 * The signed-in person types their password again before a change that matters (a refund, a
 * role): a stolen session alone can't make it. Wrong guesses count like wrong sign-ins.
 */
export async function confirmOwnPassword(client: string, user: User, password: string): Promise<void> {
  const ok = await throttledPasswordCheck(client, user.email, async () => ((await bcrypt.compare(password, user.passwordHash)) ? true : null));
  if (!ok) throw new FieldErrors({ currentPassword: [WRONG_OWN_PASSWORD] });
}

export interface SignUpInput {
  kind: "buyer" | "shop";
  organisationName: string;
  name: string;
  email: string;
  password: string;
}

export type NewAccount = Omit<SignUpInput, "password"> & { passwordHash: string };

/** The organisation and its first user, inside the caller's transaction. */
export async function createAccount(input: NewAccount, transaction: Transaction): Promise<User> {
  const organisation = await Organisation.create({ name: input.organisationName, kind: input.kind, region: null, accountManagerId: null }, { transaction });
  const user = await User.create(
    { organisationId: organisation.id, email: input.email, name: input.name, passwordHash: input.passwordHash, role: input.kind, lastSignInAt: new Date() },
    { transaction },
  );
  // A new machine builder has no account manager: the admins hear of it at once (shops are
  // announced by their approval list instead).
  if (organisation.kind === "buyer") {
    for (const admin of await User.findAll({ where: { role: "admin", active: true }, order: [["email", "ASC"]], transaction })) {
      const mail = newBuyerUnassignedMail({ name: admin.name, buyerName: organisation.name, personName: user.name, email: user.email });
      await enqueueMail({ to: admin.email, ...mail }, transaction);
    }
  }
  return user;
}

/**
 * Creates the organisation and its first user together, or neither, at once. The sign-up page
 * goes through a confirmed address instead (sign-up.server.ts); this serves tests and scripts.
 */
export async function signUp(input: SignUpInput): Promise<User> {
  const passwordHash = await hashPassword(input.password);
  try {
    return await sequelize.transaction((transaction) => createAccount({ ...input, passwordHash }, transaction));
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw new FieldErrors({ email: [DUPLICATE_EMAIL] });
    throw error;
  }
}

/** Always behaves the same whether or not the address is known, so it reveals no accounts. */
export async function requestPasswordReset(email: string): Promise<void> {
  // Counted for every address, known or not; over the limit nothing more is sent.
  if (!(await mayMail("password-reset", email))) return;
  const user = await User.findOne({ where: { email, active: true } });
  if (!user) return;
  const { token, tokenHash } = newToken();
  await sequelize.transaction(async (transaction) => {
    await PasswordReset.create({ userId: user.id, tokenHash, expiresAt: new Date(Date.now() + RESET_LINK_HOURS * 3_600_000), usedAt: null }, { transaction });
    await enqueueMail({ to: user.email, ...passwordResetMail({ name: user.name, token, hours: RESET_LINK_HOURS }), priority: "account" }, transaction);
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
    // Whoever knew the old password is signed out wherever they were.
    await UserSession.revokeAllOf(user.id, transaction);
    return user;
  });
}

/** Invites a colleague into the actor's organisation with a role that organisation may hold. */
export async function inviteColleague(actor: User, email: string, requestedRole?: Role) {
  const organisation = await Organisation.findByPk(actor.organisationId, { rejectOnEmpty: true });
  const allowed = ROLES_BY_KIND[organisation.kind];
  const role = requestedRole ?? allowed[0];
  if (!allowed.includes(role)) throw new FieldErrors({ role: ["That role does not belong to this organisation."] });
  // Only an admin may bring account managers and admins in (the access policy's team.invite).
  authorize(await viewerOf(actor), "team.invite", organisation);
  const owner = await User.findOne({ where: { email } });
  // Members are on the team page already, so saying so reveals nothing.
  if (owner?.organisationId === organisation.id) throw new FieldErrors({ email: ["This person is already in your team."] });
  await throttleInvitations(actor.id);
  const notifyOwner = owner ? await mayMail("account-notice", email) : false;
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
    // An address with an account elsewhere: the inviter sees the same pending invitation as for
    // anyone else, and the owner, not the inviter, learns why it can't be accepted.
    if (owner) {
      if (notifyOwner) {
        const notice = invitationToTakenAddressMail({ inviterName: actor.name, organisationName: organisation.name });
        await enqueueMail({ to: email, ...notice, priority: "account" }, transaction);
      }
      return invitation;
    }
    const mail = invitationMail({ inviterName: actor.name, organisationName: organisation.name, token, days: INVITATION_DAYS });
    await enqueueMail({ to: email, ...mail, priority: "account" }, transaction);
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
