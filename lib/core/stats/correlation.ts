// Descriptive statistics for comparing predicted and observed times. Framework-free.
// Pearson's product-moment correlation and Spearman's rank correlation (Pearson's r of the ranks, ties
// given their average rank), as in NIST/SEMATECH e-Handbook of Statistical Methods, 2012, 1.3.5.x and
// Spearman (1904); the sample standard deviation uses n - 1.

export function mean(xs: readonly number[]): number {
  if (xs.length === 0) throw new RangeError('mean of no values');
  let s = 0;
  for (const x of xs) s += x;
  return s / xs.length;
}

/** Sample standard deviation (n - 1); null below two values. */
export function sampleStandardDeviation(xs: readonly number[]): number | null {
  if (xs.length < 2) return null;
  const m = mean(xs);
  let s = 0;
  for (const x of xs) s += (x - m) * (x - m);
  return Math.sqrt(s / (xs.length - 1));
}

/** Pearson's r; null below three pairs or when either side does not vary. */
export function pearsonCorrelation(xs: readonly number[], ys: readonly number[]): number | null {
  if (xs.length !== ys.length) throw new RangeError('pearsonCorrelation needs pairs');
  if (xs.length < 3) return null;
  const mx = mean(xs);
  const my = mean(ys);
  let sxy = 0;
  let sxx = 0;
  let syy = 0;
  for (let i = 0; i < xs.length; i++) {
    const dx = xs[i] - mx;
    const dy = ys[i] - my;
    sxy += dx * dy;
    sxx += dx * dx;
    syy += dy * dy;
  }
  if (sxx === 0 || syy === 0) return null;
  return sxy / Math.sqrt(sxx * syy);
}

/** Ranks from 1, ties sharing their average rank. */
export function averageRanks(xs: readonly number[]): number[] {
  const order = xs.map((_, i) => i).sort((a, b) => xs[a] - xs[b]);
  const ranks = new Array<number>(xs.length);
  let i = 0;
  while (i < order.length) {
    let j = i;
    while (j + 1 < order.length && xs[order[j + 1]] === xs[order[i]]) j++;
    const rank = (i + j) / 2 + 1;
    for (let k = i; k <= j; k++) ranks[order[k]] = rank;
    i = j + 1;
  }
  return ranks;
}

/** Spearman's rho: Pearson's r of the average ranks; null below three pairs or without variation. */
export function spearmanCorrelation(xs: readonly number[], ys: readonly number[]): number | null {
  if (xs.length !== ys.length) throw new RangeError('spearmanCorrelation needs pairs');
  return pearsonCorrelation(averageRanks(xs), averageRanks(ys));
}
