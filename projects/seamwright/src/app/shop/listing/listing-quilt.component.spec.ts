import { TestBed } from '@angular/core/testing';
import { ListingQuiltComponent, type ListingQuilt } from './listing-quilt.component';

const svg = (fill: string) => `<svg xmlns="http://www.w3.org/2000/svg" width="320" height="320" viewBox="0 0 38 38"><rect width="38" height="38" fill="${fill}"/></svg>`;

const quilt: ListingQuilt = {
  sizes: [
    { name: 'Wall 1 × 1', widthIn: 38, heightIn: 38, blockCount: 1, totalYards: 6.125 },
    { name: 'Throw 2 × 2', widthIn: 66, heightIn: 66, blockCount: 4, totalYards: 15.375 },
  ],
  pictures: [
    { colourwayId: null, name: 'Pattern fabrics', svg: svg('#2b2d4f') },
    { colourwayId: 'dusk', name: 'Dusk', svg: svg('#1c1b22') },
  ],
};

function render(q: ListingQuilt) {
  const fixture = TestBed.createComponent(ListingQuiltComponent);
  fixture.componentRef.setInput('quilt', q);
  fixture.componentRef.setInput('title', 'Orchard Wheel');
  fixture.detectChanges();
  return fixture.nativeElement as HTMLElement;
}

describe('ListingQuiltComponent', () => {
  it('shows one picture per colourway with its name and alt text, the server’s SVG as the image', () => {
    const el = render(quilt);
    const figures = [...el.querySelectorAll('figure')];
    expect(figures.map((f) => f.querySelector('figcaption')?.textContent?.trim())).toEqual(['Pattern fabrics', 'Dusk']);
    const images = figures.map((f) => f.querySelector('img')!);
    expect(images.map((i) => i.alt)).toEqual(["Orchard Wheel quilt in the pattern's own fabrics", 'Orchard Wheel quilt in the Dusk colourway']);
    expect(decodeURIComponent(images[1].getAttribute('src')!.replace('data:image/svg+xml,', ''))).toBe(quilt.pictures[1].svg);
  });

  it('lists the sizes with finished size, blocks and yards', () => {
    const el = render(quilt);
    const rows = [...el.querySelectorAll('tbody tr')].map((r) => [...r.querySelectorAll('th, td')].map((c) => c.textContent?.trim()));
    expect(rows).toEqual([
      ['Wall 1 × 1', '38 × 38 in.', '1', '6 ⅛ yd'],
      ['Throw 2 × 2', '66 × 66 in.', '4', '15 ⅜ yd'],
    ]);
    expect(el.querySelector('caption')?.textContent?.trim()).toBe('Sizes');
  });

  it('shows no table when the layout names no size', () => {
    const el = render({ ...quilt, sizes: [] });
    expect(el.querySelector('table')).toBeNull();
    expect(el.querySelectorAll('img').length).toBe(2);
  });
});
