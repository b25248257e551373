// sky.lensed.frag — the lensed sky as the camera sees it: stars, Milky Way, uniform sky, horizon and far-side
// grids, optional celestial grid ("where the light comes from"), exposure, tone mapping, sRGB encoding.
// Mirrors: lib/render/shade.ts Shader.shade and lib/render/renderRows.ts renderBandLinear (+ toneMap.ts),
// with lib/webgl/sourceDirections.ts compositeCelestialGrid for the celestial grid.
// Two steps are cheaper approximations of lib/render's, for software WebGL (SwiftShader), where every
// texture lookup and transcendental costs each pixel: the sources of a pixel are coloured by ONE blackbody
// lookup at their luminance-weighted mean ln T (lib/render sums one coloured lookup per source; the two agree
// exactly where one source dominates a pixel, as almost everywhere), and the sRGB curve is a three-square-root
// fit; and interior sky tiles interpolate their geometry (INTERPOLATED_GEOMETRY). Against lib/render the frame
// differs by a mean of about 0.2/255 and a 99th percentile of 2/255 (tests/e2e/sky-view.spec.ts; the issue
// allows 2/255 and 10/255).
//
// Compile-time switches (besides those of sky.common.glsl; lib/webgl/shaderVariant.ts):
//   SAMPLES             samples per axis (1..4), box filter
//   TONE_MAP            0 none, 1 Reinhard (luminance), 2 exponential 1 - exp(-c)
//   HORIZON_GRID, FAR_SIDE_GRID, CELESTIAL_GRID   1 where that grid is drawn and its rays can occur in the
//                       frame (the celestial one in the "where the light comes from" mode)
//   STARS               1: star catalogue on;  DIFFUSE 1: diffuse map bound;  MILKY_WAY 1: Milky Way on
//   UNIFORM_SKY         1: uniform sky brightness on
//   INTERPOLATED_GEOMETRY 1: every ray reaches the sky, and the direction and footprint are interpolated from
//                       the grid of sky.geometry.frag (interior sky tiles of the picture mode); 0: traced here
//
// Uniforms (besides those of sky.common.glsl):
//   uColourShift        bool    shift colours by g (physics.md section 6)
//   uBeaming            bool    scale brightness by g^4
//   uExposureScale      float   display units per (mag-0 star flux per steradian): 2^ev / 1000
//   uColourTable        sampler2D RGBA float, one row: unit-luminance linear sRGB of a blackbody against ln T
//   uColourLogMinK      float   ln T of the first entry (ln K);  uColourEntries float  entries in the table
//   uColourIndexPerLog  float   table entries per unit of ln T
//   uStarGain float;  uPsfSigmaPx float (pixels);  uSourceSizeRad float (radians)
//   uStarTiles          usamplerCube RGBA32UI, nearest texel, no mip levels: per level (a channel each), the list of
//                       that level's tile holding the texel, packed as first entry << uStarTileCountBits | entry
//                       count (lib/webgl/starTiles.ts StarTileIndex)
//   uStarTileCountBits  int     low bits of a packed tile holding its count
//   uStarTileEntries    sampler2D RGBA float: unit vector times flux (mag-0 units), and ln(T / 1 K), of the star
//                       of each list entry, in rows as arrayTexel
//   uStarTileMargins    vec4    per level, narrowest first: largest kernel reach served (3 sigma, chord of unit
//                       vectors)
//   uDiffuse            sampler2D RGBA float mip-mapped equirect (Milky Way per sr, star flux per sr,
//                       star flux x K per sr);  uDiffuseTexelRad float (radians)
//   uMilkyWayGain float;  uMilkyWayLogT float (ln K)
//   uUniformBrightness  float   mag-0 fluxes per steradian;  uUniformTemperatureK float (K)
//   uHorizonGrid, uFarSideGrid  vec4 (enabled 0/1, spacing rad, line width px, dashed 0/1)
//   uHorizonColour, uFarSideColour, uCelestialColour  vec3 display-linear colours
//   uCelestialGrid      vec4    like the grids
//   uGeometry           sampler2D RGBA float, linear filter: sky.geometry.frag's grid (direction, footprint)
//   uGeometryStep float (pixels between grid points);  uGeometrySize vec2 (grid points across and down)
precision highp float;
precision highp int;
precision highp sampler2D;
precision highp usamplerCube;

