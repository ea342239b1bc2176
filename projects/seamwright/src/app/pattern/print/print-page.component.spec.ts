import { TestBed } from '@angular/core/testing';
import { signal } from '@angular/core';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { buildGardenGate, planPrintLayout, sheetCountStatement, type PatternDocument } from '@seamwright/piecing';
import { PrintPageComponent } from './print-page.component';
import { PrintPreviewPlanner } from './print-preview-planner';
import { PatternContext } from '../pattern-context.service';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { fillIn } from '../../testing/material-form';

describe('PrintPageComponent preview', () => {
  async function setup() {
    const document = signal<PatternDocument | null>(buildGardenGate());
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: PatternContext, useValue: { id: signal('p1'), document, revision: signal(1), canEdit: signal(true) } },
      ],
    });
    const planSpy = vi.spyOn(PrintPreviewPlanner.prototype, 'plan');
    const fixture = TestBed.createComponent(PrintPageComponent);
    fixture.detectChanges();
    TestBed.inject(HttpTestingController).expectOne('/api/patterns/p1/print-sets').flush({ items: [] });
    const el = fixture.nativeElement as HTMLElement;
    const preview = () => el.querySelector('section[aria-labelledby=preview-title]') as HTMLElement;
    const status = () => preview().querySelector('[role=status]')?.textContent?.trim() ?? '';
    const statement = () => preview().querySelector('p strong')?.textContent?.trim() ?? '';
    const settle = async () => {
      await vi.waitFor(() => {
        fixture.detectChanges();
        expect(status()).toBe('');
      }, { timeout: 10_000, interval: 20 });
    };
    return { fixture, el, loader: TestbedHarnessEnvironment.loader(fixture), planSpy, preview, status, statement, settle };
  }

  afterEach(() => vi.restoreAllMocks());

  it('says it is planning, then shows the planned sheets', async () => {
    const { fixture, status, statement, settle, preview } = await setup();
    fixture.detectChanges();
    expect(status()).toContain('Planning…');
    expect(preview().getAttribute('aria-busy')).toBe('true');
    await settle();
    expect(statement()).toBe(sheetCountStatement(planPrintLayout(buildGardenGate(), { paper: 'letter', marginIn: 0.5 })));
    expect(preview().getAttribute('aria-busy')).toBe('false');
    expect(preview().querySelectorAll('sw-sheet-preview').length).toBeGreaterThan(0);
  });

  it('plans once for a burst of form changes, with the last value', async () => {
    const { fixture, el, planSpy, settle, statement } = await setup();
    await settle();
    expect(planSpy).toHaveBeenCalledTimes(1);
    // Typed in one synchronous burst, not through the input harness: its awaits between values are real time
    // that, on a busy machine, could outlast the 250 ms debounce this test is about.
    const margin = el.querySelector('input[formcontrolname=marginIn]') as HTMLInputElement;
    for (const v of ['0.75', '1', '1.25']) {
      margin.value = v;
      margin.dispatchEvent(new Event('input'));
      fixture.detectChanges();
    }
    await settle();
    expect(planSpy).toHaveBeenCalledTimes(2);
    expect(planSpy.mock.calls[1][0].options.marginIn).toBe(1.25);
    expect(statement()).toBe(sheetCountStatement(planPrintLayout(buildGardenGate(), { paper: 'letter', marginIn: 1.25 })));
  });

  it('plans nothing for an invalid margin and shows no sheets', async () => {
    const { loader, planSpy, settle, preview } = await setup();
    await settle();
    await fillIn(loader, { 'Margin (in.)': '9' });
    await settle();
    expect(planSpy).toHaveBeenCalledTimes(1);
    expect(preview().querySelectorAll('sw-sheet-preview').length).toBe(0);
  });
});
