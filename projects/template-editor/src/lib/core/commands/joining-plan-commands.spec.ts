import { buildOrchardWheel, checkJoiningPlan, defaultJoiningPlan, readPatternDocument, type PatternDocument } from '@seamwright/piecing';
import { describe, expect, it } from 'vitest';
import { DocumentStore } from '../store/document-store';
import {
  adoptDefaultJoiningPlan,
  currentJoiningPlan,
  joiningStepMoveProblem,
  moveJoiningStep,
  resetJoiningPlan,
  setJoiningStepPress,
} from './joining-plan-commands';

const square = (id: string, label: string, x: number, y: number) => ({
  id,
  label,
  geometry: { kind: 'straight' as const, vertices: [{ x, y }, { x: x + 4, y }, { x: x + 4, y: y + 4 }, { x, y: y + 4 }] },
});

/** Four 4 in. squares, A B over C D, joined in two rows (A to B, C to D) and then row to row. */
function rows(): PatternDocument {
  return readPatternDocument({
    formatVersion: 2,
    title: 'Rows',
    canvas: { widthIn: 8, heightIn: 8 },
    sections: [square('a', 'A', 0, 0), square('b', 'B', 4, 0), square('c', 'C', 0, 4), square('d', 'D', 4, 4)],
    joiningPlan: {
      steps: [
        { id: 'row-1', kind: 'join', a: 'a', b: 'b', press: 'a' },
        { id: 'row-2', kind: 'join', a: 'c', b: 'd', press: 'b' },
        { id: 'rows', kind: 'join', a: 'row-1', b: 'row-2', press: 'open' },
      ],
    },
  });
}

const order = (doc: PatternDocument) => currentJoiningPlan(doc).steps.map((s) => s.id);

describe('joining plan commands', () => {
  it('moves a join that needs nothing made by the one before it, and the plan stays sound', () => {
    const doc = rows();
    expect(checkJoiningPlan(doc, doc.joiningPlan!)).toEqual([]);
    const moved = moveJoiningStep(doc, 'row-2', -1);
    expect(order(moved)).toEqual(['row-2', 'row-1', 'rows']);
    expect(checkJoiningPlan(moved, moved.joiningPlan!)).toEqual([]);
    expect(order(moveJoiningStep(moved, 'row-2', 1))).toEqual(['row-1', 'row-2', 'rows']);
  });

  it('refuses a move that puts a join before the unit it needs, or off the list, and says why', () => {
    const doc = rows();
    // Joining the rows before the second row is sewn would name a unit not made yet.
    expect(moveJoiningStep(doc, 'rows', -1)).toBe(doc);
    const why = joiningStepMoveProblem(doc, 'rows', -1);
    // piecing's check names the step and the unit it needs (wording from checkJoiningPlan).
    expect(why).toMatch(/^Step 2: .*unit of step 3.*not made yet/);
    expect(joiningStepMoveProblem(doc, 'row-1', -1)).toBe('it is the first join already');
    expect(joiningStepMoveProblem(doc, 'rows', 1)).toBe('it is the last join already');
    expect(moveJoiningStep(doc, 'row-1', -1)).toBe(doc);
    expect(joiningStepMoveProblem(doc, 'no-such-step', 1)).toBe('there is no such join in the plan');
  });

  it('sets how a join is pressed, only to a pressing its kind has', () => {
    const doc = rows();
    const pressed = setJoiningStepPress(doc, 'row-1', 'open');
    expect(pressed.joiningPlan!.steps[0]).toEqual({ id: 'row-1', kind: 'join', a: 'a', b: 'b', press: 'open' });
    // A pair join is pressed toward a part or open, never round a ring.
    expect(setJoiningStepPress(doc, 'row-1', 'clockwise')).toBe(doc);
    expect(setJoiningStepPress(doc, 'row-1', 'a')).toBe(doc);
    expect(setJoiningStepPress(doc, 'nothing', 'a')).toBe(doc);
  });

  it('takes the default plan as the designer’s own, and goes back to the default', () => {
    const wheel = buildOrchardWheel();
    expect(wheel.joiningPlan).toBeUndefined();
    const adopted = adoptDefaultJoiningPlan(wheel);
    expect(adopted.joiningPlan!.steps).toEqual(defaultJoiningPlan(wheel).steps);
    expect(adoptDefaultJoiningPlan(adopted)).toBe(adopted);
    expect(resetJoiningPlan(adopted).joiningPlan).toBeUndefined();
    expect(resetJoiningPlan(wheel)).toBe(wheel);
  });

  it('moving or pressing a join of the default plan makes it the designer’s in the same undo step', () => {
    const wheel = buildOrchardWheel();
    const steps = defaultJoiningPlan(wheel).steps;
    // The default joins the ring copies first; two rings need nothing from each other.
    expect(steps[0].kind).toBe('ring');
    expect(steps[1].kind).toBe('ring');
    const store = new DocumentStore(wheel);
    store.apply('Move join', (d) => moveJoiningStep(d, steps[1].id, -1));
    expect(store.document.joiningPlan!.steps.map((s) => s.id).slice(0, 2)).toEqual([steps[1].id, steps[0].id]);
    store.apply('Join pressing', (d) => setJoiningStepPress(d, steps[0].id, 'anticlockwise'));
    expect(store.document.joiningPlan!.steps.find((s) => s.id === steps[0].id)!.press).toBe('anticlockwise');
    expect(store.undoDepth).toBe(2);
    store.undo();
    store.undo();
    expect(store.document.joiningPlan).toBeUndefined();
  });
});
