import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { spawn } from 'node:child_process';
import { describe, expect, it } from 'vitest';

const root = path.resolve(import.meta.dirname, '..');
const pkg = JSON.parse(fs.readFileSync(path.join(root, 'package.json'), 'utf8')) as { version: string };

describe('server process', () => {
  it('starts with `tsx server/main.ts`, migrates, seeds on --seed-demo, answers /api/health and stops on SIGTERM', async () => {
    const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'seamwright-main-'));
    const child = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts', '--seed-demo'], {
      cwd: root,
      env: { ...process.env, PORT: '0', SEAMWRIGHT_DATA_DIR: dataDir, BCRYPT_ROUNDS: '4', NODE_ENV: 'test' },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let output = '';
    const port = await new Promise<number>((resolve, reject) => {
      const timer = setTimeout(() => reject(new Error(`no start within 45 s:\n${output}`)), 45_000);
      const onData = (chunk: Buffer) => {
        output += chunk.toString();
        const m = /listening on http:\/\/127\.0\.0\.1:(\d+)/.exec(output);
        if (m) {
          clearTimeout(timer);
          resolve(Number(m[1]));
        }
      };
      child.stdout.on('data', onData);
      child.stderr.on('data', onData);
      child.once('exit', (code) => reject(new Error(`exited ${code}:\n${output}`)));
    });
    try {
      const res = await fetch(`http://127.0.0.1:${port}/api/health`);
      expect(res.status).toBe(200);
      expect(await res.json()).toEqual({ ok: true, version: pkg.version });
      expect(res.headers.get('content-security-policy')).toContain("default-src 'self'");
      expect(output).toContain('demo sign-in: designer@fernbrook.example');
      expect(fs.existsSync(path.join(dataDir, 'seamwright.db'))).toBe(true);
      expect(fs.existsSync(path.join(dataDir, 'seamwright.db-wal'))).toBe(true);
    } finally {
      const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
      child.kill('SIGTERM');
      expect(await exited).toBe(0);
      fs.rmSync(dataDir, { recursive: true, force: true });
    }
  });
});
