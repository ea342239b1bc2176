import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { PatternsService, StaleSaveError } from './patterns.service';
import { RevisionsService } from './revisions.service';
import type { Revision } from '../core/api-types';

const doc = { formatVersion: 2 as const, title: 'Orchard Wheel', canvas: { widthIn: 24, heightIn: 24 } };

describe('PatternsService', () => {
  let svc: PatternsService;
  let ctl: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    svc = TestBed.inject(PatternsService);
    ctl = TestBed.inject(HttpTestingController);
  });

  afterEach(() => ctl.verify());

  it('asks for a page with sort, order, scope and a trimmed search', () => {
    svc.list({ page: 2, pageSize: 25, sort: 'title', order: 'asc', q: '  wheel ', scope: 'trash' }).subscribe();
    const req = ctl.expectOne((r) => r.url === '/api/patterns');
    expect(req.request.params.toString()).toBe('page=2&pageSize=25&sort=title&order=asc&scope=trash&q=wheel');
    req.flush({ items: [], total: 0, page: 2, pageSize: 25 });
  });

  it('leaves out an empty search', () => {
    svc.list({ page: 1, pageSize: 10, sort: 'updated', order: 'desc', q: '   ', scope: 'all' }).subscribe();
    const req = ctl.expectOne((r) => r.url === '/api/patterns');
    expect(req.request.params.has('q')).toBe(false);
    req.flush({ items: [], total: 0, page: 1, pageSize: 10 });
  });

  it('saves with PUT on top of the base revision', () => {
    let saved = 0;
    svc.save('p1', { baseRevision: 4, document: doc }).subscribe((r) => (saved = r.revision.number));
    const req = ctl.expectOne('/api/patterns/p1');
    expect(req.request.method).toBe('PUT');
    expect(req.request.body).toEqual({ baseRevision: 4, document: doc });
    req.flush({ pattern: { id: 'p1' }, revision: { number: 5, document: doc } });
    expect(saved).toBe(5);
  });

  it('turns a stale save into a StaleSaveError carrying the other revision', () => {
    let error: unknown;
    svc.save('p1', { baseRevision: 4, document: doc }).subscribe({ error: (e) => (error = e) });
    const latest: Partial<Revision> = { number: 5, author: { id: 'u2', displayName: 'Bea' }, document: { ...doc, title: 'Theirs' } as Revision['document'] };
    ctl
      .expectOne('/api/patterns/p1')
      .flush({ error: 'This pattern was saved by someone else since revision 4', details: { latest } }, { status: 409, statusText: 'Conflict' });
    expect(error).toBeInstanceOf(StaleSaveError);
    expect((error as StaleSaveError).latest.number).toBe(5);
    expect((error as StaleSaveError).latest.document.title).toBe('Theirs');
    expect((error as StaleSaveError).message).toBe('This pattern was saved by someone else since revision 4');
  });

  it('reports a 409 without a revision (a trashed pattern) as a plain error', () => {
    let error: unknown;
    svc.save('p1', { baseRevision: 4, document: doc }).subscribe({ error: (e) => (error = e) });
    ctl.expectOne('/api/patterns/p1').flush({ error: 'Pattern is in the trash', details: null }, { status: 409, statusText: 'Conflict' });
    expect(error).not.toBeInstanceOf(StaleSaveError);
    expect((error as { status: number }).status).toBe(409);
  });

  it('restores a revision on top of the latest one', () => {
    TestBed.inject(RevisionsService).restore('p1', 2, 7).subscribe();
    const req = ctl.expectOne('/api/patterns/p1/revisions/2/restore');
    expect(req.request.method).toBe('POST');
    expect(req.request.body).toEqual({ baseRevision: 7 });
    req.flush({ pattern: {}, revision: { number: 8 } });
  });
});
