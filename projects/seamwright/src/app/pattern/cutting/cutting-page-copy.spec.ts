import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import type { ColourwayCopy } from '@seamwright/api';
import { buildOrchardWheel } from '@seamwright/piecing';
import { PatternContext } from '../pattern-context.service';
import { QuiltChoice } from '../quilt/quilt-choice.service';
import { CuttingPageComponent } from './cutting-page.component';

/** The quilter's copy of Dusk with the Plum slot renamed (projects/piecing/src/lib/demo/orchard-wheel-quilt.ts). */
const copy: ColourwayCopy = {
  id: 'c1',
  patternId: 'p1',
  sourceColourwayId: 'dusk',
  name: 'Night orchard',
  fabrics: {
    plum: { name: 'Aubergine linen', colour: '#40203a' },
    oat: { name: 'Fog', colour: '#cfd3d6' },
    sage: { name: 'Slate', colour: '#6f8291' },
    marigold: { name: 'Ember', colour: '#c8553d' },
    ink: { name: 'Coal', colour: '#1c1c22' },
  },
  version: 1,
  createdAt: '2026-12-05T10:00:00.000Z',
  updatedAt: '2026-12-05T10:00:00.000Z',
};

describe('CuttingPageComponent with a colourway copy chosen', () => {
  beforeAll(() => {
    const proto = SVGElement.prototype as unknown as { getBBox?: () => DOMRect };
    proto.getBBox ??= () => ({ x: 0, y: 0, width: 0, height: 0 }) as DOMRect;
  });

  it('names every fabric, block and whole quilt alike, as the copy does; back to Dusk when Dusk is chosen', () => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), QuiltChoice, { provide: PatternContext, useValue: { id: signal('p1'), document: signal(buildOrchardWheel()) } }],
    });
    const choice = TestBed.inject(QuiltChoice);
    const fixture = TestBed.createComponent(CuttingPageComponent);
    fixture.detectChanges();
    TestBed.inject(HttpTestingController).expectOne('/api/patterns/p1/colourway-copies').flush({ items: [copy] });
    choice.chooseCopy('c1');
    fixture.detectChanges();
    const el = fixture.nativeElement as HTMLElement;
    const blockFabrics = () => [...el.querySelectorAll('section.fabric h3')].map((h) => h.textContent?.trim());
    expect(blockFabrics()).toContain('Aubergine linen');
    expect(blockFabrics()).not.toContain('Midnight');
    // The whole quilt's fabric needs (sashing, borders, binding) follow the copy too.
    expect(el.querySelector('sw-quilt-fabric-needs')?.textContent).toContain('Aubergine linen');
    choice.chooseColourway('dusk');
    fixture.detectChanges();
    expect(blockFabrics()).toContain('Midnight');
    expect(el.querySelector('sw-quilt-fabric-needs')?.textContent).not.toContain('Aubergine linen');
  }, 30_000);
});
