// The dashboard's bars of jobs per stage (app/components/jobs-by-stage-chart.tsx): whole-number
// ticks, bars in proportion, every stage drawn (zeros too), and the same counts in the table.
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { JobsByStageChart, countTicks } from "~/components/jobs-by-stage-chart";
import { JOB_STAGES, JOB_STAGE_LABELS } from "~/content/job-milestones";

describe("countTicks", () => {
  it("counts in whole steps of 1, 2 or 5 × 10ⁿ, at most five steps, from 0 past the highest count", () => {
    expect(countTicks(0)).toEqual([0, 1]);
    expect(countTicks(1)).toEqual([0, 1]);
    expect(countTicks(4)).toEqual([0, 1, 2, 3, 4]);
    expect(countTicks(7)).toEqual([0, 2, 4, 6, 8]);
    expect(countTicks(10)).toEqual([0, 2, 4, 6, 8, 10]);
    expect(countTicks(23)).toEqual([0, 5, 10, 15, 20, 25]);
    expect(countTicks(120)).toEqual([0, 50, 100, 150]);
  });
});

describe("JobsByStageChart", () => {
  const data = JOB_STAGES.map((stage, i) => ({ stage, count: [2, 0, 5, 1, 0, 3, 4][i] ?? 0 }));
  const html = renderToStaticMarkup(<JobsByStageChart data={data} caption="Jobs by stage" />);
  const bars = [...html.matchAll(/<g data-stage-bar="(\d+)">.*?<rect [^>]*width="([\d.]+)"/g)].map((m) => ({ count: Number(m[1]), width: Number(m[2]) }));

  it("draws a bar for every stage, zeros included, each as long as its count", () => {
    expect(bars).toHaveLength(JOB_STAGES.length);
    expect(bars.map((b) => b.count)).toEqual(data.map((d) => d.count));
    const perJob = bars.find((b) => b.count === 5)!.width / 5;
    for (const bar of bars) expect(bar.width).toBeCloseTo(bar.count * perJob, 6);
    expect(bars.filter((b) => b.count === 0).every((b) => b.width === 0)).toBe(true);
  });

  it("names each stage beside its bar, and gives the same counts in a table for screen readers and phones", () => {
    for (const { stage, count } of data) {
      expect(html).toContain(`>${JOB_STAGE_LABELS[stage]}</text>`);
      expect(html).toContain(
        `<th scope="row" class="py-1 text-left font-normal">${JOB_STAGE_LABELS[stage]}</th><td class="py-1 text-right font-semibold tabular-nums">${count}</td>`,
      );
    }
    expect(html).toMatch(/<div aria-hidden="true"[^>]*><svg data-jobs-chart/);
  });
});
