import { env } from "~/env.server";
import { formatDay, formatMoment } from "~/content/dates";
import { formatMoney } from "~/content/money";

// Every e-mail Tenderflow writes, in one place: each template takes the facts it reports and
// returns the subject and text. Days are written with formatDay, moments with formatMoment,
// money with formatMoney, and each mail links to the page it talks about. Services decide who
// gets which mail and queue it (enqueueMail) in the transaction of the change.

export interface MailContent {
  subject: string;
  text: string;
}

/** An absolute link to a page of the portal. */
export const pageLink = (path: string) => `${env().APP_URL}${path}`;

const jobLink = (jobId: string) => pageLink(`/jobs/${jobId}`);
const specLink = (specId: string) => pageLink(`/specs/${specId}`);
const offersLink = (specId: string) => pageLink(`/specs/${specId}/bids`);
const questionsLink = (specId: string) => pageLink(`/specs/${specId}#questions`);

// --- Accounts -----------------------------------------------------------------------------------

export function passwordResetMail(d: { name: string; token: string; hours: number }): MailContent {
  return {
    subject: "Reset your Tenderflow password",
    text: `Hello ${d.name},\n\nSomeone asked to reset the password of your Tenderflow account. To choose a new one, open this link within ${d.hours} hour${d.hours === 1 ? "" : "s"}:\n\n${pageLink(`/reset-password/${d.token}`)}\n\nThe link works once. If you did not ask for this, ignore this message; your password stays as it is.`,
  };
}

export function invitationMail(d: { inviterName: string; organisationName: string; token: string; days: number }): MailContent {
  return {
    subject: `${d.inviterName} invited you to ${d.organisationName} on Tenderflow`,
    text: `Hello,\n\n${d.inviterName} invited you to join ${d.organisationName} on Tenderflow.\n\nTo accept, open this link within ${d.days} days and choose your password:\n\n${pageLink(`/join/${d.token}`)}\n`,
  };
}

/** To an invited address that already belongs to another organisation: it cannot accept. */
export function invitationToTakenAddressMail(d: { inviterName: string; organisationName: string }): MailContent {
  return {
    subject: `${d.inviterName} invited you to ${d.organisationName} on Tenderflow`,
    text: `Hello,\n\n${d.inviterName} invited this address to join ${d.organisationName} on Tenderflow. This address already has a Tenderflow account with another organisation, and an address belongs to one organisation only, so the invitation can't be accepted with it.\n\nIf you want to work with ${d.organisationName} on Tenderflow, ask ${d.inviterName} to invite another address of yours. We have not told them that this address has an account; to them the invitation simply waits for an answer.\n\nIf you don't know them, ignore this message. Your account is unchanged.\n\nSign in to your own account: ${pageLink("/sign-in")}\n`,
  };
}

export function signUpConfirmMail(d: { name: string; organisationName: string; token: string; hours: number }): MailContent {
  return {
    subject: "Finish creating your Tenderflow account",
    text: `Hello ${d.name},\n\nTo finish creating the Tenderflow account of ${d.organisationName}, open this link within ${d.hours} hours:\n\n${pageLink(`/sign-up/${d.token}`)}\n\nIf you did not sign up, ignore this message; no account is made without the link.`,
  };
}

/** To the owner of an address someone tried to sign up with again. */
export function signUpAddressTakenMail(d: { name: string }): MailContent {
  return {
    subject: "Someone tried to sign up to Tenderflow with your address",
    text: `Hello ${d.name},\n\nSomeone tried to create a new Tenderflow account with this address, which already has one. If it was you, sign in instead:\n\n${pageLink("/sign-in")}\n\nForgot your password? Choose a new one here:\n\n${pageLink("/forgot-password")}\n\nIf it wasn't you, ignore this message: nothing was created and your account is unchanged.`,
  };
}

export function shopApprovedMail(d: { name: string; shopName: string }): MailContent {
  return {
    subject: `${d.shopName} is approved on Tenderflow`,
    text: `Hello ${d.name},\n\n${d.shopName} has been approved as a fluid-power shop on Tenderflow. You can now read the specs machine builders publish, ask them questions and bid.\n\nThe specs open for bids: ${pageLink("/open-specs")}\n`,
  };
}

