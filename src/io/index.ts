export * from './json-with-lines.js';
export * from './package-version.js';
