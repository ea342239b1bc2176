import { TestBed } from '@angular/core/testing';
import { signal } from '@angular/core';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { readPatternDocument, type PatternDocument } from '@seamwright/piecing';
import { PrintPageComponent } from './print-page.component';
import { PatternContext } from '../pattern-context.service';

/** Three patches in a row numbered left (1), right (2), middle (3): patch 2 shares no seam with patch 1. Invented. */
function misnumberedStrip(): PatternDocument {
  return readPatternDocument({
    formatVersion: 2,
    title: 'Misnumbered strip',
    canvas: { widthIn: 4, heightIn: 2 },
    fabrics: [{ id: 'plum', name: 'Plum', colour: '#6b2d5c' }],
    sections: [
      {
        id: 'a',
        label: 'A',
        geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 3, y: 0 }, { x: 3, y: 1 }, { x: 0, y: 1 }] },
        seams: [
          { id: 's1', a: { x: 1, y: -1 }, b: { x: 1, y: 2 } },
          { id: 's2', a: { x: 2, y: -1 }, b: { x: 2, y: 2 } },
        ],
        patches: [
          { number: 1, anchor: { x: 0.5, y: 0.5 }, fabricId: 'plum' },
          { number: 2, anchor: { x: 2.5, y: 0.5 }, fabricId: 'plum' },
          { number: 3, anchor: { x: 1.5, y: 0.5 }, fabricId: 'plum' },
        ],
      },
    ],
  });
}

describe('PrintPageComponent with a section not sewable as numbered', () => {
  it('shows the reason, holds the print set back until "Print anyway" is ticked, then asks for it', async () => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: PatternContext, useValue: { id: signal('p1'), document: signal(misnumberedStrip()), revision: signal(3), canEdit: signal(true) } },
      ],
    });
    const fixture = TestBed.createComponent(PrintPageComponent);
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/patterns/p1/print-sets').flush({ items: [] });
    const el = fixture.nativeElement as HTMLElement;
    const loader = TestbedHarnessEnvironment.loader(fixture);

    const alert = el.querySelector('[role=alert]') as HTMLElement;
    expect(alert.textContent).toContain('Not sewable as numbered');
    expect(alert.textContent).toContain('Section A: A2 shares no seam with the patches sewn before it (A1)');
    const make = await loader.getHarness(MatButtonHarness.with({ text: /Make print set/ }));
    expect(await make.isDisabled()).toBe(true);

    const anyway = await loader.getHarness(MatCheckboxHarness.with({ label: /Print anyway/ }));
    await anyway.check();
    expect(await make.isDisabled()).toBe(false);
    await make.click();
    const request = http.expectOne((r) => r.method === 'POST' && r.url === '/api/patterns/p1/print-sets');
    expect(request.request.body.options.printUnsewable).toBe(true);
    expect(request.request.body.revision).toBe(3);
    // The harnesses wait for the page to settle, the debounced sheet preview included.
  }, 20_000);
});
