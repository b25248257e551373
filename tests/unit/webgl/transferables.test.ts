import { describe, expect, it } from 'vitest';
import { transferablesOf } from '@/components/sky-view/gpu/transferables';

describe('transferablesOf', () => {
  it('should list every distinct buffer of the typed arrays nested in objects and arrays, once', () => {
    // structured clone rejects a transfer list naming one ArrayBuffer twice (HTML standard, StructuredSerializeWithTransfer)
    const shared = new Float32Array(8);
    const other = new Float64Array(3);
    const data = { a: shared, b: { c: [new Uint8Array(shared.buffer, 4, 4), other], d: 3, e: 'text', f: null } };
    const found = transferablesOf(data);
    expect(found).toHaveLength(2);
    expect(found).toContain(shared.buffer);
    expect(found).toContain(other.buffer);
    expect(transferablesOf({ n: 1, s: 'x' })).toEqual([]);
  });
});
