/**
 * Sizing-engine throughput on one core: `npx tsx tests/bench/engine.bench.ts`.
 * Prints designs per second (median of five rounds) for a mix of axes, through the validating
 * entry point and the parsed one, next to a JSON round-trip of the same requirements as a
 * baseline; the ratios to the baseline compare runs on different machines or loads.
 */
import { parseRequirements, sizeCircuit, sizeCircuitParsed, type RequirementsInput } from "../../app/hydraulics";
import { AXIS_MIX } from "../support/hydraulics";

/** The series checks' five axes (tests/support/hydraulics.ts) and a long, light, fast horizontal stroke. */
const MIX: RequirementsInput[] = [
  ...AXIS_MIX,
  {
    orientation: "horizontal",
    massKg: 50,
    strokeMm: 2500,
    extendSpeedMmS: 500,
    retractSpeedMmS: 500,
    mounting: "fixed-free",
    cyclesPerHour: 10,
    hoursPerDay: 4,
    supplyHz: 50,
  },
];

/**
 * Runs body `iterations` times after a warm-up, in five rounds, and prints the median rate per
 * second of this process's CPU time (the one-core figure) and of wall time. The median of rounds
 * keeps one busy moment on a shared machine from deciding the figure.
 */
function rate(label: string, iterations: number, body: (i: number) => unknown): number {
  for (let i = 0; i < Math.min(iterations, 5000); i++) body(i); // warm-up for the JIT
  const rounds = 5;
  const per = Math.ceil(iterations / rounds);
  const cpuRates: number[] = [];
  const wallRates: number[] = [];
  let produced = 0;
  for (let round = 0; round < rounds; round++) {
    const cpuStart = process.cpuUsage();
    const start = performance.now();
    for (let i = 0; i < per; i++) if (body(round * per + i)) produced++;
    const wallS = (performance.now() - start) / 1000;
    const cpu = process.cpuUsage(cpuStart);
    cpuRates.push(per / ((cpu.user + cpu.system) / 1e6));
    wallRates.push(per / wallS);
  }
  const median = (xs: number[]) => xs.sort((a, b) => a - b)[Math.floor(xs.length / 2)];
  const perCpuSecond = median(cpuRates);
  const fmt = (x: number) => Math.round(x).toLocaleString("en-GB").padStart(10);
  console.log(
    `${label.padEnd(44)} ${fmt(perCpuSecond)} /CPU-s ${fmt(median(wallRates))} /wall-s${produced === per * rounds ? "" : "  (some runs returned nothing)"}`,
  );
  return perCpuSecond;
}

const N = 200_000;
const parsed = MIX.map((r) => parseRequirements(r));
const baseline = rate("baseline: JSON.parse(JSON.stringify(req))", N, (i) => JSON.parse(JSON.stringify(MIX[i % MIX.length])));
const full = rate("sizeCircuit (schema parse + sizing)", N, (i) => sizeCircuit(MIX[i % MIX.length]));
const engine = rate("sizeCircuitParsed (sizing only)", N, (i) => sizeCircuitParsed(parsed[i % parsed.length]));
console.log(`\nmix of ${MIX.length} axes; target ≥ 50 000 designs per CPU-second on one core`);
console.log(`sizeCircuit is ${(baseline / full).toFixed(1)}× slower than the JSON round-trip baseline; sizeCircuitParsed ${(baseline / engine).toFixed(1)}×`);
