import { checkPatternText, displayPath, problemsFromServer, readPatternFile } from './read-pattern-file';

const good = {
  formatVersion: 1,
  title: 'Imported block',
  canvas: { widthIn: 12, heightIn: 12 },
  fabrics: [{ id: 'plum', name: 'Plum', colour: '#6b2d5c' }],
  sections: [
    {
      id: 'a',
      label: 'A',
      geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 6, y: 0 }, { x: 6, y: 6 }, { x: 0, y: 6 }] },
      seams: [{ id: 's1', a: { x: 3, y: 0 }, b: { x: 3, y: 6 } }],
      patches: [{ number: 1, anchor: { x: 1, y: 3 }, fabricId: 'plum' }],
    },
  ],
};

const broken = {
  ...good,
  fabrics: [{ id: 'plum', name: 'Plum', colour: 'purple' }],
  sections: [
    good.sections[0],
    { id: 'b', label: 'b', geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 250, y: 0 }, { x: 6, y: 6 }] } },
  ],
};

describe('checkPatternText', () => {
  it('takes a valid file through the library parser: defaults filled in, version upgraded', () => {
    const r = checkPatternText(JSON.stringify(good));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.document.title).toBe('Imported block');
    // ¼ in. seam allowance is the schema's default (common practice).
    expect(r.document.seamAllowanceIn).toBe(0.25);
    expect(r.document.formatVersion).toBeGreaterThanOrEqual(1);
    expect(r.droppedTraceImage).toBe(false);
  });

  it('lists every problem with its path', () => {
    const r = checkPatternText(JSON.stringify(broken));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems).toEqual([
      { path: 'fabrics.0.colour', message: 'must be a colour like #7a3b69' },
      { path: 'sections.1.label', message: 'must be one to three capital letters' },
      { path: 'sections.1.geometry.vertices.1.x', message: 'must be within ±200 in.' },
    ]);
  });

  it('refuses text that is not JSON, and a newer format version, saying so', () => {
    const notJson = checkPatternText('{"title": ');
    expect(notJson.ok).toBe(false);
    if (!notJson.ok) expect(notJson.problems[0]).toMatchObject({ path: '', message: expect.stringMatching(/^not a JSON file/) });
    const newer = checkPatternText(JSON.stringify({ ...good, formatVersion: 999 }));
    expect(newer.ok).toBe(false);
    if (!newer.ok) expect(newer.problems[0]).toMatchObject({ path: 'formatVersion', message: expect.stringMatching(/^version 999 is newer/) });
  });

  it('leaves out a traced image, which stays with the pattern it was uploaded to', () => {
    const withImage = { ...good, referenceImage: { uploadId: 'up-123', origin: { x: 0, y: 0 }, widthIn: 12, opacity: 0.4 } };
    const r = checkPatternText('\uFEFF' + JSON.stringify(withImage));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.document.referenceImage).toBeUndefined();
    expect(r.droppedTraceImage).toBe(true);
  });
});

describe('readPatternFile', () => {
  it('reads the file the user chose', async () => {
    const r = await readPatternFile(new Blob([JSON.stringify(broken)], { type: 'application/json' }));
    expect(r.ok ? [] : r.problems.map((p) => p.path)).toEqual(['fabrics.0.colour', 'sections.1.label', 'sections.1.geometry.vertices.1.x']);
  });

  it('refuses a file above 4 MB without reading it', async () => {
    const r = await readPatternFile(new Blob([new Uint8Array(4 * 1024 * 1024 + 1)]));
    expect(r).toEqual({ ok: false, problems: [{ path: '', message: 'the file is larger than 4 MB' }] });
  });
});

describe('displayPath', () => {
  it('writes array indices in brackets', () => {
    expect(displayPath('sections.2.geometry.vertices.1.x')).toBe('sections[2].geometry.vertices[1].x');
    expect(displayPath('title')).toBe('title');
    expect(displayPath('')).toBe('(file)');
  });
});

describe('problemsFromServer', () => {
  it('takes the server paths back to paths in the file', () => {
    expect(problemsFromServer([{ path: 'document.sections.0.label', message: 'm' }, { path: 'document', message: 'n' }])).toEqual([
      { path: 'sections.0.label', message: 'm' },
      { path: '', message: 'n' },
    ]);
  });
});
