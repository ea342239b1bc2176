import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import type { PatternDocument } from '@seamwright/piecing';
import { AUTOSAVE_DELAY_MS, BoardAutosave } from './board-autosave';
import { readDraft } from './draft-backup';

const doc = (title: string) => ({ formatVersion: 1, title, canvas: { widthIn: 12, heightIn: 12 }, fabrics: [], sections: [] }) as unknown as PatternDocument;

describe('BoardAutosave', () => {
  let ctl: HttpTestingController;
  let saved: Array<[string, number, boolean]>;
  let autosave: BoardAutosave;

  beforeEach(() => {
    vi.useFakeTimers();
    localStorage.clear();
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    ctl = TestBed.inject(HttpTestingController);
    saved = [];
    autosave = TestBed.runInInjectionContext(() => new BoardAutosave((d, rev, settled) => saved.push([d.title, rev, settled])));
    autosave.reset('p1', 3);
  });

  afterEach(() => {
    vi.useRealTimers();
    ctl.verify();
  });

  it('saves once, a pause after the last of several changes, on top of the revision it started from', () => {
    autosave.change(doc('one'));
    vi.advanceTimersByTime(AUTOSAVE_DELAY_MS - 100);
    autosave.change(doc('two'));
    vi.advanceTimersByTime(AUTOSAVE_DELAY_MS - 100);
    ctl.expectNone('/api/patterns/p1');
    expect(autosave.status()).toBe('pending');
    vi.advanceTimersByTime(100);
    const put = ctl.expectOne('/api/patterns/p1');
    expect(put.request.method).toBe('PUT');
    expect(put.request.body).toEqual({ baseRevision: 3, document: doc('two') });
    expect(autosave.status()).toBe('saving');
    put.flush({ pattern: {}, revision: { number: 4, document: doc('two') } });
    expect(autosave.status()).toBe('saved');
    expect(saved).toEqual([['two', 4, true]]);
    expect(readDraft('p1')).toBeNull();
  });

  it('keeps a copy in the browser until the server has it', () => {
    autosave.change(doc('unsaved'));
    expect(readDraft('p1')?.document.title).toBe('unsaved');
    expect(readDraft('p1')?.baseRevision).toBe(3);
    vi.advanceTimersByTime(AUTOSAVE_DELAY_MS);
    ctl.expectOne('/api/patterns/p1').flush({ error: 'Internal server error', details: null }, { status: 500, statusText: 'Server Error' });
    expect(autosave.status()).toBe('error');
    expect(autosave.dirty()).toBe(true);
    expect(readDraft('p1')?.document.title).toBe('unsaved');
  });

  it('chains the next save on the revision the last one made', () => {
    autosave.change(doc('a'));
    vi.advanceTimersByTime(AUTOSAVE_DELAY_MS);
    const first = ctl.expectOne('/api/patterns/p1');
    autosave.change(doc('b'));
    first.flush({ pattern: {}, revision: { number: 4, document: doc('a') } });
    expect(saved).toEqual([['a', 4, false]]);
    vi.advanceTimersByTime(AUTOSAVE_DELAY_MS);
    const second = ctl.expectOne('/api/patterns/p1');
    expect(second.request.body.baseRevision).toBe(4);
    expect(second.request.body.document.title).toBe('b');
    second.flush({ pattern: {}, revision: { number: 5, document: doc('b') } });
    expect(autosave.status()).toBe('saved');
  });

  it('stops on a stale save, keeps the drawing, and can save it on top of the other revision', () => {
    autosave.change(doc('mine'));
    vi.advanceTimersByTime(AUTOSAVE_DELAY_MS);
    const latest = { number: 7, author: { id: 'u2', displayName: 'Bea' }, document: doc('theirs'), createdAt: '2026-12-01T22:00:00Z' };
    ctl
      .expectOne('/api/patterns/p1')
      .flush({ error: 'This pattern was saved by someone else since revision 3', details: { latest } }, { status: 409, statusText: 'Conflict' });
    expect(autosave.status()).toBe('conflict');
    expect(autosave.conflict()?.number).toBe(7);
    expect(autosave.pending()?.title).toBe('mine');
    expect(readDraft('p1')?.document.title).toBe('mine');
    // More drawing during the conflict is kept but not sent.
    autosave.change(doc('mine, more'));
    vi.advanceTimersByTime(AUTOSAVE_DELAY_MS * 2);
    ctl.expectNone('/api/patterns/p1');
    autosave.saveOnTopOf(7);
    const put = ctl.expectOne('/api/patterns/p1');
    expect(put.request.body).toEqual({ baseRevision: 7, document: doc('mine, more') });
    put.flush({ pattern: {}, revision: { number: 8, document: doc('mine, more') } });
    expect(autosave.status()).toBe('saved');
    expect(autosave.conflict()).toBeNull();
  });
});
