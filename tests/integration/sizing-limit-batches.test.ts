import { describe, expect, it, vi } from "vitest";

// An allowance large enough for a worker to take its requests five at a time; set before the app reads its env.
vi.hoisted(() => {
  process.env.SIZING_REQUESTS_PER_MINUTE = "100";
});

import { RouterContextProvider } from "react-router";
import { sequelize } from "~/db.server";
import { consumeSizingRequest } from "~/services/rate-limit.server";
import { serverContext } from "../support/routes";

const ask = (address: string) =>
  consumeSizingRequest({
    request: new Request("http://127.0.0.1:3000/api/v1/sizing", { method: "POST" }),
    context: serverContext(address) as RouterContextProvider,
  });

/** The shared count PostgreSQL holds for a client. */
async function sharedCount(address: string) {
  const [rows] = await sequelize.query(`SELECT points FROM rate_limits WHERE key = 'sizing:client:${address}'`);
  return (rows as { points: number }[])[0]?.points ?? 0;
}

describe("the sizing limit, taken from the shared count a few requests at a time", () => {
  it("takes five per round trip, answers exactly the limit and refuses the next", async () => {
    const address = "198.51.100.20";
    expect(await ask(address)).toEqual({ ok: true });
    // One request answered, five taken from the shared count for this worker.
    expect(await sharedCount(address)).toBe(5);
    for (let i = 0; i < 4; i++) await ask(address);
    expect(await sharedCount(address)).toBe(5);

    let answered = 5;
    while ((await ask(address)).ok) answered++;
    expect(answered).toBe(100);
    expect(await sharedCount(address)).toBeGreaterThanOrEqual(100);
    expect(await ask(address)).toMatchObject({ ok: false });
  });

  it("near the limit takes only what is left, so no request of the window is lost", async () => {
    const address = "198.51.100.21";
    // Another worker has used 97 of the 100 (taken straight from the shared count).
    await sequelize.query(`INSERT INTO rate_limits (key, points, expire) VALUES ('sizing:client:${address}', 97, ${Date.now() + 60_000})`);
    const answers = [await ask(address), await ask(address), await ask(address), await ask(address)];
    expect(answers.map((a) => a.ok)).toEqual([true, true, true, false]);
  });
});
