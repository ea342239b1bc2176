import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatSlideToggleHarness } from '@angular/material/slide-toggle/testing';
import { PublishSettingsComponent } from './publish-settings.component';
import { fillIn, shownErrors } from '../../testing/material-form';

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
  const listing = await TestbedHarnessEnvironment.loader(fixture).getChildLoader('form[aria-label="Listing of Lantern Block"]');
  const save = async () => (await listing.getHarness(MatButtonHarness.with({ text: 'Save listing' }))).click();
  return { http, save, listing };
}

// The first test also pays for the Material harnesses' first load; on a busy shared machine that passes 5 s.
describe('PublishSettingsComponent', { timeout: 20_000 }, () => {
  it('takes the price in the shop currency’s units and refuses a third decimal', async () => {
    const { save, http, listing } = await setup();
    await fillIn(listing, { 'Price in EUR': '12.505', 'Description for buyers': 'A lattice block.' });
    await save();
    expect(await shownErrors(listing)).toEqual(['Type an amount with at most 2 decimals, e.g. 12.50']);
    http.expectNone((r) => r.method === 'PUT');
  });

  it('refuses a price under the least the payment provider takes, in the currency', async () => {
    const { save, http, listing } = await setup();
    await fillIn(listing, { 'Price in EUR': '0.10', 'Description for buyers': 'A lattice block.' });
    await save();
    expect(await shownErrors(listing)).toEqual(['At least €0.50']);
    http.expectNone((r) => r.method === 'PUT');
  });

  it('shows what buyers pay and sends the typed amount in minor units, read without floating-point error', async () => {
    const { save, http, listing } = await setup();
    // 19.99 × 100 is 1998.9999999999998 in floating point; the price must go out as 1999.
    await fillIn(listing, { 'Price in EUR': '19.99' });
    expect(await (await listing.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Price in EUR' }))).getTextHints()).toEqual(['Buyers pay €19.99']);
    await fillIn(listing, { 'Description for buyers': '  A lattice block.  ' });
    await (await listing.getHarness(MatSlideToggleHarness.with({ label: 'Published' }))).check();
    await save();
    const req = http.expectOne({ method: 'PUT', url: '/api/shop/listings/p1' });
    expect(req.request.body).toEqual({ priceMinor: 1999, description: 'A lattice block.', published: true });
  });

  it('says a price is needed before anything is sent', async () => {
    const { save, listing, http } = await setup();
    await save();
    expect(await shownErrors(listing)).toEqual(['A price is required', 'A description is required']);
    http.expectNone((r) => r.method === 'PUT');
  });
});
