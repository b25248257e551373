/** Every distinct ArrayBuffer under a plain object (typed arrays in nested objects and arrays), for postMessage. */
export function transferablesOf(value: unknown, found: Set<ArrayBuffer> = new Set()): ArrayBuffer[] {
  if (ArrayBuffer.isView(value)) {
    if (value.buffer instanceof ArrayBuffer) found.add(value.buffer);
  } else if (Array.isArray(value)) {
    for (const item of value) transferablesOf(item, found);
  } else if (value !== null && typeof value === 'object') {
    for (const item of Object.values(value)) transferablesOf(item, found);
  }
  return [...found];
}
