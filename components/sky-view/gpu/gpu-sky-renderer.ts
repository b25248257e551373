/**
 * The WebGL twin of lib/render: the frame drawn with shaders/sky.lensed.frag
 * (the picture) or shaders/sky.directions.frag (the "where the light comes
 * from" debug target, float RGBA). Per frame the CPU side (lib/webgl
 * prepareGpuFrame) builds the ray table and constants; this class moves them
 * into uniforms and textures and draws. Where part of the frame's rays end on
 * r = 2M (or outside a dome master's circle), the picture is drawn as screen
 * tiles sorted by lib/webgl/fateTiles.ts, each class with a program that
 * leaves out the work its pixels cannot need. No React here, so the benchmark
 * page uses it too.
 */
import * as THREE from 'three';
import type { FrameRequest } from '@/lib/render/schema';
import { prepareGpuFrame, type GpuFrame, type GridUniforms } from '@/lib/webgl/gpuFrame';
import { MAX_RAY_TABLE_SEGMENTS } from '@/lib/webgl/rayTableTexture';
import { CELESTIAL_GRID } from '@/lib/webgl/sourceDirections';
import { STAR_TILE_LEVELS } from '@/lib/webgl/starTiles';
import { SKY_DIRECTIONS_FRAG, SKY_FULLSCREEN_VERT, SKY_GEOMETRY_FRAG, SKY_LENSED_FRAG } from '@/lib/webgl/shaderSources';
import { directionsShaderDefines, fateTilesPay, lensedShaderDefines, shaderVariantKey, tileShaderDefines, type ShaderDefines } from '@/lib/webgl/shaderVariant';
import { classifyFateTiles, GEOMETRY_STEP_PX, geometryGridSize, interiorSkyTiles, tileTriangles, TILE_MIXED, TILE_SKY, TILE_SKY_INTERIOR, TILE_SURFACE } from '@/lib/webgl/fateTiles';
import { createProjector } from '@/lib/render/projections';
import { MILKY_WAY_TEMPERATURE_K } from '@/lib/render/milkyWay';
import { hexToLinear } from '@/lib/render/shade';
import { colourTexture, dataTexture, diffuseTexture, RayTableTexture, starTextures, uintCubeTexture, type StarGpuTextures } from './sky-textures';
import type { GpuSkyData } from './sky-data';

/** Display mode: the picture, or the picture with the celestial grid drawn through the lensing. */
export type SkyViewMode = 'image' | 'sources';

const ARCSEC_RAD = Math.PI / 648000;

function mat3(m: Float64Array): THREE.Matrix3 {
  return new THREE.Matrix3().set(m[0], m[1], m[2], m[3], m[4], m[5], m[6], m[7], m[8]);
}

function gridVec(grid: GridUniforms): THREE.Vector4 {
  return new THREE.Vector4(grid.enabled ? 1 : 0, grid.spacingRad, grid.lineWidthPx, grid.dashed ? 1 : 0);
}

function colourVec(c: ArrayLike<number>): THREE.Vector3 {
  return new THREE.Vector3(c[0], c[1], c[2]);
}

/** A mesh of screen tiles of one class (clip-space triangles), refilled per frame. */
class TileMesh {
  readonly mesh: THREE.Mesh;
  private positions = new Float32Array(0);
  private vertices = 0;
  private readonly geometry = new THREE.BufferGeometry();

  constructor(material: THREE.Material) {
    this.mesh = new THREE.Mesh(this.geometry, material);
    this.mesh.frustumCulled = false;
    this.mesh.visible = false;
  }

  /** Refill with the tiles of one class; floats: the capacity needed (18 per tile of the frame). */
  fill(write: (out: Float32Array) => number, floats: number): void {
    if (this.positions.length < floats) {
      this.positions = new Float32Array(floats);
      this.geometry.setAttribute('position', new THREE.BufferAttribute(this.positions, 3).setUsage(THREE.DynamicDrawUsage));
    }
    this.vertices = write(this.positions);
    const attribute = this.geometry.getAttribute('position') as THREE.BufferAttribute;
    attribute.clearUpdateRanges();
    attribute.addUpdateRange(0, 3 * this.vertices);
    attribute.needsUpdate = true;
    this.geometry.setDrawRange(0, this.vertices);
  }

  /** Draw with the next render (when it has tiles) or not. */
  setShown(shown: boolean): void {
    this.mesh.visible = shown && this.vertices > 0;
  }

  dispose(): void {
    this.geometry.dispose();
  }
}

