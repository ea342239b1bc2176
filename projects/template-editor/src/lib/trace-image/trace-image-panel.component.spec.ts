import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { readPatternDocument } from '@seamwright/piecing';
import { setReferenceImage } from '../core/public-api';
import { EditorSession } from '../session/editor-session';
import { TraceImagePanelComponent } from './trace-image-panel.component';

/** A 24 × 24 in. pattern tracing upload "up1" at (1, 2), 10 in. wide, 40 % opaque. */
function tracedPattern() {
  const doc = readPatternDocument({ formatVersion: 1, title: 'Traced', canvas: { widthIn: 24, heightIn: 24 } });
  return setReferenceImage(doc, 'up1', { origin: { x: 1, y: 2 }, widthIn: 10, opacity: 0.4 });
}

describe('TraceImagePanelComponent', () => {
  let fixture: ComponentFixture<TraceImagePanelComponent>;
  let session: EditorSession;
  let el: HTMLElement;

  const image = () => session.document().referenceImage;
  const render = async () => {
    fixture.detectChanges();
    await fixture.whenStable();
  };
  const button = (name: string) =>
    Array.from(el.querySelectorAll('button')).find((b) => (b.getAttribute('aria-label') ?? b.textContent ?? '').replace(/\s+/g, ' ').includes(name)) as HTMLButtonElement;
  const type = async (label: string, text: string) => {
    const input = el.querySelector(`input[aria-label="${label}"]`) as HTMLInputElement;
    input.value = text;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter' }));
    await render();
  };

  beforeEach(async () => {
    TestBed.configureTestingModule({ providers: [EditorSession] });
    session = TestBed.inject(EditorSession);
    session.load(tracedPattern());
    fixture = TestBed.createComponent(TraceImagePanelComponent);
    fixture.componentRef.setInput('session', session);
    el = fixture.nativeElement as HTMLElement;
    await render();
  });

  it('sets the opacity from its labelled slider, one undo step', async () => {
    const slider = el.querySelector('input[type=range]') as HTMLInputElement;
    expect((el.querySelector('label[for=trace-opacity]') as HTMLLabelElement).textContent).toBe('Opacity');
    expect(slider.value).toBe('40');
    slider.value = '70';
    slider.dispatchEvent(new Event('change'));
    await render();
    expect(image()?.opacity).toBe(0.7);
    expect(el.querySelector('output')?.textContent?.trim()).toBe('70 %');
    session.undo();
    expect(image()?.opacity).toBe(0.4);
  });

  it('moves by ⅛ in. with the nudge buttons and the arrow keys (a whole inch with Shift), and to a typed corner', async () => {
    button('Move right ⅛ in.').click();
    const pad = el.querySelector('[role=group][aria-label="Move trace image"]') as HTMLElement;
    pad.dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowUp', bubbles: true }));
    pad.dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowDown', shiftKey: true, bubbles: true }));
    await render();
    expect(image()?.origin).toEqual({ x: 1.125, y: 2.875 });
    expect(session.editor.store.undoDepth).toBe(3);
    await type('Left edge', '2 1/2');
    expect(image()?.origin).toEqual({ x: 2.5, y: 2.875 });
    expect(session.editor.store.undoDepth).toBe(4);
  });

  it('sets the scale from two points picked on the board and their typed distance', async () => {
    button('Set scale').click();
    await render();
    expect(fixture.componentInstance.picking()).toBe(true);
    expect(el.querySelector('[role=status]')?.textContent).toContain('Click a point on the traced image');
    fixture.componentInstance.pickAt({ x: 3, y: 4 });
    await render();
    expect(el.querySelector('[role=status]')?.textContent).toContain('Click the second point');
    fixture.componentInstance.pickAt({ x: 7, y: 7 });
    await render();
    const distance = el.querySelector('input[aria-label="True distance"]') as HTMLInputElement;
    expect(distance.value).toBe('5');
    // 5 in. on the image is 25.4 cm in truth: k = 10 / 5 = 2, so 10 in. → 20 in. wide, about (3, 4).
    await type('True distance', '25.4 cm');
    expect(image()?.widthIn).toBeCloseTo(20, 9);
    expect(image()?.origin.x).toBeCloseTo(-1, 9);
    expect(image()?.origin.y).toBeCloseTo(0, 9);
    expect(fixture.componentInstance.picking()).toBe(false);
    expect(session.editor.store.undoDepth).toBe(1);
  });

  it('removes the image; undo brings it back', async () => {
    button('Remove image').click();
    await render();
    expect(image()).toBeUndefined();
    expect(el.querySelector('input[type=range]')).toBeNull();
    session.undo();
    await render();
    expect(image()?.uploadId).toBe('up1');
    expect(el.querySelector('input[type=range]')).not.toBeNull();
  });
});
