/** The tones a status badge is shown in. */
export type Tone = "neutral" | "good" | "warn" | "bad";

/**
 * A list of statuses in Tenderflow's own words: each status written once, with its label and the
 * tone of its badge. Gives the statuses in the order written (for the database enum and the
 * schemas), their labels and their tones.
 */
export function statusWords<S extends string>(words: Record<S, readonly [label: string, tone: Tone]>) {
  const statuses = Object.keys(words) as S[] as [S, ...S[]];
  const each = <T>(pick: (word: readonly [string, Tone]) => T) => Object.fromEntries(statuses.map((s) => [s, pick(words[s])])) as Record<S, T>;
  return { statuses: statuses as readonly [S, ...S[]], labels: each(([label]) => label), tones: each(([, tone]) => tone) };
}
