import { formatNumber } from "./number-format";

/** A count with its noun, as every page writes it: "1 user", "1,204 users". */
export const countOf = (n: number, noun: string, plural = `${noun}s`) => `${formatNumber(n, 3)} ${n === 1 ? noun : plural}`;