#include "sky.common.glsl"

#ifndef SAMPLES
#define SAMPLES 1
#endif
#ifndef TONE_MAP
#define TONE_MAP 2
#endif
#ifndef HORIZON_GRID
#define HORIZON_GRID 1
#endif
#ifndef FAR_SIDE_GRID
#define FAR_SIDE_GRID 1
#endif
#ifndef CELESTIAL_GRID
#define CELESTIAL_GRID 0
#endif
#ifndef STARS
#define STARS 1
#endif
#ifndef DIFFUSE
#define DIFFUSE 1
#endif
#ifndef MILKY_WAY
#define MILKY_WAY 1
#endif
#ifndef UNIFORM_SKY
#define UNIFORM_SKY 0
#endif
#ifndef INTERPOLATED_GEOMETRY
#define INTERPOLATED_GEOMETRY 0
#endif

#define STAR_CELL_SIZE 0.02

uniform bool uColourShift;
uniform bool uBeaming;
uniform float uExposureScale;
uniform highp sampler2D uColourTable;
uniform float uColourLogMinK;
uniform float uColourEntries;
uniform float uColourIndexPerLog;
uniform float uStarGain;
uniform float uPsfSigmaPx;
uniform float uSourceSizeRad;
uniform highp usamplerCube uStarTiles;
uniform highp sampler2D uStarTileEntries;
uniform int uStarTileCountBits;
uniform vec4 uStarTileMargins;
uniform highp sampler2D uDiffuse;
uniform float uDiffuseTexelRad;
uniform float uMilkyWayGain;
uniform float uMilkyWayLogT;
uniform float uUniformBrightness;
uniform float uUniformTemperatureK;
uniform vec4 uHorizonGrid;
uniform vec4 uFarSideGrid;
uniform vec4 uCelestialGrid;
uniform vec3 uHorizonColour;
uniform vec3 uFarSideColour;
uniform vec3 uCelestialColour;

#if INTERPOLATED_GEOMETRY
uniform highp sampler2D uGeometry;
uniform float uGeometryStep;
uniform vec2 uGeometrySize;
#endif

out vec4 fragColor;

#if INTERPOLATED_GEOMETRY
// texture coordinate of frame point p in sky.geometry.frag's grid
vec2 gridCoord(vec2 p) {
  vec2 cell = (p - 0.5) / uGeometryStep;
  return vec2(cell.x + 0.5, uGeometrySize.y - 0.5 - cell.y) / uGeometrySize;
}

// traceFramePoint for a ray known to reach the sky, its direction and footprint interpolated bilinearly between
// the four grid points around p (uGeometryStep pixels apart; the error is second order in the step, a small part
// of a footprint where interior tiles are drawn: tests/unit/webgl/fateTiles.test.ts); g is exact, from p's own
// look direction
Trace interpolatedTrace(vec2 p) {
  Trace tr;
  vec4 geo = textureLod(uGeometry, gridCoord(p), 0.0);
  float pixelRad;
  float doppler;
  vec3 n = referenceLook(p, pixelRad, doppler);
  tr.g = frequencyShift(n, doppler);
  tr.dir = normalize(geo.xyz);
  tr.fate = 0.0;
  tr.footRad = geo.w;
  tr.dA = vec3(0.0);
  tr.dB = vec3(0.0);
  return tr;
}
#endif

// lib/render/colourTable.ts blackbodyColourLog: linear interpolation between table entries.
vec3 blackbodyLog(float logT) {
  float x = clamp((logT - uColourLogMinK) * uColourIndexPerLog, 0.0, uColourEntries - 1.0);
  return texture(uColourTable, vec2((x + 0.5) / uColourEntries, 0.5)).rgb;
}

