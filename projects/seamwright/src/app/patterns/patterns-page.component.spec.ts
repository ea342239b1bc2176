import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatTableHarness } from '@angular/material/table/testing';
import { PatternsPageComponent } from './patterns-page.component';
import type { Page, PatternListItem } from '../core/api-types';

const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="96" height="96" viewBox="0 0 8 8"><rect width="8" height="8" fill="#fffdf8"/></svg>';

const row = (id: string, title: string, extra: Partial<PatternListItem>): PatternListItem => ({
  id,
  title,
  owner: { id: 'u1', displayName: 'Mira' },
  access: 'owner',
  headRevision: 3,
  createdAt: '2026-01-02T10:00:00.000Z',
  updatedAt: '2026-01-03T10:00:00.000Z',
  trashedAt: null,
  sectionCount: null,
  finishedSize: null,
  preview: null,
  ...extra,
});

describe('PatternsPageComponent', () => {
  async function setup(items: PatternListItem[]) {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    const http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(PatternsPageComponent);
    fixture.detectChanges();
    const list = http.expectOne((r) => r.url === '/api/patterns');
    expect(list.request.params.get('page')).toBe('1');
    list.flush({ items, total: items.length, page: 1, pageSize: 10 } satisfies Page<PatternListItem>);
    fixture.detectChanges();
    await fixture.whenStable();
    const table = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatTableHarness.with({ selector: '[aria-label="Patterns"]' }));
    return { http, el: fixture.nativeElement as HTMLElement, table };
  }

  it('shows each row from the list answer alone: picture, section count and finished size', async () => {
    const { http, el, table } = await setup([
      row('p1', 'Garden Gate', { sectionCount: 3, finishedSize: { widthIn: 8, heightIn: 8, displayUnit: 'in', text: '8 × 8 in.' }, preview: svg }),
      row('p2', 'Orchard Wheel', { sectionCount: 4, finishedSize: { widthIn: 26, heightIn: 26, displayUnit: 'cm', text: '66.04 × 66.04 cm' }, preview: svg }),
    ]);
    const cells = await table.getCellTextByColumnName();
    expect(cells['title'].text).toEqual(['Garden Gate', 'Orchard Wheel']);
    expect(cells['sections'].text).toEqual(['3', '4']);
    expect(cells['size'].text).toEqual(['8 × 8 in.', '66.04 × 66.04 cm']);
    expect(cells['size'].headerText).toEqual(['Finished size']);
    const img = el.querySelector('img[alt="Preview of Garden Gate"]') as HTMLImageElement;
    expect(img.getAttribute('src')!.startsWith('data:image/svg+xml,')).toBe(true);
    expect(decodeURIComponent(img.getAttribute('src')!.slice('data:image/svg+xml,'.length))).toBe(svg);
    // No request per row: the list answer carries what the rows show.
    http.verify();
  });

  it('shows a plain mark and dashes for a row the server could not draw', async () => {
    const { http, el, table } = await setup([row('p3', 'Unreadable', {})]);
    const cells = await table.getCellTextByColumnName();
    expect([cells['sections'].text, cells['size'].text]).toEqual([['–'], ['–']]);
    expect(el.querySelector('img')).toBeNull();
    expect(el.querySelector('sw-pattern-thumbnail mat-icon')?.textContent).toBe('grid_view');
    http.verify();
  });
});
