// Two app servers on one database and one object store, behind a round-robin proxy (issue 16):
// a whole deal in a real browser while requests alternate between them — a drawing uploaded
// through one server and downloaded through either, the bid, the award and its mail — then one
// server stops and the retainer is paid by card through the survivor, its webhook coming in
// through the proxy. Both servers run the mail sender: each mail arrives exactly once.
import { readFile } from "node:fs/promises";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { QueryTypes } from "sequelize";
import { Job, OutboxMail, sequelize, type Spec, type User } from "~/models/index.server";
import { startStripeFake, type StripeFake } from "../../fakes/stripe";
import { fillOfferTerms } from "../support/bid-page";
import { SCREENSHOTS, hydrated, signInAs, startBrowserApp, type BrowserApp } from "../support/browser";
import { fillCard } from "../support/card-page";
import { PASSWORD, makeCompleteDraft, makeMember } from "../support/factories";
import { mailsTo, waitForMail } from "../support/mailbox";
import { startServerPair, type ServerPair } from "../support/server-pair";

let pair: ServerPair;
let app: BrowserApp;
let fake: StripeFake;
let buyer: User;
let shop: User;
let draft: Spec;
const TITLE = "Scrap baler, twin-server ram";
const SHOP_NAME = "Halden Fluid Power";
const DRAWING = Buffer.from("%PDF-1.7\n% Ram mounting, drawing TF-HA-01\n1 0 obj << /Type /Catalog >> endobj\n%%EOF\n");

beforeAll(async () => {
  // This file's own card service: its webhooks go to the proxy, like Stripe's to a load balancer.
  fake = await startStripeFake({ webhookSecret: process.env.STRIPE_WEBHOOK_SECRET! });
  buyer = await makeMember("buyer", { organisationName: "Rookwood Recycling Machines" });
  shop = await makeMember("shop", { organisationName: SHOP_NAME });
  draft = await makeCompleteDraft(buyer, { machine: { title: TITLE } });
  pair = await startServerPair({ STRIPE_API_URL: fake.url });
  fake.setWebhookUrl(`${pair.baseUrl}/webhooks/stripe`);
  app = await startBrowserApp(pair);
}, 180_000);
afterAll(async () => {
  await app?.close();
  await fake?.close();
});

const shot = (page: Page, name: string) => page.screenshot({ path: path.join(SCREENSHOTS, `two-servers-${name}.png`), fullPage: true });

/**
 * How many copies of a mail reached the inbox, counted once its outbox row is sent and its
 * pg-boss job completed: then no server holds it any more, so a second copy would be there too.
 */
async function copiesDelivered(to: string, subject: string) {
  const delivered = async () => {
    const row = await OutboxMail.findOne({ where: { to, subject } });
    if (row?.status !== "sent" || !row.jobId) return false;
    const [job] = await sequelize.query<{ state: string }>("SELECT state FROM pgboss.job WHERE id = :id", {
      replacements: { id: row.jobId },
      type: QueryTypes.SELECT,
    });
    return job?.state === "completed";
  };
  await expect.poll(delivered, { timeout: 30_000 }).toBe(true);
  expect(await OutboxMail.count({ where: { to, subject } })).toBe(1);
  await waitForMail(to, subject, 10_000);
  return (await mailsTo(to)).filter((m) => m.subject === subject).length;
}

