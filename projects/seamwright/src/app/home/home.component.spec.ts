import { TestBed } from '@angular/core/testing';
import { HomeComponent } from './home.component';

describe('HomeComponent', () => {
  it('states what Seamwright does for designers and quilters', async () => {
    const fixture = TestBed.createComponent(HomeComponent);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('h1')?.textContent).toContain('true to size');
    const titles = Array.from(el.querySelectorAll('mat-card-title')).map((t) => t.textContent?.trim());
    expect(titles).toEqual(['For designers', 'For quilters']);
  });
});
