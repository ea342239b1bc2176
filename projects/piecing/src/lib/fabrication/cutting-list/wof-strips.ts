/** Rough-cut pieces of one size and fabric. */
export interface PieceGroup {
  /** The shorter and the longer side, in inches (rounded up to ⅛ in.). */
  widthIn: number;
  lengthIn: number;
  count: number;
}

/** How a group of equal pieces is cut from strips across the width of fabric. */
export interface WofStripPlan {
  /** Width of each strip cut across the WOF, in inches. */
  stripWidthIn: number;
  /** Length of each piece cross-cut from a strip, in inches. */
  pieceLengthIn: number;
  /** floor(usable WOF / piece length). */
  piecesPerStrip: number;
  /** ceil(count / piecesPerStrip). */
  stripCount: number;
  /** Fabric length the strips take from the bolt: stripCount × stripWidthIn, in inches. */
  depthIn: number;
}

/**
 * Plans strips across the usable width of fabric for `count` equal pieces: strips as wide as one side of
 * the piece, pieces cross-cut along the other, pieces per strip = floor(usable WOF / piece length). Both
 * ways round are tried and the one taking less fabric off the bolt wins (the narrower strip on a tie).
 * Returns null when the piece is longer than the WOF both ways (it must be cut along the length).
 */
export function planWofStrips(piece: PieceGroup, usableWofIn: number): WofStripPlan | null {
  if (!(usableWofIn > 0)) throw new RangeError(`usable width of fabric must be positive, got ${usableWofIn}`);
  const plan = (stripWidthIn: number, pieceLengthIn: number): WofStripPlan | null => {
    // A hair of float noise must not turn 42 / 3 into 13 pieces.
    const piecesPerStrip = Math.floor(usableWofIn / pieceLengthIn + 1e-9);
    if (piecesPerStrip < 1) return null;
    const stripCount = Math.ceil(piece.count / piecesPerStrip);
    return { stripWidthIn, pieceLengthIn, piecesPerStrip, stripCount, depthIn: stripCount * stripWidthIn };
  };
  const narrow = plan(piece.widthIn, piece.lengthIn);
  const wide = piece.widthIn === piece.lengthIn ? null : plan(piece.lengthIn, piece.widthIn);
  if (!narrow) return wide;
  if (!wide) return narrow;
  return wide.depthIn < narrow.depthIn ? wide : narrow;
}
