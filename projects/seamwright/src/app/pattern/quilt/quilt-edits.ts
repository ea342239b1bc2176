import type { Colourway, PatternDocument, QuiltBorder, QuiltCell, QuiltLayout, QuiltSize } from '@seamwright/piecing';

/*
 * The Quilt tab's changes to a pattern document, as pure functions: each answers a new document and
 * never changes its input. The layout's fields are those of design §11 (docs/quilt-layout.md).
 */

/**
 * A change the Quilt tab's controls send to the page, which applies it to its newest working document.
 * Controls send changes, not whole documents: without zone.js, several events (a name confirmed with
 * Enter, then a colour picked) can arrive before a control's `document` input is brought up to date,
 * and a document built from that older input would silently undo the change before it.
 */
export type QuiltEdit = (doc: PatternDocument) => PatternDocument;

/** A first quilt layout for a block: 3 × 3, straight, no sashing or borders, common binding and backing. */
export function startQuilt(doc: PatternDocument): PatternDocument {
  const first = doc.fabrics[0]?.id;
  const quilt: QuiltLayout = {
    setting: 'straight',
    columns: 3,
    rows: 3,
    borders: [],
    binding: { stripWidthIn: 2.5, extraIn: 12, ...(first ? { fabricId: first } : {}) },
    backing: { marginIn: 4, ...(first ? { fabricId: first } : {}) },
    sizes: [],
  };
  return { ...doc, quilt };
}

/** Drops the quilt layout (the pattern is one block again); colourways stay. */
export function removeQuilt(doc: PatternDocument): PatternDocument {
  const next = { ...doc };
  delete next.quilt;
  return next;
}

/** Changes fields of the layout. */
export function updateQuilt(doc: PatternDocument, change: Partial<QuiltLayout>): PatternDocument {
  if (!doc.quilt) return doc;
  const quilt = { ...doc.quilt, ...change };
  if (quilt.setting === 'on-point') {
    // Setting triangles need a fabric to be drawn and cut: the first of the pattern until one is chosen.
    if (!quilt.settingTrianglesFabricId && doc.fabrics[0]) quilt.settingTrianglesFabricId = doc.fabrics[0].id;
  }
  for (const key of Object.keys(change) as Array<keyof QuiltLayout>) if (change[key] === undefined) delete quilt[key];
  // Cells past the new edges would name positions that no longer exist.
  if (quilt.cells && (change.columns !== undefined || change.rows !== undefined || change.setting !== undefined)) {
    const onPoint = quilt.setting === 'on-point';
    const rows = onPoint ? 2 * quilt.rows - 1 : quilt.rows;
    quilt.cells = quilt.cells.filter((c) => c.row < rows && c.col < (onPoint && c.row % 2 === 1 ? quilt.columns - 1 : quilt.columns));
    if (!quilt.cells.length) delete quilt.cells;
  }
  return { ...doc, quilt };
}

/** What a cell may differ in from a plain copy of the block. */
export type CellChange = Partial<Pick<QuiltCell, 'rotateDeg' | 'mirrored' | 'alternate'>>;

/** The layout's entry for a cell, or a plain copy's values. */
export function cellAt(quilt: QuiltLayout, row: number, col: number): QuiltCell {
  return quilt.cells?.find((c) => c.row === row && c.col === col) ?? { row, col };
}

/** Turns, mirrors or makes plain one cell; a cell back to a plain copy of the block leaves the list. */
export function updateCell(doc: PatternDocument, row: number, col: number, change: CellChange): PatternDocument {
  if (!doc.quilt) return doc;
  const merged: QuiltCell = { ...cellAt(doc.quilt, row, col), ...change };
  const cell: QuiltCell = { row, col };
  if (merged.rotateDeg) cell.rotateDeg = merged.rotateDeg;
  if (merged.mirrored) cell.mirrored = true;
  if (merged.alternate) cell.alternate = true;
  const others = (doc.quilt.cells ?? []).filter((c) => c.row !== row || c.col !== col);
  const cells = Object.keys(cell).length > 2 ? [...others, cell].sort((a, b) => a.row - b.row || a.col - b.col) : others;
  const quilt: QuiltLayout = { ...doc.quilt, cells };
  if (!cells.length) delete quilt.cells;
  // A plain block needs a fabric: the first of the pattern until the designer picks one.
  if (cell.alternate && !quilt.alternateFabricId && doc.fabrics[0]) quilt.alternateFabricId = doc.fabrics[0].id;
  return { ...doc, quilt };
}

