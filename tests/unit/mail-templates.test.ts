// Every mail template once: its subject, the exact page it links to, and days, moments and money
// written the app's one way (formatDay, formatMoment, formatMoney).
import { describe, expect, it } from "vitest";
import * as t from "~/services/mail-templates.server";

const APP = "http://127.0.0.1:3000";
const spec = { specId: "spec-1", specTitle: "Bending press" };
const overdue = {
  buyerName: "Acme",
  shopName: "Brenner",
  specTitle: "Bending press",
  jobId: "job-1",
  milestone: "Bench-tested",
  targetDate: "2026-04-02",
  daysLate: 3,
};
const retainer = { specTitle: "Bending press", jobId: "job-1", amountCents: 123456, currency: "EUR" };
const BALANCE = {
  ...retainer,
  buyerName: "Acme",
  shopName: "Brenner",
  paidAt: new Date("2026-03-14T09:12:00Z"),
  method: "bank_transfer" as const,
  reference: "BACS 77",
};

describe("mail templates", () => {
  const cases: [string, t.MailContent, RegExp | string, string][] = [
    ["password reset", t.passwordResetMail({ name: "Ann", token: "tok", hours: 1 }), "Reset your Tenderflow password", `${APP}/reset-password/tok`],
    [
      "invitation",
      t.invitationMail({ inviterName: "Ann", organisationName: "Acme", token: "tok", days: 7 }),
      "Ann invited you to Acme on Tenderflow",
      `${APP}/join/tok`,
    ],
    [
      "invitation to a taken address",
      t.invitationToTakenAddressMail({ inviterName: "Ann", organisationName: "Acme" }),
      "Ann invited you to Acme on Tenderflow",
      `${APP}/sign-in`,
    ],
    [
      "sign-up link",
      t.signUpConfirmMail({ name: "Ann", organisationName: "Acme", token: "tok", hours: 24 }),
      "Finish creating your Tenderflow account",
      `${APP}/sign-up/tok`,
    ],
    [
      "sign-up with a known address",
      t.signUpAddressTakenMail({ name: "Ann" }),
      "Someone tried to sign up to Tenderflow with your address",
      `${APP}/forgot-password`,
    ],
    ["shop approved", t.shopApprovedMail({ name: "Bo", shopName: "Brenner" }), "Brenner is approved on Tenderflow", `${APP}/open-specs`],
    [
      "shop refused",
      t.shopRefusedMail({ name: "Bo", shopName: "Brenner", reason: "No address." }),
      "Brenner was not approved on Tenderflow",
      `${APP}/open-specs`,
    ],
    [
      "spec published",
      t.specPublishedMail({ ...spec, shopName: "Brenner", deliveryRegion: "Bavaria", bidDeadline: "2026-03-14" }),
      "New spec open for bids: Bending press",
      `${APP}/specs/spec-1\n`,
    ],
    [
      "spec revised",
      t.specRevisedMail({ ...spec, shopName: "Brenner", revision: 2, bidDeadline: "2026-03-14" }),
      "Spec revised (revision 2): Bending press",
      `${APP}/specs/spec-1\n`,
    ],
    [
      "question asked",
      t.questionAskedMail({ ...spec, name: "Ann", shopName: "Brenner", question: "Which fluid?" }),
      "New question on your spec: Bending press",
      `${APP}/specs/spec-1#questions`,
    ],
    [
      "question answered",
      t.questionAnsweredMail({ ...spec, name: "Bo", isAsker: true, edited: false, question: "Which fluid?", answer: "HLP 46" }),
      "Question answered: Bending press",
      `${APP}/specs/spec-1#questions`,
    ],
    ["bid offered", t.bidOfferedMail({ ...spec, name: "Ann", shopName: "Brenner", version: 1 }), "New bid on Bending press", `${APP}/specs/spec-1/bids`],
    ["bid withdrawn", t.bidWithdrawnMail({ ...spec, name: "Ann", shopName: "Brenner" }), "Offer taken back on Bending press", `${APP}/specs/spec-1/bids`],
    [
      "bid chosen",
      t.bidChosenMail({ name: "Bo", specTitle: "Bending press", jobId: "job-1", totalCents: 1000000, retainerCents: 100000, currency: "EUR" }),
      "Your bid was chosen: Bending press",
      `${APP}/jobs/job-1`,
    ],
    ["bid not chosen", t.bidNotChosenMail({ ...spec, name: "Bo" }), "Not chosen this time: Bending press", `${APP}/specs/spec-1\n`],
    [
      "new job",
      t.newJobMail({ name: "Max", buyerName: "Acme", specTitle: "Bending press", jobId: "job-1", totalCents: 1000000, currency: "EUR" }),
      "New job for Acme: Bending press",
      `${APP}/jobs/job-1`,
    ],
    [
      "job progress",
      t.jobProgressMail({
        name: "Ann",
        toShop: false,
        shopName: "Brenner",
        specTitle: "Bending press",
        jobId: "job-1",
        reached: ["Drawings agreed"],
        note: "",
        next: null,
      }),
      'Job progress on "Bending press": Drawings agreed',
      `${APP}/jobs/job-1`,
    ],
    [
      "milestone taken back",
      t.milestoneTakenBackMail({
        name: "Ann",
        shopName: "Brenner",
        specTitle: "Bending press",
        jobId: "job-1",
        milestone: "In the workshop",
        reason: "Cracked.",
      }),
      'Job progress on "Bending press": In the workshop taken back',
      `${APP}/jobs/job-1`,
    ],
    [
      "receipt",
      t.receiptMail({ ...retainer, name: "Ann", buyerName: "Acme", shopName: "Brenner", paidAt: new Date("2026-03-14T09:12:00Z"), reference: "pi_1" }),
      "Receipt: retainer of €1,234.56 for Bending press",
      `${APP}/jobs/job-1`,
    ],
    [
      "retainer received",
      t.retainerReceivedMail({ ...retainer, name: "Bo", buyerName: "Acme", paidAt: new Date("2026-03-14T09:12:00Z") }),
      "Retainer received: €1,234.56 for Bending press",
      `${APP}/jobs/job-1`,
    ],
    [
      "second charge, payer",
      t.secondChargeToPayerMail({ ...retainer, name: "Ann", reference: "pi_2", refused: null }),
      "Charged twice for the retainer of Bending press: refunded",
      `${APP}/jobs/job-1`,
    ],
    [
      "second charge, staff",
      t.secondChargeToStaffMail({ ...retainer, name: "Max", buyerName: "Acme", reference: "pi_2", refused: "card_declined" }),
      "Check: retainer charged twice for Bending press (Acme)",
      `${APP}/payments?flagged=1`,
    ],
    [
      "refund, payer",
      t.refundToPayerMail({ ...retainer, name: "Ann", newlyCents: 23456, refundedCents: 23456 }),
      "Refund of €234.56 on your retainer for Bending press",
      `${APP}/jobs/job-1`,
    ],
    [
      "refund, shop",
      t.refundToShopMail({ ...retainer, name: "Bo", newlyCents: 23456, refundedCents: 123456 }),
      "Retainer paid back in full: Bending press",
      `${APP}/jobs/job-1`,
    ],
    [
      "deadline passed",
      t.deadlinePassedMail({ ...spec, name: "Ann", deadline: new Date("2026-03-14T23:59:59Z"), bids: 1 }),
      "Bidding closed on Bending press: 1 bid",
      `${APP}/specs/spec-1/bids`,
    ],
    [
      "no bids, buyer",
      t.noBidsToBuyerMail({ ...spec, name: "Ann", deadline: new Date("2026-03-14T23:59:59Z") }),
      "No bids on Bending press",
      `${APP}/specs/spec-1`,
    ],
    [
      "no bids, staff",
      t.noBidsToStaffMail({ ...spec, name: "Max", buyerName: "Acme", deadline: new Date("2026-03-14T23:59:59Z") }),
      "No bids for Acme: Bending press",
      `${APP}/specs/spec-1`,
    ],
    ["milestone overdue", t.milestoneOverdueMail({ ...overdue, name: "Bo", role: "shop" }), "Overdue: Bench-tested on Bending press", `${APP}/jobs/job-1`],
    [
      "handover accepted",
      t.handoverAcceptedMail({ name: "Bo", toShop: true, buyerName: "Acme", specTitle: "Bending press", jobId: "job-1" }),
      "Handover accepted: Bending press",
      `${APP}/jobs/job-1`,
    ],
    [
      "handover problem",
      t.handoverProblemMail({ name: "Bo", toShop: true, buyerName: "Acme", specTitle: "Bending press", jobId: "job-1", note: "Leaks.", photos: 2 }),
      "Problem with the handover: Bending press",
      `${APP}/jobs/job-1`,
    ],
    ["balance receipt", t.balanceReceiptMail({ ...BALANCE, name: "Ann" }), "Receipt: balance of €1,234.56 for Bending press", `${APP}/jobs/job-1`],
    ["balance received", t.balanceReceivedMail({ ...BALANCE, name: "Bo" }), "Balance received: €1,234.56 for Bending press", `${APP}/jobs/job-1`],
  ];

  it.each(cases)("%s: subject and the page it links to", (_name, mail, subject, link) => {
    expect(mail.subject).toBe(subject);
    expect(mail.text).toContain(link);
    // No mail names a day the machine way, and every mail greets.
    expect(mail.text).not.toMatch(/\d{4}-\d{2}-\d{2}/);
    expect(mail.text).toMatch(/^Hello/);
  });

  it("says how the balance was paid, when it arrived and its reference", () => {
    expect(t.balanceReceiptMail({ ...BALANCE, name: "Ann" }).text).toContain("to Brenner by bank transfer, received on 14 Mar 2026.\nReference: BACS 77");
    expect(t.balanceReceivedMail({ ...BALANCE, method: "card", name: "Bo" }).text).toContain("by card, received on 14 Mar 2026.");
  });

  it("names who accepted a handover, to the buyer's colleagues as to the shop (no 'you' beside a name)", () => {
    const accepted = (name: string, toShop: boolean) =>
      t.handoverAcceptedMail({ name, toShop, buyerName: "Priya Raman", specTitle: "Panel press, main ram", jobId: "job-1" }).text;
    for (const text of [accepted("Priya Raman", false), accepted("Tom Hale", false), accepted("Bo", true)]) {
      expect(text).toContain('Priya Raman has accepted the handover of "Panel press, main ram". The job is closed');
      expect(text).not.toMatch(/\bYou accepted|\(Priya Raman\)/);
    }
  });

  it("says when a deadline passed and how late a milestone is, to each reader", () => {
    const deadline = new Date("2026-03-14T23:59:59Z");
    expect(t.deadlinePassedMail({ ...spec, name: "Ann", deadline, bids: 3 }).text).toContain("passed on 14 Mar 2026 with 3 bids from shops.");
    expect(t.milestoneOverdueMail({ ...overdue, name: "Bo", role: "shop" }).text).toContain("was due on 2 Apr 2026 and is not recorded yet: 3 days late.");
    expect(t.milestoneOverdueMail({ ...overdue, daysLate: 1, name: "Ann", role: "buyer" }).text).toContain("1 day late. The job waits for the retainer");
    expect(t.milestoneOverdueMail({ ...overdue, name: "Max", role: "staff" }).text).toContain("between Acme and Brenner");
  });

  it("writes days, moments and money the app's one way", () => {
    expect(t.specPublishedMail({ ...spec, shopName: "Brenner", deliveryRegion: "Bavaria", bidDeadline: "2026-03-14" }).text).toContain(
      "bids until 14 Mar 2026.",
    );
    expect(t.specRevisedMail({ ...spec, shopName: "Brenner", revision: 2, bidDeadline: "2026-03-14" }).text).toContain("Bids until 14 Mar 2026.");
    const next = { label: "In the workshop", targetDate: "2026-04-02" };
    expect(
      t.jobProgressMail({
        name: "Ann",
        toShop: true,
        shopName: "Brenner",
        specTitle: "Bending press",
        jobId: "job-1",
        reached: ["Drawings agreed", "Parts ordered"],
        note: "On time.",
        next,
      }).text,
    ).toContain(
      'Your shop has recorded progress on "Bending press": Drawings agreed, then Parts ordered. The buyer has been told.\n\nThe note: On time.\n\nNext up: In the workshop, planned for 2 Apr 2026.',
    );
    const receipt = t.receiptMail({
      ...retainer,
      name: "Ann",
      buyerName: "Acme",
      shopName: "Brenner",
      paidAt: new Date("2026-03-14T09:12:00Z"),
      reference: "pi_1",
    });
    expect(receipt.text).toContain("by card on 14 Mar 2026, 09:12 UTC.");
    expect(t.refundToShopMail({ ...retainer, name: "Bo", newlyCents: 100, refundedCents: 200 }).text).toContain(
      '€1.00 of the buyer\'s retainer for "Bending press" (€2.00 of €1,234.56 refunded so far)',
    );
    expect(t.refundToShopMail({ ...retainer, name: "Bo", newlyCents: 100, refundedCents: 200 }).subject).toBe("Retainer paid back in part: Bending press");
  });
});
