/** Says which renderer draws the sky view, and why when it is the CPU fallback. */
export type SkyViewPath = { kind: 'detecting' } | { kind: 'webgl' } | { kind: 'cpu'; reason: string };

export function PathIndicator({ path }: { path: SkyViewPath }) {
  const text =
    path.kind === 'webgl' ? 'WebGL (GPU)' : path.kind === 'cpu' ? `CPU renderer in a worker — ${path.reason}` : 'Checking WebGL…';
  return (
    <p className="text-xs text-slate-400" aria-live="polite">
      Renderer:{' '}
      <span data-testid="sky-view-path" data-path={path.kind} className={path.kind === 'webgl' ? 'text-teal-300' : 'text-violet-300'}>
        {text}
      </span>
    </p>
  );
}
