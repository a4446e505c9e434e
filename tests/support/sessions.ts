// Signing in for integration tests: one way, through the real sign-in form, so every test's
// session is made exactly as a person's is.
import { expect } from "vitest";
import * as signInRoute from "~/routes/sign-in";
import { PASSWORD } from "./factories";
import { Visitor } from "./routes";

/** Signs `visitor` in as `user` and checks the form let them in; its answer, for tests that read the cookie. */
export async function signInAs(visitor: Visitor, user: { email: string }, password = PASSWORD) {
  const res = await visitor.post(signInRoute.action, "/sign-in", { email: user.email, password });
  expect(res.status, `signing in ${user.email}`).toBe(302);
  return res;
}

/** A fresh browser signed in as `user`. */
export async function signedIn(user: { email: string }, password = PASSWORD): Promise<Visitor> {
  const visitor = new Visitor();
  await signInAs(visitor, user, password);
  return visitor;
}