describe("two servers behind one address", () => {
  it("upload, publish, download, bid, award and mail alternate between servers; paying goes on after one stops", { timeout: 360_000 }, async () => {
    // The buyer adds a drawing on the quotation step and publishes.
    const buyerPage = await app.newPage();
    await signInAs(buyerPage, buyer.email, PASSWORD);
    await buyerPage.waitForURL("**/specs");
    await buyerPage.goto(`/specs/${draft.id}/edit/quotation`);
    await hydrated(buyerPage);
    await buyerPage.locator("[data-enhanced]").waitFor(); // the uploader is a chunk of its own: hydrated once it is there
    await buyerPage.getByLabel("Drawings and photos").setInputFiles({ name: "ram mounting.pdf", mimeType: "application/pdf", buffer: DRAWING });
    await expect.poll(() => buyerPage.getByRole("link", { name: "ram mounting.pdf" }).count(), { timeout: 15_000 }).toBeGreaterThan(0);
    await buyerPage.getByRole("button", { name: "Save and continue →" }).click();
    await buyerPage.waitForURL("**/edit/review");
    await hydrated(buyerPage);
    await expect.poll(() => buyerPage.getByRole("link", { name: "ram mounting.pdf" }).count(), { timeout: 15_000 }).toBe(1);
    await buyerPage.getByLabel(/I have read the cautions/).check();
    await buyerPage.getByRole("button", { name: "Publish for bids" }).click();
    await buyerPage.waitForURL("**/specs/*?published=1");
    await expect.poll(() => buyerPage.getByText("Open for bids").count(), { timeout: 15_000 }).toBeGreaterThan(0);

    // The shop finds it, downloads the drawing (the same bytes, whichever server stored or reads
    // it) and submits an offer.
    const shopPage = await app.newPage();
    await signInAs(shopPage, shop.email, PASSWORD);
    await shopPage.waitForURL("**/open-specs");
    await shopPage.getByRole("link", { name: TITLE }).click();
    await shopPage.waitForURL(`**/specs/${draft.id}`);
    const drawingLink = shopPage.getByRole("link", { name: "ram mounting.pdf" }).first();
    await expect.poll(() => drawingLink.count(), { timeout: 15_000 }).toBe(1);
    // Downloaded until each server has sent it once (round robin: two or three clicks), so one
    // of them read a file the other stored.
    const href = (await drawingLink.getAttribute("href"))!;
    const served = () => pair.servers.map((server) => server.logs.join("").includes(`GET ${href} 200`));
    for (let i = 0; i < 4 && !served().every(Boolean); i++) {
      const [download] = await Promise.all([shopPage.waitForEvent("download"), drawingLink.click()]);
      expect(download.suggestedFilename()).toBe("ram mounting.pdf");
      expect(Buffer.compare(await readFile((await download.path())!), DRAWING)).toBe(0);
    }
    expect(served()).toEqual([true, true]);
    await shot(shopPage, "shop-spec");
    await shopPage.getByRole("link", { name: "Start a bid" }).click();
    await shopPage.waitForURL(`**/specs/${draft.id}/bid`);
    await hydrated(shopPage);
    const prices = shopPage.locator('input[name$=".unitPrice"]');
    await expect.poll(() => prices.count(), { timeout: 15_000 }).toBeGreaterThan(3);
    for (let i = 0; i < (await prices.count()); i++) await prices.nth(i).fill(i === 0 ? "2600" : "180");
    await fillOfferTerms(shopPage, "10");
    await shopPage.getByRole("button", { name: "Submit the offer" }).click();
    await expect.poll(() => shopPage.getByText(/^Offer 1 sent/).count(), { timeout: 15_000 }).toBe(1);

    // The buyer awards; the shop's mail arrives.
    await buyerPage.goto(`/specs/${draft.id}/bids`);
    await hydrated(buyerPage);
    await expect.poll(() => buyerPage.getByTestId("comparison").textContent(), { timeout: 15_000 }).toContain(SHOP_NAME);
    await buyerPage
      .getByRole("link", { name: `Award to ${SHOP_NAME}` })
      .first()
      .click();
    await buyerPage.getByText(`I award this spec to ${SHOP_NAME}.`).click();
    await buyerPage.getByRole("button", { name: "Confirm the award" }).click();
    await buyerPage.waitForURL("**/jobs/*");
    await hydrated(buyerPage);
    const job = await Job.findOne({ where: { specId: draft.id }, rejectOnEmpty: true });
    const chosen = await waitForMail(shop.email, `Your bid was chosen: ${TITLE}`, 30_000);
    expect(chosen.text).toContain(`${pair.baseUrl}/jobs/${job.id}`);

    // Both servers took part; then one stops and the other carries on alone.
    expect(pair.answered[0]).toBeGreaterThan(0);
    expect(pair.answered[1]).toBeGreaterThan(0);
    await pair.stopServer(0);
    const answeredByStopped = pair.answered[0];
    const answeredBySurvivor = pair.answered[1];

    // The retainer, by card: the fake's page, back to the app, the webhook through the proxy.
    await buyerPage.goto(`/jobs/${job.id}`);
    await hydrated(buyerPage);
    await buyerPage.getByRole("button", { name: /^Pay the retainer of/ }).click();
    await buyerPage.waitForURL(`${fake.url}/checkout/**`);
    await fillCard(buyerPage, "4242 4242 4242 4242");
    await buyerPage.waitForURL(`**/jobs/${job.id}/payment?session_id=*`);
    await expect.poll(() => buyerPage.getByText(/the retainer of .* has been received/).count(), { timeout: 30_000 }).toBe(1);
    await buyerPage.getByRole("link", { name: "Back to the job" }).click();
    await buyerPage.waitForURL(`**/jobs/${job.id}`);
    await expect.poll(() => buyerPage.getByText(/^Paid \d/).count(), { timeout: 15_000 }).toBeGreaterThan(0);
    expect((await job.reload()).retainerPaidAt).not.toBeNull();
    // The card service's signed webhook reached a server through the proxy and was taken.
    await expect.poll(() => fake.deliveries.some((d) => d.type === "checkout.session.completed" && d.status === 200), { timeout: 15_000 }).toBe(true);
    await shot(buyerPage, "retainer-paid");
    expect(pair.answered[0]).toBe(answeredByStopped);
    expect(pair.answered[1]).toBeGreaterThan(answeredBySurvivor);

    // Every mail of the deal was sent once, though both servers ran the sender.
    const receipt = await waitForMail(buyer.email, "Receipt: retainer of", 30_000);
    expect(await copiesDelivered(buyer.email, receipt.subject)).toBe(1);
    expect(await copiesDelivered(shop.email, `Your bid was chosen: ${TITLE}`)).toBe(1);
    expect(await copiesDelivered(shop.email, `New spec open for bids: ${TITLE}`)).toBe(1);
  });
});
