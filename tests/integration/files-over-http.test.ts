// Stored files and their uploads through the app's real server (the production build, its root
// middleware and React Router's document and data requests), from a server whose object store
// answers and from one whose store does not. Downloads keep their own sandboxing CSP; a store
// that is down is a 503 in words for job files, handover photos and offer documents alike; and an
// upload refused while posted without JavaScript comes back as its page, the problem beside the
// field and what was typed kept.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as filesRoute from "~/routes/job-files";
import * as documentsRoute from "~/routes/spec-bid-documents";
import * as attachmentsRoute from "~/routes/spec-attachments";
import { JobEvent, JobFile, Organisation, Payment, Refund, type Spec, type User } from "~/models/index.server";
import { BidDocument } from "~/models/bid.server";
import { reachMilestones } from "~/services/job-progress.server";
import { newAttempt } from "~/services/payments.server";
import { askQuestion } from "~/services/questions.server";
import { PDF_BYTES, PNG_BYTES, draftOf, pdf, png, uploadForm } from "../support/attachment-files";
import { makeJob, makeMember, makeOperatorUser, makePublishedSpec, makeSubmittedBid } from "../support/factories";
import { sendAs, startAppAndStoreDown, type HttpApp } from "../support/http-app";
import { call, type Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";

const SANDBOX = "default-src 'none'; sandbox";
const STORE_DOWN = "Tenderflow cannot reach its file store just now.";

let buyer: User, shop: User;
let buyerBrowser: Visitor, shopBrowser: Visitor;
/** One server whose object store answers, one whose store does not. */
let app: HttpApp, storeDown: HttpApp;

beforeAll(async () => {
  buyer = await makeMember("buyer");
  shop = await makeMember("shop");
  [buyerBrowser, shopBrowser] = await Promise.all([signedIn(buyer), signedIn(shop)]);
  ({ app, storeDown } = await startAppAndStoreDown());
}, 240_000);

afterAll(async () => {
  await Promise.all([app?.close(), storeDown?.close()]);
});

/** A request to a served app as `visitor`'s browser sends it: its session cookie, our own origin. */
function send(server: HttpApp, visitor: Visitor, path: string, init: RequestInit = {}) {
  return sendAs(server, visitor.request("/").headers.get("Cookie")!, path, init);
}

function form(fields: Record<string, string>, files: File[] = []) {
  const body = new FormData();
  for (const [k, v] of Object.entries(fields)) body.set(k, v);
  for (const f of files) body.append("files", f);
  return body;
}

/** A job with a test certificate stored through this process (whose store answers). */
async function jobWithCertificate() {
  const { job } = await makeJob(buyer, shop);
  const request = shopBrowser.request(`/jobs/${job.id}/files`, { method: "POST", body: form({ kind: "test_certificate" }, [pdf("pressure test.pdf")]) });
  expect((await call(filesRoute.action, request, { jobId: job.id })).status).toBe(302);
  const file = await JobFile.findOne({ where: { jobId: job.id }, rejectOnEmpty: true });
  return { job, file };
}

/** The shop's offer on a spec that takes bids, with its quotation stored. */
async function offerWithDocument() {
  const spec = await makePublishedSpec(buyer);
  const bid = await makeSubmittedBid(spec, shop);
  const request = shopBrowser.request(`/specs/${spec.id}/bid/documents`, { method: "POST", body: form({}, [pdf("quotation.pdf")]) });
  expect((await call(documentsRoute.action, request, { specId: spec.id })).status).toBe(302);
  return { spec, bid, document: await BidDocument.findOne({ where: { bidId: bid.id }, rejectOnEmpty: true }) };
}

async function attachmentOf(spec: Spec) {
  const request = buyerBrowser.request(`/specs/${spec.id}/attachments`, {
    method: "POST",
    body: uploadForm(png("gauge panel.png")),
    headers: { Accept: "application/json" },
  });
  const res = await call(attachmentsRoute.action, request, { specId: spec.id });
  expect(res.status).toBe(200);
  return res.data.attachments[0].id as string;
}

describe("downloads through the app's server", () => {
  it("keep their own CSP (nothing allowed, sandboxed) where pages get the app's", async () => {
    const { job, file } = await jobWithCertificate();
    const { spec, bid, document } = await offerWithDocument();
    const draft = await draftOf(buyer);
    const attachmentId = await attachmentOf(draft);
    const downloads: [Visitor, string][] = [
      [buyerBrowser, `/jobs/${job.id}/files/${file.id}`],
      [shopBrowser, `/specs/${spec.id}/bids/${bid.id}/documents/${document.id}`],
      [buyerBrowser, `/specs/${draft.id}/attachments/${attachmentId}`],
      [buyerBrowser, `/jobs/${job.id}/order.pdf`],
      [buyerBrowser, `/jobs/${job.id}/priced-bill.xlsx`],
    ];
    for (const [visitor, path] of downloads) {
      const res = await send(app, visitor, path);
      expect(res.status, path).toBe(200);
      expect(res.headers.get("Content-Security-Policy"), path).toBe(SANDBOX);
      expect(res.headers.get("Content-Disposition"), path).toMatch(/^attachment; /);
      // The rest of the app's headers still fill in what the download left out.
      expect(res.headers.get("X-Frame-Options"), path).toBe("DENY");
      expect(res.headers.get("Cache-Control"), path).toBe("private, no-store");
      await res.arrayBuffer();
    }
    expect(new Uint8Array(await (await send(app, buyerBrowser, downloads[0][1])).arrayBuffer())).toEqual(PDF_BYTES);
    const page = await send(app, buyerBrowser, `/jobs/${job.id}`);
    expect(page.headers.get("Content-Security-Policy")).toMatch(/script-src 'self' 'nonce-/);
  });
});

describe("a server whose object store does not answer", () => {
  it("answers a job file's download with a 503 in words", async () => {
    const { job, file } = await jobWithCertificate();
    const res = await send(storeDown, buyerBrowser, `/jobs/${job.id}/files/${file.id}`);
    expect(res.status).toBe(503);
    expect(res.headers.get("Retry-After")).toBe("60");
    expect(await res.text()).toBe(`${STORE_DOWN} Please try again in a few minutes.`);
  });

  it("refuses job files, handover photos and offer documents with a 503 saying nothing was uploaded, and keeps no row", async () => {
    const { job } = await makeJob(buyer, shop);
    // The fetcher's data request, as the page sends it with JavaScript.
    const upload = await send(storeDown, shopBrowser, `/jobs/${job.id}/files.data`, { method: "POST", body: form({ kind: "test_certificate" }, [pdf()]) });
    expect(upload.status).toBe(503);
    expect(await upload.text()).toContain(`${STORE_DOWN} Nothing was uploaded; please try again in a few minutes.`);
    expect(await JobFile.count({ where: { jobId: job.id } })).toBe(0);

    await reachMilestones(shop, job.id, { milestone: "handed_over", note: "" });
    const problem = await send(storeDown, buyerBrowser, `/jobs/${job.id}/handover.data?intent=problem`, {
      method: "POST",
      body: form({ note: "The tank leaks at the drain plug." }, [png("drain.png")]),
    });
    expect(problem.status).toBe(503);
    expect(await problem.text()).toContain(STORE_DOWN);
    expect(await JobEvent.count({ where: { jobId: job.id, kind: "handover_problem" } })).toBe(0);

    const { spec, bid } = await offerWithDocument();
    const documents = await send(storeDown, shopBrowser, `/specs/${spec.id}/bid/documents`, { method: "POST", body: form({}, [pdf("datasheet.pdf")]) });
    expect(documents.status).toBe(503);
    expect(await documents.text()).toContain(`${STORE_DOWN} Nothing was uploaded`);
    expect(await BidDocument.count({ where: { bidId: bid.id } })).toBe(1);
  });
});

describe("an upload (or another form of the job page) posted without JavaScript", () => {
  /** The page the browser gets back for a plain form post. */
  const postPlain = (visitor: Visitor, path: string, body: FormData | URLSearchParams) => send(app, visitor, path, { method: "POST", body });

  it("comes back as the job page with the problem beside the field and the choice kept; the page's other forms still work there", async () => {
    const { job } = await makeJob(buyer, shop);
    const refused = await postPlain(shopBrowser, `/jobs/${job.id}/files`, form({ kind: "approved_drawing" }, [new File([PNG_BYTES], "drawing.pdf")]));
    expect(refused.status).toBe(400);
    expect(refused.headers.get("Content-Type")).toMatch(/^text\/html/);
    const html = await refused.text();
    expect(html).toMatch(/<p id="job-files-error"[^>]*>drawing\.pdf: The name ends in \.pdf but the file is a PNG image/);
    expect(html).toMatch(/<option value="approved_drawing" selected="">/);
    expect(html).toContain('aria-describedby="job-files-error"');

    // The page was drawn at the upload's address, so its other forms post there: the page's own action answers.
    const note = await postPlain(shopBrowser, `/jobs/${job.id}/files`, new URLSearchParams({ intent: "progress-note", body: "Manifold machined." }));
    expect(note.status).toBe(302);
    expect(note.headers.get("Location")).toBe(`/jobs/${job.id}`);
    expect(await JobEvent.count({ where: { jobId: job.id, kind: "progress_note" } })).toBe(1);
  });

  it("offers the buyer the approved drawing and the shop a test certificate first, chosen at the start", async () => {
    const { job } = await makeJob(buyer, shop);
    const chosen = async (visitor: Visitor) => {
      const select = (await (await send(app, visitor, `/jobs/${job.id}`)).text()).match(/id="job-file-kind".*?<\/select>/s)?.[0];
      return select?.match(/<option value="(\w+)" selected="">/)?.[1];
    };
    expect(await chosen(buyerBrowser)).toBe("approved_drawing");
    expect(await chosen(shopBrowser)).toBe("test_certificate");
  });

  it("keeps the handover problem's note and says what is missing beside its field", async () => {
    const { job } = await makeJob(buyer, shop);
    await reachMilestones(shop, job.id, { milestone: "handed_over", note: "" });
    const note = "Pump whines above 150 bar & the gauge <reads> high.";
    const refused = await postPlain(buyerBrowser, `/jobs/${job.id}/handover?intent=problem`, form({ note }, [pdf("report.pdf")]));
    expect(refused.status).toBe(400);
    const html = await refused.text();
    expect(html).toContain("Pump whines above 150 bar &amp; the gauge &lt;reads&gt; high.</textarea>");
    expect(html).toMatch(/<p id="problem-photos-error"[^>]*>report\.pdf: a PDF can&#x27;t go here/);
    expect(html).toMatch(/<details[^>]* open=""/);

    const empty = await postPlain(buyerBrowser, `/jobs/${job.id}/handover?intent=problem`, form({ note: " " }));
    expect(await empty.text()).toMatch(/<p id="problem-note-error"[^>]*>Say what is wrong/);
    expect(await JobEvent.count({ where: { jobId: job.id, kind: "handover_problem" } })).toBe(0);
  });

  it("the account manager's bank transfer, refused, comes back as the job page with what was typed", async () => {
    const { job } = await makeJob(buyer, shop);
    await job.update({ retainerPaidAt: new Date() });
    await reachMilestones(shop, job.id, { milestone: "handed_over", note: "" });
    const manager = await makeOperatorUser("account_manager");
    await Organisation.update({ accountManagerId: manager.id }, { where: { id: buyer.organisationId } });
    const refused = await postPlain(
      await signedIn(manager),
      `/jobs/${job.id}/balance`,
      new URLSearchParams({ reference: "BACS HOLLINS 0412", paidOn: "2026-02-30" }),
    );
    expect(refused.status).toBe(400);
    const html = await refused.text();
    expect(html).toMatch(/<p id="transfer-day-error"[^>]*>[^<]*like 2026-09-30/);
    expect(html).toContain('value="BACS HOLLINS 0412"');
    expect((await job.reload()).balancePaidAt).toBeNull();
  });

  it("a shop's question or the buyer's answer, refused, comes back as the spec page with the text kept", async () => {
    const spec = await makePublishedSpec(buyer);
    const asked = await postPlain(shopBrowser, `/specs/${spec.id}/questions`, new URLSearchParams({ body: "x".repeat(2001) }));
    expect(asked.status).toBe(400);
    expect(asked.headers.get("Content-Type")).toMatch(/^text\/html/);
    const page = await asked.text();
    expect(page).toMatch(/<p id="[^"]*body-error"[^>]*>[^<]*2000 characters or fewer/);
    expect(page).toContain(`${"x".repeat(2001)}</textarea>`);

    const question = await askQuestion(shop, spec.id, { body: "May the unit stand 8 m from the press?" });
    const answered = await postPlain(buyerBrowser, `/specs/${spec.id}/questions/${question.id}/answer`, new URLSearchParams({ answer: "  " }));
    expect(answered.status).toBe(400);
    expect(await answered.text()).toMatch(/<p id="[^"]*answer-error"[^>]*>Write the answer first\./);
    expect((await question.reload()).answer).toBeNull();
  });

  it("a refund's question, then a wrong password, come back as the job page with the amount and reason kept", async () => {
    const { job } = await makeJob(buyer, shop);
    const payment = await Payment.create({ ...newAttempt(job, buyer.id), status: "paid", paidAt: new Date(), paymentIntentId: `pi_plain_${job.id}` });
    const manager = await makeOperatorUser("account_manager");
    await Organisation.update({ accountManagerId: manager.id }, { where: { id: buyer.organisationId } });
    const managerBrowser = await signedIn(manager);
    const refund = (fields: Record<string, string>) => postPlain(managerBrowser, `/payments/${payment.id}/refund`, new URLSearchParams(fields));

    const notAnAmount = await refund({ amount: "abc", reason: "Paint left off" });
    expect(notAnAmount.status).toBe(400);
    const refused = await notAnAmount.text();
    expect(refused).toMatch(new RegExp(`<p id="refund-${payment.id}-amount-error"[^>]*>Enter an amount like 250`));
    expect(refused).toContain('value="Paint left off"');

    const asked = await refund({ amount: "12.50", reason: "Paint left off" });
    expect(asked.status).toBe(200);
    const question = await asked.text();
    expect(question).toMatch(/Refund \S+ 12\.50 of the/);
    expect(question).toContain('name="confirm" value="yes"');
    const wrong = await refund({ amount: "12.50", reason: "Paint left off", confirm: "yes", currentPassword: "not it" });
    expect(wrong.status).toBe(400);
    const again = await wrong.text();
    expect(again).toMatch(new RegExp(`<p id="refund-${payment.id}-password-error"[^>]*>[^<]+`));
    expect(again).toMatch(/Refund \S+ 12\.50 of the/);
    expect(await Refund.count({ where: { paymentId: payment.id } })).toBe(0);
  });

  it("comes back as the bid page with an offer document's problem beside the upload field", async () => {
    const { spec, bid } = await offerWithDocument();
    const refused = await postPlain(shopBrowser, `/specs/${spec.id}/bid/documents`, form({}, [new File([PNG_BYTES], "datasheet.pdf")]));
    expect(refused.status).toBe(400);
    const html = await refused.text();
    expect(html).toMatch(/<p id="offer-documents-error"[^>]*>datasheet\.pdf: The name ends in \.pdf but the file is a PNG image/);
    expect(html).toContain('aria-describedby="offer-documents-error"');
    expect(await BidDocument.count({ where: { bidId: bid.id } })).toBe(1);

    // The bid form, drawn at this address, posts here too (also Conform's "add a line", which sends
    // no intent of ours): the bid page's action answers, naming what is missing.
    const bidForm = await postPlain(shopBrowser, `/specs/${spec.id}/bid/documents`, new URLSearchParams({ leadTimeWeeks: "eight" }));
    expect(bidForm.status).toBe(400);
    expect(await bidForm.text()).toContain("Your bid");
  });
});
