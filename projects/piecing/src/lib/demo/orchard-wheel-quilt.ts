import type { Colourway, QuiltLayout } from '../document/pattern-schema';

/**
 * The Orchard Wheel set into a quilt (invented demo data, docs/quilt-layout.md): 26 in. medallions in a
 * straight setting with 2 in. Oat sashing and Marigold cornerstones, a 2 in. Plum border inside a 4 in. Ink
 * border, Plum binding and Sage backing. Three named sizes: one medallion for the wall, 2 × 2 for a throw,
 * 3 × 3 for a bed. The layout itself is the throw.
 */
export function orchardWheelQuilt(): QuiltLayout {
  return {
    setting: 'straight',
    columns: 2,
    rows: 2,
    sashing: { widthIn: 2, fabricId: 'oat', cornerstoneFabricId: 'marigold' },
    borders: [
      { widthIn: 2, fabricId: 'plum' },
      { widthIn: 4, fabricId: 'ink' },
    ],
    binding: { fabricId: 'plum', stripWidthIn: 2.5, extraIn: 12 },
    backing: { fabricId: 'sage', marginIn: 4 },
    sizes: [
      { name: 'Wall 1 × 1', columns: 1, rows: 1 },
      { name: 'Throw 2 × 2', columns: 2, rows: 2 },
      { name: 'Bed 3 × 3', columns: 3, rows: 3 },
    ],
  };
}

/** Two colourways of the Orchard Wheel (invented names and colours), besides the document's own fabrics. */
export function orchardWheelColourways(): Colourway[] {
  return [
    {
      id: 'dusk',
      name: 'Dusk',
      fabrics: {
        plum: { name: 'Midnight', colour: '#2b2d4f' },
        oat: { name: 'Fog', colour: '#cfd3d6' },
        sage: { name: 'Slate', colour: '#6f8291' },
        marigold: { name: 'Ember', colour: '#c8553d' },
        ink: { name: 'Coal', colour: '#1c1c22' },
      },
    },
    {
      id: 'frost',
      name: 'Frost',
      fabrics: {
        plum: { name: 'Spruce', colour: '#2f5d50' },
        oat: { name: 'Snow', colour: '#f3f4f0' },
        sage: { name: 'Ice', colour: '#a9c7d3' },
        marigold: { name: 'Berry', colour: '#a23b4c' },
        ink: { name: 'Pine', colour: '#1f3b33' },
      },
    },
  ];
}
