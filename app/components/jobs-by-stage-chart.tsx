import { JOB_STAGE_LABELS, type JobStage } from "~/content/job-milestones";

// How many jobs are at each stage, as horizontal bars. Plain SVG of a fixed size, like the cycle
// chart: a chart library's server render was a quarter of the dashboard's server time and most of
// its script, for seven bars. The server renders the same SVG the browser hydrates. Screen readers
// get the table below it instead of the drawing, and so does a phone, where the drawing is wider
// than the screen: the counts in a short table rather than a chart to scroll sideways.

const WIDTH = 560;
const ROW = 30;
const TOP = 6;
const AXIS = 24;
const LABELS = 140;
const GAP = 8;
/** Room right of the longest bar for its count. */
const RIGHT = 36;
const BAR = 16;
const FONT = 12;
const COLOURS = { bar: "#0b7f71", grid: "#e6eaef", label: "#1f2a37", tick: "#3f4d5e" };

/** Whole-number ticks from 0 to the first of 1, 2, 5 × 10ⁿ steps that reaches `max` in at most five steps. */
export function countTicks(max: number): number[] {
  const top = Math.max(1, Math.ceil(max));
  for (let decade = 1; ; decade *= 10) {
    const step = [1, 2, 5].map((m) => m * decade).find((s) => top / s <= 5);
    if (step) return Array.from({ length: Math.ceil(top / step) + 1 }, (_, i) => i * step);
  }
}

export function JobsByStageChart({ data, caption }: { data: { stage: JobStage; count: number }[]; caption: string }) {
  const rows = data.map((d) => ({ label: JOB_STAGE_LABELS[d.stage], count: d.count }));
  const ticks = countTicks(Math.max(0, ...rows.map((r) => r.count)));
  const left = LABELS + GAP;
  const plot = WIDTH - left - RIGHT;
  const x = (count: number) => left + (count / ticks[ticks.length - 1]) * plot;
  const height = TOP + rows.length * ROW + AXIS;
  const bottom = TOP + rows.length * ROW;
  return (
    <figure>
      <figcaption className="mb-2 text-sm font-semibold text-ink-800">{caption}</figcaption>
      <div aria-hidden="true" className="hidden overflow-x-auto sm:block">
        <svg data-jobs-chart width={WIDTH} height={height} viewBox={`0 0 ${WIDTH} ${height}`} fontFamily="inherit" fontSize={FONT}>
          {ticks.map((t) => (
            <g key={t}>
              <line x1={x(t)} x2={x(t)} y1={TOP} y2={bottom} stroke={COLOURS.grid} />
              <text x={x(t)} y={bottom + 16} textAnchor="middle" fill={COLOURS.tick}>
                {t}
              </text>
            </g>
          ))}
          <line x1={left} x2={left + plot} y1={bottom} y2={bottom} stroke={COLOURS.tick} />
          {rows.map((r, i) => {
            const middle = TOP + i * ROW + ROW / 2;
            return (
              <g key={r.label} data-stage-bar={r.count}>
                <text x={LABELS} y={middle} dy="0.35em" textAnchor="end" fill={COLOURS.label}>
                  {r.label}
                </text>
                <rect x={left} y={middle - BAR / 2} width={x(r.count) - left} height={BAR} fill={COLOURS.bar} />
                <text x={x(r.count) + 6} y={middle} dy="0.35em" fill={COLOURS.label}>
                  {r.count}
                </text>
              </g>
            );
          })}
        </svg>
      </div>
      <table className="w-full text-sm sm:sr-only">
        <caption className="sr-only">{caption}</caption>
        <thead className="sr-only">
          <tr>
            <th scope="col">Stage</th>
            <th scope="col">Jobs</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.label} className="border-t border-ink-100">
              <th scope="row" className="py-1 text-left font-normal">
                {r.label}
              </th>
              <td className="py-1 text-right font-semibold tabular-nums">{r.count}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </figure>
  );
}
