/**
 * The 10-degree visual fields of the area rule (WCAG 2.2: "within any 10 degree
 * visual field"), as circular caps of 5-degree radius centred on a near-uniform
 * grid of directions: rings of constant angle from the frame centre (view +z),
 * spacingDeg apart, each ring cut into ceil(360 sin(theta) / spacingDeg) centres.
 * Every direction lies within about spacingDeg / sqrt(2) of a centre, so with a
 * 2.5-degree spacing any compact flashing region of 0.006 sr (a disc of about
 * 2.5 degrees radius) lies wholly inside at least one field (2.5 + 1.8 < 5).
 * Each cell belongs to every field whose centre is within 5 degrees of it.
 */
import type { WorkingGrid } from './workingGrid';
import { VISUAL_FIELD_DIAMETER_DEG } from './thresholds';

const DEG = Math.PI / 180;

/** Field centres and the cell -> field membership lists (compressed rows). */
export interface FieldGrid {
  /** Number of field centres over the whole sphere. */
  fieldCount: number;
  /** Unit centre direction of each field, view space, 3 per field. */
  centre: Float64Array;
  /** Cells of the working grid per field, for reference (0 for fields outside the frame). */
  cellsPerField: Uint32Array;
  /** Fields of cell c are memberField[memberStart[c] .. memberStart[c + 1]). */
  memberStart: Uint32Array;
  memberField: Uint16Array | Uint32Array;
}

/**
 * Lay out field centres and assign the working grid's cells to them.
 * @param grid the working grid (cell directions)
 * @param spacingDeg spacing of field centres, degrees (0.5..5)
 * @returns the field grid
 * @throws RangeError for a spacing outside 0.5..5 degrees
 */
export function buildFieldGrid(grid: WorkingGrid, spacingDeg: number): FieldGrid {
  if (!Number.isFinite(spacingDeg) || spacingDeg < 0.5 || spacingDeg > 5) throw new RangeError('fieldSpacingDeg: 0.5..5 degrees');
  const radiusRad = (VISUAL_FIELD_DIAMETER_DEG / 2) * DEG;
  const cosRadius = Math.cos(radiusRad);
  const ringCount = Math.round(180 / spacingDeg) + 1;
  const ringStepRad = Math.PI / (ringCount - 1);
  const ringTheta = new Float64Array(ringCount);
  const ringSize = new Int32Array(ringCount);
  const ringOffset = new Int32Array(ringCount + 1);
  for (let i = 0; i < ringCount; i++) {
    ringTheta[i] = i * ringStepRad;
    const s = Math.sin(ringTheta[i]);
    ringSize[i] = i === 0 || i === ringCount - 1 ? 1 : Math.max(1, Math.ceil((2 * Math.PI * s) / (spacingDeg * DEG)));
    ringOffset[i + 1] = ringOffset[i] + ringSize[i];
  }
  const fieldCount = ringOffset[ringCount];
  const centre = new Float64Array(3 * fieldCount);
  for (let i = 0; i < ringCount; i++) {
    const st = Math.sin(ringTheta[i]);
    const ct = Math.cos(ringTheta[i]);
    for (let j = 0; j < ringSize[i]; j++) {
      const phi = (2 * Math.PI * j) / ringSize[i];
      const f = ringOffset[i] + j;
      centre[3 * f] = st * Math.cos(phi);
      centre[3 * f + 1] = st * Math.sin(phi);
      centre[3 * f + 2] = i === ringCount - 1 ? -1 : ct;
    }
  }

  const cellsPerField = new Uint32Array(fieldCount);
  const memberStart = new Uint32Array(grid.cellCount + 1);
  let members = new Uint32Array(Math.max(1024, grid.cellCount * 4));
  let used = 0;
  const push = (f: number) => {
    if (used === members.length) {
      const bigger = new Uint32Array(members.length * 2);
      bigger.set(members);
      members = bigger;
    }
    members[used++] = f;
    cellsPerField[f]++;
  };
  const dirs = grid.cellDirection;
  for (let cell = 0; cell < grid.cellCount; cell++) {
    memberStart[cell] = used;
    if (!(grid.cellSolidAngleSr[cell] > 0)) continue;
    const x = dirs[3 * cell], y = dirs[3 * cell + 1], z = dirs[3 * cell + 2];
    const theta = Math.acos(Math.max(-1, Math.min(1, z)));
    const phi = Math.atan2(y, x);
    const sinTheta = Math.sin(theta);
    const iLo = Math.max(0, Math.ceil((theta - radiusRad) / ringStepRad - 1e-9));
    const iHi = Math.min(ringCount - 1, Math.floor((theta + radiusRad) / ringStepRad + 1e-9));
    for (let i = iLo; i <= iHi; i++) {
      const n = ringSize[i];
      const den = sinTheta * Math.sin(ringTheta[i]);
      let halfWidthRad = Math.PI;
      if (den > 1e-12) {
        const c = (cosRadius - z * Math.cos(ringTheta[i])) / den;
        if (c > 1) continue;
        if (c > -1) halfWidthRad = Math.acos(c);
      }
      const step = (2 * Math.PI) / n;
      const jLo = Math.floor((phi - halfWidthRad) / step) - 1;
      const jHi = Math.ceil((phi + halfWidthRad) / step) + 1;
      if (jHi - jLo + 1 >= n) {
        for (let j = 0; j < n; j++) {
          const f = ringOffset[i] + j;
          if (x * centre[3 * f] + y * centre[3 * f + 1] + z * centre[3 * f + 2] >= cosRadius - 1e-12) push(f);
        }
      } else {
        for (let jj = jLo; jj <= jHi; jj++) {
          const f = ringOffset[i] + (((jj % n) + n) % n);
          if (x * centre[3 * f] + y * centre[3 * f + 1] + z * centre[3 * f + 2] >= cosRadius - 1e-12) push(f);
        }
      }
    }
  }
  memberStart[grid.cellCount] = used;
  const memberField = fieldCount <= 65536 ? Uint16Array.from(members.subarray(0, used)) : members.slice(0, used);
  return { fieldCount, centre, cellsPerField, memberStart, memberField };
}
