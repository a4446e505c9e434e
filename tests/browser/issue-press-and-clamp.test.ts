// Two axes a new buyer types into quick sizing, read on the page as a shop would price them: the
// 2 t platen pressing 150 kN over its last 30 mm (engine 1 gave it 45 kW, 172 L/min and 690 L),
// and a clamp that holds its load for 45 minutes (leak-tight holding, not a counterbalance valve
// alone). The figures are the engine's own, worked by hand in tests/unit/hydraulics/pump-choice.test.ts
// and worked-examples-v2.test.ts; here they must reach the page a buyer reads.
import path from "node:path";
import type { Page } from "playwright-core";
import { describe, expect, it } from "vitest";
import { SCREENSHOTS, browserAppForFile, openHydrated } from "../support/browser";

const app = browserAppForFile();

const keySize = (page: Page, label: string) => page.locator(`[data-key-size="${label}"]`).first().innerText();

/** A vertical axis, rod moving down, typed as a buyer would with units in the fields. */
async function typeAxis(page: Page, answers: Record<string, string>) {
  await page.getByLabel("Vertical").check();
  await page.getByRole("radio", { name: /^Down/ }).check();
  await page.getByText("More about the motion").click();
  for (const [label, value] of Object.entries(answers)) await page.getByLabel(label, { exact: true }).fill(value);
}

describe("the issue's press and a held clamp, typed into quick sizing", () => {
  it("sizes the 2 t / 150 kN press with a double pump: 11 kW, about 149 L/min and 600 L", { timeout: 120_000 }, async () => {
    const page = await app.newPage();
    await openHydrated(page, "/quick-sizing");
    // As pump-choice.test.ts works it: a platen on guides (flange, rod end fixed), returning at 200 mm/s.
    await page.getByRole("radio", { name: /^Flange, rod end fixed and guided/ }).check();
    await typeAxis(page, {
      "Moving mass": "2 t",
      "Working force at the end of the stroke": "150 kN",
      Stroke: "500",
      "Extending speed": "200",
      "Retracting speed": "200",
      "Pressing stroke": "30",
      "Pressing speed": "10",
      "Cycles per hour": "60",
    });
    await expect.poll(() => keySize(page, "Pump flow"), { timeout: 15_000 }).toMatch(/double pump/);
    // 125 bore · 200 mm/s = 147.3 L/min → sections 100 + 8 cm³/rev, 108 · 1450 · 0.95 = 148.8 L/min (continuity; ISO 3662 sizes)
    expect(await keySize(page, "Bore / rod")).toContain("Ø125 / Ø56 mm");
    expect(await keySize(page, "Pump flow")).toContain("148.8 L/min");
    expect(await keySize(page, "Pump flow")).toContain("double pump, 100 cm³/rev + 8 cm³/rev");
    // the 14.59 kW peak lasts seconds: it needs 14.59 / 1.5 = 9.72 kW of rating (short overload, IEC 60034-1 from memory), RMS within it → 11 kW (IEC 60072-1 size)
    expect(await keySize(page, "Motor rating")).toMatch(/^Motor rating\n11 kW\nneeds 9.72 kW/);
    // 4 × 148.8 L/min plus the oil the rod draws → 600 L (common practice)
    expect(await keySize(page, "Reservoir")).toContain("600 L");
    await page.screenshot({ path: path.join(SCREENSHOTS, "issue-press-2t.png"), fullPage: true });
    await page.context().close();
  });

  it("holds a clamp for 45 minutes with a pilot-operated check, not a counterbalance valve alone", { timeout: 120_000 }, async () => {
    const page = await app.newPage();
    await openHydrated(page, "/quick-sizing");
    await typeAxis(page, { "Moving mass": "300", "Working force at the end of the stroke": "40 kN", Stroke: "200", "Time the load is held at rest": "45" });
    const circuit = page.getByRole("img", { name: /circuit/i }).first();
    await expect.poll(async () => /Pilot-operated check/i.test((await circuit.textContent()) ?? ""), { timeout: 15_000 }).toBe(true);
    // Leak-tight: the poppet holds, the counterbalance valve behind it still brakes the descent.
    expect(await circuit.textContent()).toMatch(/holds the load leak-tight/);
    expect(await circuit.textContent()).toMatch(/Counterbalance valve/);
    await page.screenshot({ path: path.join(SCREENSHOTS, "issue-clamp-held.png"), fullPage: true });
    await page.context().close();
  });
});
