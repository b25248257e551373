import { describe, expect, it } from 'vitest';
import fs from 'node:fs';
import path from 'node:path';
import { catalogueFromGeoJson, decodeCatalogue, encodeCatalogue } from '@/lib/render/starCatalogue';
import { rasteriseMilkyWay } from '@/lib/render/milkyWay';
import { celestialDataDir } from '@/lib/render/node/paths';
import { close } from './helpers';

const stars = JSON.parse(fs.readFileSync(path.join(celestialDataDir(), 'stars.8.json'), 'utf8'));

describe('catalogueFromGeoJson', () => {
  it('should unwrap RA to 0..360 and keep magnitudes and B-V (Arcturus, HIP 69673)', () => {
    const cat = catalogueFromGeoJson(stars);
    expect(cat.count).toBeGreaterThan(40000);
    const i = Array.from(cat.hip).indexOf(69673);
    // Arcturus J2000: RA 213.9153 deg, Dec +19.1824 deg, V = -0.05, B-V = 1.23 (Hipparcos; value from memory)
    expect(close(cat.raDeg[i], 213.9153, 0.001) && close(cat.decDeg[i], 19.1824, 0.001)).toBe(true);
    expect(close(cat.mag[i], -0.05, 0.01) && close(cat.bv[i], 1.23, 0.02)).toBe(true);
  });

  it('should round-trip through the binary form', () => {
    const cat = catalogueFromGeoJson(stars);
    const back = decodeCatalogue(encodeCatalogue(cat));
    expect(back.count).toBe(cat.count);
    let worst = 0;
    for (let i = 0; i < cat.count; i += 97) worst = Math.max(worst, Math.abs(back.raDeg[i] - cat.raDeg[i]), Math.abs(back.mag[i] - cat.mag[i]));
    expect(worst).toBeLessThan(1e-9);
    expect(() => decodeCatalogue(new Uint8Array(40))).toThrow(RangeError);
  });
});

describe('rasteriseMilkyWay', () => {
  it('should be bright at the Galactic centre and dark at the Galactic poles', () => {
    const mw = JSON.parse(fs.readFileSync(path.join(celestialDataDir(), 'mw.json'), 'utf8'));
    const w = 512;
    const h = 256;
    const map = rasteriseMilkyWay(mw, w, h, 1);
    const at = (raDeg: number, decDeg: number) => map[Math.floor(((90 - decDeg) / 180) * h) * w + Math.floor((raDeg / 360) * w)];
    // Galactic centre RA 266.40, Dec -28.94; north/south Galactic poles RA 192.86 Dec +27.13 / RA 12.86 Dec -27.13
    // (IAU 1958 system, Blaauw et al. 1960, MNRAS 121, 123)
    let peak = 0;
    for (const v of map) peak = Math.max(peak, v);
    expect(at(266.4, -28.94)).toBeGreaterThan(0.2 * peak);
    expect(at(192.86, 27.13)).toBe(0);
    expect(at(12.86, -27.13)).toBe(0);
  });
});
