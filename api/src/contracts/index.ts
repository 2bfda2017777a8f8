export * from './roles.js';
export * from './users.js';
export * from './errors.js';
export * from './registry.js';
