import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { ConfigError, loadConfig } from './config';

describe('config from the environment', () => {
  it('has defaults that work on a laptop', () => {
    const c = loadConfig({}, '/srv/seamwright');
    expect(c).toMatchObject({
      env: 'development',
      port: 4200,
      host: '127.0.0.1',
      publicUrl: 'http://localhost:4200',
      dataDir: path.resolve('/srv/seamwright', 'data'),
      staticDir: path.resolve('/srv/seamwright', 'dist/seamwright/browser'),
      smtp: { host: '127.0.0.1', port: 1025 },
      mailInboxUrl: 'http://127.0.0.1:1080',
      seedDemo: false,
      secureCookies: false,
      bcryptRounds: 12,
    });
  });

  it('reads every setting once, with PUBLIC_URL following PORT unless given', () => {
    const c = loadConfig({ PORT: '8080', SEAMWRIGHT_DATA_DIR: '/var/lib/sw', SMTP_PORT: '2525', SEAMWRIGHT_SEED_DEMO: '1', NODE_ENV: 'test' }, '/x');
    expect(c.port).toBe(8080);
    expect(c.publicUrl).toBe('http://localhost:8080');
    expect(c.dataDir).toBe('/var/lib/sw');
    expect(c.smtp.port).toBe(2525);
    expect(c.seedDemo).toBe(true);
    const https = loadConfig({ PUBLIC_URL: 'https://quilts.example/' });
    expect(https.publicUrl).toBe('https://quilts.example');
    expect(https.secureCookies).toBe(true);
  });

  it('refuses settings it cannot use, naming them', () => {
    expect(() => loadConfig({ PORT: 'eighty' })).toThrow(ConfigError);
    expect(() => loadConfig({ PORT: '70000' })).toThrow(/PORT/);
    expect(() => loadConfig({ NODE_ENV: 'staging' })).toThrow(/NODE_ENV/);
    expect(() => loadConfig({ PUBLIC_URL: 'not a url' })).toThrow(/PUBLIC_URL/);
    expect(() => loadConfig({ SEAMWRIGHT_SECRET: 'short' })).toThrow(/SEAMWRIGHT_SECRET/);
  });
});
