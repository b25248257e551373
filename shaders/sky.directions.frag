// sky.directions.frag — debug / test target of the "where the light comes from" view: writes, per pixel centre,
// the unit direction on the celestial sphere (or the point on r = 2M) in the hole frame (J2000 axes) and the fate
// code (0 sky, 1 horizon, 2 far side, -1 outside the image) into a float RGBA target read back with readPixels.
// Compile-time switches: PROJECTION, LENSING, BOOST of sky.common.glsl (lib/webgl/shaderVariant.ts directionsShaderDefines).
// Uniforms: those of sky.common.glsl (geometry, reference observer, ray table).
// Mirrors: lib/webgl/sourceDirections.ts traceSourceDirection (itself lib/render/shade.ts Shader.shade).
precision highp float;
precision highp int;
precision highp sampler2D;

#include "sky.common.glsl"

out vec4 fragColor;

void main() {
  vec2 p = vec2(floor(gl_FragCoord.x) + 0.5, uFrameSizePx.y - 0.5 - floor(gl_FragCoord.y));
  Trace tr = traceFramePoint(p);
  fragColor = vec4(tr.dir, tr.fate);
}
