/**
 * Property tests (fast-check) draw from one seed per run. On CI the seed is fixed, so a run on main
 * cannot fail on a counterexample no change introduced; elsewhere it is fresh each run, so local runs
 * keep exploring. FC_SEED replays any run: fast-check prints the seed of a failing property.
 */
import fc from 'fast-check';

const raw = process.env['FC_SEED'];
const seed = raw && /^-?\d+$/.test(raw) ? Number(raw) : process.env['CI'] ? 20_261_205 : undefined;
if (seed !== undefined) fc.configureGlobal({ ...fc.readConfigureGlobal(), seed });
