import { describe, expect, it } from 'vitest';
import { buildOrchardWheel } from '../demo/orchard-wheel';
import { buildCuttingList } from '../fabrication/cutting-list/build-cutting-list';
import { applyFabricChoice } from './fabric-choice';
import { quiltPlan } from './quilt-plan';

describe('applyFabricChoice', () => {
  it('renames and recolours the named slots and keeps ids, usable WOF and the rest', () => {
    const doc = buildOrchardWheel();
    const out = applyFabricChoice(doc, { plum: { name: 'My aubergine', colour: '#40203a' }, nope: { name: 'Ghost', colour: '#000000' } });
    expect(out.fabrics.map((f) => [f.id, f.name, f.colour, f.usableWofIn])).toEqual([
      ['plum', 'My aubergine', '#40203a', 42],
      ['oat', 'Oat', '#e9dcc1', 42],
      ['sage', 'Sage', '#9aae8c', 42],
      ['marigold', 'Marigold', '#e2a03a', 41],
      ['ink', 'Ink', '#262b3d', 42],
    ]);
    expect(out.sections).toBe(doc.sections);
    expect(doc.fabrics[0].name).toBe('Plum');
  });

  it('does not read inherited keys as slots', () => {
    const doc = { fabrics: [{ id: 'constructor', name: 'Plain', colour: '#ffffff', usableWofIn: 42 }] };
    expect(applyFabricChoice(doc, {}).fabrics[0].name).toBe('Plain');
  });

  it('the cutting list and the quilt plan follow the chosen names with the same yardage', () => {
    const doc = buildOrchardWheel();
    const chosen = applyFabricChoice(doc, { ink: { name: 'Charcoal linen', colour: '#333333' } });
    const before = quiltPlan(doc, { sizeName: 'Bed 3 × 3' });
    const after = quiltPlan(chosen, { sizeName: 'Bed 3 × 3' });
    expect(after.fabrics.find((f) => f.id === 'ink')?.name).toBe('Charcoal linen');
    expect(after.fabrics.map((f) => f.yards)).toEqual(before.fabrics.map((f) => f.yards));
    const names = new Set(buildCuttingList(chosen).fabrics.map((f) => f.name));
    expect(names.has('Charcoal linen')).toBe(true);
    expect(names.has('Ink')).toBe(false);
  });
});
