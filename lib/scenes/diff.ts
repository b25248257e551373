/** One changed leaf between two specs, addressed by an RFC 6901 JSON Pointer. */
export type FieldChange = { pointer: string; change: 'added' | 'removed' | 'changed'; before?: unknown; after?: unknown };

function isContainer(value: unknown): value is Record<string, unknown> | unknown[] {
  return typeof value === 'object' && value !== null;
}

const escape = (key: string) => key.replace(/~/g, '~0').replace(/\//g, '~1');

/** Which fields differ between two revisions' specs (leaves only, sorted by pointer). */
export function diffSpecs(before: unknown, after: unknown, pointer = ''): FieldChange[] {
  if (isContainer(before) && isContainer(after) && Array.isArray(before) === Array.isArray(after)) {
    const keys = new Set([...Object.keys(before), ...Object.keys(after)]);
    const changes: FieldChange[] = [];
    for (const key of keys) {
      const a = (before as Record<string, unknown>)[key];
      const b = (after as Record<string, unknown>)[key];
      const child = `${pointer}/${escape(key)}`;
      if (a === undefined) changes.push({ pointer: child, change: 'added', after: b });
      else if (b === undefined) changes.push({ pointer: child, change: 'removed', before: a });
      else changes.push(...diffSpecs(a, b, child));
    }
    return changes.sort((x, y) => x.pointer.localeCompare(y.pointer));
  }
  return Object.is(before, after) || JSON.stringify(before) === JSON.stringify(after) ? [] : [{ pointer: pointer || '/', change: 'changed', before, after }];
}
