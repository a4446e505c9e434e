// A shop and a machine builder in a real browser: the shop finds a spec through the open-specs
// filters, reads what to quote, asks a question (an empty one is refused beside the box); the
// buyer sees who asked and answers; the shop reads the answer. A screenshot of each page.
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { Organisation, type Spec, type User } from "~/models/index.server";
import { makePublishedSpec } from "../support/factories";
import { makeBuyerAndShop } from "../support/parties";
import { SCREENSHOTS, browserAppForFile, hydrated, openHydrated, signedInPage } from "../support/browser";

let buyer: User;
let shop: User;
let spec: Spec;

beforeAll(async () => {
  ({ buyer, shop } = await makeBuyerAndShop({ buyer: "Larkspur Balers", shop: "Quarry Lane Hydraulics" }));
  await Organisation.update({ region: "UK — Yorkshire" }, { where: { id: buyer.organisationId } });
  await makePublishedSpec(buyer, { machine: { title: "Baler ram, main stroke" }, quotation: { notes: "Paint RAL 7035." } });
  spec = await makePublishedSpec(buyer, { machine: { title: "Coil car lift" }, quotation: { deliveryRegion: "UK — Humber" } });
});
const app = browserAppForFile();

const shot = (page: Page, name: string) => page.screenshot({ path: path.join(SCREENSHOTS, `questions-${name}.png`), fullPage: true });
/** One card of the spec page, by its heading. */
const card = (page: Page, heading: string, name: string) =>
  page
    .locator("section")
    .filter({ has: page.getByRole("heading", { name: heading, exact: true }) })
    .screenshot({ path: path.join(SCREENSHOTS, `questions-${name}.png`) });
const toast = (page: Page) => page.getByRole("status").filter({ hasText: /Question sent|Answer published/ });

describe("questions on a spec", () => {
  it("a shop filters, asks, the buyer answers and the shop reads the answer", { timeout: 120_000 }, async () => {
    const shopPage = await signedInPage(app, shop.email, "**/open-specs");
    await hydrated(shopPage);
    await shopPage.getByLabel("Delivered to").fill("humber");
    await shopPage.getByRole("button", { name: "Apply" }).click();
    await shopPage.waitForURL("**/open-specs?*region=humber*");
    await expect.poll(() => shopPage.getByRole("link", { name: "Coil car lift" }).count()).toBe(1);
    await expect.poll(() => shopPage.getByRole("link", { name: "Baler ram, main stroke" }).count()).toBe(0);
    await shot(shopPage, "1-open-specs-filtered");

    // The size filters are folded until used; a refused one stays open with what was typed.
    await shopPage.getByText("Filter by relief setting and pump flow").click();
    await shopPage.getByLabel("Relief setting from (bar)").fill("many");
    await shopPage.getByRole("button", { name: "Apply" }).click();
    await expect.poll(() => shopPage.getByRole("alert").textContent()).toContain("enter a number");
    expect(await shopPage.getByLabel("Relief setting from (bar)").inputValue()).toBe("many");

    // On a phone the list starts on the first screen, below the filters.
    await shopPage.setViewportSize({ width: 390, height: 844 });
    await openHydrated(shopPage, "/open-specs");
    const firstSpec = (await shopPage.getByRole("link", { name: "Coil car lift" }).boundingBox())!;
    expect(firstSpec.y + firstSpec.height).toBeLessThanOrEqual(844);
    await shopPage.setViewportSize({ width: 1280, height: 720 });

    await shopPage.getByRole("link", { name: "Coil car lift" }).click();
    await shopPage.waitForURL(`**/specs/${spec.id}`);
    await hydrated(shopPage);
    await expect.poll(() => shopPage.getByRole("heading", { name: "The machine and what to quote" }).count()).toBe(1);

    // The page's header leads to the question box, below the whole design.
    await shopPage.getByRole("link", { name: "Ask a question" }).click();
    // Scrolled into the window (its box starts inside the 720 px height), not just on the page.
    await expect
      .poll(async () => {
        const box = await shopPage.getByLabel("Ask the machine builder").boundingBox();
        return box !== null && box.y >= 0 && box.y < 720;
      })
      .toBe(true);
    await expect.poll(() => shopPage.evaluate(() => location.hash)).toBe("#ask-question");

    // An empty question is refused beside the box; a real one is sent.
    await shopPage.getByRole("button", { name: "Send the question" }).click();
    await expect.poll(() => shopPage.getByText("Write your question first.").count()).toBe(1);
    const question = "Can the power unit stand on the mezzanine, 6 m above the lift?";
    await shopPage.getByLabel("Ask the machine builder").fill(question);
    await shopPage.getByRole("button", { name: "Send the question" }).click();
    await expect.poll(() => toast(shopPage).count()).toBe(1);
    await expect.poll(() => shopPage.getByText(question).count()).toBe(1);
    expect(await shopPage.getByText("Your question").count()).toBe(1);
    expect(await shopPage.getByLabel("Ask the machine builder").inputValue()).toBe("");
    await shot(shopPage, "2-shop-asked");
    await card(shopPage, "The machine and what to quote", "2a-what-to-quote");
    await card(shopPage, "Questions and answers", "2b-shop-panel");

    const buyerPage = await signedInPage(app, buyer.email, "**/specs");
    // The waiting question shows where the buyer looks first: the list of specs, then the top of the spec.
    await buyerPage.getByRole("link", { name: "1 question waiting for your answer" }).click();
    await buyerPage.waitForURL(`**/specs/${spec.id}#questions`);
    await hydrated(buyerPage);
    await expect.poll(() => buyerPage.getByText("1 question from shops waits for your answer").count()).toBe(1);
    await expect.poll(() => buyerPage.getByText("Quarry Lane Hydraulics asked").count()).toBe(1);
    await buyerPage.getByLabel("Your answer").fill("Yes; allow 8 m of pressure line along the rail.");
    await buyerPage.getByRole("button", { name: "Publish the answer" }).click();
    await expect.poll(() => toast(buyerPage).count()).toBe(1);
    await expect.poll(() => buyerPage.getByLabel("Change your answer").inputValue()).toBe("Yes; allow 8 m of pressure line along the rail.");
    await shot(buyerPage, "3-buyer-answered");
    await card(buyerPage, "Questions and answers", "3b-buyer-panel");

    await shopPage.reload();
    await expect.poll(() => shopPage.getByText("Yes; allow 8 m of pressure line along the rail.").count()).toBe(1);
    expect(await shopPage.getByText("Quarry Lane Hydraulics asked").count()).toBe(0);
    await shot(shopPage, "4-shop-reads-answer");
    await card(shopPage, "Questions and answers", "4b-shop-panel");
    await shopPage.context().close();
    await buyerPage.context().close();
  });
});
