/** Test target: ln p = -(Rosenbrock's function), maximal (0) at (1, ..., 1). */
export function rosenbrockTarget(): (x: Float64Array) => number {
  return (x) => {
    let f = 0;
    for (let i = 0; i + 1 < x.length; i++) f += 100 * (x[i + 1] - x[i] * x[i]) ** 2 + (1 - x[i]) ** 2;
    return -f;
  };
}
