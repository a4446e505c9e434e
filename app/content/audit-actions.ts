// What the audit log records, with the words the admin's page shows. Shared by the service that
// writes entries and the page's filter, so the two never disagree.
export const AUDIT_ACTIONS = {
  "sign-in": "Signed in",
  "sign-in-failed": "Failed sign-in",
  "role-changed": "Role changed",
  "user-deactivated": "Deactivated",
  "user-reactivated": "Reactivated",
  "shop-approved": "Shop approved",
  "shop-refused": "Shop refused",
  "account-manager-assigned": "Account manager assigned",
  "bid-awarded": "Bid awarded",
  "payment-paid": "Payment received",
  "payment-recorded": "Payment recorded by hand",
  "refund-requested": "Refund requested",
  "refund-settled": "Refund settled",
  "refund-failed": "Refund failed",
} as const;

export type AuditAction = keyof typeof AUDIT_ACTIONS;
export const AUDIT_ACTION_KEYS = Object.keys(AUDIT_ACTIONS) as [AuditAction, ...AuditAction[]];

/** The kinds of record an entry speaks of. */
export const AUDIT_SUBJECTS = ["user", "organisation", "spec", "job", "payment", "refund"] as const;
export type AuditSubjectType = (typeof AUDIT_SUBJECTS)[number];
