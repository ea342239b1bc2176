import { viewReadout } from './view-readout';

describe('viewReadout', () => {
  it('gives the zoom, the exact pixels per inch and the document point at the top-left corner', () => {
    // At 48 px per inch with the origin 96 px right and 24 px down, the corner is at (−2, −0.5) in.
    expect(viewReadout({ scale: 48, originX: 96, originY: 24, mirrored: false, mirrorWidthIn: 12 })).toBe(
      'Zoom 50 % (48.000 px per in.), top left x -2.000 in., y -0.500 in.',
    );
  });

  it('reads a mirrored view from the far side of the drawing area', () => {
    // Mirrored about a 12 in. wide area: screen x 0 shows document x 12 + 96/48 = 14 in.
    expect(viewReadout({ scale: 48, originX: 96, originY: 0, mirrored: true, mirrorWidthIn: 12 })).toBe(
      'Zoom 50 % (48.000 px per in.), top left x 14.000 in., y 0.000 in., mirrored',
    );
  });
});
