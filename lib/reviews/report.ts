/**
 * The accuracy report of one scene revision, as plain data: the path's
 * segments, its key moments (start, joints, horizon crossing, end) with the
 * readouts an advisor checks there, the ray table's worst error against the
 * exact tracer at each of those camera states, the published checks, every
 * non-physical setting in force and the idealisations of the model.
 * Pure TypeScript (no framework, DOM or database imports): the report page
 * and the unit tests call the same functions.
 */
import { createRayLookup, massScale, observeRay, RayTable, sampleWorldline, type Worldline } from '@/lib/relativity';
import { engineCameraOptics } from '@/lib/render/engine';
import { listNonPhysicalChoices } from '@/lib/render/schema';
import { clampToPath, frameRequestAt, frameSizeFor, sceneTiming } from '@/lib/scenes/frame-request';
import { screenTimeAt } from '@/lib/scenes/pacing';
import { readoutAt, sceneWorldline, type SceneReadout } from '@/lib/scenes/readout';
import type { SceneSpec } from '@/lib/scenes/schema';
import { runPublishedChecks, type CheckResult } from './checks';

/** Look angles compared per camera state (the brief: "a few thousand"). */
export const RAY_AUDIT_SAMPLES = 3000;
/** Band around the shadow edge left out of the comparison, rad (where phi diverges; lib/relativity/README.md). */
export const RAY_AUDIT_EDGE_BAND_RAD = 1e-6;
/** Horizon radius, M (Schwarzschild 1916). */
const HORIZON_RADIUS_M = 2;
const FATES = ['sky', 'horizon', 'far-side'] as const;

/** Why a moment is key. */
export type KeyMomentKind = 'start' | 'joint' | 'horizon' | 'end';

/** A moment of the path the report shows frames and numbers for. */
export interface KeyMoment {
  kind: KeyMomentKind;
  /** short label, e.g. "Joint 1: hover → drop" */
  label: string;
  /** proper time along the path, M */
  tauM: number;
}

/** The ray table's agreement with the exact tracer at one camera state. */
export interface RayTableAudit {
  /** camera radius, M */
  rM: number;
  /** reference observer's -u_t and u^r (the frame the renderer's table uses) */
  referenceEnergy: number;
  referenceUr: number;
  /** look angles compared */
  compared: number;
  /** look angles left out because they lie within the edge band of the shadow edge */
  excludedNearEdge: number;
  /** largest |phi_table - phi_exact|, rad */
  worstPhiErrorRad: number;
  /** largest |g_table - g_exact| / g_exact */
  worstShiftRelative: number;
  /** look angles where the table and the tracer disagree on where the ray comes from */
  fateMismatches: number;
  /** why no comparison was made (null when one was) */
  skipped: string | null;
}

/** One row of the segment table. */
export interface SegmentRow {
  index: number;
  kind: string;
  tauStartM: number;
  durationM: number;
  /** proper-time length in seconds for the scene's mass */
  durationSeconds: number;
  startRadiusRs: number;
  endRadiusRs: number;
  screenStartS: number;
  screenEndS: number;
  endsAtSingularity: boolean;
}

/** Everything the report shows about one key moment. */
export interface KeyMomentReport {
  moment: KeyMoment;
  screenTimeS: number;
  readout: SceneReadout;
  rayTable: RayTableAudit;
}

/** An idealisation of the model, worded for a general audience's producer. */
export interface Idealisation {
  title: string;
  plainWords: string;
}

/** A non-physical setting in force, as listed by lib/render and explained in plain words. */
export interface NonPhysicalSetting {
  setting: string;
  plainWords: string;
}

/** The whole report of one revision. */
export interface AccuracyReport {
  massSolar: number;
  secondsPerM: number;
  pathDurationM: number;
  screenStartS: number;
  screenEndS: number;
  endsAtSingularity: boolean;
  segments: SegmentRow[];
  moments: KeyMomentReport[];
  checks: CheckResult[];
  nonPhysical: NonPhysicalSetting[];
  idealisations: Idealisation[];
}

