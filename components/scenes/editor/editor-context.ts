'use client';

import { createContext, useContext } from 'react';
import type { LiveScene, IssueMap } from './use-live-scene';

/** What every panel of the editor reads: units for the scene's mass and live issues. Changes only on edits. */
export interface EditorContextValue {
  canEdit: boolean;
  /** seconds per M and metres per M for the mass being typed (null while the mass is not a valid number) */
  secondsPerM: number | null;
  metresPerM: number | null;
  /** unit for proper times typed in the panels, chosen for the mass so numbers stay readable */
  time: { unit: 's' | 'ms' | 'µs'; fromM: (m: number) => number; toM: (v: number) => number } | null;
  issues: IssueMap;
  live: LiveScene | null;
}

/**
 * The scrub position, in its own context so the panels and the form do not
 * re-render on every frame of a scrub or playback. Consumers get a deferred
 * copy: the preview and scrubber stay smooth, charts and markers follow.
 */
export interface PlayheadValue {
  /** proper time at the scrubber, M */
  tau: number;
  /** screen time at the scrubber, s */
  screenTime: number;
  setScreenTime: (seconds: number) => void;
}

export const EditorContext = createContext<EditorContextValue | null>(null);

export function useEditor(): EditorContextValue {
  const value = useContext(EditorContext);
  if (!value) throw new Error('useEditor must be used inside the scene editor');
  return value;
}

export const PlayheadContext = createContext<PlayheadValue | null>(null);

export function usePlayhead(): PlayheadValue {
  const value = useContext(PlayheadContext);
  if (!value) throw new Error('usePlayhead must be used inside the scene editor');
  return value;
}

/** Seconds, milliseconds or microseconds, whichever keeps a path of ~100 M readable for this mass. */
export function timeUnitFor(secondsPerM: number | null): EditorContextValue['time'] {
  if (!secondsPerM) return null;
  const [unit, factor] = secondsPerM >= 1e-2 ? (['s', 1] as const) : secondsPerM >= 1e-5 ? (['ms', 1e3] as const) : (['µs', 1e6] as const);
  return { unit, fromM: (m) => m * secondsPerM * factor, toM: (v) => v / (secondsPerM * factor) };
}
