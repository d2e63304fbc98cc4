/** One measured line of the benchmark table. */
export interface BenchResult {
  name: string;
  value: number;
  unit: string;
  /** What it is measured against in the same run, and the ratio value / baseline. */
  baseline?: { name: string; value: number; ratio: number };
  notes?: string;
  /** Several scores from one measurement (Lighthouse categories, 0 to 100); `value` is the one the table leads with. */
  scores?: Record<string, number>;
}

export function withBaseline(
  r: Omit<BenchResult, 'baseline'>,
  baselineName: string,
  baselineValue: number,
): BenchResult {
  return {
    ...r,
    baseline: {
      name: baselineName,
      value: baselineValue,
      ratio: baselineValue ? Number((r.value / baselineValue).toFixed(3)) : 0,
    },
  };
}
