// sky.common.glsl — shared per-pixel geometry of the sky shaders: pixel -> view direction -> camera
// frame -> (boost) -> look angle psi -> ray table -> direction on the sky or on the horizon.
// Included by sky.lensed.frag, sky.directions.frag and sky.geometry.frag (scripts/build-shaders.mjs inlines it).
//
// Compile-time switches (#define; each combination is its own program, chosen per frame by
// components/sky-view/gpu/gpu-sky-renderer.ts from lib/webgl/shaderVariant.ts, so no pixel pays for code
// of a setting that is off):
//   PROJECTION        0 flat, 1 dome master, 2 equirectangular, 3 cube face (lib/webgl PROJECTION_CODES)
//   LENSING           1 lensed; 0 plain sky remap (phi = psi, g = 1)
//   BOOST             1 when the camera moves relative to its radial reference observer (uBoostVelocity != 0)
//   DASHED_GRIDS      1 when a grid drawn in this frame is dashed (gridCoverage's dash code)
//
// Uniforms (units):
//   uFrameSizePx      vec2   frame width, height in pixels
//   uFocalPx          float  flat / cube face focal length, pixels
//   uRadPerPx         float  dome: radians per pixel from the centre
//   uHalfApertureRad  float  dome: half aperture, radians
//   uCubeFace         mat3   cube face: columns right, top, centre in the front face's view space
//   uViewToCamera     mat3   view (x right, y up, z centre) -> camera frame (e1 outward radial, e2, e3)
//   uCameraToHole     mat3   camera frame -> hole frame (J2000 equatorial axes)
//   uBoostVelocity    vec3   camera velocity relative to the radial reference observer, camera frame, units of c
//   uEps, uUr         float  reference observer's -u_t and u^r (geometric units)
//   uSegHi[j]         vec4   upper psi bounds (rad) of segments 4j..4j+3; 1e30 for the last segment and unused ones
//   uSegA[i]          vec4   (map 0 uniform / 1 log from left / 2 log to right, psi_hi rad, anchor rad, fate)
//   uSegB[i]          vec4   (t0, dt, node offset, node count) of the sampling variable t (psi or ln|psi - anchor|)
//   uRayTable         sampler2D RGBA float: (phi rad, dphi/dt) of node i and of node i + 1 in texel i,
//                     ARRAY_TEXTURE_WIDTH texels per row (lib/webgl/rayTableTexture.ts packRayTable)
//
// Mirrors: lib/render/projections.ts createProjector (pixelToView), lib/render/orientation.ts,
// lib/relativity/boost.ts boostLookDirection, lib/relativity/rayTable.ts RayTable.lookup,
// lib/render/shade.ts Shader.shade (direction, footprint, derivatives), lib/render/grids.ts drawLensedGrid,
// lib/webgl/sourceDirections.ts.

#define MAX_SEGMENTS 12
// rows of the textures holding 1-D arrays (lib/webgl/arrayTexture.ts ARRAY_TEXTURE_WIDTH = 2^10)
#define ARRAY_TEXTURE_WIDTH_LOG2 10
#define PI 3.141592653589793

// Software WebGL (SwiftShader) runs every branch of a 2 x 2 pixel quad under a lane mask and every loop for the
// longest lane, so code that is compiled in costs every pixel, taken or not: settings that are off are
// compiled out (the #if switches below), and paths share work rather than branch around it.

#ifndef PROJECTION
#define PROJECTION 0
#endif
#ifndef LENSING
#define LENSING 1
#endif
#ifndef BOOST
#define BOOST 0
#endif
#ifndef DASHED_GRIDS
#define DASHED_GRIDS 1
#endif

uniform vec2 uFrameSizePx;
uniform float uFocalPx;
uniform float uRadPerPx;
uniform float uHalfApertureRad;
uniform mat3 uCubeFace;
uniform mat3 uViewToCamera;
uniform mat3 uCameraToHole;
uniform vec3 uBoostVelocity;
uniform float uEps;
uniform float uUr;
uniform vec4 uSegHi[MAX_SEGMENTS / 4];
uniform vec4 uSegA[MAX_SEGMENTS];
uniform vec4 uSegB[MAX_SEGMENTS];
uniform highp sampler2D uRayTable;

