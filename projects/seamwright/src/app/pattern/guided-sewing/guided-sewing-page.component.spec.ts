import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { buildGardenGate, type PatternDocument } from '@seamwright/piecing';
import { PatternContext } from '../pattern-context.service';
import { GuidedSewingPageComponent } from './guided-sewing-page.component';

describe('GuidedSewingPageComponent', () => {
  const doc: PatternDocument = buildGardenGate();
  // The default joining plan joins B to A first, so guided sewing starts with section B.
  const a = doc.sections.find((x) => x.label === 'B')!;

  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: PatternContext, useValue: { document: signal(doc), id: signal('p1') } },
      ],
    });
  });

  async function open() {
    const fixture = TestBed.createComponent(GuidedSewingPageComponent);
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/patterns/p1/sewing-log').flush({ entries: [] });
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    const heading = () => el.querySelector('h2')!;
    const key = async (k: string) => {
      document.body.dispatchEvent(new KeyboardEvent('keydown', { key: k, bubbles: true }));
      await fixture.whenStable();
    };
    return { fixture, el, http, heading, key };
  }

  it('shows the first patch: its fabric, rough cut and where it goes; Previous is off at the start', async () => {
    const { el, heading } = await open();
    expect(heading().textContent?.trim()).toBe('Step 1 of 4: add B1');
    const piece = el.querySelector('[aria-label="Piece"]')!.textContent!;
    expect(piece).toContain(doc.fabrics.find((f) => f.id === a.patches.find((p) => p.number === 1)!.fabricId)!.name);
    expect(piece).toMatch(/rough cut \d.* × .*in\./);
    expect(el.querySelector('svg[role="img"]')!.getAttribute('aria-label')).toBe('Section B as the printed side of the foundation shows it (mirror image): B1 to place now, outlined and marked "here".');
    // A button's name is its text without the icons (they are hidden from assistive technology).
    const name = (b: HTMLElement) => {
      const copy = b.cloneNode(true) as HTMLElement;
      copy.querySelectorAll('[aria-hidden="true"]').forEach((n) => n.remove());
      return copy.textContent!.trim();
    };
    const buttons = [...el.querySelectorAll('button')].filter((b) => /step$/.test(name(b)));
    expect(buttons.map((b) => [name(b), b.disabled])).toEqual([
      ['Previous step', true],
      ['Next step', false],
    ]);
  });

  it('walks by keys, moves focus to the step heading, and ticks the copy pieced after its last patch', async () => {
    const { heading, key, http } = await open();
    await key('ArrowRight');
    expect(heading().textContent?.trim()).toBe('Step 2 of 4: add B2');
    expect(document.activeElement).toBe(heading());
    await key('n');
    http.expectNone('/api/patterns/p1/sewing-log/' + a.id);
    await key('N');
    expect(heading().textContent?.trim()).toBe('Step 4 of 4: trim section B');
    const put = http.expectOne('/api/patterns/p1/sewing-log/' + a.id);
    expect([put.request.method, put.request.body]).toEqual(['PUT', { stage: 'pieced', copy: 1 }]);
    put.flush({ entry: { sectionId: a.id, copy: 1, stage: 'pieced', updatedAt: new Date().toISOString() } });
    await key('ArrowLeft');
    expect(heading().textContent?.trim()).toBe('Step 3 of 4: add B3');
    await key('p');
    expect(heading().textContent?.trim()).toBe('Step 2 of 4: add B2');
  });

  it('comes back to the saved step when opened again', async () => {
    const first = await open();
    await first.key('ArrowRight');
    await first.key('ArrowRight');
    first.http.match(() => true);
    first.fixture.destroy();
    const again = await open();
    expect(again.heading().textContent?.trim()).toBe('Step 3 of 4: add B3');
  });

  it('keeps the page\'s keys out of form fields', async () => {
    const { el, heading, fixture } = await open();
    const input = document.createElement('input');
    el.appendChild(input);
    input.dispatchEvent(new KeyboardEvent('keydown', { key: 'n', bubbles: true }));
    await fixture.whenStable();
    expect(heading().textContent?.trim()).toBe('Step 1 of 4: add B1');
  });
});
