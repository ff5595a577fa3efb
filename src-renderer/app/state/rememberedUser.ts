/** The user chosen at start is remembered on this device (not in the shared archive). */
const KEY = 'stress-ledger.current-user';

export function rememberedUser(storage: Pick<Storage, 'getItem'> | undefined = globalThis.localStorage): string | null {
  try { return storage?.getItem(KEY) || null; } catch { return null; }
}

export function rememberUser(name: string | null, storage: Pick<Storage, 'setItem' | 'removeItem'> | undefined = globalThis.localStorage): void {
  try {
    if (name) storage?.setItem(KEY, name); else storage?.removeItem(KEY);
  } catch { /* storage unavailable: the choice lasts until the window closes */ }
}