/** Draws frames of a request on a three.js renderer. */
export class GpuSkyRenderer {
  private readonly scene = new THREE.Scene();
  private readonly camera = new THREE.OrthographicCamera(-1, 1, 1, -1, 0, 1);
  private readonly mesh: THREE.Mesh;
  /** compiled programs by shader variant (lib/webgl/shaderVariant.ts) */
  private readonly programs = new Map<string, THREE.RawShaderMaterial>();
  /** the programs of the last prepared frame */
  private lensed: THREE.RawShaderMaterial;
  private directions: THREE.RawShaderMaterial;
  /** the frame's tiles by class (sky, interior sky, surface, mixed), drawn instead of the full-frame quad when `tiled` */
  private readonly tiles: Record<'sky' | 'interior' | 'surface' | 'mixed', TileMesh>;
  private tiled = false;
  /** interior sky tiles take their geometry from the grid pass (picture mode, float targets) */
  private interpolating = false;
  /** the grid pass: traced points GEOMETRY_STEP_PX apart, into a float target read with bilinear filtering */
  private readonly geometryScene = new THREE.Scene();
  private readonly geometryMesh: THREE.Mesh;
  private readonly geometryTarget: THREE.WebGLRenderTarget | null;
  /** inputs of the last tile sort */
  private tilesKey = '';
  private readonly uniforms: Record<string, THREE.IUniform>;
  private readonly rayTable = new RayTableTexture();
  private readonly placeholder = dataTexture({ width: 1, height: 1, channels: 4, data: new Float32Array(4) });
  /** stands in for the integer tile cube (an integer cube sampler must see an integer cube map): empty lists */
  private readonly tilePlaceholder = uintCubeTexture(Array.from({ length: 6 }, () => ({ width: 1, height: 1, channels: 4, data: new Uint32Array(4) })));
  private sky: { data: GpuSkyData; stars: StarGpuTextures | null; diffuse: THREE.DataTexture | null; colour: THREE.DataTexture } | null = null;
  private last: GpuFrame | undefined;
  private lastKey = '';

  constructor(private readonly gl: THREE.WebGLRenderer) {
    const segA = new Float32Array(MAX_RAY_TABLE_SEGMENTS * 4);
    const segB = new Float32Array(MAX_RAY_TABLE_SEGMENTS * 4);
    this.uniforms = {
      uFrameSizePx: { value: new THREE.Vector2(1, 1) },
      uFocalPx: { value: 1 },
      uRadPerPx: { value: 0 },
      uHalfApertureRad: { value: 0 },
      uCubeFace: { value: new THREE.Matrix3() },
      uViewToCamera: { value: new THREE.Matrix3() },
      uCameraToHole: { value: new THREE.Matrix3() },
      uBoostVelocity: { value: new THREE.Vector3() },
      uEps: { value: 1 },
      uUr: { value: 0 },
      uSegHi: { value: new Float32Array(MAX_RAY_TABLE_SEGMENTS) },
      uSegA: { value: segA },
      uSegB: { value: segB },
      uRayTable: { value: this.rayTable.texture },
      uColourShift: { value: true },
      uBeaming: { value: true },
      uExposureScale: { value: 1e-3 },
      uColourTable: { value: this.placeholder },
      uColourLogMinK: { value: 0 },
      uColourEntries: { value: 2 },
      uColourIndexPerLog: { value: 1 },
      uStarGain: { value: 1 },
      uPsfSigmaPx: { value: 0.8 },
      uSourceSizeRad: { value: 5 * ARCSEC_RAD },
      uStarTiles: { value: this.tilePlaceholder },
      uStarTileEntries: { value: this.placeholder },
      uStarTileCountBits: { value: 1 },
      uStarTileMargins: { value: new THREE.Vector4().fromArray(STAR_TILE_LEVELS.map((level) => level.marginChord)) },
      uDiffuse: { value: this.placeholder },
      uDiffuseTexelRad: { value: Math.PI / 512 },
      uMilkyWayGain: { value: 1 },
      uMilkyWayLogT: { value: Math.log(MILKY_WAY_TEMPERATURE_K) },
      uUniformBrightness: { value: 0 },
      uUniformTemperatureK: { value: 6500 },
      uHorizonGrid: { value: new THREE.Vector4() },
      uFarSideGrid: { value: new THREE.Vector4() },
      uCelestialGrid: { value: new THREE.Vector4() },
      uHorizonColour: { value: new THREE.Vector3() },
      uFarSideColour: { value: new THREE.Vector3() },
      uCelestialColour: { value: colourVec(hexToLinear(CELESTIAL_GRID.colour)) },
      uGeometry: { value: this.placeholder },
      uGeometryStep: { value: GEOMETRY_STEP_PX },
      uGeometrySize: { value: new THREE.Vector2(1, 1) },
    };
    // placeholders until the first prepare() picks the variants of its frame
    this.lensed = this.program(SKY_LENSED_FRAG, {});
    this.directions = this.program(SKY_DIRECTIONS_FRAG, {});
    this.mesh = new THREE.Mesh(new THREE.PlaneGeometry(2, 2), this.lensed);
    this.mesh.frustumCulled = false;
    this.scene.add(this.mesh);
    this.tiles = { sky: new TileMesh(this.lensed), interior: new TileMesh(this.lensed), surface: new TileMesh(this.lensed), mixed: new TileMesh(this.lensed) };
    for (const tile of Object.values(this.tiles)) this.scene.add(tile.mesh);
    this.geometryMesh = new THREE.Mesh(new THREE.PlaneGeometry(2, 2), this.directions);
    this.geometryMesh.frustumCulled = false;
    this.geometryScene.add(this.geometryMesh);
    // rendering to float targets needs EXT_color_buffer_float; without it every pixel traces its own ray
    this.geometryTarget = gl.extensions.has('EXT_color_buffer_float')
      ? new THREE.WebGLRenderTarget(1, 1, { type: THREE.FloatType, format: THREE.RGBAFormat, depthBuffer: false, minFilter: THREE.LinearFilter, magFilter: THREE.LinearFilter })
      : null;
  }

