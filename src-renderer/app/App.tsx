import { useCallback, useEffect, useMemo, useState } from 'react';
import type { UnitSystem } from '../engine/units/unitSystem';
import { AppContext, type AppServices } from './context';
import { openServices, type OpenedServices } from './services';
import { routeFromHash, routeToHash, type Route } from './state/route';
import { rememberedUser, rememberUser } from './state/rememberedUser';
import { setPendingCommand } from './state/pendingCommand';
import { rememberedTeamFolder, rememberTeamFolder } from './state/teamFolder';
import { TeamSync } from '../archive/team-sync';
import { TeamScreen } from './screens/team/TeamScreen';
import { StartScreen } from './screens/StartScreen';
import { ArchiveScreen } from './screens/ArchiveScreen';
import { ImportScreen } from './screens/ImportScreen';
import { TestScreen } from './screens/test/TestScreen';
import { SettingsScreen } from './screens/SettingsScreen';
import { ConnectedStressModelScreen } from './screens/model/ConnectedStressModelScreen';
import { ConnectedReportScreen } from './screens/report/ConnectedReportScreen';

const NAV: { screen: Route['screen']; label: string; icon: string; testId: string }[] = [
  { screen: 'archive', label: 'Archive', icon: '▤', testId: 'nav-archive' },
  { screen: 'import', label: 'Import', icon: '⇪', testId: 'nav-import' },
  { screen: 'model', label: 'Stress model', icon: '⟂', testId: 'nav-model' },
  { screen: 'team', label: 'Team', icon: '⇄', testId: 'nav-team' },
  { screen: 'settings', label: 'Settings', icon: '⚙', testId: 'nav-settings' },
];

export function App() {
  const [services, setServices] = useState<OpenedServices | null>(null);
  const [loadError, setLoadError] = useState<string | null>(null);
  const [loadText, setLoadText] = useState('Opening the archive…');
  const [user, setUser] = useState<string | null>(() => rememberedUser());
  const [units, setUnitsState] = useState<UnitSystem>('si');
  const [route, setRoute] = useState<Route>(() => routeFromHash(window.location.hash));
  const [toast, setToast] = useState<string | null>(null);
  const [teamFolder, setTeamFolderState] = useState<string | null>(() => rememberedTeamFolder());
  const [teamSync, setTeamSync] = useState<TeamSync | null>(null);

  useEffect(() => {
    let alive = true;
    openServices(setLoadText)
      .then(async (s) => {
        const settings = await s.archive.getSettings();
        if (!alive) return;
        setUnitsState(settings.unitSystem);
        setServices(s);
      })
      .catch((e: unknown) => {
        console.error('Opening the archive failed', e);
        if (alive) setLoadError(e instanceof Error ? e.message : String(e));
      });
    return () => { alive = false; };
  }, []);

  useEffect(() => {
    const onHash = () => setRoute(routeFromHash(window.location.hash));
    window.addEventListener('hashchange', onHash);
    return () => window.removeEventListener('hashchange', onHash);
  }, []);

  useEffect(() => {
    if (!toast) return;
    const t = setTimeout(() => setToast(null), 4000);
    return () => clearTimeout(t);
  }, [toast]);

  const navigate = useCallback((r: Route) => {
    const hash = routeToHash(r);
    if (window.location.hash !== hash) window.location.hash = hash;
    setRoute(r);
  }, []);

  // Menu commands that belong to another screen open it first (the screen then runs them).
  useEffect(() => {
    if (!services || !user) return;
    return services.bridge.onMenuCommand((c) => {
      if ((c === 'open-files' || c === 'open-folder') && route.screen !== 'import') { setPendingCommand(c); navigate({ screen: 'import' }); }
      if (c === 'find' && route.screen !== 'archive') { setPendingCommand(c); navigate({ screen: 'archive' }); }
    });
  }, [services, user, route.screen, navigate]);

  // One team folder sync per user: started when a folder is chosen (Electron only),
  // stopped and started again for the new user when the user changes.
  useEffect(() => {
    const folderBridge = services?.bridge.teamFolder;
    if (!services || !user || !teamFolder || !folderBridge) return;
    const sync = new TeamSync(services.archive, folderBridge, { folder: teamFolder, author: user });
    setTeamSync(sync);
    void sync.start();
    return () => { sync.stop(); setTeamSync(null); };
  }, [services, user, teamFolder]);

  const setTeamFolder = useCallback((folder: string | null) => {
    rememberTeamFolder(folder);
    setTeamFolderState(folder);
  }, []);

  const setUnits = useCallback((u: UnitSystem) => {
    setUnitsState(u);
    void services?.archive.setUnitSystem(u).then(
      () => setToast(`Showing ${u === 'si' ? 'SI' : 'oilfield'} units; the choice is kept.`),
      (e: unknown) => setToast(`The unit choice could not be kept: ${e instanceof Error ? e.message : String(e)}`),
    );
  }, [services]);

  const value = useMemo<AppServices | null>(() => (services && user ? {
    archive: services.archive, bridge: services.bridge, engine: services.engine, user, units, setUnits, navigate, notify: setToast,
    teamSync, teamFolder, setTeamFolder,
  } : null), [services, user, units, setUnits, navigate, teamSync, teamFolder, setTeamFolder]);

  if (loadError) {
    return <div className="start"><div className="card" role="alert"><h1>The archive could not be opened</h1><p>{loadError}</p></div></div>;
  }
  if (!services) {
    return <div className="start"><div className="card" aria-busy="true" data-testid="loading"><h1>Stress Ledger</h1><p className="hint">{loadText}</p></div></div>;
  }
  if (!user || route.screen === 'start' || !value) {
    return (
      <StartScreen archive={services.archive} current={user}
        onChoose={(name) => { rememberUser(name); setUser(name); navigate({ screen: 'archive' }); }} />
    );
  }

  const active = route.screen === 'test' || route.screen === 'report' ? 'archive' : route.screen;
  return (
    <AppContext.Provider value={value}>
      <div className="shell">
        <nav className="sidebar" aria-label="Main">
          <div className="brand">Stress Ledger<small>Pressure-test archive and review</small></div>
          {NAV.map((n) => (
            <button key={n.screen} type="button" className="nav-item" data-testid={n.testId}
              aria-current={active === n.screen ? 'page' : undefined} onClick={() => navigate({ screen: n.screen } as Route)}>
              <span className="nav-icon" aria-hidden="true">{n.icon}</span>{n.label}
            </button>
          ))}
          <div className="sidebar-foot">
            <div className="hint" style={{ color: '#aeb9c8' }}>Signed in as</div>
            <div className="who" data-testid="current-user">{user}</div>
            <button type="button" data-testid="change-user" onClick={() => navigate({ screen: 'start' })}>Change user</button>
          </div>
        </nav>
        <main className="main">
          {route.screen === 'archive' && <ArchiveScreen />}
          {route.screen === 'import' && <ImportScreen />}
          {route.screen === 'test' && <TestScreen key={route.testId} testId={route.testId} />}
          {route.screen === 'settings' && <SettingsScreen />}
          {route.screen === 'model' && <ConnectedStressModelScreen />}
          {route.screen === 'team' && <TeamScreen />}
          {route.screen === 'report' && <ConnectedReportScreen key={route.testId ?? route.wellName} testId={route.testId} wellName={route.wellName} />}
        </main>
      </div>
      {toast && <div className="toast" role="status" data-testid="toast">{toast}</div>}
    </AppContext.Provider>
  );
}
