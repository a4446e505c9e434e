// Smoke test in a real browser: each demo role signs in and sees its own home and navigation.
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { sequelize } from "~/db.server";
import { DEMO_PASSWORD, seedDemo } from "../../db/seeds/demo";
import { PHONE, SCREENSHOTS, browserAppForFile, signInAs, signedInPage } from "../support/browser";

beforeAll(async () => {
  await seedDemo(sequelize);
}, 120_000);
const app = browserAppForFile();

const ROLES = [
  { role: "buyer", email: "priya@kestrel-forming.test", path: "/specs", heading: "My specs", nav: ["My specs", "Jobs", "Payments", "Team", "Quick sizing"] },
  { role: "shop", email: "aled@ironbridge-fluid.test", path: "/open-specs", heading: "Open specs", nav: ["Open specs", "Jobs", "Team", "Quick sizing"] },
  {
    role: "account manager",
    email: "nadia@tenderflow.test",
    path: "/jobs",
    heading: "Job dashboard",
    nav: ["Job dashboard", "Payments", "My accounts", "Quick sizing"],
  },
  {
    role: "admin",
    email: "felix@tenderflow.test",
    path: "/admin/users",
    heading: "Users",
    nav: ["Users", "Organisations", "Mail", "Jobs", "Payments", "Operator team", "Quick sizing"],
  },
];

