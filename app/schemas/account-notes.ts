import { z } from "zod";

// A note on a buyer account (the account page): added, or edited by its id.
export const ACCOUNT_NOTE_MAX = 2000;

const body = z
  .string({ error: "Write the note first." })
  .trim()
  .min(1, "Write the note first.")
  .max(ACCOUNT_NOTE_MAX, `Keep a note under ${ACCOUNT_NOTE_MAX + 1} characters.`);

export const accountNoteSchema = z.discriminatedUnion("intent", [
  z.object({ intent: z.literal("add-note"), body }),
  z.object({ intent: z.literal("edit-note"), noteId: z.uuid({ error: "That note was not found." }), body }),
]);
