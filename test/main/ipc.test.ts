import { beforeEach, describe, expect, it, vi } from 'vitest';

// Electron security checklist (electronjs.org/docs/latest/tutorial/security, "Validate the
// sender of all IPC messages"): every handler refuses frames that are not the app's page,
// and validates its payload before acting. Electron itself is replaced by stand-ins here.

const handlers = new Map<string, (event: unknown, payload?: unknown) => Promise<unknown>>();
const saveDialog = vi.fn();
const written: { file: string; bytes: Uint8Array }[] = [];

vi.mock('electron', () => ({
  ipcMain: { handle: (channel: string, fn: (event: unknown, payload?: unknown) => Promise<unknown>) => { handlers.set(channel, fn); } },
  BrowserWindow: { fromWebContents: () => ({ webContents: { printToPDF: async () => new Uint8Array([37, 80, 68, 70]) } }) },
  dialog: { showSaveDialog: (...args: unknown[]) => saveDialog(...args), showOpenDialog: async () => ({ canceled: true, filePaths: [] }) },
  app: { getVersion: () => '0.1.0', getPath: () => '/home/ana/Documents' },
}));

vi.mock('node:fs/promises', async (original) => ({
  ...(await original<typeof import('node:fs/promises')>()),
  writeFile: async (file: string, bytes: Uint8Array) => { written.push({ file, bytes }); },
}));

const { registerIpcHandlers } = await import('../../src-main/ipc');
const { CHANNELS } = await import('../../src-main/channels');

const store = { current: () => ({ window: { width: 1, height: 1, maximized: false }, recentFiles: ['/data/hf-1.csv'] }), addRecent: async () => [] };
const fromApp = { senderFrame: { url: 'app://stress-ledger/index.html#/archive' }, sender: {} };
const fromElsewhere = { senderFrame: { url: 'https://attacker.invalid/' }, sender: {} };

describe('ipc handlers', () => {
  beforeEach(() => {
    handlers.clear();
    written.length = 0;
    saveDialog.mockReset();
    registerIpcHandlers({ store: store as never, refreshMenu: () => undefined });
  });

  it('should register one handler per bridge channel', () => {
    expect([...handlers.keys()].sort()).toEqual(Object.values(CHANNELS).sort());
  });

  it('should refuse every channel when the sender is not the app page', async () => {
    for (const [channel, handler] of handlers) {
      await expect(handler(fromElsewhere, undefined), channel).rejects.toThrow(/did not come from the app/);
      await expect(handler({ senderFrame: null, sender: {} }, undefined), channel).rejects.toThrow(/did not come from the app/);
    }
  });

  it('should refuse a bad payload before opening any dialog', async () => {
    await expect(handlers.get(CHANNELS.saveFile)!(fromApp, { suggestedName: '../../.bashrc', bytes: new Uint8Array(1), mimeType: 'text/plain' })).rejects.toThrow(/Refused/);
    expect(saveDialog).not.toHaveBeenCalled();
  });

  it('should save through the native dialog and answer the simple queries', async () => {
    saveDialog.mockResolvedValue({ canceled: false, filePath: '/home/ana/Documents/gradients.csv' });
    const bytes = new TextEncoder().encode('tvd_m,shmin_mpa\n');
    expect(await handlers.get(CHANNELS.saveFile)!(fromApp, { suggestedName: 'gradients.csv', bytes, mimeType: 'text/csv' })).toBe('gradients.csv');
    expect(written).toEqual([{ file: '/home/ana/Documents/gradients.csv', bytes }]);
    saveDialog.mockResolvedValue({ canceled: true });
    expect(await handlers.get(CHANNELS.printReport)!(fromApp, { suggestedName: 'HF-1 review.pdf' })).toBeNull();
    expect(await handlers.get(CHANNELS.recentFiles)!(fromApp, undefined)).toEqual(['/data/hf-1.csv']);
    expect(await handlers.get(CHANNELS.appVersion)!(fromApp, undefined)).toBe('0.1.0');
  });

  it('should route the team folder calls to the host after checking them', async () => {
    const calls: unknown[] = [];
    const host = {
      connect: async (o: unknown) => { calls.push(['connect', o]); return { folder: '/srv/team' }; },
      status: () => ({ folder: '/srv/team' }),
      readChanges: async () => [],
      push: async (events: unknown[]) => ({ reachable: true, journals: [], count: events.length }),
      writeRaw: async (hash: string) => hash,
      readRaw: async () => ({ status: 'missing' }),
    };
    handlers.clear();
    registerIpcHandlers({ store: store as never, refreshMenu: () => undefined, teamFolder: host as never });
    expect(await handlers.get(CHANNELS.connectTeamFolder)!(fromApp, { folder: '/srv/team', author: 'Ana Petrov', device: 'dev-a' })).toEqual({ folder: '/srv/team' });
    await expect(handlers.get(CHANNELS.connectTeamFolder)!(fromApp, { folder: 'relative', author: 'Ana Petrov', device: 'dev-a' })).rejects.toThrow(/Refused/);
    await expect(handlers.get(CHANNELS.pushTeamEvents)!(fromApp, { events: [{ id: 1 }] })).rejects.toThrow(/Refused/);
    expect(await handlers.get(CHANNELS.pushTeamEvents)!(fromApp, { events: [] })).toMatchObject({ count: 0 });
    expect(await handlers.get(CHANNELS.readTeamRaw)!(fromApp, { hash: 'cd'.repeat(32) })).toEqual({ status: 'missing' });
    expect(await handlers.get(CHANNELS.chooseTeamFolder)!(fromApp, undefined)).toBeNull();
    expect(calls).toEqual([['connect', { folder: '/srv/team', author: 'Ana Petrov', device: 'dev-a' }]]);
  });
});