  /** The compiled program of a fragment shader with a set of switches (cached; three.js compiles on first use). */
  private program(fragmentShader: string, defines: ShaderDefines): THREE.RawShaderMaterial {
    const name = fragmentShader === SKY_LENSED_FRAG ? 'lensed' : fragmentShader === SKY_GEOMETRY_FRAG ? 'geometry' : 'directions';
    const key = `${name}|${shaderVariantKey(defines)}`;
    let material = this.programs.get(key);
    if (!material) {
      material = new THREE.RawShaderMaterial({
        uniforms: this.uniforms,
        vertexShader: SKY_FULLSCREEN_VERT,
        fragmentShader,
        defines,
        glslVersion: THREE.GLSL3,
        depthTest: false,
        depthWrite: false,
      });
      this.programs.set(key, material);
    }
    return material;
  }

  /** Hand over the sky data (stars, diffuse map, colour table); replaces earlier data. */
  setSky(data: GpuSkyData): void {
    if (this.sky?.data === data) return;
    this.disposeSky();
    this.sky = {
      data,
      stars: data.stars ? starTextures(data.stars) : null,
      diffuse: data.diffuse ? diffuseTexture(data.diffuse) : null,
      colour: colourTexture(data.colour),
    };
    const u = this.uniforms;
    u.uColourTable.value = this.sky.colour;
    u.uColourLogMinK.value = data.colour.logMinK;
    u.uColourEntries.value = data.colour.image.width;
    u.uColourIndexPerLog.value = (data.colour.image.width - 1) / data.colour.logSpan;
    u.uStarTiles.value = this.sky.stars?.tiles ?? this.tilePlaceholder;
    u.uStarTileEntries.value = this.sky.stars?.tileEntries ?? this.placeholder;
    u.uStarTileCountBits.value = data.stars?.tiles.countBits ?? 1;
    u.uDiffuse.value = this.sky.diffuse ?? this.placeholder;
    u.uDiffuseTexelRad.value = data.diffuse?.texelRad ?? Math.PI / 512;
    this.lastKey = '';
  }

  /**
   * Update the uniforms for a request (the ray table is rebuilt only when the camera state changes).
   * @returns milliseconds spent building the ray table (0 when reused)
   */
  prepare(req: FrameRequest, mode: SkyViewMode): number {
    const key = JSON.stringify([req.camera.state, req.effects.lensing]);
    let buildMs = 0;
    let fresh = false;
    if (key !== this.lastKey || !this.last) {
      this.last = prepareGpuFrame(req, this.last);
      buildMs = this.last.tableBuildMs;
      this.lastKey = key;
      fresh = true;
    } else {
      // camera state unchanged: keep the table, refresh the rest
      const table = this.last.table;
      this.last = { ...prepareGpuFrameWithoutTable(req), table, tableBuildMs: 0 };
    }
    this.applyFrame(this.last, req, mode, fresh);
    return buildMs;
  }

