import type { StressLedgerBridge } from './types';
import { createWebBridge } from './web';

declare global {
  interface Window { stressLedger?: StressLedgerBridge }
}

let webBridge: StressLedgerBridge | null = null;

/** The bridge in force: Electron's preload (window.stressLedger) when present, else the web one. */
export function getBridge(): StressLedgerBridge {
  if (typeof window !== 'undefined' && window.stressLedger) return window.stressLedger;
  webBridge ??= createWebBridge({ document, window });
  return webBridge;
}

export type {
  StressLedgerBridge, PickedFile, MenuCommand, TeamFolderBridge, TeamFolderInfo, TeamFolderNotice, TeamJournalChanges,
  TeamJournalIssue, TeamPushResult, TeamRawRead,
} from './types';
