import { describe, expect, it } from 'vitest';
import path from 'node:path';
import { APP_START_URL, contentTypeFor, isAppUrl, resolveAssetPath } from '../../src-main/app-scheme';

// Path traversal cases follow OWASP's "Path Traversal" attack patterns (../, encoded ..%2f,
// backslashes, NUL bytes, absolute and drive paths).

const root = path.resolve('/opt/stress-ledger/renderer');

describe('app-scheme', () => {
  it('should map app URLs to files inside the renderer folder', () => {
    expect(resolveAssetPath(root, 'app://stress-ledger/')).toBe(path.join(root, 'index.html'));
    expect(resolveAssetPath(root, APP_START_URL)).toBe(path.join(root, 'index.html'));
    expect(resolveAssetPath(root, 'app://stress-ledger/assets/index-3f2a.js?v=1#x')).toBe(path.join(root, 'assets/index-3f2a.js'));
    expect(resolveAssetPath(root, 'app://stress-ledger/assets/demo%20file.csv')).toBe(path.join(root, 'assets/demo file.csv'));
  });

  it('should refuse every way out of the folder', () => {
    const attempts = [
      'app://stress-ledger/../../etc/passwd',
      'app://stress-ledger/assets/%2e%2e/%2e%2e/etc/passwd',
      'app://stress-ledger/..%2f..%2fetc/passwd',
      'app://stress-ledger/assets/..%5c..%5cwindows',
      'app://stress-ledger/a%00.js',
      'app://stress-ledger/C:/Windows/win.ini',
      'app://stress-ledger/%E0%A4%A',
      'app://stress-ledger//etc/passwd/..',
    ];
    for (const url of attempts) {
      const resolved = resolveAssetPath(root, url);
      if (resolved !== null) expect(resolved.startsWith(root + path.sep), url).toBe(true);
    }
    // These must be refused outright, not just kept inside.
    // WHATWG URL parsing (url.spec.whatwg.org, "double-dot URL path segment") resolves %2e%2e
    // segments before the handler sees the path, clamping at the root: it stays inside.
    expect(resolveAssetPath(root, 'app://stress-ledger/assets/%2e%2e/%2e%2e/etc/passwd')).toBe(path.join(root, 'etc/passwd'));
    expect(resolveAssetPath(root, 'app://stress-ledger/..%2f..%2fetc/passwd')).toBeNull();
    expect(resolveAssetPath(root, 'app://stress-ledger/a%00.js')).toBeNull();
    expect(resolveAssetPath(root, 'app://stress-ledger/C:/Windows/win.ini')).toBeNull();
    expect(resolveAssetPath(root, 'app://stress-ledger/%E0%A4%A')).toBeNull();
  });

  it('should refuse other schemes and hosts', () => {
    expect(resolveAssetPath(root, 'file:///etc/passwd')).toBeNull();
    expect(resolveAssetPath(root, 'app://other-host/index.html')).toBeNull();
    expect(resolveAssetPath(root, 'not a url')).toBeNull();
  });

  it('should recognise the app page as an IPC sender and nothing else', () => {
    expect(isAppUrl('app://stress-ledger/index.html#/archive')).toBe(true);
    expect(isAppUrl('https://stress-ledger/index.html')).toBe(false);
    expect(isAppUrl('app://evil/index.html')).toBe(false);
    expect(isAppUrl('file:///opt/stress-ledger/renderer/index.html')).toBe(false);
    expect(isAppUrl(undefined)).toBe(false);
    expect(isAppUrl('http://localhost:5173/', 'http://localhost:5173')).toBe(true);
    expect(isAppUrl('http://localhost:5174/', 'http://localhost:5173')).toBe(false);
  });

  it('should name content types by extension', () => {
    expect(contentTypeFor('a/index.html')).toMatch(/^text\/html/);
    expect(contentTypeFor('a/x.js')).toMatch(/^text\/javascript/);
    expect(contentTypeFor('a/x.unknown')).toBe('application/octet-stream');
  });
});
