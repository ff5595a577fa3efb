/** Screens of the app, kept in the location hash so Back and reload work. */
export type Route =
  | { screen: 'start' }
  | { screen: 'archive' }
  | { screen: 'import' }
  | { screen: 'test'; testId: string }
  | { screen: 'report'; testId?: string; wellName?: string }
  | { screen: 'settings' }
  | { screen: 'model' }
  | { screen: 'team' };

export function routeToHash(route: Route): string {
  if (route.screen === 'test') return `#/test/${encodeURIComponent(route.testId)}`;
  if (route.screen === 'report') {
    return route.testId ? `#/report/test/${encodeURIComponent(route.testId)}` : `#/report/well/${encodeURIComponent(route.wellName ?? '')}`;
  }
  return `#/${route.screen}`;
}

export function routeFromHash(hash: string): Route {
  const parts = hash.replace(/^#\/?/, '').split('/');
  switch (parts[0]) {
    case 'start': return { screen: 'start' };
    case 'import': return { screen: 'import' };
    case 'settings': return { screen: 'settings' };
    case 'model': return { screen: 'model' };
    case 'team': return { screen: 'team' };
    case 'test': return parts[1] ? { screen: 'test', testId: decodeURIComponent(parts[1]) } : { screen: 'archive' };
    case 'report':
      if (parts[1] === 'test' && parts[2]) return { screen: 'report', testId: decodeURIComponent(parts[2]) };
      if (parts[1] === 'well' && parts[2]) return { screen: 'report', wellName: decodeURIComponent(parts[2]) };
      return { screen: 'archive' };
    default: return { screen: 'archive' };
  }
}