  private applyFrame(frame: GpuFrame, req: FrameRequest, mode: SkyViewMode, freshTable: boolean): void {
    const u = this.uniforms;
    const p = frame.projection;
    (u.uFrameSizePx.value as THREE.Vector2).set(frame.width, frame.height);
    u.uFocalPx.value = p.focalPx;
    u.uRadPerPx.value = p.radPerPx;
    u.uHalfApertureRad.value = p.halfApertureRad;
    u.uCubeFace.value = mat3(p.cubeFace);
    u.uViewToCamera.value = mat3(frame.viewToCamera);
    u.uCameraToHole.value = mat3(frame.cameraToHole);
    (u.uBoostVelocity.value as THREE.Vector3).set(frame.boostVelocity[0], frame.boostVelocity[1], frame.boostVelocity[2]);
    if (frame.table) {
      u.uEps.value = frame.table.eps;
      u.uUr.value = frame.table.ur;
      (u.uSegHi.value as Float32Array).set(frame.table.segmentHi);
      (u.uSegA.value as Float32Array).set(frame.table.segmentA);
      (u.uSegB.value as Float32Array).set(frame.table.segmentB);
      if (freshTable) {
        this.rayTable.update(frame.table);
        u.uRayTable.value = this.rayTable.texture;
      }
    }
    u.uColourShift.value = frame.colourShift;
    u.uBeaming.value = frame.beaming;
    u.uExposureScale.value = frame.exposureScale;
    const stars = req.sky.stars;
    u.uStarGain.value = stars.gain;
    u.uPsfSigmaPx.value = stars.psfSigmaPx;
    u.uSourceSizeRad.value = stars.sourceSizeArcsec * ARCSEC_RAD;
    u.uMilkyWayGain.value = req.sky.milkyWay.gain;
    u.uUniformBrightness.value = req.sky.uniform?.brightness ?? 0;
    u.uUniformTemperatureK.value = req.sky.uniform?.temperatureK ?? 6500;
    u.uHorizonGrid.value = gridVec(frame.horizonGrid);
    u.uFarSideGrid.value = gridVec(frame.farSideGrid);
    u.uHorizonColour.value = colourVec(frame.horizonGrid.colour);
    u.uFarSideColour.value = colourVec(frame.farSideGrid.colour);
    u.uCelestialGrid.value = new THREE.Vector4(mode === 'sources' ? 1 : 0, (CELESTIAL_GRID.spacingDeg * Math.PI) / 180, CELESTIAL_GRID.lineWidthPx, 0);
    const defines = lensedShaderDefines(frame, {
      sourcesMode: mode === 'sources',
      stars: stars.enabled && !!this.sky?.stars,
      diffuse: !!this.sky?.diffuse,
      milkyWay: req.sky.milkyWay.enabled && !!this.sky?.data.hasMilkyWay,
      uniformBrightness: req.sky.uniform?.brightness ?? 0,
    });
    this.lensed = this.program(SKY_LENSED_FRAG, defines);
    const geometryDefines = directionsShaderDefines(frame);
    this.directions = this.program(SKY_DIRECTIONS_FRAG, geometryDefines);
    this.interpolating = mode === 'image' && !!this.geometryTarget && frame.lensing && !!frame.table;
    this.tiled = fateTilesPay(frame) || this.interpolating;
    if (this.tiled) {
      const programs = tileShaderDefines(defines);
      this.tiles.sky.mesh.material = this.program(SKY_LENSED_FRAG, programs.sky);
      this.tiles.interior.mesh.material = this.program(SKY_LENSED_FRAG, programs.interior);
      this.tiles.surface.mesh.material = this.program(SKY_LENSED_FRAG, programs.surface);
      this.tiles.mixed.mesh.material = this.lensed;
      this.fillTiles(frame, req);
    }
    if (this.interpolating && this.geometryTarget) {
      const { across, down } = geometryGridSize(frame.width, frame.height);
      if (this.geometryTarget.width !== across || this.geometryTarget.height !== down) this.geometryTarget.setSize(across, down);
      (u.uGeometrySize.value as THREE.Vector2).set(across, down);
      u.uGeometry.value = this.geometryTarget.texture;
      this.geometryMesh.material = this.program(SKY_GEOMETRY_FRAG, geometryDefines);
    }
  }

