'use client';
/**
 * When the preview's WebGL path should draw light (half-size) frames while moving: once full-size frames in
 * motion come slower than 20 per second (software WebGL on a machine without a GPU), unless the producer
 * has asked for full-size frames.
 */
import { useCallback, useEffect, useRef, useState } from 'react';

/** WebGL frames in motion slower than this (median of the last MOTION_SAMPLES intervals) switch to light frames, ms. */
const SLOW_FRAME_MS = 50;
const MOTION_SAMPLES = 8;
/**
 * Intervals ignored when the scrubber starts moving: the first frames of a move pay one-off costs (a shader
 * variant compiled, code warming up), which used to switch a machine that keeps up to light frames.
 */
const WARM_UP_INTERVALS = 4;
/** localStorage key of the producer's choice to keep WebGL frames full size while moving. */
const FULL_FRAMES_KEY = 'skywell:preview-full-frames-while-moving';

/** The producer's "full-size frames while moving" choice, kept in this browser. */
export function useFullFramesChoice(): [boolean, (on: boolean) => void] {
  const [on, setOn] = useState(false);
  useEffect(() => setOn(window.localStorage.getItem(FULL_FRAMES_KEY) === '1'), []);
  const choose = useCallback((next: boolean) => {
    setOn(next);
    window.localStorage.setItem(FULL_FRAMES_KEY, next ? '1' : '0');
  }, []);
  return [on, choose];
}

/**
 * Watches WebGL frame intervals while `watch` holds (the scrubber moving: dragged or playing) and reports
 * whether full-size frames come slower than SLOW_FRAME_MS. Once slow, it stays so for this editor: the
 * machine's WebGL (software on a computer without a GPU) does not speed up. The median resists a pause in a
 * mouse drag; the first WARM_UP_INTERVALS of each move are not counted.
 */
export function useSlowWebGl(watch: boolean): { slow: boolean; onFrame: () => void } {
  const [slow, setSlow] = useState(false);
  const watching = useRef(false);
  watching.current = watch && !slow;
  const last = useRef(0);
  const intervals = useRef<number[]>([]);
  const skipped = useRef(0);
  const onFrame = useCallback(() => {
    const now = performance.now();
    if (!watching.current) {
      last.current = 0;
      intervals.current = [];
      skipped.current = 0;
      return;
    }
    if (last.current > 0) {
      if (skipped.current < WARM_UP_INTERVALS) skipped.current++;
      else intervals.current.push(now - last.current);
    }
    last.current = now;
    if (intervals.current.length < MOTION_SAMPLES) return;
    intervals.current = intervals.current.slice(-MOTION_SAMPLES);
    const sorted = [...intervals.current].sort((a, b) => a - b);
    if ((sorted[MOTION_SAMPLES / 2 - 1] + sorted[MOTION_SAMPLES / 2]) / 2 > SLOW_FRAME_MS) setSlow(true);
  }, []);
  return { slow, onFrame };
}
