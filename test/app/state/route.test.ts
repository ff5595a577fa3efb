import { describe, expect, it } from 'vitest';
import { routeFromHash, routeToHash, type Route } from '../../../src-renderer/app/state/route';

describe('route', () => {
  it('should round-trip every screen through the location hash', () => {
    const routes: Route[] = [
      { screen: 'start' }, { screen: 'archive' }, { screen: 'import' }, { screen: 'settings' }, { screen: 'model' }, { screen: 'team' },
      { screen: 'test', testId: 'a b/c' }, { screen: 'report', testId: 'x1' }, { screen: 'report', wellName: 'HF-3' },
    ];
    for (const r of routes) expect(routeFromHash(routeToHash(r))).toEqual(r);
  });

  it('should fall back to the archive for an unknown or empty hash', () => {
    expect(routeFromHash('')).toEqual({ screen: 'archive' });
    expect(routeFromHash('#/nowhere')).toEqual({ screen: 'archive' });
    expect(routeFromHash('#/test/')).toEqual({ screen: 'archive' });
  });
});
