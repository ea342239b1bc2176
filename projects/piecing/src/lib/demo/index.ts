/* Demo pattern documents (invented, docs/design-notes.md#demo-data) and a generated pattern for benchmarks. */
export { buildOrchardWheel, ORCHARD_WHEEL_FABRICS } from './orchard-wheel';
export { buildGardenGate } from './garden-gate';
export { buildStressPattern, MAX_STRESS_PATCHES } from './stress-pattern';
export { orchardWheelQuilt, orchardWheelColourways } from './orchard-wheel-quilt';
