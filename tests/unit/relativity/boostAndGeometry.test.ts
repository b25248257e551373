import { describe, expect, it } from 'vitest';
import { boostLookDirection, endDirection, latitudeLongitude, observeRay } from '@/lib/relativity';
import { expectClose } from './support/tolerance';

describe('boostLookDirection', () => {
  it('should follow Einstein\'s aberration and Doppler formulas', () => {
    // Einstein 1905, section 7: a source at angle theta' from the motion in the moving frame appears at
    // cos(theta) = (cos(theta') - v)/(1 - v cos(theta')) in the frame the camera moves through;
    // D = E_cam/E_ref = 1/(gamma (1 - v cos(theta'))).
    const v = 0.6;
    const gamma = 1 / Math.sqrt(1 - v * v);
    const out = new Float64Array(3);
    for (const theta of [0.3, 1.2, 2.5]) {
      const D = boostLookDirection(out, [Math.cos(theta), Math.sin(theta), 0], [v, 0, 0]);
      expectClose(out[0], (Math.cos(theta) - v) / (1 - v * Math.cos(theta)), 1e-14, 'cos theta in reference frame');
      expectClose(Math.hypot(out[0], out[1], out[2]), 1, 1e-14, 'unit length');
      expectClose(D, 1 / (gamma * (1 - v * Math.cos(theta))), 1e-14, 'Doppler factor');
    }
  });
});

describe('endDirection', () => {
  it('should return the look direction itself in flat space and lat/long on the sphere', () => {
    // physics.md section 5: phi -> psi far from the hole, so the source direction is the look direction.
    const radial = Float64Array.from([0, 0, 1]);
    const psi = 1.1;
    const look = Float64Array.from([Math.sin(psi), 0, Math.cos(psi)]);
    const out = new Float64Array(3);
    endDirection(out, radial, look, observeRay(1e9, psi, { kind: 'static' }).phi);
    for (let i = 0; i < 3; i++) expectClose(out[i], look[i], 1e-7, `component ${i}`);
    const latLon = latitudeLongitude(new Float64Array(2), Float64Array.from([0, 1, 0]));
    expectClose(latLon[0], 0, 1e-15, 'latitude');
    expectClose(latLon[1], Math.PI / 2, 1e-15, 'longitude');
    endDirection(out, radial, look, Math.PI);
    expect(out[2]).toBeCloseTo(-1, 12);
  });
});
