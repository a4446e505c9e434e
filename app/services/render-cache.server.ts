// What the server makes from data that never changes (a published revision: its design as
// parsed from the database, its rendered bill and trail) is made once per worker and kept here,
// bounded: least recently used first out. In-process on purpose: an entry is rebuilt from the
// database in a few milliseconds, so a miss after a restart or on another worker costs one
// build, while a shared store (PostgreSQL, Redis) would add a round trip to every hit and keep
// nothing the database doesn't already hold.

/** `RENDER_CACHE=off` makes every value every time: only the page bench's "before" column sets it. */
const enabled = () => process.env.RENDER_CACHE !== "off";

/** A bounded map that forgets its least recently used entry first. */
class Kept<T> {
  private readonly entries = new Map<string, T>();
  constructor(private readonly max: number) {}

  once(key: string, make: () => T): T {
    if (!enabled()) return make();
    const kept = this.entries.get(key);
    if (kept !== undefined) {
      // A Map keeps insertion order: moving a hit to the end makes the first key the least recent.
      this.entries.delete(key);
      this.entries.set(key, kept);
      return kept;
    }
    const made = make();
    this.entries.set(key, made);
    if (this.entries.size > this.max) this.entries.delete(this.entries.keys().next().value!);
    return made;
  }

  forget(key: string) {
    this.entries.delete(key);
  }
}

// Rendered fragments are tens of kB each; a parsed design is a few hundred kB of objects.
const fragments = new Kept<string>(500);
const records = new Kept<Promise<unknown>>(100);

/** The markup kept under `key`, rendered by `make` the first time (and after it was evicted). */
export function renderedOnce(key: string, make: () => string): string {
  return fragments.once(key, make);
}

/**
 * A record that never changes, read by `read` the first time (and after it was evicted). A read
 * that fails is not kept, so the next request tries again.
 */
export function readOnce<T>(key: string, read: () => Promise<T>): Promise<T> {
  return records.once(key, () => {
    const reading = read();
    reading.catch(() => records.forget(key));
    return reading;
  }) as Promise<T>;
}