/**
 * The idealisations behind every Skywell picture (product.md, Cautions).
 * Reference: physics.md (Schwarzschild solution, section 5 for the far side).
 */
export const IDEALISATIONS: readonly Idealisation[] = [
  {
    title: 'An eternal hole',
    plainWords: 'The hole is modelled as having always existed and lasting for ever (the exact, eternal solution of Einstein\'s equations). Real holes formed from collapsing stars; outside the hole the two look the same.',
  },
  {
    title: 'An isolated hole',
    plainWords: 'Nothing else is near the hole: no glowing disc of gas, no jets, no companion star. The only light is the distant starry sky, which holds still during the shot.',
  },
  {
    title: 'A non-spinning, uncharged hole',
    plainWords: 'Real holes spin. A spinning hole\'s shadow is flattened on one side and its sky is dragged round; this show uses the simpler non-spinning hole.',
  },
  {
    title: 'Far-side light exists only in the eternal solution',
    plainWords: 'Inside the horizon part of the view (marked with the dashed violet grid) shows light from a second universe that exists only in the eternal solution. A hole made by a collapsing star has no such region; what a real traveller would see there is not known.',
  },
  {
    title: 'A point-sized camera and a 2 m body',
    plainWords: 'The camera sees from a single point. Tidal stretch and squeeze are quoted for a body 2 m long; the 10 g "disruption" line is an illustrative assumption, not a measured limit.',
  },
];

/**
 * A plain-words explanation of a setting listed by lib/render listNonPhysicalChoices.
 * @param setting one entry of listNonPhysicalChoices
 * @returns the explanation (a generic one for settings this function does not know)
 */
export function explainNonPhysicalSetting(setting: string): string {
  if (setting.startsWith('lensing switched off')) return 'The bending of light is switched off: the sky is shown as if the hole did not bend it. Not what a traveller would see.';
  if (setting.startsWith('frequency-shift colours')) return 'Colour changes from the hole\'s gravity and the camera\'s speed are switched off: stars keep their own colours.';
  if (setting.startsWith('g^4 brightness')) return 'The brightening and dimming that come with the colour shift are switched off.';
  if (setting.startsWith('horizon grid')) return 'A thin teal grid is drawn where light would come from the horizon itself. It marks a place; nothing there glows.';
  if (setting.startsWith('far-side grid')) return 'A dashed violet grid is drawn where light would come from the far side of the eternal hole (seen only inside the horizon).';
  if (setting.startsWith('Milky Way switched off')) return 'The glow of the Milky Way is left out of the sky.';
  if (setting.startsWith('stars switched off')) return 'The stars are left out of the sky.';
  if (setting.startsWith('Milky Way gain')) return 'The Milky Way is drawn brighter or fainter than it is.';
  if (setting.startsWith('star gain')) return 'The stars are drawn brighter or fainter than they are.';
  if (setting.startsWith('exposure')) return 'Exposure and tone mapping are chosen settings, as with any camera: near the hole the true brightness would exceed any screen.';
  if (setting.startsWith('star point-spread')) return 'Each star is drawn as a small soft dot so it stays visible on screen; real stars are points.';
  return 'A rendering choice that is not part of the physics.';
}

/** Bisection on r - 2 inside one segment: the proper time where the path crosses the horizon inward. */
function horizonCrossing(worldline: Worldline, lo: number, hi: number): number {
  const radius = (tau: number) => sampleWorldline(worldline, clampToPath(worldline, tau)).state.r;
  let a = lo;
  let b = hi;
  for (let i = 0; i < 80 && b - a > 1e-13 * Math.max(1, hi); i++) {
    const mid = 0.5 * (a + b);
    if (radius(mid) > HORIZON_RADIUS_M) a = mid;
    else b = mid;
  }
  return 0.5 * (a + b);
}

/**
 * The key moments of a path: its start, each joint between segments, the
 * horizon crossing (if any) and its end (just before the singularity when the
 * path ends there).
 * @param worldline built path (lib/scenes sceneWorldline)
 * @returns moments in proper-time order (tau in M)
 */
