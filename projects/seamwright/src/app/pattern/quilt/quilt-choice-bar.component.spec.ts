import { TestBed } from '@angular/core/testing';
import { signal } from '@angular/core';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import type { ColourwayCopy } from '@seamwright/api';
import { buildOrchardWheel } from '@seamwright/piecing';
import { PatternContext } from '../pattern-context.service';
import { QuiltChoiceBarComponent, documentInChoice } from './quilt-choice-bar.component';
import { QuiltChoice } from './quilt-choice.service';

const copy = (id: string, name: string): ColourwayCopy => ({
  id,
  patternId: 'p1',
  sourceColourwayId: 'frost',
  name,
  fabrics: { plum: { name: 'Aubergine linen', colour: '#40203a' } },
  version: 1,
  createdAt: '2026-12-05T10:00:00.000Z',
  updatedAt: '2026-12-05T10:00:00.000Z',
});

function render() {
  TestBed.configureTestingModule({
    providers: [provideHttpClient(), provideHttpClientTesting(), QuiltChoice, { provide: PatternContext, useValue: { id: signal('p1') } }],
  });
  const fixture = TestBed.createComponent(QuiltChoiceBarComponent);
  fixture.componentRef.setInput('document', buildOrchardWheel());
  fixture.detectChanges();
  const el = fixture.nativeElement as HTMLElement;
  const button = (name: string) => [...el.querySelectorAll('button')].find((b) => b.textContent?.includes(name));
  return { fixture, el, button, http: TestBed.inject(HttpTestingController), choice: TestBed.inject(QuiltChoice) };
}

describe('QuiltChoiceBarComponent copies', { timeout: 20_000 }, () => {
  it('loads the user\'s copies once per pattern and makes a copy of the colourway shown, then opens it', () => {
    const { fixture, el, button, http, choice } = render();
    http.expectOne('/api/patterns/p1/colourway-copies').flush({ items: [copy('c1', 'Winter')] });
    fixture.detectChanges();
    expect(choice.copies().map((c) => c.name)).toEqual(['Winter']);
    choice.chooseColourway('dusk');
    fixture.detectChanges();
    button('Make my copy')!.click();
    const req = http.expectOne('/api/patterns/p1/colourway-copies');
    expect([req.request.method, req.request.body]).toEqual(['POST', { colourwayId: 'dusk' }]);
    req.flush({ copy: { ...copy('c2', 'My Dusk'), sourceColourwayId: 'dusk' } }, { status: 201, statusText: 'Created' });
    fixture.detectChanges();
    expect([choice.colourwayId(), choice.colourwayCopyId()]).toEqual([null, 'c2']);
    expect(el.querySelector('sw-colourway-copy-editor h3')?.textContent?.trim()).toBe('My copy: My Dusk');
    expect(button('Hide my copy')?.getAttribute('aria-expanded')).toBe('true');
    // A second bar of the same pattern (another page) does not load them again.
    TestBed.createComponent(QuiltChoiceBarComponent).componentRef.setInput('document', buildOrchardWheel());
    http.verify();
  });

  it('with a copy chosen, a new copy starts from the colourway that copy came from', () => {
    const { fixture, button, http, choice } = render();
    http.expectOne('/api/patterns/p1/colourway-copies').flush({ items: [copy('c1', 'Winter')] });
    choice.chooseCopy('c1');
    fixture.detectChanges();
    button('Make my copy')!.click();
    expect(http.expectOne('/api/patterns/p1/colourway-copies').request.body).toEqual({ colourwayId: 'frost' });
  });
});

describe('documentInChoice', () => {
  it('takes the copy\'s fabrics when a copy is chosen, else the colourway\'s', () => {
    const doc = buildOrchardWheel();
    const names = (d: ReturnType<typeof buildOrchardWheel>) => d.fabrics.map((f) => f.name);
    expect(names(documentInChoice(doc, 'dusk', copy('c1', 'Winter')))).toEqual(['Aubergine linen', 'Oat', 'Sage', 'Marigold', 'Ink']);
    expect(names(documentInChoice(doc, 'dusk', null))).toEqual(['Midnight', 'Fog', 'Slate', 'Ember', 'Coal']);
    expect(names(documentInChoice(doc, 'gone', null))).toEqual(['Plum', 'Oat', 'Sage', 'Marigold', 'Ink']);
  });
});
