/*
 * Reference offsets from jsts, the JavaScript port of the JTS Topology Suite: an independent, general
 * purpose geometry library used only to check our own results (in tests and the benchmark).
 * jsts ships ES modules without a package entry point, so each class is imported from its own file.
 */
import GeometryFactory from 'jsts/org/locationtech/jts/geom/GeometryFactory.js';
import Coordinate from 'jsts/org/locationtech/jts/geom/Coordinate.js';
import BufferOp from 'jsts/org/locationtech/jts/operation/buffer/BufferOp.js';
import BufferParameters from 'jsts/org/locationtech/jts/operation/buffer/BufferParameters.js';
import type { Point } from '../../document/pattern-schema';

const factory = new GeometryFactory();

/** A jsts polygon from a ring in inches (closed for jsts). */
export function toJstsPolygon(points: readonly Point[]) {
  const coordinates = points.map((p) => new Coordinate(p.x, p.y));
  coordinates.push(new Coordinate(points[0].x, points[0].y));
  return factory.createPolygon(factory.createLinearRing(coordinates), []);
}

/** jsts buffer parameters: mitre joins with `mitreLimit`, or round joins with `quadrantSegments` per 90°. */
export function jstsBufferParameters(join: 'mitre' | 'round', mitreLimit = 4, quadrantSegments = 8) {
  const params = new BufferParameters();
  if (join === 'mitre') {
    params.setJoinStyle(BufferParameters.JOIN_MITRE);
    params.setMitreLimit(mitreLimit);
  } else {
    params.setQuadrantSegments(quadrantSegments);
  }
  // No input simplification: compare the offset of exactly the same ring.
  params.setSimplifyFactor(0);
  return params;
}

/** The jsts buffer of a jsts polygon built already (see {@link toJstsPolygon}) by `distanceIn`. */
export function jstsBufferPolygon(polygon: ReturnType<typeof toJstsPolygon>, distanceIn: number, params = jstsBufferParameters('mitre')) {
  return BufferOp.bufferOp(polygon, distanceIn, params);
}

/** The jsts buffer of a ring by `distanceIn`. */
export function jstsBuffer(points: readonly Point[], distanceIn: number, params = jstsBufferParameters('mitre')) {
  return BufferOp.bufferOp(toJstsPolygon(points), distanceIn, params);
}

/** Area of the jsts buffer, in square inches. */
export function jstsBufferArea(points: readonly Point[], distanceIn: number, params = jstsBufferParameters('mitre')): number {
  return jstsBuffer(points, distanceIn, params).getArea();
}

/** The vertices of the jsts buffer's boundary, in inches. */
export function jstsBufferRing(points: readonly Point[], distanceIn: number, params = jstsBufferParameters('mitre')): Point[] {
  return jstsBuffer(points, distanceIn, params)
    .getCoordinates()
    .map((c: { x: number; y: number }) => ({ x: c.x, y: c.y }));
}
