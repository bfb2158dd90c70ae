import { escapeMarkup } from './escape-markup.js';

/**
 * A small label markup for axis and parameter names: `_x` or `_{...}` makes a
 * subscript, `^x` or `^{...}` a superscript, everything else is plain text
 * (unicode welcome: "σ_8", "k P_0(k)", "10^{-2}"). Braces do not nest.
 */
export interface RichTextSegment {
  text: string;
  shift: 'none' | 'sub' | 'sup';
}

export function parseRichText(markup: string): RichTextSegment[] {
  const segments: RichTextSegment[] = [];
  let plain = '';
  let i = 0;
  while (i < markup.length) {
    const c = markup[i];
    if ((c === '_' || c === '^') && i + 1 < markup.length) {
      let text: string;
      if (markup[i + 1] === '{') {
        const close = markup.indexOf('}', i + 2);
        const end = close === -1 ? markup.length : close;
        text = markup.slice(i + 2, end);
        i = end + 1;
      } else {
        const cp = markup.codePointAt(i + 1) as number;
        text = String.fromCodePoint(cp);
        i += 1 + text.length;
      }
      if (plain !== '') segments.push({ text: plain, shift: 'none' });
      plain = '';
      segments.push({ text, shift: c === '_' ? 'sub' : 'sup' });
    } else {
      plain += c;
      i += 1;
    }
  }
  if (plain !== '') segments.push({ text: plain, shift: 'none' });
  return segments;
}

/** The label as SVG text content: tspans shifted down or up by a third of the font size. */
export function richTextToSvg(markup: string): string {
  let out = '';
  let offset = 0; // current baseline shift in em
  for (const seg of parseRichText(markup)) {
    const target = seg.shift === 'sub' ? 0.3 : seg.shift === 'sup' ? -0.4 : 0;
    const dy = Number((target - offset).toFixed(2));
    offset = target;
    const size = seg.shift === 'none' ? '' : ' font-size="75%"';
    out += dy === 0 && size === '' ? escapeMarkup(seg.text) : `<tspan dy="${dy}em"${size}>${escapeMarkup(seg.text)}</tspan>`;
  }
  return out;
}

/** The label as HTML: <sub> and <sup>. */
export function richTextToHtml(markup: string): string {
  return parseRichText(markup)
    .map((seg) => {
      const text = escapeMarkup(seg.text);
      return seg.shift === 'sub' ? `<sub>${text}</sub>` : seg.shift === 'sup' ? `<sup>${text}</sup>` : text;
    })
    .join('');
}

/** Rough width of the rendered label in units of the font size (for layout, not typesetting). */
export function richTextWidthEm(markup: string): number {
  return parseRichText(markup).reduce((w, seg) => w + [...seg.text].length * (seg.shift === 'none' ? 0.58 : 0.44), 0);
}
