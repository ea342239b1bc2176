import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { PrintSetsService, formatBytes, percent } from './print-sets.service';
import { SewingLogService } from './sewing-log.service';
import { MembersService } from './members.service';
import type { PrintSet } from '../core/api-types';

const set = (status: PrintSet['status'], progress: number) => ({ printSet: { id: 's1', status, progress } as PrintSet });

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

  it('polls until the print set is done, then stops', () => {
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

  it('writes sizes and progress for people', () => {
    expect(formatBytes(512)).toBe('512 B');
    expect(formatBytes(2048)).toBe('2 kB');
    expect(formatBytes(5.5 * 1024 * 1024)).toBe('5.5 MB');
    expect(percent(0.456)).toBe(46);
    expect(percent(1.2)).toBe(100);
  });

  it('logs a stage with PUT and clears it with null', () => {
    const log = TestBed.inject(SewingLogService);
    log.mark('p1', 'sec-a', 'sewn').subscribe();
    const put = ctl.expectOne('/api/patterns/p1/sewing-log/sec-a');
    expect(put.request.method).toBe('PUT');
    expect(put.request.body).toEqual({ stage: 'sewn' });
    put.flush({ entry: { sectionId: 'sec-a', stage: 'sewn' } });
    log.mark('p1', 'sec-a', null).subscribe();
    expect(ctl.expectOne('/api/patterns/p1/sewing-log/sec-a').request.body).toEqual({ stage: null });
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
