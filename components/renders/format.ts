/** Small display formatters shared by the render and delivery pages. */

/** "2 min 05 s", "45 s", "1 h 03 min" for a duration in seconds (>= 0). */
export function formatSecondsLeft(seconds: number): string {
  const s = Math.max(0, Math.round(seconds));
  if (s < 60) return `${s} s`;
  if (s < 3600) return `${Math.floor(s / 60)} min ${String(s % 60).padStart(2, '0')} s`;
  return `${Math.floor(s / 3600)} h ${String(Math.floor((s % 3600) / 60)).padStart(2, '0')} min`;
}

/** Bytes as B, KiB, MiB or GiB with three significant figures. */
export function formatBytes(bytes: number): string {
  const units = ['B', 'KiB', 'MiB', 'GiB'];
  let value = bytes;
  let unit = 0;
  while (value >= 1024 && unit < units.length - 1) {
    value /= 1024;
    unit++;
  }
  return unit === 0 ? `${value} B` : `${value.toPrecision(3)} ${units[unit]}`;
}

/** A number with `digits` significant figures, or an en dash when absent. */
export function formatNumber(value: number | null | undefined, digits = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '–';
  return Math.abs(value) >= 1e6 || (Math.abs(value) < 1e-3 && value !== 0) ? value.toExponential(digits - 1) : String(Number(value.toPrecision(digits)));
}

/** Local date and time, short. */
export function formatWhen(iso: string | null): string {
  return iso ? new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' }) : '–';
}

/** The output format as a producer names it. */
export function formatLabel(format: string): string {
  return format === 'png16' ? '16-bit PNG' : format === 'png8' ? '8-bit PNG' : format === 'jpeg' ? 'JPEG proxy' : format;
}
