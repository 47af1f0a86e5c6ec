/** One measured figure of a benchmark file; bench/run.ts prints these. */
export interface BenchResult {
  name: string;
  opsPerSecond: number;
  /** Time per operation divided by the time per iteration of the file's baseline loop, measured in the same run. */
  ratioToBaseline: number;
  note?: string;
}
