import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { ResetConfirmComponent } from './reset-confirm.component';
import { CsrfTokenService } from '../core/csrf-token.service';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { fillIn, shownErrors } from '../testing/material-form';

describe('ResetConfirmComponent', () => {
  function setup() {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    TestBed.inject(CsrfTokenService).remember('t');
    const fixture = TestBed.createComponent(ResetConfirmComponent);
    fixture.componentRef.setInput('token', 'reset-token-1');
    fixture.detectChanges();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const submit = async () => (await loader.getHarness(MatButtonHarness.with({ text: 'Save the new password' }))).click();
    return { fixture, el: fixture.nativeElement as HTMLElement, loader, submit, http: TestBed.inject(HttpTestingController) };
  }

  it('requires a long enough new password', async () => {
    const { fixture, loader, submit } = setup();
    await fixture.whenStable();
    await fillIn(loader, { 'New password': 'abc' });
    await submit();
    expect(await shownErrors(loader)).toEqual([
      'New password must be at least 10 characters',
      'New password again is required',
    ]);
  });

  it('sends the token with the new password and says so when done', async () => {
    const { fixture, el, loader, submit, http } = setup();
    await fixture.whenStable();
    await fillIn(loader, { 'New password': 'a brand new secret', 'New password again': 'a brand new secret' });
    await submit();
    const req = http.expectOne('/api/auth/password-reset/confirm');
    expect(req.request.body).toEqual({ token: 'reset-token-1', newPassword: 'a brand new secret' });
    req.flush({ ok: true });
    await fixture.whenStable();
    expect(el.querySelector('[role=status]')?.textContent).toContain('Your password is changed');
  });

  it('explains an expired link', async () => {
    const { fixture, el, loader, submit, http } = setup();
    await fixture.whenStable();
    await fillIn(loader, { 'New password': 'a brand new secret', 'New password again': 'a brand new secret' });
    await submit();
    http
      .expectOne('/api/auth/password-reset/confirm')
      .flush({ error: 'This reset link is invalid or has expired', details: null }, { status: 400, statusText: 'Bad Request' });
    await fixture.whenStable();
    expect(el.querySelector('[role=alert]')?.textContent).toContain('This reset link is invalid or has expired');
  });
});
