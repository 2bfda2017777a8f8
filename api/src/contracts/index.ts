export * from './roles.js';
export * from './users.js';
export * from './errors.js';
export * from './registry.js';
export * from './ingest.js';
export * from './twin.js';
export * from './alerts.js';
export * from './backtests.js';
