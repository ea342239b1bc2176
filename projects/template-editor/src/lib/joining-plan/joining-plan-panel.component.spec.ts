import { TestBed } from '@angular/core/testing';
import { Component, signal } from '@angular/core';
import { ComponentHarness, HarnessLoader, HarnessPredicate, TestKey } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { readPatternDocument, type PatternDocument } from '@seamwright/piecing';
import type { BoardHighlight } from '../core/public-api';
import { EditorSession } from '../session/editor-session';
import { JoiningPlanPanelComponent } from './joining-plan-panel.component';

const square = (id: string, label: string, x: number, y: number) => ({
  id,
  label,
  geometry: { kind: 'straight' as const, vertices: [{ x, y }, { x: x + 4, y }, { x: x + 4, y: y + 4 }, { x, y: y + 4 }] },
});

/** Four 4 in. squares, A B over C D. */
function squares(steps?: NonNullable<PatternDocument['joiningPlan']>['steps']): PatternDocument {
  return readPatternDocument({
    formatVersion: 2,
    title: 'Rows',
    canvas: { widthIn: 8, heightIn: 8 },
    sections: [square('a', 'A', 0, 0), square('b', 'B', 4, 0), square('c', 'C', 0, 4), square('d', 'D', 4, 4)],
    ...(steps ? { joiningPlan: { steps } } : {}),
  });
}

/** The designer's plan: the two rows (A to B, C to D), then row to row. */
const rowPlan = () =>
  squares([
    { id: 'row-1', kind: 'join', a: 'a', b: 'b', press: 'a' },
    { id: 'row-2', kind: 'join', a: 'c', b: 'd', press: 'b' },
    { id: 'rows', kind: 'join', a: 'row-1', b: 'row-2', press: 'open' },
  ]);

/** One join of the list, by its step id: the button that names it. */
class JoinStepHarness extends ComponentHarness {
  static hostSelector = 'button.name';
  static forStep(id: string): HarnessPredicate<JoinStepHarness> {
    return new HarnessPredicate(JoinStepHarness, { selector: `[data-step-id="${id}"] button.name` });
  }
  async press(modifiers: { alt?: boolean }, key: TestKey): Promise<void> {
    await (await this.host()).sendKeys(modifiers, key);
  }
  async click(): Promise<void> {
    await (await this.host()).click();
  }
}

/** The panel's disclosure button. */
class DisclosureHarness extends ComponentHarness {
  static hostSelector = 'button.disclosure';
  async click(): Promise<void> {
    await (await this.host()).click();
  }
}

@Component({
  imports: [JoiningPlanPanelComponent],
  providers: [EditorSession],
  template: `<sw-joining-plan-panel (highlightChange)="highlights.push($event); last.set($event)" />`,
})
class HostComponent {
  readonly highlights: Array<BoardHighlight | null> = [];
  readonly last = signal<BoardHighlight | null>(null);
}

async function setUp(doc: PatternDocument) {
  const fixture = TestBed.createComponent(HostComponent);
  const session = fixture.debugElement.children[0].injector.get(EditorSession);
  session.load(doc);
  fixture.detectChanges();
  await fixture.whenStable();
  const loader: HarnessLoader = TestbedHarnessEnvironment.loader(fixture);
  const el = fixture.nativeElement as HTMLElement;
  await (await loader.getHarness(DisclosureHarness)).click();
  const steps = () => [...el.querySelectorAll('ol[aria-label="Joins in sewing order"] > li')].map((li) => li.getAttribute('data-step-id'));
  const stepButton = (id: string) => el.querySelector<HTMLButtonElement>(`[data-step-id="${id}"] button.name`)!;
  return { fixture, session, loader, el, steps, stepButton };
}

