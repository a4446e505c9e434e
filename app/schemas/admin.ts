import { z } from "zod";
import { ORGANISATION_KINDS, ROLES } from "~/auth/roles";
import { APPROVALS } from "~/content/shop-approval";
import { sortParam } from "./list-sort";

/** Search, sort and paging parameters of the admin tables; bad values fall back instead of failing. */
const listQuerySchema = z.object({
  q: z.string().trim().max(100).optional().catch(undefined),
  page: z.coerce.number().int().min(1).max(100_000).optional().catch(undefined),
});

export const userListQuerySchema = listQuerySchema.extend({ sort: sortParam("users") });

export const organisationListQuerySchema = listQuerySchema.extend({
  sort: sortParam("organisations"),
  kind: z.enum(ORGANISATION_KINDS).optional().catch(undefined),
  approval: z.enum(APPROVALS).optional().catch(undefined),
});

export const accountListQuerySchema = z.object({ sort: sortParam("accounts") });

export const userActionSchema = z.discriminatedUnion("intent", [
  // The admin's own password is asked for on a second step (`confirm` set), see admin.users.tsx.
  z.object({
    intent: z.literal("change-role"),
    userId: z.uuid(),
    role: z.enum(ROLES),
    confirm: z.literal("yes").optional(),
    currentPassword: z.string().max(200).optional(),
  }),
  z.object({ intent: z.literal("set-active"), userId: z.uuid(), active: z.enum(["true", "false"]).transform((v) => v === "true") }),
  // From the unassigned machine builders on the admin's home: a choice is required there.
  z.object({ intent: z.literal("assign-manager"), organisationId: z.uuid(), managerId: z.uuid({ error: "Choose an account manager." }) }),
]);

export const assignManagerSchema = z.object({
  organisationId: z.uuid(),
  managerId: z.union([z.uuid(), z.literal("")]).transform((v) => v || null),
});
