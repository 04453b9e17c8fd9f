import { describe, expect, it } from 'vitest';
import { ConfigError, loadConfig } from '../../../server/config';

describe('loadConfig', () => {
  it('when the environment is empty, then the documented defaults apply', () => {
    expect(loadConfig({})).toEqual({
      port: 3000,
      databaseUrl: 'sqlite:./data/baywright.sqlite',
      nodeEnv: 'development',
      cookieSecure: false,
      rateLimitRelaxed: false,
      seedDemo: true,
      uploadDir: './data/uploads',
      trustProxy: false,
      designRunsKept: 5,
      smtp: null,
      designRuns: {},
    });
  });

  it('when the design budget variables are given, then designRuns carries them; a bad one is named', () => {
    expect(loadConfig({ DESIGN_TIMEOUT_MS: '5000', DESIGN_MEMORY_MB: '256', DESIGN_WORKERS: '2' }).designRuns).toEqual({ timeoutMs: 5000, memoryMb: 256, workers: 2 });
    expect(() => loadConfig({ DESIGN_TIMEOUT_MS: '0' })).toThrow('DESIGN_TIMEOUT_MS must be at least 1');
  });

  it('when DESIGN_RUNS_KEPT is set, then it is read, and a value that is not a whole number from 1 to 1000 is refused by name', () => {
    expect(loadConfig({ DESIGN_RUNS_KEPT: '12' }).designRunsKept).toBe(12);
    for (const bad of ['0', '2.5', 'many', '1001']) {
      expect(() => loadConfig({ DESIGN_RUNS_KEPT: bad }), bad).toThrow(/DESIGN_RUNS_KEPT must be a whole number between 1 and 1000/);
    }
  });

  it('when NODE_ENV is production and COOKIE_SECURE unset, then cookies are Secure', () => {
    expect(loadConfig({ NODE_ENV: 'production' }).cookieSecure).toBe(true);
    expect(loadConfig({ NODE_ENV: 'production', COOKIE_SECURE: 'false' }).cookieSecure).toBe(false);
  });

  it('when the e2e variables are given, then they are parsed', () => {
    const c = loadConfig({
      NODE_ENV: 'production',
      PORT: '3111',
      DATABASE_URL: 'sqlite:./data/e2e-3111.sqlite',
      COOKIE_SECURE: 'false',
      RATE_LIMIT_RELAXED: 'true',
      SEED_DEMO: '0',
    });
    expect(c).toMatchObject({
      port: 3111,
      databaseUrl: 'sqlite:./data/e2e-3111.sqlite',
      cookieSecure: false,
      rateLimitRelaxed: true,
      seedDemo: false,
    });
  });

  it.each(['sqlite::memory:', 'postgres://bw:pw@db.internal:5432/baywright', 'postgresql://localhost/bw'])(
    'when DATABASE_URL is %s, then it is accepted',
    (url) => {
      expect(loadConfig({ DATABASE_URL: url }).databaseUrl).toBe(url);
    },
  );

  it.each([
    [{ PORT: 'abc' }, /PORT must be a whole number.*"abc"/],
    [{ PORT: '70000' }, /PORT/],
    [{ DATABASE_URL: 'mysql://x' }, /DATABASE_URL must start with sqlite:/],
    [{ NODE_ENV: 'staging' }, /NODE_ENV must be development, production or test/],
    [{ COOKIE_SECURE: 'maybe' }, /COOKIE_SECURE must be one of/],
    [{ SMTP_HOST: 'mail.example', SMTP_FROM: 'not-an-email' }, /SMTP_FROM must be an email/],
    [{ SMTP_HOST: 'mail.example' }, /SMTP_FROM: required when SMTP_HOST is set/],
    [{ SMTP_HOST: 'mail.example', SMTP_FROM: 'noreply@baywright.example' }, /APP_URL: required when SMTP_HOST is set/],
    [{ APP_URL: 'not a url' }, /APP_URL must be an http\(s\) address/],
    [{ MAIL_FROM: 'nope' }, /MAIL_FROM must be an email/],
  ])('when the environment is %o, then a ConfigError names the variable', (env, pattern) => {
    let caught: unknown;
    try {
      loadConfig(env as Record<string, string>);
    } catch (err) {
      caught = err;
    }
    expect(caught).toBeInstanceOf(ConfigError);
    expect((caught as Error).message).toMatch(pattern);
  });

  it('when TRUST_PROXY is a hop count or a name, then it is passed on typed', () => {
    expect(loadConfig({ TRUST_PROXY: '1' }).trustProxy).toBe(1);
    expect(loadConfig({ TRUST_PROXY: 'loopback' }).trustProxy).toBe('loopback');
    expect(loadConfig({ TRUST_PROXY: 'true' }).trustProxy).toBe(true);
  });

  it('when SMTP is fully configured, then smtp carries it with port 587 by default', () => {
    expect(
      loadConfig({
        SMTP_HOST: 'mail.example',
        SMTP_FROM: 'noreply@baywright.example',
        APP_URL: 'https://baywright.example',
      }).smtp,
    ).toEqual({
      host: 'mail.example',
      port: 587,
      user: undefined,
      password: undefined,
      from: 'noreply@baywright.example',
    });
  });

  it('when the aliases SMTP_PASS and MAIL_FROM are used, then smtp and appUrl carry them', () => {
    const c = loadConfig({
      SMTP_HOST: 'mail.example',
      SMTP_PORT: '2525',
      SMTP_USER: 'bw',
      SMTP_PASS: 'secret',
      MAIL_FROM: 'noreply@baywright.example',
      APP_URL: 'https://baywright.example/',
    });
    expect(c.smtp).toEqual({
      host: 'mail.example',
      port: 2525,
      user: 'bw',
      password: 'secret',
      from: 'noreply@baywright.example',
    });
    expect(c.appUrl).toBe('https://baywright.example');
  });
});
