import { describe, expect, it } from 'vitest';
import { wrapWords } from '../../../src/ui/common/wrap-words';

describe('wrapWords', () => {
  it('breaks at spaces within the width, cutting only a word wider than the line', () => {
    expect(wrapWords('one two three four', 9)).toEqual(['one two', 'three', 'four']);
    expect(wrapWords('abcdefghijkl xy', 5)).toEqual(['abcde', 'xy']);
  });

  it('keeps a unit on the line of its number (worked by hand)', () => {
    expect(wrapWords('fall 26.48 V..27.23 V', 21)).toEqual(['fall 26.48 V..27.23 V']);
    expect(wrapWords('fall 26.48 V..27.23 V', 20)).toEqual(['fall', '26.48 V..27.23 V']);
    expect(wrapWords('sink 3.04 mA, then 12 %', 9)).toEqual(['sink', '3.04 mA,', 'then 12 %']);
    // A word that is not a unit, or follows no number, wraps as before.
    expect(wrapWords('at 3 sigma', 5)).toEqual(['at 3', 'sigma']);
    expect(wrapWords('in V out', 4)).toEqual(['in V', 'out']);
  });
});
