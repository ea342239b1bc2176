import { TestBed } from '@angular/core/testing';
import { ApplicationRef } from '@angular/core';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Router, provideRouter } from '@angular/router';
import { PatternsPageComponent } from './patterns-page.component';
import { AuthService } from '../core/auth.service';
import type { Page, PatternListItem, User } from '../core/api-types';

const row = (id: string, title: string): PatternListItem => ({
  id,
  title,
  owner: { id: 'u1', displayName: 'Mira' },
  access: 'owner',
  headRevision: 3,
  createdAt: '2026-01-02T10:00:00.000Z',
  updatedAt: '2026-01-03T10:00:00.000Z',
  trashedAt: null,
  sectionCount: 2,
  finishedSize: null,
  preview: null,
});

const page = (items: PatternListItem[]): Page<PatternListItem> => ({ items, total: items.length, page: 1, pageSize: 10 });

/** Focus after the list's actions: a row that leaves hands focus to the next row or the heading; dialogs give it back. */
describe('PatternsPageComponent focus', { timeout: 20_000 }, () => {
  async function setup(items: PatternListItem[]) {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    const http = TestBed.inject(HttpTestingController);
    TestBed.inject(AuthService).load().subscribe();
    http.expectOne('/api/auth/session').flush({ user: { id: 'u1', email: 'mira@example.test', displayName: 'Mira', role: 'designer' } as User });
    const fixture = TestBed.createComponent(PatternsPageComponent);
    document.body.appendChild(fixture.nativeElement);
    fixture.detectChanges();
    http.expectOne((r) => r.url === '/api/patterns').flush(page(items));
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    return { fixture, http, el };
  }

  async function trashFromMenu(fixture: { whenStable(): Promise<unknown> }, el: HTMLElement, title: string): Promise<void> {
    const trigger = el.querySelector(`button[aria-label="Actions for ${title}"]`) as HTMLButtonElement;
    trigger.focus();
    trigger.click();
    await fixture.whenStable();
    const item = [...document.querySelectorAll<HTMLButtonElement>('.mat-mdc-menu-panel button')].find((b) => b.textContent?.includes('Move to trash'));
    item!.click();
    await fixture.whenStable();
  }

  afterEach(() => document.querySelectorAll('.cdk-overlay-container').forEach((c) => (c.innerHTML = '')));

  it('moves focus to the row that takes the place of a pattern moved to the trash', async () => {
    const { fixture, http, el } = await setup([row('p1', 'Garden Gate'), row('p2', 'Orchard Wheel'), row('p3', 'Night Sky')]);
    await trashFromMenu(fixture, el, 'Orchard Wheel');
    http.expectOne((r) => r.method === 'POST' && r.url === '/api/patterns/p2/trash').flush({});
    http.expectOne((r) => r.url === '/api/patterns').flush(page([row('p1', 'Garden Gate'), row('p3', 'Night Sky')]));
    await fixture.whenStable();
    expect(document.activeElement?.textContent?.trim()).toBe('Night Sky');
    expect(document.activeElement?.tagName).toBe('A');
    fixture.destroy();
  });

  it('moves focus to the previous row when the last row leaves, and to the heading when the list is empty', async () => {
    const { fixture, http, el } = await setup([row('p1', 'Garden Gate'), row('p2', 'Orchard Wheel')]);
    await trashFromMenu(fixture, el, 'Orchard Wheel');
    http.expectOne((r) => r.method === 'POST').flush({});
    http.expectOne((r) => r.url === '/api/patterns').flush(page([row('p1', 'Garden Gate')]));
    await fixture.whenStable();
    expect(document.activeElement?.textContent?.trim()).toBe('Garden Gate');

    await trashFromMenu(fixture, el, 'Garden Gate');
    http.expectOne((r) => r.method === 'POST').flush({});
    http.expectOne((r) => r.url === '/api/patterns').flush(page([]));
    await fixture.whenStable();
    expect(document.activeElement).toBe(el.querySelector('h1'));
    expect(document.activeElement?.textContent?.trim()).toBe('Patterns');
    fixture.destroy();
  });

  it('gives focus back to "New pattern" when its dialog is cancelled, and opens the new pattern’s board when created', async () => {
    const { fixture, http, el } = await setup([]);
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    const newButton = [...el.querySelectorAll('button')].find((b) => b.textContent?.includes('New pattern')) as HTMLButtonElement;
    newButton.focus();
    newButton.click();
    await fixture.whenStable();
    // The newest dialog (a closed one may still be leaving the page).
    const dialog = () => [...document.querySelectorAll<HTMLElement>('mat-dialog-container')].at(-1) ?? null;
    await vi.waitFor(() => expect(dialog()?.contains(document.activeElement)).toBe(true));
    ([...dialog()!.querySelectorAll('button')].find((b) => b.textContent?.trim() === 'Cancel') as HTMLButtonElement).click();
    await vi.waitFor(() => expect(document.activeElement).toBe(newButton));
    await vi.waitFor(() => expect(dialog()).toBeNull());

    newButton.click();
    const tick = () => TestBed.inject(ApplicationRef).tick();
    await vi.waitFor(() => {
      tick();
      expect(dialog()?.querySelector('input')).toBeTruthy();
    });
    const title = dialog()!.querySelector('input') as HTMLInputElement;
    title.value = 'Star Path';
    title.dispatchEvent(new Event('input'));
    tick();
    ([...dialog()!.querySelectorAll('button')].find((b) => b.textContent?.trim() === 'Create') as HTMLButtonElement).click();
    await vi.waitFor(() => http.expectOne((r) => r.method === 'POST' && r.url === '/api/patterns').flush({ pattern: { id: 'p9' }, revision: { number: 1 } }));
    expect(navigate).toHaveBeenCalledWith(['/patterns', 'p9', 'board']);
    fixture.destroy();
  });
});
