import type { MachineMotion } from "~/hydraulics";

/** "A and B", "A, B and C". */
export const listInWords = (names: readonly string[]): string =>
  names.length > 1 ? `${names.slice(0, -1).join(", ")} and ${names[names.length - 1]}` : (names[0] ?? "");

/** "Clamp and Feed extend while Press returns": one step of a machine cycle in words (page and workbook alike). */
export function stepInWords(step: readonly MachineMotion[]): string {
  const byMotion = new Map<string, string[]>();
  for (const m of step) byMotion.set(m.motion, [...(byMotion.get(m.motion) ?? []), m.axis]);
  return [...byMotion]
    .map(([motion, axes]) => {
      const many = axes.length > 1;
      const verb = motion === "extend" ? (many ? "extend" : "extends") : many ? "return" : "returns";
      return `${listInWords(axes)} ${verb}`;
    })
    .join(" while ");
}
