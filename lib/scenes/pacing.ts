/**
 * The pacing curve: screen time (seconds of the finished shot) against the
 * traveller's proper time (M). Producers place handles; between them the
 * curve is a monotone cubic Hermite spline (Fritsch & Carlson 1980, SIAM J.
 * Numer. Anal. 17, 238), so it never runs backwards and has an exact inverse.
 * Beyond the first and last handle it continues straight with the slope of
 * the nearest span. Pure TypeScript (browser and server).
 */

/** One handle of the curve: proper time in M, screen time in seconds. */
export interface PacingPoint {
  properTime: number;
  screenTime: number;
}

/** A validated curve with its Hermite slopes (dscreen/dproper, s per M), ready for evaluation. */
export interface PacingCurve {
  properTimes: Float64Array;
  screenTimes: Float64Array;
  slopes: Float64Array;
}

/**
 * Validate handles and compute Fritsch-Carlson slopes.
 * @param points at least two handles, both coordinates finite and >= 0, strictly increasing in both
 * @returns the curve
 * @throws RangeError naming the first bad handle
 * Reference: Fritsch & Carlson 1980, steps 1-5 (the "alpha^2 + beta^2 <= 9" limiter).
 */
export function buildPacingCurve(points: readonly PacingPoint[]): PacingCurve {
  if (!Array.isArray(points) || points.length < 2) throw new RangeError('points: at least two pacing handles are needed');
  const n = points.length;
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const p = points[i];
    if (!Number.isFinite(p.properTime) || p.properTime < 0) throw new RangeError(`points[${i}].properTime: a finite proper time >= 0 (M)`);
    if (!Number.isFinite(p.screenTime) || p.screenTime < 0) throw new RangeError(`points[${i}].screenTime: a finite screen time >= 0 (s)`);
    x[i] = p.properTime;
    y[i] = p.screenTime;
    if (i > 0 && !(x[i] > x[i - 1])) throw new RangeError(`points[${i}].properTime: must be greater than the previous handle's`);
    if (i > 0 && !(y[i] > y[i - 1])) throw new RangeError(`points[${i}].screenTime: must be greater than the previous handle's`);
  }
  const secant = new Float64Array(n - 1);
  for (let i = 0; i < n - 1; i++) secant[i] = (y[i + 1] - y[i]) / (x[i + 1] - x[i]);
  const m = new Float64Array(n);
  m[0] = secant[0];
  m[n - 1] = secant[n - 2];
  for (let i = 1; i < n - 1; i++) m[i] = (secant[i - 1] + secant[i]) / 2;
  // Limit the slopes so each span stays monotone (Fritsch & Carlson 1980, eq. 4.6 region with radius 3).
  for (let i = 0; i < n - 1; i++) {
    const a = m[i] / secant[i];
    const b = m[i + 1] / secant[i];
    const s = a * a + b * b;
    if (s > 9) {
      const tau = 3 / Math.sqrt(s);
      m[i] = tau * a * secant[i];
      m[i + 1] = tau * b * secant[i];
    }
  }
  return { properTimes: x, screenTimes: y, slopes: m };
}

