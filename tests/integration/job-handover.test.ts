// The handover's acceptance (issue 17 point 6): the buyer accepts the shop's "handed over", which
// closes the job, or reports a problem with a note and photos, which gives the handover back to
// the shop with the note shown; and the files buyer and shop exchange on the job.
import { beforeAll, describe, expect, it } from "vitest";
import * as handoverRoute from "~/routes/job-handover";
import * as filesRoute from "~/routes/job-files";
import * as fileDownload from "~/routes/job-file-download";
import { Job, JobEvent, JobFile, JobMilestone, type User } from "~/models/index.server";
import { reachMilestones, undoLastMilestone } from "~/services/job-progress.server";
import { acceptHandover, handoverPanelOf } from "~/services/job-handover.server";
import { listJobs } from "~/services/job-reads.server";
import { deliverDueMail } from "~/services/mail.server";
import { makeJob, makeMember } from "../support/factories";
import { makeDealParties } from "../support/parties";
import { mailsTo } from "../support/mailbox";
import { call, type Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";

const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d, 0x49, 0x48, 0x44, 0x52]);
const PDF = new TextEncoder().encode("%PDF-1.4\n% test certificate\n");
const DXF = new TextEncoder().encode("0\nSECTION\n2\nHEADER\n0\nENDSEC\n0\nEOF\n");

let buyer: User;
let shop: User;
let manager: User;

beforeAll(async () => {
  ({ buyer, shop, manager } = await makeDealParties());
});

async function handedOverJob() {
  const { job } = await makeJob(buyer, shop);
  await reachMilestones(shop, job.id, { milestone: "handed_over", note: "Delivered and commissioned on site." });
  return job;
}

function form(fields: Record<string, string>, files: File[] = []) {
  const body = new FormData();
  for (const [k, v] of Object.entries(fields)) body.set(k, v);
  for (const f of files) body.append("files", f);
  return body;
}

const post = (visitor: Visitor, fn: typeof handoverRoute.action | typeof filesRoute.action, path: string, jobId: string, body: FormData) =>
  call(fn, visitor.request(path, { method: "POST", body }), { jobId });

/** The job's files form (a kind and the files) as `visitor` posts it. */
const uploadToJob = (visitor: Visitor, jobId: string, fields: Record<string, string>, files: File[] = []) =>
  post(visitor, filesRoute.action, `/jobs/${jobId}/files`, jobId, form(fields, files));

async function downloaded(visitor: Visitor, jobId: string, fileId: string) {
  const request = visitor.request(`/jobs/${jobId}/files/${fileId}`);
  const response = await fileDownload.loader({ request, params: { jobId, fileId }, context: {} } as Parameters<typeof fileDownload.loader>[0]);
  return new Uint8Array(await response.arrayBuffer());
}

describe("accepting the handover", () => {
  it("closes the job once; a second tab is told it was accepted, and the shop can change nothing after", async () => {
    const job = await handedOverJob();
    const panel = await handoverPanelOf(buyer, job.id);
    expect(panel).toMatchObject({ state: "awaiting", canAnswer: true });
    expect((await handoverPanelOf(shop, job.id)).canAnswer).toBe(false);

    const visitor = await signedIn(buyer);
    const accepted = await post(visitor, handoverRoute.action, `/jobs/${job.id}/handover?intent=accept`, job.id, form({}));
    expect(accepted.status).toBe(302);
    const again = await post(visitor, handoverRoute.action, `/jobs/${job.id}/handover?intent=accept`, job.id, form({}));
    expect(again.status).toBe(400);
    expect(again.data.errors[""].join(" ")).toMatch(/was accepted on .*closed/);

    const closed = await Job.findByPk(job.id, { rejectOnEmpty: true });
    expect(closed.acceptedAt).not.toBeNull();
    expect(closed.acceptedById).toBe(buyer.id);
    expect(await JobEvent.count({ where: { jobId: job.id, kind: "handover_accepted" } })).toBe(1);
    expect(await handoverPanelOf(shop, job.id)).toMatchObject({ state: "accepted", acceptedBy: buyer.name });
    // The job list says it is accepted, for the manager following the account.
    expect((await listJobs(manager, {})).jobs.find((j) => j.id === job.id)?.acceptedAt).toBe(closed.acceptedAt!.toISOString());
    await expect(undoLastMilestone(shop, job.id, { milestone: "handed_over", reason: "Oops" })).rejects.toThrow(/closed/);

    await deliverDueMail();
    const mail = (await mailsTo(shop.email)).find((m) => m.subject.startsWith("Handover accepted"));
    expect(mail?.text).toContain(`/jobs/${job.id}`);
  });

  it("is refused before the shop records the handover, and to anyone but the job's buyer", async () => {
    const { job } = await makeJob(buyer, shop);
    await expect(acceptHandover(buyer, job.id)).rejects.toThrow(/not recorded the handover/);
    await reachMilestones(shop, job.id, { milestone: "handed_over", note: "" });
    await expect(acceptHandover(shop, job.id)).rejects.toMatchObject({ init: { status: 403 } });
    await expect(acceptHandover(manager, job.id)).rejects.toMatchObject({ init: { status: 403 } });
    await expect(acceptHandover(await makeMember("buyer"), job.id)).rejects.toMatchObject({ init: { status: 404 } });
    expect((await Job.findByPk(job.id, { rejectOnEmpty: true })).acceptedAt).toBeNull();
  });
});

