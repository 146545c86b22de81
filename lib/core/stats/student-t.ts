// Quantiles of Student's t distribution for whole degrees of freedom (closed forms for 1 and 2, else the
// finite series of the distribution function inverted by bisection), and the normal quantile by Acklam's
// rational approximation (2003, relative error below 1.15e-9) for a starting bracket. Framework-free.

/** Standard normal quantile (Acklam's algorithm with its published coefficients). */
export function normalQuantile(p: number): number {
  if (!(p > 0 && p < 1)) throw new RangeError(`p must be in (0, 1) (got ${p})`);
  const a = [
    -3.969683028665376e1, 2.209460984245205e2, -2.759285104469687e2, 1.38357751867269e2, -3.066479806614716e1,
    2.506628277459239,
  ];
  const b = [
    -5.447609879822406e1, 1.615858368580409e2, -1.556989798598866e2, 6.680131188771972e1, -1.328068155288572e1,
  ];
  const c = [
    -7.784894002430293e-3, -3.223964580411365e-1, -2.400758277161838, -2.549732539343734, 4.374664141464968,
    2.938163982698783,
  ];
  const d = [7.784695709041462e-3, 3.224671290700398e-1, 2.445134137142996, 3.754408661907416];
  const lowTail = 0.02425;
  if (p < lowTail) {
    const q = Math.sqrt(-2 * Math.log(p));
    return (
      (((((c[0] * q + c[1]) * q + c[2]) * q + c[3]) * q + c[4]) * q + c[5]) /
      ((((d[0] * q + d[1]) * q + d[2]) * q + d[3]) * q + 1)
    );
  }
  if (p > 1 - lowTail) return -normalQuantile(1 - p);
  const q = p - 0.5;
  const r = q * q;
  return (
    ((((((a[0] * r + a[1]) * r + a[2]) * r + a[3]) * r + a[4]) * r + a[5]) * q) /
    (((((b[0] * r + b[1]) * r + b[2]) * r + b[3]) * r + b[4]) * r + 1)
  );
}

/**
 * P(|T| <= t) for nu degrees of freedom (integer): the finite series of Abramowitz & Stegun, Handbook of
 * Mathematical Functions, 1964, 26.7.3 (nu odd) and 26.7.4 (nu even), in theta = atan(t / sqrt(nu)).
 */
export function studentTCentralProbability(t: number, nu: number): number {
  const theta = Math.atan(Math.abs(t) / Math.sqrt(nu));
  const s = Math.sin(theta);
  const c = Math.cos(theta);
  const c2 = c * c;
  if (nu % 2 === 1) {
    if (nu === 1) return (2 / Math.PI) * theta;
    // cos + (2/3) cos^3 + (2*4)/(3*5) cos^5 + ... up to cos^(nu-2)
    let term = c;
    let sum = c;
    for (let k = 3; k <= nu - 2; k += 2) {
      term *= (c2 * (k - 1)) / k;
      sum += term;
    }
    return (2 / Math.PI) * (theta + s * sum);
  }
  // 1 + (1/2) cos^2 + (1*3)/(2*4) cos^4 + ... up to cos^(nu-2)
  let term = 1;
  let sum = 1;
  for (let k = 2; k <= nu - 2; k += 2) {
    term *= (c2 * (k - 1)) / k;
    sum += term;
  }
  return s * sum;
}

/** t with P(T <= t) = p for an integer nu >= 1: exact for 1 and 2, else bisection on the series above. */
export function studentTQuantile(p: number, nu: number): number {
  if (!(p > 0 && p < 1)) throw new RangeError(`p must be in (0, 1) (got ${p})`);
  if (!Number.isInteger(nu) || nu < 1)
    throw new RangeError(`degrees of freedom must be a whole number from 1 (got ${nu})`);
  if (nu === 1) return Math.tan(Math.PI * (p - 0.5));
  if (nu === 2) return (2 * p - 1) / Math.sqrt(2 * p * (1 - p));
  if (p < 0.5) return -studentTQuantile(1 - p, nu);
  const central = 2 * p - 1; // P(|T| <= t)
  let lo = 0;
  let hi = Math.max(1, normalQuantile(p));
  while (studentTCentralProbability(hi, nu) < central) hi *= 2;
  for (let i = 0; i < 200 && hi - lo > 1e-13 * hi; i++) {
    const mid = (lo + hi) / 2;
    if (studentTCentralProbability(mid, nu) < central) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}
