/**
 * What the browser offers for the WebGL path: WebGL2 with float textures that
 * can be filtered linearly (the mip-mapped sky map and colour table), and
 * whether float render targets exist (the "where the light comes from" debug
 * target). Anything missing sends the view to the CPU worker.
 */

/** Result of {@link detectWebGlSupport}. */
export type WebGlSupport = { ok: true; floatTargets: boolean } | { ok: false; reason: string };

/** Probe a throw-away canvas for what the GPU path needs. */
export function detectWebGlSupport(): WebGlSupport {
  if (typeof document === 'undefined') return { ok: false, reason: 'no document' };
  let gl: WebGL2RenderingContext | null = null;
  try {
    gl = document.createElement('canvas').getContext('webgl2');
  } catch {
    gl = null;
  }
  if (!gl) return { ok: false, reason: 'WebGL2 is not available' };
  try {
    if (!gl.getExtension('OES_texture_float_linear')) return { ok: false, reason: 'float textures cannot be filtered (OES_texture_float_linear missing)' };
    const floatTargets = !!gl.getExtension('EXT_color_buffer_float');
    return { ok: true, floatTargets };
  } finally {
    gl.getExtension('WEBGL_lose_context')?.loseContext();
  }
}
