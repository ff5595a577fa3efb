import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { AppContext, type AppServices } from '../../../../src-renderer/app/context';
import { TeamScreen } from '../../../../src-renderer/app/screens/team/TeamScreen';
import type { StressLedgerBridge, TeamFolderBridge } from '../../../../src-renderer/bridge/types';

// The first render of the Team screen, before the archive answers (effects do not run in a
// static render): what each build offers. The archive is never called here.
function render(bridge: Partial<StressLedgerBridge>, teamFolder: string | null = null): string {
  const services = {
    archive: {} as AppServices['archive'], bridge: { platform: 'web', ...bridge } as StressLedgerBridge, engine: {} as AppServices['engine'],
    user: 'Ada Brennan', units: 'si', setUnits: () => undefined, navigate: () => undefined, notify: () => undefined,
    teamSync: null, teamFolder, setTeamFolder: () => undefined,
  } satisfies AppServices;
  return renderToStaticMarkup(<AppContext.Provider value={services}><TeamScreen /></AppContext.Provider>);
}

describe('TeamScreen', () => {
  it('should offer bundles and say that bundles are the way in the browser', () => {
    const html = render({});
    expect(html).toContain('data-testid="bundle-export"');
    expect(html).toContain('data-testid="bundle-import"');
    expect(html).toContain('data-testid="team-folder-web"');
    expect(html).not.toContain('data-testid="team-folder-choose"');
    expect(html).toContain('data-testid="sync-status"');
    expect(html).toContain('qualified engineer');
  });

  it('should offer choosing the team folder where the bridge has one (desktop app)', () => {
    const html = render({ platform: 'electron', teamFolder: {} as TeamFolderBridge }, '/mnt/team');
    expect(html).toContain('data-testid="team-folder-choose"');
    expect(html).toContain('data-testid="team-sync-now"');
    expect(html).toContain('/mnt/team');
    expect(html).not.toContain('data-testid="team-folder-web"');
  });
});
