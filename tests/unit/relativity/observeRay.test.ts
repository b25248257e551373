import { describe, expect, it } from 'vitest';
import { observeRay } from '@/lib/relativity';
import { expectClose, expectRelative } from './support/tolerance';

/** Shadow edge (fate change sky -> horizon) of a static/radial observer, by bisection on psi. */
function shadowEdgePsi(r: number, observer: Parameters<typeof observeRay>[2]): number {
  let sky = 0;
  let hole = Math.PI;
  for (let i = 0; i < 70; i++) {
    const mid = 0.5 * (sky + hole);
    if (observeRay(r, mid, observer).fate === 'sky') sky = mid;
    else hole = mid;
  }
  return 0.5 * (sky + hole);
}

describe('observeRay', () => {
  it('should put a hovering observer\'s shadow edge at Synge\'s angle, inside the photon sphere too', () => {
    for (const r of [2.2, 2.5, 2.9, 3.5, 6, 20, 100]) {
      // Synge 1966, MNRAS 131, 463: sin(alpha) = 3 sqrt(3) sqrt(1 - 2/r)/r, alpha from the direction to the hole;
      // alpha > 90 degrees inside the photon sphere.
      const s = (3 * Math.sqrt(3) * Math.sqrt(1 - 2 / r)) / r;
      const alpha = r < 3 ? Math.PI - Math.asin(s) : Math.asin(s);
      expectClose(Math.PI - shadowEdgePsi(r, { kind: 'static' }), alpha, 1e-12, `shadow half-angle at r=${r}`);
    }
  });

  it('should aberrate the static shadow for a radially falling observer', () => {
    // Einstein 1905 aberration: a static-frame angle theta from the outward axis is seen by an observer moving
    // inward (along -e1) at speed v (measured by the static observer) at cos(theta') = (cos(theta) - v)/(1 - v cos(theta)).
    for (const [r, energy] of [[6, 1], [10, 0.98], [2.5, 1.3]] as const) {
      const f = 1 - 2 / r;
      const v = Math.sqrt(energy * energy - f) / energy; // physics.md section 3: eps = sqrt(f)/sqrt(1 - v^2)
      const staticPsi = shadowEdgePsi(r, { kind: 'static' });
      const expected = Math.acos((Math.cos(staticPsi) - v) / (1 - v * Math.cos(staticPsi)));
      expectClose(shadowEdgePsi(r, { kind: 'radial', energy }), expected, 1e-10, `moving shadow at r=${r}`);
    }
  });

  it('should tend to phi = psi far from the hole (flat-space limit)', () => {
    // physics.md section 5: "Flat-space check: phi -> psi far from the hole"; deflection ~ 4M/b (common practice).
    for (const psi of [0.1, 0.7, 1.5, 2.2, 2.9]) {
      const far = observeRay(1e9, psi, { kind: 'static' });
      expect(far.fate).toBe('sky');
      expectClose(far.phi, psi, 1e-7, `phi at psi=${psi}`);
    }
    const errors = [1e3, 1e5].map((r) => Math.abs(observeRay(r, 1, { kind: 'static' }).phi - 1));
    expect(errors[1]).toBeLessThan(errors[0] / 50);
  });

  it('should give g = 1/sqrt(1 - 2/r) for a hovering observer looking sideways', () => {
    // physics.md section 5: hovering g = 1/sqrt(f) (Hartle 2003 ch. 9, gravitational blueshift).
    for (const r of [3.5, 10, 1000]) {
      const ray = observeRay(r, Math.PI / 2, { kind: 'static' });
      expect(ray.fate).toBe('sky');
      expectRelative(ray.g, 1 / Math.sqrt(1 - 2 / r), 1e-14, `g at r=${r}`);
    }
  });

  it('should see sky, horizon and far side inside the horizon', () => {
    // physics.md section 5: inside, E > 0 with b < b_c is sky, b > b_c horizon, E < 0 far side.
    expect(observeRay(1, 0.2, { kind: 'radial', energy: 1 }).fate).toBe('sky');
    expect(observeRay(1, 3.1, { kind: 'radial', energy: 1 }).fate).toBe('far-side');
    const fates = new Set<string>();
    for (let i = 1; i < 400; i++) fates.add(observeRay(1, (i / 400) * Math.PI, { kind: 'radial', energy: 1 }).fate);
    expect([...fates].sort()).toEqual(['far-side', 'horizon', 'sky']);
  });

  it('should change continuously across r = 2 for a falling observer', () => {
    // Property (physics.md section 8): continuity of the view across the horizon for a falling camera.
    for (const psi of [0.3, 1.0, 1.7, 2.2]) {
      const outside = observeRay(2 + 1e-9, psi, { kind: 'radial', energy: 1 });
      const inside = observeRay(2 - 1e-9, psi, { kind: 'radial', energy: 1 });
      expect(inside.fate).toBe(outside.fate);
      expectClose(inside.phi, outside.phi, 1e-6, `phi across r=2 at psi=${psi}`);
      expectClose(inside.g, outside.g, 1e-6, `g across r=2 at psi=${psi}`);
    }
  });

  it('should throw RangeError naming the argument for bad input', () => {
    expect(() => observeRay(Number.NaN, 1, { kind: 'static' })).toThrow(/r must/);
    expect(() => observeRay(-1, 1, { kind: 'radial', energy: 1 })).toThrow(RangeError);
    expect(() => observeRay(2, 1, { kind: 'static' })).toThrow(/r must be > 2/);
    expect(() => observeRay(1.5, 1, { kind: 'static' })).toThrow(RangeError);
    expect(() => observeRay(10, 4, { kind: 'static' })).toThrow(/psi must/);
    expect(() => observeRay(10, Number.NaN, { kind: 'static' })).toThrow(/psi/);
    expect(() => observeRay(10, 1, { kind: 'radial', energy: 0.5 })).toThrow(/energy too low|energy must/);
    expect(() => observeRay(10, 1, { kind: 'radial', energy: Number.POSITIVE_INFINITY })).toThrow(/energy/);
  });
});
