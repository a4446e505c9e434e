import type { Circuit } from "./design";

/**
 * Groups ports joined in pairs, directly or through a chain, into nets (union–find); the returned
 * function names a port's net, so two ports share a net when it names both the same.
 */
export function portNets(joins: Iterable<readonly [string, string]>): (port: string) => string {
  const parent = new Map<string, string>();
  const find = (x: string): string => {
    const p = parent.get(x) ?? x;
    if (p === x) return x;
    const root = find(p);
    parent.set(x, root);
    return root;
  };
  for (const [a, b] of joins) parent.set(find(a), find(b));
  return find;
}

/** The nets of the lines that carry oil: pilots only signal and a shaft turns, so neither joins ports. */
export const oilNets = (circuit: Pick<Circuit, "connections">) =>
  portNets(circuit.connections.filter((c) => c.line !== "pilot" && c.line !== "shaft").map((c) => [c.from, c.to] as const));
