import path from 'node:path';

/**
 * The custom scheme the renderer is served from: app://stress-ledger/. Registered as
 * standard and secure so the page gets a real origin (IndexedDB, crypto.subtle and
 * module workers need one). Pure helpers only; the Electron wiring is in protocol.ts.
 */
export const APP_SCHEME = 'app';
export const APP_HOST = 'stress-ledger';
export const APP_ORIGIN = `${APP_SCHEME}://${APP_HOST}`;
export const APP_START_URL = `${APP_ORIGIN}/index.html`;

const CONTENT_TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json; charset=utf-8',
  '.map': 'application/json; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.ico': 'image/x-icon',
  '.woff2': 'font/woff2',
  '.wasm': 'application/wasm',
  '.csv': 'text/csv; charset=utf-8',
  '.txt': 'text/plain; charset=utf-8',
  '.las': 'text/plain; charset=utf-8',
  '.xlsx': 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
};

/** Content type by file extension; unknown types are served as bytes. */
export function contentTypeFor(filePath: string): string {
  return CONTENT_TYPES[path.extname(filePath).toLowerCase()] ?? 'application/octet-stream';
}

/**
 * The file a request URL names inside the renderer folder, or null when the URL is not
 * ours or would leave the folder (".." segments, encoded separators, NUL, absolute or
 * drive paths).
 *
 * @param rootDirectory absolute path of the built renderer folder
 * @param requestUrl the request URL, e.g. "app://stress-ledger/assets/index-3f2a.js"
 * @example resolveAssetPath('/opt/app/renderer', 'app://stress-ledger/') // '/opt/app/renderer/index.html'
 */
export function resolveAssetPath(rootDirectory: string, requestUrl: string): string | null {
  let url: URL;
  try {
    url = new URL(requestUrl);
  } catch {
    return null;
  }
  if (url.protocol !== `${APP_SCHEME}:` || url.host !== APP_HOST) return null;
  const rawPath = url.pathname;
  // Encoded separators or dots would let a request reach outside after decoding.
  if (/%2f|%5c|%00|%2e/i.test(rawPath)) return null;
  let decoded: string;
  try {
    decoded = decodeURIComponent(rawPath);
  } catch {
    return null;
  }
  if (decoded.includes('\0') || decoded.includes('\\')) return null;
  const segments = decoded.split('/').filter((s) => s.length > 0);
  if (segments.some((s) => s === '..' || s === '.' || /^[A-Za-z]:$/.test(s))) return null;
  const relative = segments.length === 0 ? 'index.html' : segments.join('/');
  const root = path.resolve(rootDirectory);
  const resolved = path.resolve(root, relative);
  const inside = path.relative(root, resolved);
  if (!inside || inside.startsWith('..') || path.isAbsolute(inside)) return null;
  return resolved;
}

/** Whether a frame URL belongs to the app (our scheme and host, or the given development origin). */
export function isAppUrl(frameUrl: string | undefined | null, developmentOrigin?: string): boolean {
  if (!frameUrl) return false;
  try {
    const url = new URL(frameUrl);
    if (url.protocol === `${APP_SCHEME}:` && url.host === APP_HOST) return true;
    return developmentOrigin !== undefined && url.origin === new URL(developmentOrigin).origin;
  } catch {
    return false;
  }
}
