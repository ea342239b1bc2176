import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { PrintSetsService, formatBytes, percent } from './print-sets.service';
import { SewingLogService } from './sewing-log.service';
import { MembersService } from './members.service';
import type { PrintSet } from '../core/api-types';
import { EVENT_SOURCE } from './server-events';

const set = (status: PrintSet['status'], progress: number) => ({ printSet: { id: 's1', status, progress } as PrintSet });

/** Stands in for the browser's EventSource: the spec sends the server's events and failures by hand. */
class FakeEventSource {
  static made: FakeEventSource[] = [];
  closed = false;
  private readonly listeners = new Map<string, Array<(e: Event) => void>>();

  constructor(
    readonly url: string,
    readonly init?: EventSourceInit,
  ) {
    FakeEventSource.made.push(this);
  }

  addEventListener(type: string, listener: (e: Event) => void): void {
    this.listeners.set(type, [...(this.listeners.get(type) ?? []), listener]);
  }

  close(): void {
    this.closed = true;
  }

  /** A `progress` event as the server writes it (`event: progress`, `data: <print set JSON>`). */
  progress(status: PrintSet['status'], progress: number): void {
    if (this.closed) return;
    for (const l of this.listeners.get('progress') ?? []) l(new MessageEvent('progress', { data: JSON.stringify(set(status, progress).printSet) }));
  }

  fail(): void {
    if (this.closed) return;
    for (const l of this.listeners.get('error') ?? []) l(new Event('error'));
  }
}

