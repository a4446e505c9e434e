/** A count with its noun, as every page writes it: "1 user", "1,204 users". */
export const countOf = (n: number, noun: string, plural = `${noun}s`) => `${n.toLocaleString("en-GB")} ${n === 1 ? noun : plural}`;
