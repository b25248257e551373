'use client';

import { useEffect, useState } from 'react';
import type { Worldline } from '@/lib/relativity';
import { sceneSpecSchema, type SceneSpec } from '@/lib/scenes/schema';
import { sceneWorldline } from '@/lib/scenes/readout';
import { sceneTiming, type SceneTiming } from '@/lib/scenes/frame-request';

/** The last valid state of the scene being edited, ready for readouts, charts and preview. */
export interface LiveScene {
  spec: SceneSpec;
  worldline: Worldline;
  timing: SceneTiming;
  /** changes whenever spec changes (for keys and caches) */
  version: number;
}

/** Field path ("path.segments.0.r") -> message, from the one scene schema. */
export type IssueMap = Record<string, string>;

let version = 0;

/** Validate and build a scene; null plus issues when it is not valid. */
export function buildLiveScene(values: unknown): { live: LiveScene | null; issues: IssueMap } {
  const parsed = sceneSpecSchema.safeParse(values);
  if (!parsed.success) {
    const issues: IssueMap = {};
    for (const issue of parsed.error.issues) {
      const key = issue.path.join('.');
      if (!(key in issues)) issues[key] = issue.message;
    }
    return { live: null, issues };
  }
  try {
    const worldline = sceneWorldline(parsed.data);
    return { live: { spec: parsed.data, worldline, timing: sceneTiming(parsed.data, worldline), version: ++version }, issues: {} };
  } catch (error) {
    return { live: null, issues: { path: error instanceof Error ? error.message : 'the camera path cannot be built' } };
  }
}

/**
 * Validates the form's values shortly after each change (so typing never
 * waits on the physics) and keeps the last valid scene for the preview.
 */
export function useLiveScene(values: unknown, initial: { live: LiveScene | null; issues: IssueMap }, delayMs = 120) {
  const [state, setState] = useState(() => ({ ...initial, pending: false }));
  useEffect(() => {
    setState((s) => (s.pending ? s : { ...s, pending: true }));
    const timer = setTimeout(() => {
      const next = buildLiveScene(values);
      setState((s) => ({ live: next.live ?? s.live, issues: next.issues, pending: false, valid: next.live !== null }));
    }, delayMs);
    return () => clearTimeout(timer);
  }, [values, delayMs]);
  return state as { live: LiveScene | null; issues: IssueMap; pending: boolean; valid?: boolean };
}
