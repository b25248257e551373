/**
 * Camera-frame geometry for renderers: where on the celestial sphere (or on
 * the horizon) a ray ends, in the hole's fixed frame (physics.md section 5).
 * Uses gl-matrix's vec3 operations on Float64Array storage.
 */
import { vec3 } from 'gl-matrix';

const tangential = new Float64Array(3) as unknown as vec3;

/**
 * Rotates the camera's outward radial unit vector by phi in the plane spanned by it and
 * the look direction: the source direction on the celestial sphere (sky rays) or the point
 * where the backward ray meets r = 2 (horizon / far-side rays), seen from the hole.
 * @param out unit 3-vector, hole frame (written)
 * @param radial unit 3-vector from the hole to the camera, hole frame
 * @param look unit look direction expressed in the hole frame's axes (the reference observer's
 *   spatial axes are aligned with them: radial, tangential, normal)
 * @param phi azimuth swept (radians) from observeRay / RayTable
 * @returns out; for a purely radial look the rotation plane is undefined and out = +-radial
 */
export function endDirection(out: Float64Array, radial: Float64Array, look: Float64Array, phi: number): Float64Array {
  const along = vec3.dot(look as unknown as vec3, radial as unknown as vec3);
  vec3.scaleAndAdd(tangential, look as unknown as vec3, radial as unknown as vec3, -along);
  const length = vec3.length(tangential);
  const o = out as unknown as vec3;
  if (length < 1e-15) {
    vec3.scale(o, radial as unknown as vec3, Math.cos(phi));
    return out;
  }
  vec3.scale(tangential, tangential, 1 / length);
  vec3.scale(o, radial as unknown as vec3, Math.cos(phi));
  vec3.scaleAndAdd(o, o, tangential, Math.sin(phi));
  return out;
}

/**
 * Latitude and longitude of a unit direction in the hole's fixed frame (z = north pole,
 * longitude from +x toward +y), for painting the horizon grids.
 * @param out [latitude, longitude] in radians (latitude in [-pi/2, pi/2], longitude in (-pi, pi])
 * @param direction unit 3-vector, hole frame
 */
export function latitudeLongitude(out: Float64Array, direction: Float64Array): Float64Array {
  out[0] = Math.asin(Math.max(-1, Math.min(1, direction[2])));
  out[1] = Math.atan2(direction[1], direction[0]);
  return out;
}

/**
 * Look angle psi (from the outward radial axis) of a look direction given in the frame's
 * (radial, tangential, normal) components.
 * @param look unit 3-vector, components along (radial, tangential, normal)
 * @returns psi in radians, [0, pi]
 */
export function lookAngleFromRadial(look: ArrayLike<number>): number {
  return Math.acos(Math.max(-1, Math.min(1, look[0])));
}
