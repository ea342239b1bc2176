import { TestBed } from '@angular/core/testing';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter, Router } from '@angular/router';
import { SignInComponent } from './sign-in.component';
import { csrfInterceptor } from '../core/csrf.interceptor';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { fillIn, shownErrors } from '../testing/material-form';

function setup() {
  TestBed.configureTestingModule({
    providers: [provideHttpClient(withInterceptors([csrfInterceptor])), provideHttpClientTesting(), provideRouter([])],
  });
  const fixture = TestBed.createComponent(SignInComponent);
  fixture.detectChanges();
  const http = TestBed.inject(HttpTestingController);
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const submit = async () => (await loader.getHarness(MatButtonHarness.with({ text: 'Sign in' }))).click();
  return { fixture, el: fixture.nativeElement as HTMLElement, http, loader, submit };
}

describe('SignInComponent', () => {
  it('says which fields are missing and sends nothing', async () => {
    const { submit, loader, http } = setup();
    await submit();
    expect(await shownErrors(loader)).toEqual(['E-mail is required', 'Password is required']);
    http.expectNone(() => true);
  });

  it('explains a malformed e-mail address', async () => {
    const { loader, submit } = setup();
    await fillIn(loader, { 'E-mail': 'not-an-address', Password: 'whatever-it-is' });
    await submit();
    expect(await shownErrors(loader)).toEqual(['Enter an e-mail address like name@example.com']);
  });

  it('signs in with the CSRF token and goes to the patterns', async () => {
    const { loader, submit, http, fixture } = setup();
    const router = TestBed.inject(Router);
    const nav = vi.spyOn(router, 'navigateByUrl').mockResolvedValue(true);
    await fillIn(loader, { 'E-mail': ' ada@example.com ', Password: 'correct horse battery' });
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
    const { loader, submit, http, fixture, el } = setup();
    await fillIn(loader, { 'E-mail': 'ada@example.com', Password: 'wrong' });
    await submit();
    http.expectOne('/api/auth/csrf').flush({ csrfToken: 't' });
    http.expectOne('/api/auth/sign-in').flush({ error: 'Wrong e-mail or password', details: null }, { status: 401, statusText: 'Unauthorized' });
    await fixture.whenStable();
    expect(el.querySelector('[role=alert]')?.textContent).toContain('do not match an account');
  });
});
