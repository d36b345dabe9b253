/**
 * The Lambert W function (principal branch, real argument) and the Wright omega function
 * omega(x) = W(exp(x)), the closed form behind the integrated Michaelis-Menten equation
 * (Schnell, S. and Mendoza, C. (1997) J. Theor. Biol. 187, 207-212).
 *
 * Wright omega is evaluated directly, so that W(exp(x)) never overflows when x is large (the
 * integrated equation needs x = ln(S0/Km) + (S0 - V t)/Km, which exceeds 700 when S0 >> Km).
 * Starting values: omega ~ exp(x) for very negative x, ~ x - ln x for large x, and a few terms of
 * the series at x = 1 (W(e) = 1) in between. Refinement: the fourth-order iteration of Fritsch,
 * Shafer and Crowley (1973) Commun. ACM 16, 123-124, as used for omega by Lawrence, Corless and
 * Jeffrey (2012) ACM Trans. Math. Softw. 38, 20 (Algorithm 917). W(z) for z > 0 is omega(ln z);
 * for -1/e <= z < 0 Halley's iteration starts from the branch-point series (Corless et al.
 * (1996) Adv. Comput. Math. 5, 329-359, eq. 4.22).
 */

/** -1/e, the branch point of W. */
export const BRANCH_POINT = -Math.exp(-1);

/** omega(x) = W(exp(x)): the solution w > 0 of w + ln w = x. */
export function wrightOmega(x: number): number {
  if (Number.isNaN(x)) return Number.NaN;
  if (x === Number.POSITIVE_INFINITY) return Number.POSITIVE_INFINITY;
  if (x < -745) return 0; // exp(x) underflows; omega(x) = exp(x) to full precision there
  let w: number;
  if (x < -2) {
    const e = Math.exp(x);
    w = e * (1 - e); // W(z) = z - z^2 + ... for small z
  } else if (x > 3) {
    const l = Math.log(x);
    w = x - l + l / x;
  } else {
    // series of omega about x = 1 (omega(1) = 1): 1 + y/2 + y^2/16 - y^3/192
    const y = x - 1;
    w = 1 + y / 2 + (y * y) / 16 - (y * y * y) / 192;
    if (w <= 0) w = Math.exp(x);
  }
  for (let k = 0; k < 6; k++) {
    const r = x - w - Math.log(w);
    if (r === 0) break;
    const onePlusW = 1 + w;
    const q = onePlusW * (onePlusW + (2 * r) / 3);
    const next = w * (1 + (r / onePlusW) * ((q - r / 2) / (q - r)));
    if (Math.abs(next - w) <= 1e-16 * Math.abs(next)) {
      w = next;
      break;
    }
    w = next;
  }
  return w;
}

/**
 * W(z), the principal branch (W >= -1) for real z >= -1/e; NaN below the branch point.
 * W(1) = 0.5671432904097838 (the omega constant).
 */
export function lambertW(z: number): number {
  if (Number.isNaN(z) || z < BRANCH_POINT) return Number.NaN;
  if (z === 0) return 0;
  if (z > 0) return wrightOmega(Math.log(z));
  if (z === BRANCH_POINT) return -1;
  // -1/e < z < 0: W in (-1, 0)
  const p = Math.sqrt(2 * (Math.E * z + 1));
  let w = z > -0.25 ? z * (1 - z + 1.5 * z * z) : -1 + p - (p * p) / 3 + (11 / 72) * p * p * p;
  for (let k = 0; k < 30; k++) {
    const ew = Math.exp(w);
    const f = w * ew - z;
    if (f === 0) break;
    const wp1 = w + 1;
    if (wp1 === 0) break;
    const step = f / (ew * wp1 - ((w + 2) * f) / (2 * wp1));
    const next = w - step;
    if (Math.abs(step) <= 4e-16 * Math.max(1, Math.abs(next))) {
      w = next;
      break;
    }
    w = next;
  }
  return w;
}
