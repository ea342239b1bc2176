/** The cautions every print set carries (docs/design-notes.md#cautions), on the cover and on the last sheet. */
export const PRINT_CAUTIONS: readonly string[] = [
  'Print at 100 % / actual size and measure the test squares before cutting any fabric: printers set to "fit to page" shrink the page, commonly by a few per cent.',
  'Rotary cutters are very sharp: close the blade every time you put the cutter down, and cut away from your body.',
  'Irons are hot; starch and steam burn. Keep the iron away from the edge of the table and out of reach of children.',
  'Freezer paper in a laser printer can melt its coating onto the fuser: check the printer\'s manual first. Most quilters print freezer paper on an inkjet printer.',
];
