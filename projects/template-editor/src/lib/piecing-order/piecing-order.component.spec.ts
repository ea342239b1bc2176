import { TestBed } from '@angular/core/testing';
import { readPatternDocument } from '@seamwright/piecing';
import { addSection, addSeam, setPiecingOrder } from '../core/public-api';
import { EditorSession } from '../session/editor-session';
import { PiecingOrderComponent } from './piecing-order.component';

const C = { x: 12, y: 12 };
const polar = (r: number, deg: number) => ({ x: C.x + r * Math.cos((deg * Math.PI) / 180), y: C.y + r * Math.sin((deg * Math.PI) / 180) });

function setUp() {
  TestBed.configureTestingModule({ providers: [EditorSession] });
  const session = TestBed.inject(EditorSession);
  const analysis = session.editor.analysis;
  let doc = readPatternDocument({ formatVersion: 1, title: 'Order', canvas: { widthIn: 24, heightIn: 24 }, fabrics: [] });
  const added = addSection(doc, { kind: 'arc', centre: C, innerRadiusIn: 5, outerRadiusIn: 8, startAngleDeg: 0, sweepDeg: 90 }, analysis);
  doc = added.document;
  for (const deg of [22.5, 45, 67.5]) doc = addSeam(doc, added.sectionId, polar(5, deg), polar(8, deg), analysis);
  const indexAt = (deg: number) => session.editor.analysis.patchAt(doc.sections[0], polar(6.5, deg))!.index;
  doc = setPiecingOrder(doc, added.sectionId, [10, 30, 55, 80].map(indexAt), analysis);
  session.load(doc);
  session.editor.store.select({ sectionId: added.sectionId });
  const fixture = TestBed.createComponent(PiecingOrderComponent);
  fixture.detectChanges();
  return { fixture, session, indexAt, sectionId: added.sectionId };
}

describe('PiecingOrderComponent', () => {
  it('lists the patches in sewing order and says the order can be sewn', () => {
    const { fixture } = setUp();
    const el = fixture.nativeElement as HTMLElement;
    const items = [...el.querySelectorAll('li')].map((li) => li.getAttribute('data-label'));
    expect(items).toEqual(['A1', 'A2', 'A3', 'A4']);
    expect(el.querySelector('[data-testid="sewability"]')?.textContent).toContain('can be sewn in this order');
  });

  it('warns in words when a reorder breaks the order, and one action makes it sewable again', async () => {
    const { fixture, session } = setUp();
    const el = fixture.nativeElement as HTMLElement;
    // A2 later, twice: order A1, A3, A4, A2 — A3 (at 55°) shares no seam with A1 (at 10°).
    (el.querySelector('button[aria-label="Sew A2 later"]') as HTMLButtonElement).click();
    fixture.detectChanges();
    const verdict = el.querySelector('[data-testid="sewability"]')!;
    expect(verdict.getAttribute('role')).toBe('alert');
    expect(verdict.textContent).toMatch(/cannot be sewn in this order at A2: A2 shares no seam/);
    expect(session.canUndo()).toBe(true);
    const find = [...el.querySelectorAll('button')].find((b) => b.textContent?.includes('Find a sewable order'))!;
    find.click();
    fixture.detectChanges();
    expect(el.querySelector('[data-testid="sewability"]')?.textContent).toContain('can be sewn in this order');
  });
});
