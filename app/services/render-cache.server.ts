// What the server renders from data that never changes (a published revision's design) is made
// once per worker and kept here, bounded: least recently used first out. In-process on purpose:
// an entry is rebuilt from the database in a few milliseconds, so a miss after a restart or on
// another worker costs one render, while a shared store (PostgreSQL, Redis) would add a round trip
// to every hit and keep nothing the database doesn't already hold.

/** At most this many entries per worker: each is a rendered fragment of tens of kB. */
const MAX_ENTRIES = 500;

/** `RENDER_CACHE=off` renders every time: only the page bench's "before" column sets it. */
const enabled = () => process.env.RENDER_CACHE !== "off";

const entries = new Map<string, string>();

/** The value kept under `key`, made by `make` the first time (and after it was evicted). */
export function renderedOnce(key: string, make: () => string): string {
  if (!enabled()) return make();
  const kept = entries.get(key);
  if (kept !== undefined) {
    // A Map keeps insertion order: moving a hit to the end makes the first key the least recent.
    entries.delete(key);
    entries.set(key, kept);
    return kept;
  }
  const made = make();
  entries.set(key, made);
  if (entries.size > MAX_ENTRIES) entries.delete(entries.keys().next().value!);
  return made;
}
