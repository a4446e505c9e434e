import { sequelize } from "~/models/index.server";

// What every paged, searched list does the same way: the page's offset and count, a typed search
// matched literally, and a name sorted as people read it.

/** The page asked for (1 when missing or odd), its offset and limit. */
export function pageOf(requested: number | undefined, size: number) {
  const page = Math.max(1, Math.floor(requested ?? 1) || 1);
  return { page, offset: (page - 1) * size, limit: size };
}

/** How many pages `total` rows fill; an empty list is one empty page. */
export const pageCountOf = (total: number, size: number) => Math.max(1, Math.ceil(total / size));

/** An ILIKE pattern for what a person typed: their % and _ are matched literally. */
export const likePattern = (q: string) => `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/** Orders by a text column without regard to case ("acme" beside "Acme"). */
export const caseless = (column: string) => sequelize.fn("lower", sequelize.col(column));
