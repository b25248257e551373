import { describe, expect, it } from 'vitest';
import { decodeBrightnessMap, encodeBrightnessMap } from '@/lib/webgl/skyAssetFormat';
import { expectClose } from './close';

describe('encodeBrightnessMap', () => {
  it('should round-trip a map through its binary form', () => {
    const data = new Float32Array(6).map((_, i) => 0.5 + 270 * i);
    const back = decodeBrightnessMap(encodeBrightnessMap({ width: 3, height: 2, data }));
    expect([back.width, back.height]).toEqual([3, 2]);
    data.forEach((v, i) => expectClose(back.data[i], v, 0));
  });

  it('should reject bytes that are not a map', () => {
    expect(() => decodeBrightnessMap(new Uint8Array(20))).toThrow(RangeError);
    expect(() => encodeBrightnessMap({ width: 2, height: 2, data: new Float32Array(3) })).toThrow(RangeError);
  });
});
