// sky.lensed.frag — the lensed sky as the camera sees it: stars, Milky Way, uniform sky, horizon and far-side
// grids, optional celestial grid ("where the light comes from"), exposure, tone mapping, sRGB encoding.
// Mirrors: lib/render/shade.ts Shader.shade and lib/render/renderRows.ts renderBandLinear (+ toneMap.ts),
// with lib/webgl/sourceDirections.ts compositeCelestialGrid for the celestial grid.
//
// Compile-time switches (besides those of sky.common.glsl; lib/webgl/shaderVariant.ts):
//   SAMPLES             samples per axis (1..4), box filter
//   TONE_MAP            0 none, 1 Reinhard (luminance), 2 exponential 1 - exp(-c)
//   HORIZON_GRID, FAR_SIDE_GRID, CELESTIAL_GRID   1 where that grid is drawn (the celestial one in the
//                       "where the light comes from" mode)
//   STARS               1: star catalogue on;  DIFFUSE 1: diffuse map bound;  MILKY_WAY 1: Milky Way on
//   UNIFORM_SKY         1: uniform sky brightness on
//
// Uniforms (besides those of sky.common.glsl):
//   uColourShift        bool    shift colours by g (physics.md section 6)
//   uBeaming            bool    scale brightness by g^4
//   uExposureScale      float   display units per (mag-0 star flux per steradian): 2^ev / 1000
//   uColourTable        sampler2D RGBA float, one row: unit-luminance linear sRGB of a blackbody against ln T
//   uColourLogMinK      float   ln T of the first entry (ln K);  uColourLogSpan float ln T span of the table
//   uStarGain float;  uPsfSigmaPx float (pixels);  uSourceSizeRad float (radians)
//   uStarPosFlux        sampler2D RGBA float: hole-frame unit vector and flux (mag-0 units) per star, 1024 wide
//   uStarLogT           sampler2D R float: ln(T / 1 K) per star, 1024 wide
//   uCellStart          sampler2D R float: first star of each cell of lib/render's star grid, 1024 wide
//   uMaxRun             int     most stars in a z-run of three cells (loop bound)
//   uDiffuse            sampler2D RGBA float mip-mapped equirect (Milky Way per sr, star flux per sr,
//                       star flux x K per sr);  uDiffuseTexelRad float (radians)
//   uMilkyWayGain float;  uMilkyWayLogT float (ln K)
//   uUniformBrightness  float   mag-0 fluxes per steradian;  uUniformTemperatureK float (K)
//   uHorizonGrid, uFarSideGrid  vec4 (enabled 0/1, spacing rad, line width px, dashed 0/1)
//   uHorizonColour, uFarSideColour, uCelestialColour  vec3 display-linear colours
//   uCelestialGrid      vec4    like the grids
precision highp float;
precision highp int;
precision highp sampler2D;

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

#define WHEN_GRID WHEN
#define WHEN_SKY if
#define WHEN_STAR if
#define WHEN_MAP WHEN

#define STAR_CELL_SIZE 0.02
#define STAR_CELLS 101

uniform bool uColourShift;
uniform bool uBeaming;
uniform float uExposureScale;
uniform highp sampler2D uColourTable;
uniform float uColourLogMinK;
uniform float uColourLogSpan;
uniform float uStarGain;
uniform float uPsfSigmaPx;
uniform float uSourceSizeRad;
uniform highp sampler2D uStarPosFlux;
uniform highp sampler2D uStarLogT;
uniform highp sampler2D uCellStart;
uniform int uMaxRun;
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

out vec4 fragColor;

// lib/render/colourTable.ts blackbodyColourLog: linear interpolation between table entries.
vec3 blackbodyLog(float logT) {
  float entries = float(textureSize(uColourTable, 0).x);
  float x = clamp((logT - uColourLogMinK) / uColourLogSpan * (entries - 1.0), 0.0, entries - 1.0);
  return texture(uColourTable, vec2((x + 0.5) / entries, 0.5)).rgb;
}

float fetchR(sampler2D tex, int i) {
  return texelFetch(tex, ivec2(i % 1024, i / 1024), 0).r;
}