  /** Sort the frame's screen tiles (again only when the view, the camera state or the frame size changed). */
  private fillTiles(frame: GpuFrame, req: FrameRequest): void {
    const key = JSON.stringify([req.camera, req.projection, req.width, req.height, this.interpolating]);
    if (key === this.tilesKey || !frame.table) return;
    this.tilesKey = key;
    const classified = classifyFateTiles({ ...frame, table: frame.table }, createProjector(req.projection, frame.width, frame.height));
    const tiles = this.interpolating ? interiorSkyTiles(classified) : classified;
    const floats = 18 * tiles.classes.length;
    this.tiles.sky.fill((out) => tileTriangles(tiles, TILE_SKY, frame.width, frame.height, out), floats);
    this.tiles.interior.fill((out) => tileTriangles(tiles, TILE_SKY_INTERIOR, frame.width, frame.height, out), floats);
    this.tiles.surface.fill((out) => tileTriangles(tiles, TILE_SURFACE, frame.width, frame.height, out), floats);
    this.tiles.mixed.fill((out) => tileTriangles(tiles, TILE_MIXED, frame.width, frame.height, out), floats);
  }

  /** Draw the full-frame quad with a material, or (null) the frame's tiles. */
  private show(material: THREE.RawShaderMaterial | null): void {
    this.mesh.visible = material !== null;
    if (material) this.mesh.material = material;
    for (const tile of Object.values(this.tiles)) tile.setShown(material === null);
  }

  /** Draw the picture to the canvas (or a render target). */
  draw(target: THREE.WebGLRenderTarget | null = null): void {
    if (this.interpolating && this.geometryTarget) {
      this.gl.setRenderTarget(this.geometryTarget);
      this.gl.render(this.geometryScene, this.camera);
    }
    // tiles not drawn (outside a dome master's circle) keep the clear colour: black, as the full program draws them
    this.show(this.tiled ? null : this.lensed);
    this.gl.setRenderTarget(target);
    this.gl.render(this.scene, this.camera);
    this.gl.setRenderTarget(null);
  }

  /**
   * Render the picture into an 8-bit target and read it back.
   * @returns RGBA bytes, rows from the top of the frame
   */
  readFrame(req: FrameRequest, mode: SkyViewMode): Uint8Array {
    this.prepare(req, mode);
    const target = new THREE.WebGLRenderTarget(req.width, req.height, { type: THREE.UnsignedByteType, format: THREE.RGBAFormat, depthBuffer: false });
    try {
      this.draw(target);
      const pixels = new Uint8Array(req.width * req.height * 4);
      this.gl.readRenderTargetPixels(target, 0, 0, req.width, req.height, pixels);
      return flipRows(pixels, req.width, req.height, 4);
    } finally {
      target.dispose();
    }
  }

  /**
   * Render the "where the light comes from" target (float RGBA: hole-frame direction, fate) and read it back.
   * @returns 4 floats per pixel, rows from the top of the frame
   */
  readDirections(req: FrameRequest): Float32Array {
    this.prepare(req, 'sources');
    const target = new THREE.WebGLRenderTarget(req.width, req.height, { type: THREE.FloatType, format: THREE.RGBAFormat, depthBuffer: false });
    try {
      this.show(this.directions);
      this.gl.setRenderTarget(target);
      this.gl.render(this.scene, this.camera);
      this.gl.setRenderTarget(null);
      const out = new Float32Array(req.width * req.height * 4);
      this.gl.readRenderTargetPixels(target, 0, 0, req.width, req.height, out);
      return flipRows(out, req.width, req.height, 4);
    } finally {
      target.dispose();
    }
  }

  private disposeSky(): void {
    if (!this.sky) return;
    this.sky.colour.dispose();
    this.sky.diffuse?.dispose();
    if (this.sky.stars) {
      this.sky.stars.tiles.dispose();
      this.sky.stars.tileEntries.dispose();
    }
    this.sky = null;
  }

  /** Free GPU resources. */
  dispose(): void {
    this.disposeSky();
    this.rayTable.dispose();
    this.geometryTarget?.dispose();
    this.geometryMesh.geometry.dispose();
    this.placeholder.dispose();
    this.tilePlaceholder.dispose();
    for (const material of this.programs.values()) material.dispose();
    this.programs.clear();
    this.mesh.geometry.dispose();
    for (const tile of Object.values(this.tiles)) tile.dispose();
  }
}

/** prepareGpuFrame minus the ray table (lensing switched off in the copy so no table is built). */
function prepareGpuFrameWithoutTable(req: FrameRequest): GpuFrame {
  const frame = prepareGpuFrame({ ...req, effects: { ...req.effects, lensing: false } });
  return { ...frame, lensing: req.effects.lensing };
}

function flipRows<T extends Uint8Array | Float32Array>(data: T, width: number, height: number, channels: number): T {
  const row = width * channels;
  const out = new (data.constructor as { new (n: number): T })(data.length);
  for (let y = 0; y < height; y++) out.set(data.subarray((height - 1 - y) * row, (height - y) * row), y * row);
  return out;
}
