// What one page view asks of the database, counted from the statements the app's real server
// prints with LOG_SQL=on (the production build: its root middleware, and React Router handing
// each loader its own copy of the request). Who is signed in is read once per view, however many
// loaders ask; a spec or job the page's panels each check is read once; and a published
// revision's design, which never changes, is read once per worker, not on every view.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Job, Spec, User } from "~/models/index.server";
import { makeJob, makeMember, makePublishedSpec } from "../support/factories";
import { sendAs, startHttpApp, type HttpApp } from "../support/http-app";
import { signedIn } from "../support/sessions";

let app: HttpApp;
let buyer: User, shop: User;
let buyerCookie: string, shopCookie: string;
let spec: Spec, job: Job;

beforeAll(async () => {
  buyer = await makeMember("buyer");
  shop = await makeMember("shop");
  spec = await makePublishedSpec(buyer);
  ({ job } = await makeJob(buyer, shop));
  const cookieOf = async (user: User) => (await signedIn(user)).request("/").headers.get("Cookie")!;
  [buyerCookie, shopCookie] = await Promise.all([cookieOf(buyer), cookieOf(shop)]);
  app = await startHttpApp({ LOG_SQL: "on" });
}, 240_000);

afterAll(async () => {
  await app?.close();
});

/** The SQL statements the server sent while answering one GET of `path` (the request log line closes them). */
async function statementsOf(cookie: string, path: string): Promise<string[]> {
  const from = app.logs.join("").length;
  const response = await sendAs(app, cookie, path);
  expect(response.status).toBe(200);
  await response.arrayBuffer();
  const logged = () => app.logs.join("").slice(from);
  // morgan writes the request's line once the response is finished; its statements come before it.
  await expect.poll(() => logged().includes(`GET ${path} 200`)).toBe(true);
  const output = logged();
  return output
    .slice(0, output.indexOf(`GET ${path} 200`))
    .split("\n")
    .filter((line) => line.startsWith("Executing ("));
}

const matching = (statements: string[], pattern: RegExp) => statements.filter((s) => pattern.test(s));
const SESSION_READ = /^Executing \(\w+\): SELECT .* FROM "sessions" AS "UserSession"/;
const USER_READ = /^Executing \(\w+\): SELECT .* FROM "users" AS "User" LEFT OUTER JOIN "organisations"/;

describe("reads per page view", () => {
  it("reads the session and the signed-in user once, though the root loader and the page's loader both ask", async () => {
    const statements = await statementsOf(buyerCookie, "/specs");
    expect(matching(statements, SESSION_READ)).toHaveLength(1);
    expect(matching(statements, USER_READ)).toHaveLength(1);
  });

  it("reads a spec once for the panels that each check it, and its published design once per worker", async () => {
    const path = `/specs/${spec.id}`;
    const specRead = new RegExp(`FROM "specs" AS "Spec" WHERE .*"Spec"."id" = '${spec.id}'`);
    const designRead = /SELECT "id", "axes", "machine" FROM "spec_revisions"/;
    const first = await statementsOf(buyerCookie, path);
    expect(matching(first, SESSION_READ)).toHaveLength(1);
    expect(matching(first, USER_READ)).toHaveLength(1);
    expect(matching(first, specRead)).toHaveLength(1);
    expect(matching(first, designRead)).toHaveLength(1);
    // The list of revisions comes without their designs.
    expect(matching(first, /FROM "spec_revisions"/).filter((s) => /"axes"|"machine"/.test(s))).toHaveLength(1);

    const again = await statementsOf(buyerCookie, path);
    expect(matching(again, specRead)).toHaveLength(1);
    expect(matching(again, designRead)).toHaveLength(0);
  });

  it("reads a job once for the payment, balance and handover panels of its page", async () => {
    const statements = await statementsOf(shopCookie, `/jobs/${job.id}`);
    expect(matching(statements, SESSION_READ)).toHaveLength(1);
    expect(matching(statements, USER_READ)).toHaveLength(1);
    // jobFor reads the job with its parties; the panels share one plain read of it.
    const plainJobReads = matching(statements, new RegExp(`FROM "jobs" AS "Job" WHERE .*"Job"."id" = '${job.id}'`));
    expect(plainJobReads).toHaveLength(1);
  });
});
