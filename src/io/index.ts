export * from './json-with-lines.js';
