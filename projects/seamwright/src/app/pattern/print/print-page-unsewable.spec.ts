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
import { misnumberedStrip as misnumberedStripJson } from '../../../../../../tests/fixtures/misnumbered-strip';

/** The shared misnumbered strip: A2 shares no seam with A1, so section A is not sewable as numbered. */
function misnumberedStrip(): PatternDocument {
  return readPatternDocument(misnumberedStripJson());
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
