import { FONT_FAMILY } from '../svg/svg-document.js';

/** The report's only stylesheet, inlined into its <head>. */
export const REPORT_CSS = `
body { font-family: ${FONT_FAMILY}; color: #222; background: #fafafa; margin: 0; }
main { max-width: 980px; margin: 0 auto; padding: 24px 28px 48px; background: #fff; }
h1 { font-size: 1.6em; margin: 0 0 4px; }
h2 { font-size: 1.2em; margin: 32px 0 10px; border-bottom: 1px solid #ddd; padding-bottom: 4px; }
p.subtitle { color: #666; margin: 0 0 16px; }
dl.assumptions { display: grid; grid-template-columns: max-content 1fr; gap: 4px 18px; margin: 0; }
dl.assumptions dt { font-weight: bold; }
dl.assumptions dd { margin: 0; white-space: pre-wrap; }
table { border-collapse: collapse; font-size: 0.92em; }
th, td { padding: 4px 10px; text-align: right; border-bottom: 1px solid #e4e4e4; }
th { background: #f2f2f2; }
th:first-child, td:first-child { text-align: left; }
td.flag { color: #b33c00; font-weight: bold; }
figure { margin: 24px 0; }
figure svg { max-width: 100%; height: auto; display: block; }
figcaption { color: #444; font-size: 0.92em; margin-top: 6px; max-width: 820px; }
p.legend-note { color: #666; font-size: 0.88em; }
`;
