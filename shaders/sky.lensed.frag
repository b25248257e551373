// sky.lensed.frag — the lensed sky as the camera sees it: stars, Milky Way, uniform sky, horizon and far-side
// grids, optional celestial grid ("where the light comes from"), exposure, tone mapping, sRGB encoding.
// Mirrors: lib/render/shade.ts Shader.shade and lib/render/renderRows.ts renderBandLinear (+ toneMap.ts),
// with lib/webgl/sourceDirections.ts compositeCelestialGrid for the celestial grid.
//
// Uniforms (besides those of sky.common.glsl):
//   uSupersampling      int     samples per axis (1..4), box filter
//   uColourShift        bool    shift colours by g (physics.md section 6)
//   uBeaming            bool    scale brightness by g^4
//   uExposureScale      float   display units per (mag-0 star flux per steradian): 2^ev / 1000
//   uToneMap            int     0 none, 1 Reinhard (luminance), 2 exponential 1 - exp(-c)
//   uColourTable        sampler2D RGBA float, one row: unit-luminance linear sRGB of a blackbody against ln T
//   uColourLogMinK      float   ln T of the first entry (ln K);  uColourLogSpan float ln T span of the table
//   uStarsEnabled       bool;   uStarGain float;  uPsfSigmaPx float (pixels);  uSourceSizeRad float (radians)
//   uStarPosFlux        sampler2D RGBA float: hole-frame unit vector and flux (mag-0 units) per star, 1024 wide
//   uStarLogT           sampler2D R float: ln(T / 1 K) per star, 1024 wide
//   uCellStart          sampler2D R float: first star of each cell of lib/render's star grid, 1024 wide
//   uMaxRun             int     most stars in a z-run of three cells (loop bound)
//   uDiffuseEnabled     bool;   uDiffuse sampler2D RGBA float mip-mapped equirect (Milky Way per sr,
//                               star flux per sr, star flux x K per sr); uDiffuseTexelRad float (radians)
//   uMilkyWayEnabled    bool;   uMilkyWayGain float;  uMilkyWayLogT float (ln K)
//   uUniformBrightness  float   mag-0 fluxes per steradian (0: none);  uUniformTemperatureK float (K)
//   uHorizonGrid, uFarSideGrid  vec4 (enabled 0/1, spacing rad, line width px, dashed 0/1)
//   uHorizonColour, uFarSideColour, uCelestialColour  vec3 display-linear colours
//   uCelestialGrid      vec4    like the grids; enabled in the "where the light comes from" mode
precision highp float;
precision highp int;
precision highp sampler2D;

#include "sky.common.glsl"

#define STAR_CELL_SIZE 0.02
#define STAR_CELLS 101
#define MAX_STARS_PER_RUN 512

uniform int uSupersampling;
uniform bool uColourShift;
uniform bool uBeaming;
uniform float uExposureScale;
uniform int uToneMap;
uniform highp sampler2D uColourTable;
uniform float uColourLogMinK;
uniform float uColourLogSpan;
uniform bool uStarsEnabled;
uniform float uStarGain;
uniform float uPsfSigmaPx;
uniform float uSourceSizeRad;
uniform highp sampler2D uStarPosFlux;
uniform highp sampler2D uStarLogT;
uniform highp sampler2D uCellStart;
uniform int uMaxRun;
uniform bool uDiffuseEnabled;
uniform highp sampler2D uDiffuse;
uniform float uDiffuseTexelRad;
uniform bool uMilkyWayEnabled;
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
      int end = int(fetchR(uCellStart, base + hi.z + 1) + 0.5);
      for (int k = 0; k < MAX_STARS_PER_RUN; k++) {
        int s = first + k;
        if (s >= end || k >= uMaxRun) break;
        vec4 star = texelFetch(uStarPosFlux, ivec2(s % 1024, s / 1024), 0);
        vec3 e = star.xyz - d;
        float dist2 = dot(e, e);
        if (dist2 >= reach2) continue;
        float w = norm * star.w * exp(-dist2 * inv2s2);
        sum += w * blackbodyLog(fetchR(uStarLogT, s) + logShift);
      }
    }
  }
  return sum;
}

