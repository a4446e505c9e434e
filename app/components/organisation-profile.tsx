import { KIND_LABELS, type OrganisationKind } from "~/auth/roles";

// An organisation's company profile as other parties see it: beside a shop's offer, on the order
// confirmation, and (its region) on open specs. Plain data, built on the server by
// `profileOf` (services/organisation-profile.server.ts).

export interface OrganisationProfile {
  name: string;
  kind: OrganisationKind;
  address: string | null;
  region: string | null;
  taxNumber: string | null;
  quoteContact: { name: string | null; email: string | null; phone: string | null } | null;
}

/** One line: "Machine builder in UK — West Midlands" (or just the kind when no region is given). */
export function profileLine(profile: Pick<OrganisationProfile, "kind" | "region">) {
  return profile.region ? `${KIND_LABELS[profile.kind]} in ${profile.region}` : KIND_LABELS[profile.kind];
}

/** The profile as a small card; `title` names it (e.g. "The shop"). Missing fields are left out. */
export function OrganisationProfileCard({ profile, title, className = "" }: { profile: OrganisationProfile; title?: string; className?: string }) {
  const contact = profile.quoteContact;
  return (
    <section aria-label={title ?? profile.name} className={`rounded-md bg-ink-50 p-3 text-sm ${className}`}>
      {title ? <p className="text-xs font-semibold tracking-wide text-ink-600 uppercase">{title}</p> : null}
      <p className="font-semibold">{profile.name}</p>
      <p className="text-ink-600">{profileLine(profile)}</p>
      {profile.address ? <p className="mt-1 whitespace-pre-line">{profile.address}</p> : null}
      {profile.taxNumber ? <p className="mt-1">Tax number: {profile.taxNumber}</p> : null}
      {contact ? (
        <p className="mt-1">
          Quotes: {[contact.name, contact.phone].filter(Boolean).join(", ")}
          {contact.email ? (
            <>
              {contact.name || contact.phone ? ", " : null}
              <a href={`mailto:${contact.email}`} className="break-all text-flow-700 hover:underline">
                {contact.email}
              </a>
            </>
          ) : null}
        </p>
      ) : null}
    </section>
  );
}
