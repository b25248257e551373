/**
 * Photosensitivity thresholds, from WCAG 2.2's definition "general flash and red
 * flash thresholds" (success criterion 2.3.1, Three Flashes or Below Threshold),
 * the same ideas as ITU-R BT.1702 uses for broadcast.
 */

/** A general-flash transition: relative luminance changes by at least this (fraction of white, WCAG 2.2 "10% or more"). */
export const LUMINANCE_CHANGE_MIN = 0.1;
/** ... and the darker state's relative luminance is below this (WCAG 2.2). */
export const DARKER_STATE_BELOW = 0.8;
/** Saturated red: R/(R+G+B) at least this, R, G, B linear as in "relative luminance" (WCAG 2.2 note, ISO 9241-391). */
export const SATURATED_RED_RATIO_MIN = 0.8;
/** A red transition: CIE 1976 u'v' distance between the states above this (unitless; WCAG 2.2 note, ISO 9241-391). */
export const RED_CHROMATICITY_CHANGE_ABOVE = 0.2;
/** At most this many flashes of each kind in any one-second period pass (WCAG 2.2 SC 2.3.1). */
export const FLASHES_PER_SECOND_MAX = 3;
/** Length of the counting window, seconds (WCAG 2.2: "any one-second period"). */
export const WINDOW_SECONDS = 1;
/** Flashing areas up to this many steradians within one 10-degree field pass (WCAG 2.2: "25% of any 10 degree visual field"). */
export const FLASH_AREA_MAX_SR = 0.006;
/** Diameter of the visual field the area rule applies to, degrees (WCAG 2.2). */
export const VISUAL_FIELD_DIAMETER_DEG = 10;

/** The thresholds a report was made with. */
export interface FlashThresholds {
  /** Relative-luminance change of a general transition, >= (fraction of white). */
  luminanceChangeMin: number;
  /** Relative luminance the darker state must stay below. */
  darkerStateBelow: number;
  /** R/(R+G+B) of a saturated red, >= (linear sRGB). */
  saturatedRedRatioMin: number;
  /** CIE 1976 u'v' distance of a red transition, > (unitless). */
  redChromaticityChangeAbove: number;
  /** Flashes of one kind allowed in any one-second window. */
  flashesPerSecondMax: number;
  /** Counting window, s. */
  windowSeconds: number;
  /** Flashing area allowed within one 10-degree field, sr. */
  flashAreaMaxSr: number;
  /** Diameter of the visual field, degrees. */
  visualFieldDiameterDeg: number;
}

/** The thresholds as a plain object for reports. */
export const FLASH_THRESHOLDS: Readonly<FlashThresholds> = Object.freeze({
  luminanceChangeMin: LUMINANCE_CHANGE_MIN,
  darkerStateBelow: DARKER_STATE_BELOW,
  saturatedRedRatioMin: SATURATED_RED_RATIO_MIN,
  redChromaticityChangeAbove: RED_CHROMATICITY_CHANGE_ABOVE,
  flashesPerSecondMax: FLASHES_PER_SECOND_MAX,
  windowSeconds: WINDOW_SECONDS,
  flashAreaMaxSr: FLASH_AREA_MAX_SR,
  visualFieldDiameterDeg: VISUAL_FIELD_DIAMETER_DEG,
});
