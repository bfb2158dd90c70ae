/**
 * Orbits of lattice vectors under the symmetries of a periodic box that keep
 * the z axis (the line of sight) as an axis: x <-> y, x -> -x, y -> -y
 * (8 elements, which leave every |k| and every mu unchanged) and, optionally,
 * z -> -z as well (16 elements; it flips the sign of every mu).
 *
 * Each orbit has exactly one representative with x >= y >= 0 (and z >= 0 when
 * z -> -z is included): (max(|x|,|y|), min(|x|,|y|), |z|).
 */
export interface AxialRepresentatives {
  readonly count: number;
  /** Representatives, 3 integers each. */
  readonly vectors: Int16Array;
  /** Size of each representative's orbit (the number of distinct images). */
  readonly orbitSize: Int32Array;
}

export function axialRepresentatives(vectors: Int16Array, withZFlip: boolean): AxialRepresentatives {
  const reps: number[] = [];
  const sizes: number[] = [];
  for (let p = 0; p < vectors.length; p += 3) {
    const x = vectors[p];
    const y = vectors[p + 1];
    const z = vectors[p + 2];
    if (!(x >= y && y >= 0 && (!withZFlip || z >= 0))) continue;
    reps.push(x, y, z);
    sizes.push(orbitSize(x, y, z, withZFlip));
  }
  return { count: sizes.length, vectors: Int16Array.from(reps), orbitSize: Int32Array.from(sizes) };
}

function orbitSize(x: number, y: number, z: number, withZFlip: boolean): number {
  const images = new Set<string>();
  const zs = withZFlip ? [z, -z] : [z];
  for (const [a, b] of [
    [x, y],
    [y, x],
  ]) {
    for (const sa of [1, -1]) for (const sb of [1, -1]) for (const c of zs) images.add(`${sa * a},${sb * b},${c}`);
  }
  return images.size;
}
