/**
 * Timelike geodesics in the equatorial plane integrated in proper time with
 * (r, u^r, phi) as the state: d^2r/dtau^2 = -1/r^2 + l^2/r^3 - 3 l^2/r^4 and
 * dphi/dtau = l/r^2 (Hartle 2003 eq. 9.23 differentiated). No Schwarzschild t
 * appears, so the path crosses r = 2 smoothly (physics.md section 3).
 */

/** Dense samples of one integrated geodesic, with cubic Hermite sampling. */
export interface GeodesicTrack {
  tau: Float64Array;
  r: Float64Array;
  ur: Float64Array;
  phi: Float64Array;
  count: number;
  angularMomentum: number;
  /** proper time at which r reached the singularity, or Infinity if it did not within the span */
  singularityTau: number;
}

// Step = STEP_FRACTION x the local dynamical time; RK4 error per step ~ STEP_FRACTION^5.
const STEP_FRACTION = 2e-3;
// Below this radius (M) the remaining proper time is < 1e-9 M: call it the singularity.
const SINGULAR_RADIUS_M = 1e-6;

function radialAcceleration(r: number, l2: number): number {
  const inv = 1 / r;
  const inv2 = inv * inv;
  return -inv2 + l2 * inv2 * inv - 3 * l2 * inv2 * inv2;
}

/**
 * Integrates from (r0, ur0, phi0) for at most `span` of proper time (RK4, adaptive step).
 * @param r0 start radius in M (> 0)
 * @param ur0 start u^r
 * @param phi0 start azimuth, radians
 * @param l angular momentum u_phi in M
 * @param span proper-time span in M (> 0, may be Infinity only if the path reaches r = 0)
 * @returns samples; stops early at the singularity
 */
export function integrateGeodesic(r0: number, ur0: number, phi0: number, l: number, span: number): GeodesicTrack {
  const l2 = l * l;
  let capacity = 1024;
  let tauA = new Float64Array(capacity);
  let rA = new Float64Array(capacity);
  let urA = new Float64Array(capacity);
  let phiA = new Float64Array(capacity);
  let count = 0;
  const push = (t: number, r: number, ur: number, p: number) => {
    if (count === capacity) {
      capacity *= 2;
      const grow = (a: Float64Array) => {
        const b = new Float64Array(capacity);
        b.set(a);
        return b;
      };
      tauA = grow(tauA);
      rA = grow(rA);
      urA = grow(urA);
      phiA = grow(phiA);
    }
    tauA[count] = t;
    rA[count] = r;
    urA[count] = ur;
    phiA[count] = p;
    count++;
  };
  let t = 0;
  let r = r0;
  let ur = ur0;
  let p = phi0;
  push(t, r, ur, p);
  let singularityTau = Infinity;
  const maxSteps = 5_000_000;
  for (let step = 0; step < maxSteps && t < span; step++) {
    // Local dynamical time: free-fall time, radial crossing time and angular time.
    const dyn = r / (Math.abs(ur) + 1 / Math.sqrt(r) + Math.abs(l) / r);
    let h = Math.min(STEP_FRACTION * dyn, span - t);
    // Never step past r = 0: cap h so a linear extrapolation stays above half of r.
    if (ur < 0) h = Math.min(h, (0.5 * r) / -ur);
    const k1r = ur;
    const k1u = radialAcceleration(r, l2);
    const k1p = l / (r * r);
    const r2 = r + 0.5 * h * k1r;
    const u2 = ur + 0.5 * h * k1u;
    const k2r = u2;
    const k2u = radialAcceleration(r2, l2);
    const k2p = l / (r2 * r2);
    const r3 = r + 0.5 * h * k2r;
    const u3 = ur + 0.5 * h * k2u;
    const k3r = u3;
    const k3u = radialAcceleration(r3, l2);
    const k3p = l / (r3 * r3);
    const r4 = r + h * k3r;
    const u4 = ur + h * k3u;
    const k4r = u4;
    const k4u = radialAcceleration(r4, l2);
    const k4p = l / (r4 * r4);
    r += (h / 6) * (k1r + 2 * k2r + 2 * k3r + k4r);
    ur += (h / 6) * (k1u + 2 * k2u + 2 * k3u + k4u);
    p += (h / 6) * (k1p + 2 * k2p + 2 * k3p + k4p);
    t += h;
    if (!(r > SINGULAR_RADIUS_M)) {
      singularityTau = t;
      break;
    }
    push(t, r, ur, p);
  }
  return {
    tau: tauA.subarray(0, count),
    r: rA.subarray(0, count),
    ur: urA.subarray(0, count),
    phi: phiA.subarray(0, count),
    count,
    angularMomentum: l,
    singularityTau,
  };
}

/**
 * Samples a track at proper time tau (cubic Hermite in each step: r with u^r,
 * u^r with the radial acceleration, phi with l/r^2).
 * @param out [r, ur, phi] written
 */
export function sampleGeodesicTrack(out: Float64Array, track: GeodesicTrack, tau: number): Float64Array {
  const { tau: T, count } = track;
  const l2 = track.angularMomentum * track.angularMomentum;
  const l = track.angularMomentum;
  if (tau <= T[0] || count === 1) {
    out[0] = track.r[0];
    out[1] = track.ur[0];
    out[2] = track.phi[0];
    return out;
  }
  let lo = 0;
  let hi = count - 1;
  if (tau >= T[hi]) {
    out[0] = track.r[hi];
    out[1] = track.ur[hi];
    out[2] = track.phi[hi];
    return out;
  }
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (T[mid] <= tau) lo = mid;
    else hi = mid;
  }
  const h = T[hi] - T[lo];
  const s = (tau - T[lo]) / h;
  const h00 = (1 + 2 * s) * (1 - s) * (1 - s);
  const h10 = s * (1 - s) * (1 - s);
  const h01 = s * s * (3 - 2 * s);
  const h11 = s * s * (s - 1);
  const ra = track.r[lo];
  const rb = track.r[hi];
  const ua = track.ur[lo];
  const ub = track.ur[hi];
  out[0] = h00 * ra + h10 * h * ua + h01 * rb + h11 * h * ub;
  out[1] = h00 * ua + h10 * h * radialAcceleration(ra, l2) + h01 * ub + h11 * h * radialAcceleration(rb, l2);
  out[2] = h00 * track.phi[lo] + h10 * h * (l / (ra * ra)) + h01 * track.phi[hi] + h11 * h * (l / (rb * rb));
  return out;
}