export function shopRefusedMail(d: { name: string; shopName: string; reason: string }): MailContent {
  return {
    subject: `${d.shopName} was not approved on Tenderflow`,
    text: `Hello ${d.name},\n\n${d.shopName} has not been approved to read machine builders' specs on Tenderflow.\n\nThe reason given: ${d.reason}\n\nIf something has changed, contact Tenderflow and an administrator will look at it again. Your account stays open: ${pageLink("/open-specs")}\n`,
  };
}

/** To each admin: a machine builder signed up and has no account manager yet. */
export function newBuyerUnassignedMail(d: { name: string; buyerName: string; personName: string; email: string }): MailContent {
  return {
    subject: `New machine builder without an account manager: ${d.buyerName}`,
    text: `Hello ${d.name},\n\n${d.buyerName} has just signed up on Tenderflow (${d.personName}, ${d.email}). Nobody follows the account yet: it shows as unassigned on your users page and on every account manager's dashboard until you assign it.\n\nAssign an account manager: ${pageLink("/admin/users")}\n`,
  };
}

// --- Specs, questions, bids ---------------------------------------------------------------------

export function specPublishedMail(d: { shopName: string; specId: string; specTitle: string; deliveryRegion: string; bidDeadline: string }): MailContent {
  return {
    subject: `New spec open for bids: ${d.specTitle}`,
    text: `Hello ${d.shopName},\n\nA machine builder has published a spec on Tenderflow: "${d.specTitle}", delivered to ${d.deliveryRegion}, bids until ${formatDay(d.bidDeadline)}.\n\nRead it and bid: ${specLink(d.specId)}\n`,
  };
}

export function specRevisedMail(d: { shopName: string; specId: string; specTitle: string; revision: number; bidDeadline: string }): MailContent {
  return {
    subject: `Spec revised (revision ${d.revision}): ${d.specTitle}`,
    text: `Hello ${d.shopName},\n\nThe machine builder has published revision ${d.revision} of "${d.specTitle}" with a fresh preliminary circuit. Bids made against an earlier revision are marked as such. Bids until ${formatDay(d.bidDeadline)}.\n\nRead it: ${specLink(d.specId)}\n`,
  };
}

export function questionAskedMail(d: { name: string; shopName: string; specId: string; specTitle: string; question: string }): MailContent {
  return {
    subject: `New question on your spec: ${d.specTitle}`,
    text:
      `Hello ${d.name},\n\n${d.shopName} asked a question about "${d.specTitle}":\n\n${d.question}\n\n` +
      `Your answer will be shown to every shop that reads the spec, without the name of the shop that asked. ` +
      `Answer it here: ${questionsLink(d.specId)}\n`,
  };
}

export function questionAnsweredMail(d: {
  name: string;
  isAsker: boolean;
  edited: boolean;
  specId: string;
  specTitle: string;
  question: string;
  answer: string;
}): MailContent {
  const what = d.isAsker ? "your question" : "a question from a shop";
  return {
    subject: `${d.edited ? "Answer updated" : "Question answered"}: ${d.specTitle}`,
    text:
      `Hello ${d.name},\n\nThe machine builder ${d.edited ? "changed the answer to" : "answered"} ${what} on "${d.specTitle}".\n\n` +
      `Question:\n${d.question}\n\nAnswer:\n${d.answer}\n\nEvery question and answer on the spec: ${questionsLink(d.specId)}\n`,
  };
}

/** To the spec's buyers when a shop offers, or offers again (version > 1). */
export function bidOfferedMail(d: { name: string; shopName: string; specId: string; specTitle: string; version: number }): MailContent {
  return {
    subject: `${d.version > 1 ? "Revised bid" : "New bid"} on ${d.specTitle}`,
    text: `Hello ${d.name},\n\n${d.shopName} has ${d.version > 1 ? `revised its bid (version ${d.version})` : "sent a bid"} on "${d.specTitle}". Compare the bids side by side: ${offersLink(d.specId)}\n`,
  };
}

export function bidWithdrawnMail(d: { name: string; shopName: string; specId: string; specTitle: string }): MailContent {
  return {
    subject: `Offer taken back on ${d.specTitle}`,
    text: `Hello ${d.name},\n\n${d.shopName} has taken back its offer on "${d.specTitle}"; it no longer appears in your comparison. They may offer again until the deadline.\n\nThe offers: ${offersLink(d.specId)}\n`,
  };
}

// --- The award and the job ----------------------------------------------------------------------

