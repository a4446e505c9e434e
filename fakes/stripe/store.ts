// Every object the fake has made, kept in memory by id (ids are unique across kinds, as in
// Stripe, so an id alone finds its object when a response is expanded).
import { randomBytes } from "node:crypto";
import { invalid, noSuch } from "./errors";
import type { ParamReader } from "./params";

export type StripeObject = { id: string; object: string; created: number };
export type ListObject<T = unknown> = { object: "list"; data: T[]; has_more: boolean; url: string };

export const unixNow = () => Math.floor(Date.now() / 1000);

const ALPHABET = "0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz";
/** `cus_…`, `cs_test_…`: a prefix and 24 random letters and digits, like Stripe's own ids. */
export function newId(prefix: string) {
  return `${prefix}_${[...randomBytes(24)].map((byte) => ALPHABET[byte % ALPHABET.length]).join("")}`;
}

/** Names used in "No such …" errors, as Stripe words them. */
const LABELS: Record<string, string> = { "checkout.session": "checkout.session", payment_method: "PaymentMethod" };

export class Store {
  private readonly objects = new Map<string, StripeObject>();
  /** Properties that exist only when expanded, such as a session's `line_items`. */
  private readonly virtualFields = new Map<string, (owner: StripeObject) => unknown>();

  add<T extends StripeObject>(object: T): T {
    this.objects.set(object.id, object);
    return object;
  }

  find(id: string) {
    return this.objects.get(id);
  }

  get<T extends StripeObject>(kind: string, id: string, param = "id"): T {
    const object = this.objects.get(id);
    if (!object || object.object !== kind) throw noSuch(LABELS[kind] ?? kind, id, param);
    return object as T;
  }

  all<T extends StripeObject>(kind: string): T[] {
    return [...this.objects.values()].filter((object) => object.object === kind) as T[];
  }

  defineVirtualField(kind: string, field: string, read: (owner: StripeObject) => unknown) {
    this.virtualFields.set(`${kind}.${field}`, read);
  }

  /** A list page, newest first, with Stripe's limit / starting_after / ending_before / created. */
  list<T extends StripeObject>(kind: string, url: string, query: ParamReader, keep: (item: T) => boolean = () => true): ListObject<T> {
    const limit = query.integer("limit", { min: 1, max: 100 }) ?? 10;
    const created = createdFilter(query);
    let items = this.all<T>(kind).reverse();
    const after = query.text("starting_after");
    const before = after === undefined ? query.text("ending_before") : undefined;
    if (after !== undefined) items = items.slice(this.position(items, kind, after, "starting_after") + 1);
    if (before !== undefined) items = items.slice(0, this.position(items, kind, before, "ending_before"));
    items = items.filter((item) => created(item.created) && keep(item));
    // ending_before pages towards newer objects: the ones nearest the cursor are kept.
    const page = before !== undefined ? items.slice(-limit) : items.slice(0, limit);
    return { object: "list", data: page, has_more: items.length > limit, url };
  }

  private position(items: StripeObject[], kind: string, id: string, param: string) {
    this.get(kind, id, param);
    return items.findIndex((item) => item.id === id);
  }

  /** A copy of a response with each `expand[]` path replaced by the object its id names. */
  expand(response: unknown, paths: string[]) {
    const copy = structuredClone(response);
    for (const path of paths) this.expandPath(copy, path.split("."), path);
    return copy;
  }

  private expandPath(target: unknown, [field, ...rest]: string[], path: string) {
    if (!isRecord(target)) return;
    if (target.object === "list" && field === "data" && Array.isArray(target.data)) {
      for (const item of target.data) this.expandPath(item, rest, path);
      return;
    }
    const virtual = this.virtualFields.get(`${target.object}.${field}`);
    const value = target[field];
    if (virtual && value === undefined) target[field] = structuredClone(virtual(target as StripeObject));
    else if (typeof value === "string" && this.objects.has(value)) target[field] = structuredClone(this.objects.get(value));
    else if (value !== null && !isRecord(value)) {
      throw invalid(`This property cannot be expanded (${path}).`, { param: "expand" });
    }
    if (rest.length > 0) this.expandPath(target[field], rest, path);
  }
}

function createdFilter(query: ParamReader): (created: number) => boolean {
  if (!query.has("created")) return () => true;
  const exact = typeof query.values.created === "string" ? query.integer("created") : undefined;
  if (exact !== undefined) return (created) => created === exact;
  const range = query.child("created")!.allowOnly(["gt", "gte", "lt", "lte"]);
  const [gt, gte, lt, lte] = ["gt", "gte", "lt", "lte"].map((bound) => range.integer(bound));
  return (created) =>
    (gt === undefined || created > gt) && (gte === undefined || created >= gte) && (lt === undefined || created < lt) && (lte === undefined || created <= lte);
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === "object" && value !== null && !Array.isArray(value);
}

/** Changes some fields of a stored object, checked against its type (Object.assign is not). */
export function update<T extends object>(target: T, changes: Partial<T>) {
  return Object.assign(target, changes);
}