function spanIndex(xs: Float64Array, value: number): number {
  let lo = 0;
  let hi = xs.length - 2;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (xs[mid] <= value) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

function hermite(curve: PacingCurve, i: number, xValue: number): number {
  const { properTimes: x, screenTimes: y, slopes: m } = curve;
  const h = x[i + 1] - x[i];
  const t = (xValue - x[i]) / h;
  const t2 = t * t;
  const t3 = t2 * t;
  return (2 * t3 - 3 * t2 + 1) * y[i] + (t3 - 2 * t2 + t) * h * m[i] + (-2 * t3 + 3 * t2) * y[i + 1] + (t3 - t2) * h * m[i + 1];
}

function endSlope(curve: PacingCurve, atEnd: boolean): number {
  const { properTimes: x, screenTimes: y } = curve;
  const n = x.length;
  return atEnd ? (y[n - 1] - y[n - 2]) / (x[n - 1] - x[n - 2]) : (y[1] - y[0]) / (x[1] - x[0]);
}

/**
 * Screen time at a proper time.
 * @param curve from buildPacingCurve
 * @param properTimeM proper time along the path, M (finite; outside the handles the curve continues straight)
 * @returns screen time, seconds
 */
export function screenTimeAt(curve: PacingCurve, properTimeM: number): number {
  if (!Number.isFinite(properTimeM)) throw new RangeError('properTimeM: a finite proper time (M)');
  const { properTimes: x, screenTimes: y } = curve;
  const n = x.length;
  if (properTimeM <= x[0]) return y[0] + (properTimeM - x[0]) * endSlope(curve, false);
  if (properTimeM >= x[n - 1]) return y[n - 1] + (properTimeM - x[n - 1]) * endSlope(curve, true);
  return hermite(curve, spanIndex(x, properTimeM), properTimeM);
}

/**
 * Proper time at a screen time: the exact inverse of screenTimeAt (bisection on a monotone span, to 1e-12 relative).
 * @param curve from buildPacingCurve
 * @param screenTimeS screen time, seconds (finite)
 * @returns proper time along the path, M
 */
export function properTimeAt(curve: PacingCurve, screenTimeS: number): number {
  if (!Number.isFinite(screenTimeS)) throw new RangeError('screenTimeS: a finite screen time (s)');
  const { properTimes: x, screenTimes: y } = curve;
  const n = x.length;
  if (screenTimeS <= y[0]) return x[0] + (screenTimeS - y[0]) / endSlope(curve, false);
  if (screenTimeS >= y[n - 1]) return x[n - 1] + (screenTimeS - y[n - 1]) / endSlope(curve, true);
  const i = spanIndex(y, screenTimeS);
  let lo = x[i];
  let hi = x[i + 1];
  for (let k = 0; k < 80 && hi - lo > 1e-13 * Math.max(1, Math.abs(hi)); k++) {
    const mid = (lo + hi) / 2;
    if (hermite(curve, i, mid) < screenTimeS) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/**
 * Pace of the shot at a proper time: screen seconds per M of proper time (the curve's slope).
 * @param curve from buildPacingCurve
 * @param properTimeM proper time, M (finite)
 * @returns ds/dtau in s per M (> 0 away from flat handles)
 */
export function paceAt(curve: PacingCurve, properTimeM: number): number {
  if (!Number.isFinite(properTimeM)) throw new RangeError('properTimeM: a finite proper time (M)');
  const { properTimes: x } = curve;
  const n = x.length;
  if (properTimeM <= x[0]) return endSlope(curve, false);
  if (properTimeM >= x[n - 1]) return endSlope(curve, true);
  const h = 1e-6 * (x[n - 1] - x[0]);
  const a = Math.max(x[0], properTimeM - h);
  const b = Math.min(x[n - 1], properTimeM + h);
  return (screenTimeAt(curve, b) - screenTimeAt(curve, a)) / (b - a);
}

/**
 * Handles for a shot that slows down towards its end: screen time grows like
 * 1 - (1 - u)^power of the proper-time fraction u, i.e. the last moments get most of the screen.
 * @param pathDurationM proper-time length of the path, M (> 0)
 * @param screenDurationS length of the shot, s (> 0)
 * @param slowdown 1 = even pace, larger = slower near the end (1..8)
 * @param handles number of handles (3..12)
 * @returns handles from (0, 0) to (pathDurationM, screenDurationS)
 */
export function slowDownNearEnd(pathDurationM: number, screenDurationS: number, slowdown = 3, handles = 5): PacingPoint[] {
  if (!Number.isFinite(pathDurationM) || pathDurationM <= 0) throw new RangeError('pathDurationM: a proper time > 0 (M)');
  if (!Number.isFinite(screenDurationS) || screenDurationS <= 0) throw new RangeError('screenDurationS: a screen time > 0 (s)');
  if (!Number.isFinite(slowdown) || slowdown < 1 || slowdown > 8) throw new RangeError('slowdown: 1..8');
  if (!Number.isInteger(handles) || handles < 3 || handles > 12) throw new RangeError('handles: an integer 3..12');
  const points: PacingPoint[] = [];
  for (let i = 0; i < handles; i++) {
    // Screen fraction s in [0, 1]; proper-time fraction u = 1 - (1 - s)^slowdown spends screen time late.
    const s = i / (handles - 1);
    const u = 1 - Math.pow(1 - s, slowdown);
    points.push({ properTime: u * pathDurationM, screenTime: s * screenDurationS });
  }
  return points;
}
