// Types for polylabel 2 (it ships none): the pole of inaccessibility of a polygon given as rings of
// [x, y] pairs (outer ring first), found to within `precision`; `distance` is its distance to the edge.
declare module 'polylabel' {
  export default function polylabel(polygon: number[][][], precision?: number, debug?: boolean): number[] & { distance: number };
}
