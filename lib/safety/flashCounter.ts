/**
 * Counting flashes per 10-degree field in sliding one-second windows. A field
 * "transitions" in a frame step when the solid angle of its cells transitioning
 * the same way exceeds 0.006 sr (the area rule of WCAG 2.2); a flash is a pair
 * of opposing field transitions, so only transitions opposite to the field's
 * previous one are counted, and a window holding n of them holds floor(n / 2)
 * flashes. Only the transitions of the last second are kept per field.
 */
import { FLASH_AREA_MAX_SR, FLASHES_PER_SECOND_MAX, WINDOW_SECONDS } from './thresholds';

/** A stretch of frames in which some field flashes more than three times in a second (frame indices from 0). */
export interface FlashRun {
  /** Frame before the first counted transition of the first failing window. */
  startFrame: number;
  /** Frame that completes the last counted transition of the last failing window. */
  endFrame: number;
  /** Most flashes in one one-second window within the stretch. */
  count: number;
  /** Field that had that many (of those, the one with the largest transitioning area). */
  field: number;
  /** Largest solid angle of that field transitioning in one step, sr. */
  areaSr: number;
}

/** Per-field transition history and the failing stretches found so far, for one kind of flash. */
export class FieldFlashCounter {
  private readonly lastDirection: Int8Array;
  private readonly history: Int32Array;
  private readonly historyHead: Int32Array;
  private readonly historySize: Int32Array;
  private readonly capacity: number;
  private readonly windowFrames: number;
  private maxFlashes = 0;
  private readonly runs: FlashRun[] = [];

  /**
   * @param fieldCount number of fields (>= 1)
   * @param frameRate frames per second (1..240); two transitions share a window when (step2 - step1) / frameRate < 1 s
   */
  constructor(fieldCount: number, frameRate: number) {
    this.windowFrames = frameRate * WINDOW_SECONDS;
    // at most one counted transition per step, ceil(window) steps per window
    this.capacity = Math.ceil(this.windowFrames) + 2;
    this.lastDirection = new Int8Array(fieldCount);
    this.history = new Int32Array(fieldCount * this.capacity);
    this.historyHead = new Int32Array(fieldCount);
    this.historySize = new Int32Array(fieldCount);
  }

  /**
   * Record one frame step of one field.
   * @param field field index
   * @param upAreaSr solid angle of the field's cells rising this step, sr
   * @param downAreaSr solid angle of the field's cells falling this step, sr
   * @param step index of the frame that completes the step (>= 1)
   */
  addStep(field: number, upAreaSr: number, downAreaSr: number, step: number): void {
    const up = upAreaSr > FLASH_AREA_MAX_SR;
    const down = downAreaSr > FLASH_AREA_MAX_SR;
    if (!up && !down) return;
    // Both ways in one step (parts of the field in counter-phase, or a large moving edge): one transition,
    // the one opposing the previous, so two halves flickering in counter-phase count at their own rate.
    if (up && down) {
      const direction = this.lastDirection[field] === 1 ? -1 : 1;
      this.addTransition(field, direction, step, direction === 1 ? upAreaSr : downAreaSr);
      return;
    }
    if (up) this.addTransition(field, 1, step, upAreaSr);
    else this.addTransition(field, -1, step, downAreaSr);
  }

  private addTransition(field: number, direction: number, step: number, areaSr: number): void {
    if (this.lastDirection[field] === direction) return;
    this.lastDirection[field] = direction;
    const base = field * this.capacity;
    let head = this.historyHead[field];
    let size = this.historySize[field];
    while (size > 0 && step - this.history[base + head] >= this.windowFrames) {
      head = (head + 1) % this.capacity;
      size--;
    }
    this.history[base + ((head + size) % this.capacity)] = step;
    size++;
    this.historyHead[field] = head;
    this.historySize[field] = size;
    const flashes = size >> 1;
    if (flashes > this.maxFlashes) this.maxFlashes = flashes;
    if (flashes > FLASHES_PER_SECOND_MAX) this.addRun({ startFrame: this.history[base + head] - 1, endFrame: step, count: flashes, field, areaSr });
  }

  private addRun(found: FlashRun): void {
    let run = found;
    while (this.runs.length > 0 && run.startFrame <= this.runs[this.runs.length - 1].endFrame + 1) {
      const last = this.runs.pop() as FlashRun;
      const lastWorse = last.count > run.count || (last.count === run.count && last.areaSr >= run.areaSr);
      const worst = lastWorse ? last : run;
      run = {
        startFrame: Math.min(last.startFrame, run.startFrame),
        endFrame: Math.max(last.endFrame, run.endFrame),
        count: worst.count,
        field: worst.field,
        areaSr: worst.areaSr,
      };
    }
    this.runs.push(run);
  }

  /** Most flashes of this kind in any one-second window of any field so far. */
  get maxPerSecond(): number {
    return this.maxFlashes;
  }

  /** The failing stretches so far, in time order (copies). */
  failingRuns(): FlashRun[] {
    return this.runs.map((r) => ({ ...r }));
  }
}
