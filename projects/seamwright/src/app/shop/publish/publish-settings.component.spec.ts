import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { PublishSettingsComponent } from './publish-settings.component';

async function setup() {
  TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
  const fixture = TestBed.createComponent(PublishSettingsComponent);
  const http = TestBed.inject(HttpTestingController);
  fixture.detectChanges();
  http.expectOne('/api/shop/mine').flush({
    shop: { currency: 'eur' },
    patterns: [{ patternId: 'p1', title: 'Lantern Block', paidOrders: 0, listing: null }],
  });
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  const listing = () => el.querySelector('form[aria-label="Listing of Lantern Block"]') as HTMLFormElement;
  const field = (selector: string) => listing().querySelector(selector) as HTMLInputElement | HTMLTextAreaElement;
  const type = async (selector: string, value: string) => {
    const input = field(selector);
    input.value = value;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new Event('blur'));
    await fixture.whenStable();
  };
  const save = async () => {
    (listing().querySelector('button[type=submit]') as HTMLButtonElement).click();
    await fixture.whenStable();
  };
  const text = (selector: string) => Array.from(listing().querySelectorAll(selector)).map((e) => e.textContent?.trim());
  return { fixture, http, el, type, save, text, listing };
}

describe('PublishSettingsComponent', () => {
  it('labels the price in the shop currency’s minor unit and refuses fractions', async () => {
    const { type, save, text, http, listing } = await setup();
    expect(listing().querySelector('mat-label')?.textContent).toContain('Price in cents');
    await type('input[type=number]', '12.5');
    await type('textarea', 'A lattice block.');
    await save();
    expect(text('mat-error')).toEqual(['Whole cents only']);
    http.expectNone((r) => r.method === 'PUT');
  });

  it('shows what buyers pay and sends the price in minor units', async () => {
    const { type, save, text, http, listing, fixture } = await setup();
    await type('input[type=number]', '1250');
    expect(text('mat-hint')).toEqual(['Buyers pay €12.50']);
    await type('textarea', '  A lattice block.  ');
    (listing().querySelector('button[role=switch]') as HTMLButtonElement).click();
    await fixture.whenStable();
    await save();
    const req = http.expectOne({ method: 'PUT', url: '/api/shop/listings/p1' });
    expect(req.request.body).toEqual({ priceMinor: 1250, description: 'A lattice block.', published: true });
  });

  it('says a price is needed before anything is sent', async () => {
    const { save, text, http } = await setup();
    await save();
    expect(text('mat-error')).toEqual(['A price is required', 'A description is required']);
    http.expectNone((r) => r.method === 'PUT');
  });
});
