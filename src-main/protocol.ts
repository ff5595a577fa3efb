import { protocol, session } from 'electron';
import { readFile } from 'node:fs/promises';
import { APP_SCHEME, contentTypeFor, resolveAssetPath } from './app-scheme';
import { CONTENT_SECURITY_POLICY } from './csp';

/** Register the app scheme as privileged; must run before the app is ready. */
export function registerAppScheme(): void {
  protocol.registerSchemesAsPrivileged([{
    scheme: APP_SCHEME,
    privileges: { standard: true, secure: true, supportFetchAPI: true, stream: true, codeCache: true },
  }]);
}

/** Serve the built renderer folder on the app scheme, refusing anything outside it. */
export function handleAppScheme(rendererDirectory: string): void {
  protocol.handle(APP_SCHEME, async (request) => {
    const filePath = resolveAssetPath(rendererDirectory, request.url);
    if (!filePath) return new Response('Not found', { status: 404, headers: { 'content-type': 'text/plain' } });
    try {
      const body = await readFile(filePath);
      return new Response(body, {
        status: 200,
        headers: {
          'content-type': contentTypeFor(filePath),
          'content-security-policy': CONTENT_SECURITY_POLICY,
          'x-content-type-options': 'nosniff',
          'cross-origin-opener-policy': 'same-origin',
        },
      });
    } catch {
      return new Response('Not found', { status: 404, headers: { 'content-type': 'text/plain' } });
    }
  });
}

/** Add the CSP header to every response of the default session (covers the development server too). */
export function enforceContentSecurityPolicy(policy: string): void {
  session.defaultSession.webRequest.onHeadersReceived((details, callback) => {
    callback({ responseHeaders: { ...details.responseHeaders, 'Content-Security-Policy': [policy] } });
  });
}
