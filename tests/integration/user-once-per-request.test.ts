// The root loader and the page's loaders each ask who is signed in; the user is looked up once
// per request (app/auth/permissions.server.ts), not once per loader. Here the loaders are called
// in this process with one Request; reads-per-page.test.ts counts the same through the served
// app, where React Router hands each loader its own copy of the request.
import { afterEach, describe, expect, it, vi } from "vitest";
import { getOptionalUser, requireUser } from "~/auth/permissions.server";
import { User } from "~/models/index.server";
import * as root from "~/root";
import * as specs from "~/routes/specs";
import { makeMember } from "../support/factories";
import { call } from "../support/routes";
import { signedIn } from "../support/sessions";

describe("who is signed in, once per request", () => {
  afterEach(() => vi.restoreAllMocks());

  it("reads the user once for the root loader and the page's loader of one request", async () => {
    const user = await makeMember("buyer");
    const visitor = await signedIn(user);
    const lookups = vi.spyOn(User, "findByPk");
    const request = visitor.request("/specs");
    const [shell, page] = await Promise.all([call(root.loader, request), call(specs.loader, request)]);
    expect(shell.status).toBe(200);
    expect(page.status).toBe(200);
    expect(lookups).toHaveBeenCalledTimes(1);
    // the same answer to every later question in the request
    expect((await requireUser(request)).id).toBe(user.id);
    expect(lookups).toHaveBeenCalledTimes(1);
  });

  it("looks again for the next request, so a user deactivated meanwhile is out at once", async () => {
    const user = await makeMember("buyer");
    const visitor = await signedIn(user);
    expect((await getOptionalUser(visitor.request("/specs")))?.id).toBe(user.id);
    await User.update({ active: false }, { where: { id: user.id } });
    expect(await getOptionalUser(visitor.request("/specs"))).toBeNull();
  });
});
