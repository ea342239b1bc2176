import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { signal } from '@angular/core';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { formatDate } from '@angular/common';
import { HistoryPageComponent } from './history-page.component';
import { PatternContext } from '../pattern-context.service';
import type { RevisionGroup, RevisionSummary } from '../../core/api-types';

const ada = { id: 'u1', displayName: 'Ada' };
const run = (first: number, last: number, extra: Partial<RevisionGroup> = {}): RevisionGroup => ({
  first,
  last,
  count: last - first + 1,
  author: ada,
  startedAt: `2026-12-03T14:0${first % 10}:00Z`,
  endedAt: `2026-12-03T14:3${last % 10}:00Z`,
  version: null,
  restoredFrom: null,
  ...extra,
});
const GROUPS: RevisionGroup[] = [
  run(13, 13, { restoredFrom: 3 }),
  run(12, 12, { version: { name: 'First fitting', note: 'Before the border' } }),
  run(4, 11),
  run(1, 1),
];
const save = (number: number): RevisionSummary => ({ id: `r${number}`, number, author: ada, restoredFrom: null, version: null, createdAt: `2026-12-03T14:${10 + number}:00Z` });

/** The request to `url` once the page has sent it (a harness click sends it after a few turns of the event loop). */
async function nextRequest(http: HttpTestingController, url: string) {
  for (let turn = 0; turn < 1000; turn++) {
    const [req] = http.match((r) => r.url === url);
    if (req) return req;
    await new Promise((resolve) => setTimeout(resolve));
  }
  throw new Error(`no request to ${url}`);
}

describe('HistoryPageComponent', () => {
  async function setup(canEdit = true) {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: PatternContext, useValue: { id: signal('p1'), revision: signal(13), canEdit: signal(canEdit) } },
      ],
    });
    const fixture = TestBed.createComponent(HistoryPageComponent);
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    const req = http.expectOne((r) => r.url === '/api/patterns/p1/revisions/groups');
    expect(req.request.params.get('page')).toBe('1');
    req.flush({ items: GROUPS, total: 4, page: 1, pageSize: 20 });
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    const table = el.querySelector('table[aria-label=Revisions]') as HTMLTableElement;
    // Each row as its cells' text, " | " between cells; a cell of controls as their words, " / " between them.
    const words = (e: Element) => e.textContent!.replace(/expand_(more|less)/, '').replace(/\s+/g, ' ').trim();
    const rows = () =>
      Array.from(table.querySelectorAll(':scope > tbody > tr')).map((tr) =>
        Array.from(tr.children, (td) => {
          const controls = td.querySelectorAll('button, a');
          return controls.length ? Array.from(controls, words).join(' / ') : words(td);
        }).join(' | '),
      );
    const loader = TestbedHarnessEnvironment.loader(fixture);
    /** The button or link named `name`, through Material's button harness; null when there is none. */
    const button = (name: string) => loader.getHarnessOrNull(MatButtonHarness.with({ selector: `[aria-label="${name}"]` }));
    return { fixture, el, http, table, rows, button };
  }

  it('shows one row per run of saves, with its range, its count and its times', async () => {
    const { rows } = await setup();
    const r = rows();
    expect(r).toHaveLength(4);
    // Times show in the browser's time zone.
    const at = (iso: string, format: string) => formatDate(iso, format, 'en-US');
    expect(r[0]).toBe(`Revision 13 latest | Ada | ${at('2026-12-03T14:33:00Z', 'd MMM y, HH:mm:ss')} | Restored from revision 3 | Open`);
    expect(r[2]).toBe(
      `Revisions 4–11 | Ada | ${at('2026-12-03T14:04:00Z', 'd MMM y, HH:mm')}–${at('2026-12-03T14:31:00Z', 'HH:mm')} | 8 saves in one sitting | Show 8 saves / Open / Restore`,
    );
    expect(r[3]).toBe(`Revision 1 | Ada | ${at('2026-12-03T14:31:00Z', 'd MMM y, HH:mm:ss')} |  | Open / Restore`);
  });

  it('sets a named version apart with an icon and the word Version, its name and its note', async () => {
    const { table } = await setup();
    const row = table.querySelectorAll(':scope > tbody > tr')[1] as HTMLElement;
    expect(row.classList).toContain('version-row');
    const tag = row.querySelector('.version-tag') as HTMLElement;
    expect(tag.textContent?.replace('bookmark', '').trim()).toBe('Version');
    expect(tag.querySelector('mat-icon')?.getAttribute('aria-hidden')).toBe('true');
    expect(row.querySelector('.version-name')?.textContent).toBe('First fitting');
    expect(row.querySelector('.version-note')?.textContent).toBe('Before the border');
  });

  it('opens a run to list each save, newest first, and closes it again', async () => {
    const { fixture, http, rows, button, el } = await setup();
    expect(await button('Show 1 save of revision 1')).toBeNull();
    const toggle = (await button('Show 8 saves of revisions 4–11'))!;
    const toggleHost = await toggle.host();
    expect(await toggleHost.getAttribute('aria-expanded')).toBe('false');
    // The harness waits for the page to settle after the click, and the list request is pending until flushed.
    const clicked = toggle.click();
    const req = await nextRequest(http, '/api/patterns/p1/revisions');
    expect(req.request.params.get('from')).toBe('4');
    expect(req.request.params.get('to')).toBe('11');
    req.flush({ items: [11, 10, 9, 8, 7, 6, 5, 4].map(save), total: 8, page: 1, pageSize: 100 });
    await clicked;
    await fixture.whenStable();
    const opened = (await button('Hide 8 saves of revisions 4–11'))!;
    expect(await opened.getText()).toContain('Hide 8 saves');
    expect(await toggleHost.getAttribute('aria-expanded')).toBe('true');
    const saves = el.querySelector(`#${await toggleHost.getAttribute('aria-controls')}`)!.querySelector('table[aria-label="Saves of revisions 4–11"]')!;
    const numbers = Array.from(saves.querySelectorAll('tbody tr td:first-child')).map((td) => Number(td.textContent));
    expect(numbers).toEqual([11, 10, 9, 8, 7, 6, 5, 4]);
    expect(await button('Restore revision 7')).not.toBeNull();
    expect(rows()).toHaveLength(5);
    await opened.click();
    expect(rows()).toHaveLength(4);
    expect(await toggleHost.getAttribute('aria-expanded')).toBe('false');
    expect(await toggleHost.getAttribute('aria-controls')).toBeNull();
  });

  it('opens and restores a run by its last save; the latest revision has no restore', async () => {
    const { button } = await setup();
    const open = (await button('Open revision 11 read-only'))!;
    expect(await (await open.host()).getAttribute('href')).toBe('/history/11');
    expect(await button('Restore revision 11')).not.toBeNull();
    expect(await button('Restore revision 13')).toBeNull();
  });

  it('offers no restore to a quilter', async () => {
    const { button } = await setup(false);
    expect(await button('Open revision 11 read-only')).not.toBeNull();
    expect(await button('Restore revision 11')).toBeNull();
    expect(await button('Restore revision 1')).toBeNull();
  });
});
