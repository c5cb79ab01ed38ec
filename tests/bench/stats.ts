/** Percentiles for the benchmark reports (nearest rank on sorted samples). */
export function percentile(sorted: readonly number[], q: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))] ?? Number.NaN;
}

/** "  name: median … p90 … p99 … max …" in milliseconds. */
export function summary(name: string, values: readonly number[]): string {
  const s = [...values].sort((a, b) => a - b);
  const f = (q: number): string => percentile(s, q).toFixed(3);
  return `  ${name}: median ${f(0.5)} ms   p90 ${f(0.9)} ms   p99 ${f(0.99)} ms   max ${f(1)} ms`;
}
