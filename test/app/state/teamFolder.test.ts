import { describe, expect, it } from 'vitest';
import { rememberedTeamFolder, rememberTeamFolder } from '../../../src-renderer/app/state/teamFolder';

function memoryStorage() {
  const items = new Map<string, string>();
  return { getItem: (k: string) => items.get(k) ?? null, setItem: (k: string, v: string) => void items.set(k, v), removeItem: (k: string) => void items.delete(k) };
}

describe('teamFolder', () => {
  it('should remember the chosen folder on this device and forget it on null', () => {
    const storage = memoryStorage();
    expect(rememberedTeamFolder(storage)).toBeNull();
    rememberTeamFolder('/mnt/team/harrow-flats', storage);
    expect(rememberedTeamFolder(storage)).toBe('/mnt/team/harrow-flats');
    rememberTeamFolder(null, storage);
    expect(rememberedTeamFolder(storage)).toBeNull();
  });

  it('should not throw when storage is unavailable', () => {
    const broken = { getItem: () => { throw new Error('denied'); }, setItem: () => { throw new Error('denied'); }, removeItem: () => { throw new Error('denied'); } };
    expect(rememberedTeamFolder(broken)).toBeNull();
    expect(() => rememberTeamFolder('/x', broken)).not.toThrow();
  });
});
