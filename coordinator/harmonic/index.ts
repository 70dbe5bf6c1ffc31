export * from './partition-function.js';
export * from './spectrum.js';
export * from './log-capacity.js';
export * from './probe-analysis.js';
export * from './ensemble-intervals.js';
export * from './probe-input.js';
export * from './measure-picture.js';
export * from './probe-run.js';
