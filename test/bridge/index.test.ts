import { afterEach, describe, expect, it } from 'vitest';

// getBridge prefers the Electron preload's window.stressLedger (the design's one bridge
// per platform); checked with a stand-in window object.

const holder = globalThis as unknown as { window?: unknown; document?: unknown };

afterEach(() => { delete holder.window; delete holder.document; });

describe('bridge index', () => {
  it('should return the preload bridge when the window has one', async () => {
    const preload = { platform: 'electron' };
    holder.window = { stressLedger: preload };
    const { getBridge } = await import('../../src-renderer/bridge/index');
    expect(getBridge()).toBe(preload);
  });

  it('should fall back to the web bridge, created once', async () => {
    holder.window = { addEventListener() {}, removeEventListener() {}, localStorage: null };
    holder.document = {};
    const { getBridge } = await import('../../src-renderer/bridge/index');
    const first = getBridge();
    expect(first.platform).toBe('web');
    expect(getBridge()).toBe(first);
  });
});
