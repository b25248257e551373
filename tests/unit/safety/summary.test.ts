import { describe, expect, it } from 'vitest';
import { analyseFlashSequence } from '@/lib/safety/flashDetector';
import { summariseFlashReport, VENUE_POLICY_CAUTION } from '@/lib/safety/summary';
import { sequence, uniformFrame } from './helpers';

const w = 96, h = 54;
const options = { width: w, height: h, frameRate: 30, projection: { kind: 'flat' as const, fovDeg: 60 } };
const black = uniformFrame(w, h, [0, 0, 0]);
const white = uniformFrame(w, h, [255, 255, 255]);
const red = uniformFrame(w, h, [255, 0, 0]);

describe('summariseFlashReport', () => {
  it('should say a 1.5 Hz alternation passes and end with the venue-policy caution', () => {
    // product.md "Cautions the product shows": defer to venue policy and local rules; WCAG 2.2 SC 2.3.1 (<= 3 per second)
    const text = summariseFlashReport(analyseFlashSequence(sequence(91, black, white, (i) => Math.floor(i / 10) % 2 === 1), options));
    expect(text.startsWith('Photosensitivity check passed')).toBe(true);
    expect(text.endsWith(VENUE_POLICY_CAUTION)).toBe(true);
    expect(VENUE_POLICY_CAUTION).toMatch(/venue policy and local rules decide/);
  });

  it('should name the failing time range, the count and the reason for each kind', () => {
    // WCAG 2.2 SC 2.3.1: 15 flashes in the second from 0 to 1 s; a red / black alternation is also a red flash
    // (u'v' of black taken as D65 white: 0.26 from the red primary, above 0.2)
    const text = summariseFlashReport(analyseFlashSequence(sequence(31, black, red, (i) => i % 2 === 1), options), { dome: true });
    expect(text.startsWith('Photosensitivity check failed')).toBe(true);
    expect(text).toContain('Brightness flashes from 0.00 s to 1.00 s (frames 0-30): 15 in one second');
    expect(text).toContain('Saturated-red flashes from 0.00 s to 1.00 s (frames 0-30): 15 in one second');
    expect(text).toContain('from the zenith');
    expect(text.endsWith(VENUE_POLICY_CAUTION)).toBe(true);
  });
});
