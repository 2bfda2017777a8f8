// the pool every process uses, from the lower package so that the simulator shares it
export { createPgPool } from '@shadowloop/simulator/pg-pool';
