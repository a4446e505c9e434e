// A published spec's page sends its design without the long detail; the bill and the trail come
// when the reader opens them (`?detail=`), rendered once per revision, and only to its readers.
import { describe, expect, it } from "vitest";
import * as specPage from "~/routes/spec";
import { SpecRevision } from "~/models/index.server";
import { makeMember, makePublishedSpec } from "../support/factories";
import { signedIn } from "../support/sessions";

describe("a published spec's long detail", () => {
  it("is left out of the page, counted, and sent as rendered HTML when asked for", async () => {
    const buyer = await makeMember("buyer");
    const spec = await makePublishedSpec(buyer);
    const revision = await SpecRevision.findOne({ where: { specId: spec.id }, rejectOnEmpty: true });
    const design = revision.axes[0].design as { trail: { quantity: string }[]; bom: { key: string }[]; cylinder: { boreMm: number } };
    const visitor = await signedIn(buyer);

    const page = await visitor.get(specPage.loader, `/specs/${spec.id}`, { specId: spec.id });
    expect(page.data.published.design.cylinder.boreMm).toBe(design.cylinder.boreMm);
    expect(page.data.published.design).not.toHaveProperty("trail");
    expect(page.data.published.design).not.toHaveProperty("bom");
    expect(page.data.published.counts).toEqual({ bill: design.bom.length, trail: design.trail.length });
    expect(page.data.detail).toBeNull();
    // The page's data is now a fraction of the stored design.
    expect(JSON.stringify(page.data.published).length).toBeLessThan(JSON.stringify(design).length / 2);

    const trail = await visitor.get(specPage.loader, `/specs/${spec.id}?detail=trail`, { specId: spec.id });
    expect(trail.data.detail.part).toBe("trail");
    expect(trail.data.detail.html.match(/data-trail-row/g)).toHaveLength(design.trail.length);
    expect(trail.data.detail.html).toContain(design.trail[0].quantity);
    // Asked again (the cache's copy), the same HTML.
    const again = await visitor.get(specPage.loader, `/specs/${spec.id}?detail=trail`, { specId: spec.id });
    expect(again.data.detail.html).toBe(trail.data.detail.html);

    const bill = await visitor.get(specPage.loader, `/specs/${spec.id}?detail=bill`, { specId: spec.id });
    expect(bill.data.detail.html.match(/data-bom-key=/g)).toHaveLength(design.bom.length);
    // Anything else is no detail at all.
    const other = await visitor.get(specPage.loader, `/specs/${spec.id}?detail=answers`, { specId: spec.id });
    expect(other.data.detail).toBeNull();
  });

  it("is a 404 for a reader outside the spec, like the page", async () => {
    const buyer = await makeMember("buyer");
    const spec = await makePublishedSpec(buyer);
    const stranger = await signedIn(await makeMember("buyer"));
    const res = await stranger.get(specPage.loader, `/specs/${spec.id}?detail=trail`, { specId: spec.id });
    expect(res.status).toBe(404);
  });
});