#if STARS
// Star light by Gaussian kernels on the sky (lib/render/shade.ts, the star loop): every star closer than
// reach = 3 sigma adds its kernel. The one tile list read holds every star within its margin of the tile: that
// of the first level whose margin covers the reach (the last level's margin is the widest reach summed).
vec2 starLight(vec3 d, float sigma, float weight) {
  vec2 sum = vec2(0.0);
  float reach = 3.0 * sigma;
  float reach2 = reach * reach;
  float inv2s2 = 1.0 / (2.0 * sigma * sigma);
  float norm = uStarGain * weight / (2.0 * PI * sigma * sigma);
  // the lists of the tiles holding d (lib/webgl/starTiles.ts starTileOf), found by the sampler's own cube-map
  // lookup, then the list of the first level whose margin covers the reach
  uvec4 lists = textureLod(uStarTiles, d, 0.0);
  vec4 m = uStarTileMargins;
  uint list = reach <= m.x ? lists.x : reach <= m.y ? lists.y : reach <= m.z ? lists.z : lists.w;
  uint bits = uint(uStarTileCountBits);
  int first = int(list >> bits);
  int end = first + int(list & ((1u << bits) - 1u));
  for (int s = first; s < end; s++) {
    // one texel per star: its direction times its flux, and ln T
    vec4 star = texelFetch(uStarTileEntries, arrayTexel(s), 0);
    float flux2 = dot(star.xyz, star.xyz);
    float invFlux = inversesqrt(flux2);
    vec3 e = star.xyz * invFlux - d;
    float dist2 = dot(e, e);
    float w = dist2 < reach2 ? flux2 * invFlux * exp(-dist2 * inv2s2) : 0.0;
    sum += w * vec2(1.0, star.w);
  }
  return norm * sum;
}
#endif

// Radiance (mag-0 fluxes per sr, linear sRGB) and overlay (premultiplied colour, coverage) of one sample.
void shadeSample(vec2 p, float samples, out vec3 radiance, out vec4 overlay, out float celestial) {
  radiance = vec3(0.0);
  overlay = vec4(0.0);
  celestial = 0.0;
#if INTERPOLATED_GEOMETRY
  Trace tr = interpolatedTrace(p);
#else
  Trace tr = traceFramePoint(p);
#endif
  bool sky = tr.fate > -0.5 && tr.fate < 0.5;
  // colours shift by g: ln(g) moves a blackbody's ln T (physics.md section 6)
  float logShift = uColourShift ? log(tr.g) : 0.0;
  float mapWeight = 0.0;
  // (luminance, luminance x ln T) of all sources
  vec2 light = vec2(0.0);
#if STARS
  // the star loop first: the fewer values live across a loop, the fewer SwiftShader saves and reloads
  float starSigma = max(uPsfSigmaPx * tr.footRad, uSourceSizeRad);
  float sigmaMax = STAR_CELL_SIZE / 3.0;
  mapWeight = smoothstep(0.5 * sigmaMax, sigmaMax, starSigma);
  if (sky && mapWeight < 1.0) light = starLight(tr.dir, starSigma, 1.0 - mapWeight);
#endif
  vec2 ll = latLon(tr.dir);
#if HORIZON_GRID || FAR_SIDE_GRID || CELESTIAL_GRID
  // one grid per sample: the horizon's or far side's where the ray ends on r = 2M, the celestial one on the sky
  bool horizon = tr.fate > 0.5 && tr.fate < 1.5;
#if HORIZON_GRID
  vec4 horizonGrid = uHorizonGrid;
#else
  vec4 horizonGrid = vec4(0.0);
#endif
#if FAR_SIDE_GRID
  vec4 farSideGrid = uFarSideGrid;
#else
  vec4 farSideGrid = vec4(0.0);
#endif
  vec4 grid = sky ? vec4(float(CELESTIAL_GRID), uCelestialGrid.yz, 0.0) : horizon ? horizonGrid : farSideGrid;
  if (tr.fate > -0.5 && grid.x > 0.5) {
    float cover = gridCoverage(tr, ll, grid.y, grid.z, 1.0 / samples, grid.w > 0.5);
    if (sky) celestial = cover;
    else overlay = vec4((horizon ? uHorizonColour : uFarSideColour) * cover, cover);
  }
#endif
#if DIFFUSE
  // Milky Way and the star-light map for wide kernels (lib/render/skyMap.ts sampleSkyMapIo: mip level from the
  // footprint, Williams 1983)
  float u = ll.y / (2.0 * PI);
  u -= floor(u);
  float v = 0.5 - ll.x / PI;
  float ratio = tr.footRad / samples / uDiffuseTexelRad;
  float lod = ratio > 1.0 ? log2(ratio) : 0.0;
  vec4 m = textureLod(uDiffuse, vec2(u, v), lod);
#if MILKY_WAY
  light += m.r * uMilkyWayGain * vec2(1.0, uMilkyWayLogT);
#endif
#if STARS
  if (mapWeight > 0.0 && m.g > 0.0) light += m.g * uStarGain * mapWeight * vec2(1.0, log(m.b / m.g));
#endif
#endif
#if UNIFORM_SKY
  light += uUniformBrightness * vec2(1.0, log(uUniformTemperatureK));
#endif
  // Liouville: bolometric surface brightness scales as g^4 (physics.md section 6)
  float g2 = tr.g * tr.g;
  vec3 colour = light.x > 0.0 ? light.x * blackbodyLog(light.y / light.x + logShift) : vec3(0.0);
  if (sky) radiance = colour * (uBeaming ? g2 * g2 : 1.0);
}

