import { TestBed } from '@angular/core/testing';
import { signal } from '@angular/core';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { SharePageComponent } from './share-page.component';
import { PatternContext } from '../pattern-context.service';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { fillIn, shownErrors } from '../../testing/material-form';

const members = {
  owner: { id: 'u1', displayName: 'Dana', email: 'dana@example.test' },
  members: [{ userId: 'u2', displayName: 'Quinn', email: 'quinn@example.test', access: 'quilter', createdAt: '2026-12-01T10:00:00Z' }],
  invitations: [],
};

describe('SharePageComponent', () => {
  async function setup(owner = true) {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: PatternContext, useValue: { id: signal('p1'), isOwner: signal(owner), canEdit: signal(owner) } },
      ],
    });
    const fixture = TestBed.createComponent(SharePageComponent);
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/patterns/p1/members').flush(members);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const send = async (value: string) => {
      await fillIn(loader, { 'E-mail address': value });
      await (await loader.getHarness(MatButtonHarness.with({ text: /Send invitation$/ }))).click();
    };
    const emailInputs = () => loader.getAllHarnesses(MatInputHarness.with({ label: 'E-mail address' }));
    return { fixture, el, http, loader, send, emailInputs };
  }

  it('lists the owner and the members', async () => {
    const { el } = await setup();
    const people = Array.from(el.querySelectorAll('[aria-labelledby=people-title] li')).map((li) => li.textContent?.replace(/\s+/g, ' ').trim());
    expect(people[0]).toContain('Dana');
    expect(people[0]).toContain('Owner');
    expect(people[1]).toContain('Quinn');
  });

  it('asks for an address before sending', async () => {
    const { loader, send, http } = await setup();
    await send('');
    expect(await shownErrors(loader)).toEqual(['E-mail is required']);
    http.expectNone('/api/patterns/p1/invitations');
  });

  it('refuses a malformed address with a message', async () => {
    const { loader, send } = await setup();
    await send('quinn at example');
    expect(await shownErrors(loader)).toEqual(['Enter an e-mail address like name@example.com']);
  });

  it('sends the invitation with the chosen access and clears the field without an error', async () => {
    const { loader, send, http, fixture, emailInputs } = await setup();
    await send(' newbie@example.test ');
    const req = http.expectOne('/api/patterns/p1/invitations');
    expect(req.request.body).toEqual({ email: 'newbie@example.test', access: 'quilter' });
    req.flush({ invitation: { id: 'i1', email: 'newbie@example.test', access: 'quilter', createdAt: '', expiresAt: '' } }, { status: 201, statusText: 'Created' });
    http.expectOne('/api/patterns/p1/members').flush(members);
    await fixture.whenStable();
    const [email] = await emailInputs();
    expect(await email.getValue()).toBe('');
    expect(await shownErrors(loader)).toEqual([]);
  });

  it('shows no invitation form to members who are not the owner', async () => {
    const { el, emailInputs } = await setup(false);
    expect(await emailInputs()).toEqual([]);
    expect(el.textContent).toContain('Quilter');
  });
});
