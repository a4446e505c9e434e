/**
 * Number text for specifications and messages. Built from integer parts because turning a
 * fractional double into text is several times slower, and the engine writes dozens per design.
 */
const SCALE = [1, 10, 100, 1000];

/** x rounded to `decimals` (0–3) places, trailing zeros dropped: 27.55 → "27.6" (1), 6.35 → "6.35" (2). */
export function num(x: number, decimals = 1): string {
  if (!Number.isFinite(x)) return String(x);
  const negative = x < 0;
  const scale = SCALE[decimals];
  const scaled = Math.round(Math.abs(x) * scale);
  const whole = Math.floor(scaled / scale);
  let frac = scaled - whole * scale;
  let text = String(whole);
  if (frac > 0) {
    let digits = decimals;
    while (frac % 10 === 0) {
      frac /= 10;
      digits--;
    }
    const f = String(frac);
    text += "." + (f.length < digits ? "0".repeat(digits - f.length) + f : f);
  }
  return negative && scaled > 0 ? "-" + text : text;
}
