export {};
export * from './fisher/index.js';
