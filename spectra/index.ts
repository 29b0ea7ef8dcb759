// Public surface of the spectral library. Only re-exports live here (a test snapshots this list).
export * from './errors';
export * from './grid';
export * from './panel';
