import { describe, expect, it } from 'vitest';
import { MAXIMUM_FILES, parsePayload, saveFilePayload, suggestedFileName } from '../../src-main/ipc-schemas';
import { CHANNELS } from '../../src-main/channels';

// The shell treats renderer payloads as untrusted input (Electron security checklist,
// "Validate the sender of all IPC messages" and "do not expose more than needed"; common practice
// for any process boundary): every message is checked before use.

describe('ipc-schemas', () => {
  it('should accept a save request with a plain file name, bytes and a MIME type', () => {
    const payload = parsePayload(CHANNELS.saveFile, { suggestedName: 'harrow-flats-gradients.csv', bytes: new Uint8Array([1, 2]), mimeType: 'text/csv' });
    expect(payload.suggestedName).toBe('harrow-flats-gradients.csv');
    expect(saveFilePayload.safeParse({ suggestedName: 'a.xlsx', bytes: new Uint8Array(0), mimeType: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet' }).success).toBe(true);
  });

  it('should refuse file names that name folders, parents or control characters', () => {
    for (const name of ['../evil.csv', 'dir/evil.csv', 'C:\\x.csv', '..', '.', '', 'a\u0000b.csv', 'x'.repeat(256)]) {
      expect(suggestedFileName.safeParse(name).success, name).toBe(false);
    }
  });

  it('should refuse a save request with a string for bytes, a bad MIME type or extra keys', () => {
    expect(() => parsePayload(CHANNELS.saveFile, { suggestedName: 'a.csv', bytes: 'AAEC', mimeType: 'text/csv' })).toThrow(/Refused bridge:save-file: bytes/);
    expect(() => parsePayload(CHANNELS.saveFile, { suggestedName: 'a.csv', bytes: new Uint8Array(1), mimeType: 'csv' })).toThrow(/mimeType/);
    expect(() => parsePayload(CHANNELS.saveFile, { suggestedName: 'a.csv', bytes: new Uint8Array(1), mimeType: 'text/csv', path: '/etc/passwd' })).toThrow();
  });

  it('should accept a print request only for a .pdf name', () => {
    expect(parsePayload(CHANNELS.printReport, { suggestedName: 'HF-3 LOT review.pdf' }).suggestedName).toBe('HF-3 LOT review.pdf');
    expect(() => parsePayload(CHANNELS.printReport, { suggestedName: 'report.html' })).toThrow(/\.pdf/);
  });

  it('should accept absolute dropped paths and refuse relative ones, NUL and too many', () => {
    expect(parsePayload(CHANNELS.readDroppedFiles, { paths: ['/home/ana/hf-1.csv', 'C:\\data\\hf-2.csv', '\\\\server\\share\\hf.las'] }).paths).toHaveLength(3);
    expect(() => parsePayload(CHANNELS.readDroppedFiles, { paths: ['hf-1.csv'] })).toThrow(/absolute path/);
    expect(() => parsePayload(CHANNELS.readDroppedFiles, { paths: ['/a\u0000b'] })).toThrow();
    expect(() => parsePayload(CHANNELS.readDroppedFiles, { paths: [] })).toThrow();
    expect(() => parsePayload(CHANNELS.readDroppedFiles, { paths: Array.from({ length: MAXIMUM_FILES + 1 }, (_, i) => `/f${i}`) })).toThrow();
  });

  it('should accept open options with extensions and refuse anything else', () => {
    expect(parsePayload(CHANNELS.openFiles, undefined)).toBeUndefined();
    expect(parsePayload(CHANNELS.openFiles, { accept: ['.csv', 'xlsx'], multiple: true })).toEqual({ accept: ['.csv', 'xlsx'], multiple: true });
    expect(() => parsePayload(CHANNELS.openFiles, { accept: ['*'] })).toThrow();
    expect(() => parsePayload(CHANNELS.openFiles, { accept: ['.csv'], defaultPath: '/etc' })).toThrow();
    expect(() => parsePayload(CHANNELS.appVersion, { anything: 1 })).toThrow();
    expect(() => parsePayload(CHANNELS.openFolder, 'x')).toThrow();
  });

  it('should accept team folder payloads and refuse relative folders, bad hashes and malformed events', () => {
    const event = {
      id: 'e1', author: 'Ana Petrov', device: 'dev-a', time: '2026-02-01T08:00:00.000Z', clock: 1, prev: '', seq: 1, seen: {},
      body: { kind: 'comment', testId: 't1', text: 'closure looks early' },
    };
    expect(parsePayload(CHANNELS.connectTeamFolder, { folder: '/srv/team/harrow-flats', author: 'Ana Petrov', device: 'dev-a' }).folder).toBe('/srv/team/harrow-flats');
    expect(() => parsePayload(CHANNELS.connectTeamFolder, { folder: 'team', author: 'Ana Petrov', device: 'dev-a' })).toThrow(/absolute path/);
    expect(() => parsePayload(CHANNELS.connectTeamFolder, { folder: '/srv/team', author: ' Ana', device: 'dev-a' })).toThrow(/author/);
    expect(() => parsePayload(CHANNELS.connectTeamFolder, { folder: '/srv/team', author: 'Ana', device: 'dev-a', extra: 1 })).toThrow();
    expect(parsePayload(CHANNELS.pushTeamEvents, { events: [event] }).events).toHaveLength(1);
    expect(() => parsePayload(CHANNELS.pushTeamEvents, { events: [{ ...event, body: { kind: 'comment', testId: 't1' } }] })).toThrow(/events\.0: not a review-log event \(body\.text/);
    expect(() => parsePayload(CHANNELS.pushTeamEvents, { events: [{ ...event, clock: -1 }] })).toThrow(/clock/);
    // SHA-256 names are 64 lower-case hex digits (FIPS 180-4 digests are 256 bits).
    const hash = 'ab'.repeat(32);
    expect(parsePayload(CHANNELS.writeTeamRaw, { hash, bytes: new Uint8Array(3) }).hash).toBe(hash);
    expect(() => parsePayload(CHANNELS.readTeamRaw, { hash: '../../etc/passwd' })).toThrow(/SHA-256/);
    expect(() => parsePayload(CHANNELS.readTeamRaw, { hash: hash.toUpperCase() })).toThrow(/SHA-256/);
    expect(() => parsePayload(CHANNELS.writeTeamRaw, { hash, bytes: 'AAEC' })).toThrow(/bytes/);
    expect(parsePayload(CHANNELS.readTeamChanges, undefined)).toBeUndefined();
    expect(() => parsePayload(CHANNELS.teamFolderStatus, { folder: '/' })).toThrow();
  });
});
