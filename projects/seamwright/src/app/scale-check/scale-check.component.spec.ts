import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { ScaleCheckComponent } from './scale-check.component';
import { fillIn } from '../testing/material-form';

describe('ScaleCheckComponent', () => {
  async function setup() {
    const fixture = TestBed.createComponent(ScaleCheckComponent);
    fixture.detectChanges();
    const el = fixture.nativeElement as HTMLElement;
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const measure = async (text: string) => {
      await fillIn(loader, { 'It measures': text });
      await (await loader.getHarness(MatButtonHarness.with({ text: 'Check' }))).click();
    };
    const toggle = async (text: string) => (await loader.getHarness(MatButtonToggleHarness.with({ text }))).check();
    return { el, measure, toggle };
  }

  it('reads a fraction and says the print shrank, and what to change', async () => {
    const { el, measure } = await setup();
    await measure('15/16');
    expect(el.querySelector('#verdict-title')?.textContent).toBe('The print is too small');
    expect(el.textContent).toContain('93.8 %');
    expect(el.textContent).toContain('Turn off "Fit to page"');
  });

  it('says a true print is true', async () => {
    const { el, measure } = await setup();
    await measure('1 in');
    expect(el.querySelector('#verdict-title')?.textContent).toBe('The print is true to size');
    expect(el.textContent).toContain('100.0 %');
  });

  it('measures the 2 cm square in centimetres', async () => {
    const { el, measure, toggle } = await setup();
    await toggle('The 2 cm square');
    await toggle('cm');
    await measure('1,94');
    expect(el.querySelector('#verdict-title')?.textContent).toBe('The print is too small');
    expect(el.textContent).toContain('97.0 %');
  });

  it('explains text that is not a length', async () => {
    const { el, measure } = await setup();
    await measure('about one');
    expect(el.querySelector('#verdict-title')).toBeNull();
    expect(el.querySelector('[role=alert]')?.textContent).toContain('is not a length');
  });

  it('shows the cautions before cutting', async () => {
    const { el } = await setup();
    expect(el.querySelector('[aria-label=Cautions]')?.textContent).toContain('Rotary cutters are very sharp');
  });
});
