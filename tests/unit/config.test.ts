import { describe, expect, it } from 'vitest';
import { ConfigError, loadConfig } from '../../server/config';

const base = { DATABASE_URL: 'postgres://u:p@127.0.0.1:5432/db' };

describe('loadConfig', () => {
  it('gives working local defaults', () => {
    const c = loadConfig(base);
    expect(c.PORT).toBe(3000);
    expect(c.HOST).toBe('127.0.0.1');
    expect(c.S3_BUCKET).toBe('rivet-reel-media');
    expect(c.s3ForcePathStyle).toBe(false);
    expect(loadConfig({ ...base, S3_ENDPOINT: 'http://127.0.0.1:4569' }).s3ForcePathStyle).toBe(true);
  });

  it('rejects bad values, naming each variable', () => {
    const attempt = () => loadConfig({ DATABASE_URL: 'mysql://nope', PORT: 'eighty', S3_BUCKET: 'Bad_Bucket', SMTP_SECURE: 'maybe' });
    expect(attempt).toThrow(ConfigError);
    try {
      attempt();
    } catch (err) {
      const message = (err as ConfigError).message;
      for (const name of ['DATABASE_URL', 'PORT', 'S3_BUCKET', 'SMTP_SECURE']) expect(message).toContain(name);
      expect(message).toContain('must be a postgres:// connection URL');
    }
  });

  it('requires DATABASE_URL', () => {
    expect(() => loadConfig({})).toThrow(/DATABASE_URL/);
  });

  it('refuses the development session secret in production', () => {
    expect(() => loadConfig({ ...base, NODE_ENV: 'production' })).toThrow(/SESSION_SECRET: must be set in production/);
    expect(loadConfig({ ...base, NODE_ENV: 'production', SESSION_SECRET: 'x'.repeat(40) }).NODE_ENV).toBe('production');
  });

  it('treats empty variables as unset', () => {
    expect(loadConfig({ ...base, PORT: '' }).PORT).toBe(3000);
  });
});
