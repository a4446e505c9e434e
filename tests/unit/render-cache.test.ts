// The per-worker cache of what never changes (app/services/render-cache.server.ts).
import { describe, expect, it } from "vitest";
import { readOnce, renderedOnce } from "~/services/render-cache.server";

describe("the render cache", () => {
  it("renders a fragment once per key", () => {
    let renders = 0;
    const render = () => `<p>${++renders}</p>`;
    expect([renderedOnce("unit:a", render), renderedOnce("unit:a", render), renderedOnce("unit:b", render)]).toEqual(["<p>1</p>", "<p>1</p>", "<p>2</p>"]);
  });

  it("forgets the least recently used fragment first once full", () => {
    let renders = 0;
    const render = () => String(++renders);
    renderedOnce("unit:first", render);
    for (let i = 0; i < 500; i++) renderedOnce(`unit:filler-${i}`, render);
    expect(renderedOnce("unit:first", render)).toBe(String(renders));
  });

  it("reads a record once, shared by readers that ask while it is being read", async () => {
    let reads = 0;
    const read = async () => ({ n: ++reads });
    const [a, b] = await Promise.all([readOnce("unit:record", read), readOnce("unit:record", read)]);
    expect(a).toBe(b);
    expect(reads).toBe(1);
  });

  it("keeps no failed read: the next reader tries again", async () => {
    let reads = 0;
    const read = async () => {
      if (++reads === 1) throw new Error("the database is restarting");
      return "read";
    };
    await expect(readOnce("unit:flaky", read)).rejects.toThrow("restarting");
    await new Promise((r) => setTimeout(r, 0));
    expect(await readOnce("unit:flaky", read)).toBe("read");
  });
});
