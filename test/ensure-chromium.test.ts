/** The browser tests' set-up: a missing Chromium is installed when possible, else the run stops with the command. */
import { afterEach, describe, expect, it, vi } from 'vitest';

afterEach(() => {
  vi.unstubAllEnvs();
  vi.resetModules();
});

describe('ensureChromium', () => {
  it('returns the path when the binary exists', async () => {
    vi.stubEnv('CHROMIUM_PATH', process.execPath);
    const { ensureChromium } = await import('../scripts/ensure-chromium.mjs');
    expect(ensureChromium()).toBe(process.execPath);
  });
  it('does not install over an explicit CHROMIUM_PATH; it fails with the install command', async () => {
    vi.stubEnv('CHROMIUM_PATH', '/nonexistent/chromium-for-test');
    const { ensureChromium } = await import('../scripts/ensure-chromium.mjs');
    expect(() => ensureChromium()).toThrow(/nonexistent\/chromium-for-test not found.*apt-get install -y chromium/);
  });
});
