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

describe('PublishSettingsComponent', () => {
  it('labels the price in the shop currency’s minor unit and refuses fractions', async () => {
    const { save, http, listing } = await setup();
    await fillIn(listing, { 'Price in cents': '12.5', 'Description for buyers': 'A lattice block.' });
    await save();
    expect(await shownErrors(listing)).toEqual(['Whole cents only']);
    http.expectNone((r) => r.method === 'PUT');
  });

  it('shows what buyers pay and sends the price in minor units', async () => {
    const { save, http, listing } = await setup();
    await fillIn(listing, { 'Price in cents': '1250' });
    expect(await (await listing.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Price in cents' }))).getTextHints()).toEqual(['Buyers pay €12.50']);
    await fillIn(listing, { 'Description for buyers': '  A lattice block.  ' });
    await (await listing.getHarness(MatSlideToggleHarness.with({ label: 'Published' }))).check();
    await save();
    const req = http.expectOne({ method: 'PUT', url: '/api/shop/listings/p1' });
    expect(req.request.body).toEqual({ priceMinor: 1250, description: 'A lattice block.', published: true });
  });

  it('says a price is needed before anything is sent', async () => {
    const { save, listing, http } = await setup();
    await save();
    expect(await shownErrors(listing)).toEqual(['A price is required', 'A description is required']);
    http.expectNone((r) => r.method === 'PUT');
  });
});
