// What an action answers when a form is refused, for component tests that render the form again.
import type { SubmissionResult } from "@conform-to/react";

/** Conform's reply to a refused post: the fields as posted and the message beside each bad one. */
export const refused = (initialValue: Record<string, string>, error: Record<string, string[]>): SubmissionResult<string[]> => ({
  status: "error",
  initialValue,
  error,
});
