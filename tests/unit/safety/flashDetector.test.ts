import { describe, expect, it } from 'vitest';
import type { Projection } from '@/lib/render/schema';
import { analyseFlashSequence, createFlashDetector, type FlashDetectorOptions, type FramePixels } from '@/lib/safety/flashDetector';
import { capFrame, close, DOME_180, pixelDiscFrame, sequence, uniformFrame } from './helpers';

const DEG = Math.PI / 180;
const FLAT: Projection = { kind: 'flat', fovDeg: 60 };
const BLACK = [0, 0, 0];
const WHITE = [255, 255, 255];

/** Full-frame alternation of two colours on a small flat frame. */
function fullFrame(count: number, a: number[], b: number[], stateOf: (i: number) => boolean, frameRate = 30, kind: 'u8' | 'f32' = 'u8') {
  const w = 160, h = 90;
  const options: FlashDetectorOptions = { width: w, height: h, frameRate, projection: FLAT, encoding: kind === 'u8' ? 'srgb' : 'linear' };
  return analyseFlashSequence(sequence(count, uniformFrame(w, h, a, kind), uniformFrame(w, h, b, kind), stateOf), options);
}

describe('analyseFlashSequence', () => {
  it('should fail full-frame black/white alternation at 30 fps with 15 flashes in the second', () => {
    // WCAG 2.2 SC 2.3.1: more than three flashes in one second fails; 30 transitions = 15 flashes
    const report = fullFrame(31, BLACK, WHITE, (i) => i % 2 === 1);
    expect(report.verdict).toBe('fail');
    expect(report.generalFlashes.maxPerSecond).toBe(15);
    const range = report.generalFlashes.failingRanges[0];
    expect(report.generalFlashes.failingRanges.length).toBe(1);
    expect([range.startFrame, range.endFrame, range.count]).toEqual([0, 30, 15]);
    expect(close(range.startSeconds, 0, 1e-12) && close(range.endSeconds, 1, 1e-12)).toBe(true);
    expect(report.redFlashes.maxPerSecond).toBe(0);
    expect(report.framesAnalysed).toBe(31);
  });

  it('should pass the same alternation at 1.5 Hz (three transitions, one flash per second)', () => {
    // WCAG 2.2 SC 2.3.1: three flashes or fewer in any one second pass; 1.5 Hz toggles every 10 frames at 30 fps
    const report = fullFrame(91, BLACK, WHITE, (i) => Math.floor(i / 10) % 2 === 1);
    expect(report.verdict).toBe('pass');
    expect(report.generalFlashes.maxPerSecond).toBe(1);
    expect(report.generalFlashes.failingRanges).toEqual([]);
  });

  it('should pass a luminance-only change below 0.1 even at 15 Hz', () => {
    // WCAG 2.2: a general flash needs a change of 10% or more of the maximum relative luminance; 0.20 <-> 0.28
    const report = fullFrame(31, [0.2, 0.2, 0.2], [0.28, 0.28, 0.28], (i) => i % 2 === 1, 30, 'f32');
    expect(report.verdict).toBe('pass');
    expect(report.generalFlashes.maxPerSecond + report.redFlashes.maxPerSecond).toBe(0);
  });

  it('should pass a slow fade up and down', () => {
    // WCAG 2.2: a flash is a pair of opposing changes; one rise in 3 s and one fall in 3 s never share a second
    const n = 181;
    const w = 160, h = 90;
    const frames = Array.from({ length: n }, (_, i) => {
      const level = i <= 90 ? i / 90 : (180 - i) / 90;
      return uniformFrame(w, h, [level, level, level], 'f32');
    });
    const report = analyseFlashSequence(frames, { width: w, height: h, frameRate: 30, projection: FLAT, encoding: 'linear' });
    expect(report.verdict).toBe('pass');
    expect(report.generalFlashes.maxPerSecond).toBe(0);
  });

  it('should not count changes between two states both above 0.8 relative luminance', () => {
    // WCAG 2.2: a general flash needs the darker image below 0.80; 0.85 <-> 1.0 is not a flash
    const bright = fullFrame(31, [0.85, 0.85, 0.85], [1, 1, 1], (i) => i % 2 === 1, 30, 'f32');
    expect(bright.verdict).toBe('pass');
    expect(bright.generalFlashes.maxPerSecond).toBe(0);
    // control: the same swing from 0.75 is a flash
    const control = fullFrame(31, [0.75, 0.75, 0.75], [1, 1, 1], (i) => i % 2 === 1, 30, 'f32');
    expect(control.verdict).toBe('fail');
  });

  it('should count two halves flickering in counter-phase at their own rate, not twice it', () => {
    // WCAG 2.2: a flash is a pair of opposing changes of the same area; each half toggles every 6 frames at 24 fps,
    // 4 transitions and 2 flashes per second, so fields straddling the middle (half rising, half falling) pass
    const w = 160, h = 90;
    const halves = (leftWhite: boolean) => {
      const f = new Uint8Array(w * h * 3);
      for (let y = 0; y < h; y++) for (let x = 0; x < w; x++) if ((x < w / 2) === leftWhite) f.fill(255, 3 * (y * w + x), 3 * (y * w + x) + 3);
      return f;
    };
    const report = analyseFlashSequence(sequence(73, halves(true), halves(false), (i) => Math.floor(i / 6) % 2 === 1), {
      width: w, height: h, frameRate: 24, projection: FLAT,
    });
    expect(report.generalFlashes.maxPerSecond).toBe(2);
    expect(report.verdict).toBe('pass');
  });

  it('should find transitions between peaks and valleys when each frame changes less than 0.1', () => {
    // WCAG 2.2 note: "A transition is the change in relative luminance ... between adjacent peaks and valleys";
    // a 5 Hz triangle wave 0 -> 0.3 -> 0 in steps of 0.05 at 60 fps: 10 transitions, 5 flashes per second
    const w = 160, h = 90;
    const frames = Array.from({ length: 121 }, (_, i) => {
      const phase = i % 12;
      const level = 0.05 * (phase <= 6 ? phase : 12 - phase);
      return uniformFrame(w, h, [level, level, level], 'f32');
    });
    const report = analyseFlashSequence(frames, { width: w, height: h, frameRate: 60, projection: FLAT, encoding: 'linear' });
    expect(report.verdict).toBe('fail');
    expect(report.generalFlashes.maxPerSecond).toBe(5);
  });
});

