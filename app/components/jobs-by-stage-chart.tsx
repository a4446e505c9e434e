import { Bar, BarChart, CartesianGrid, LabelList, XAxis, YAxis } from "recharts";
import { JOB_STAGE_LABELS, type JobStage } from "~/content/job-milestones";

// A fixed-size chart (no ResponsiveContainer), so the server renders the same SVG the browser
// hydrates; the fixed id keeps recharts' clip-path id the same on both sides. Screen readers get
// the table below it instead of the drawing, and so does a phone, where the drawing is wider than
// the screen: the counts in a short table rather than a chart to scroll sideways.

const WIDTH = 560;
const ROW = 30;

export function JobsByStageChart({ data, caption }: { data: { stage: JobStage; count: number }[]; caption: string }) {
  const rows = data.map((d) => ({ label: JOB_STAGE_LABELS[d.stage], count: d.count }));
  return (
    <figure>
      <figcaption className="mb-2 text-sm font-semibold text-ink-800">{caption}</figcaption>
      <div aria-hidden="true" className="hidden overflow-x-auto sm:block">
        <BarChart
          id="jobs-by-stage"
          width={WIDTH}
          height={36 + rows.length * ROW}
          data={rows}
          layout="vertical"
          margin={{ top: 4, right: 36, bottom: 4, left: 4 }}
        >
          <CartesianGrid horizontal={false} stroke="#e6eaef" />
          <XAxis type="number" allowDecimals={false} domain={[0, (max: number) => Math.max(1, max)]} tick={{ fontSize: 12, fill: "#3f4d5e" }} />
          <YAxis type="category" dataKey="label" width={140} interval={0} tick={{ fontSize: 12, fill: "#1f2a37" }} />
          <Bar dataKey="count" fill="#0b7f71" barSize={16} isAnimationActive={false}>
            <LabelList dataKey="count" position="right" fontSize={12} fill="#1f2a37" />
          </Bar>
        </BarChart>
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
