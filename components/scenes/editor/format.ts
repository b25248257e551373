/**
 * Number formatting for the editor and readouts: a few significant digits,
 * exponents only where plain digits would mislead.
 */

/** Up to `digits` significant digits, trailing zeros dropped; exponent form outside 1e-3..1e7. */
export function formatNumber(value: number, digits = 4): string {
  if (!Number.isFinite(value)) return '–';
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude >= 1e7 || magnitude < 1e-3) {
    const [mantissa, exponent] = value.toExponential(digits - 1).split('e');
    return `${trimZeros(mantissa)}e${Number(exponent)}`;
  }
  if (magnitude >= 10 ** digits) return String(Math.round(value));
  return trimZeros(value.toPrecision(digits));
}

function trimZeros(text: string): string {
  return text.includes('.') ? text.replace(/\.?0+$/, '') : text;
}

/** A duration in seconds as a person reads it: microseconds up to days. */
export function formatDuration(seconds: number): string {
  if (!Number.isFinite(seconds)) return '–';
  const s = Math.abs(seconds);
  const sign = seconds < 0 ? '−' : '';
  if (s < 1e-3) return `${sign}${formatNumber(s * 1e6, 3)} µs`;
  if (s < 1) return `${sign}${formatNumber(s * 1e3, 3)} ms`;
  if (s < 120) return `${sign}${formatNumber(s, 4)} s`;
  if (s < 7200) return `${sign}${formatNumber(s / 60, 3)} min`;
  if (s < 172800) return `${sign}${formatNumber(s / 3600, 3)} h`;
  return `${sign}${formatNumber(s / 86400, 3)} days`;
}

/** Screen time as m:ss.t (the scrubber's clock). */
export function formatScreenTime(seconds: number): string {
  if (!Number.isFinite(seconds)) return '–';
  const minutes = Math.floor(seconds / 60);
  const rest = seconds - minutes * 60;
  return `${minutes}:${rest.toFixed(1).padStart(4, '0')}`;
}
