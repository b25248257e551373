import { buildWorldline, sampleWorldline } from '@/lib/relativity';
import type { SegmentSpec } from '@/lib/scenes/schema';

/**
 * Proper time (M) a falling segment takes to reach a radius: "until r" as a
 * duration. Builds the chain up to that segment with the segment left open
 * (to the singularity), finds the first crossing of the radius on a coarse
 * scan, then bisects it.
 * @param massSolar hole mass, solar masses (> 0)
 * @param segments the chain so far (radii and durations in M)
 * @param index the segment to measure (a drop, fall or free fall)
 * @param targetM radius to reach, M (> 0)
 * @returns the duration in M, or a sentence saying why there is none
 */
export function durationUntilRadius(massSolar: number, segments: SegmentSpec[], index: number, targetM: number): number | string {
  if (!(targetM > 0) || !Number.isFinite(targetM)) return 'the radius must be a positive number';
  const seg = segments[index];
  if (!seg || (seg.kind !== 'drop' && seg.kind !== 'fall' && seg.kind !== 'free-fall')) return 'only falls can run until a radius';
  const open = { ...seg, duration: undefined };
  let worldline;
  try {
    worldline = buildWorldline({ massSolar, segments: [...segments.slice(0, index), open] });
  } catch (error) {
    return error instanceof Error && /duration/.test(error.message) ? 'this fall never reaches the singularity: give it a proper time instead' : 'fix the segments before this one first';
  }
  const built = worldline.segments[index];
  const start = built.tauStart;
  const length = built.duration * (1 - 1e-9);
  const rAt = (local: number) => sampleWorldline(worldline, start + local).state.r;
  const r0 = rAt(0);
  const sign = Math.sign(r0 - targetM);
  if (sign === 0) return 'the segment already starts at that radius';
  const steps = 400;
  let previous = 0;
  for (let i = 1; i <= steps; i++) {
    const local = (length * i) / steps;
    if (Math.sign(rAt(local) - targetM) !== sign) {
      let lo = previous;
      let hi = local;
      for (let k = 0; k < 60; k++) {
        const mid = (lo + hi) / 2;
        if (Math.sign(rAt(mid) - targetM) === sign) lo = mid;
        else hi = mid;
      }
      return (lo + hi) / 2;
    }
    previous = local;
  }
  return 'this segment never reaches that radius';
}
