import { TestBed } from '@angular/core/testing';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Router, provideRouter } from '@angular/router';
import { ChangePasswordComponent } from './change-password.component';
import { AuthService } from '../core/auth.service';
import { CsrfTokenService } from '../core/csrf-token.service';
import { csrfInterceptor } from '../core/csrf.interceptor';
import { sessionExpiredInterceptor } from '../core/session-expired.interceptor';
import { formDriver } from '../testing/form-driver';

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
    const { el, type, submit, errors, errorOf, values } = formDriver(fixture);
    return { fixture, el, type, submit, errors, errorOf, values, http, auth };
  }

  it('asks for the current password and a long enough new one, typed twice alike', async () => {
    const { type, submit, errors, http } = await setup();
    type('New password', 'short');
    type('New password again', 'different');
    await submit();
    expect(errors()).toEqual([
      'Current password is required',
      'New password must be at least 10 characters',
      'The two passwords do not match',
    ]);
    http.verify();
  });

  it('sends both passwords and says the other sessions were signed out', async () => {
    const { fixture, el, type, submit, errors, values, http } = await setup();
    expect(el.textContent).toContain('Signed in as mira@example.test');
    type('Current password', 'the old secret');
    type('New password', 'a brand new secret');
    type('New password again', 'a brand new secret');
    await submit();
    const req = http.expectOne('/api/auth/change-password');
    expect(req.request.body).toEqual({ currentPassword: 'the old secret', newPassword: 'a brand new secret' });
    expect(req.request.headers.get('x-csrf-token')).toBe('t');
    req.flush({ ok: true });
    await fixture.whenStable();
    expect(el.querySelector('[role=status]')?.textContent).toContain('Your password is changed');
    // The emptied form is ready for another change, not full of "required" errors.
    fixture.detectChanges();
    expect(values()).toEqual(['', '', '']);
    expect(errors()).toEqual([]);
  });

  it('puts a wrong current password on its field and keeps the user signed in', async () => {
    const { fixture, type, submit, errorOf, http, auth } = await setup();
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigate');
    type('Current password', 'not the password');
    type('New password', 'a brand new secret');
    type('New password again', 'a brand new secret');
    await submit();
    http
      .expectOne('/api/auth/change-password')
      .flush({ error: 'The current password is wrong', details: [{ path: 'currentPassword', message: 'does not match' }] }, { status: 401, statusText: 'Unauthorized' });
    await fixture.whenStable();
    expect(errorOf('Current password')).toBe('does not match');
    expect(auth.signedIn()).toBe(true);
    expect(navigate).not.toHaveBeenCalled();
  });
});
