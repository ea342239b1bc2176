#!/usr/bin/env node
/**
 * The app build's stamp, so `npm start` builds only when the app's sources changed.
 *
 * The stamp is a SHA-256 over every input of `ng build seamwright`: the files of the four projects
 * (the app, the editor library, the piecing and API libraries it imports; specs left out, the build
 * never reads them), the fonts it copies, angular.json, the TypeScript configs, package.json and
 * package-lock.json (a new dependency version changes the bundle). Each file adds its path and its
 * bytes, in sorted path order, so a renamed, added or removed file changes the stamp too.
 *
 *   node scripts/app-build-stamp.mjs check <outDir>   exit 0 when <outDir>/.build-stamp matches and
 *                                                     <outDir>/browser/index.html exists, else 1
 *   node scripts/app-build-stamp.mjs write <outDir>   writes the stamp after a successful build
 *
 * SEAMWRIGHT_ROOT names another tree to hash (tests use a small copy); the default is this repository.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const STAMP_FILE = '.build-stamp';

/** Folders whose files the app build reads (relative to the root). */
const SOURCE_DIRS = ['projects/seamwright', 'projects/template-editor', 'projects/piecing', 'projects/api', 'fonts'];
/** Single files the build reads. */
const SOURCE_FILES = ['angular.json', 'package.json', 'package-lock.json', 'tsconfig.json'];
/** Never read by the build: tests, and folders made by tools. */
const SKIP = (name) => name.endsWith('.spec.ts') || name === 'node_modules' || name === '.angular' || name === 'dist' || name.startsWith('.');

function listFiles(root, rel, out) {
  let entries;
  try {
    entries = fs.readdirSync(path.join(root, rel), { withFileTypes: true });
  } catch {
    return;
  }
  for (const e of entries) {
    if (SKIP(e.name)) continue;
    const child = `${rel}/${e.name}`;
    if (e.isDirectory()) listFiles(root, child, out);
    else if (e.isFile()) out.push(child);
  }
}

/** The hash of the app build's inputs under `root`, as hex. */
export function appSourcesHash(root) {
  const files = [];
  for (const dir of SOURCE_DIRS) listFiles(root, dir, files);
  for (const f of SOURCE_FILES) if (fs.existsSync(path.join(root, f))) files.push(f);
  files.sort();
  const hash = crypto.createHash('sha256');
  for (const f of files) {
    hash.update(f);
    hash.update('\0');
    hash.update(fs.readFileSync(path.join(root, f)));
    hash.update('\0');
  }
  return hash.digest('hex');
}

/** Whether the build in `outDir` was made from the sources under `root` as they are now. */
export function buildIsCurrent(root, outDir) {
  const dir = path.resolve(root, outDir);
  if (!fs.existsSync(path.join(dir, 'browser', 'index.html'))) return false;
  let stamp;
  try {
    stamp = fs.readFileSync(path.join(dir, STAMP_FILE), 'utf8').trim();
  } catch {
    return false;
  }
  return stamp === appSourcesHash(root);
}

/** Records that the build in `outDir` was made from the sources under `root` as they are now. */
export function writeStamp(root, outDir) {
  const dir = path.resolve(root, outDir);
  fs.mkdirSync(dir, { recursive: true });
  fs.writeFileSync(path.join(dir, STAMP_FILE), appSourcesHash(root) + '\n');
}

const isMain = process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url);
if (isMain) {
  const [command, outDir = 'dist/seamwright'] = process.argv.slice(2);
  const root = process.env.SEAMWRIGHT_ROOT ?? path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
  if (command === 'check') process.exit(buildIsCurrent(root, outDir) ? 0 : 1);
  else if (command === 'write') writeStamp(root, outDir);
  else {
    console.error('usage: node scripts/app-build-stamp.mjs check|write [outDir]');
    process.exit(2);
  }
}
