/** The tones a status badge is shown in. */
export type Tone = "neutral" | "good" | "warn" | "bad";

/**
 * A list of statuses in Tenderflow's own words: each status written once, with its label and the
 * tone of its badge. Gives the statuses in the order written (a non-empty list, as the database
 * enum and `z.enum` take it), their labels and their tones.
 */
export function statusWords<S extends string>(words: Record<S, readonly [label: string, tone: Tone]>) {
  // Object.keys keeps the order the statuses are written in (none is an integer-like key).
  const statuses: readonly [S, ...S[]] = Object.keys(words) as S[] as [S, ...S[]];
  const each = <T>(pick: (word: readonly [string, Tone]) => T) => Object.fromEntries(statuses.map((s) => [s, pick(words[s])])) as Record<S, T>;
  return { statuses, labels: each(([label]) => label), tones: each(([, tone]) => tone) };
}
