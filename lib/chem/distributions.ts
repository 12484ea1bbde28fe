/**
 * The few distribution functions the uncertainty, pooling and fitting code needs, written out so
 * that lib/chem stays free of dependencies and runs in the browser.
 */

/**
 * Inverse of the standard normal CDF: Wichura's algorithm AS 241 (PPND16), Appl. Statist. 37
 * (1988) 477, accurate to about 1e-16 over the whole range.
 */
export function normalQuantile(p: number): number {
  if (!(p > 0 && p < 1)) {
    if (p === 0) return -Infinity;
    if (p === 1) return Infinity;
    throw new RangeError(`probability must lie in [0, 1], got ${p}`);
  }
  const q = p - 0.5;
  if (Math.abs(q) <= 0.425) {
    const r = 0.180625 - q * q;
    return (
      (q *
        (((((((r * 2509.0809287301227 + 33430.57558358813) * r + 67265.7709270087) * r +
          45921.95393154987) * r + 13731.69376550946) * r + 1971.5909503065513) * r +
          133.14166789178438) * r + 3.3871328727963665)) /
      (((((((r * 5226.495278852546 + 28729.085735721943) * r + 39307.89580009271) * r +
        21213.794301586597) * r + 5394.196021424751) * r + 687.1870074920579) * r +
        42.31333070160091) * r + 1)
    );
  }
  let r = Math.sqrt(-Math.log(q < 0 ? p : 1 - p));
  let value: number;
  if (r <= 5) {
    r -= 1.6;
    value =
      (((((((r * 0.0007745450142783414 + 0.022723844989269184) * r + 0.2417807251774506) * r +
        1.2704582524523684) * r + 3.6478483247632045) * r + 5.769497221460691) * r +
        4.630337846156546) * r + 1.4234371107496835) /
      (((((((r * 1.0507500716444169e-9 + 0.0005475938084995345) * r + 0.015198666563616457) * r +
        0.14810397642748008) * r + 0.6897673349851) * r + 1.6763848301838038) * r +
        2.053191626637759) * r + 1);
  } else {
    r -= 5;
    value =
      (((((((r * 2.0103343992922881e-7 + 0.000027115555687434876) * r + 0.0012426609473880784) * r +
        0.026532189526576124) * r + 0.29656057182850487) * r + 1.7848265399172913) * r +
        5.463784911164114) * r + 6.657904643501103) /
      (((((((r * 2.0442631033899397e-15 + 1.421511758316446e-7) * r + 0.000018463183175100548) * r +
        0.0007868691311456133) * r + 0.014875361290850615) * r + 0.1369298809227358) * r +
        0.599832206555888) * r + 1);
  }
  return q < 0 ? -value : value;
}

/** ln Γ(x) for x > 0, Lanczos approximation (g = 7, n = 9), relative error below 1e-14. */
function logGamma(x: number): number {
  const c = [
    0.9999999999998099, 676.5203681218851, -1259.1392167224028, 771.3234287776531, -176.6150291621406,
    12.507343278686905, -0.13857109526572012, 0.000009984369578019572, 1.5056327351493116e-7,
  ];
  if (x < 0.5) return Math.log(Math.PI / Math.abs(Math.sin(Math.PI * x))) - logGamma(1 - x);
  const z = x - 1;
  let sum = c[0] ?? 1;
  for (let i = 1; i < 9; i++) sum += (c[i] ?? 0) / (z + i);
  const t = z + 7.5;
  return 0.5 * Math.log(2 * Math.PI) + (z + 0.5) * Math.log(t) - t + Math.log(sum);
}

/** Continued fraction for the incomplete beta function (modified Lentz). */
function betaContinuedFraction(x: number, a: number, b: number): number {
  const tiny = 1e-300;
  let c = 1;
  let d = 1 - ((a + b) * x) / (a + 1);
  if (Math.abs(d) < tiny) d = tiny;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= 300; m++) {
    const m2 = 2 * m;
    let aa = (m * (b - m) * x) / ((a + m2 - 1) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    h *= d * c;
    aa = (-(a + m) * (a + b + m) * x) / ((a + m2) * (a + m2 + 1));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < 1e-15) break;
  }
  return h;
}

/** Regularized incomplete beta I_x(a, b). */
function regularizedBeta(x: number, a: number, b: number): number {
  if (x <= 0) return 0;
  if (x >= 1) return 1;
  const front = Math.exp(logGamma(a + b) - logGamma(a) - logGamma(b) + a * Math.log(x) + b * Math.log(1 - x));
  return x < (a + 1) / (a + b + 2)
    ? (front * betaContinuedFraction(x, a, b)) / a
    : 1 - (front * betaContinuedFraction(1 - x, b, a)) / b;
}

/** CDF of Student's t with `df` degrees of freedom (df = Infinity gives the normal). */
export function studentTCdf(t: number, df: number): number {
  if (!Number.isFinite(df)) return 0.5 * (1 + erf(t / Math.SQRT2));
  const tail = 0.5 * regularizedBeta(df / (df + t * t), df / 2, 0.5);
  return t >= 0 ? 1 - tail : tail;
}

/** Quantile of Student's t: closed forms for 1 and 2 degrees of freedom, else Newton on the CDF. */
export function studentTQuantile(p: number, df: number): number {
  if (!(df > 0)) throw new RangeError(`degrees of freedom must be positive, got ${df}`);
  if (!Number.isFinite(df)) return normalQuantile(p);
  if (p <= 0 || p >= 1) return normalQuantile(p);
  if (df === 1) return Math.tan(Math.PI * (p - 0.5));
  if (df === 2) return (2 * p - 1) / Math.sqrt(2 * p * (1 - p));
  let t = normalQuantile(p);
  const logNorm = logGamma((df + 1) / 2) - logGamma(df / 2) - 0.5 * Math.log(df * Math.PI);
  for (let i = 0; i < 50; i++) {
    const density = Math.exp(logNorm - ((df + 1) / 2) * Math.log(1 + (t * t) / df));
    const step = (studentTCdf(t, df) - p) / density;
    t -= step;
    if (Math.abs(step) < 1e-12 * Math.max(1, Math.abs(t))) break;
  }
  return t;
}

/** Error function from the Chebyshev fit to erfc in Numerical Recipes (2nd ed. §6.2); fractional error below 1.2e-7. */
export function erf(x: number): number {
  const z = Math.abs(x);
  const t = 1 / (1 + 0.5 * z);
  const erfc =
    t *
    Math.exp(
      -z * z - 1.26551223 +
        t * (1.00002368 + t * (0.37409196 + t * (0.09678418 + t * (-0.18628806 + t * (0.27886807 +
          t * (-1.13520398 + t * (1.48851587 + t * (-0.82215223 + t * 0.17087277)))))))),
    );
  return x >= 0 ? 1 - erfc : erfc - 1;
}

/** Standard normal CDF. */
export function normalCdf(z: number): number {
  return 0.5 * (1 + erf(z / Math.SQRT2));
}

/**
 * Percentile of an ascending-sorted sample by linear interpolation between order statistics
 * (Hyndman & Fan, Am. Stat. 50 (1996) 361, definition 7, the default of R and NumPy).
 */
export function sortedPercentile(sorted: ArrayLike<number>, p: number): number {
  const n = sorted.length;
  if (n === 0) return Number.NaN;
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, n - 1);
  const a = sorted[lo] ?? Number.NaN;
  const b = sorted[hi] ?? Number.NaN;
  return a + (h - lo) * (b - a);
}
