/**
 * Opening the app's services: the archive (with the analysis worker as its engine)
 * and the bridge to the system. The one place the app wires the layers together.
 */
import { Archive } from '../archive/archive';
import type { TeamArchiveService } from '../archive/api';
import { seedDemoArchive } from '../archive/demo';
import { getBridge } from '../bridge';
import type { StressLedgerBridge } from '../bridge/types';
import { AnalysisClient } from './workers/analysisClient';

export interface OpenedServices {
  archive: TeamArchiveService;
  bridge: StressLedgerBridge;
  engine: AnalysisClient;
  /** True when the archive was empty and the demo archive was written. */
  seeded: boolean;
}

let opening: Promise<OpenedServices> | null = null;

/** Opens the services once per page (later calls share the first call's promise). */
export function openServices(onSeedProgress?: (text: string) => void): Promise<OpenedServices> {
  opening ??= openServicesOnce(onSeedProgress);
  return opening;
}

async function openServicesOnce(onSeedProgress?: (text: string) => void): Promise<OpenedServices> {
  const engine = new AnalysisClient();
  const archive = await Archive.open({ engine });
  const bridge = getBridge();
  let seeded = false;
  if (await archive.isEmpty()) {
    onSeedProgress?.('Writing the demo archive of the Harrow Flats field…');
    await seedDemoArchive(archive, { onProgress: onSeedProgress });
    seeded = true;
  }
  // Start the analysis worker once the window is idle, so the first test opened does not wait for it to load.
  const whenIdle = (globalThis as { requestIdleCallback?: (work: () => void, options: { timeout: number }) => number }).requestIdleCallback;
  if (whenIdle) whenIdle(() => engine.warmUp(), { timeout: 3000 }); else setTimeout(() => engine.warmUp(), 1000);
  return { archive, bridge, engine, seeded };
}
