import { describe, expect, it } from 'vitest';
import { openTestArchive } from './support/open';
import { simpleFile } from './support/engine';
import { DEMO_IMPORTER, DEMO_REVIEWER, demoAuthoring, loadBundledDemoFiles, parseDemoManifest, seedDemoArchive } from '../../src-renderer/archive/demo';
import { tableCounts } from './support/open';

// Demo archive plan (product choice): every review state shows, acceptance always by a
// second engineer (four eyes), the rejection carries a reason. Files are synthetic.

describe('demo archive', () => {
  it('should import the files and show every review state with four eyes kept', async () => {
    const { archive } = await openTestArchive();
    const files = Array.from({ length: 8 }, (_, i) => simpleFile(`hf-${i + 1}.csv`, `HF-${i + 1}`, { peak: (20 + i) * 1e6, tvd: 1000 + 100 * i, samples: i === 5 ? 2 : 6 }));
    const report = await seedDemoArchive(archive, { loadFiles: async () => ({ files, manifest: null }) });
    expect(report.outcomes.every((o) => o.status === 'imported')).toBe(true);
    const counts = await archive.countByState();
    expect(counts.total).toBe(8);
    expect(counts.accepted).toBeGreaterThanOrEqual(2);
    expect(counts.rejected).toBe(1);
    expect(counts['in-review']).toBeGreaterThanOrEqual(1);
    expect(counts.imported).toBeGreaterThanOrEqual(1);
    // The lowest grade (the two-sample record) is the rejected one, with its reason in the log.
    const [rejected] = await archive.listTests({ state: 'rejected' });
    expect(rejected.wellName).toBe('HF-6');
    const log = await archive.eventsForTest(rejected.id);
    expect(log.at(-1)!.body).toMatchObject({ kind: 'rejected' });
    for (const accepted of await archive.listTests({ state: 'accepted' })) {
      expect(accepted.importedBy).toBe(DEMO_IMPORTER);
      expect(accepted.reviewer).toBe(DEMO_REVIEWER);
    }
  });

  it('should follow review states the manifest gives', async () => {
    const { archive } = await openTestArchive();
    const files = [simpleFile('a.csv', 'HF-1'), simpleFile('b.csv', 'HF-2', { peak: 2e7 })];
    const manifest = parseDemoManifest({ files: [{ file: 'a.csv', review: 'accepted' }, { file: 'b.csv', state: 'rejected', reason: 'pump stopped mid-test' }] });
    await seedDemoArchive(archive, { loadFiles: async () => ({ files, manifest }) });
    expect((await archive.listTests({ state: 'accepted' })).map((t) => t.wellName)).toEqual(['HF-1']);
    const [rejected] = await archive.listTests({ state: 'rejected' });
    expect((await archive.eventsForTest(rejected.id)).at(-1)!.body).toMatchObject({ reason: 'pump stopped mid-test' });
  });

  it('should read manifests as a list or an object, with strings or entries', () => {
    expect(parseDemoManifest(['x.csv'])).toEqual([{ file: 'x.csv' }]);
    expect(parseDemoManifest({ tests: [{ name: 'y.csv', review: 'in-review' }, { nothing: 1 }] })).toEqual([{ file: 'y.csv', review: 'in-review' }]);
    expect(parseDemoManifest({ other: 1 })).toBeNull();
  });

  it('should fetch bundled assets in manifest order, skipping what is not a test file', async () => {
    const contents: Record<string, string> = {
      'u:manifest': JSON.stringify({ files: [{ file: 'b.csv' }, { file: 'a.csv' }, { file: 'README.md' }] }),
      'u:a': 'A', 'u:b': 'BB', 'u:readme': '#',
    };
    const originalFetch = globalThis.fetch;
    globalThis.fetch = (async (url: string) => new Response(contents[url])) as typeof fetch;
    try {
      const { files } = await loadBundledDemoFiles({ '../../demo/manifest.json': 'u:manifest', '../../demo/a.csv': 'u:a', '../../demo/b.csv': 'u:b', '../../demo/README.md': 'u:readme' });
      expect(files.map((f) => `${f.name}:${f.bytes.length}`)).toEqual(['b.csv:2', 'a.csv:1']);
    } finally {
      globalThis.fetch = originalFetch;
    }
  });

  it('should seed the same demo events on two fresh machines, so exchanging bundles adds no duplicate tests', async () => {
    const files = () => Array.from({ length: 6 }, (_, i) => simpleFile(`hf-${i + 1}.csv`, `HF-${i + 1}`, { peak: (21 + i) * 1e6, samples: i === 2 ? 2 : 6 }));
    const first = await openTestArchive();
    const second = await openTestArchive();
    expect(first.archive.deviceId()).not.toBe(second.archive.deviceId());
    await seedDemoArchive(first.archive, { loadFiles: async () => ({ files: files(), manifest: null }) });
    await seedDemoArchive(second.archive, { loadFiles: async () => ({ files: files(), manifest: null }) });
    const events = await first.archive.listEvents();
    expect(await second.archive.listEvents()).toEqual(events);
    // Identity from the files' hashes, not from the installation or the clock.
    const authoring = demoAuthoring(files());
    expect(events.every((e) => e.device === authoring.device && e.id === `${e.author}@${e.device}#${e.seq}`)).toBe(true);
    expect(events[0].time >= authoring.startTime).toBe(true);
    expect(demoAuthoring(files().slice(1)).device).not.toBe(authoring.device);
    const before = await tableCounts(first.archive);
    const outcome = await first.archive.importBundle(await second.archive.exportBundle(DEMO_REVIEWER), 'demo.slbundle');
    expect(outcome).toMatchObject({ added: 0, conflicts: [], findings: [] });
    expect((await tableCounts(first.archive)).tests).toBe(before.tests);
    expect((await first.archive.listTests()).map((t) => t.id).sort()).toEqual((await second.archive.listTests()).map((t) => t.id).sort());
    // The demo sign-offs hold when the log is derived anew (four eyes, picks version).
    expect((await first.archive.countByState()).accepted).toBeGreaterThanOrEqual(1);
    expect(await first.archive.conflicts()).toEqual([]);
    expect(await first.archive.findings()).toEqual([]);
  });

  it('should seed with this device when the archive already holds events', async () => {
    const { archive } = await openTestArchive();
    await archive.setLimits({ minimumSamples: 3 }, 'Ana Petrov', 'field standard');
    await seedDemoArchive(archive, { loadFiles: async () => ({ files: [simpleFile('a.csv', 'HF-1')], manifest: null }) });
    expect((await archive.listEvents()).every((e) => e.device === archive.deviceId())).toBe(true);
  });
});
