// SVG plots (each a plain function of its input returning one SVG string) and
// the self-contained HTML report. Labels use a small markup: "b_1", "σ_8", "k^{-1}".
export * from './plots/corner-plot.js';
export * from './plots/multipole-plot.js';
export * from './plots/bispectrum-plot.js';
export * from './plots/triangle-shape-map.js';
export * from './plots/trace-plot.js';
export * from './plots/line-plot.js';
export * from './plots/fisher-ellipse-plot.js';
export { TRIANGLE_SHAPE_CLASSES, type TriangleShapeClass } from './plots/shape-classes.js';
export { credibleContours, type CredibleContour } from './stats/credible-contours.js';
export { covarianceEllipse, deltaChiSquareTwoDof, ONE_SIGMA_MASS, TWO_SIGMA_MASS } from './stats/covariance-ellipse.js';
export type * from './html/report-input.js';
export { renderReportHtml } from './html/render-report.js';
export { RHAT_LIMIT, ESS_MINIMUM } from './html/summary-table.js';
