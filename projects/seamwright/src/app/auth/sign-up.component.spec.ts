import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { SignUpComponent } from './sign-up.component';
import { CsrfTokenService } from '../core/csrf-token.service';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatRadioButtonHarness } from '@angular/material/radio/testing';
import { errorsUnder, fillIn } from '../testing/material-form';

function setup() {
  TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
  TestBed.inject(CsrfTokenService).remember('t');
  const fixture = TestBed.createComponent(SignUpComponent);
  fixture.detectChanges();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const submit = async () => (await loader.getHarness(MatButtonHarness.with({ text: 'Create account' }))).click();
  return { fixture, el: fixture.nativeElement as HTMLElement, loader, submit, http: TestBed.inject(HttpTestingController) };
}

const complete = { 'Your name': 'Ada', 'E-mail': 'ada@example.com', Password: 'long enough password', 'Password again': 'long enough password' };

describe('SignUpComponent', () => {
  it('asks for a password of at least 10 characters', async () => {
    const { loader, submit } = setup();
    await fillIn(loader, { Password: 'short' });
    await submit();
    expect(await errorsUnder(loader, 'Password')).toEqual(['Password must be at least 10 characters']);
    expect(await errorsUnder(loader, 'Your name')).toEqual(['Your name is required']);
  });

  it('says when the two passwords differ', async () => {
    const { loader, submit, http } = setup();
    await fillIn(loader, { ...complete, 'Password again': 'long enough passw0rd' });
    await submit();
    expect(await errorsUnder(loader, 'Password again')).toEqual(['The two passwords do not match']);
    http.expectNone('/api/auth/sign-up');
  });

  it('sends the chosen role and shows a taken address in words', async () => {
    const { loader, submit, http, fixture, el } = setup();
    await fillIn(loader, { ...complete, 'Your name': 'Quinn', 'E-mail': 'quinn@example.com' });
    await (await loader.getHarness(MatRadioButtonHarness.with({ label: 'sew patterns shared with me (quilter)' }))).check();
    await submit();
    const req = http.expectOne('/api/auth/sign-up');
    expect(req.request.body).toEqual({ displayName: 'Quinn', email: 'quinn@example.com', password: 'long enough password', role: 'quilter' });
    req.flush({ error: 'E-mail already registered', details: null }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    expect(el.querySelector('[role=alert]')?.textContent).toContain('already exists');
  });

  it('puts server field issues under the field they name', async () => {
    const { loader, submit, http, fixture } = setup();
    await fillIn(loader, complete);
    await submit();
    http
      .expectOne('/api/auth/sign-up')
      .flush({ error: 'Invalid request', details: [{ path: 'password', message: 'must be at most 72 bytes' }] }, { status: 400, statusText: 'Bad Request' });
    await fixture.whenStable();
    expect(await errorsUnder(loader, 'Password')).toEqual(['must be at most 72 bytes']);
  });
});