// Result of tracing one frame point.
struct Trace {
  vec3 dir;       // unit vector, hole frame: sky direction or point on r = 2M
  float fate;     // 0 sky, 1 horizon, 2 far side, -1 outside the image
  float g;        // observed / emitted frequency (reference observer g times the boost's Doppler factor)
  float footRad;  // the sample's footprint on the sky, radians
  vec3 dA;        // change of dir per output pixel along the look angle psi (hole frame)
  vec3 dB;        // change of dir per output pixel across it
};

// Frame point (px from the left, py from the top) -> unit view direction; returns the pixel's angular size or -1.
float pixelToView(vec2 p, out vec3 view) {
  vec2 size = uFrameSizePx;
#if PROJECTION == 1
  vec2 d = vec2(p.x - 0.5 * size.x, 0.5 * size.x - p.y);
  float rho = length(d);
  float theta = rho * uRadPerPx;
  float s = rho > 0.0 ? sin(theta) / rho : 0.0;
  view = vec3(d * s, cos(theta));
  return theta > uHalfApertureRad ? -1.0 : uRadPerPx;
#elif PROJECTION == 2
  float lon = (p.x / size.x - 0.5) * 2.0 * PI;
  float lat = (0.5 - p.y / size.y) * PI;
  float c = cos(lat);
  view = vec3(c * sin(lon), sin(lat), c * cos(lon));
  return max(2.0 * PI * c / size.x, PI / size.y);
#else
  float x = (p.x - 0.5 * size.x) / uFocalPx;
  float y = (0.5 * size.y - p.y) / uFocalPx;
  float inv = inversesqrt(x * x + y * y + 1.0);
  view = vec3(x * inv, y * inv, inv);
#if PROJECTION == 3
  view = uCubeFace * view;
#endif
  return inv / uFocalPx;
#endif
}

// Aberration into the reference frame (Einstein 1905); returns the Doppler factor E_camera / E_reference.
float boostLook(inout vec3 n, vec3 v) {
  float v2 = dot(v, v);
  if (v2 == 0.0) return 1.0;
  float gamma = inversesqrt(1.0 - v2);
  float vDotK = -dot(v, n);
  float energy = gamma * (1.0 + vDotK);
  float coefficient = (gamma - 1.0) * vDotK / v2 + gamma;
  vec3 k = -n + coefficient * v;
  n = -k / energy;
  return 1.0 / energy;
}

// element i of a 1-D array laid out in texture rows (shift and mask: software GPUs divide integers lane by lane)
ivec2 arrayTexel(int i) {
  return ivec2(i & ((1 << ARRAY_TEXTURE_WIDTH_LOG2) - 1), i >> ARRAY_TEXTURE_WIDTH_LOG2);
}

// nodes i and i + 1 of the table (one fetch, as each texel carries the next node too)
vec4 rayNodes(int i) {
  return texelFetch(uRayTable, arrayTexel(i), 0);
}