describe('analyseFlashSequence', () => {
  it('should fail a saturated red / blue alternation of equal luminance as red flashes only', () => {
    // WCAG 2.2 note (ISO 9241-391): to or from R/(R+G+B) >= 0.8 with a u'v' change above 0.2 is a red transition;
    // linear red 0.25 and blue 0.7363 both have relative luminance 0.0532, so no general flash
    const red = [0.25, 0, 0];
    const blue = [0, 0, (0.2126 * 0.25) / 0.0722];
    const report = fullFrame(31, red, blue, (i) => i % 2 === 1, 30, 'f32');
    expect(report.verdict).toBe('fail');
    expect(report.redFlashes.maxPerSecond).toBe(15);
    expect(report.generalFlashes.maxPerSecond).toBe(0);
  });

  it('should report both kinds for 8-bit red (255, 0, 0) against blue (0, 0, 255)', () => {
    // WCAG 2.2: red L = 0.2126, blue L = 0.0722, a change of 0.14 >= 0.1, and a red transition as above
    const report = fullFrame(31, [255, 0, 0], [0, 0, 255], (i) => i % 2 === 1);
    expect(report.redFlashes.maxPerSecond).toBe(15);
    expect(report.generalFlashes.maxPerSecond).toBe(15);
  });

  it('should not count a flicker between two saturated reds', () => {
    // WCAG 2.2 note: the u'v' difference between the states must exceed 0.2; both states here are near the red primary
    const report = fullFrame(31, [0.9, 0.02, 0.02], [0.5, 0.0, 0.06], (i) => i % 2 === 1, 30, 'f32');
    expect(report.redFlashes.maxPerSecond).toBe(0);
  });
});

