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
    expect(put.request.body).toEqual({ baseRevision: 3, document: doc('two'), editSession: autosave.editSession });
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
    // One editing session for every save of this board: History shows them as one row.
    expect(second.request.body.editSession).toBe(first.request.body.editSession);
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
    expect(put.request.body).toEqual({ baseRevision: 7, document: doc('mine, more'), editSession: autosave.editSession });
    put.flush({ pattern: {}, revision: { number: 8, document: doc('mine, more') } });
    expect(autosave.status()).toBe('saved');
    expect(autosave.conflict()).toBeNull();
  });

  it('makes a new random editing session for each opening of the board, in the form the server takes', () => {
    const other = TestBed.runInInjectionContext(() => new BoardAutosave(() => undefined));
    // The server's rule (docs/api.md): 8–64 of letters, digits, "-" and "_".
    expect(autosave.editSession).toMatch(/^[A-Za-z0-9_-]{8,64}$/);
    expect(other.editSession).toMatch(/^[A-Za-z0-9_-]{8,64}$/);
    expect(other.editSession).not.toBe(autosave.editSession);
  });

  describe('named versions', () => {
    const revision = (number: number, title: string, version: { name: string; note: string | null } | null) => ({
      number,
      document: doc(title),
      version,
      author: { id: 'u1', displayName: 'Ada' },
      createdAt: '2026-12-01T22:00:00Z',
    });

    it('keeps the unsaved drawing as the version, so it is not saved twice', async () => {
      autosave.change(doc('drawn'));
      const done = autosave.saveVersion({ name: 'First fitting', note: '  Before the border ' });
      const post = ctl.expectOne('/api/patterns/p1/revisions');
      expect(post.request.method).toBe('POST');
      expect(post.request.body).toEqual({ baseRevision: 3, name: 'First fitting', note: 'Before the border', document: doc('drawn'), editSession: autosave.editSession });
      expect(autosave.status()).toBe('saving');
      post.flush({ pattern: {}, revision: revision(4, 'drawn', { name: 'First fitting', note: 'Before the border' }) });
      expect((await done).version?.name).toBe('First fitting');
      expect(autosave.status()).toBe('saved');
      expect(autosave.lastSavedRevision()).toBe(4);
      expect(saved).toEqual([['drawn', 4, true]]);
      expect(readDraft('p1')).toBeNull();
      // The pause after the change ends with nothing left to save.
      vi.advanceTimersByTime(AUTOSAVE_DELAY_MS);
      ctl.expectNone('/api/patterns/p1');
    });

    it('names the latest revision as it stands when nothing is unsaved (no document, no empty note)', async () => {
      const done = autosave.saveVersion({ name: 'As is', note: '   ' });
      const post = ctl.expectOne('/api/patterns/p1/revisions');
      expect(post.request.body).toEqual({ baseRevision: 3, name: 'As is', editSession: autosave.editSession });
      post.flush({ pattern: {}, revision: revision(4, 'server', { name: 'As is', note: null }) });
      expect((await done).number).toBe(4);
      expect(saved).toEqual([['server', 4, true]]);
    });

    it('waits for the save in flight and names on top of the revision it made', async () => {
      autosave.change(doc('a'));
      vi.advanceTimersByTime(AUTOSAVE_DELAY_MS);
      const put = ctl.expectOne('/api/patterns/p1');
      const done = autosave.saveVersion({ name: 'After a' });
      ctl.expectNone('/api/patterns/p1/revisions');
      put.flush({ pattern: {}, revision: { number: 4, document: doc('a') } });
      const post = ctl.expectOne('/api/patterns/p1/revisions');
      expect(post.request.body).toEqual({ baseRevision: 4, name: 'After a', editSession: autosave.editSession });
      post.flush({ pattern: {}, revision: revision(5, 'a', { name: 'After a', note: null }) });
      expect((await done).number).toBe(5);
      expect(autosave.lastSavedRevision()).toBe(5);
    });

    it('answers a stale base as autosave does: the conflict is shown, the drawing kept, the version refused', async () => {
      autosave.change(doc('mine'));
      const done = autosave.saveVersion({ name: 'Mine' });
      const latest = revision(7, 'theirs', null);
      ctl
        .expectOne('/api/patterns/p1/revisions')
        .flush({ error: 'This pattern was saved by someone else since revision 3', details: { latest } }, { status: 409, statusText: 'Conflict' });
      await expect(done).rejects.toThrow('This pattern was saved by someone else since revision 3');
      expect(autosave.status()).toBe('conflict');
      expect(autosave.conflict()?.number).toBe(7);
      expect(autosave.pending()?.title).toBe('mine');
      // While the conflict is open, no version is sent.
      await expect(autosave.saveVersion({ name: 'Again' })).rejects.toThrow(/Someone else saved first/);
      ctl.expectNone('/api/patterns/p1/revisions');
    });

    it('keeps the drawing unsaved when the version fails for another reason', async () => {
      autosave.change(doc('mine'));
      const done = autosave.saveVersion({ name: 'x'.repeat(10) });
      ctl
        .expectOne('/api/patterns/p1/revisions')
        .flush({ error: 'Invalid request', details: [{ path: 'name', message: 'must not be empty' }] }, { status: 400, statusText: 'Bad Request' });
      await expect(done).rejects.toThrow('Invalid request');
      expect(autosave.status()).toBe('error');
      expect(autosave.pending()?.title).toBe('mine');
      expect(readDraft('p1')?.document.title).toBe('mine');
    });
  });
});
