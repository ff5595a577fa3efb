import { describe, expect, it } from 'vitest';
import { isEngineError, type EngineError } from '../../../src-renderer/engine/errors';
import { BUNDLE_MAGIC, exportBundle, importBundle, journalTextsFromEvents } from '../../../src-renderer/archive/journal/bundle';
import { deriveArchiveState } from '../../../src-renderer/archive/journal/derive';
import { mergeEventSets } from '../../../src-renderer/archive/journal/merge';
import { sha256Hex } from '../../../src-renderer/archive/journal/sha256';
import { movePick, setUpField, Team } from './team-fixture';

// Synthetic two-person history; the raw file is an invented Cobalt Ridge CSV.

function twoPeople() {
  const team = new Team();
  const anna = team.person('Anna', 'laptop-7');
  const ben = team.person('Ben', 'desk-2');
  setUpField(anna);
  movePick(anna, 't1', 1, 'closure', 31.0e6);
  ben.receiveFrom(anna);
  ben.signOff('t1');
  const csv = new TextEncoder().encode('time_s;pressure_kPa;rate_m3min\n0;101,3;0\n1;850,0;0,25\n');
  return { team, anna, ben, raw: [{ hash: sha256Hex(csv), bytes: csv }] };
}

function refusal(bytes: Uint8Array): EngineError {
  try {
    importBundle(bytes, 'harrow.slbundle');
  } catch (e) {
    if (isEngineError(e)) return e;
    throw e;
  }
  throw new Error('the bundle was accepted');
}

function repack(payload: unknown): Uint8Array {
  const body = new TextEncoder().encode(JSON.stringify(payload));
  const header = new TextEncoder().encode(`${BUNDLE_MAGIC} sha256=${sha256Hex(body)} bytes=${body.length}\n`);
  const out = new Uint8Array(header.length + body.length);
  out.set(header);
  out.set(body, header.length);
  return out;
}

function payloadOf(bytes: Uint8Array): Record<string, unknown> {
  const text = new TextDecoder().decode(bytes);
  return JSON.parse(text.slice(text.indexOf('\n') + 1));
}

describe('team bundle', () => {
  it('should round-trip journals and raw files, and merge on the other machine to the same archive', () => {
    const { team, raw } = twoPeople();
    const bundle = exportBundle({ journals: journalTextsFromEvents(team.all), raw, createdBy: 'Ben', createdAt: '2026-11-02T09:00:00.000Z' });
    const imported = importBundle(bundle, 'harrow.slbundle');
    expect(imported.read.issues).toEqual([]);
    expect(imported.raw).toEqual(raw);
    expect(imported.createdBy).toBe('Ben');
    expect(imported.notice).toContain('qualified engineer');
    // Carl had nothing; after merging the bundle his archive equals the senders'.
    const carl = mergeEventSets([], imported.read.events);
    expect(deriveArchiveState(carl.events)).toEqual(deriveArchiveState(team.all));
    expect(deriveArchiveState(carl.events).tests.t1.state).toBe('accepted');
    // Importing it twice adds nothing.
    expect(mergeEventSets(carl.events, importBundle(bundle, 'again.slbundle').read.events).added).toEqual([]);
  });

  it('should refuse a bundle with a flipped byte, naming the checksum', () => {
    const { team, raw } = twoPeople();
    const bundle = exportBundle({ journals: journalTextsFromEvents(team.all), raw, createdBy: 'Ben', createdAt: '2026-11-02T09:00:00.000Z' });
    const damaged = bundle.slice();
    damaged[damaged.length - 40] ^= 0x01;
    const e = refusal(damaged);
    expect(e.code).toBe('bad-bundle');
    expect(e.message).toContain('checksum does not match');
    expect(e.location.file).toBe('harrow.slbundle');
  });

  it('should refuse a cut-short bundle, a foreign file and a damaged header', () => {
    const { team, raw } = twoPeople();
    const bundle = exportBundle({ journals: journalTextsFromEvents(team.all), raw, createdBy: 'Ben', createdAt: '2026-11-02T09:00:00.000Z' });
    expect(refusal(bundle.subarray(0, bundle.length - 100)).message).toContain('cut short');
    expect(refusal(new TextEncoder().encode('time,pressure\n0,1\n')).message).toContain('not a Stress Ledger team bundle');
    const header = new TextDecoder().decode(bundle.subarray(0, 120)).split('\n')[0];
    const broken = new TextEncoder().encode(header.replace('sha256=', 'sha265=') + '\n{}');
    expect(refusal(broken).message).toContain('header line is damaged');
    expect(refusal(new TextEncoder().encode('STRESS-LEDGER-TEAM-BUNDLE/7 sha256=00 bytes=2\n{}')).message).toContain('newer');
  });

  it('should refuse a bundle whose raw file does not match its hash, even with a valid checksum', () => {
    const { team, raw } = twoPeople();
    const payload = payloadOf(exportBundle({ journals: journalTextsFromEvents(team.all), raw, createdBy: 'Ben', createdAt: '2026-11-02T09:00:00.000Z' }));
    const rawList = payload.raw as { hash: string; size: number; base64: string }[];
    rawList[0].base64 = Buffer.from('x'.repeat(rawList[0].size)).toString('base64');
    const e = refusal(repack(payload));
    expect(e.message).toContain(`raw file ${raw[0].hash} does not match its hash`);
  });

  it('should import a bundle whose journal was edited, reporting the broken chain', () => {
    const { team, raw } = twoPeople();
    const payload = payloadOf(exportBundle({ journals: journalTextsFromEvents(team.all), raw, createdBy: 'Ben', createdAt: '2026-11-02T09:00:00.000Z' }));
    const journals = payload.journals as { file: string; text: string }[];
    const anna = journals.find((j) => j.file.startsWith('Anna'))!;
    anna.text = anna.text.replace('Harrow Flats 3', 'Harrow Flats 4');
    const imported = importBundle(repack(payload), 'edited.slbundle');
    expect(imported.read.issues.map((i) => i.kind)).toContain('chain-broken');
    expect(imported.read.events).toHaveLength(team.all.length);
  });

  it('should refuse to export a raw file whose bytes do not match its hash', () => {
    const { team, raw } = twoPeople();
    expect(() => exportBundle({ journals: journalTextsFromEvents(team.all), raw: [{ hash: raw[0].hash, bytes: new Uint8Array([1, 2, 3]) }], createdBy: 'Ben', createdAt: '' }))
      .toThrow('does not match its hash');
  });
});
