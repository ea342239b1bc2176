import { TestBed } from '@angular/core/testing';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter, Router } from '@angular/router';
import { SignInComponent } from './sign-in.component';
import { csrfInterceptor } from '../core/csrf.interceptor';
import { formDriver } from '../testing/form-driver';

function setup() {
  TestBed.configureTestingModule({
    providers: [provideHttpClient(withInterceptors([csrfInterceptor])), provideHttpClientTesting(), provideRouter([])],
  });
  const fixture = TestBed.createComponent(SignInComponent);
  fixture.detectChanges();
  const http = TestBed.inject(HttpTestingController);
  const { el, type, submit, errors } = formDriver(fixture);
  return { fixture, el, http, type, submit, errors };
}

describe('SignInComponent', () => {
  it('says which fields are missing and sends nothing', async () => {
    const { submit, errors, http } = setup();
    await submit();
    expect(errors()).toEqual(['E-mail is required', 'Password is required']);
    http.expectNone(() => true);
  });

  it('explains a malformed e-mail address', async () => {
    const { type, submit, errors } = setup();
    type('E-mail', 'not-an-address');
    type('Password', 'whatever-it-is');
    await submit();
    expect(errors()).toEqual(['Enter an e-mail address like name@example.com']);
  });

  it('signs in with the CSRF token and goes to the patterns', async () => {
    const { type, submit, http, fixture } = setup();
    const router = TestBed.inject(Router);
    const nav = vi.spyOn(router, 'navigateByUrl').mockResolvedValue(true);
    type('E-mail', ' ada@example.com ');
    type('Password', 'correct horse battery');
    await submit();
    http.expectOne('/api/auth/csrf').flush({ csrfToken: 'tok-1' });
    const req = http.expectOne('/api/auth/sign-in');
    expect(req.request.headers.get('x-csrf-token')).toBe('tok-1');
    expect(req.request.withCredentials).toBe(true);
    expect(req.request.body).toEqual({ email: 'ada@example.com', password: 'correct horse battery' });
    req.flush({ user: { id: 'u1', email: 'ada@example.com', displayName: 'Ada', role: 'designer', disabled: false, createdAt: '' }, csrfToken: 'tok-2' });
    await fixture.whenStable();
    expect(nav).toHaveBeenCalledWith('/patterns');
  });

  it('shows the wrong-password answer in words', async () => {
    const { type, submit, http, fixture, el } = setup();
    type('E-mail', 'ada@example.com');
    type('Password', 'wrong');
    await submit();
    http.expectOne('/api/auth/csrf').flush({ csrfToken: 't' });
    http.expectOne('/api/auth/sign-in').flush({ error: 'Wrong e-mail or password', details: null }, { status: 401, statusText: 'Unauthorized' });
    await fixture.whenStable();
    expect(el.querySelector('[role=alert]')?.textContent).toContain('do not match an account');
  });
});