/** Adds a border outside the others (the last fabric used, 2 in. wide). */
export function addBorder(doc: PatternDocument): PatternDocument {
  if (!doc.quilt) return doc;
  const last = doc.quilt.borders.at(-1);
  const fabricId = last?.fabricId ?? doc.fabrics[0]?.id;
  if (!fabricId) return doc;
  return updateQuilt(doc, { borders: [...doc.quilt.borders, { widthIn: last?.widthIn ?? 2, fabricId }] });
}

export function updateBorder(doc: PatternDocument, index: number, change: Partial<QuiltBorder>): PatternDocument {
  if (!doc.quilt) return doc;
  return updateQuilt(doc, { borders: doc.quilt.borders.map((b, i) => (i === index ? { ...b, ...change } : b)) });
}

export function removeBorder(doc: PatternDocument, index: number): PatternDocument {
  if (!doc.quilt) return doc;
  return updateQuilt(doc, { borders: doc.quilt.borders.filter((_, i) => i !== index) });
}

/** A size name not yet used: "Size 2", "Size 3" … */
function freeName(taken: readonly string[], stem: string): string {
  for (let n = taken.length + 1; ; n++) if (!taken.includes(`${stem} ${n}`)) return `${stem} ${n}`;
}

/** Adds a named size at the layout's own columns and rows. */
export function addSize(doc: PatternDocument): PatternDocument {
  if (!doc.quilt) return doc;
  const size: QuiltSize = { name: freeName(doc.quilt.sizes.map((s) => s.name), 'Size'), columns: doc.quilt.columns, rows: doc.quilt.rows };
  return updateQuilt(doc, { sizes: [...doc.quilt.sizes, size] });
}

export function updateSize(doc: PatternDocument, index: number, change: Partial<QuiltSize>): PatternDocument {
  if (!doc.quilt) return doc;
  return updateQuilt(doc, { sizes: doc.quilt.sizes.map((s, i) => (i === index ? { ...s, ...change } : s)) });
}

export function removeSize(doc: PatternDocument, index: number): PatternDocument {
  if (!doc.quilt) return doc;
  return updateQuilt(doc, { sizes: doc.quilt.sizes.filter((_, i) => i !== index) });
}

/** A colourway id not yet used in the document. */
export function freeColourwayId(doc: PatternDocument): string {
  const taken = new Set((doc.colourways ?? []).map((c) => c.id));
  for (let n = taken.size + 1; ; n++) if (!taken.has(`colourway-${n}`)) return `colourway-${n}`;
}

/** Adds a colourway: a copy of `from` (another colourway) or of the pattern's own fabrics. */
export function addColourway(doc: PatternDocument, from: Colourway | null = null): PatternDocument {
  const existing = doc.colourways ?? [];
  const fabrics = Object.fromEntries(doc.fabrics.map((f) => [f.id, from?.fabrics[f.id] ?? { name: f.name, colour: f.colour }]));
  const name = from ? `${from.name} (copy)`.slice(0, 80) : freeName(existing.map((c) => c.name), 'Colourway');
  return { ...doc, colourways: [...existing, { id: freeColourwayId(doc), name, fabrics }] };
}

export function updateColourway(doc: PatternDocument, id: string, change: Partial<Pick<Colourway, 'name' | 'fabrics'>>): PatternDocument {
  return { ...doc, colourways: (doc.colourways ?? []).map((c) => (c.id === id ? { ...c, ...change } : c)) };
}

/** Changes one fabric slot of a colourway (its name or colour). */
export function updateColourwayFabric(doc: PatternDocument, id: string, fabricId: string, change: { name?: string; colour?: string }): PatternDocument {
  const colourway = doc.colourways?.find((c) => c.id === id);
  const base = doc.fabrics.find((f) => f.id === fabricId);
  if (!colourway || !base) return doc;
  const current = colourway.fabrics[fabricId] ?? { name: base.name, colour: base.colour };
  return updateColourway(doc, id, { fabrics: { ...colourway.fabrics, [fabricId]: { ...current, ...change } } });
}

export function removeColourway(doc: PatternDocument, id: string): PatternDocument {
  const colourways = (doc.colourways ?? []).filter((c) => c.id !== id);
  const next: PatternDocument = { ...doc, colourways };
  if (!colourways.length) delete next.colourways;
  return next;
}
