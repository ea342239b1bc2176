import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { SignUpComponent } from './sign-up.component';
import { CsrfTokenService } from '../core/csrf-token.service';
import { formDriver } from '../testing/form-driver';

function setup() {
  TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
  TestBed.inject(CsrfTokenService).remember('t');
  const fixture = TestBed.createComponent(SignUpComponent);
  fixture.detectChanges();
  const { el, type, submit, errorOf } = formDriver(fixture);
  return { fixture, el, type, submit, errorOf, http: TestBed.inject(HttpTestingController) };
}

describe('SignUpComponent', () => {
  it('asks for a password of at least 10 characters', async () => {
    const { type, submit, errorOf } = setup();
    type('Password', 'short');
    await submit();
    expect(errorOf('Password')).toBe('Password must be at least 10 characters');
    expect(errorOf('Your name')).toBe('Your name is required');
  });

  it('says when the two passwords differ', async () => {
    const { type, submit, errorOf, http } = setup();
    type('Your name', 'Ada');
    type('E-mail', 'ada@example.com');
    type('Password', 'long enough password');
    type('Password again', 'long enough passw0rd');
    await submit();
    expect(errorOf('Password again')).toBe('The two passwords do not match');
    http.expectNone('/api/auth/sign-up');
  });

  it('sends the chosen role and shows a taken address in words', async () => {
    const { type, submit, http, fixture, el } = setup();
    type('Your name', 'Quinn');
    type('E-mail', 'quinn@example.com');
    type('Password', 'long enough password');
    type('Password again', 'long enough password');
    (el.querySelectorAll('mat-radio-button input')[1] as HTMLInputElement).click();
    await submit();
    const req = http.expectOne('/api/auth/sign-up');
    expect(req.request.body).toEqual({ displayName: 'Quinn', email: 'quinn@example.com', password: 'long enough password', role: 'quilter' });
    req.flush({ error: 'E-mail already registered', details: null }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    expect(el.querySelector('[role=alert]')?.textContent).toContain('already exists');
  });

  it('puts server field issues under the field they name', async () => {
    const { type, submit, http, fixture, errorOf } = setup();
    type('Your name', 'Ada');
    type('E-mail', 'ada@example.com');
    type('Password', 'long enough password');
    type('Password again', 'long enough password');
    await submit();
    http
      .expectOne('/api/auth/sign-up')
      .flush({ error: 'Invalid request', details: [{ path: 'password', message: 'must be at most 72 bytes' }] }, { status: 400, statusText: 'Bad Request' });
    await fixture.whenStable();
    expect(errorOf('Password')).toBe('must be at most 72 bytes');
  });
});
