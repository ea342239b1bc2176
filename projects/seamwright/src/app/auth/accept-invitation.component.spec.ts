import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Router, provideRouter } from '@angular/router';
import { AcceptInvitationComponent } from './accept-invitation.component';
import { CsrfTokenService } from '../core/csrf-token.service';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';

const invitation = { patternTitle: 'Orchard Wheel', invitedBy: { displayName: 'Mira' }, email: 'jonah@example.test', access: 'quilter', expiresAt: '2026-12-08T00:00:00Z' };

describe('AcceptInvitationComponent', () => {
  async function setup(signedIn: boolean) {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    TestBed.inject(CsrfTokenService).remember('t');
    const fixture = TestBed.createComponent(AcceptInvitationComponent);
    fixture.componentRef.setInput('token', 'tok-9');
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    const me = http.expectOne('/api/auth/session');
    if (signedIn) me.flush({ user: { id: 'u3', email: 'jonah@example.test', displayName: 'Jonah', role: 'quilter', disabled: false, createdAt: '' } });
    else me.flush({ user: null, csrfToken: 'anon' });
    http.expectOne('/api/invitations/tok-9').flush({ invitation });
    await fixture.whenStable();
    return { fixture, http, el: fixture.nativeElement as HTMLElement, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('says who invites to what, and asks a signed-out person to create an account or sign in, coming back here', async () => {
    const { el } = await setup(false);
    expect(el.textContent).toContain('Mira invites you to Orchard Wheel as a quilter');
    const links = Array.from(el.querySelectorAll('a')).map((a) => [a.textContent?.trim(), a.getAttribute('href')]);
    expect(links).toEqual([
      ['Create an account', '/sign-up?next=%2Finvitations%2Faccept%3Ftoken%3Dtok-9'],
      ['Sign in to accept', '/sign-in?next=%2Finvitations%2Faccept%3Ftoken%3Dtok-9'],
    ]);
  });

  it('accepts with the token and opens the pattern', async () => {
    const { loader, http, fixture } = await setup(true);
    const nav = vi.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Accept and open the pattern' }))).click();
    const req = http.expectOne('/api/invitations/accept');
    expect(req.request.body).toEqual({ token: 'tok-9' });
    req.flush({ pattern: { id: 'p42' } });
    await fixture.whenStable();
    expect(nav).toHaveBeenCalledWith(['/patterns', 'p42']);
  });

  it('explains an invitation that cannot be used', async () => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    const fixture = TestBed.createComponent(AcceptInvitationComponent);
    fixture.componentRef.setInput('token', 'old');
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/auth/session').flush({ error: 'Not signed in', details: null }, { status: 401, statusText: 'Unauthorized' });
    http.expectOne('/api/invitations/old').flush({ error: 'Invitation not found', details: null }, { status: 404, statusText: 'Not Found' });
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).querySelector('[role=alert]')?.textContent).toContain('expired or been withdrawn');
  });
});
