// Roles and organisation kinds: shared by server and client (navigation shows what a role may use).
export const ROLES = ["buyer", "shop", "account_manager", "admin"] as const;
export type Role = (typeof ROLES)[number];

export const ORGANISATION_KINDS = ["buyer", "shop", "operator"] as const;
export type OrganisationKind = (typeof ORGANISATION_KINDS)[number];

export const ROLE_LABELS: Record<Role, string> = {
  buyer: "Machine builder",
  shop: "Fluid-power shop",
  account_manager: "Account manager",
  admin: "Administrator",
};

export const KIND_LABELS: Record<OrganisationKind, string> = {
  buyer: "Machine builder",
  shop: "Fluid-power shop",
  operator: "Tenderflow operator",
};

/** Operator staff: the roles that follow buyer accounts (admins every account). The one list. */
export const OPERATOR_ROLES = ["account_manager", "admin"] as const satisfies readonly Role[];

/** Which roles an organisation of each kind may hold. */
export const ROLES_BY_KIND: Record<OrganisationKind, readonly Role[]> = {
  buyer: ["buyer"],
  shop: ["shop"],
  operator: OPERATOR_ROLES,
};

/** Each role's home page: where sign-in lands. */
export const HOME_BY_ROLE: Record<Role, string> = {
  buyer: "/specs",
  shop: "/open-specs",
  account_manager: "/jobs",
  admin: "/admin/users",
};

/** Roles that see their organisation's team page and invite colleagues. */
export const TEAM_ROLES = ["buyer", "shop", "admin"] as const satisfies readonly Role[];

/**
 * Who may open which area's pages (the page gate, `requireRole`); which records a page shows
 * and what may be done with them is the access policy's (access-policy.server.ts).
 */
export const PAGE_ROLES = {
  /** A buyer's own specs: the list, the form, files, the bid comparison and the award, answers. */
  ownSpecs: ["buyer"],
  /** Open specs, the bid form and questions. */
  bidding: ["shop"],
  team: TEAM_ROLES,
  accounts: OPERATOR_ROLES,
  payments: ["buyer", ...OPERATOR_ROLES],
  administration: ["admin"],
} as const satisfies Record<string, readonly Role[]>;
