/** Float comparison for the scene tests: |a - b| <= abs + rel * |b|. */
export function near(a: number, b: number, abs: number, rel = 0): boolean {
  return Math.abs(a - b) <= abs + rel * Math.abs(b);
}
