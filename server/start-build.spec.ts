import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { spawnSync } from 'node:child_process';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';

/**
 * `npm start` builds the app only when its sources changed (scripts/build-app-if-changed.sh with the
 * stamp of scripts/app-build-stamp.mjs). Run against a small tree laid out like the repository, with
 * a build command that writes the output and counts how often it ran.
 */
const root = path.resolve(import.meta.dirname, '..');
const script = path.join(root, 'scripts/build-app-if-changed.sh');

let tree: string;
let buildLog: string;

function write(rel: string, text: string) {
  fs.mkdirSync(path.dirname(path.join(tree, rel)), { recursive: true });
  fs.writeFileSync(path.join(tree, rel), text);
}

/** Runs the start script's build step; returns how many builds have run so far in this tree. */
function startBuildStep(extraEnv: Record<string, string> = {}): number {
  const build = `mkdir -p dist/seamwright/browser && echo '<html>' > dist/seamwright/browser/index.html && echo built >> '${buildLog}'`;
  const run = spawnSync('bash', [script], {
    env: { ...process.env, SEAMWRIGHT_ROOT: tree, SEAMWRIGHT_BUILD_COMMAND: build, SEAMWRIGHT_REBUILD: '0', ...extraEnv },
    encoding: 'utf8',
  });
  expect(run.status, run.stderr).toBe(0);
  return fs.existsSync(buildLog) ? fs.readFileSync(buildLog, 'utf8').trim().split('\n').length : 0;
}

beforeEach(() => {
  tree = fs.mkdtempSync(path.join(os.tmpdir(), 'seamwright-start-'));
  buildLog = path.join(tree, 'builds.log');
  write('angular.json', '{"projects":{}}');
  write('package-lock.json', '{"lockfileVersion":3}');
  write('projects/seamwright/src/main.ts', 'console.log("app");\n');
  write('projects/seamwright/src/main.spec.ts', 'it("x", () => {});\n');
  write('projects/piecing/src/public-api.ts', 'export const a = 1;\n');
  write('projects/template-editor/src/public-api.ts', 'export const b = 1;\n');
  write('projects/api/src/public-api.ts', 'export const c = 1;\n');
  write('fonts/Sans.ttf', 'font bytes');
});

afterEach(() => {
  fs.rmSync(tree, { recursive: true, force: true });
});

describe('npm start builds the app only when its sources changed', () => {
  it('builds the first time, then skips while nothing the build reads has changed', () => {
    expect(startBuildStep()).toBe(1);
    expect(fs.readFileSync(path.join(tree, 'dist/seamwright/.build-stamp'), 'utf8')).toMatch(/^[0-9a-f]{64}\n$/);
    expect(startBuildStep()).toBe(1);
    // A spec is not read by the build: no new build.
    write('projects/seamwright/src/main.spec.ts', 'it("y", () => {});\n');
    expect(startBuildStep()).toBe(1);
  });

  it.each([
    ['an app source', 'projects/seamwright/src/main.ts', 'console.log("changed");\n'],
    ['a library source', 'projects/piecing/src/public-api.ts', 'export const a = 2;\n'],
    ['the API contract', 'projects/api/src/public-api.ts', 'export const c = 2;\n'],
    ['angular.json', 'angular.json', '{"projects":{"x":{}}}'],
    ['package-lock.json', 'package-lock.json', '{"lockfileVersion":3,"packages":{}}'],
    ['a font', 'fonts/Sans.ttf', 'other font bytes'],
    ['a new file', 'projects/template-editor/src/lib/new.ts', 'export {};\n'],
  ])('builds again when %s changes', (_what, rel, text) => {
    expect(startBuildStep()).toBe(1);
    write(rel, text);
    expect(startBuildStep()).toBe(2);
    expect(startBuildStep()).toBe(2);
  });

  it('builds again when a file is removed, when the output is gone, and when asked to', () => {
    expect(startBuildStep()).toBe(1);
    fs.rmSync(path.join(tree, 'projects/template-editor/src/public-api.ts'));
    expect(startBuildStep()).toBe(2);
    fs.rmSync(path.join(tree, 'dist/seamwright/browser/index.html'));
    expect(startBuildStep()).toBe(3);
    expect(startBuildStep({ SEAMWRIGHT_REBUILD: '1' })).toBe(4);
  });

  it('leaves no stamp behind when the build fails, so the next start builds again', () => {
    expect(startBuildStep()).toBe(1);
    write('projects/seamwright/src/main.ts', 'broken(\n');
    const failing = spawnSync('bash', [script], {
      env: { ...process.env, SEAMWRIGHT_ROOT: tree, SEAMWRIGHT_BUILD_COMMAND: 'false' },
      encoding: 'utf8',
    });
    expect(failing.status).not.toBe(0);
    expect(fs.existsSync(path.join(tree, 'dist/seamwright/.build-stamp'))).toBe(false);
    expect(startBuildStep()).toBe(2);
  });

  it('is the step scripts/start.sh runs before starting the servers', () => {
    const start = fs.readFileSync(path.join(root, 'scripts/start.sh'), 'utf8');
    expect(start).toMatch(/^bash scripts\/build-app-if-changed\.sh$/m);
    expect(start).not.toMatch(/^\s*npx ng build/m);
  });
});
