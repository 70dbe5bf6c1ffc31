export * from './palette.js';
export * from './cluster-picture.js';
