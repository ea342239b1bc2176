import { cursorReadout } from './cursor-readout';

describe('cursorReadout', () => {
  it('writes the pointer position as quilters do, with the decimals beside it', () => {
    expect(cursorReadout({ x: 2.75, y: 5.125 }, 'in')).toEqual({ quilter: '2 ¾ in. × 5 ⅛ in.', exact: 'x 2.750 in., y 5.125 in.' });
  });

  it('writes centimetres on a cm board (1 in. = 2.54 cm exactly, NIST HB 44)', () => {
    expect(cursorReadout({ x: 1, y: 10 }, 'cm')).toEqual({ quilter: '2.5 cm × 25.4 cm', exact: 'x 2.54 cm, y 25.4 cm' });
  });

  it('shows nothing off the board', () => {
    expect(cursorReadout(null, 'in')).toBeNull();
  });
});
