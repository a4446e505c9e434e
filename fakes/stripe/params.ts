// Typed reading of request parameters. Every failure is the error Stripe gives for it, naming
// the parameter the way Stripe does (`line_items[0][price_data][currency]`).
import { invalid, invalidParam, missingParam } from "./errors";
import type { ParamValue, Params } from "./form-body";

export type Metadata = Record<string, string>;

export class ParamReader {
  constructor(
    readonly values: Params,
    /** How Stripe names this object in errors, such as `line_items[0][price_data]`. */
    readonly prefix = "",
  ) {}

  private label(name: string) {
    return this.prefix ? `${this.prefix}[${name}]` : name;
  }

  has(name: string) {
    return this.values[name] !== undefined;
  }

  /** Stripe refuses parameters it does not know; so does the fake, so typos surface in tests. */
  allowOnly(names: string[]) {
    for (const name of Object.keys(this.values)) {
      if (name !== "expand" && !names.includes(name)) {
        throw invalid(`Received unknown parameter: ${this.label(name)}`, { code: "parameter_unknown", param: this.label(name) });
      }
    }
    return this;
  }

  text(name: string): string | undefined {
    const value = this.values[name];
    if (value === undefined) return undefined;
    if (typeof value !== "string") throw invalidParam(this.label(name), `Invalid string: ${describe(value)}`);
    return value;
  }

  requiredText(name: string): string {
    const value = this.text(name);
    if (value === undefined || value === "") throw missingParam(this.label(name));
    return value;
  }

  integer(name: string, { min = -Infinity, max = Infinity } = {}): number | undefined {
    const value = this.text(name);
    if (value === undefined) return undefined;
    const number = Number(value);
    if (!/^-?\d+$/.test(value) || number < min || number > max) {
      const kind = min >= 1 ? "positive integer" : min >= 0 ? "non-negative integer" : "integer";
      throw invalidParam(this.label(name), `Invalid ${kind}: ${value}`, "parameter_invalid_integer");
    }
    return number;
  }

  oneOf<T extends string>(name: string, allowed: readonly T[]): T | undefined {
    const value = this.text(name);
    if (value === undefined) return undefined;
    if (!allowed.includes(value as T)) {
      throw invalidParam(this.label(name), `Invalid ${this.label(name)}: must be one of ${allowed.join(", ")}`);
    }
    return value as T;
  }

  /** Metadata as Stripe treats it: string values only, an empty value (or `metadata=""`) unsets. */
  metadata(name = "metadata"): Metadata | "" | undefined {
    const value = this.values[name];
    if (value === undefined || value === "") return value;
    if (typeof value !== "object" || Array.isArray(value)) {
      throw invalidParam(this.label(name), `Invalid object: ${describe(value)}`, "parameter_invalid_empty");
    }
    const entries = Object.entries(value);
    if (entries.length > 50) throw invalidParam(this.label(name), "Metadata can have at most 50 keys.");
    for (const [key, item] of entries) {
      if (typeof item !== "string") throw invalidParam(`${this.label(name)}[${key}]`, `Invalid string: ${describe(item)}`);
      if (key.length > 40) throw invalidParam(`${this.label(name)}[${key}]`, "Metadata keys can be at most 40 characters long.");
      if (item.length > 500) throw invalidParam(`${this.label(name)}[${key}]`, "Metadata values can be at most 500 characters long.");
    }
    return value as Metadata;
  }

  child(name: string): ParamReader | undefined {
    const value = this.values[name];
    if (value === undefined) return undefined;
    if (typeof value !== "object" || Array.isArray(value)) {
      throw invalidParam(this.label(name), `Invalid object: ${describe(value)}`, "parameter_invalid_empty");
    }
    return new ParamReader(value, this.label(name));
  }

  list(name: string): ParamReader[] | undefined {
    const value = this.values[name];
    if (value === undefined) return undefined;
    if (!Array.isArray(value)) throw invalidParam(this.label(name), `Invalid array: ${describe(value)}`);
    return value.map((item, index) => {
      if (typeof item !== "object" || Array.isArray(item)) {
        throw invalidParam(`${this.label(name)}[${index}]`, `Invalid object: ${describe(item)}`);
      }
      return new ParamReader(item, `${this.label(name)}[${index}]`);
    });
  }

  /** `expand[]` as a list of dotted paths. */
  expand(): string[] {
    const value = this.values.expand;
    if (value === undefined) return [];
    const items = Array.isArray(value) ? value : [value];
    return items.map((item, index) => {
      if (typeof item !== "string") throw invalidParam(`expand[${index}]`, `Invalid string: ${describe(item)}`);
      return item;
    });
  }
}

/** Applies a metadata update the way Stripe does: keys merge, an empty value removes a key. */
export function mergeMetadata(current: Metadata, update: Metadata | "" | undefined): Metadata {
  if (update === undefined) return current;
  if (update === "") return {};
  const merged = { ...current, ...update };
  for (const [key, value] of Object.entries(update)) if (value === "") delete merged[key];
  return merged;
}

function describe(value: ParamValue) {
  return typeof value === "string" ? value : JSON.stringify(value);
}
