import { describe, expect, it } from 'vitest';
import { buildWorldline, radialTidalComponents, sampleWorldline, validateWorldline } from '@/lib/relativity';
import { expectClose, expectRelative } from './support/tolerance';

describe('sampleWorldline', () => {
  it('should need the hovering acceleration M/(r^2 sqrt(1 - 2M/r))', () => {
    // Hartle 2003 ch. 9 (physics.md section 3).
    for (const r of [2.1, 3, 10]) {
      const w = buildWorldline({ massSolar: 1, segments: [{ kind: 'hover', r, duration: 1 }] });
      expectRelative(sampleWorldline(w, 0.5).thrust, 1 / (r * r * Math.sqrt(1 - 2 / r)), 1e-14, `thrust at r=${r}`);
    }
  });

  it('should move on a circular orbit with Omega = sqrt(M/r^3) and local speed sqrt(M/(r - 2M))', () => {
    // Bardeen, Press & Teukolsky 1972 (physics.md section 3).
    const r = 8;
    const w = buildWorldline({ massSolar: 1, segments: [{ kind: 'circular-orbit', r, duration: 50 }] });
    const s = sampleWorldline(w, 20);
    const uT = s.state.energy / (1 - 2 / r); // u^t = eps/f
    const uPhi = s.state.angularMomentum / (r * r);
    expectRelative(uPhi / uT, Math.sqrt(1 / r ** 3), 1e-13, 'Omega');
    expectRelative(uT, 1 / Math.sqrt(1 - 3 / r), 1e-13, 'u^t');
    expectRelative(s.frame.tangentialSpeed, Math.sqrt(1 / (r - 2)), 1e-13, 'speed seen by a hovering observer');
    expect(s.thrust).toBe(0);
    expect(s.orbitBand).toBe('stable orbits');
  });

  it('should need no thrust to hold at the geodesic orbital speed', () => {
    // Bardeen et al. 1972: v = sqrt(M/(r - 2M)) is free; faster needs inward thrust.
    const r = 5;
    const hold = (v: number) =>
      sampleWorldline(buildWorldline({ massSolar: 1, segments: [{ kind: 'hover', r, duration: 1 }, { kind: 'hold', duration: 1, orbitalSpeed: v }] }), 1.5).thrust;
    expectClose(hold(1 / Math.sqrt(r - 2)), 0, 1e-15, 'thrust at orbital speed');
    expect(hold(0.9)).toBeLessThan(0);
  });

  it('should show MTW\'s radial tidal components for radial falls', () => {
    // MTW 1973 eq. 31.4: stretch 2M/r^3, squeeze M/r^3 for static or radially moving observers.
    const w = buildWorldline({ massSolar: 1, segments: [{ kind: 'drop', r: 12 }] });
    for (const tau of [1, 30, 46]) {
      const s = sampleWorldline(w, tau);
      expectRelative(s.stretchPerM2, 2 / s.state.r ** 3, 1e-12, 'stretch');
      expectRelative(s.squeezePerM2, 1 / s.state.r ** 3, 1e-12, 'squeeze');
      expect(radialTidalComponents(s.state.r).stretch).toBeCloseTo(s.stretchPerM2, 12);
    }
  });

  it('should add 3 L^2/r^2 to the radial stretch of an orbiting camera', () => {
    // Projection of the Riemann tensor on a tangentially boosted tetrad: radial eigenvalue (2 + 3 L^2/r^2) M/r^3
    // (Marck 1983, Proc. R. Soc. A 385, 431; value from memory).
    const r = 7;
    const w = buildWorldline({ massSolar: 1, segments: [{ kind: 'circular-orbit', r, duration: 5 }] });
    const s = sampleWorldline(w, 2);
    const l2 = s.state.angularMomentum ** 2;
    expectRelative(s.stretchPerM2, (2 + (3 * l2) / (r * r)) / r ** 3, 1e-12, 'stretch with angular momentum');
  });

  it('should pass about 9 g of head-to-foot stretch on a 2 m body about 0.1 s before the singularity, for any mass', () => {
    // physics.md section 4: 4 l/(9 tau^2) whatever the mass; a fact of the trade (common practice).
    for (const massSolar of [10, 4e6]) {
      // Fall from rest at infinity (eps = 1): the escape speed sqrt(2M/r) seen by a hovering observer at r = 2000 M.
      const w = buildWorldline({ massSolar, segments: [{ kind: 'fall', r: 2000, speed: Math.sqrt(2 / 2000) }] });
      const tauM = w.duration - 0.1 / (massSolar * 4.925490947e-6);
      const s = sampleWorldline(w, tauM, 2);
      expectClose(s.properTimeLeftSeconds ?? Number.NaN, 0.1, 1e-6, 'time left (s)');
      expect(s.stretchG).toBeGreaterThan(8.5);
      expect(s.stretchG).toBeLessThan(9.5);
    }
  });

  it('should chain segments continuously, through the horizon', () => {
    // Property: each segment starts where the previous ends (common practice for piecewise paths).
    const head = [
      { kind: 'hover', r: 30, duration: 20 },
      { kind: 'circular-orbit', duration: 80 },
      { kind: 'hold', duration: 10, orbitalSpeed: 0.1 },
      { kind: 'fall', speed: 0.3, duration: 60 },
    ] as const;
    const partial = buildWorldline({ massSolar: 12, segments: [...head] });
    const end = sampleWorldline(partial, partial.duration).state;
    const w = buildWorldline({
      massSolar: 12,
      segments: [...head, { kind: 'free-fall', energy: end.energy, angularMomentum: 1, radialSense: 'in' }],
    });
    for (const seg of w.segments.slice(0, -1)) {
      const t = seg.tauStart + seg.duration;
      const before = sampleWorldline(w, t - 1e-9);
      const after = sampleWorldline(w, Math.min(t + 1e-9, w.duration));
      expectClose(after.state.r, before.state.r, 1e-6, `r at joint ${seg.index}`);
      expectClose(after.state.azimuth, before.state.azimuth, 1e-6, `azimuth at joint ${seg.index}`);
    }
    // The free fall crosses r = 2 smoothly (regular coordinates): u^T stays finite.
    let crossed = false;
    for (let t = w.segments[4].tauStart; t < w.duration; t += (w.duration - w.segments[4].tauStart) / 200) {
      const s = sampleWorldline(w, t);
      expect(Number.isFinite(s.fourVelocityPG[0])).toBe(true);
      if (s.state.r < 2) crossed = true;
    }
    expect(crossed).toBe(true);
  });

  it('should keep the energy of a free fall with angular momentum conserved', () => {
    // Conservation of -u_t along geodesics: u_r^2 = eps^2 - f (1 + L^2/r^2) (Hartle 2003 eq. 9.23).
    const w = buildWorldline({ massSolar: 1, segments: [{ kind: 'free-fall', r: 15, energy: 0.97, angularMomentum: 3.5, radialSense: 'in' }] });
    for (const tau of [1, 10, w.duration * 0.5, w.duration * 0.95]) {
      const { r, ur, energy, angularMomentum } = sampleWorldline(w, tau).state;
      const implied = Math.sqrt(ur * ur + (1 - 2 / r) * (1 + (angularMomentum / r) ** 2));
      expectClose(implied, energy, 1e-8, `energy at tau=${tau}`);
    }
  });
});

