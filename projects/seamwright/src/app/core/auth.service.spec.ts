import { TestBed } from '@angular/core/testing';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { AuthService } from './auth.service';
import { csrfInterceptor } from './csrf.interceptor';
import { CsrfTokenService } from './csrf-token.service';

const ada = { id: 'u1', email: 'ada@example.com', displayName: 'Ada', role: 'designer' as const, disabled: false, createdAt: '' };

describe('AuthService', () => {
  let auth: AuthService;
  let ctl: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(withInterceptors([csrfInterceptor])), provideHttpClientTesting()] });
    auth = TestBed.inject(AuthService);
    ctl = TestBed.inject(HttpTestingController);
  });

  it('takes a session answer without a user as signed out, and keeps its CSRF token', () => {
    let user: unknown = 'unset';
    auth.load().subscribe((u) => (user = u));
    ctl.expectOne('/api/auth/session').flush({ user: null, csrfToken: 'anon-token' });
    expect(user).toBeNull();
    expect(auth.signedIn()).toBe(false);
    let token = '';
    TestBed.inject(CsrfTokenService).get().subscribe((t) => (token = t));
    expect(token).toBe('anon-token');
  });

  it('takes a 401 from the session probe as signed out', () => {
    let user: unknown = 'unset';
    auth.load().subscribe((u) => (user = u));
    ctl.expectOne('/api/auth/session').flush({ error: 'Not signed in', details: null }, { status: 401, statusText: 'Unauthorized' });
    expect(user).toBeNull();
  });

  it('asks the server once however many guards ask', () => {
    auth.load().subscribe();
    auth.load().subscribe();
    ctl.expectOne('/api/auth/session').flush({ user: ada, csrfToken: 't' });
    expect(auth.user()?.displayName).toBe('Ada');
    expect(auth.canDesign()).toBe(true);
  });

  it('uses the token that comes with sign-in for the next write', () => {
    TestBed.inject(CsrfTokenService).remember('anonymous');
    auth.signIn('ada@example.com', 'pw').subscribe();
    const signIn = ctl.expectOne('/api/auth/sign-in');
    expect(signIn.request.headers.get('x-csrf-token')).toBe('anonymous');
    signIn.flush({ user: ada, csrfToken: 'session-token' });
    auth.signOut().subscribe();
    expect(ctl.expectOne('/api/auth/sign-out').request.headers.get('x-csrf-token')).toBe('session-token');
  });
});
