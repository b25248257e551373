/** Photosensitivity check of rendered sequences (WCAG 2.2 SC 2.3.1, ITU-R BT.1702); see flashDetector.ts for the method. */
export {
  analyseFlashSequence,
  createFlashDetector,
  DEFAULT_FIELD_SPACING_DEG,
  DEFAULT_MAX_CELL_DEG,
  type FailingRange,
  type FieldCentre,
  type FlashDetector,
  type FlashDetectorOptions,
  type FlashKindResult,
  type FlashReport,
  type FramePixels,
  type PixelEncoding,
  type WorkingResolution,
} from './flashDetector';
export { summariseFlashReport, VENUE_POLICY_CAUTION } from './summary';
export { D65_U, D65_V, linearRgbToUv, redRatio, relativeLuminance, relativeLuminanceSrgb, srgbToLinear } from './colour';
export { FLASH_THRESHOLDS, type FlashThresholds } from './thresholds';
export { pixelSolidAngleSr, createSolidAngleScratch } from './solidAngle';
export { buildWorkingGrid, type WorkingGrid } from './workingGrid';
