import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { parallel } from '@angular/cdk/testing';
import { MatCardHarness } from '@angular/material/card/testing';
import { HomeComponent } from './home.component';

describe('HomeComponent', () => {
  it('states what Seamwright does for designers and quilters', async () => {
    const fixture = TestBed.createComponent(HomeComponent);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('h1')?.textContent).toContain('true to size');
    const cards = await TestbedHarnessEnvironment.loader(fixture).getAllHarnesses(MatCardHarness);
    expect(await parallel(() => cards.map((c) => c.getTitleText()))).toEqual(['For designers', 'For quilters']);
  });
});
