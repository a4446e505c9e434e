// The operator's side in a browser: the admin sees a new machine builder nobody follows and
// assigns it; the account manager opens the account, keeps a note and edits it; a refund asks
// with the amount spelled out before any money moves; the admin filters the audit log.
import path from "node:path";
import { describe, expect, it } from "vitest";
import { Organisation, Payment } from "~/models/index.server";
import { signUp } from "~/services/accounts.server";
import { newAttempt } from "~/services/payments.server";
import { spelledMoney } from "~/content/refund";
import { PASSWORD, makeJob, makeMember, makeOperatorUser, uniqueEmail } from "../support/factories";
import { SCREENSHOTS, browserAppForFile, hydrated, signedInPage, openHydrated } from "../support/browser";

const app = browserAppForFile();
const LAPTOP = { width: 1366, height: 768 };

const shot = (page: { screenshot(o: { path: string; fullPage: boolean }): Promise<unknown> }, name: string) =>
  page.screenshot({ path: path.join(SCREENSHOTS, `operator-${name}.png`), fullPage: true });

describe("the operator's side", () => {
  it("assigns a new machine builder, keeps notes on the account, asks before a refund and finds it all in the audit log", { timeout: 120_000 }, async () => {
    const admin = await makeOperatorUser("admin");
    const manager = await makeOperatorUser("account_manager");
    await manager.update({ name: "Rosalind Achterberg" });
    const newcomer = await signUp({
      kind: "buyer",
      organisationName: "Trevose Cider Presses",
      name: "Jory Trevose",
      email: uniqueEmail("jory"),
      password: PASSWORD,
    });

    // Every account manager's dashboard shows it too, until an admin assigns it.
    const managerPage = await signedInPage(app, manager.email, "**/jobs", { viewport: LAPTOP });
    await expect.poll(() => managerPage.getByRole("listitem").filter({ hasText: "Trevose Cider Presses" }).textContent()).toContain("unassigned");
    await shot(managerPage, "0-dashboard-unassigned");

    // The admin's home lists the newcomer as unassigned; choosing a manager takes it off the list.
    const adminPage = await signedInPage(app, admin.email, "**/admin/users", { viewport: LAPTOP });
    const card = adminPage.getByRole("listitem").filter({ hasText: "Trevose Cider Presses" });
    await expect.poll(() => card.textContent()).toContain("unassigned");
    await shot(adminPage, "1-unassigned");
    await card.getByLabel("Account manager for Trevose Cider Presses").selectOption({ label: "Rosalind Achterberg" });
    await card.getByRole("button", { name: "Save" }).click();
    await expect.poll(() => adminPage.getByRole("status").textContent()).toContain("Account manager assigned");
    await expect.poll(() => card.count()).toBe(0);
    expect((await Organisation.findByPk(newcomer.organisationId, { rejectOnEmpty: true })).accountManagerId).toBe(manager.id);

    // The manager's account view: notes added and edited, with who and when.
    await openHydrated(managerPage, `/accounts/${newcomer.organisationId}`);
    await managerPage.getByLabel("Add a note").fill("Jory wants a press for the autumn harvest; call in August.");
    await managerPage.getByRole("button", { name: "Add the note" }).click();
    await expect.poll(() => managerPage.getByRole("status").textContent()).toContain("Note added");
    await managerPage.getByText("Edit", { exact: true }).click();
    await managerPage.getByLabel("Edit the note").fill("Jory wants a press for the autumn harvest; call in July.");
    await managerPage.getByRole("button", { name: "Save the note" }).click();
    const edited = managerPage.getByRole("listitem").filter({ hasText: /edited by Rosalind Achterberg/ });
    await expect.poll(() => edited.count()).toBe(1);
    expect(await edited.locator("p").first().textContent()).toBe("Jory wants a press for the autumn harvest; call in July.");
    await shot(managerPage, "2-account-notes");

    // A refund: the amount and reason first, then the question with the amount spelled out.
    const buyer = await makeMember("buyer", { organisationName: "Rotherby Presses" });
    await Organisation.update({ accountManagerId: manager.id }, { where: { id: buyer.organisationId } });
    const { job } = await makeJob(buyer, await makeMember("shop"));
    const payment = await Payment.create(newAttempt(job, buyer.id));
    await payment.update({ status: "paid", paidAt: new Date(), paymentIntentId: "pi_operator_demo" });
    await openHydrated(managerPage, `/jobs/${job.id}`);
    // An empty amount is not "everything": the field is required (and the server says so too).
    expect(await managerPage.getByLabel(`Amount (${job.currency})`).getAttribute("required")).not.toBeNull();
    await managerPage.getByLabel(`Amount (${job.currency})`).fill("1250");
    await managerPage.getByLabel(/^Reason/).fill("Guard rails left off the order");
    await managerPage.getByRole("button", { name: "Continue" }).click();
    const question = `Refund ${spelledMoney(125_000, job.currency)} of the ${spelledMoney(payment.amountCents, job.currency)} retainer to Rotherby Presses?`;
    await expect.poll(() => managerPage.getByText(question).count()).toBe(1);
    await managerPage.getByRole("button", { name: "Yes, refund" }).scrollIntoViewIfNeeded();
    await shot(managerPage, "3-refund-question");
    // Going back keeps what was typed.
    await managerPage.getByRole("button", { name: "Change the amount" }).click();
    await expect.poll(() => managerPage.getByLabel(`Amount (${job.currency})`).inputValue()).toBe("1250");

    // The newcomer fills in its company profile; its contact for quotes is on the manager's account view.
    const buyerPage = await signedInPage(app, newcomer.email, "**/specs", { viewport: LAPTOP });
    await openHydrated(buyerPage, "/settings");
    await buyerPage.getByLabel("Region").fill("UK — Cornwall");
    await buyerPage.getByLabel("Tax number (VAT)").fill("not a tax number!");
    await buyerPage.getByRole("button", { name: "Save the profile" }).click();
    await expect.poll(() => buyerPage.getByText(/A tax number has letters, digits/).count()).toBe(1);
    await buyerPage.getByLabel("Tax number (VAT)").fill("GB 987 6543 21");
    await buyerPage.getByRole("group", { name: "Contact for quotes" }).getByLabel("Name").fill("Jory Trevose");
    await buyerPage.getByRole("group", { name: "Contact for quotes" }).getByLabel("E-mail address").fill("presses@trevose.test");
    await buyerPage.getByRole("button", { name: "Save the profile" }).click();
    await expect.poll(() => buyerPage.getByRole("status").textContent()).toContain("Company profile saved");
    await shot(buyerPage, "6-settings-profile");
    await managerPage.goto(`/accounts/${newcomer.organisationId}`);
    await expect.poll(() => managerPage.getByRole("region", { name: "Trevose Cider Presses" }).textContent()).toContain("presses@trevose.test");

    // The audit log, filtered to assignments, names who assigned whom.
    await adminPage.goto("/admin/users");
    await adminPage.getByRole("link", { name: "Audit log" }).click();
    await adminPage.waitForURL("**/admin/audit");
    await hydrated(adminPage);
    await adminPage.getByLabel("What happened").selectOption({ label: "Account manager assigned" });
    await adminPage.getByRole("button", { name: "Filter" }).click();
    await adminPage.waitForURL("**/admin/audit?action=account-manager-assigned*");
    const row = adminPage.getByRole("row").filter({ hasText: "Trevose Cider Presses" });
    await expect.poll(() => row.textContent()).toContain("manager: Rosalind Achterberg");
    await shot(adminPage, "4-audit-filtered");
    await adminPage.goto("/admin/audit?from=2026-02-30");
    await expect.poll(() => adminPage.getByText(/From: that is not a date on the calendar/).count()).toBe(1);
    // What was typed stays in the field to be put right.
    expect(await adminPage.getByLabel("From (day, UTC)").inputValue()).toBe("2026-02-30");
    await shot(adminPage, "5-audit-impossible-date");
  });
});
