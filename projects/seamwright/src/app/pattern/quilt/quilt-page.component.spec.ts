import { computed, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { readPatternDocument, type PatternDocument, type QuiltLayoutInput } from '@seamwright/piecing';
import { PatternContext } from '../pattern-context.service';
import { QuiltChoice } from './quilt-choice.service';
import { QuiltPageComponent } from './quilt-page.component';
import { sampleBlock } from '../../../../../../tests/fixtures/sample-block';

/**
 * A 12 in. block (the sample block: a square cut on the diagonal, Plum and Oat) set 4 × 5 with 2 in.
 * sashing and two borders, 2 in. Oat inside 4 in. Plum.
 * Finished size (design §11, straight setting): 4·12 + 3·2 + 2·(2 + 4) = 66 in. across,
 * 5·12 + 4·2 + 2·(2 + 4) = 80 in. down.
 */
const block = sampleBlock('Diagonal', 12);

function quilt(extra: Partial<QuiltLayoutInput> = {}): PatternDocument {
  return readPatternDocument({
    ...block,
    quilt: {
      setting: 'straight',
      columns: 4,
      rows: 5,
      sashing: { widthIn: 2, fabricId: 'oat' },
      borders: [
        { widthIn: 2, fabricId: 'oat' },
        { widthIn: 4, fabricId: 'plum' },
      ],
      binding: { fabricId: 'plum' },
      backing: { fabricId: 'oat' },
      ...extra,
    },
  });
}

function render(doc: PatternDocument, canEdit = true) {
  const document = signal<PatternDocument | null>(doc);
  const revision = signal(7);
  const ctx = {
    id: signal('p1'),
    document,
    revision,
    canEdit: computed(() => canEdit),
    adopt: (d: PatternDocument, n: number) => {
      document.set(d);
      revision.set(n);
    },
  };
  TestBed.configureTestingModule({
    providers: [provideHttpClient(), provideHttpClientTesting(), QuiltChoice, { provide: PatternContext, useValue: ctx }],
  });
  const fixture = TestBed.createComponent(QuiltPageComponent);
  fixture.detectChanges();
  const el = fixture.nativeElement as HTMLElement;
  const field = (label: string) =>
    [...el.querySelectorAll('mat-form-field')].find((f) => f.querySelector('mat-label')?.textContent?.trim() === label)?.querySelector('input') ?? null;
  const type = async (label: string, text: string) => {
    const input = field(label);
    if (!input) throw new Error(`no field “${label}”`);
    input.dispatchEvent(new Event('focus'));
    input.value = text;
    input.dispatchEvent(new Event('input'));
    fixture.detectChanges();
    await fixture.whenStable();
  };
  const size = () => el.querySelector('[data-testid="finished-size"]')?.textContent?.trim();
  return { fixture, el, field, type, size, http: TestBed.inject(HttpTestingController), choice: TestBed.inject(QuiltChoice) };
}

// The first render builds the whole quilt's cutting list on a shared machine: give each test room.
describe('QuiltPageComponent', { timeout: 20_000 }, () => {
  it('shows the finished size of a 4 × 5 quilt of 12 in. blocks with 2 in. sashing and two borders', () => {
    const { el, size } = render(quilt());
    expect(size()).toBe('66 in. × 80 in.');
    expect(el.textContent).toContain('20 blocks of 12 in. × 12 in.');
    // The picture: one block position per cell, sashing strips between them (3 per row × 5 rows + 4 rows × 4 under blocks, at least).
    const svg = el.querySelector('sw-quilt-picture svg');
    expect(svg?.getAttribute('viewBox')).toBe('0 0 66 80');
    expect(svg?.querySelectorAll('g[data-row][data-col]').length).toBe(20);
    expect(svg?.querySelectorAll('[data-part="border"]').length).toBe(8);
  });

  it('updates the finished size as the designer types, and saves the layout into the document', async () => {
    const { type, size, http, el, fixture } = render(quilt());
    await type('Columns', '5');
    // 5·12 + 4·2 + 12 = 80 in. across.
    expect(size()).toBe('80 in. × 80 in.');
    await type('Border 2 width', '6');
    // Borders 2 + 6: 60 + 8 + 16 = 84 across, 60 + 8 + 16 = 84 down.
    expect(size()).toBe('84 in. × 84 in.');
    // Nothing has reached the server yet (autosave waits for a pause); "Save now" sends it.
    http.expectNone((r) => r.method === 'PUT');
    const saveNow = [...el.querySelectorAll('button')].find((b) => b.textContent?.trim() === 'Save now');
    expect(saveNow).toBeTruthy();
    saveNow!.click();
    const put = http.expectOne((r) => r.method === 'PUT' && r.url === '/api/patterns/p1');
    const body = put.request.body as { baseRevision: number; document: PatternDocument };
    expect(body.baseRevision).toBe(7);
    expect(body.document.quilt?.columns).toBe(5);
    expect(body.document.quilt?.borders.map((b) => b.widthIn)).toEqual([2, 6]);
    put.flush({ pattern: { id: 'p1' }, revision: { number: 8, document: body.document } });
    fixture.detectChanges();
    expect(el.textContent).toContain('All changes saved · revision 8');
  });

  it('refuses a typed 0 columns with a message and keeps the last good size', async () => {
    const { type, size, el } = render(quilt());
    await type('Columns', '0');
    expect(size()).toBe('66 in. × 80 in.');
    expect(el.textContent).toContain('Must be at least 1');
  });

  it('turns, mirrors and makes plain the block chosen by keys', async () => {
    const { el, fixture, http } = render(quilt({ alternateFabricId: 'plum' }));
    const picture = el.querySelector<HTMLElement>('sw-quilt-picture [role="group"]')!;
    picture.dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowRight', bubbles: true }));
    fixture.detectChanges();
    expect(el.textContent).toContain('Chosen block: row 1, position 2');
    const button = (name: string) => [...el.querySelectorAll('button')].find((b) => b.textContent?.trim().endsWith(name))!;
    button('Turn a quarter').click();
    fixture.detectChanges();
    const checkbox = (name: string) => [...el.querySelectorAll('mat-checkbox')].find((c) => c.textContent?.trim() === name)!.querySelector('input')!;
    checkbox('Plain block').click();
    fixture.detectChanges();
    // One plain block: 19 pieced blocks.
    expect(el.textContent).toContain('19 blocks of 12 in. × 12 in.');
    button('Save now').click();
    const put = http.expectOne((r) => r.method === 'PUT');
    expect((put.request.body as { document: PatternDocument }).document.quilt?.cells).toEqual([{ row: 0, col: 1, rotateDeg: 90, alternate: true }]);
  });

  it('shows quilters the quilt without the layout controls', () => {
    const { el, field } = render(quilt({ sizes: [{ name: 'Throw', columns: 4, rows: 5 }] }), false);
    expect(field('Columns')).toBeNull();
    expect(el.textContent).toContain('Read-only');
    expect(el.querySelector('sw-quilt-picture [role="group"]')).toBeNull();
    expect(el.querySelector('[aria-label="Size for the cutting list and print set"]')).not.toBeNull();
  });
});
