import { TestBed } from '@angular/core/testing';
import { readPatternDocument, type PatternDocument } from '@seamwright/piecing';
import { SizeChartComponent } from './size-chart.component';
import { sampleBlock } from '../../../../../../tests/fixtures/sample-block';

/** A 12 in. square cut on the diagonal (Plum above, Oat below), in a 4 × 5 layout with 2 in. sashing and borders of 2 and 4 in. */
function pattern(): PatternDocument {
  return readPatternDocument({
    ...sampleBlock('Diagonal', 12),
    quilt: {
      columns: 4,
      rows: 5,
      sashing: { widthIn: 2, fabricId: 'oat' },
      borders: [
        { widthIn: 2, fabricId: 'oat' },
        { widthIn: 4, fabricId: 'plum' },
      ],
      binding: { fabricId: 'plum' },
      backing: { fabricId: 'oat' },
      sizes: [
        { name: 'Wall', columns: 2, rows: 2 },
        { name: 'Throw', columns: 4, rows: 5 },
      ],
    },
  });
}

function render(doc: PatternDocument, canEdit: boolean) {
  const fixture = TestBed.createComponent(SizeChartComponent);
  fixture.componentRef.setInput('document', doc);
  fixture.componentRef.setInput('canEdit', canEdit);
  const changes: PatternDocument[] = [];
  const chosen: Array<string | null> = [];
  // Each change applied to the document shown, as the Quilt page does.
  fixture.componentInstance.edit.subscribe((edit) => changes.push(edit(fixture.componentInstance.document())));
  fixture.componentInstance.chooseSize.subscribe((s) => chosen.push(s));
  fixture.detectChanges();
  const el = fixture.nativeElement as HTMLElement;
  const row = (name: string) =>
    [...el.querySelectorAll('tbody tr')].find((r) => r.querySelector('th')?.textContent?.trim() === name)?.querySelectorAll('td') ?? null;
  return { fixture, el, row, changes, chosen };
}

describe('SizeChartComponent', { timeout: 20_000 }, () => {
  it('gives each size its finished size and block count (design §11, straight setting)', () => {
    const { row, el } = render(pattern(), false);
    // Throw, 4 × 5: 4·12 + 3·2 + 2·(2 + 4) = 66 across, 5·12 + 4·2 + 12 = 80 down; 20 blocks.
    const throwRow = [...row('Throw')!].map((td) => td.textContent?.trim());
    expect(throwRow.slice(0, 3)).toEqual(['4 × 5', '66 in. × 80 in.', '20']);
    // Wall, 2 × 2: 2·12 + 2 + 12 = 38 in. square; 4 blocks.
    const wallRow = [...row('Wall')!].map((td) => td.textContent?.trim());
    expect(wallRow.slice(0, 3)).toEqual(['2 × 2', '38 in. × 38 in.', '4']);
    // A yardage column per fabric, in yards, and the total; the bigger quilt takes more of each.
    const headers = [...el.querySelectorAll('thead th')].map((th) => th.textContent?.trim());
    expect(headers).toEqual(['Size', 'Blocks across × down', 'Finished size', 'Blocks', 'Plum', 'Oat', 'All fabric']);
    const yards = (cells: Array<string | undefined>) => cells.slice(3).map((t) => {
      expect(t).toMatch(/ yd$/);
      return t!;
    });
    expect(yards(throwRow)).toHaveLength(3);
    expect(yards(wallRow)).toHaveLength(3);
    expect(throwRow[5]).not.toBe(wallRow[5]);
    // Quilters see no editing fields.
    expect(el.querySelector('input[matInput]')).toBeNull();
  });

  it('lets the designer rename, add and remove sizes, and everyone choose one', () => {
    const { el, changes, chosen, fixture } = render(pattern(), true);
    const name = [...el.querySelectorAll<HTMLInputElement>('input')].find((i) => i.value === 'Wall')!;
    name.value = 'Wall hanging';
    name.dispatchEvent(new Event('change'));
    expect(changes.at(-1)?.quilt?.sizes.map((s) => s.name)).toEqual(['Wall hanging', 'Throw']);
    // A name another size has is refused.
    name.value = 'Throw';
    name.dispatchEvent(new Event('change'));
    expect(changes).toHaveLength(1);
    const button = (text: string) => [...el.querySelectorAll('button')].find((b) => (b.textContent?.trim() ?? '').endsWith(text) || b.getAttribute('aria-label') === text)!;
    button('Add a size').click();
    expect(changes.at(-1)?.quilt?.sizes.at(-1)).toEqual({ name: 'Size 3', columns: 4, rows: 5 });
    button('Remove size Wall').click();
    expect(changes.at(-1)?.quilt?.sizes.map((s) => s.name)).toEqual(['Throw']);
    const radio = [...el.querySelectorAll('mat-radio-button')].find((r) => r.textContent?.trim() === 'Throw')!.querySelector('input')!;
    radio.click();
    fixture.detectChanges();
    expect(chosen).toEqual(['Throw']);
  });
});
