// Test data made through the app's own services, so tests exercise the real rules.
import { randomBytes } from "node:crypto";
import { Organisation, User } from "~/models/index.server";
import { hashPassword, signUp } from "~/services/accounts.server";
import type { Role } from "~/auth/roles";

export const PASSWORD = "correct-horse-battery";

export const uniqueEmail = (label = "user") => `${label}-${randomBytes(4).toString("hex")}@example.test`;

export async function makeMember(kind: "buyer" | "shop", overrides: Partial<{ email: string; organisationName: string }> = {}) {
  return signUp({
    kind,
    organisationName: overrides.organisationName ?? `${kind === "buyer" ? "Builder" : "Shop"} ${randomBytes(3).toString("hex")}`,
    name: `Test ${kind}`,
    email: overrides.email ?? uniqueEmail(kind),
    password: PASSWORD,
  });
}

/** Operator staff can't sign up; the seed or an admin makes them. */
export async function makeOperatorUser(role: Extract<Role, "admin" | "account_manager">) {
  const organisation = await Organisation.create({ name: `Operator ${randomBytes(3).toString("hex")}`, kind: "operator", region: null, accountManagerId: null });
  return User.create({
    organisationId: organisation.id,
    email: uniqueEmail(role),
    name: `Test ${role}`,
    passwordHash: await hashPassword(PASSWORD),
    role,
    lastSignInAt: null,
  });
}
