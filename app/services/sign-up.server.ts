import { Op, UniqueConstraintError } from "sequelize";
import { SignUpRequest, User, sequelize } from "~/models/index.server";
import { DUPLICATE_EMAIL, createAccount, hashPassword, type SignUpInput } from "./accounts.server";
import { FieldErrors } from "./errors.server";
import { enqueueMail } from "./mail.server";
import { signUpAddressTakenMail, signUpConfirmMail } from "./mail-templates.server";
import { mayMail } from "./throttle.server";
import { hashToken, newToken } from "./tokens.server";

// Signing up is confirmed by e-mail, so the page answers the same whether or not the address
// already has an account: a new address gets a link that makes the account, a known one gets
// a note to its owner. Only someone who reads the mail learns which it was.

const LINK_HOURS = 24;

const usable = (token: string) => ({ tokenHash: hashToken(token), usedAt: null, expiresAt: { [Op.gt]: new Date() } });

export async function requestSignUp(input: SignUpInput): Promise<void> {
  // Both branches hash, look up and write, so they take about as long.
  const passwordHash = await hashPassword(input.password);
  const owner = await User.findOne({ where: { email: input.email }, attributes: ["id", "name"] });
  if (!(await mayMail("sign-up", input.email))) return;
  await sequelize.transaction(async (transaction) => {
    if (owner) {
      await enqueueMail({ to: input.email, ...signUpAddressTakenMail({ name: owner.name }), priority: "account" }, transaction);
      return;
    }
    const { token, tokenHash } = newToken();
    await SignUpRequest.destroy({ where: { expiresAt: { [Op.lt]: new Date() } }, transaction });
    await SignUpRequest.create(
      {
        email: input.email,
        kind: input.kind,
        organisationName: input.organisationName,
        name: input.name,
        passwordHash,
        tokenHash,
        expiresAt: new Date(Date.now() + LINK_HOURS * 3_600_000),
        usedAt: null,
      },
      { transaction },
    );
    const mail = signUpConfirmMail({ name: input.name, organisationName: input.organisationName, token, hours: LINK_HOURS });
    await enqueueMail({ to: input.email, ...mail, priority: "account" }, transaction);
  });
}

/** The pending sign-up a link points to, if it can still be used. */
export function findUsableSignUp(token: string) {
  return SignUpRequest.findOne({ where: usable(token) });
}

/** Uses a sign-up link once (UPDATE … WHERE used_at IS NULL) and makes the account. */
export async function completeSignUp(token: string): Promise<User> {
  try {
    return await sequelize.transaction(async (transaction) => {
      const [count, rows] = await SignUpRequest.update({ usedAt: new Date() }, { where: usable(token), returning: true, transaction });
      if (count === 0) throw new FieldErrors({ token: ["This link has expired or was already used. Sign up again, or sign in."] });
      const request = rows[0];
      return createAccount(
        { kind: request.kind, organisationName: request.organisationName, name: request.name, email: request.email, passwordHash: request.passwordHash },
        transaction,
      );
    });
  } catch (error) {
    // The address got an account meanwhile (an earlier link, an invitation): only its owner reads this.
    if (error instanceof UniqueConstraintError) throw new FieldErrors({ token: [DUPLICATE_EMAIL] });
    throw error;
  }
}
