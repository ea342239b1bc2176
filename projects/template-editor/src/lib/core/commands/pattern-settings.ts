import { MAX_SIZE_IN, resizePattern, type Fabric, type FinishedSize, type PatternDocument, type Section, type StripSet } from '@seamwright/piecing';
import { newId } from './ids';

/*
 * Pattern-wide settings as named commands: fabrics, counts, sewing lengths, strip-set names and resizing
 * the design. Each is a pure function of the document; one that is asked for something it cannot do
 * returns the document it was given (the store then records nothing).
 */

/** Usable width of fabric a new fabric starts with (common practice: 40–42 in. after the selvages). */
export const DEFAULT_USABLE_WOF_IN = 42;

/** Colours offered to new fabrics, in turn; a colour already in the pattern is skipped while others are left. */
const NEW_FABRIC_COLOURS = ['#6b2d5c', '#e8dcc0', '#8fa382', '#c4622d', '#2f5d7c', '#d9a441', '#4a4a4a', '#b85a78'];

/** Whether `colour` is a colour the pattern format takes: `#rrggbb`. */
export function isFabricColour(colour: string): boolean {
  return /^#[0-9a-fA-F]{6}$/.test(colour);
}

/** A new fabric for the document: the next free "Fabric N" name, a colour not yet used, 42 in. usable width. */
export function newFabric(document: PatternDocument, id = newId('f')): Fabric {
  const names = new Set(document.fabrics.map((f) => f.name.toLowerCase()));
  let n = document.fabrics.length + 1;
  while (names.has(`fabric ${n}`)) n++;
  const used = new Set(document.fabrics.map((f) => f.colour.toLowerCase()));
  const colour = NEW_FABRIC_COLOURS.find((c) => !used.has(c)) ?? NEW_FABRIC_COLOURS[document.fabrics.length % NEW_FABRIC_COLOURS.length];
  return { id, name: `Fabric ${n}`, colour, usableWofIn: DEFAULT_USABLE_WOF_IN };
}

/** Adds a fabric (at most 100, the format's limit; an id already present is refused). */
export function addFabric(document: PatternDocument, fabric: Fabric): PatternDocument {
  if (document.fabrics.length >= 100 || document.fabrics.some((f) => f.id === fabric.id)) return document;
  return { ...document, fabrics: [...document.fabrics, { ...fabric }] };
}

/** What can change about a fabric. */
export interface FabricChange {
  name?: string;
  colour?: string;
  usableWofIn?: number;
}

/** Why a fabric change cannot be made, in words, or null when it can. */
export function fabricChangeProblem(document: PatternDocument, fabricId: string, change: FabricChange): string | null {
  if (change.name !== undefined) {
    const name = change.name.trim();
    if (name.length === 0) return 'a fabric needs a name';
    if (name.length > 80) return 'a fabric name is at most 80 characters';
    if (document.fabrics.some((f) => f.id !== fabricId && f.name.trim().toLowerCase() === name.toLowerCase())) return `another fabric is called ${name}`;
  }
  if (change.colour !== undefined && !isFabricColour(change.colour)) return 'a colour is written like #7a3b69';
  if (change.usableWofIn !== undefined && !(change.usableWofIn > 0 && change.usableWofIn <= MAX_SIZE_IN)) return `the usable width must be more than 0 and at most ${MAX_SIZE_IN} in.`;
  return null;
}

/** Renames a fabric, changes its colour or its usable width of fabric; an invalid change is refused. */
export function updateFabric(document: PatternDocument, fabricId: string, change: FabricChange): PatternDocument {
  const index = document.fabrics.findIndex((f) => f.id === fabricId);
  if (index < 0 || fabricChangeProblem(document, fabricId, change) !== null) return document;
  const old = document.fabrics[index];
  const next: Fabric = {
    ...old,
    ...(change.name !== undefined ? { name: change.name.trim() } : {}),
    ...(change.colour !== undefined ? { colour: change.colour.toLowerCase() } : {}),
    ...(change.usableWofIn !== undefined ? { usableWofIn: change.usableWofIn } : {}),
  };
  if (next.name === old.name && next.colour === old.colour && next.usableWofIn === old.usableWofIn) return document;
  const fabrics = document.fabrics.slice();
  fabrics[index] = next;
  return { ...document, fabrics };
}

