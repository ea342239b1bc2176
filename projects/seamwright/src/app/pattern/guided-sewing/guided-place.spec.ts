import { buildGardenGate } from '@seamwright/piecing';
import { buildSewingGuide } from './sewing-guide';
import { firstPlace, nextPlace, placeIfValid, previousPlace, ticksOnFinishing } from './guided-place';
import { stepTitle } from './step-title';
import { JOINS_PART, type GuidedPlace, type SewingGuide } from './sewing-guide-types';

describe('guided place', () => {
  // Garden Gate: sections A, B, C of 3 patches each (3 piecing steps + trim), made 4 times; the default
  // joining plan joins B to A, then C, so B comes first.
  const guide = buildSewingGuide(buildGardenGate());
  const [a, b] = guide.sections.map((s) => s.id);

  it('takes the sections in joining order', () => {
    expect(guide.sections.map((s) => s.label)).toEqual(['B', 'A', 'C']);
  });

  it('goes through the steps, then the next copy, then the next section', () => {
    let p: GuidedPlace | null = firstPlace(guide)!;
    expect(p).toEqual({ part: a, copy: 1, step: 0 });
    const seen: string[] = [];
    for (let i = 0; i < 5; i++) {
      seen.push(stepTitle(guide, p!));
      p = nextPlace(guide, p!);
    }
    expect(seen).toEqual(['Step 1 of 4: add B1', 'Step 2 of 4: add B2', 'Step 3 of 4: add B3', 'Step 4 of 4: trim section B', 'Step 1 of 4: add B1']);
    expect(p).toEqual({ part: a, copy: 2, step: 1 });
    expect(nextPlace(guide, { part: a, copy: 4, step: 3 })).toEqual({ part: b, copy: 1, step: 0 });
    expect(previousPlace(guide, { part: b, copy: 1, step: 0 })).toEqual({ part: a, copy: 4, step: 3 });
    expect(previousPlace(guide, firstPlace(guide)!)).toBeNull();
  });

  it('ticks pieced on a copy\'s last patch and trimmed on its trim, nothing before', () => {
    expect(ticksOnFinishing(guide, { part: a, copy: 3, step: 1 })).toEqual([]);
    expect(ticksOnFinishing(guide, { part: a, copy: 3, step: 2 })).toEqual([{ sectionId: a, copy: 3, stage: 'pieced' }]);
    expect(ticksOnFinishing(guide, { part: a, copy: 3, step: 3 })).toEqual([{ sectionId: a, copy: 3, stage: 'trimmed' }]);
  });

  it('a join ticks the ring copies of its block joined', () => {
    const ring: SewingGuide = {
      ...guide,
      blockCount: 2,
      sections: [{ ...guide.sections[0], id: 'ring', copies: 16, ringCount: 8 }],
      joins: [{ number: 1, kind: 'ring', label: 'Join the 8 copies of B into a ring', partA: 'B', partB: 'B', sectionIds: ['ring'], seamPaths: [], seamText: '', press: '', marks: [] }],
    };
    const ticks = ticksOnFinishing(ring, { part: JOINS_PART, copy: 2, step: 0 });
    expect(ticks.map((t) => t.copy)).toEqual([9, 10, 11, 12, 13, 14, 15, 16]);
    expect(new Set(ticks.map((t) => t.stage))).toEqual(new Set(['joined']));
  });

  it('takes a stored place back only while it fits the pattern', () => {
    expect(placeIfValid(guide, { part: b, copy: 4, step: 3 })).toEqual({ part: b, copy: 4, step: 3 });
    expect(placeIfValid(guide, { part: b, copy: 5, step: 0 })).toBeNull();
    expect(placeIfValid(guide, { part: b, copy: 1, step: 4 })).toBeNull();
    expect(placeIfValid(guide, { part: 'gone', copy: 1, step: 0 })).toBeNull();
    expect(placeIfValid(guide, 'junk')).toBeNull();
  });
});
