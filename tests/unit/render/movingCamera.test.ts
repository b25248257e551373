import { describe, expect, it } from 'vitest';
import { blackbodyLinearSrgb, createRayLookup, observeRay } from '@/lib/relativity';
import { GeodesicRayTracer } from '@/lib/render/bruteForce';
import { BARE, close, luminance, renderRowsLinear, syntheticCatalogue } from './helpers';

const DEG = Math.PI / 180;
/** Galactic centre, the default hole direction (J2000). */
const HOLE = { raDeg: 266.405, decDeg: -28.936 };

// Circular geodesic at r = 10 M (Bardeen, Press & Teukolsky 1972, ApJ 178, 347; physics.md section 3):
// u^t = 1/sqrt(1 - 3/r), so E = -u_t = (1 - 2/r)/sqrt(1 - 3/r) and L = u_phi = r^2 Omega u^t = sqrt(r)/sqrt(1 - 3/r);
// a hovering observer sees it pass at v = sqrt(1/(r - 2)).
const R = 10;
const F = 1 - 2 / R;
const ENERGY = F / Math.sqrt(1 - 3 / R);
const ANGULAR_MOMENTUM = Math.sqrt(R) / Math.sqrt(1 - 3 / R);
const V = Math.sqrt(1 / (R - 2));
const GAMMA = 1 / Math.sqrt(1 - V * V);
/** The camera moves along +e2 (schema: motionAngleDeg 0, angular momentum > 0). */
const ORBIT = { kind: 'fourVelocity' as const, radiusM: R, energy: ENERGY, angularMomentum: ANGULAR_MOMENTUM };

/**
 * Shift g = E_observed / E_infinity of light arriving along camera-frame direction n (angle theta from
 * the motion): the hovering observer at the same event sees every sky photon shifted by 1/sqrt(1 - 2/r)
 * (physics.md section 6); the orbiting camera moves through that observer's frame at v, adding the
 * special-relativistic Doppler factor D = 1 / (gamma (1 - v cos theta)) with theta measured in the
 * camera's frame (Einstein 1905, Ann. Phys. 17, 891, section 7; Rindler 2006, Relativity, eq. 4.9).
 */
function expectedShift(cosThetaCamera: number): number {
  return 1 / (GAMMA * (1 - V * cosThetaCamera)) / Math.sqrt(F);
}

/** Camera axes in J2000, built from the README convention: e1 away from the hole, e3 towards the north pole, e2 = e3 x e1. */
function cameraAxes(): { e1: number[]; e2: number[]; e3: number[] } {
  const toHole = [Math.cos(HOLE.decDeg * DEG) * Math.cos(HOLE.raDeg * DEG), Math.cos(HOLE.decDeg * DEG) * Math.sin(HOLE.raDeg * DEG), Math.sin(HOLE.decDeg * DEG)];
  const e1 = toHole.map((c) => -c);
  const k = e1[2];
  const raw = [-k * e1[0], -k * e1[1], 1 - k * e1[2]];
  const n = Math.hypot(...raw);
  const e3 = raw.map((c) => c / n);
  const e2 = [e3[1] * e1[2] - e3[2] * e1[1], e3[2] * e1[0] - e3[0] * e1[2], e3[0] * e1[1] - e3[1] * e1[0]];
  return { e1, e2, e3 };
}

function raDec(v: number[]): { raDeg: number; decDeg: number } {
  let ra = Math.atan2(v[1], v[0]) / DEG;
  if (ra < 0) ra += 360;
  return { raDeg: ra, decDeg: Math.asin(v[2]) / DEG };
}

/** Brightness-weighted centroid of a square frame, pixels from the top-left corner. */
function centroid(buf: Float32Array, size: number): { x: number; y: number; flux: number } {
  let w = 0;
  let sx = 0;
  let sy = 0;
  for (let y = 0; y < size; y++) {
    for (let x = 0; x < size; x++) {
      const l = luminance(buf, y * size + x);
      w += l;
      sx += l * (x + 0.5);
      sy += l * (y + 0.5);
    }
  }
  return { x: sx / w, y: sy / w, flux: w };
}