export function bidChosenMail(d: { name: string; specTitle: string; jobId: string; totalCents: number; retainerCents: number; currency: string }): MailContent {
  return {
    subject: `Your bid was chosen: ${d.specTitle}`,
    text: `Hello ${d.name},\n\nThe buyer has chosen your bid of ${formatMoney(d.totalCents, d.currency)} for "${d.specTitle}". The job is on Tenderflow with its milestones: ${jobLink(d.jobId)}\n\nThe retainer of ${formatMoney(d.retainerCents, d.currency)} is paid by the buyer through the portal.\n`,
  };
}

export function bidNotChosenMail(d: { name: string; specId: string; specTitle: string }): MailContent {
  return {
    subject: `Not chosen this time: ${d.specTitle}`,
    text: `Hello ${d.name},\n\nThank you for bidding on "${d.specTitle}". The buyer has chosen another offer. ${specLink(d.specId)}\n`,
  };
}

export function newJobMail(d: { name: string; buyerName: string; specTitle: string; jobId: string; totalCents: number; currency: string }): MailContent {
  return {
    subject: `New job for ${d.buyerName}: ${d.specTitle}`,
    text: `Hello ${d.name},\n\n${d.buyerName} has awarded "${d.specTitle}" (${formatMoney(d.totalCents, d.currency)}). Follow it here: ${jobLink(d.jobId)}\n`,
  };
}

/** Reached milestones, to the buyer's and the shop's people (`toShop` for the shop's own). */
export function jobProgressMail(d: {
  name: string;
  toShop: boolean;
  shopName: string;
  specTitle: string;
  jobId: string;
  reached: string[];
  note: string;
  next: { label: string; targetDate: string | null } | null;
}): MailContent {
  const steps = d.reached.join(", then ");
  const opening = d.toShop
    ? `Your shop has recorded progress on "${d.specTitle}": ${steps}. The buyer has been told.\n` + (d.note ? `\nThe note: ${d.note}\n` : "")
    : `${d.shopName} has recorded progress on "${d.specTitle}": ${steps}.\n` + (d.note ? `\nTheir note: ${d.note}\n` : "");
  const next = d.next
    ? `Next up: ${d.next.label}${d.next.targetDate ? `, planned for ${formatDay(d.next.targetDate)}` : ""}.`
    : "Every milestone of the job is now reached.";
  return {
    subject: `Job progress on "${d.specTitle}": ${d.reached.join(", ")}`,
    text: `Hello ${d.name},\n\n${opening}\n${next}\n\nThe job's timeline and history: ${jobLink(d.jobId)}\n`,
  };
}

export function milestoneTakenBackMail(d: {
  name: string;
  shopName: string;
  specTitle: string;
  jobId: string;
  milestone: string;
  reason: string;
}): MailContent {
  return {
    subject: `Job progress on "${d.specTitle}": ${d.milestone} taken back`,
    text: `Hello ${d.name},\n\n${d.shopName} has taken back "${d.milestone}" on "${d.specTitle}": it is no longer marked as reached.\nTheir reason: ${d.reason}\n\nThe job's timeline and history: ${jobLink(d.jobId)}\n`,
  };
}

/**
 * The buyer accepted the handover: the job is closed (to buyer and shop). `buyerName` is the person
 * who accepted; every reader, their colleagues too, is told who it was (not "you").
 */
export function handoverAcceptedMail(d: { name: string; toShop: boolean; buyerName: string; specTitle: string; jobId: string }): MailContent {
  return {
    subject: `Handover accepted: ${d.specTitle}`,
    text: `Hello ${d.name},\n\n${d.buyerName} has accepted the handover of "${d.specTitle}". The job is closed; the balance is paid from the job page.\n\nThe job: ${jobLink(d.jobId)}\n`,
  };
}

/** The buyer raised a problem with the handover: it is back with the shop (to buyer and shop). */
export function handoverProblemMail(d: {
  name: string;
  toShop: boolean;
  buyerName: string;
  specTitle: string;
  jobId: string;
  note: string;
  photos: number;
}): MailContent {
  const photos = d.photos ? ` with ${d.photos === 1 ? "a photo" : `${d.photos} photos`}` : "";
  return {
    subject: `Problem with the handover: ${d.specTitle}`,
    text: `Hello ${d.name},\n\n${d.buyerName} has raised a problem with the handover of "${d.specTitle}"${photos}. ${d.toShop ? "The handover is back with your shop: put it right, then record the handover again." : "The shop has been told and will record the handover again once it is put right."}\n\nThe note: ${d.note}\n\nThe job: ${jobLink(d.jobId)}\n`,
  };
}