// sRGB encoding (IEC 61966-2-1) of display-linear values, clamped to 0..1: the linear toe exactly, the power
// curve by a fit in sqrt(c), c^(1/4) and c^(1/8) (common practice in real-time graphics; coefficients from
// memory) that stays within 1/255 of 1.055 c^(1/2.4) - 0.055 after rounding (tests/unit/webgl/srgbFit.test.ts).
// Written for three channels at once and without branches: software WebGL pays for every branch of a quad.
// Three square roots cost it less than one vector pow: the encoding is now about 1% of a 1280x720 frame in
// SwiftShader.
vec3 srgbEncode(vec3 c) {
  c = clamp(c, 0.0, 1.0);
  // the select form of mix: the toe below 0.0031308, the fit above
  vec3 s1 = sqrt(c);
  vec3 s2 = sqrt(s1);
  vec3 s3 = sqrt(s2);
  return mix(12.92 * c, 0.585122381 * s1 + 0.783140355 * s2 - 0.368262736 * s3, greaterThan(c, vec3(0.0031308)));
}

void main() {
  vec2 pixel = vec2(floor(gl_FragCoord.x), uFrameSizePx.y - 1.0 - floor(gl_FragCoord.y));
  vec3 radiance = vec3(0.0);
  vec4 overlay = vec4(0.0);
  float celestial = 0.0;
#if SAMPLES == 1
  shadeSample(pixel + 0.5, 1.0, radiance, overlay, celestial);
#else
  float n = float(SAMPLES);
  for (int sy = 0; sy < SAMPLES; sy++) {
    for (int sx = 0; sx < SAMPLES; sx++) {
      vec3 r;
      vec4 o;
      float c;
      shadeSample(pixel + (vec2(float(sx), float(sy)) + 0.5) / n, n, r, o, c);
      radiance += r;
      overlay += o;
      celestial += c;
    }
  }
  float inv = 1.0 / (n * n);
  radiance *= inv;
  overlay *= inv;
  celestial *= inv;
#endif
  vec3 colour = radiance * uExposureScale;
#if TONE_MAP == 1
  colour *= 1.0 / (1.0 + dot(colour, vec3(0.2126, 0.7152, 0.0722)));
#elif TONE_MAP == 2
  colour = 1.0 - exp(-colour);
#endif
  colour = colour * (1.0 - overlay.a) + overlay.rgb;
  colour = colour * (1.0 - celestial) + uCelestialColour * celestial;
  fragColor = vec4(srgbEncode(colour), 1.0);
}
