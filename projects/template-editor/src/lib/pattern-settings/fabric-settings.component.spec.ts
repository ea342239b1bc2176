import { TestBed } from '@angular/core/testing';
import { buildOrchardWheel } from '@seamwright/piecing';
import { EditorSession } from '../session/editor-session';
import { FabricSettingsComponent } from './fabric-settings.component';

describe('FabricSettingsComponent while the board shows a colourway', () => {
  it('says which colourway the board shows and that the fabrics edited are the pattern’s own', () => {
    TestBed.configureTestingModule({ providers: [EditorSession] });
    const session = TestBed.inject(EditorSession);
    session.load(buildOrchardWheel());
    const fixture = TestBed.createComponent(FabricSettingsComponent);
    fixture.detectChanges();
    const el = fixture.nativeElement as HTMLElement;
    const note = () => el.querySelector('[data-testid="fabrics-colourway-note"]');
    expect(note()).toBeNull();
    session.colourwayId.set('dusk');
    fixture.detectChanges();
    expect(note()?.getAttribute('role')).toBe('status');
    expect(note()?.textContent?.trim()).toBe("The board shows the colourway Dusk. These are the pattern's own fabrics: a change here changes the pattern, not Dusk.");
    // The list still edits the pattern's own fabrics.
    expect((el.querySelector('input[aria-label="Name of fabric Plum"]') as HTMLInputElement).value).toBe('Plum');
    session.colourwayId.set(null);
    fixture.detectChanges();
    expect(note()).toBeNull();
  });
});
