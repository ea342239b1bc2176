import { TestBed } from '@angular/core/testing';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Router, provideRouter } from '@angular/router';
import { ChangePasswordComponent } from './change-password.component';
import { AuthService } from '../core/auth.service';
import { CsrfTokenService } from '../core/csrf-token.service';
import { csrfInterceptor } from '../core/csrf.interceptor';
import { sessionExpiredInterceptor } from '../core/session-expired.interceptor';

const inputs = (el: HTMLElement) => Array.from(el.querySelectorAll('input')) as HTMLInputElement[];

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
    const el = fixture.nativeElement as HTMLElement;
    const inputs = () => Array.from(el.querySelectorAll('input')) as HTMLInputElement[];
    const type = (i: number, v: string) => {
      const input = inputs()[i];
      input.value = v;
      input.dispatchEvent(new Event('input'));
      input.dispatchEvent(new Event('blur'));
    };
    const submit = async () => {
      (el.querySelector('button[type=submit]') as HTMLButtonElement).click();
      await fixture.whenStable();
    };
    return { fixture, el, type, submit, http, auth };
  }

  it('asks for the current password and a long enough new one, typed twice alike', async () => {
    const { el, type, submit, http } = await setup();
    type(1, 'short');
    type(2, 'different');
    await submit();
    expect(Array.from(el.querySelectorAll('mat-error')).map((e) => e.textContent?.trim())).toEqual([
      'Current password is required',
      'New password must be at least 10 characters',
      'The two passwords do not match',
    ]);
    http.verify();
  });

  it('sends both passwords and says the other sessions were signed out', async () => {
    const { fixture, el, type, submit, http } = await setup();
    expect(el.textContent).toContain('Signed in as mira@example.test');
    type(0, 'the old secret');
    type(1, 'a brand new secret');
    type(2, 'a brand new secret');
    await submit();
    const req = http.expectOne('/api/auth/change-password');
    expect(req.request.body).toEqual({ currentPassword: 'the old secret', newPassword: 'a brand new secret' });
    expect(req.request.headers.get('x-csrf-token')).toBe('t');
    req.flush({ ok: true });
    await fixture.whenStable();
    expect(el.querySelector('[role=status]')?.textContent).toContain('Your password is changed');
    // The emptied form is ready for another change, not full of "required" errors.
    fixture.detectChanges();
    expect(inputs(el).map((i) => i.value)).toEqual(['', '', '']);
    expect(el.querySelectorAll('mat-error').length).toBe(0);
  });

  it('puts a wrong current password on its field and keeps the user signed in', async () => {
    const { fixture, el, type, submit, http, auth } = await setup();
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigate');
    type(0, 'not the password');
    type(1, 'a brand new secret');
    type(2, 'a brand new secret');
    await submit();
    http
      .expectOne('/api/auth/change-password')
      .flush({ error: 'The current password is wrong', details: [{ path: 'currentPassword', message: 'does not match' }] }, { status: 401, statusText: 'Unauthorized' });
    await fixture.whenStable();
    expect(el.querySelector('mat-error')?.textContent?.trim()).toBe('does not match');
    expect(auth.signedIn()).toBe(true);
    expect(navigate).not.toHaveBeenCalled();
  });
});
