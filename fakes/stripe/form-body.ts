// Stripe's SDKs send parameters form-encoded with bracketed keys: `metadata[job_id]=7`,
// `line_items[0][price_data][unit_amount]=1500`, `expand[0]=payment_intent` (or `expand[]=`).
// This turns them back into the nested objects and arrays they were made from.
export type Params = { [key: string]: ParamValue };
export type ParamValue = string | ParamValue[] | Params;

export function parseParams(encoded: string): Params {
  const root: Params = {};
  for (const [key, value] of new URLSearchParams(encoded)) {
    const [head, ...rest] = key.split("[");
    const path = [head, ...rest.map((segment) => segment.replace(/]$/, ""))];
    place(root, path, value);
  }
  return root;
}

function place(container: Params | ParamValue[], path: string[], value: string) {
  const [segment, ...rest] = path;
  const slot = segment === "" && Array.isArray(container) ? String(container.length) : segment;
  const target = container as Record<string, ParamValue>;
  if (rest.length === 0) {
    target[slot] = value;
    return;
  }
  // A numeric or empty next segment means this key holds a list.
  const wantsList = /^\d*$/.test(rest[0]);
  const existing = target[slot];
  const child = typeof existing === "object" && existing !== null ? existing : wantsList ? [] : {};
  target[slot] = child;
  place(child, rest, value);
}
