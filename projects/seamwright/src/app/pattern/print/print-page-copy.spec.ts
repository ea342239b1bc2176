import { TestBed } from '@angular/core/testing';
import { signal } from '@angular/core';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import type { ColourwayCopy, PrintSet } from '@seamwright/api';
import { buildOrchardWheel } from '@seamwright/piecing';
import { PrintPageComponent } from './print-page.component';
import { PatternContext } from '../pattern-context.service';
import { QuiltChoice } from '../quilt/quilt-choice.service';

const copy: ColourwayCopy = {
  id: 'c1',
  patternId: 'p1',
  sourceColourwayId: 'dusk',
  name: 'Night orchard',
  fabrics: { plum: { name: 'Aubergine linen', colour: '#40203a' } },
  version: 2,
  createdAt: '2026-12-05T10:00:00.000Z',
  updatedAt: '2026-12-05T10:00:00.000Z',
};

const madeSet: PrintSet = {
  id: 's1',
  patternId: 'p1',
  revision: 1,
  options: { paper: 'letter', mirrored: true, colourwayCopy: { id: 'c1', name: 'Night orchard' } },
  status: 'done',
  progress: 1,
  error: null,
  sheets: 34,
  templateSheets: 20,
  lowerBoundSheets: 12,
  bytes: 2048,
  sha256: 'a'.repeat(64),
  createdBy: { id: 'u1', displayName: 'Kit' },
  createdAt: '2026-12-05T10:05:00.000Z',
  finishedAt: '2026-12-05T10:05:10.000Z',
  url: '/api/patterns/p1/print-sets/s1/file',
};

describe('PrintPageComponent with a colourway copy chosen', () => {
  it('asks for the print set in the copy (no colourway id) and names the copy in the list of sets', async () => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        QuiltChoice,
        { provide: PatternContext, useValue: { id: signal('p1'), document: signal(buildOrchardWheel()), revision: signal(1), canEdit: signal(false) } },
      ],
    });
    const choice = TestBed.inject(QuiltChoice);
    // Dusk was chosen first; choosing the copy stands in for it.
    choice.chooseColourway('dusk');
    const fixture = TestBed.createComponent(PrintPageComponent);
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/patterns/p1/print-sets').flush({ items: [madeSet] });
    http.expectOne('/api/patterns/p1/colourway-copies').flush({ items: [copy] });
    choice.chooseCopy('c1');
    fixture.detectChanges();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('.what')?.textContent?.replace(/\s+/g, ' ')).toContain('Letter (8.5 × 11 in.) · mirrored · in Night orchard');

    const make = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatButtonHarness.with({ text: /Make print set/ }));
    await make.click();
    const request = http.expectOne((r) => r.method === 'POST' && r.url === '/api/patterns/p1/print-sets');
    expect(request.request.body.colourwayCopyId).toBe('c1');
    expect(request.request.body.options.colourwayId).toBeUndefined();
  }, 30_000);
});
