import type { SegmentSpec } from '@/lib/scenes/schema';

export type SegmentKind = SegmentSpec['kind'];

/** The segment kinds in the producer's words (product.md flow 2). */
export const SEGMENT_LABELS: Record<SegmentKind, string> = {
  hover: 'Hover',
  'circular-orbit': 'Circular orbit',
  drop: 'Drop from rest',
  fall: 'Fall with a chosen speed',
  'free-fall': 'Free fall with angular momentum',
  hold: 'Thrusted hold',
};

export const SEGMENT_HINTS: Record<SegmentKind, string> = {
  hover: 'Rockets keep the camera at a fixed radius.',
  'circular-orbit': 'Coasting on a circular orbit (outside the photon sphere).',
  drop: 'Released at rest, falling straight in.',
  fall: 'Falling straight in, starting with a speed measured by a hovering observer.',
  'free-fall': 'Coasting with energy and angular momentum of your choice.',
  hold: 'Rockets hold the radius where the previous segment ended, optionally circling.',
};

/** Kinds whose length may be "until the singularity" (no duration). */
export const FALL_KINDS: readonly SegmentKind[] = ['drop', 'fall', 'free-fall'];

/**
 * A new segment of a kind, keeping what carries over from the one it replaces.
 * Radii and durations in M (r = 2 is the horizon).
 */
export function segmentOfKind(kind: SegmentKind, previous: Partial<SegmentSpec> | undefined, isFirst: boolean): SegmentSpec {
  const prevR = previous && 'r' in previous ? previous.r : undefined;
  const r = isFirst ? (prevR ?? 20) : undefined;
  const duration = previous && 'duration' in previous && previous.duration !== undefined ? previous.duration : 50;
  switch (kind) {
    case 'hover':
      return { kind, r, duration };
    case 'circular-orbit':
      return { kind, r: isFirst && r !== undefined && r <= 3 ? 8 : r, duration, sense: 1 };
    case 'drop':
      return { kind, r };
    case 'fall':
      return { kind, r, speed: 0.1 };
    case 'free-fall':
      return { kind, r, energy: 1, angularMomentum: 3.5, radialSense: 'in' };
    case 'hold':
      return { kind, duration, orbitalSpeed: 0 };
  }
}
