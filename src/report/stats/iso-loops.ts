/**
 * Closed iso-lines of a grid of node values by marching squares. Nodes
 * outside the grid count as below every positive level, so every loop closes.
 * Loops are in node-index coordinates (node (i, j) at (i, j)); saddle cells
 * are resolved by the mean of their four corners.
 */
export function isoLoops(values: ArrayLike<number>, nx: number, ny: number, level: number): Array<Array<[number, number]>> {
  // Work on a copy with one ring of zero nodes around it.
  const w = nx + 2;
  const h = ny + 2;
  const v = new Float64Array(w * h);
  for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) v[(j + 1) * w + i + 1] = values[j * nx + i];
  const inside = (i: number, j: number): boolean => v[j * w + i] >= level;

  // Edge keys: horizontal edge from node (i, j) to (i+1, j) is 2 (j w + i); vertical to (i, j+1) is that + 1.
  const hKey = (i: number, j: number): number => 2 * (j * w + i);
  const vKey = (i: number, j: number): number => 2 * (j * w + i) + 1;
  const points = new Map<number, [number, number]>();
  const crossing = (key: number, i: number, j: number, di: number, dj: number): number => {
    if (!points.has(key)) {
      const a = v[j * w + i];
      const b = v[(j + dj) * w + i + di];
      const t = (level - a) / (b - a);
      points.set(key, [i + di * t - 1, j + dj * t - 1]);
    }
    return key;
  };

  const segments: Array<[number, number]> = [];
  for (let j = 0; j < h - 1; j++) {
    for (let i = 0; i < w - 1; i++) {
      const c00 = inside(i, j);
      const c10 = inside(i + 1, j);
      const c11 = inside(i + 1, j + 1);
      const c01 = inside(i, j + 1);
      // Edges in order around the cell: bottom, right, top, left.
      const cut: number[] = [];
      if (c00 !== c10) cut.push(crossing(hKey(i, j), i, j, 1, 0));
      if (c10 !== c11) cut.push(crossing(vKey(i + 1, j), i + 1, j, 0, 1));
      if (c01 !== c11) cut.push(crossing(hKey(i, j + 1), i, j + 1, 1, 0));
      if (c00 !== c01) cut.push(crossing(vKey(i, j), i, j, 0, 1));
      if (cut.length === 2) segments.push([cut[0], cut[1]]);
      else if (cut.length === 4) {
        const centreInside = (v[j * w + i] + v[j * w + i + 1] + v[(j + 1) * w + i + 1] + v[(j + 1) * w + i]) / 4 >= level;
        // Cut off the corners on the minority side of the centre: corner 00 sits between left and bottom, and so on.
        const cornerOff = centreInside ? !c00 : c00;
        if (cornerOff) segments.push([cut[3], cut[0]], [cut[1], cut[2]]);
        else segments.push([cut[0], cut[1]], [cut[2], cut[3]]);
      }
    }
  }
  return linkSegments(segments, points);
}

function linkSegments(segments: ReadonlyArray<[number, number]>, points: Map<number, [number, number]>): Array<Array<[number, number]>> {
  const byEdge = new Map<number, number[]>();
  segments.forEach(([a, b], s) => {
    for (const e of [a, b]) {
      const list = byEdge.get(e);
      if (list === undefined) byEdge.set(e, [s]);
      else list.push(s);
    }
  });
  const used = new Uint8Array(segments.length);
  const loops: Array<Array<[number, number]>> = [];
  for (let start = 0; start < segments.length; start++) {
    if (used[start]) continue;
    used[start] = 1;
    const first = segments[start][0];
    const loop: Array<[number, number]> = [points.get(first) as [number, number]];
    let edge = segments[start][1];
    while (edge !== first) {
      loop.push(points.get(edge) as [number, number]);
      const next = (byEdge.get(edge) as number[]).find((s) => !used[s]);
      if (next === undefined) break;
      used[next] = 1;
      edge = segments[next][0] === edge ? segments[next][1] : segments[next][0];
    }
    loops.push(loop);
  }
  return loops;
}