/** Labels of the patches (`A3`) that use the fabric, as a fill or as a strip of a strip set, in document order. */
export function fabricUses(document: PatternDocument, fabricId: string): string[] {
  const out: string[] = [];
  for (const s of document.sections) {
    for (const p of s.patches) {
      if (p.fabricId === fabricId || p.stripSet?.strips.some((st) => st.fabricId === fabricId)) out.push(`${s.label}${p.number}`);
    }
  }
  return out;
}

/** Removes a fabric no patch or strip uses; a fabric in use is kept. */
export function removeFabric(document: PatternDocument, fabricId: string): PatternDocument {
  if (!document.fabrics.some((f) => f.id === fabricId) || fabricUses(document, fabricId).length > 0) return document;
  return { ...document, fabrics: document.fabrics.filter((f) => f.id !== fabricId) };
}

/** Sewing settings of the pattern, with the ranges the pattern format accepts. */
export const SEWING_SETTING_RANGES = {
  seamAllowanceIn: { min: 1 / 16, max: 2 },
  piecingMarginIn: { min: 0, max: 4 },
  blockCount: { min: 1, max: 1000 },
  pressingsPerTemplate: { min: 1, max: 1000 },
} as const;

/** What can change among the sewing settings. */
export type SewingSettingsChange = Partial<Record<keyof typeof SEWING_SETTING_RANGES, number>>;

/** Sets the seam allowance, piecing margin, block count or pressings per template; values out of range are refused. */
export function setSewingSettings(document: PatternDocument, change: SewingSettingsChange): PatternDocument {
  const next = { ...document };
  let changed = false;
  for (const key of Object.keys(change) as Array<keyof SewingSettingsChange>) {
    const value = change[key];
    const range = SEWING_SETTING_RANGES[key];
    if (value === undefined || !Number.isFinite(value) || value < range.min || value > range.max) return document;
    if ((key === 'blockCount' || key === 'pressingsPerTemplate') && !Number.isInteger(value)) return document;
    if (next[key] !== value) {
      next[key] = value;
      changed = true;
    }
  }
  return changed ? next : document;
}

/** One strip set of the pattern as the settings list shows it. */
export interface PatternStripSet {
  stripSetId: string;
  name: string | null;
  /** Labels of the sections (`A`) and patches (`A3`) it fills; one set may fill several patches. */
  sectionLabels: string[];
  patchLabels: string[];
}

/** Every strip set of the pattern, once per id, in document order. */
export function patternStripSets(document: PatternDocument): PatternStripSet[] {
  const byId = new Map<string, PatternStripSet>();
  for (const s of document.sections) {
    for (const p of s.patches) {
      if (!p.stripSet) continue;
      let entry = byId.get(p.stripSet.id);
      if (!entry) byId.set(p.stripSet.id, (entry = { stripSetId: p.stripSet.id, name: p.stripSet.name ?? null, sectionLabels: [], patchLabels: [] }));
      if (!entry.sectionLabels.includes(s.label)) entry.sectionLabels.push(s.label);
      entry.patchLabels.push(`${s.label}${p.number}`);
    }
  }
  return [...byId.values()];
}

/** Names a strip set (every patch it fills); an empty name removes the name. Names are at most 80 characters. */
export function renameStripSet(document: PatternDocument, stripSetId: string, name: string): PatternDocument {
  const trimmed = name.trim();
  if (trimmed.length > 80) return document;
  let changed = false;
  const rename = (set: StripSet): StripSet => {
    if ((set.name ?? '') === trimmed) return set;
    changed = true;
    const { name: _old, ...rest } = set;
    return trimmed ? { ...rest, name: trimmed } : rest;
  };
  const sections: Section[] = document.sections.map((s) => {
    if (!s.patches.some((p) => p.stripSet?.id === stripSetId)) return s;
    return { ...s, patches: s.patches.map((p) => (p.stripSet?.id === stripSetId ? { ...p, stripSet: rename(p.stripSet) } : p)) };
  });
  return changed ? { ...document, sections } : document;
}

/**
 * Resizes the design to a new finished size (piecing's `resizePattern`: scaled about the drawing's
 * origin, seam allowance kept). A size the format cannot hold is refused; call `resizePattern` first to
 * show why.
 */
export function resizeDesign(document: PatternDocument, target: FinishedSize): PatternDocument {
  if (target.widthIn === document.canvas.widthIn && target.heightIn === document.canvas.heightIn) return document;
  const result = resizePattern(document, target);
  return result.ok ? result.document : document;
}