// --- Payments -----------------------------------------------------------------------------------

interface Retainer {
  specTitle: string;
  jobId: string;
  amountCents: number;
  currency: string;
}

export function receiptMail(d: Retainer & { name: string; buyerName: string; shopName: string; paidAt: Date; reference: string }): MailContent {
  const amount = formatMoney(d.amountCents, d.currency);
  return {
    subject: `Receipt: retainer of ${amount} for ${d.specTitle}`,
    text: `Hello ${d.name},\n\nThank you: ${d.buyerName} has paid the retainer of ${amount} for "${d.specTitle}" to ${d.shopName} by card on ${formatMoment(d.paidAt.toISOString())}.\nPayment reference: ${d.reference}\n\nThe job: ${jobLink(d.jobId)}\n`,
  };
}

export function retainerReceivedMail(d: Retainer & { name: string; buyerName: string; paidAt: Date }): MailContent {
  const amount = formatMoney(d.amountCents, d.currency);
  return {
    subject: `Retainer received: ${amount} for ${d.specTitle}`,
    text: `Hello ${d.name},\n\n${d.buyerName} has paid the retainer of ${amount} for "${d.specTitle}" on ${formatMoment(d.paidAt.toISOString())}. The job can go ahead: ${jobLink(d.jobId)}\n`,
  };
}

interface Balance extends Retainer {
  buyerName: string;
  shopName: string;
  paidAt: Date;
  method: "card" | "bank_transfer";
  reference: string;
}

const howPaid = (d: Balance) => (d.method === "card" ? "by card" : "by bank transfer");

/** The balance paid (by card, or a bank transfer recorded by Tenderflow): the buyer's receipt. */
export function balanceReceiptMail(d: Balance & { name: string }): MailContent {
  const amount = formatMoney(d.amountCents, d.currency);
  return {
    subject: `Receipt: balance of ${amount} for ${d.specTitle}`,
    text: `Hello ${d.name},\n\nThank you: ${d.buyerName} has paid the balance of ${amount} for "${d.specTitle}" to ${d.shopName} ${howPaid(d)}, received on ${formatDay(d.paidAt)}.\n${d.reference ? `Reference: ${d.reference}\n` : ""}With the retainer, the job is paid in full.\n\nThe job: ${jobLink(d.jobId)}\n`,
  };
}

/** To the shop's people: the balance is in. */
export function balanceReceivedMail(d: Balance & { name: string }): MailContent {
  const amount = formatMoney(d.amountCents, d.currency);
  return {
    subject: `Balance received: ${amount} for ${d.specTitle}`,
    text: `Hello ${d.name},\n\n${d.buyerName} has paid the balance of ${amount} for "${d.specTitle}" ${howPaid(d)}, received on ${formatDay(d.paidAt)}. The job is paid in full: ${jobLink(d.jobId)}\n`,
  };
}

/** To the buyer who paid a retainer (or the balance, `what`) twice; `refused` is the card service's refusal of the automatic refund. */
export function secondChargeToPayerMail(d: Retainer & { name: string; reference: string; refused: string | null; what?: "retainer" | "balance" }): MailContent {
  const amount = formatMoney(d.amountCents, d.currency);
  const what = d.what ?? "retainer";
  return {
    subject: `Charged twice for the ${what} of ${d.specTitle}: ${d.refused ? "we are paying it back" : "refunded"}`,
    text: `Hello ${d.name},\n\nThe ${what} for "${d.specTitle}" had already been paid when a second card payment of ${amount} came through (reference ${d.reference}). ${d.refused ? "Your account manager will pay it back to your card and be in touch." : "We have asked the card service to pay it back in full; it can take a few days to appear on your statement."} Nothing else is needed from you.\n\nThe job: ${jobLink(d.jobId)}\n`,
  };
}

export function secondChargeToStaffMail(
  d: Retainer & { name: string; buyerName: string; reference: string; refused: string | null; what?: "retainer" | "balance" },
): MailContent {
  const amount = formatMoney(d.amountCents, d.currency);
  const what = d.what ?? "retainer";
  return {
    subject: `Check: ${what} charged twice for ${d.specTitle} (${d.buyerName})`,
    text: `Hello ${d.name},\n\n${d.buyerName} paid the ${what} for "${d.specTitle}" a second time: ${amount}, reference ${d.reference}. ${d.refused ? `The automatic refund was refused by the card service (${d.refused}); please pay it back from the job page.` : "It has been refunded automatically."}\n\nThe job: ${jobLink(d.jobId)}\nFlagged payments: ${pageLink("/payments?flagged=1")}\n`,
  };
}

