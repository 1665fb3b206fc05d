import { describe, expect, it } from 'vitest';
import { scratchArray } from './scratch-array';

describe('scratchArray(n, slot)', () => {
  it('scratchArray() gives n entries, the same storage again for the same slot, different storage per slot', () => {
    // its TSDoc example: scratchArray(30, 0).length is 30
    const a = scratchArray(30, 0);
    expect(a).toHaveLength(30);
    a[0] = 7;
    expect(scratchArray(30, 0)[0]).toBe(7);
    expect(scratchArray(30, 1)).not.toBe(a);
    expect(scratchArray(45, 0)).toHaveLength(45);
    expect(scratchArray(12, 0)).toHaveLength(12);
  });

  it('scratchArray() refuses a slot outside 0–9 (RangeError)', () => {
    // regression pin, not truth: the slot range scratchArray documents (0–9; profileStart uses 8 and 9)
    expect(() => scratchArray(3, 10)).toThrow(RangeError);
    expect(() => scratchArray(3, -1)).toThrow(RangeError);
    expect(scratchArray(3, 9)).toHaveLength(3);
  });
});
