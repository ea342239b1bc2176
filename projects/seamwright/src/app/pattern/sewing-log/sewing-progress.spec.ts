import { copiesAtLeast, copiesOf, copyKey, laterStage, patternProgress, stagesFromEntries, stepsDone, totalSteps } from './sewing-progress';
import type { SewingStage } from '../../core/api-types';

describe('sewing progress per copy', () => {
  // 8 ring copies of B and one A: 9 things to sew, 3 stages each (docs/api.md#sewing-log-per-user-per-pattern).
  const sections = [
    { id: 'a', copies: 1 },
    { id: 'b', copies: 8 },
  ];

  it('counts copies as ring repeats × blocks', () => {
    expect(copiesOf({ ringRepeat: { count: 8 } }, 1)).toBe(8);
    expect(copiesOf({ ringRepeat: { count: 8 } }, 4)).toBe(32);
    expect(copiesOf({}, 4)).toBe(4);
    expect(copiesOf({}, 1)).toBe(1);
  });

  it('makes progress the share of all stages of all copies: 9 × 3 = 27', () => {
    expect(totalSteps(sections)).toBe(27);
    const stages = stagesFromEntries([
      { sectionId: 'b', copy: 1, stage: 'pieced' },
      { sectionId: 'b', copy: 2, stage: 'trimmed' },
      { sectionId: 'a', copy: 1, stage: 'joined' },
    ]);
    // 1 + 2 + 3 = 6 of 27.
    expect(stepsDone(sections, stages)).toBe(6);
    expect(patternProgress(sections, stages)).toBeCloseTo(6 / 27, 12);
    expect(copiesAtLeast(sections, stages, 'pieced')).toBe(3);
    expect(copiesAtLeast(sections, stages, 'trimmed')).toBe(2);
    expect(copiesAtLeast([sections[1]], stages, 'pieced')).toBe(2);
  });

  it('one copy of B pieced moves the pattern by 1/27, not by a ninth of B', () => {
    const one = new Map<string, SewingStage>([[copyKey('b', 5), 'pieced']]);
    expect(patternProgress(sections, one)).toBeCloseTo(1 / 27, 12);
  });

  it('ignores copies and sections no longer in the pattern', () => {
    const stale = new Map<string, SewingStage>([
      [copyKey('b', 9), 'joined'],
      [copyKey('gone', 1), 'joined'],
    ]);
    expect(patternProgress(sections, stale)).toBe(0);
    expect(patternProgress([], new Map())).toBe(0);
  });

  it('never moves a copy back', () => {
    expect(laterStage('trimmed', 'pieced')).toBe('trimmed');
    expect(laterStage(undefined, 'pieced')).toBe('pieced');
    expect(laterStage('pieced', 'joined')).toBe('joined');
  });
});