/** A refund the card service has made: `newlyCents` now, `refundedCents` in all, of `amountCents` paid. */
export function refundToPayerMail(d: Retainer & { name: string; newlyCents: number; refundedCents: number }): MailContent {
  const money = (cents: number) => formatMoney(cents, d.currency);
  return {
    subject: `Refund of ${money(d.newlyCents)} on your retainer for ${d.specTitle}`,
    text: `Hello ${d.name},\n\n${money(d.newlyCents)} of the retainer you paid has been refunded to your card. Refunded so far: ${money(d.refundedCents)} of the ${money(d.amountCents)} you paid. It can take a few days to appear on your statement.\n\nThe job: ${jobLink(d.jobId)}\n`,
  };
}

export function refundToShopMail(d: Retainer & { name: string; newlyCents: number; refundedCents: number }): MailContent {
  const money = (cents: number) => formatMoney(cents, d.currency);
  return {
    subject: `Retainer paid back in ${d.refundedCents >= d.amountCents ? "full" : "part"}: ${d.specTitle}`,
    text: `Hello ${d.name},\n\nTenderflow has refunded ${money(d.newlyCents)} of the buyer's retainer for "${d.specTitle}" (${money(d.refundedCents)} of ${money(d.amountCents)} refunded so far). Your account manager will be in touch about the job.\n\nThe job: ${jobLink(d.jobId)}\n`,
  };
}

// --- Reminders (scheduled work) -----------------------------------------------------------------

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/** To the spec's buyer when its bid deadline passes with bids: time to compare and choose. */
export function deadlinePassedMail(d: { name: string; specId: string; specTitle: string; deadline: Date; bids: number }): MailContent {
  return {
    subject: `Bidding closed on ${d.specTitle}: ${plural(d.bids, "bid", "bids")}`,
    text: `Hello ${d.name},\n\nThe bid deadline of "${d.specTitle}" passed on ${formatDay(d.deadline)} with ${plural(d.bids, "bid", "bids")} from shops. Compare them side by side and choose one: ${offersLink(d.specId)}\n`,
  };
}

/** To the spec's buyer when its bid deadline passes without a bid. */
export function noBidsToBuyerMail(d: { name: string; specId: string; specTitle: string; deadline: Date }): MailContent {
  return {
    subject: `No bids on ${d.specTitle}`,
    text: `Hello ${d.name},\n\nThe bid deadline of "${d.specTitle}" passed on ${formatDay(d.deadline)} without a bid from any shop. To open it again, revise the spec with a later deadline: ${specLink(d.specId)}\n\nYour account manager has been told and can help you find shops for it.\n`,
  };
}

/** To the buyer's account manager (or the admins) when a spec's deadline passes without a bid. */
export function noBidsToStaffMail(d: { name: string; buyerName: string; specId: string; specTitle: string; deadline: Date }): MailContent {
  return {
    subject: `No bids for ${d.buyerName}: ${d.specTitle}`,
    text: `Hello ${d.name},\n\nThe bid deadline of "${d.specTitle}" by ${d.buyerName} passed on ${formatDay(d.deadline)} without a bid. The buyer has been told and may revise it with a later deadline.\n\nThe spec: ${specLink(d.specId)}\n`,
  };
}

/** A milestone past its target day and not recorded: to whoever acts on it (`role`) and to staff. */
export function milestoneOverdueMail(d: {
  name: string;
  role: "shop" | "buyer" | "staff";
  buyerName: string;
  shopName: string;
  specTitle: string;
  jobId: string;
  milestone: string;
  targetDate: string;
  daysLate: number;
}): MailContent {
  const next = {
    shop: "Record it on the job when it is done, or move its target day there with a reason.",
    buyer: "The job waits for the retainer: pay it on the job page.",
    staff: `The job is between ${d.buyerName} and ${d.shopName}; they have been reminded too.`,
  }[d.role];
  return {
    subject: `Overdue: ${d.milestone} on ${d.specTitle}`,
    text: `Hello ${d.name},\n\n"${d.milestone}" on the job for "${d.specTitle}" was due on ${formatDay(d.targetDate)} and is not recorded yet: ${plural(d.daysLate, "day", "days")} late. ${next}\n\nThe job: ${jobLink(d.jobId)}\n`,
  };
}
