/** The team folder chosen on this device is remembered locally (not in the shared archive). */
const KEY = 'stress-ledger.team-folder';

export function rememberedTeamFolder(storage: Pick<Storage, 'getItem'> | undefined = globalThis.localStorage): string | null {
  try { return storage?.getItem(KEY) || null; } catch { return null; }
}

export function rememberTeamFolder(folder: string | null, storage: Pick<Storage, 'setItem' | 'removeItem'> | undefined = globalThis.localStorage): void {
  try {
    if (folder) storage?.setItem(KEY, folder); else storage?.removeItem(KEY);
  } catch { /* storage unavailable: the folder must be chosen again next time */ }
}
