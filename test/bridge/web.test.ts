import { describe, expect, it } from 'vitest';
import { createWebBridge, filesFromEntries, menuCommandForKey } from '../../src-renderer/bridge/web';

// The web bridge is checked against minimal stand-ins for the DOM pieces it touches
// (the File and Directory Entries API of WICG "File and Directory Entries", an <a download>
// element, key events); the shortcuts are the desktop menu's (common practice).

type Listener = (event: unknown) => void;

function fakeWindow() {
  const listeners = new Map<string, Set<Listener>>();
  const storage = new Map<string, string>();
  let printed = 0;
  return {
    printed: () => printed,
    dispatch(type: string, event: unknown) { for (const l of listeners.get(type) ?? []) l(event); },
    count(type: string) { return listeners.get(type)?.size ?? 0; },
    window: {
      addEventListener(type: string, l: Listener) { if (!listeners.has(type)) listeners.set(type, new Set()); listeners.get(type)!.add(l); },
      removeEventListener(type: string, l: Listener) { listeners.get(type)?.delete(l); },
      print() { printed += 1; },
      setTimeout(fn: () => void) { fn(); return 0; },
    },
    storage: {
      getItem: (k: string) => storage.get(k) ?? null,
      setItem: (k: string, v: string) => { storage.set(k, v); },
      removeItem: (k: string) => { storage.delete(k); },
      clear: () => storage.clear(),
      key: () => null,
      length: 0,
    },
  };
}

function fakeDocument() {
  const clicked: { href: string; download: string }[] = [];
  const appended: unknown[] = [];
  return {
    clicked, appended,
    document: {
      body: { appendChild: (el: unknown) => { appended.push(el); } },
      createElement: () => {
        const element = { href: '', download: '', rel: '', style: {} as Record<string, string>, click() { clicked.push({ href: element.href, download: element.download }); }, remove() { /* detached */ } };
        return element;
      },
    },
  };
}

function fileEntry(name: string, text: string) {
  return { isFile: true, isDirectory: false, name, file: (ok: (f: File) => void) => ok(new File([text], name)) };
}

function directoryEntry(name: string, children: unknown[]) {
  return {
    isFile: false, isDirectory: true, name,
    createReader() {
      // Real readers hand out entries in batches and then an empty batch.
      const batches = [children.slice(0, 1), children.slice(1), []];
      return { readEntries: (ok: (entries: unknown[]) => void) => ok(batches.shift() ?? []) };
    },
  };
}

const key = (k: string, mods: Partial<Record<'ctrlKey' | 'metaKey' | 'shiftKey' | 'altKey', boolean>> = {}) =>
  ({ key: k, ctrlKey: false, metaKey: false, shiftKey: false, altKey: false, ...mods });

describe('web bridge', () => {
  it('should map the desktop shortcuts to menu commands', () => {
    expect(menuCommandForKey(key('o', { ctrlKey: true }))).toBe('open-files');
    expect(menuCommandForKey(key('O', { ctrlKey: true, shiftKey: true }))).toBe('open-folder');
    expect(menuCommandForKey(key('e', { metaKey: true }))).toBe('export');
    expect(menuCommandForKey(key('z', { ctrlKey: true }))).toBe('undo');
    expect(menuCommandForKey(key('Z', { ctrlKey: true, shiftKey: true }))).toBe('redo');
    expect(menuCommandForKey(key('y', { ctrlKey: true }))).toBe('redo');
    expect(menuCommandForKey(key('p', { ctrlKey: true }))).toBe('print-report');
    expect(menuCommandForKey(key('f', { ctrlKey: true }))).toBe('find');
    expect(menuCommandForKey(key('o'))).toBeNull();
    expect(menuCommandForKey(key('o', { ctrlKey: true, altKey: true }))).toBeNull();
  });

  it('should walk dropped folders in batches, skipping hidden entries', async () => {
    const tree = [directoryEntry('reports', [fileEntry('hf-1.csv', 'a'), directoryEntry('2026', [fileEntry('hf-2.las', 'bb')]), fileEntry('.DS_Store', 'x')]), fileEntry('hf-3.xlsx', 'ccc')];
    const files = await filesFromEntries(tree as never);
    expect(files.map((f) => f.relativePath)).toEqual(['reports/hf-1.csv', 'reports/2026/hf-2.las', 'hf-3.xlsx']);
    expect(await files[1].file.text()).toBe('bb');
  });

  it('should download a saved file through a Blob link with the suggested name', async () => {
    const win = fakeWindow();
    const doc = fakeDocument();
    const bridge = createWebBridge({ document: doc.document as never, window: win.window as never, storage: win.storage as never, version: '0.1.0' });
    expect(bridge.platform).toBe('web');
    expect(await bridge.saveFile('gradients.csv', new TextEncoder().encode('tvd,shmin\n'), 'text/csv')).toBe('gradients.csv');
    expect(doc.clicked).toHaveLength(1);
    expect(doc.clicked[0].download).toBe('gradients.csv');
    expect(doc.clicked[0].href).toMatch(/^blob:/);
    expect(await bridge.printReport('x.pdf')).toBeNull();
    expect(win.printed()).toBe(1);
    expect(await bridge.appVersion()).toBe('0.1.0');
  });

  it('should offer no team folder in the browser (teams share through bundles there)', () => {
    // Product design: a web page cannot keep appending to a shared folder; bundles are its only channel.
    const bridge = createWebBridge({ document: fakeDocument().document as never, window: fakeWindow().window as never, storage: null });
    expect(bridge.teamFolder).toBeUndefined();
    expect(bridge.platform).toBe('web');
  });

  it('should send shortcut commands, leave undo to text fields, and unsubscribe', () => {
    const win = fakeWindow();
    const bridge = createWebBridge({ document: fakeDocument().document as never, window: win.window as never, storage: null });
    const seen: string[] = [];
    const stop = bridge.onMenuCommand((c) => seen.push(c));
    let prevented = 0;
    const event = (k: string, target: unknown, mods = { ctrlKey: true }) => ({ ...key(k, mods), target, preventDefault: () => { prevented += 1; } });
    win.dispatch('keydown', event('o', { tagName: 'DIV' }));
    win.dispatch('keydown', event('z', { tagName: 'INPUT', type: 'text', readOnly: false }));
    win.dispatch('keydown', event('z', { tagName: 'CANVAS' }));
    expect(seen).toEqual(['open-files', 'undo']);
    expect(prevented).toBe(2);
    stop();
    expect(win.count('keydown')).toBe(0);
  });

  it('should read dropped files and remember their names as recent', async () => {
    const win = fakeWindow();
    const bridge = createWebBridge({ document: fakeDocument().document as never, window: win.window as never, storage: win.storage as never });
    const received = new Promise<string[]>((resolve) => bridge.onFilesDropped((files) => resolve(files.map((f) => `${f.relativePath}:${f.bytes.length}`))));
    const transfer = {
      types: ['Files'],
      files: [new File(['abc'], 'hf-1.csv')],
      items: [{ kind: 'file', webkitGetAsEntry: () => directoryEntry('batch', [fileEntry('hf-1.csv', 'abc'), fileEntry('hf-2.csv', 'de')]) }],
    };
    let prevented = false;
    win.dispatch('drop', { dataTransfer: transfer, preventDefault: () => { prevented = true; } });
    expect(await received).toEqual(['batch/hf-1.csv:3', 'batch/hf-2.csv:2']);
    expect(prevented).toBe(true);
    await new Promise((r) => setTimeout(r, 0));
    expect(await bridge.recentFiles()).toEqual(['batch/hf-1.csv', 'batch/hf-2.csv']);
  });
});
