import { TestBed } from '@angular/core/testing';
import { EditorSession } from '../session/editor-session';
import { BoardToolbarComponent } from './board-toolbar.component';

function setUp() {
  TestBed.configureTestingModule({ providers: [EditorSession] });
  const fixture = TestBed.createComponent(BoardToolbarComponent);
  fixture.detectChanges();
  return { fixture, session: TestBed.inject(EditorSession), el: fixture.nativeElement as HTMLElement };
}

describe('BoardToolbarComponent', () => {
  it('offers every tool with its key and switches the board to the one pressed', () => {
    const { fixture, session, el } = setUp();
    const titles = [...el.querySelectorAll('mat-button-toggle[data-tool]')].map((t) => t.getAttribute('title'));
    expect(titles).toEqual([
      'Select (V)',
      'Pan (H)',
      'Straight section (S)',
      'Arc section (A)',
      'Wedge section (W)',
      'Split (L)',
      'Ring repeat (R)',
      'Fabric fill (F)',
      'Strip set (T)',
      'Renumber (N)',
      'Delete (D)',
    ]);
    (el.querySelector('mat-button-toggle[data-tool="wedge"] button') as HTMLButtonElement).click();
    fixture.detectChanges();
    expect(session.toolId()).toBe('wedge');
  });

  it('turns the seam allowance preview and the mirrored view on and off', () => {
    const { fixture, session, el } = setUp();
    const toggle = (name: string) => [...el.querySelectorAll('mat-slide-toggle')].find((t) => t.textContent?.includes(name))!.querySelector('button')!;
    toggle('Seam allowance').click();
    fixture.detectChanges();
    expect(session.settings().showSeamAllowance).toBe(true);
    toggle('Mirrored').click();
    fixture.detectChanges();
    expect(session.settings().mirrored).toBe(true);
    expect(session.editor.viewport.mirrored).toBe(true);
  });

  it('switches the board to centimetres with the 0.5 cm snap', () => {
    const { fixture, session, el } = setUp();
    const cm = [...el.querySelectorAll('mat-button-toggle')].find((t) => t.textContent?.trim() === 'cm')!.querySelector('button')!;
    cm.click();
    fixture.detectChanges();
    expect(session.settings().unit).toBe('cm');
    expect(session.settings().grid).toBe('half-cm');
  });

  it('shows no snap controls on a read-only board, and keeps the view controls', () => {
    const { fixture, session, el } = setUp();
    const labels = () => [...el.querySelectorAll('mat-slide-toggle')].map((t) => t.textContent?.trim());
    expect(labels()).toEqual(['Snap to points', 'Snap angles', 'Seam allowance', 'Mirrored']);
    expect(el.querySelector('mat-select[aria-label="Grid snap"]')).not.toBeNull();
    session.editor.setReadOnly(true);
    fixture.detectChanges();
    expect(labels()).toEqual(['Seam allowance', 'Mirrored']);
    expect(el.querySelector('mat-select[aria-label="Grid snap"]')).toBeNull();
    expect(el.querySelector('button[aria-label="Zoom in"]')).not.toBeNull();
  });

  it('zooms in and out about the middle of the board', () => {
    const { fixture, session, el } = setUp();
    const before = session.editor.viewport.scale;
    (el.querySelector('button[aria-label="Zoom in"]') as HTMLButtonElement).click();
    fixture.detectChanges();
    expect(session.editor.viewport.scale).toBeCloseTo(before * 1.25, 9);
    (el.querySelector('button[aria-label="Zoom out"]') as HTMLButtonElement).click();
    expect(session.editor.viewport.scale).toBeCloseTo(before, 9);
  });
});
