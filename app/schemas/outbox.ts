import { z } from "zod";
import { sortParam } from "./list-sort";

/** The admin's mail page: which mail to list, its order and the page; bad values fall back instead of failing. */
export const mailListQuerySchema = z.object({
  show: z.enum(["failed", "waiting", "queued"]).optional().catch(undefined),
  sort: sortParam("mail"),
  page: z.coerce.number().int().min(1).max(100_000).optional().catch(undefined),
});

export const sendAgainSchema = z.object({
  intent: z.literal("send-again"),
  mailId: z.uuid({ error: "Choose a mail to send again." }),
});
