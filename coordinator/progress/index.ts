export * from './progress.js';
