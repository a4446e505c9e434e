// Company profiles: an organisation's own people edit theirs in settings (bounded and shaped,
// nothing typed lost on a mistake); shops read the buyer's region on open specs.
import { describe, expect, it } from "vitest";
import * as settings from "~/routes/settings";
import * as openSpecs from "~/routes/open-specs";
import { Organisation } from "~/models/index.server";
import { profileById, saveProfile } from "~/services/organisation-profile.server";
import { profileLine } from "~/components/organisation-profile";
import { makeMember, makeOperatorUser, makePublishedSpec } from "../support/factories";
import { signedIn } from "../support/sessions";

const PROFILE = {
  intent: "profile",
  address: "Unit 4, Canal Works\nTipton DY4 7AB",
  region: "UK — West Midlands",
  taxNumber: "GB 123 4567 89",
  quoteContactName: "Imogen Clay",
  quoteContactEmail: "Quotes@Example.test",
  quoteContactPhone: "+44 121 496 0000",
};

describe("the company profile", () => {
  it("is edited in settings by the organisation's people and read back for others", async () => {
    const buyer = await makeMember("buyer", { organisationName: "Ashcombe Presses" });
    const visitor = await signedIn(buyer);
    expect((await visitor.get(settings.loader, "/settings")).data.profile).toMatchObject({ name: "Ashcombe Presses", region: null });
    expect((await visitor.post(settings.action, "/settings", PROFILE)).status).toBe(302);
    const profile = await profileById(buyer.organisationId);
    expect(profile).toEqual({
      name: "Ashcombe Presses",
      kind: "buyer",
      address: PROFILE.address,
      region: PROFILE.region,
      taxNumber: PROFILE.taxNumber,
      quoteContact: { name: "Imogen Clay", email: "quotes@example.test", phone: "+44 121 496 0000" },
    });
    expect(profileLine(profile!)).toBe("Machine builder in UK — West Midlands");
    // Emptied fields are cleared, not kept.
    await visitor.post(settings.action, "/settings", { intent: "profile", region: "UK — West Midlands" });
    expect(await profileById(buyer.organisationId)).toMatchObject({ address: null, taxNumber: null, quoteContact: null });
  });

  it("refuses bad input field by field and keeps what was typed", async () => {
    const shop = await makeMember("shop");
    const visitor = await signedIn(shop);
    const bad = await visitor.post(settings.action, "/settings", {
      ...PROFILE,
      region: "x".repeat(81),
      taxNumber: "<script>",
      quoteContactEmail: "not an address",
      quoteContactPhone: "call us",
    });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.data.profile.error).sort()).toEqual(["quoteContactEmail", "quoteContactPhone", "region", "taxNumber"]);
    expect(bad.data.profile.initialValue.address).toBe(PROFILE.address);
    expect((await Organisation.findByPk(shop.organisationId, { rejectOnEmpty: true })).address).toBeNull();
  });

  it("is not offered to an account manager (the operator's profile is its admins'), and the service refuses them", async () => {
    const manager = await makeOperatorUser("account_manager");
    expect((await (await signedIn(manager)).get(settings.loader, "/settings")).data.profile).toBeNull();
    await expect(saveProfile(manager, { region: "Nowhere" })).rejects.toMatchObject({ init: { status: 403 } });
    const admin = await makeOperatorUser("admin");
    expect((await (await signedIn(admin)).get(settings.loader, "/settings")).data.profile).not.toBeNull();
  });

  it("shows shops the buyer's region on open specs as 'Machine builder in <region>'", async () => {
    const buyer = await makeMember("buyer");
    await Organisation.update({ region: "UK — North West" }, { where: { id: buyer.organisationId } });
    const spec = await makePublishedSpec(buyer);
    const shop = await makeMember("shop");
    const list = await (await signedIn(shop)).get(openSpecs.loader, "/open-specs");
    const row = list.data.specs.find((s: { id: string }) => s.id === spec.id);
    expect(profileLine({ kind: "buyer", region: row.buyerRegion })).toBe("Machine builder in UK — North West");
  });
});
