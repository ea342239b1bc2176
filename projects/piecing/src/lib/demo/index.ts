/* Demo pattern documents (invented, design.md §8) and a generated pattern for benchmarks. */
export { buildOrchardWheel, ORCHARD_WHEEL_FABRICS } from './orchard-wheel';
export { buildGardenGate } from './garden-gate';
export { buildStressPattern, MAX_STRESS_PATCHES } from './stress-pattern';
