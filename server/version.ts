import fs from 'node:fs';

/** The product version, from the root package.json. */
export const VERSION: string = (() => {
  const pkg = JSON.parse(fs.readFileSync(new URL('../package.json', import.meta.url), 'utf8')) as { version?: unknown };
  return typeof pkg.version === 'string' ? pkg.version : '0.0.0';
})();
