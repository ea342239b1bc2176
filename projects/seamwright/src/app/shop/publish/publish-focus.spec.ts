import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { PublishSettingsComponent } from './publish-settings.component';

/** Publishing a listing keeps focus on its Save button while it saves and after, never dropping it to the page. */
describe('PublishSettingsComponent focus', { timeout: 20_000 }, () => {
  it('keeps focus on "Save listing" through the save', async () => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    const fixture = TestBed.createComponent(PublishSettingsComponent);
    document.body.appendChild(fixture.nativeElement);
    const http = TestBed.inject(HttpTestingController);
    fixture.detectChanges();
    http.expectOne('/api/shop/mine').flush({
      shop: { currency: 'eur' },
      patterns: [{ patternId: 'p1', title: 'Lantern Block', paidOrders: 0, listing: { priceMinor: 1250, description: 'A lattice block.', published: false, currency: 'eur' } }],
    });
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    const save = [...el.querySelectorAll('button')].find((b) => b.textContent?.trim() === 'Save listing') as HTMLButtonElement;
    save.focus();
    save.click();
    await fixture.whenStable();
    // Saving: shown as disabled, still focused, and a second press sends nothing more.
    expect(save.getAttribute('aria-disabled')).toBe('true');
    expect(document.activeElement).toBe(save);
    save.click();
    const req = http.expectOne({ method: 'PUT', url: '/api/shop/listings/p1' });
    req.flush({ listing: { patternId: 'p1', priceMinor: 1250, currency: 'eur', description: 'A lattice block.', published: true } });
    await fixture.whenStable();
    expect(save.getAttribute('aria-disabled')).toBeNull();
    expect(document.activeElement).toBe(save);
    http.verify();
    fixture.destroy();
  });
});
