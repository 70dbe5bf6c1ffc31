export * from './cluster-snapshot.js';
