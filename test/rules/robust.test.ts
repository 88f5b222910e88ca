// The robust scale the dataset rules share is 1.4826 × the median absolute deviation (the factor that
// makes MAD estimate σ for normal data, common practice), never below its floor. It is computed on typed
// copies; it must agree with simple-statistics' medianAbsoluteDeviation for any input.
import fc from 'fast-check';
import { medianAbsoluteDeviation } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { MAD_TO_SIGMA, robustScale } from '../../pipeline/rules/robust.js';

describe('robustScale', () => {
  it('is 1.4826 × MAD: for 1, 2, 3, 4, 100 the median is 3, the deviations 2, 1, 0, 1, 97, their median 1', () => {
    expect(robustScale([1, 2, 3, 4, 100], 0)).toBeCloseTo(1.4826, 12);
    expect(robustScale([5, 5, 5, 5], 0.1)).toBe(0.1); // MAD 0: the floor
    expect(robustScale([], 0.25)).toBe(0.25);
  });

  it('agrees with simple-statistics to the last bit for any finite values, odd and even counts, arrays and typed arrays', () => {
    // an even count whose two middle deviations average differently as (a + b)/2 and a + (b − a)/2
    const xs = [0, 1.3489815189531905e-9, 1.7995841618508185e-10, -1.1690231027681088e-9];
    expect(robustScale(xs, 1e-9)).toBe(Math.max(MAD_TO_SIGMA * medianAbsoluteDeviation([...xs]), 1e-9));
    fc.assert(
      fc.property(fc.array(fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e6, max: 1e6 }), { minLength: 1, maxLength: 60 }), (xs) => {
        const expected = Math.max(MAD_TO_SIGMA * medianAbsoluteDeviation([...xs]), 1e-9);
        expect(robustScale(xs, 1e-9)).toBe(expected);
        expect(robustScale(Float64Array.from(xs), 1e-9)).toBe(expected);
      }),
      { numRuns: 5000 },
    );
  });
});