// Harness steps are slow on a busy two-core machine; the default 5 s is too short for a whole story.
describe('JoiningPlanPanelComponent', { timeout: 30_000 }, () => {
  it('lists the joins in order with their pressing, and moves one by Alt+↑ with focus kept on it', async () => {
    const { session, loader, el, steps, stepButton, fixture } = await setUp(rowPlan());
    expect(steps()).toEqual(['row-1', 'row-2', 'rows']);
    expect(stepButton('row-1').textContent).toContain('Join A to B');
    expect(stepButton('row-1').textContent).toContain('Press the seam toward A');
    expect(el.querySelector('[data-testid="plan-source"]')!.textContent).toContain('Your joining plan.');

    const second = await loader.getHarness(JoinStepHarness.forStep('row-2'));
    await second.press({ alt: true }, TestKey.UP_ARROW);
    await fixture.whenStable();
    expect(session.document().joiningPlan!.steps.map((s) => s.id)).toEqual(['row-2', 'row-1', 'rows']);
    expect(steps()).toEqual(['row-2', 'row-1', 'rows']);
    expect(document.activeElement).toBe(stepButton('row-2'));
    expect(session.editor.store.undoDepth).toBe(1);

    // ↓ moves focus to the next join without changing the plan.
    await second.press({}, TestKey.DOWN_ARROW);
    expect(document.activeElement).toBe(stepButton('row-1'));
    expect(session.document().joiningPlan!.steps.map((s) => s.id)).toEqual(['row-2', 'row-1', 'rows']);
  });

  it('refuses to join the rows before the second row is made, and says why', async () => {
    const { session, loader, el, fixture } = await setUp(rowPlan());
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Move join 3 up"]' }))).click();
    fixture.detectChanges();
    expect(session.document().joiningPlan!.steps.map((s) => s.id)).toEqual(['row-1', 'row-2', 'rows']);
    expect(el.querySelector('[role="status"]')!.textContent).toMatch(/Join 3 cannot move up: Step 2: .*not made yet/);
    expect(session.editor.store.undoDepth).toBe(0);
    const first = await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Move join 1 up"]' }));
    expect(await first.isDisabled()).toBe(true);
  });

  it('sets a join’s pressing as one undo step', async () => {
    const { session, loader } = await setUp(rowPlan());
    const select = await loader.getHarness(MatSelectHarness.with({ ancestor: '[data-step-id="row-1"]' }));
    expect(await select.getValueText()).toBe('Toward A');
    await select.open();
    expect(await Promise.all((await select.getOptions()).map((o) => o.getText()))).toEqual(['Toward A', 'Toward B', 'Open']);
    await select.clickOptions({ text: 'Toward B' });
    expect(session.document().joiningPlan!.steps[0]).toMatchObject({ id: 'row-1', press: 'b' });
    expect(session.editor.store.undoDepth).toBe(1);
    session.undo();
    expect(session.document().joiningPlan!.steps[0].press).toBe('a');
  });

  it('offers the proposed plan to take as one’s own, then to go back to', async () => {
    const { session, loader, el } = await setUp(squares());
    expect(el.querySelector('[data-testid="plan-source"]')!.textContent).toContain('Proposed by Seamwright');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Use this plan' }))).click();
    expect(session.document().joiningPlan!.steps.length).toBeGreaterThan(0);
    expect(session.editor.store.undoDepth).toBe(1);
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Use this plan' }))).toHaveLength(0);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Go back to the proposed plan' }))).click();
    expect(session.document().joiningPlan).toBeUndefined();
  });

  it('names an inset seam with its parts, and choosing a join points at its seam on the board', async () => {
    // A to B, then C onto them, then D into the corner they leave: D meets both along an edge that turns.
    const { fixture, loader, el } = await setUp(
      squares([
        { id: 'j1', kind: 'join', a: 'a', b: 'b', press: 'a' },
        { id: 'j2', kind: 'join', a: 'j1', b: 'c', press: 'a' },
        { id: 'j3', kind: 'join', a: 'j2', b: 'd', press: 'open' },
      ]),
    );
    const problems = el.querySelector('ul[aria-labelledby="sw-joining-problems"]')!;
    expect(problems.textContent).toContain('Inset seam:');
    expect(problems.textContent).toMatch(/D.*\(4, 4\)/);
    expect(el.querySelector('[data-step-id="j3"]')!.textContent).toContain('has a problem');

    const host = fixture.componentInstance;
    await (await loader.getHarness(JoinStepHarness.forStep('j1'))).click();
    fixture.detectChanges();
    // A and B meet along x = 4 from the top to y = 4.
    const seam = host.last()!.paths[0].map((p) => [p.x, p.y]);
    expect(seam.sort()).toEqual([[4, 0], [4, 4]]);
    await (await loader.getHarness(DisclosureHarness)).click();
    fixture.detectChanges();
    expect(host.last()).toBeNull();
  });
});
