/**
 * Straight lines through scattered points, robust to a few bad picks: the Theil–Sen estimator
 * (slope = median of the pairwise slopes, intercept = median of y − slope·x; Sen 1968, J. Am.
 * Stat. Assoc. 63, 1379–1389, from memory), and plain least squares where every point is trusted.
 */

export interface Line {
  slope: number;
  intercept: number;
}

export function median(values: ArrayLike<number>): number {
  const v = Array.from(values).sort((a, b) => a - b);
  const m = v.length >> 1;
  return v.length === 0 ? Number.NaN : v.length % 2 ? v[m] : (v[m - 1] + v[m]) / 2;
}

export function theilSen(x: ArrayLike<number>, y: ArrayLike<number>): Line {
  const n = x.length;
  const slopes: number[] = [];
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) if (x[j] !== x[i]) slopes.push((y[j] - y[i]) / (x[j] - x[i]));
  }
  const slope = median(slopes);
  const intercept = median(Array.from({ length: n }, (_, i) => y[i] - slope * x[i]));
  return { slope, intercept };
}

/** Least-squares line and its residual sum of squares. */
export function leastSquares(x: ArrayLike<number>, y: ArrayLike<number>, from = 0, to = x.length): Line & { rss: number } {
  const n = to - from;
  let sx = 0, sy = 0;
  for (let i = from; i < to; i++) {
    sx += x[i];
    sy += y[i];
  }
  const mx = sx / n, my = sy / n;
  let sxx = 0, sxy = 0;
  for (let i = from; i < to; i++) {
    sxx += (x[i] - mx) ** 2;
    sxy += (x[i] - mx) * (y[i] - my);
  }
  const slope = sxx > 0 ? sxy / sxx : 0;
  const intercept = my - slope * mx;
  let rss = 0;
  for (let i = from; i < to; i++) rss += (y[i] - intercept - slope * x[i]) ** 2;
  return { slope, intercept, rss };
}

/** RMS of the residuals about a line. */
export function rmsAbout(line: Line, x: ArrayLike<number>, y: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < x.length; i++) s += (y[i] - line.intercept - line.slope * x[i]) ** 2;
  return Math.sqrt(s / Math.max(1, x.length));
}

/**
 * One slope shared by several groups of points, each group with its own intercept (least
 * squares about the group means), fitted again without points more than three robust standard
 * deviations off. Long groups weigh more than short ones, as they should for a velocity.
 */
export function pooledSlope(groups: readonly { x: ArrayLike<number>; y: ArrayLike<number> }[]): number {
  const centred = groups
    .filter((g) => g.x.length >= 2)
    .map((g) => {
      const n = g.x.length;
      let mx = 0, my = 0;
      for (let i = 0; i < n; i++) [mx, my] = [mx + g.x[i] / n, my + g.y[i] / n];
      return Array.from({ length: n }, (_, i) => [g.x[i] - mx, g.y[i] - my] as const);
    })
    .flat();
  const fit = (keep: (i: number) => boolean) => {
    let sxx = 0, sxy = 0;
    centred.forEach(([dx, dy], i) => {
      if (keep(i)) [sxx, sxy] = [sxx + dx * dx, sxy + dx * dy];
    });
    return sxx > 0 ? sxy / sxx : Number.NaN;
  };
  const slope = fit(() => true);
  const residuals = centred.map(([dx, dy]) => dy - slope * dx);
  const spread = 1.4826 * median(residuals.map((r) => Math.abs(r - median(residuals))));
  return spread > 0 ? fit((i) => Math.abs(residuals[i]) <= 3 * spread) : slope;
}