describe('PrintSetsService and friends', () => {
  let ctl: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    ctl = TestBed.inject(HttpTestingController);
  });

  afterEach(() => {
    vi.useRealTimers();
    ctl.verify();
  });

  it('queues a print set of the given revision with its options', () => {
    let id = '';
    TestBed.inject(PrintSetsService)
      .create('p1', { paper: 'a4', mirrored: true }, 3)
      .subscribe((s) => (id = s.id));
    const req = ctl.expectOne('/api/patterns/p1/print-sets');
    expect(req.request.body).toEqual({ options: { paper: 'a4', mirrored: true }, revision: 3 });
    req.flush(set('queued', 0), { status: 202, statusText: 'Accepted' });
    expect(id).toBe('s1');
  });

  it('polls until the print set is done, then stops, where the browser has no EventSource (jsdom)', () => {
    expect(TestBed.inject(EVENT_SOURCE)).toBeNull();
    vi.useFakeTimers();
    const seen: string[] = [];
    let complete = false;
    TestBed.inject(PrintSetsService)
      .follow('p1', 's1', 500)
      .subscribe({ next: (s) => seen.push(`${s.status}:${s.progress}`), complete: () => (complete = true) });
    vi.advanceTimersByTime(0);
    ctl.expectOne('/api/patterns/p1/print-sets/s1').flush(set('queued', 0));
    vi.advanceTimersByTime(500);
    ctl.expectOne('/api/patterns/p1/print-sets/s1').flush(set('rendering', 0.5));
    vi.advanceTimersByTime(500);
    ctl.expectOne('/api/patterns/p1/print-sets/s1').flush(set('done', 1));
    vi.advanceTimersByTime(2000);
    ctl.expectNone('/api/patterns/p1/print-sets/s1');
    expect(seen).toEqual(['queued:0', 'rendering:0.5', 'done:1']);
    expect(complete).toBe(true);
  });

  describe('over the event stream', () => {
    beforeEach(() => {
      FakeEventSource.made = [];
      TestBed.resetTestingModule();
      TestBed.configureTestingModule({
        providers: [provideHttpClient(), provideHttpClientTesting(), { provide: EVENT_SOURCE, useValue: FakeEventSource }],
      });
      ctl = TestBed.inject(HttpTestingController);
    });

    it('follows the print set by its events, with the session cookie, and closes the stream when it is done', () => {
      const seen: string[] = [];
      let complete = false;
      TestBed.inject(PrintSetsService)
        .follow('p 1', 's1')
        .subscribe({ next: (s) => seen.push(`${s.status}:${s.progress}`), complete: () => (complete = true) });
      const [source] = FakeEventSource.made;
      expect(source.url).toBe('/api/patterns/p%201/print-sets/s1/events');
      expect(source.init).toEqual({ withCredentials: true });
      source.progress('queued', 0);
      source.progress('rendering', 0.5);
      expect(complete).toBe(false);
      source.progress('done', 1);
      expect(seen).toEqual(['queued:0', 'rendering:0.5', 'done:1']);
      expect(complete).toBe(true);
      expect(source.closed).toBe(true);
      // No request was polled (afterEach verifies that none is left open either).
      ctl.expectNone(() => true);
    });

    it('ends with a failed print set too', () => {
      const seen: string[] = [];
      let complete = false;
      TestBed.inject(PrintSetsService)
        .follow('p1', 's1')
        .subscribe({ next: (s) => seen.push(s.status), complete: () => (complete = true) });
      FakeEventSource.made[0].progress('failed', 0.3);
      expect([seen, complete, FakeEventSource.made[0].closed]).toEqual([['failed'], true, true]);
    });

    it('falls back to polling when the stream fails on the way', () => {
      vi.useFakeTimers();
      const seen: string[] = [];
      let complete = false;
      TestBed.inject(PrintSetsService)
        .follow('p1', 's1', 500)
        .subscribe({ next: (s) => seen.push(`${s.status}:${s.progress}`), complete: () => (complete = true) });
      const [source] = FakeEventSource.made;
      source.progress('rendering', 0.25);
      source.fail();
      expect(source.closed).toBe(true);
      vi.advanceTimersByTime(0);
      ctl.expectOne('/api/patterns/p1/print-sets/s1').flush(set('rendering', 0.5));
      vi.advanceTimersByTime(500);
      ctl.expectOne('/api/patterns/p1/print-sets/s1').flush(set('done', 1));
      vi.advanceTimersByTime(2000);
      ctl.expectNone('/api/patterns/p1/print-sets/s1');
      expect(seen).toEqual(['rendering:0.25', 'rendering:0.5', 'done:1']);
      expect(complete).toBe(true);
      expect(FakeEventSource.made).toHaveLength(1);
    });

    it('closes the stream when the page stops following', () => {
      const sub = TestBed.inject(PrintSetsService).follow('p1', 's1').subscribe();
      FakeEventSource.made[0].progress('queued', 0);
      sub.unsubscribe();
      expect(FakeEventSource.made[0].closed).toBe(true);
    });
  });

  it('writes sizes and progress for people', () => {
    expect(formatBytes(512)).toBe('512 B');
    expect(formatBytes(2048)).toBe('2 kB');
    expect(formatBytes(5.5 * 1024 * 1024)).toBe('5.5 MB');
    expect(percent(0.456)).toBe(46);
    expect(percent(1.2)).toBe(100);
  });

  it('logs a copy\'s stage with PUT and clears it with null', () => {
    const log = TestBed.inject(SewingLogService);
    log.mark('p1', 'sec-a', 3, 'pieced').subscribe();
    const put = ctl.expectOne('/api/patterns/p1/sewing-log/sec-a');
    expect(put.request.method).toBe('PUT');
    expect(put.request.body).toEqual({ stage: 'pieced', copy: 3 });
    put.flush({ entry: { sectionId: 'sec-a', copy: 3, stage: 'pieced' } });
    log.mark('p1', 'sec-a', 3, null).subscribe();
    expect(ctl.expectOne('/api/patterns/p1/sewing-log/sec-a').request.body).toEqual({ stage: null, copy: 3 });
  });

  it('accepts an invitation by token and hands back the pattern', () => {
    let id = '';
    TestBed.inject(MembersService)
      .accept('tok/1')
      .subscribe((p) => (id = p.id));
    const req = ctl.expectOne('/api/invitations/accept');
    expect(req.request.body).toEqual({ token: 'tok/1' });
    req.flush({ pattern: { id: 'p9' } });
    expect(id).toBe('p9');
  });
});
