'use client';

import { useEffect, useRef, useState } from 'react';
import type { SceneSpec } from '@/lib/scenes/schema';
import type { TimelinePoint } from './timeline';

/** The shot sampled along screen time, recomputed in a worker whenever the scene changes (latest answer wins). */
export function useTimeline(spec: SceneSpec | null) {
  const worker = useRef<Worker | null>(null);
  const latest = useRef(0);
  const [state, setState] = useState<{ points: TimelinePoint[] | null; error: string | null; busy: boolean }>({ points: null, error: null, busy: false });

  useEffect(() => {
    const w = new Worker(new URL('./analysis.worker.ts', import.meta.url), { type: 'module' });
    worker.current = w;
    w.onmessage = (event: MessageEvent<{ id: number; points?: TimelinePoint[]; error?: string }>) => {
      if (event.data.id !== latest.current) return;
      setState({ points: event.data.points ?? null, error: event.data.error ?? null, busy: false });
    };
    return () => {
      w.terminate();
      worker.current = null;
    };
  }, []);

  useEffect(() => {
    if (!spec || !worker.current) return;
    const id = ++latest.current;
    setState((s) => ({ ...s, busy: true }));
    const timer = setTimeout(() => worker.current?.postMessage({ id, spec }), 150);
    return () => clearTimeout(timer);
  }, [spec]);

  return state;
}
