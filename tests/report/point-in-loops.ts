/** Even-odd point-in-polygon test over several closed loops, written for the tests independently of the contouring code. */
export function insideLoops(px: number, py: number, loops: ReadonlyArray<ReadonlyArray<readonly [number, number]>>): boolean {
  let odd = false;
  for (const loop of loops) {
    for (let i = 0, j = loop.length - 1; i < loop.length; j = i++) {
      const [xi, yi] = loop[i];
      const [xj, yj] = loop[j];
      if (yi > py !== yj > py && px < ((xj - xi) * (py - yi)) / (yj - yi) + xi) odd = !odd;
    }
  }
  return odd;
}