export function keyMoments(worldline: Worldline): KeyMoment[] {
  const moments: KeyMoment[] = [{ kind: 'start', label: 'Path start', tauM: 0 }];
  const segments = worldline.segments;
  for (let i = 1; i < segments.length; i++) {
    moments.push({ kind: 'joint', label: `Joint ${i}: ${segments[i - 1].kind} → ${segments[i].kind}`, tauM: segments[i].tauStart });
  }
  for (const seg of segments) {
    const endR = seg.endsAtSingularity ? 0 : seg.end.r;
    if (seg.start.r > HORIZON_RADIUS_M && endR <= HORIZON_RADIUS_M) {
      moments.push({ kind: 'horizon', label: 'Horizon crossing', tauM: horizonCrossing(worldline, seg.tauStart, seg.tauStart + seg.duration) });
      break;
    }
  }
  moments.push({ kind: 'end', label: worldline.endsAtSingularity ? 'End (just before the singularity)' : 'Path end', tauM: clampToPath(worldline, worldline.duration) });
  return moments.sort((a, b) => a.tauM - b.tauM);
}

/** Options of {@link rayTableWorstError}. */
export interface RayTableAuditOptions {
  /** look angles compared, 2..100000 (default RAY_AUDIT_SAMPLES) */
  samples?: number;
  /** band around the shadow edge left out, rad, >= 0 (default RAY_AUDIT_EDGE_BAND_RAD) */
  edgeBandRad?: number;
  /** a table to audit instead of building one for (rM, eps, ur) (lets a test show a wrong table is caught) */
  table?: RayTable;
}

/**
 * The worst error of the engine's ray table against the exact tracer for one
 * camera state: builds RayTable for the camera's radial reference observer
 * (the table the renderer uses) and compares its lookup with observeRay over
 * evenly spread look angles, leaving out a band around the shadow edge.
 * @param rM camera radius, M (finite, > 0)
 * @param referenceEnergy reference observer's -u_t (finite)
 * @param referenceUr reference observer's u^r (finite; eps^2 - ur^2 = 1 - 2/r)
 * @param options samples, edge band, or a table to audit
 * @returns the audit; `skipped` says why when the exact tracer does not cover the observer (outgoing, or eps < 0)
 * @throws RangeError for non-finite arguments or options out of range
 * Reference: physics.md section 5 (the table must bound its error near b = b_c; Bozza 2002).
 */
export function rayTableWorstError(rM: number, referenceEnergy: number, referenceUr: number, options: RayTableAuditOptions = {}): RayTableAudit {
  if (!Number.isFinite(rM) || !(rM > 0)) throw new RangeError(`rM must be a finite radius > 0 (M); got ${rM}`);
  if (!Number.isFinite(referenceEnergy)) throw new RangeError(`referenceEnergy must be finite (-u_t); got ${referenceEnergy}`);
  if (!Number.isFinite(referenceUr)) throw new RangeError(`referenceUr must be finite (u^r); got ${referenceUr}`);
  const samples = options.samples ?? RAY_AUDIT_SAMPLES;
  const band = options.edgeBandRad ?? RAY_AUDIT_EDGE_BAND_RAD;
  if (!Number.isInteger(samples) || samples < 2 || samples > 100_000) throw new RangeError(`options.samples must be an integer 2..100000; got ${samples}`);
  if (!Number.isFinite(band) || band < 0) throw new RangeError(`options.edgeBandRad must be finite and >= 0 (rad); got ${band}`);
  const audit: RayTableAudit = { rM, referenceEnergy, referenceUr, compared: 0, excludedNearEdge: 0, worstPhiErrorRad: 0, worstShiftRelative: 0, fateMismatches: 0, skipped: null };
  const hovering = Math.abs(referenceUr) <= 1e-12 && rM > HORIZON_RADIUS_M;
  if (!hovering && referenceUr > 0) return { ...audit, skipped: 'The camera is moving outward here; the exact tracer covers hovering and infalling cameras only.' };
  if (!hovering && !(referenceEnergy >= 0)) return { ...audit, skipped: 'The camera\'s reference observer has negative energy here; the exact tracer does not cover it.' };
  const observer = hovering ? ({ kind: 'static' } as const) : ({ kind: 'radial', energy: referenceEnergy } as const);
  const table = options.table ?? RayTable.build(rM, hovering ? Math.sqrt(1 - 2 / rM) : referenceEnergy, hovering ? 0 : referenceUr);
  const edge = table.shadowEdgePsi;
  const out = createRayLookup();
  for (let i = 0; i < samples; i++) {
    const psi = (Math.PI * (i + 0.37)) / samples;
    if (Number.isFinite(edge) && Math.abs(psi - edge) < band) {
      audit.excludedNearEdge++;
      continue;
    }
    const exact = observeRay(rM, psi, observer);
    table.lookup(psi, out);
    audit.compared++;
    if (FATES[out.fate] !== exact.fate) {
      audit.fateMismatches++;
      continue;
    }
    const phiError = Math.abs(out.phi - exact.phi);
    if (!(phiError <= audit.worstPhiErrorRad)) audit.worstPhiErrorRad = phiError; // NaN counts as worst
    const shiftError = Math.abs(out.g - exact.g) / Math.abs(exact.g);
    if (Number.isFinite(exact.g) && !(shiftError <= audit.worstShiftRelative)) audit.worstShiftRelative = shiftError;
  }
  return audit;
}

