import { Authenticator } from "remix-auth";
import { FormStrategy } from "remix-auth-form";
import { signInSchema } from "~/schemas/account";
import { SignInError, verifyCredentials } from "~/services/accounts.server";
import { recordAudit } from "~/services/audit.server";
import type { User } from "~/models/index.server";

// The form was validated with the same schema before authenticate() is called; parsing again
// here keeps the strategy safe on its own.
export const authenticator = new Authenticator<User>();

authenticator.use(
  new FormStrategy(async ({ form }) => {
    const { email, password } = signInSchema.parse(Object.fromEntries(form));
    // Every answer to a password is logged (never the password): the address as typed when it fails.
    try {
      const user = await verifyCredentials(email, password);
      await recordAudit({ actor: user, action: "sign-in", subject: { type: "user", id: user.id, label: user.name } });
      return user;
    } catch (error) {
      if (error instanceof SignInError) await recordAudit({ actor: { typedEmail: email }, action: "sign-in-failed", details: { reason: error.reason } });
      throw error;
    }
  }),
  "form",
);
