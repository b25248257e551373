'use client';
/**
 * <SkyView request={FrameRequest} mode=... />: the lensed sky of one lib/render
 * frame request, drawn by WebGL when the browser offers WebGL2 with filterable
 * float textures, otherwise (or after a lost context) by lib/render in a Web
 * Worker, switching without a reload and saying which path is in use.
 */
import { useCallback, useEffect, useState } from 'react';
import type { FrameRequest } from '@/lib/render/schema';
import type { SkyViewMode } from './gpu/gpu-sky-renderer';
import { detectWebGlSupport } from './gpu/capabilities';
import { WebGlSky } from './webgl-sky';
import { CpuSky } from './cpu-sky';
import { PathIndicator, type SkyViewPath } from './path-indicator';
import { DEFAULT_SKY_ASSET_BASE } from './sky-assets';

export type { SkyViewMode } from './gpu/gpu-sky-renderer';
export type { SkyViewPath } from './path-indicator';

export interface SkyViewProps {
  /** a validated lib/render frame request (parseFrameRequest) */
  request: FrameRequest;
  /** 'image': the picture; 'sources': with the celestial grid drawn through the lensing ("where the light comes from") */
  mode?: SkyViewMode;
  /** force the CPU path (e.g. to compare) */
  forceCpu?: boolean;
  /** URL prefix of the sky-assets API */
  assetBase?: string;
  onPathChange?: (path: SkyViewPath) => void;
  /** called after each frame the WebGL path draws */
  onFrame?: () => void;
  /** width frames are shown at, px, on either path: the request is scaled to it (default: the request's width) */
  displayWidth?: number;
}

export function SkyView({ request, mode = 'image', forceCpu = false, assetBase = DEFAULT_SKY_ASSET_BASE, onPathChange, onFrame, displayWidth }: SkyViewProps) {
  const [path, setPath] = useState<SkyViewPath>({ kind: 'detecting' });
  useEffect(() => {
    if (forceCpu) {
      setPath({ kind: 'cpu', reason: 'chosen in the settings' });
      return;
    }
    const support = detectWebGlSupport();
    setPath(support.ok ? { kind: 'webgl' } : { kind: 'cpu', reason: support.reason });
  }, [forceCpu]);
  useEffect(() => onPathChange?.(path), [path, onPathChange]);
  const fallBack = useCallback((reason: string) => setPath({ kind: 'cpu', reason }), []);
  return (
    <div className="space-y-2" data-testid="sky-view">
      <div className="overflow-hidden rounded-md border border-ink-700 bg-black">
        {path.kind === 'webgl' && <WebGlSky request={request} mode={mode} assetBase={assetBase} onFailure={fallBack} onFrame={onFrame} displayWidth={displayWidth} />}
        {path.kind === 'cpu' && <CpuSky request={request} mode={mode} assetBase={assetBase} displayWidth={displayWidth} />}
        {path.kind === 'detecting' && <div style={{ width: request.width, height: request.height }} />}
      </div>
      <PathIndicator path={path} />
    </div>
  );
}
