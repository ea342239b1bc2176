import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatSelectHarness } from '@angular/material/select/testing';
import { buildOrchardWheel } from '@seamwright/piecing';
import { EditorSession } from '../session/editor-session';
import { FourBlockViewComponent } from './four-block-view.component';

async function openPanel() {
  TestBed.configureTestingModule({ providers: [EditorSession] });
  const session = TestBed.inject(EditorSession);
  session.load(buildOrchardWheel());
  const fixture = TestBed.createComponent(FourBlockViewComponent);
  fixture.detectChanges();
  const el = fixture.nativeElement as HTMLElement;
  el.querySelector<HTMLButtonElement>('button.disclosure')!.click();
  fixture.detectChanges();
  await fixture.whenStable();
  const select = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatSelectHarness.with({ selector: '[data-testid="four-block-colourway"]' }));
  /** The fill colours in the four blocks' picture. */
  const fills = () => {
    const src = el.querySelector('img.picture')?.getAttribute('src') ?? '';
    const svg = decodeURIComponent(src.replace(/^data:image\/svg\+xml;charset=utf-8,/, ''));
    return new Set([...svg.matchAll(/fill="(#[0-9a-f]{6})"/gi)].map((m) => m[1].toLowerCase()));
  };
  return { fixture, session, el, select, fills };
}

describe('FourBlockViewComponent colourway', () => {
  it("follows the board's colourway, in its picture too", async () => {
    const { fixture, session, select, fills } = await openPanel();
    expect(await select.getValueText()).toBe('Pattern fabrics');
    expect(fills().has('#6d3b5e')).toBe(true); // Plum, the pattern's own fabric
    session.colourwayId.set('frost');
    fixture.detectChanges();
    expect(await select.getValueText()).toBe('Frost');
    // The picture is drawn again once the drawing has been still for a moment.
    await vi.waitFor(() => {
      fixture.detectChanges();
      expect(fills().has('#2f5d50')).toBe(true); // Spruce, Frost's Plum slot
    });
    expect(fills().has('#6d3b5e')).toBe(false);
  });

  it('keeps a choice made in the panel until the board chooses again, and never changes the board', async () => {
    const { fixture, session, select } = await openPanel();
    session.colourwayId.set('frost');
    fixture.detectChanges();
    await select.open();
    await select.clickOptions({ text: 'Dusk' });
    expect(await select.getValueText()).toBe('Dusk');
    expect(session.colourwayId()).toBe('frost');
    session.colourwayId.set(null);
    fixture.detectChanges();
    expect(await select.getValueText()).toBe('Pattern fabrics');
    expect(await (await select.host()).getAttribute('aria-label')).toBe('Four blocks colourway');
  });
});
