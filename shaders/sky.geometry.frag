// sky.geometry.frag — the first pass of interpolated geometry: where the light of every grid point comes from,
// for a grid of frame points uGeometryStep pixels apart, into a float RGBA target (hole-frame unit direction,
// footprint in radians) that sky.lensed.frag (INTERPOLATED_GEOMETRY) reads with bilinear filtering in interior
// sky tiles (lib/webgl/fateTiles.ts interiorSkyTiles). Tracing one point in uGeometryStep^2 instead of every
// pixel: the per-pixel geometry (pixel -> look angle -> ray table -> sky direction) is about a third of a frame
// in software WebGL, and the map is smooth away from the shadow's edge.
// Compile-time switches: PROJECTION, LENSING, BOOST of sky.common.glsl.
// Uniforms (besides those of sky.common.glsl): uGeometryStep float (pixels between grid points), uGeometrySize
//   vec2 (grid points across and down; grid point (i, j) is frame point (i, j) x step + 0.5, j from the top,
//   stored bottom-up like the frame).
// Mirrors: lib/render/shade.ts Shader.shade (direction and footprint) through traceFramePoint.
precision highp float;
precision highp int;
precision highp sampler2D;

#include "sky.common.glsl"

uniform float uGeometryStep;
uniform vec2 uGeometrySize;

out vec4 fragColor;

void main() {
  vec2 cell = vec2(floor(gl_FragCoord.x), uGeometrySize.y - 1.0 - floor(gl_FragCoord.y));
  Trace tr = traceFramePoint(cell * uGeometryStep + 0.5);
  fragColor = vec4(tr.dir, tr.footRad);
}