// Radiance (mag-0 fluxes per sr, linear sRGB) and overlay (premultiplied colour, coverage) of one sample.
void shadeSample(vec2 p, float samples, out vec3 radiance, out vec4 overlay, out float celestial) {
  radiance = vec3(0.0);
  overlay = vec4(0.0);
  celestial = 0.0;
  Trace tr = traceFramePoint(p);
  if (tr.fate < 0.0) return;
  if (tr.fate > 0.5) {
    bool horizon = tr.fate < 1.5;
    vec4 grid = horizon ? uHorizonGrid : uFarSideGrid;
    if (grid.x > 0.5) {
      float cover = gridCoverage(tr, grid.y, grid.z, 1.0 / samples, grid.w > 0.5);
      overlay = vec4((horizon ? uHorizonColour : uFarSideColour) * cover, cover);
    }
    return;
  }
  if (uCelestialGrid.x > 0.5) celestial = gridCoverage(tr, uCelestialGrid.y, uCelestialGrid.z, 1.0 / samples, false);
  float shift = uColourShift ? tr.g : 1.0;
  float logShift = shift == 1.0 ? 0.0 : log(shift);
  float g2 = tr.g * tr.g;
  float beam = uBeaming ? g2 * g2 : 1.0;
  float sampleFoot = tr.footRad / samples;
  float starSigma = max(uPsfSigmaPx * tr.footRad, uSourceSizeRad);
  float mapWeight = 0.0;
  if (uStarsEnabled) {
    float sigmaMax = STAR_CELL_SIZE / 3.0;
    mapWeight = smoothstep(0.5 * sigmaMax, sigmaMax, starSigma);
    if (mapWeight < 1.0) radiance += starLight(tr.dir, starSigma, 1.0 - mapWeight, logShift);
  }
  if (uDiffuseEnabled) {
    float u = atan(tr.dir.y, tr.dir.x) / (2.0 * PI);
    u -= floor(u);
    float v = 0.5 - atan(tr.dir.z, length(tr.dir.xy)) / PI;
    float ratio = sampleFoot / uDiffuseTexelRad;
    float lod = ratio > 1.0 ? log2(ratio) : 0.0;
    vec4 s = textureLod(uDiffuse, vec2(u, v), lod);
    float mw = s.r * uMilkyWayGain;
    if (mw > 0.0 && uMilkyWayEnabled) radiance += mw * blackbodyLog(uMilkyWayLogT + logShift);
    if (mapWeight > 0.0 && s.g > 0.0) radiance += s.g * uStarGain * mapWeight * blackbodyLog(log(s.b / s.g * shift));
  }
  if (uUniformBrightness > 0.0) radiance += uUniformBrightness * blackbodyLog(log(uUniformTemperatureK * shift));
  radiance *= beam;
}

float srgbEncode(float c) {
  if (!(c > 0.0)) return 0.0;
  if (c >= 1.0) return 1.0;
  return c <= 0.0031308 ? 12.92 * c : 1.055 * pow(c, 1.0 / 2.4) - 0.055;
}

void main() {
  vec2 pixel = vec2(floor(gl_FragCoord.x), uFrameSizePx.y - 1.0 - floor(gl_FragCoord.y));
  float n = float(uSupersampling);
  vec3 radiance = vec3(0.0);
  vec4 overlay = vec4(0.0);
  float celestial = 0.0;
  if (uSupersampling == 1) {
    shadeSample(pixel + 0.5, 1.0, radiance, overlay, celestial);
  } else for (int sy = 0; sy < 4; sy++) {
    if (sy >= uSupersampling) break;
    for (int sx = 0; sx < 4; sx++) {
      if (sx >= uSupersampling) break;
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
  vec3 colour = radiance * inv * uExposureScale;
  if (uToneMap == 1) {
    colour *= 1.0 / (1.0 + dot(colour, vec3(0.2126, 0.7152, 0.0722)));
  } else if (uToneMap == 2) {
    colour = 1.0 - exp(-colour);
  }
  float a = overlay.a * inv;
  if (a > 0.0) colour = colour * (1.0 - a) + overlay.rgb * inv;
  float ca = celestial * inv;
  if (ca > 0.0) colour = colour * (1.0 - ca) + uCelestialColour * ca;
  fragColor = vec4(srgbEncode(colour.r), srgbEncode(colour.g), srgbEncode(colour.b), 1.0);
}
