import { TestBed } from '@angular/core/testing';
import { signal } from '@angular/core';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Router, provideRouter } from '@angular/router';
import { HistoryPageComponent } from './history-page.component';
import { PatternContext } from '../pattern-context.service';
import type { RevisionGroup } from '../../core/api-types';

const ada = { id: 'u1', displayName: 'Ada' };
const run = (n: number): RevisionGroup => ({
  first: n,
  last: n,
  count: 1,
  author: ada,
  startedAt: `2026-12-03T14:0${n}:00Z`,
  endedAt: `2026-12-03T14:0${n}:00Z`,
  version: null,
  restoredFrom: null,
});

/** Restoring a revision replaces the page: focus goes to the result (the board page's content), not to the body. */
describe('RevisionRestore focus', { timeout: 20_000 }, () => {
  let main: HTMLElement;

  beforeEach(() => {
    // The app shell's main region, which the board page renders into.
    main = document.createElement('main');
    main.id = 'main';
    main.tabIndex = -1;
    document.body.appendChild(main);
  });

  afterEach(() => {
    main.remove();
    vi.restoreAllMocks();
  });

  it('moves focus to the main region once the board with the restored revision is shown', async () => {
    const adopt = vi.fn();
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: PatternContext, useValue: { id: signal('p1'), revision: signal(3), canEdit: signal(true), adopt } },
      ],
    });
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    vi.spyOn(window, 'confirm').mockReturnValue(true);
    const fixture = TestBed.createComponent(HistoryPageComponent);
    main.appendChild(fixture.nativeElement);
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne((r) => r.url === '/api/patterns/p1/revisions/groups').flush({ items: [run(3), run(2)], total: 2, page: 1, pageSize: 20 });
    await fixture.whenStable();
    const restore = (fixture.nativeElement as HTMLElement).querySelector('button[aria-label="Restore revision 2"]') as HTMLButtonElement;
    restore.focus();
    restore.click();
    http.expectOne((r) => r.method === 'POST' && r.url === '/api/patterns/p1/revisions/2/restore').flush({
      pattern: { id: 'p1' },
      revision: { number: 4, document: { title: 'x' } },
    });
    http.match((r) => r.url === '/api/patterns/p1/revisions/groups').forEach((r) => r.flush({ items: [], total: 0, page: 1, pageSize: 20 }));
    expect(navigate).toHaveBeenCalledWith(['/patterns', 'p1', 'board']);
    await vi.waitFor(async () => {
      await fixture.whenStable();
      expect(document.activeElement).toBe(main);
    });
    expect(adopt).toHaveBeenCalledWith({ title: 'x' }, 4);
    fixture.destroy();
  });
});