/** Frame size used only to build requests for the report's numbers (pixels do not enter them). */
const PROBE_SIZE_PX = 64;

/**
 * Builds the accuracy report of a scene revision.
 * @param spec validated scene spec (lib/scenes/schema)
 * @param options samples per ray-table audit (default RAY_AUDIT_SAMPLES)
 * @returns the report (radii in r_s, proper times in M and s for the scene's mass, screen times in s)
 * @throws RangeError when the spec's path cannot be built
 */
export function buildAccuracyReport(spec: SceneSpec, options: { raySamples?: number } = {}): AccuracyReport {
  const worldline = sceneWorldline(spec);
  const timing = sceneTiming(spec, worldline);
  const secondsPerM = massScale(spec.massSolar).secondsPerM;
  const size = frameSizeFor(spec.projection, PROBE_SIZE_PX, PROBE_SIZE_PX);
  const segments: SegmentRow[] = worldline.segments.map((seg) => ({
    index: seg.index,
    kind: seg.kind,
    tauStartM: seg.tauStart,
    durationM: seg.duration,
    durationSeconds: seg.duration * secondsPerM,
    startRadiusRs: seg.start.r / 2,
    endRadiusRs: (seg.endsAtSingularity ? 0 : seg.end.r) / 2,
    screenStartS: screenTimeAt(timing.curve, seg.tauStart),
    screenEndS: screenTimeAt(timing.curve, seg.tauStart + seg.duration),
    endsAtSingularity: seg.endsAtSingularity,
  }));
  const moments = keyMoments(worldline).map((moment): KeyMomentReport => {
    const request = frameRequestAt(spec, worldline, moment.tauM, size);
    const optics = engineCameraOptics(request.camera.state);
    return {
      moment,
      screenTimeS: screenTimeAt(timing.curve, moment.tauM),
      readout: readoutAt(spec, worldline, moment.tauM),
      rayTable: rayTableWorstError(optics.radiusM, optics.eps, optics.ur, { samples: options.raySamples }),
    };
  });
  // Effects, sky and exposure are per scene, not per moment: one request lists them all.
  const settings = listNonPhysicalChoices(frameRequestAt(spec, worldline, 0, size));
  return {
    massSolar: spec.massSolar,
    secondsPerM,
    pathDurationM: worldline.duration,
    screenStartS: timing.screenStartS,
    screenEndS: timing.screenEndS,
    endsAtSingularity: worldline.endsAtSingularity,
    segments,
    moments,
    checks: runPublishedChecks(),
    nonPhysical: settings.map((setting) => ({ setting, plainWords: explainNonPhysicalSetting(setting) })),
    idealisations: [...IDEALISATIONS],
  };
}
