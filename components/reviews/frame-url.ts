/**
 * URL of a review frame (app/api/v1/studios/[studio]/scenes/[sceneId]/revisions/[number]/frame).
 * @param tauM proper time on the path, M (sent as JS prints it: round-trips exactly)
 */
export function frameUrl(studio: string, sceneId: string, revision: number, tauM: number, size: { width: number; height: number }, lensing: boolean): string {
  const q = new URLSearchParams({ tau: String(tauM), width: String(size.width), height: String(size.height), lensing: lensing ? 'on' : 'off' });
  return `/api/v1/studios/${studio}/scenes/${sceneId}/revisions/${revision}/frame?${q}`;
}

/** Frame size of the review page's scrub view: square for dome masters and cube faces, 16:10 for flat frames. */
export function reviewFrameSize(projectionKind: string, side: number): { width: number; height: number } {
  if (projectionKind === 'flat') return { width: side, height: Math.round((side * 10) / 16) };
  if (projectionKind === 'equirect') return { width: side, height: Math.round(side / 2) };
  return { width: Math.round(side * 0.75), height: Math.round(side * 0.75) };
}
