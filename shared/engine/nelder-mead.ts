/**
 * Nelder–Mead simplex minimisation (Nelder & Mead 1965, Computer Journal 7(4)) with the usual
 * coefficients (reflection 1, expansion 2, contraction ½, shrink ½), inside box bounds (points are
 * clamped into the box). Deterministic. Example: minimise((x) => (x[0] - 1) ** 2, [0], [[-5, 5]]).x ≈ [1].
 */
export interface MinimiseResult {
  x: number[];
  value: number;
  evaluations: number;
}

export function minimise(
  f: (x: number[]) => number,
  start: number[],
  bounds: [number, number][],
  options: { maxEvaluations?: number; tolerance?: number; initialStep?: number[] } = {},
): MinimiseResult {
  const n = start.length;
  const maxEval = options.maxEvaluations ?? 200 * n;
  const tol = options.tolerance ?? 1e-7;
  const clampX = (x: number[]) => x.map((v, i) => Math.min(bounds[i][1], Math.max(bounds[i][0], v)));
  let evaluations = 0;
  const value = (x: number[]) => {
    evaluations++;
    const v = f(x);
    return Number.isFinite(v) ? v : Infinity;
  };
  const simplex: { x: number[]; v: number }[] = [];
  const x0 = clampX(start);
  simplex.push({ x: x0, v: value(x0) });
  for (let i = 0; i < n; i++) {
    const step = options.initialStep?.[i] ?? 0.1 * (bounds[i][1] - bounds[i][0]);
    const x = [...x0];
    x[i] = x[i] + step <= bounds[i][1] ? x[i] + step : x[i] - step;
    const xc = clampX(x);
    simplex.push({ x: xc, v: value(xc) });
  }
  while (evaluations < maxEval) {
    simplex.sort((a, b) => a.v - b.v);
    const best = simplex[0];
    const worst = simplex[n];
    if (Math.abs(worst.v - best.v) <= tol * (Math.abs(best.v) + 1e-12)) break;
    const centroid = new Array(n).fill(0);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) centroid[j] += simplex[i].x[j] / n;
    const along = (t: number) => clampX(centroid.map((c, j) => c + t * (worst.x[j] - c)));
    const xr = along(-1);
    const vr = value(xr);
    if (vr < best.v) {
      const xe = along(-2);
      const ve = value(xe);
      simplex[n] = ve < vr ? { x: xe, v: ve } : { x: xr, v: vr };
    } else if (vr < simplex[n - 1].v) {
      simplex[n] = { x: xr, v: vr };
    } else {
      const xc = vr < worst.v ? along(-0.5) : along(0.5);
      const vc = value(xc);
      if (vc < Math.min(vr, worst.v)) simplex[n] = { x: xc, v: vc };
      else {
        for (let i = 1; i <= n; i++) {
          const xs = clampX(simplex[i].x.map((v, j) => best.x[j] + 0.5 * (v - best.x[j])));
          simplex[i] = { x: xs, v: value(xs) };
        }
      }
    }
  }
  simplex.sort((a, b) => a.v - b.v);
  return { x: simplex[0].x, value: simplex[0].v, evaluations };
}
