import { TestBed } from '@angular/core/testing';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Router, provideRouter } from '@angular/router';
import { ChangePasswordComponent } from './change-password.component';
import { AuthService } from '../core/auth.service';
import { CsrfTokenService } from '../core/csrf-token.service';
import { csrfInterceptor } from '../core/csrf.interceptor';
import { sessionExpiredInterceptor } from '../core/session-expired.interceptor';
import { parallel } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { errorsUnder, fillIn, shownErrors } from '../testing/material-form';

describe('ChangePasswordComponent', () => {
  async function setup() {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(withInterceptors([csrfInterceptor, sessionExpiredInterceptor])), provideHttpClientTesting(), provideRouter([])],
    });
    const http = TestBed.inject(HttpTestingController);
    const auth = TestBed.inject(AuthService);
    auth.load().subscribe();
    http.expectOne('/api/auth/session').flush({ user: { id: 'u1', email: 'mira@example.test', displayName: 'Mira', role: 'designer' }, csrfToken: 't' });
    TestBed.inject(CsrfTokenService).remember('t');
    const fixture = TestBed.createComponent(ChangePasswordComponent);
    fixture.detectChanges();
    await fixture.whenStable();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const submit = async () => (await loader.getHarness(MatButtonHarness.with({ text: 'Change password' }))).click();
    return { fixture, el: fixture.nativeElement as HTMLElement, loader, submit, http, auth };
  }

  const newSecret = { 'New password': 'a brand new secret', 'New password again': 'a brand new secret' };

  it('asks for the current password and a long enough new one, typed twice alike', async () => {
    const { loader, submit, http } = await setup();
    await fillIn(loader, { 'New password': 'short', 'New password again': 'different' });
    await submit();
    expect(await shownErrors(loader)).toEqual([
      'Current password is required',
      'New password must be at least 10 characters',
      'The two passwords do not match',
    ]);
    http.verify();
  });

  it('sends both passwords and says the other sessions were signed out', async () => {
    const { fixture, el, loader, submit, http } = await setup();
    expect(el.textContent).toContain('Signed in as mira@example.test');
    await fillIn(loader, { 'Current password': 'the old secret', ...newSecret });
    await submit();
    const req = http.expectOne('/api/auth/change-password');
    expect(req.request.body).toEqual({ currentPassword: 'the old secret', newPassword: 'a brand new secret' });
    expect(req.request.headers.get('x-csrf-token')).toBe('t');
    req.flush({ ok: true });
    await fixture.whenStable();
    expect(el.querySelector('[role=status]')?.textContent).toContain('Your password is changed');
    // The emptied form is ready for another change, not full of "required" errors.
    const inputs = await loader.getAllHarnesses(MatInputHarness);
    expect(await parallel(() => inputs.map((i) => i.getValue()))).toEqual(['', '', '']);
    expect(await shownErrors(loader)).toEqual([]);
  });

  it('puts a wrong current password on its field and keeps the user signed in', async () => {
    const { fixture, loader, submit, http, auth } = await setup();
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigate');
    await fillIn(loader, { 'Current password': 'not the password', ...newSecret });
    await submit();
    http
      .expectOne('/api/auth/change-password')
      .flush({ error: 'The current password is wrong', details: [{ path: 'currentPassword', message: 'does not match' }] }, { status: 401, statusText: 'Unauthorized' });
    await fixture.whenStable();
    expect(await errorsUnder(loader, 'Current password')).toEqual(['does not match']);
    expect(auth.signedIn()).toBe(true);
    expect(navigate).not.toHaveBeenCalled();
  });
});