describe("each demo role signs in and sees its home", () => {
  it.each(ROLES)("$role", async ({ role, email, path: home, heading, nav }) => {
    const page = await signedInPage(app, email, `**${home}`, { password: DEMO_PASSWORD, viewport: { width: 1366, height: 768 } });
    await expect.poll(() => page.getByRole("heading", { level: 1 }).textContent()).toBe(heading);
    const links = await page.getByRole("navigation", { name: "Main" }).getByRole("link").allTextContents();
    expect(links).toEqual(nav);
    // On a laptop screen the menu is one row, even the admin's seven pages.
    const tops = await page
      .getByRole("navigation", { name: "Main" })
      .getByRole("link")
      .evaluateAll((all) => all.map((a) => a.getBoundingClientRect().top));
    expect(new Set(tops).size).toBe(1);
    await page.screenshot({ path: path.join(SCREENSHOTS, `home-${role.replace(" ", "-")}.png`), fullPage: true });
    await page.context().close();
  });

  it("on a phone the menu is one button that opens every page of the role, and closes on the way", { timeout: 60_000 }, async () => {
    const page = await signedInPage(app, "felix@tenderflow.test", "**/admin/users", { password: DEMO_PASSWORD, viewport: PHONE });
    // The header is one row: logo and the Menu button, nothing wrapping.
    const header = await page.locator("header").boundingBox();
    expect(header!.height).toBeLessThan(80);
    expect(await page.getByRole("navigation", { name: "Main" }).count()).toBe(0);
    await page.locator("header summary", { hasText: "Menu" }).click();
    const links = await page.getByRole("navigation", { name: "Main" }).getByRole("link").allTextContents();
    expect(links).toEqual(ROLES[3].nav);
    await page.screenshot({ path: path.join(SCREENSHOTS, "phone-menu-admin.png") });
    await page.locator("header summary", { hasText: "Menu" }).click(); // closes it again
    // A wide table scrolls sideways in its own box while its first column stays in view.
    const users = page.getByRole("region", { name: "Users" });
    expect(await users.evaluate((el) => el.scrollWidth > el.clientWidth)).toBe(true);
    const firstCell = users.locator("tbody tr").first().locator("td").first();
    const before = await firstCell.boundingBox();
    await users.evaluate((el) => el.scrollBy({ left: 300 }));
    await expect.poll(async () => (await users.evaluate((el) => el.scrollLeft)) > 0).toBe(true);
    expect((await firstCell.boundingBox())!.x).toBeCloseTo(before!.x, 0);
    await page.screenshot({ path: path.join(SCREENSHOTS, "phone-users-scrolled.png") });
    // Only the table's box scrolls: nothing in it (a column's hidden header, a hidden label) widens the page.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await page.goto("/admin/organisations");
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await page.locator("header summary", { hasText: "Menu" }).click();
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Payments" }).click();
    await page.waitForURL("**/payments");
    await expect.poll(() => page.getByRole("navigation", { name: "Main" }).count()).toBe(0);
    await page.context().close();
  });

  it("a wrong password shows the error beside the form and stays signed out", async () => {
    const page = await app.newPage();
    await signInAs(page, "priya@kestrel-forming.test", "not-her-password");
    await expect.poll(() => page.getByRole("alert").textContent()).toContain("not right");
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    await page.screenshot({ path: path.join(SCREENSHOTS, "sign-in-wrong-password.png") });
    await page.goto("/specs");
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    await page.context().close();
  });

  it("the demo scenario's published press is open for the shops, with its circuit", async () => {
    const page = await signedInPage(app, "sofia@northgate-hyd.test", "**/open-specs", { password: DEMO_PASSWORD });
    await page.getByRole("link", { name: "Panel press, main ram" }).click();
    await page.waitForURL("**/specs/*");
    await expect.poll(() => page.getByRole("img", { name: /circuit/i }).count()).toBe(1);
    await page.screenshot({ path: path.join(SCREENSHOTS, "shop-demo-spec.png"), fullPage: true });
    await page.context().close();
  });

  it("on a phone a list's fixed first column leaves room for the others, and no page scrolls sideways", { timeout: 60_000 }, async () => {
    const page = await signedInPage(app, "priya@kestrel-forming.test", "**/specs", { password: DEMO_PASSWORD, viewport: PHONE });
    const specs = page.getByRole("region", { name: "Specs" });
    const box = await specs.evaluate((el) => el.clientWidth);
    const firstCell = await specs.locator("tbody tr td").first().boundingBox();
    expect(firstCell!.width).toBeLessThanOrEqual(box / 2);
    expect(firstCell!.width).toBeGreaterThanOrEqual(128); // a title stays readable, not a word per line
    await page.goto("/team");
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await page.context().close();
  });

  it("an admin sorts the organisations by name in the URL and opens an organisation's page from its name", { timeout: 60_000 }, async () => {
    const page = await signedInPage(app, "felix@tenderflow.test", "**/admin/users", { password: DEMO_PASSWORD });
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Organisations" }).click();
    await page.waitForURL("**/admin/organisations");
    const sort = page.getByRole("navigation", { name: "Sort" });
    expect(await sort.locator("[aria-current]").textContent()).toBe("Newest first");
    const table = page.getByRole("region", { name: "Organisations" });
    const firstColumn = () => table.locator("tbody tr td:first-child").allTextContents();
    await sort.getByRole("link", { name: "Name A–Z" }).click();
    await page.waitForURL("**/admin/organisations?sort=name");
    await expect.poll(() => sort.locator("[aria-current]").textContent()).toBe("Name A–Z");
    const byName = await firstColumn();
    expect(byName).toEqual([...byName].sort((a, b) => a.localeCompare(b, "en", { sensitivity: "base" })));
    await page.screenshot({ path: path.join(SCREENSHOTS, "admin-organisations-by-name.png"), fullPage: true });
    // A search keeps the order chosen.
    await page.getByRole("searchbox", { name: "Search organisations" }).fill("hydraulic");
    await page.getByRole("button", { name: "Search" }).click();
    await page.waitForURL(/q=hydraulic/);
    expect(new URL(page.url()).searchParams.get("sort")).toBe("name");
    await expect.poll(() => firstColumn()).toEqual(["Northgate Hydraulics", "Saltmarsh Hydraulic Works"]);

    await table.getByRole("link", { name: "Northgate Hydraulics" }).click();
    await page.waitForURL("**/accounts/*");
    await expect.poll(() => page.getByRole("heading", { level: 1 }).textContent()).toBe("Northgate Hydraulics");
    for (const heading of ["Who they are", "Jobs", "People"]) expect(await page.getByRole("heading", { name: heading, level: 2 }).count()).toBe(1);
    expect(await page.getByRole("region", { name: "People" }).textContent()).toContain("sofia@northgate-hyd.test");
    expect(await page.getByText("Approved", { exact: true }).count()).toBe(1);
    await page.screenshot({ path: path.join(SCREENSHOTS, "organisation-page-shop.png"), fullPage: true });
    await page.context().close();
  });

  it("on a phone an account manager goes from a job's buyer to the account's page and back to the account's jobs", { timeout: 60_000 }, async () => {
    const page = await signedInPage(app, "nadia@tenderflow.test", "**/jobs", { password: DEMO_PASSWORD, viewport: PHONE });
    await page.getByRole("region", { name: "Jobs" }).getByRole("link", { name: "Kestrel Forming Machines" }).first().click();
    await page.waitForURL("**/accounts/*");
    await expect.poll(() => page.getByRole("heading", { level: 1 }).textContent()).toBe("Kestrel Forming Machines");
    expect(await page.getByText("Nadia Brennan").count()).toBeGreaterThan(0); // the account manager
    // Nothing wider than the phone but the tables' own scrolling boxes.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await page.screenshot({ path: path.join(SCREENSHOTS, "phone-organisation-page-account.png"), fullPage: true });
    await page.getByRole("link", { name: /^(All \d+ jobs|In the job list) →$/ }).click();
    await page.waitForURL("**/jobs?account=*");
    // The address changes before the filtered list has loaded: wait for its rows.
    const buyerCells = page.getByRole("region", { name: "Jobs" }).locator("tbody tr td:nth-child(2)");
    await expect.poll(() => buyerCells.count()).toBeGreaterThan(0);
    expect(new Set(await buyerCells.allTextContents())).toEqual(new Set(["Kestrel Forming Machines"]));
    await page.context().close();
  });

  it("a shop opening the admin page sees the 403 page", async () => {
    const page = await signedInPage(app, "aled@ironbridge-fluid.test", "**/open-specs", { password: DEMO_PASSWORD });
    const response = await page.goto("/admin/users");
    expect(response?.status()).toBe(403);
    await expect.poll(() => page.getByRole("heading", { level: 1 }).textContent()).toBe("Not for your role");
    await page.context().close();
  });
});
