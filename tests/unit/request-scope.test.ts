// What a request works out once (app/http/request-scope.server.ts): shared by every loader of a
// reading request, never carried over to the next request, and never shared across a state
// change, whose action may change what its loaders then read.
import { describe, expect, it } from "vitest";
import { inRequestScope, oncePerRequest, readOncePerRequest } from "~/http/request-scope.server";

const KEY = Symbol("a value");
const get = (path = "/") => new Request(`http://tenderflow.test${path}`);

function counter() {
  let made = 0;
  return { make: () => ++made, read: async () => ++made, made: () => made };
}

describe("inside a reading request's scope", () => {
  it("works a value out once for every copy of the request its loaders are handed", async () => {
    const c = counter();
    const request = get();
    await inRequestScope(request, async () => {
      // React Router hands each loader its own copy of the request.
      const copies = [new Request(request.url, { headers: request.headers }), new Request(request.url, { headers: request.headers })];
      expect(copies.map((copy) => oncePerRequest(KEY, copy, c.make))).toEqual([1, 1]);
      expect(await Promise.all([readOncePerRequest("spec s1 for u1", c.read), readOncePerRequest("spec s1 for u1", c.read)])).toEqual([2, 2]);
      expect(await readOncePerRequest("spec s2 for u1", c.read)).toBe(3);
    });
    expect(c.made()).toBe(3);
  });

  it("starts afresh for the next request", async () => {
    const c = counter();
    await inRequestScope(get(), async () => oncePerRequest(KEY, get(), c.make));
    await inRequestScope(get(), async () => oncePerRequest(KEY, get(), c.make));
    expect(c.made()).toBe(2);
  });

  it("keeps concurrent requests apart", async () => {
    const c = counter();
    const values = await Promise.all(
      [get("/a"), get("/b")].map((request) =>
        inRequestScope(request, async () => {
          await new Promise((r) => setTimeout(r, 5));
          return readOncePerRequest("the same key", c.read);
        }),
      ),
    );
    expect(values.sort()).toEqual([1, 2]);
  });
});

describe("outside a reading request's scope", () => {
  it("gives a state change no shared scope: each copy of its request works the value out again", async () => {
    const c = counter();
    const post = new Request("http://tenderflow.test/specs", { method: "POST" });
    await inRequestScope(post, async () => {
      expect(oncePerRequest(KEY, post, c.make)).toBe(1);
      expect(oncePerRequest(KEY, post, c.make)).toBe(1);
      expect(oncePerRequest(KEY, new Request(post.url, { method: "GET" }), c.make)).toBe(2);
      expect(await readOncePerRequest("spec s1 for u1", c.read)).toBe(3);
      expect(await readOncePerRequest("spec s1 for u1", c.read)).toBe(4);
    });
  });

  it("remembers a value per Request object when no middleware opened a scope (a test calling a loader)", () => {
    const c = counter();
    const request = get();
    expect([oncePerRequest(KEY, request, c.make), oncePerRequest(KEY, request, c.make), oncePerRequest(KEY, get(), c.make)]).toEqual([1, 1, 2]);
  });
});