describe('analyseFlashSequence', () => {
  // a toggle every 4 frames: 24 fps -> 6 transitions per second (3 flashes, pass);
  // 30 and 29.97 fps -> windows of 30 steps hold 8 transitions (4 flashes, fail). WCAG 2.2 SC 2.3.1
  const toggleEvery4 = (i: number) => Math.floor(i / 4) % 2 === 1;

  it('should count a 24 fps window of 24 frame steps', () => {
    const report = fullFrame(49, BLACK, WHITE, toggleEvery4, 24);
    expect(report.generalFlashes.maxPerSecond).toBe(3);
    expect(report.verdict).toBe('pass');
  });

  it('should count a 30 fps window of 30 frame steps', () => {
    const report = fullFrame(49, BLACK, WHITE, toggleEvery4, 30);
    expect(report.generalFlashes.maxPerSecond).toBe(4);
    expect(report.verdict).toBe('fail');
  });

  it('should count a 29.97 fps window of 30 frame steps and time frames at 1/29.97 s', () => {
    // 29 steps span 0.968 s (< 1 s), 30 steps span 1.001 s: the same 30-step window as 30 fps
    const report = fullFrame(49, BLACK, WHITE, toggleEvery4, 29.97);
    expect(report.generalFlashes.maxPerSecond).toBe(4);
    const range = report.generalFlashes.failingRanges[0];
    expect(close(range.startSeconds, range.startFrame / 29.97, 1e-12)).toBe(true);
    expect(close(range.endSeconds, range.endFrame / 29.97, 1e-12)).toBe(true);
    expect(close(range.endSeconds, 48 / 29.97, 1e-12)).toBe(true);
  });
});

describe('analyseFlashSequence', () => {
  const size = 360; // 0.5 degree per pixel over 180 degrees
  const options: FlashDetectorOptions = { width: size, height: size, frameRate: 30, projection: DOME_180 };
  const offAxis = 30 * DEG;
  const centre = [Math.sin(offAxis), 0, Math.cos(offAxis)];

  it('should pass a 15 Hz flashing patch of 0.0038 sr (under 0.006 sr of a 10-degree field)', () => {
    // WCAG 2.2: flashing within 0.006 sr of any 10-degree field passes; cap of 2 degrees = 2 pi (1 - cos 2 deg) = 0.0038 sr
    const off = capFrame(DOME_180, size, centre, 2, BLACK, BLACK);
    const on = capFrame(DOME_180, size, centre, 2, WHITE, BLACK);
    const report = analyseFlashSequence(sequence(31, off, on, (i) => i % 2 === 1), options);
    expect(report.verdict).toBe('pass');
    expect(report.generalFlashes.maxPerSecond).toBe(0);
  });

  it('should fail a 15 Hz flashing patch of 0.015 sr and place it 30 degrees from the zenith', () => {
    // WCAG 2.2: over 0.006 sr flashing more than 3 times a second fails; cap of 4 degrees = 0.0153 sr
    const off = capFrame(DOME_180, size, centre, 4, BLACK, BLACK);
    const on = capFrame(DOME_180, size, centre, 4, WHITE, BLACK);
    const report = analyseFlashSequence(sequence(31, off, on, (i) => i % 2 === 1), options);
    expect(report.verdict).toBe('fail');
    expect(report.generalFlashes.maxPerSecond).toBe(15);
    const range = report.generalFlashes.failingRanges[0];
    const d = range.worstFieldCentre.viewDirection;
    // the worst field holds the whole patch: its centre within 1 degree of the patch centre (grid spacing 2.5 degrees
    // with a ring at 30 degrees), its area the cap's 0.0153 sr within the 0.5-degree pixels' edge error
    expect(d[0] * centre[0] + d[1] * centre[1] + d[2] * centre[2]).toBeGreaterThan(Math.cos(1 * DEG));
    expect(close(range.worstFieldCentre.offAxisDeg, 30, 1)).toBe(true);
    expect(close(range.worstFieldAreaSr, 2 * Math.PI * (1 - Math.cos(4 * DEG)), 0.1 * 0.0153)).toBe(true);
  });

  it('should measure steradians from the centre seat: the same pixel disc fails at the zenith and passes near the spring line', () => {
    // product.md: measure the area in steradians from the centre seat. Azimuthal equidistant projection: a pixel's
    // solid angle scales with sin(theta)/theta. A disc of 11.2 px at 0.25 deg/px holds 0.0075 sr at the zenith
    // (theta ~ 0) but 0.0075 x sin(85 deg)/(85 deg in rad) = 0.0050 sr 85 degrees out: a pixel rule cannot tell them apart.
    const big = 720;
    const radPerPx = (90 * DEG) / (big / 2);
    const radiusPx = Math.sqrt(0.0075 / Math.PI) / radPerPx;
    const opts: FlashDetectorOptions = { width: big, height: big, frameRate: 30, projection: DOME_180 };
    const run = (cx: number, cy: number) => {
      const off = uniformFrame(big, big, BLACK) as Uint8Array;
      const on = pixelDiscFrame(big, cx, cy, radiusPx, WHITE, BLACK);
      return analyseFlashSequence(sequence(11, off, on, (i) => i % 2 === 1), opts);
    };
    expect(run(big / 2, big / 2).verdict).toBe('fail');
    const rimPx = (85 * DEG) / radPerPx;
    expect(run(big / 2, big / 2 + rimPx).verdict).toBe('pass');
  });
});

