/**
 * Orientation of a frame: from view space (x right, y top, z frame centre) to
 * the camera frame (e1 radially outward, e2, e3; physics.md section 5), and
 * from the camera frame to the hole frame (J2000 equatorial axes).
 */
import type { FrameRequest } from './schema';
import { cross3, dot3, normalize3, unitFromRaDec } from './vec3';

const DEG = Math.PI / 180;

/** Row-major 3x3 matrices stored in Float64Array(9): out = M v. */
export type Mat3 = Float64Array;

/** out = M v for a row-major Mat3. */
export function applyMat3(out: Float64Array, m: Mat3, x: number, y: number, z: number): Float64Array {
  out[0] = m[0] * x + m[1] * y + m[2] * z;
  out[1] = m[3] * x + m[4] * y + m[5] * z;
  out[2] = m[6] * x + m[7] * y + m[8] * z;
  return out;
}

/** Matrix whose columns are a, b, c. */
function fromColumns(a: ArrayLike<number>, b: ArrayLike<number>, c: ArrayLike<number>): Mat3 {
  return new Float64Array([a[0], b[0], c[0], a[1], b[1], c[1], a[2], b[2], c[2]]);
}

/**
 * Camera-frame axes in the hole frame.
 * @param holeRaDeg right ascension of the hole seen from the camera (J2000, degrees)
 * @param holeDecDeg declination of the hole seen from the camera (J2000, degrees)
 * @returns matrix with columns e1 (outward radial = away from the hole), e2, e3 (towards the
 *   north celestial pole on the sky plane; x axis if the hole lies at a pole); right-handed
 */
export function cameraToHoleMatrix(holeRaDeg: number, holeDecDeg: number): Mat3 {
  if (!Number.isFinite(holeRaDeg)) throw new RangeError('holeRaDeg: finite degrees');
  if (!Number.isFinite(holeDecDeg) || Math.abs(holeDecDeg) > 90) throw new RangeError('holeDecDeg: -90..90 degrees');
  const toHole = unitFromRaDec([0, 0, 0], holeRaDeg, holeDecDeg);
  const e1 = [-toHole[0], -toHole[1], -toHole[2]];
  let ref = [0, 0, 1];
  if (Math.abs(e1[2]) > 1 - 1e-12) ref = [1, 0, 0];
  const k = dot3(ref, e1);
  const e3 = normalize3([0, 0, 0], [ref[0] - k * e1[0], ref[1] - k * e1[1], ref[2] - k * e1[2]]);
  const e2 = cross3([0, 0, 0], e3, e1);
  return fromColumns(e1, e2, e3);
}

/**
 * Camera-frame axes in the hole frame from a sampled worldline point.
 * @param radialAxis unit vector from the hole to the camera (hole frame)
 * @param tangentAxis unit vector of increasing azimuth, orthogonal to radialAxis
 * @returns matrix with columns e1 = radial, e2 = tangent (re-orthogonalised), e3 = e1 x e2
 * @throws RangeError for zero or parallel axes
 */
export function cameraToHoleFromAxes(radialAxis: ArrayLike<number>, tangentAxis: ArrayLike<number>): Mat3 {
  const e1 = normalize3([0, 0, 0], radialAxis);
  const k = dot3(tangentAxis, e1);
  const t = [tangentAxis[0] - k * e1[0], tangentAxis[1] - k * e1[1], tangentAxis[2] - k * e1[2]];
  if (Math.hypot(t[0], t[1], t[2]) < 1e-9) throw new RangeError('tangentAxis: must not be parallel to radialAxis');
  const e2 = normalize3([0, 0, 0], t);
  return fromColumns(e1, e2, cross3([0, 0, 0], e1, e2));
}

/**
 * View space to camera frame for a request's look, up, roll and (dome) tilt.
 * The frame centre looks along `look`; `up` (made orthogonal) points to the frame top;
 * roll turns up towards the right. A dome's tilt turns the frame centre from look
 * towards the front of the dome (the frame bottom), so look appears tiltDeg above the centre.
 * @param req validated request
 * @returns matrix with columns right, top, centre in camera-frame components
 */
export function viewToCameraMatrix(req: FrameRequest): Mat3 {
  const f = normalize3([0, 0, 0], req.camera.look);
  const upIn = req.camera.up;
  let k = dot3(upIn, f);
  let u = [upIn[0] - k * f[0], upIn[1] - k * f[1], upIn[2] - k * f[2]];
  if (Math.hypot(u[0], u[1], u[2]) < 1e-9) {
    // up parallel to look: fall back to the camera axis least aligned with look
    const alt = Math.abs(f[2]) < 0.9 ? [0, 0, 1] : [0, 1, 0];
    k = dot3(alt, f);
    u = [alt[0] - k * f[0], alt[1] - k * f[1], alt[2] - k * f[2]];
  }
  normalize3(u, u);
  let r = cross3([0, 0, 0], f, u); // right = forward x up (right-handed camera frame)
  const roll = req.camera.rollDeg * DEG;
  const u2 = [0, 1, 2].map((i) => Math.cos(roll) * u[i] + Math.sin(roll) * r[i]);
  r = cross3([0, 0, 0], f, u2);
  let centre = f;
  let top = u2;
  if (req.projection.kind === 'dome' && req.projection.tiltDeg !== 0) {
    const t = req.projection.tiltDeg * DEG;
    centre = [0, 1, 2].map((i) => Math.cos(t) * f[i] - Math.sin(t) * u2[i]);
    top = [0, 1, 2].map((i) => Math.cos(t) * u2[i] + Math.sin(t) * f[i]);
  }
  return fromColumns(r, top, centre);
}

/** Transpose of a rotation matrix = its inverse. */
export function transposeMat3(m: Mat3): Mat3 {
  return new Float64Array([m[0], m[3], m[6], m[1], m[4], m[7], m[2], m[5], m[8]]);
}

/** Product a b of row-major 3x3 matrices. */
export function multiplyMat3(a: Mat3, b: Mat3): Mat3 {
  const out = new Float64Array(9);
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) out[i * 3 + j] = a[i * 3] * b[j] + a[i * 3 + 1] * b[3 + j] + a[i * 3 + 2] * b[6 + j];
  return out;
}
