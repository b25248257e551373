import { describe, expect, it } from 'vitest';
import { contentHash } from '@/lib/scenes/hash';
import { diffSpecs } from '@/lib/scenes/diff';
import { sceneSpecSchema } from '@/lib/scenes/schema';
import { defaultSceneSpec } from '@/lib/scenes/defaults';

describe('contentHash', () => {
  it('should not depend on key order (RFC 8785 canonical JSON)', () => {
    expect(contentHash({ a: 1, b: { c: [1, 2], d: 'x' } })).toBe(contentHash({ b: { d: 'x', c: [1, 2] }, a: 1 }));
  });

  it('should change when any value changes, including array order', () => {
    const base = contentHash({ a: [1, 2] });
    expect(contentHash({ a: [2, 1] })).not.toBe(base);
    expect(contentHash({ a: [1, 2.0000001] })).not.toBe(base);
  });

  it('should be the SHA-256 of the canonical form', () => {
    // SHA-256 of the two bytes "{}" (value from memory; `openssl dgst -sha256` agrees).
    expect(contentHash({})).toBe('44136fa355b3678a1146ad16f7e8649e94fb4fc21fe77e8310c060f61caaff8a');
  });

  it('should be stable for a parsed scene whatever order its keys were typed in', () => {
    const reverseKeys = (value: unknown): unknown =>
      Array.isArray(value) ? value.map(reverseKeys)
        : value && typeof value === 'object' ? Object.fromEntries(Object.entries(value).reverse().map(([k, v]) => [k, reverseKeys(v)]))
          : value;
    const spec = sceneSpecSchema.parse(defaultSceneSpec());
    const reversed = reverseKeys(spec);
    expect(JSON.stringify(reversed)).not.toBe(JSON.stringify(spec));
    expect(contentHash(reversed)).toBe(contentHash(spec));
  });
});

describe('diffSpecs', () => {
  it('should list changed, added and removed leaves as JSON Pointers (RFC 6901)', () => {
    const changes = diffSpecs({ massSolar: 10, path: { segments: [{ r: 6 }] }, notes: 'a' }, { massSolar: 12, path: { segments: [{ r: 6 }, { r: 3 }] }, 'a/b': 1 });
    expect(changes).toEqual([
      { pointer: '/a~1b', change: 'added', after: 1 },
      { pointer: '/massSolar', change: 'changed', before: 10, after: 12 },
      { pointer: '/notes', change: 'removed', before: 'a' },
      { pointer: '/path/segments/1', change: 'added', after: { r: 3 } },
    ]);
  });

  it('should find nothing between equal specs', () => {
    expect(diffSpecs(defaultSceneSpec(), defaultSceneSpec())).toEqual([]);
  });
});
