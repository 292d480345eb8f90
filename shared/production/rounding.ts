/** Rounding for the production arithmetic: grams as the plan shows them, totals split without losing a gram. */

export const EPS = 1e-9;
export const sum = (xs: number[]) => xs.reduce((a, b) => a + b, 0);

export const round = (x: number, dp = 0) => {
  const f = 10 ** dp;
  return Math.round((x + Math.sign(x) * EPS) * f) / f;
};

/** Grams as the plan shows them: to 1 g, or to 0.1 g under 50 g. */
export const roundGrams = (g: number) => (g < 50 ? round(g, 1) : round(g));

/**
 * Split a total into n parts that add up to it exactly, each a multiple of `step`
 * (largest-remainder method), so mix weights add up to the dough's totals.
 */
export function apportion(total: number, n: number, step: number): number[] {
  const units = Math.round(total / step);
  const base = Math.floor(units / n);
  const extra = units - base * n;
  return Array.from({ length: n }, (_, i) => round((base + (i < extra ? 1 : 0)) * step, step < 1 ? 1 : 0));
}
