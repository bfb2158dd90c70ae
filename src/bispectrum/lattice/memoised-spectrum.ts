import { withPowerOf, type LinearSpectrum } from '../../contracts/linear-spectrum.js';

/**
 * A LinearSpectrum for integrands evaluated on the lattice of a box of side L:
 * it remembers power(k) and powerNoWiggle(k) at the lattice wavenumbers
 * k = k_f sqrt(a), a an integer, in arrays indexed by a, and returns the
 * identical numbers. A discrete-box average asks for a few thousand distinct
 * k some 1e9 times, so an integrand built on this wrapper runs faster there
 * with bit-identical results. Any other k (a dilated one, a k beyond 1024 k_f)
 * goes straight to the wrapped spectrum.
 */
const MAX_INDEX = 1 << 20;

export function latticeMemoisedSpectrum(spectrum: LinearSpectrum, boxSize: number): LinearSpectrum {
  const kf = (2 * Math.PI) / boxSize;
  // Four slots per index: an integrand may hand over k times a factor that is
  // 1 only up to rounding (e.g. an AP stretch at alpha = 1), so the same lattice
  // wavenumber arrives as a few neighbouring doubles. Each is kept exactly.
  const memo = (fn: (k: number) => number): ((k: number) => number) => {
    let keys = new Float64Array(0);
    let values = new Float64Array(0);
    return (k) => {
      const x = k / kf;
      const a = Math.round(x * x);
      if (!(a < MAX_INDEX)) return fn(k);
      if (4 * a >= keys.length) {
        const size = 4 * Math.min(MAX_INDEX, Math.max(keys.length / 2, a + 1, 1024));
        const grownKeys = new Float64Array(size).fill(Number.NaN);
        grownKeys.set(keys);
        const grownValues = new Float64Array(size);
        grownValues.set(values);
        keys = grownKeys;
        values = grownValues;
      }
      const slot = 4 * a;
      for (let w = slot; w < slot + 4; w++) if (keys[w] === k) return values[w];
      const v = fn(k);
      let free = slot;
      while (free < slot + 3 && keys[free] === keys[free]) free++; // first NaN slot, else the last
      keys[free] = k;
      values[free] = v;
      return v;
    };
  };
  return withPowerOf(
    spectrum,
    memo((k) => spectrum.power(k)),
    memo((k) => spectrum.powerNoWiggle(k)),
  );
}
