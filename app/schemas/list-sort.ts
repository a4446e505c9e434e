import { z } from "zod";

// The orders each list offers, by the name that stands in the URL (`?sort=`), with the words the
// page shows. The first is the default. Shared by the pages (their sort links) and the services
// (which turn a key into an ORDER BY), so a key the page offers is always one the query knows.

export const LIST_SORTS = {
  users: { newest: "Newest first", name: "Name A–Z", "last-sign-in": "Last signed in" },
  organisations: { newest: "Newest first", name: "Name A–Z" },
  mail: { "last-tried": "Last tried first", "longest-waiting": "Waiting longest first", recipient: "Recipient A–Z" },
  accounts: { name: "Name A–Z", newest: "Newest customers first" },
} as const satisfies Record<string, Record<string, string>>;

export type SortedList = keyof typeof LIST_SORTS;
export type SortOf<L extends SortedList> = keyof (typeof LIST_SORTS)[L] & string;

/** The list's sort from the URL: an unknown or missing value is the default order, never an error. */
export function sortParam<L extends SortedList>(list: L) {
  const keys = Object.keys(LIST_SORTS[list]) as [SortOf<L>, ...SortOf<L>[]];
  return z.enum(keys).catch(keys[0]).default(keys[0]);
}
