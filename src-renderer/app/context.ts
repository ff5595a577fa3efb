import { createContext, useContext } from 'react';
import type { TeamArchiveService } from '../archive/api';
import type { TeamSync } from '../archive/team-sync';
import type { StressLedgerBridge } from '../bridge/types';
import type { UnitSystem } from '../engine/units/unitSystem';
import type { AnalysisClient } from './workers/analysisClient';
import type { Route } from './state/route';

/** Everything a screen needs from the app: services, the current user, units and navigation. */
export interface AppServices {
  /** The archive with team sharing (bundles, conflicts, sync status). */
  archive: TeamArchiveService;
  bridge: StressLedgerBridge;
  engine: AnalysisClient;
  user: string;
  units: UnitSystem;
  setUnits(units: UnitSystem): void;
  navigate(route: Route): void;
  /** Short message in the corner (saved, refused ...). */
  notify(text: string): void;
  /** The team folder sync of the current user (Electron with a chosen folder), or null. */
  teamSync: TeamSync | null;
  /** The chosen team folder (remembered on this device), or null. */
  teamFolder: string | null;
  /** Choose (or forget, with null) the team folder; sync restarts for the current user. */
  setTeamFolder(folder: string | null): void;
}

export const AppContext = createContext<AppServices | null>(null);

export function useApp(): AppServices {
  const ctx = useContext(AppContext);
  if (!ctx) throw new Error('useApp outside the app');
  return ctx;
}
