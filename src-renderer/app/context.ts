import { createContext, useContext } from 'react';
import type { ArchiveService } from '../archive/api';
import type { StressLedgerBridge } from '../bridge/types';
import type { UnitSystem } from '../engine/units/unitSystem';
import type { AnalysisClient } from './workers/analysisClient';
import type { Route } from './state/route';

/** Everything a screen needs from the app: services, the current user, units and navigation. */
export interface AppServices {
  archive: ArchiveService;
  bridge: StressLedgerBridge;
  engine: AnalysisClient;
  user: string;
  units: UnitSystem;
  setUnits(units: UnitSystem): void;
  navigate(route: Route): void;
  /** Short message in the corner (saved, refused ...). */
  notify(text: string): void;
}

export const AppContext = createContext<AppServices | null>(null);

export function useApp(): AppServices {
  const ctx = useContext(AppContext);
  if (!ctx) throw new Error('useApp outside the app');
  return ctx;
}
