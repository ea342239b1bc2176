import { TestBed } from '@angular/core/testing';
import { signal } from '@angular/core';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Subject } from 'rxjs';
import { buildGardenGate, type PatternDocument } from '@seamwright/piecing';
import { PrintPageComponent } from './print-page.component';
import { PatternContext } from '../pattern-context.service';
import { PrintSetsService } from '../../resources/print-sets.service';
import type { PrintSet } from '../../core/api-types';

const set = (status: PrintSet['status'], extra: Partial<PrintSet> = {}): PrintSet => ({
  id: 's1',
  patternId: 'p1',
  revision: 1,
  options: { paper: 'letter', mirrored: true },
  status,
  progress: status === 'done' ? 1 : 0,
  error: null,
  sheets: status === 'done' ? 6 : null,
  templateSheets: null,
  lowerBoundSheets: null,
  bytes: status === 'done' ? 12_000 : null,
  sha256: null,
  createdBy: { id: 'u1', displayName: 'Mira' },
  createdAt: '2026-01-03T10:00:00.000Z',
  finishedAt: null,
  url: '/api/patterns/p1/print-sets/s1',
  ...extra,
});

/** Focus after making and deleting a print set: the keyboard user goes on from the result. */
describe('PrintPageComponent focus', { timeout: 20_000 }, () => {
  async function setup() {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: PatternContext, useValue: { id: signal('p1'), document: signal<PatternDocument | null>(buildGardenGate()), revision: signal(1), canEdit: signal(true) } },
      ],
    });
    const progress = new Subject<PrintSet>();
    vi.spyOn(PrintSetsService.prototype, 'follow').mockReturnValue(progress);
    const fixture = TestBed.createComponent(PrintPageComponent);
    document.body.appendChild(fixture.nativeElement);
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/patterns/p1/print-sets').flush({ items: [] });
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    const makeButton = () => [...el.querySelectorAll('button')].find((b) => b.textContent?.includes('Make print set')) as HTMLButtonElement;
    return { fixture, http, el, progress, makeButton };
  }

  afterEach(() => vi.restoreAllMocks());

  it('keeps focus on "Make print set" while the set renders, then moves it to the new set’s download link', async () => {
    const { fixture, http, el, progress, makeButton } = await setup();
    makeButton().focus();
    makeButton().click();
    http.expectOne((r) => r.method === 'POST' && r.url === '/api/patterns/p1/print-sets').flush({ printSet: set('queued') });
    progress.next(set('rendering', { progress: 0.5 }));
    await fixture.whenStable();
    // Disabled while it renders, yet still focused (not dropped to the page body).
    expect(makeButton().getAttribute('aria-disabled')).toBe('true');
    expect(document.activeElement).toBe(makeButton());

    progress.next(set('done'));
    http.expectOne('/api/patterns/p1/print-sets').flush({ items: [set('done')] });
    await fixture.whenStable();
    const link = el.querySelector('.progress a[download]') as HTMLAnchorElement;
    expect(link.getAttribute('href')).toBe('/api/patterns/p1/print-sets/s1/file');
    expect(document.activeElement).toBe(link);
    expect(el.querySelector('.progress')?.textContent).toContain('Ready: 6 pages.');
    fixture.destroy();
  });

  it('leaves focus on "Make print set" when the set fails, and says so in words', async () => {
    const { fixture, http, el, progress, makeButton } = await setup();
    makeButton().focus();
    makeButton().click();
    http.expectOne((r) => r.method === 'POST').flush({ printSet: set('queued') });
    progress.next(set('failed', { error: 'Out of paper' }));
    await fixture.whenStable();
    expect(document.activeElement).toBe(makeButton());
    expect(el.querySelector('.progress')?.textContent).toContain('Failed: Out of paper');
    fixture.destroy();
  });

  it('moves focus to the list heading after a print set is deleted', async () => {
    const { fixture, http, el } = await setup();
    fixture.componentInstance['reload']();
    http.expectOne('/api/patterns/p1/print-sets').flush({ items: [set('done')] });
    await fixture.whenStable();
    vi.spyOn(window, 'confirm').mockReturnValue(true);
    const del = el.querySelector('button[aria-label="Delete print set of revision 1"]') as HTMLButtonElement;
    del.focus();
    del.click();
    http.expectOne((r) => r.method === 'DELETE').flush(null, { status: 204, statusText: 'No Content' });
    http.expectOne('/api/patterns/p1/print-sets').flush({ items: [] });
    await fixture.whenStable();
    expect(document.activeElement).toBe(el.querySelector('h2#sets-title'));
    fixture.destroy();
  });
});