// RayTable.lookup: fate, phi and dphi/dpsi at look angle psi (cubic Hermite in the segment's variable t).
// Written without loops or branches (one log, one texel fetch), see the note on SwiftShader above.
void lookupRayTable(float psi, out float fate, out float phi, out float dPhiDPsi) {
  // segment: how many upper bounds lie below psi (the bounds rise; the last segment's and unused ones are 1e30)
  vec4 p4 = vec4(psi);
  int seg = int(dot(vec4(greaterThan(p4, uSegHi[0])) + vec4(greaterThan(p4, uSegHi[1])) + vec4(greaterThan(p4, uSegHi[2])), vec4(1.0)));
  vec4 a = uSegA[seg];
  vec4 b = uSegB[seg];
  float t0 = b.x;
  float dt = b.y;
  int offset = int(b.z + 0.5);
  int count = int(b.w + 0.5);
  bool uniformMap = a.x < 0.5;
  float side = a.x < 1.5 ? 1.0 : -1.0;
  float d = max(side * (psi - a.z), 1e-30);
  float t = uniformMap ? psi : log(d);
  float dtDpsi = uniformMap ? 1.0 : side / d;
  float x = (t - t0) / dt;
  int i = clamp(int(floor(x)), 0, count - 2);
  vec4 nodes = rayNodes(offset + i);
  vec2 n0 = nodes.xy;
  vec2 n1 = nodes.zw;
  float dPhiDt;
  if (x <= 0.0) {
    // beyond the closest node to a crossing phi is linear in ln(distance) (Bozza 2002)
    phi = n0.x + n0.y * (t - t0);
    dPhiDt = n0.y;
  } else {
    float s = x - float(i);
    float m0 = n0.y * dt;
    float m1 = n1.y * dt;
    float s2 = s * s;
    float s3 = s2 * s;
    phi = (2.0 * s3 - 3.0 * s2 + 1.0) * n0.x + (s3 - 2.0 * s2 + s) * m0 + (-2.0 * s3 + 3.0 * s2) * n1.x + (s3 - s2) * m1;
    dPhiDt = ((6.0 * s2 - 6.0 * s) * n0.x + (3.0 * s2 - 4.0 * s + 1.0) * m0 + (-6.0 * s2 + 6.0 * s) * n1.x + (3.0 * s2 - 2.0 * s) * m1) / dt;
  }
  fate = a.w;
  dPhiDPsi = dPhiDt * dtDpsi;
}

// Where the light of frame point p (pixels from the top-left) comes from.
// Frame point p -> look direction in the reference frame (camera frame axes, after the boost); pixelRad: the
// pixel's angular size (< 0 outside a dome master's circle); doppler: E_camera / E_reference.
vec3 referenceLook(vec2 p, out float pixelRad, out float doppler) {
  vec3 view;
  pixelRad = pixelToView(p, view);
  vec3 n = uViewToCamera * view;
  doppler = 1.0;
#if LENSING && BOOST
  doppler = boostLook(n, uBoostVelocity);
#endif
  return n;
}

// Observed / emitted frequency of the light arriving along reference-frame look direction n: the reference
// observer's shift times the boost's Doppler factor (1 without lensing).
float frequencyShift(vec3 n, float doppler) {
  float g = 1.0;
#if LENSING
  g = 1.0 / abs(uEps - n.x * uUr);
#endif
  return g * doppler;
}

Trace traceFramePoint(vec2 p) {
  Trace tr;
  float pixelRad;
  float doppler;
  vec3 n = referenceLook(p, pixelRad, doppler);
#if PROJECTION == 1
  if (pixelRad < 0.0) {
    tr.dir = vec3(0.0);
    tr.fate = -1.0;
    tr.g = 1.0;
    tr.footRad = 0.0;
    tr.dA = vec3(0.0);
    tr.dB = vec3(0.0);
    return tr;
  }
#endif
  float sinPsi = length(n.yz);
  vec2 tdir = vec2(1.0, 0.0);
  if (sinPsi > 1e-15) tdir = n.yz / sinPsi; else sinPsi = 0.0;
  float psi = atan(sinPsi, n.x);
  float fate = 0.0;
  float phi = psi;
  float dPhiDPsi = 1.0;
#if LENSING
  lookupRayTable(psi, fate, phi, dPhiDPsi);
#endif
  tr.g = frequencyShift(n, doppler);
  float cp = cos(phi);
  float sp = sin(phi);
  // e1 and the transverse look direction t in the hole frame; dir = cos(phi) e1 + sin(phi) t
  vec3 e1 = uCameraToHole[0];
  vec3 t = uCameraToHole * vec3(0.0, tdir);
  // normalised: software GPUs (SwiftShader) give sin^2 + cos^2 = 1 only to ~1e-4
  tr.dir = normalize(cp * e1 + sp * t);
  tr.fate = fate;
  // aberration is conformal with scale D: a camera pixel spans D times its angle in the reference frame
  float pixelRefRad = pixelRad * doppler;
  float radialRate = dPhiDPsi;
  float tangentialRate = sinPsi > 1e-9 ? sp / sinPsi : radialRate;
  tr.footRad = pixelRefRad * max(abs(radialRate), abs(tangentialRate));
  tr.dA = radialRate * pixelRefRad * (cp * t - sp * e1);
  tr.dB = tangentialRate * pixelRefRad * (uCameraToHole * vec3(0.0, -tdir.y, tdir.x));
  return tr;
}