describe('renderBandLinear (camera on a circular orbit)', () => {
  it('should shift a uniform sky by the special-relativistic Doppler factor times 1/sqrt(1 - 2/r) ahead, behind and sideways', () => {
    // Liouville: a uniform sky of brightness B appears as B g^4 (MTW section 22.6; physics.md section 6)
    const B = 1000;
    const directions: { name: string; look: [number, number, number]; cosTheta: number }[] = [
      { name: 'ahead (+e2)', look: [0, 1, 0], cosTheta: 1 },
      { name: 'behind (-e2)', look: [0, -1, 0], cosTheta: -1 },
      { name: 'sideways (+e3)', look: [0, 0, 1], cosTheta: 0 },
    ];
    for (const d of directions) {
      const buf = renderRowsLinear(
        {
          ...BARE,
          sky: { ...BARE.sky, uniform: { brightness: B } },
          camera: { state: ORBIT, holeDirection: HOLE, look: d.look, up: [1, 0, 0] },
          projection: { kind: 'flat', fovDeg: 1 },
          width: 5,
          height: 5,
        },
        {},
      );
      const g = expectedShift(d.cosTheta);
      const measured = luminance(buf, 12); // centre pixel, exactly along the look direction
      console.log(`${d.name}: g expected ${g.toFixed(6)}, rendered B g^4 / B = ${(measured / B).toFixed(6)} (g = ${(measured / B) ** 0.25})`);
      expect(close(measured / (B * g ** 4), 1, 1e-6)).toBe(true);
    }
  });

  it('should show the star straight ahead at the frame centre, blue-shifted to the colour of a blackbody at g T, with flux F g^4 J / D^2', () => {
    // Light from straight ahead keeps its direction under the boost (aberration leaves the apex fixed,
    // Einstein 1905), so the hovering observer sees it at psi = 90 degrees along e2 and it comes from
    // e1 rotated by phi(90 degrees) towards e2 (physics.md section 5, engine's exact phi).
    const { e1, e2 } = cameraAxes();
    const phi = observeRay(R, Math.PI / 2, { kind: 'static' }).phi;
    const star = e1.map((c, i) => Math.cos(phi) * c + Math.sin(phi) * e2[i]);
    const bv = 0.65;
    const size = 33;
    const fovDeg = 2;
    const buf = renderRowsLinear(
      {
        ...BARE,
        sky: { ...BARE.sky, stars: { enabled: true } },
        camera: { state: ORBIT, holeDirection: HOLE, look: [0, 1, 0], up: [1, 0, 0] },
        projection: { kind: 'flat', fovDeg },
        width: size,
        height: size,
      },
      { catalogue: syntheticCatalogue([{ ...raDec(star), mag: 0, bv }]) },
    );
    const c = centroid(buf, size);
    console.log(`star ahead: centroid (${c.x.toFixed(3)}, ${c.y.toFixed(3)}), frame centre ${size / 2}`);
    expect(Math.hypot(c.x - size / 2, c.y - size / 2)).toBeLessThan(0.3);

    // colour: blue/red ratio of the image equals that of a blackbody at g T (physics.md section 6)
    const g = expectedShift(1);
    let red = 0;
    let blue = 0;
    for (let i = 0; i < size * size; i++) {
      red += buf[3 * i];
      blue += buf[3 * i + 2];
    }
    // star temperature from B-V (Ballesteros 2012, EPL 97, 34008; physics.md section 6)
    const t = 4600 * (1 / (0.92 * bv + 1.7) + 1 / (0.92 * bv + 0.62));
    const shifted = blackbodyLinearSrgb(new Float64Array(3), g * t);
    const unshiftedByDoppler = blackbodyLinearSrgb(new Float64Array(3), t / Math.sqrt(F));
    const expectedRatio = shifted[2] / shifted[0];
    console.log(`T = ${t.toFixed(0)} K, g = ${g.toFixed(4)}: blue/red ${(blue / red).toFixed(4)}, blackbody at gT ${expectedRatio.toFixed(4)}, without Doppler ${(unshiftedByDoppler[2] / unshiftedByDoppler[0]).toFixed(4)}`);
    expect(close(blue / red / expectedRatio, 1, 2e-3)).toBe(true);

    // flux: F g^4 |dOmega_camera / dOmega_sky|, the hovering frame's Jacobian J divided by D^2
    // because aberration maps solid angles by dOmega_camera = dOmega_hover / D^2 (Rindler 2006).
    // J = sin(psi) / |sin(phi) dphi/dpsi| (physics.md section 6) from an odex integration of the ray.
    const ray = new GeodesicRayTracer(R, Math.sqrt(F), 0).trace(Math.PI / 2, 0, createRayLookup());
    const jac = 1 / Math.abs(Math.sin(ray.phi) * ray.dPhiDPsi);
    const D = g * Math.sqrt(F);
    const f = size / 2 / Math.tan((fovDeg / 2) * DEG);
    let flux = 0;
    for (let y = 0; y < size; y++) {
      for (let x = 0; x < size; x++) {
        const dx = (x + 0.5 - size / 2) / f;
        const dy = (y + 0.5 - size / 2) / f;
        flux += luminance(buf, y * size + x) / (f * f * (1 + dx * dx + dy * dy) ** 1.5); // pinhole pixel solid angle
      }
    }
    const expected = g ** 4 * (jac / (D * D));
    console.log(`star ahead flux: measured ${flux.toExponential(4)}, F g^4 J / D^2 = ${expected.toExponential(4)}`);
    expect(Math.abs(flux / expected - 1)).toBeLessThan(0.05);
  });

  it('should show light that the hovering observer receives from 90 degrees to the motion at cos(theta) = v ahead of the perpendicular', () => {
    // Aberration (Einstein 1905, section 7): cos(theta_camera) = (cos(theta_hover) + v) / (1 + v cos(theta_hover));
    // theta_hover = 90 degrees gives cos(theta_camera) = v. The ray leaving the hovering observer along e3
    // comes from e1 rotated by phi(90 degrees) towards e3.
    const { e1, e3 } = cameraAxes();
    const phi = observeRay(R, Math.PI / 2, { kind: 'static' }).phi;
    const star = e1.map((c, i) => Math.cos(phi) * c + Math.sin(phi) * e3[i]);
    const size = 33;
    const look: [number, number, number] = [0, V, Math.sqrt(1 - V * V)];
    const buf = renderRowsLinear(
      {
        ...BARE,
        sky: { ...BARE.sky, stars: { enabled: true } },
        camera: { state: ORBIT, holeDirection: HOLE, look, up: [1, 0, 0] },
        projection: { kind: 'flat', fovDeg: 2 },
        width: size,
        height: size,
      },
      { catalogue: syntheticCatalogue([{ ...raDec(star), mag: 0 }]) },
    );
    const c = centroid(buf, size);
    console.log(`aberrated star: centroid (${c.x.toFixed(3)}, ${c.y.toFixed(3)}), frame centre ${size / 2}; without aberration it would be ${(Math.asin(V) / DEG).toFixed(1)} degrees away`);
    expect(c.flux).toBeGreaterThan(0);
    expect(Math.hypot(c.x - size / 2, c.y - size / 2)).toBeLessThan(0.3);
  });
});
