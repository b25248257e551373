import { describe, expect, it } from 'vitest';
import { SKY_LENSED_FRAG } from '@/lib/webgl/shaderSources';

/** The fit's coefficients as the shader states them (one source of truth). */
function shaderFit(): (c: number) => number {
  const m = SKY_LENSED_FRAG.match(/mix\(12\.92 \* c, ([\d.]+) \* s1 \+ ([\d.]+) \* s2 - ([\d.]+) \* s3, greaterThan\(c, vec3\(([\d.]+)\)\)\)/);
  if (!m) throw new Error('srgbEncode in shaders/sky.lensed.frag no longer has the expected form');
  const [a, b, d, toe] = m.slice(1).map(Number);
  return (c: number) => {
    const x = Math.min(1, Math.max(0, c));
    if (!(x > toe)) return 12.92 * x;
    const s1 = Math.sqrt(x);
    const s2 = Math.sqrt(s1);
    return a * s1 + b * s2 - d * Math.sqrt(s2);
  };
}

/** sRGB transfer function, IEC 61966-2-1:1999 section 5.2. */
const iec = (c: number) => (c <= 0.0031308 ? 12.92 * c : 1.055 * Math.pow(c, 1 / 2.4) - 0.055);
const byte = (v: number) => Math.round(255 * Math.min(1, Math.max(0, v)));

describe('sky.lensed.frag srgbEncode fit', () => {
  it('should round to within one 8-bit step of IEC 61966-2-1 everywhere in 0..1, and match it exactly at 0 and 1', () => {
    const fit = shaderFit();
    let worst = 0;
    let off = 0;
    const n = 200000;
    for (let i = 0; i <= n; i++) {
      const c = i / n;
      const d = Math.abs(byte(fit(c)) - byte(iec(c)));
      worst = Math.max(worst, d);
      if (d > 0) off++;
    }
    expect(worst).toBeLessThanOrEqual(1);
    // off by one step for a minority of values only
    expect(off / n).toBeLessThan(0.2);
    expect(byte(fit(0))).toBe(0);
    expect(byte(fit(1))).toBe(255);
    expect(byte(fit(2))).toBe(255);
  });
});
