import { countAtLeast, patternProgress, stageFraction } from './sewing-progress';
import type { SewingStage } from '../../core/api-types';

describe('sewing progress', () => {
  const ids = ['a', 'b', 'c', 'd'];

  it('counts each stage as a third of the way', () => {
    expect([stageFraction(null), stageFraction('cut'), stageFraction('sewn'), stageFraction('trimmed')]).toEqual([0, 1 / 3, 2 / 3, 1]);
  });

  it('averages over every section of the pattern, unlogged ones as zero', () => {
    const stages = new Map<string, SewingStage>([
      ['a', 'trimmed'],
      ['b', 'sewn'],
    ]);
    expect(patternProgress(ids, stages)).toBeCloseTo((1 + 2 / 3) / 4, 12);
    expect(countAtLeast(ids, stages, 'sewn')).toBe(2);
    expect(countAtLeast(ids, stages, 'trimmed')).toBe(1);
  });

  it('ignores log entries of sections no longer in the pattern', () => {
    expect(patternProgress(['a'], new Map([['gone', 'trimmed' as SewingStage]]))).toBe(0);
    expect(patternProgress([], new Map())).toBe(0);
  });
});
