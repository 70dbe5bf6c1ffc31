export * from './palette.js';
export * from './cluster-picture.js';
export * from './spheres-picture.js';
export * from './model-picture.js';
