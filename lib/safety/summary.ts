/**
 * Plain-language summary of a photosensitivity report for the studio UI and the
 * delivery, ending with the product's caution that venue policy and local rules
 * decide (product.md, "Cautions the product shows").
 */
import type { FailingRange, FlashKindResult, FlashReport } from './flashDetector';

/** The closing caution of every summary (product.md: defer to venue policy and local rules). */
export const VENUE_POLICY_CAUTION =
  'This check follows WCAG 2.2 (success criterion 2.3.1) and ITU-R BT.1702; venue policy and local rules decide whether and how the sequence may be shown.';

function seconds(s: number): string {
  return `${s.toFixed(2)} s`;
}

function place(range: FailingRange, dome: boolean): string {
  const off = Math.round(range.worstFieldCentre.offAxisDeg);
  return dome ? `${off} degrees from the zenith` : `${off} degrees from the frame centre`;
}

function describeKind(name: string, why: string, result: FlashKindResult, dome: boolean): string[] {
  return result.failingRanges.map(
    (r) =>
      `${name} flashes from ${seconds(r.startSeconds)} to ${seconds(r.endSeconds)} (frames ${r.startFrame}-${r.endFrame}): ` +
      `${r.count} in one second, ${why}, worst ${place(r, dome)}.`,
  );
}

/**
 * Summarise a report in a few plain sentences.
 * @param report result of createFlashDetector(...).finish() or analyseFlashSequence
 * @param options dome: true to place failures by angle from the zenith (dome masters); default false
 * @returns text: the verdict, each failing time range and why, then VENUE_POLICY_CAUTION
 */
export function summariseFlashReport(report: FlashReport, options: { dome?: boolean } = {}): string {
  const dome = options.dome === true;
  const t = report.thresholds;
  const duration = seconds(report.framesAnalysed / report.frameRate);
  const lines: string[] = [];
  if (report.verdict === 'pass') {
    lines.push(
      `Photosensitivity check passed for ${report.framesAnalysed} frames (${duration}): no 10-degree part of the view flashes more than ` +
        `${t.flashesPerSecondMax} times in any second over more than ${t.flashAreaMaxSr} sr ` +
        `(most in one second: ${report.generalFlashes.maxPerSecond} general, ${report.redFlashes.maxPerSecond} red).`,
    );
  } else {
    lines.push(`Photosensitivity check failed for ${report.framesAnalysed} frames (${duration}).`);
    const why = `more than ${t.flashesPerSecondMax} allowed over more than ${t.flashAreaMaxSr} sr of a 10-degree field`;
    lines.push(...describeKind('Brightness', `${why} (changes of ${t.luminanceChangeMin} or more in relative luminance)`, report.generalFlashes, dome));
    lines.push(...describeKind('Saturated-red', `${why} (to or from saturated red)`, report.redFlashes, dome));
    lines.push('Slow the flashing to three per second or fewer, lower its contrast, or shrink the flashing area.');
  }
  lines.push(VENUE_POLICY_CAUTION);
  return lines.join('\n');
}