describe("reporting a problem", () => {
  it("gives the handover back to the shop with the note and photos, and the shop can hand over again", async () => {
    const job = await handedOverJob();
    const visitor = await signedIn(buyer);
    const note = "The pressure gauge reads 20 bar high and the tank drips at the drain plug.";
    const reply = await post(
      visitor,
      handoverRoute.action,
      `/jobs/${job.id}/handover?intent=problem`,
      job.id,
      form({ note }, [new File([PNG], "gauge.png"), new File([PNG], "drain plug.png")]),
    );
    expect(reply.status).toBe(302);
    const handover = await JobMilestone.findOne({ where: { jobId: job.id, key: "handed_over" }, rejectOnEmpty: true });
    expect(handover.reachedAt).toBeNull();

    const seenByShop = await handoverPanelOf(shop, job.id);
    expect(seenByShop.state).toBe("problem");
    expect(seenByShop.problem?.note).toBe(note);
    expect(seenByShop.problem?.photos.map((p) => [p.fileName, p.uploadedBy])).toEqual([
      ["drain plug.png", buyer.name],
      ["gauge.png", buyer.name],
    ]);
    const shopBrowser = await signedIn(shop);
    expect(await downloaded(shopBrowser, job.id, seenByShop.problem!.photos[0].id)).toEqual(PNG);
    await deliverDueMail();
    expect((await mailsTo(shop.email)).find((m) => m.subject.startsWith("Problem with the handover"))?.text).toContain(note);

    // Answered already: a second tab's problem report or acceptance is refused.
    const late = await post(visitor, handoverRoute.action, `/jobs/${job.id}/handover?intent=accept`, job.id, form({}));
    expect(late.data.errors[""].join(" ")).toMatch(/not recorded the handover yet/);

    await reachMilestones(shop, job.id, { milestone: "handed_over", note: "Gauge replaced, plug resealed." });
    await acceptHandover(buyer, job.id);
    expect((await handoverPanelOf(buyer, job.id)).state).toBe("accepted");
  });

  it("refuses a report without a note, or with a photo that is not an image, and keeps nothing", async () => {
    const job = await handedOverJob();
    const visitor = await signedIn(buyer);
    const path = `/jobs/${job.id}/handover?intent=problem`;
    const noNote = await post(visitor, handoverRoute.action, path, job.id, form({ note: "  " }, [new File([PNG], "a.png")]));
    expect(noNote.status).toBe(400);
    expect(noNote.data.errors.note[0]).toMatch(/Say what is wrong/);
    const pdf = await post(visitor, handoverRoute.action, path, job.id, form({ note: "Leak" }, [new File([PDF], "report.pdf")]));
    expect(pdf.data.errors.files.join(" ")).toMatch(/report\.pdf: a PDF can't go here; choose PNG image or JPEG photo/);
    const renamed = await post(visitor, handoverRoute.action, path, job.id, form({ note: "Leak" }, [new File([PDF], "photo.png")]));
    expect(renamed.data.errors.files.join(" ")).toMatch(/photo\.png: The name ends in \.png but the file is a PDF/);
    expect(await JobFile.count({ where: { jobId: job.id } })).toBe(0);
    expect((await JobMilestone.findOne({ where: { jobId: job.id, key: "handed_over" }, rejectOnEmpty: true })).reachedAt).not.toBeNull();
    const unknown = await post(visitor, handoverRoute.action, `/jobs/${job.id}/handover?intent=shrug`, job.id, form({}));
    expect(unknown.status).toBe(400);
  });
});

describe("files exchanged on the job", () => {
  it("keeps who uploaded each file and when, for buyer, shop and the account's staff; others get a 404", async () => {
    const { job } = await makeJob(buyer, shop);
    const shopBrowser = await signedIn(shop);
    const up = await uploadToJob(shopBrowser, job.id, { kind: "test_certificate" }, [new File([PDF], "pressure test.pdf")]);
    expect(up.status).toBe(302);
    const buyerBrowser = await signedIn(buyer);
    const drawing = await uploadToJob(buyerBrowser, job.id, { kind: "approved_drawing" }, [new File([DXF], "unit rev C.dxf")]);
    expect(drawing.status).toBe(302);

    // The upload form starts at each side's usual kind: the buyer's approved drawing, the shop's certificates; staff upload nothing.
    expect((await handoverPanelOf(buyer, job.id)).fileKinds).toEqual(["approved_drawing", "test_certificate"]);
    expect((await handoverPanelOf(shop, job.id)).fileKinds).toEqual(["test_certificate", "approved_drawing"]);
    expect((await handoverPanelOf(manager, job.id)).fileKinds).toEqual([]);

    const files = (await handoverPanelOf(manager, job.id)).files;
    expect(files.map((f) => [f.kindLabel, f.fileName, f.uploadedBy])).toEqual([
      ["Test certificate", "pressure test.pdf", shop.name],
      ["Approved drawing", "unit rev C.dxf", buyer.name],
    ]);
    expect(files[0].uploadedByOrganisation).toBeTruthy();
    expect(Date.parse(files[0].uploadedAt)).not.toBeNaN();
    expect(await downloaded(buyerBrowser, job.id, files[0].id)).toEqual(PDF);
    expect(await JobEvent.count({ where: { jobId: job.id, kind: "file_added" } })).toBe(2);

    const stranger = await signedIn(await makeMember("shop"));
    const refused = await call(fileDownload.loader, stranger.request(`/jobs/${job.id}/files/${files[0].id}`), { jobId: job.id, fileId: files[0].id });
    expect(refused.status).toBe(404);
    const otherJob = (await makeJob(buyer, shop)).job;
    const crossed = await call(fileDownload.loader, buyerBrowser.request(`/jobs/${otherJob.id}/files/${files[0].id}`), {
      jobId: otherJob.id,
      fileId: files[0].id,
    });
    expect(crossed.status).toBe(404);
    const managerBrowser = await signedIn(manager);
    const staffUpload = await uploadToJob(managerBrowser, job.id, { kind: "test_certificate" }, [new File([PDF], "x.pdf")]);
    expect(staffUpload.status).toBe(403);
  });

  it("refuses a file of the wrong kind, no kind, or no file, and stores nothing", async () => {
    const { job } = await makeJob(buyer, shop);
    const visitor = await signedIn(shop);
    const path = `/jobs/${job.id}/files`;
    const dxfCertificate = await post(visitor, filesRoute.action, path, job.id, form({ kind: "test_certificate" }, [new File([DXF], "cert.dxf")]));
    expect(dxfCertificate.data.errors.files.join(" ")).toMatch(/cert\.dxf: a DXF drawing can't go here/);
    const noKind = await post(visitor, filesRoute.action, path, job.id, form({}, [new File([PDF], "cert.pdf")]));
    expect(noKind.data.errors.kind[0]).toMatch(/Choose what the file is/);
    const noFile = await post(visitor, filesRoute.action, path, job.id, form({ kind: "test_certificate" }));
    expect(noFile.data.errors.files[0]).toMatch(/Choose at least one/);
    expect(await JobFile.count({ where: { jobId: job.id } })).toBe(0);
  });
});