describe('validateWorldline', () => {
  it('should capture a fall from rest far away (e = 1) only below l = 4 M', () => {
    // Hartle 2003 section 9.3 / MTW 1973 eq. 25.19: for e = 1 the barrier's top, the unstable circular orbit at
    // r = 4 M, has l = 4 M; below it a fall from far away reaches r = 0, above it the barrier turns it back.
    const fall = (angularMomentum: number) => ({ massSolar: 1, segments: [{ kind: 'free-fall' as const, r: 30, energy: 1, angularMomentum, radialSense: 'in' as const }] });
    expect(validateWorldline(fall(3.9))).toEqual([]);
    expect(buildWorldline(fall(3.9)).endsAtSingularity).toBe(true);
    expect(validateWorldline(fall(4.1))).toEqual([{ path: 'segments[0].duration', message: 'is required: this free fall never reaches the singularity' }]);
    expect(validateWorldline(fall(4.5)).map((i) => i.path)).toEqual(['segments[0].duration']);
  });

  it('should say precisely why a chain is impossible', () => {
    const issues = validateWorldline({
      massSolar: 10,
      segments: [
        { kind: 'circular-orbit', r: 2.5, duration: 3 },
        { kind: 'hover', r: 1.5, duration: 1 },
        { kind: 'fall', r: 10, speed: 1 },
      ],
    });
    expect(issues.map((i) => i.path)).toEqual(['segments[0].r', 'segments[1].r', 'segments[2].speed']);
    expect(issues[0].message).toMatch(/r = 3/);
    expect(issues[1].message).toMatch(/horizon/);
    expect(issues[2].message).toMatch(/< 1/);
  });

  it('should reject segments that cannot start where the previous one ends', () => {
    const afterSingularity = validateWorldline({ massSolar: 10, segments: [{ kind: 'drop', r: 10 }, { kind: 'hover', duration: 1 }] });
    expect(afterSingularity[0].path).toBe('segments[1]');
    const mismatch = validateWorldline({ massSolar: 10, segments: [{ kind: 'hover', r: 10, duration: 1 }, { kind: 'hover', r: 12, duration: 1 }] });
    expect(mismatch[0].message).toMatch(/previous segment ends at r = 10/);
    const inside = validateWorldline({ massSolar: 10, segments: [{ kind: 'drop', r: 10, duration: 34 }, { kind: 'hold', duration: 1 }] });
    expect(inside[0].message).toMatch(/inside the horizon/);
    const tooLong = validateWorldline({ massSolar: 10, segments: [{ kind: 'drop', r: 10, duration: 1000 }] });
    expect(tooLong[0].path).toBe('segments[0].duration');
    expect(() => buildWorldline({ massSolar: 10, segments: [{ kind: 'hover', r: 2, duration: 1 }] })).toThrow(RangeError);
  });
});
