import type { Transaction } from "sequelize";
import { authorize, can, viewerOf } from "~/auth/access-policy.server";
import type { OrganisationProfile } from "~/components/organisation-profile";
import { Organisation, type User } from "~/models/index.server";
import type { ProfileInput } from "~/schemas/profile";

// Company profiles: the organisation's own people edit theirs in settings (the access policy's
// organisation.editProfile); anyone a page shows the organisation to sees it through `profileOf`.

type ProfileColumns = Pick<Organisation, "name" | "kind" | "address" | "region" | "taxNumber" | "quoteContactName" | "quoteContactEmail" | "quoteContactPhone">;

/** The columns `profileOf` reads, for a query's `attributes`. */
export const PROFILE_ATTRIBUTES = ["id", "name", "kind", "address", "region", "taxNumber", "quoteContactName", "quoteContactEmail", "quoteContactPhone"];

/** The plain profile of an organisation row, for OrganisationProfileCard and profileLine. */
export function profileOf(o: ProfileColumns): OrganisationProfile {
  const contact = o.quoteContactName || o.quoteContactEmail || o.quoteContactPhone;
  return {
    name: o.name,
    kind: o.kind,
    address: o.address,
    region: o.region,
    taxNumber: o.taxNumber,
    quoteContact: contact ? { name: o.quoteContactName, email: o.quoteContactEmail, phone: o.quoteContactPhone } : null,
  };
}

/** An organisation's profile by id, for a page that already decided the reader may see it. */
export async function profileById(organisationId: string, transaction?: Transaction): Promise<OrganisationProfile | null> {
  const organisation = await Organisation.findByPk(organisationId, { attributes: PROFILE_ATTRIBUTES, transaction });
  return organisation ? profileOf(organisation) : null;
}

/** The signed-in person's own organisation's profile, and whether they may edit it. */
export async function ownProfile(user: User) {
  const organisation = await Organisation.findByPk(user.organisationId, { rejectOnEmpty: true });
  return { profile: profileOf(organisation), canEdit: can(await viewerOf(user), "organisation.editProfile", organisation) };
}

export async function saveProfile(user: User, input: ProfileInput) {
  const organisation = await Organisation.findByPk(user.organisationId, { rejectOnEmpty: true });
  authorize(await viewerOf(user), "organisation.editProfile", organisation);
  await organisation.update({
    address: input.address ?? null,
    region: input.region ?? null,
    taxNumber: input.taxNumber ?? null,
    quoteContactName: input.quoteContactName ?? null,
    quoteContactEmail: input.quoteContactEmail?.toLowerCase() ?? null,
    quoteContactPhone: input.quoteContactPhone ?? null,
  });
  return profileOf(organisation);
}
