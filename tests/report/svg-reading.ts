/**
 * Reading drawn SVG back the way a person reads a plot: tick labels give the
 * axis mapping, shapes give positions. Written for the tests, independent of
 * the plotting code.
 */
export interface DrawnText {
  x: number;
  y: number;
  anchor: string;
  text: string;
}

const attr = (tag: string, name: string): string | undefined => new RegExp(`\\s${name}="([^"]*)"`).exec(tag)?.[1];

export function drawnTexts(svg: string): DrawnText[] {
  return [...svg.matchAll(/<text([^>]*)>(.*?)<\/text>/g)].map((m) => ({
    x: Number(attr(m[1], 'x')),
    y: Number(attr(m[1], 'y')),
    anchor: attr(m[1], 'text-anchor') ?? 'start',
    text: m[2].replace(/<[^>]+>/g, '').replace(/\u2212/g, '-'),
  }));
}

/** Every element of the given kinds (e.g. "circle" or "circle|path"), in document order, as attribute maps with `tag`. */
export function drawnElements(svg: string, names: string): Array<Record<string, string>> {
  return [...svg.matchAll(new RegExp(`<(${names})\\s([^>]*?)/?>`, 'g'))].map((m) => {
    const out: Record<string, string> = { tag: m[1] };
    for (const a of m[2].matchAll(/([a-zA-Z0-9:-]+)="([^"]*)"/g)) out[a[1]] = a[2];
    return out;
  });
}

/** Sub-paths of path data made of M/L/Z commands, as point lists. */
export function pathPoints(d: string): Array<Array<[number, number]>> {
  const loops: Array<Array<[number, number]>> = [];
  for (const m of d.matchAll(/([MLZ])([^MLZ]*)/g)) {
    if (m[1] === 'Z') continue;
    const [x, y] = m[2].trim().split(/\s+/).map(Number);
    if (m[1] === 'M') loops.push([]);
    loops[loops.length - 1].push([x, y]);
  }
  return loops;
}

/** A linear map value -> pixel fitted through tick (value, pixel) pairs; throws if they are not collinear. */
export function axisFromTicks(ticks: ReadonlyArray<{ value: number; pixel: number }>): { toPixel(v: number): number; toValue(p: number): number } {
  if (ticks.length < 2) throw new Error(`need two ticks, got ${ticks.length}`);
  const a = ticks[0];
  const b = ticks[ticks.length - 1];
  const slope = (b.pixel - a.pixel) / (b.value - a.value);
  for (const t of ticks) {
    if (Math.abs(a.pixel + slope * (t.value - a.value) - t.pixel) > 0.03) throw new Error('tick labels are not evenly spaced');
  }
  return { toPixel: (v) => a.pixel + slope * (v - a.value), toValue: (p) => a.value + (p - a.pixel) / slope };
}

/** x-axis ticks: centred labels, value read from the text, pixel from its x. */
export function xTicks(svg: string, keep: (t: DrawnText) => boolean): Array<{ value: number; pixel: number }> {
  return drawnTexts(svg)
    .filter((t) => t.anchor === 'middle' && keep(t) && /^-?[0-9.]+$/.test(t.text))
    .map((t) => ({ value: Number(t.text), pixel: t.x }));
}

/** y-axis ticks: right-aligned labels drawn 4 px below their tick. */
export function yTicks(svg: string, keep: (t: DrawnText) => boolean): Array<{ value: number; pixel: number }> {
  return drawnTexts(svg)
    .filter((t) => t.anchor === 'end' && keep(t) && /^-?[0-9.]+$/.test(t.text))
    .map((t) => ({ value: Number(t.text), pixel: t.y - 4 }))
    .sort((p, q) => p.value - q.value);
}