// lib/render/grids.ts lineCoverage: box-filtered coverage of the nearest line of one family, faded where lines crowd.
float lineCoverage(float offsetRad, float ratePerPx, float spacingRad, float widthPx, float filterPx) {
  if (!(ratePerPx > 0.0) || isinf(ratePerPx)) return 0.0;
  float spacingPx = spacingRad / ratePerPx;
  float crowd = 1.0 + widthPx;
  float fade = (spacingPx - crowd) / crowd;
  if (fade <= 0.0) return 0.0;
  float distPx = offsetRad / ratePerPx;
  float half_ = 0.5 * widthPx;
  float hi = min(distPx + 0.5 * filterPx, half_);
  float lo = max(distPx - 0.5 * filterPx, -half_);
  float cover = hi > lo ? (hi - lo) / filterPx : 0.0;
  return fade >= 1.0 ? cover : cover * fade * fade * (3.0 - 2.0 * fade);
}

float onLength(float x) {
  float whole = floor(x);
  float rest = x - whole;
  return 0.5 * whole + (rest < 0.5 ? rest : 0.5);
}

// lib/render/grids.ts squareWaveCoverage: mean of a unit square wave over [x - h, x + h] (periods).
float squareWaveCoverage(float x, float h) {
  if (h >= 1.0) return 0.5;
  if (h <= 0.0) return fract(x) < 0.5 ? 1.0 : 0.0;
  return (onLength(x + h) - onLength(x - h)) / (2.0 * h);
}

// Latitude (atan of z over |xy| rather than asin(z): SwiftShader's asin is good to only ~1e-4 rad) and
// longitude of a unit vector, radians; shared by the grids and the sky-map lookup.
vec2 latLon(vec3 d) {
  return vec2(atan(d.z, length(d.xy)), atan(d.y, d.x));
}

// lib/render/grids.ts drawLensedGrid: latitude/longitude grid line coverage at tr.dir (latitude and longitude
// ll from latLon), line widths measured on screen through the end point's derivatives per output pixel (tr.dA, tr.dB).
float gridCoverage(Trace tr, vec2 ll, float spacing, float lineWidthPx, float filterPx, bool dashed) {
  vec3 d = tr.dir;
  float cosLat = max(length(d.xy), 1e-12);
  float lat = ll.x;
  float lon = ll.y;
  float latRate = length(vec2(tr.dA.z, tr.dB.z)) / cosLat;
  float lonA = (d.x * tr.dA.y - d.y * tr.dA.x) / (cosLat * cosLat);
  float lonB = (d.x * tr.dB.y - d.y * tr.dB.x) / (cosLat * cosLat);
  float lonRate = length(vec2(lonA, lonB));
  float parallel = lineCoverage(abs(lat - floor(lat / spacing + 0.5) * spacing), latRate, spacing, lineWidthPx, filterPx);
  float meridian = lineCoverage(abs(lon - floor(lon / spacing + 0.5) * spacing), lonRate, spacing, lineWidthPx, filterPx);
#if DASHED_GRIDS
  if (dashed) {
    float dash = spacing / 4.0;
    if (parallel > 0.0) parallel *= squareWaveCoverage(lon / dash, 0.5 * filterPx * lonRate / dash);
    if (meridian > 0.0) meridian *= squareWaveCoverage(lat / dash, 0.5 * filterPx * latRate / dash);
  }
#endif
  return max(parallel, meridian);
}
