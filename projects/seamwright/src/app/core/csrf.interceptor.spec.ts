import { TestBed } from '@angular/core/testing';
import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { csrfInterceptor } from './csrf.interceptor';

describe('csrfInterceptor', () => {
  let http: HttpClient;
  let ctl: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(withInterceptors([csrfInterceptor])), provideHttpClientTesting()] });
    http = TestBed.inject(HttpClient);
    ctl = TestBed.inject(HttpTestingController);
  });

  afterEach(() => ctl.verify());

  it('sends reads with the cookie and without a token', () => {
    http.get('/api/patterns').subscribe();
    const req = ctl.expectOne('/api/patterns');
    expect(req.request.withCredentials).toBe(true);
    expect(req.request.headers.has('x-csrf-token')).toBe(false);
    req.flush({});
  });

  it('fetches the token once and puts it on every write', () => {
    http.post('/api/patterns', {}).subscribe();
    ctl.expectOne('/api/auth/csrf').flush({ csrfToken: 'abc' });
    expect(ctl.expectOne('/api/patterns').request.headers.get('x-csrf-token')).toBe('abc');
    http.delete('/api/patterns/p1').subscribe();
    const del = ctl.expectOne('/api/patterns/p1');
    expect(del.request.headers.get('x-csrf-token')).toBe('abc');
    expect(del.request.withCredentials).toBe(true);
  });

  it('retries once with a fresh token when the server refuses the old one', () => {
    let status = 0;
    http.put('/api/patterns/p1', {}, { observe: 'response' }).subscribe((r) => (status = r.status));
    ctl.expectOne('/api/auth/csrf').flush({ csrfToken: 'old' });
    ctl.expectOne('/api/patterns/p1').flush({ error: 'Missing or invalid CSRF token', details: null }, { status: 403, statusText: 'Forbidden' });
    ctl.expectOne('/api/auth/csrf').flush({ csrfToken: 'new' });
    const retry = ctl.expectOne('/api/patterns/p1');
    expect(retry.request.headers.get('x-csrf-token')).toBe('new');
    retry.flush({});
    expect(status).toBe(200);
  });

  it('does not retry other refusals', () => {
    let error: unknown;
    http.post('/api/patterns', {}).subscribe({ error: (e) => (error = e) });
    ctl.expectOne('/api/auth/csrf').flush({ csrfToken: 't' });
    ctl.expectOne('/api/patterns').flush({ error: 'Only designers create patterns', details: null }, { status: 403, statusText: 'Forbidden' });
    expect((error as { status: number }).status).toBe(403);
  });

  it('leaves other origins alone', () => {
    http.post('http://127.0.0.1:2580/api/messages', {}).subscribe();
    const req = ctl.expectOne('http://127.0.0.1:2580/api/messages');
    expect(req.request.withCredentials).toBe(false);
    expect(req.request.headers.has('x-csrf-token')).toBe(false);
    req.flush({});
  });
});