#if STARS
// Star light by Gaussian kernels on the sky (lib/render/shade.ts, the star loop).
vec3 starLight(vec3 d, float sigma, float weight, float logShift) {
  vec3 sum = vec3(0.0);
  float reach = 3.0 * sigma;
  float reach2 = reach * reach;
  float inv2s2 = 1.0 / (2.0 * sigma * sigma);
  float norm = uStarGain * weight / (2.0 * PI * sigma * sigma);
  ivec3 lo = ivec3(floor((d - reach + 1.0) / STAR_CELL_SIZE));
  ivec3 hi = ivec3(floor((d + reach + 1.0) / STAR_CELL_SIZE));
  lo = max(lo, ivec3(0));
  hi = min(hi, ivec3(STAR_CELLS - 1));
  for (int ix = lo.x; ix <= hi.x; ix++) {
    for (int iy = lo.y; iy <= hi.y; iy++) {
      int base = (ix * STAR_CELLS + iy) * STAR_CELLS;
      int first = int(fetchR(uCellStart, base + lo.z) + 0.5);
      int end = min(int(fetchR(uCellStart, base + hi.z + 1) + 0.5), first + uMaxRun);
      for (int s = first; s < end; s++) {
        vec4 star = texelFetch(uStarPosFlux, ivec2(s % 1024, s / 1024), 0);
        vec3 e = star.xyz - d;
        float dist2 = dot(e, e);
        WHEN_STAR(dist2 < reach2) {
          float w = norm * star.w * exp(-dist2 * inv2s2);
          sum += w * blackbodyLog(fetchR(uStarLogT, s) + logShift);
        }
      }
    }
  }
  return sum;
}
#endif

// Radiance (mag-0 fluxes per sr, linear sRGB) of one sample whose light comes from the sky.
vec3 skyRadiance(Trace tr, float samples) {
  vec3 radiance = vec3(0.0);
  float shift = uColourShift ? tr.g : 1.0;
  float logShift = log(shift);
  float g2 = tr.g * tr.g;
  float beam = uBeaming ? g2 * g2 : 1.0;
  float mapWeight = 0.0;
#if STARS
  float starSigma = max(uPsfSigmaPx * tr.footRad, uSourceSizeRad);
  float sigmaMax = STAR_CELL_SIZE / 3.0;
  mapWeight = smoothstep(0.5 * sigmaMax, sigmaMax, starSigma);
  if (mapWeight < 1.0) radiance += starLight(tr.dir, starSigma, 1.0 - mapWeight, logShift);
#endif
#if DIFFUSE
  float u = atan(tr.dir.y, tr.dir.x) / (2.0 * PI);
  u -= floor(u);
  float v = 0.5 - atan(tr.dir.z, length(tr.dir.xy)) / PI;
  float ratio = tr.footRad / samples / uDiffuseTexelRad;
  float lod = ratio > 1.0 ? log2(ratio) : 0.0;
  vec4 s = textureLod(uDiffuse, vec2(u, v), lod);
#if MILKY_WAY
  radiance += s.r * uMilkyWayGain * blackbodyLog(uMilkyWayLogT + logShift);
#endif
#if STARS
  WHEN_MAP(mapWeight > 0.0 && s.g > 0.0) radiance += s.g * uStarGain * mapWeight * blackbodyLog(log(s.b / s.g) + logShift);
#endif
#endif
#if UNIFORM_SKY
  radiance += uUniformBrightness * blackbodyLog(log(uUniformTemperatureK) + logShift);
#endif
  return radiance * beam;
}

// Radiance (mag-0 fluxes per sr, linear sRGB) and overlay (premultiplied colour, coverage) of one sample.
void shadeSample(vec2 p, float samples, out vec3 radiance, out vec4 overlay, out float celestial) {
  radiance = vec3(0.0);
  overlay = vec4(0.0);
  celestial = 0.0;
  Trace tr = traceFramePoint(p);
  bool sky = tr.fate > -0.5 && tr.fate < 0.5;
#if HORIZON_GRID || FAR_SIDE_GRID || CELESTIAL_GRID
  // one grid per sample: the horizon's or far side's where the ray ends on r = 2M, the celestial one on the sky
  bool horizon = tr.fate > 0.5 && tr.fate < 1.5;
  vec4 grid = sky ? vec4(float(CELESTIAL_GRID), uCelestialGrid.yz, 0.0) : horizon ? uHorizonGrid : uFarSideGrid;
  WHEN_GRID(tr.fate > -0.5 && grid.x > 0.5) {
    float cover = gridCoverage(tr, grid.y, grid.z, 1.0 / samples, grid.w > 0.5);
    if (sky) celestial = cover;
    else overlay = vec4((horizon ? uHorizonColour : uFarSideColour) * cover, cover);
  }
#endif
  WHEN_SKY(sky) radiance = skyRadiance(tr, samples);
}

// sRGB encoding (IEC 61966-2-1) of a display-linear value, clamped to 0..1.
float srgbEncode(float c) {
  if (!(c > 0.0)) return 0.0;
  if (c >= 1.0) return 1.0;
  return c <= 0.0031308 ? 12.92 * c : 1.055 * pow(c, 1.0 / 2.4) - 0.055;
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
  fragColor = vec4(srgbEncode(colour.r), srgbEncode(colour.g), srgbEncode(colour.b), 1.0);
}
