/**
 * Local Lorentz boost between a camera and the radial reference observer at
 * the same event (Einstein 1905 aberration and Doppler). A renderer for a
 * non-radial camera (circular orbit, free fall with angular momentum, hold
 * with orbital speed) maps each pixel direction from the camera frame into the
 * reference frame with this boost, then looks the ray up in the reference
 * observer's RayTable. Observed shift: g_camera = g_reference * doppler; point
 * star Jacobian: |dOmega_cam/dOmega_sky| = jacobian_reference / doppler^2.
 */

/**
 * Aberrates a look direction from the camera frame into the reference frame.
 * Directions are unit 3-vectors in the frames' shared spatial axes (radial,
 * tangential, normal): the camera moves relative to the reference with
 * 3-velocity `velocity` (|v| < 1) measured in the reference frame.
 * @param out unit look direction in the reference frame (written)
 * @param lookCamera unit look direction in the camera frame (where the light comes from)
 * @param velocity camera velocity relative to the reference, units of c, |v| < 1
 * @returns Doppler factor D = E_camera / E_reference = 1 / (gamma (1 - v . n_cam)) (> 1 looking ahead)
 * Reference: Einstein 1905, Ann. Phys. 17, 891, section 7; Rindler 2006, Relativity, eq. 4.9.
 */
export function boostLookDirection(
  out: Float64Array,
  lookCamera: ArrayLike<number>,
  velocity: ArrayLike<number>,
): number {
  const vx = velocity[0];
  const vy = velocity[1];
  const vz = velocity[2];
  const v2 = vx * vx + vy * vy + vz * vz;
  if (v2 === 0) {
    out[0] = lookCamera[0];
    out[1] = lookCamera[1];
    out[2] = lookCamera[2];
    return 1;
  }
  const gamma = 1 / Math.sqrt(1 - v2);
  // Photon momentum in the camera frame: k' = E' (1, -n'). The camera frame moves with v in the reference
  // frame, so E = gamma (E' + v.k') and k = k' + [(gamma - 1)(k'.v)/v^2 + gamma E'] v (standard boost).
  const nx = lookCamera[0];
  const ny = lookCamera[1];
  const nz = lookCamera[2];
  const vDotK = -(vx * nx + vy * ny + vz * nz); // v . k' / E'
  const energy = gamma * (1 + vDotK); // E / E'
  const coefficient = ((gamma - 1) * vDotK) / v2 + gamma;
  const kx = -nx + coefficient * vx;
  const ky = -ny + coefficient * vy;
  const kz = -nz + coefficient * vz;
  out[0] = -kx / energy;
  out[1] = -ky / energy;
  out[2] = -kz / energy;
  return 1 / energy;
}