describe('createFlashDetector', () => {
  it('should give the same report frame by frame as for the whole sequence', () => {
    // the incremental API is the batch API fed one frame at a time (invariant)
    const w = 160, h = 90;
    const frames = sequence(31, uniformFrame(w, h, BLACK), uniformFrame(w, h, WHITE), (i) => i % 3 === 0);
    const options: FlashDetectorOptions = { width: w, height: h, frameRate: 25, projection: FLAT };
    const detector = createFlashDetector(options);
    for (const f of frames) detector.addFrame(f);
    expect(detector.framesAdded).toBe(31);
    expect(detector.finish()).toEqual(analyseFlashSequence(frames, options));
  });

  it('should read 8-bit, 16-bit, float sRGB and RGBA frames alike', () => {
    // sRGB codes c / 255 and c x 257 / 65535 are the same encoded value (IEC 61966-2-1 encoding is per value)
    const w = 64, h = 36;
    const level = 128;
    const as8 = uniformFrame(w, h, [level, level, level]) as Uint8Array;
    const as16 = Uint16Array.from(as8, (c) => c * 257);
    const asFloat = Float32Array.from(as8, (c) => c / 255);
    const rgba = new Uint8Array(w * h * 4);
    for (let i = 0; i < w * h; i++) rgba.set([level, level, level, 255], 4 * i);
    const dark = new Uint8Array(w * h * 3);
    const opts = (channels: 3 | 4): FlashDetectorOptions => ({ width: w, height: h, frameRate: 30, projection: FLAT, channels });
    const darkRgba = new Uint8Array(w * h * 4);
    const reports = [
      analyseFlashSequence(sequence<FramePixels>(31, dark, as8, (i) => i % 2 === 1), opts(3)),
      analyseFlashSequence(sequence<FramePixels>(31, new Uint16Array(w * h * 3), as16, (i) => i % 2 === 1), opts(3)),
      analyseFlashSequence(sequence<FramePixels>(31, new Float32Array(w * h * 3), asFloat, (i) => i % 2 === 1), opts(3)),
      analyseFlashSequence(sequence<FramePixels>(31, darkRgba, rgba, (i) => i % 2 === 1), opts(4)),
    ];
    // sRGB 128 decodes to 0.2158 linear: a 0.2158 swing from black, 15 flashes per second in every format
    for (const r of reports) expect(r.generalFlashes.maxPerSecond).toBe(15);
  });

  it('should choose cells of whole pixels under maxCellDeg and report them before any frame', () => {
    // 180 deg / 1024 px = 0.176 deg per pixel; cells of at most 1 deg -> 5 x 5 pixels (0.88 deg)
    const detector = createFlashDetector({ width: 1024, height: 1024, frameRate: 30, projection: DOME_180, maxCellDeg: 1 });
    const report = detector.finish();
    expect(report.workingResolution.blockPx).toBe(5); // 5 x 0.176 = 0.88 <= 1 < 6 x 0.176
    expect(report.framesAnalysed).toBe(0);
    expect(report.verdict).toBe('pass');
    expect(report.method).toContain('WCAG 2.2');
  });

  it('should refuse bad options and frames with RangeError naming the argument', () => {
    const base: FlashDetectorOptions = { width: 32, height: 18, frameRate: 30, projection: FLAT };
    expect(() => createFlashDetector({ ...base, frameRate: 0 })).toThrow(/frameRate/);
    expect(() => createFlashDetector({ ...base, frameRate: Number.NaN })).toThrow(RangeError);
    expect(() => createFlashDetector({ ...base, width: 0 })).toThrow(/width/);
    expect(() => createFlashDetector({ ...base, projection: { kind: 'flat', fovDeg: 200 } })).toThrow(/fovDeg/);
    expect(() => createFlashDetector({ ...base, projection: DOME_180 })).toThrow(/height/);
    const detector = createFlashDetector(base);
    expect(() => detector.addFrame(new Uint8Array(10))).toThrow(/pixels/);
    detector.finish();
    expect(() => detector.addFrame(new Uint8Array(32 * 18 * 3))).toThrow(/finished/);
  });
});
