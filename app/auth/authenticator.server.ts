import { Authenticator } from "remix-auth";
import { FormStrategy } from "remix-auth-form";
import { signInSchema } from "~/schemas/account";
import { verifyCredentials } from "~/services/accounts.server";
import type { User } from "~/models/index.server";

// The form was validated with the same schema before authenticate() is called; parsing again
// here keeps the strategy safe on its own.
export const authenticator = new Authenticator<User>();

authenticator.use(
  new FormStrategy(async ({ form }) => {
    const { email, password } = signInSchema.parse(Object.fromEntries(form));
    return verifyCredentials(email, password);
  }),
  "form",
);
