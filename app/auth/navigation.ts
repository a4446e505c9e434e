import type { Role } from "./roles";

export interface NavItem {
  to: string;
  label: string;
}

/** The pages each role may use, in the order the navigation bar shows them. */
export const NAV_BY_ROLE: Record<Role, NavItem[]> = {
  buyer: [
    { to: "/specs", label: "My specs" },
    { to: "/jobs", label: "Jobs" },
    { to: "/payments", label: "Payments" },
    { to: "/team", label: "Team" },
  ],
  shop: [
    { to: "/open-specs", label: "Open specs" },
    { to: "/jobs", label: "Jobs" },
    { to: "/team", label: "Team" },
  ],
  account_manager: [
    { to: "/jobs", label: "Job dashboard" },
    { to: "/payments", label: "Payments" },
    { to: "/accounts", label: "My accounts" },
  ],
  admin: [
    { to: "/admin/users", label: "Users" },
    { to: "/admin/organisations", label: "Organisations" },
    { to: "/admin/mail", label: "Mail" },
    { to: "/jobs", label: "Jobs" },
    { to: "/payments", label: "Payments" },
    { to: "/team", label: "Operator team" },
  ],
};

/** Pages for everyone, signed in or not. */
export const PUBLIC_NAV: NavItem[] = [{ to: "/quick-sizing", label: "Quick sizing" }];

/** Where a spec page's "back" leads: the list its reader came from. */
export function specBackLink(reader: { role: Role; organisationId: string }, spec: { organisationId: string }): NavItem {
  if (reader.role === "buyer" && spec.organisationId === reader.organisationId) return { to: "/specs", label: "My specs" };
  if (reader.role === "account_manager") return { to: `/accounts/${spec.organisationId}`, label: "The account" };
  if (reader.role === "admin") return { to: "/admin/organisations", label: "Organisations" };
  return { to: "/open-specs", label: "Open specs" };
}
