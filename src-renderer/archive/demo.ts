/// <reference types="vite/client" />
import type { ArchiveService, ImportFileInput, ImportOutcome } from './api';
import { sha256Hex, sha256OfText } from './journal/sha256';

/**
 * The demo archive written on first run: the committed demo files of the invented Harrow
 * Flats field (tests by Cobalt Ridge Test Services), imported by one engineer, with a few
 * reviewed by a second one so every review state shows: some accepted, one rejected with a
 * reason, some in review, the rest just imported.
 *
 * The files are bundled as assets (import.meta.glob of ?url) and fetched, so the same code
 * works in the Electron build (app:// scheme) and the web build.
 *
 * The seed is deterministic: on an archive without events it runs with fixed authoring
 * (Archive.withFixedAuthoring): a device id, event ids, test ids and times derived from
 * the demo files' SHA-256 hashes. Two fresh machines therefore write the same demo events,
 * and exchanging team bundles between them adds no duplicate demo tests.
 */

export const DEMO_IMPORTER = 'Maren Holt';
export const DEMO_REVIEWER = 'Idris Calloway';

/** Asset URLs of the demo folder, by path relative to the repository (e.g. "../../demo/hf-1-lot.csv"). */
const DEMO_ASSETS = import.meta.glob('../../demo/**/*', { query: '?url', import: 'default', eager: true }) as Record<string, string>;

export interface DemoManifestEntry {
  file: string;
  /** Review state the demo should show for this file, when the manifest says. */
  review?: 'imported' | 'in-review' | 'accepted' | 'rejected';
  reason?: string;
}

export interface SeedOptions {
  /** Files to import (default: the bundled demo assets, fetched). */
  loadFiles?: () => Promise<{ files: ImportFileInput[]; manifest: DemoManifestEntry[] | null }>;
  onProgress?: (text: string) => void;
}

export interface SeedReport {
  outcomes: ImportOutcome[];
  accepted: string[];
  rejected: string[];
  inReview: string[];
}

/** Read a demo manifest's entries in any of the shapes {files:[...]} or [...], entries as strings or {file|name|path}. */
export function parseDemoManifest(value: unknown): DemoManifestEntry[] | null {
  const list = Array.isArray(value) ? value : value && typeof value === 'object' ? ((value as Record<string, unknown>).files ?? (value as Record<string, unknown>).tests) : null;
  if (!Array.isArray(list)) return null;
  const entries: DemoManifestEntry[] = [];
  for (const item of list) {
    if (typeof item === 'string') { entries.push({ file: item }); continue; }
    if (!item || typeof item !== 'object') continue;
    const record = item as Record<string, unknown>;
    const file = [record.file, record.name, record.path, record.fileName].find((v): v is string => typeof v === 'string');
    if (!file) continue;
    const review = typeof record.review === 'string' ? record.review : typeof record.state === 'string' ? record.state : undefined;
    entries.push({
      file,
      ...(review && ['imported', 'in-review', 'accepted', 'rejected'].includes(review) ? { review: review as DemoManifestEntry['review'] } : {}),
      ...(typeof record.reason === 'string' ? { reason: record.reason } : {}),
    });
  }
  return entries;
}

/** The bundled demo files, fetched from their asset URLs (manifest order when there is one). */
export async function loadBundledDemoFiles(assets: Record<string, string> = DEMO_ASSETS): Promise<{ files: ImportFileInput[]; manifest: DemoManifestEntry[] | null }> {
  const byName = new Map<string, string>();
  for (const [key, url] of Object.entries(assets)) byName.set(key.replace(/^.*?demo\//, ''), url);
  let manifest: DemoManifestEntry[] | null = null;
  const manifestUrl = byName.get('manifest.json');
  if (manifestUrl) manifest = parseDemoManifest(await (await fetch(manifestUrl)).json());
  const importable = (name: string) => /\.(csv|tsv|txt|dat|xlsx|las)$/i.test(name) && !/readme/i.test(name);
  const names = manifest ? manifest.map((e) => e.file).filter((n) => byName.has(n)) : [...byName.keys()].filter(importable).sort();
  const files: ImportFileInput[] = [];
  for (const name of names) {
    if (!importable(name)) continue;
    const response = await fetch(byName.get(name)!);
    if (!response.ok) throw new Error(`The demo file ${name} could not be loaded (${response.status}).`);
    files.push({ name: name.split('/').pop()!, relativePath: name, bytes: new Uint8Array(await response.arrayBuffer()) });
  }
  return { files, manifest };
}

/**
 * Import the demo files and review a few. Review plan, unless the manifest sets states:
 * of the imported tests in file-name order, the lowest-graded one is rejected, its reason
 * taken from the first criterion it fails; of the rest, every third one is accepted
 * (imported by DEMO_IMPORTER, signed off by DEMO_REVIEWER), the next one left in review
 * with a comment, the next left as imported.
 */
export async function seedDemoArchive(archive: ArchiveService, options: SeedOptions = {}): Promise<SeedReport> {
  const { files, manifest } = await (options.loadFiles ?? (() => loadBundledDemoFiles()))();
  const fixed = archive as ArchiveService & Partial<FixedAuthoringArchive>;
  if (typeof fixed.withFixedAuthoring === 'function' && (await archive.listEvents()).length === 0) {
    return fixed.withFixedAuthoring(demoAuthoring(files), () => seedFiles(archive, files, manifest, options));
  }
  return seedFiles(archive, files, manifest, options);
}

/** An archive that can author events with a fixed identity (Archive in archive/archive.ts). */
export interface FixedAuthoringArchive {
  withFixedAuthoring<T>(authoring: { device: string; startTime: string }, work: () => Promise<T>): Promise<T>;
}

/** Earliest demo time; the seed starts within 90 days after it. */
const DEMO_EPOCH = Date.UTC(2026, 0, 5, 7, 0, 0);

/**
 * The demo seed's device id and start time, from the SHA-256 of the demo files: the same
 * files give the same identity on every machine.
 * @example demoAuthoring(files) // { device: 'demo-3f2a…', startTime: '2026-02-11T…Z' }
 */
export function demoAuthoring(files: readonly ImportFileInput[]): { device: string; startTime: string } {
  const digest = sha256OfText(files.map((f) => sha256Hex(f.bytes)).sort().join('\n'));
  const minutes = parseInt(digest.slice(16, 24), 16) % (90 * 24 * 60);
  return { device: `demo-${digest.slice(0, 16)}`, startTime: new Date(DEMO_EPOCH + minutes * 60_000).toISOString() };
}

async function seedFiles(archive: ArchiveService, files: ImportFileInput[], manifest: DemoManifestEntry[] | null, options: SeedOptions): Promise<SeedReport> {
  await archive.addUser(DEMO_IMPORTER);
  await archive.addUser(DEMO_REVIEWER);
  options.onProgress?.(`Importing ${files.length} demo files…`);
  const outcomes = await archive.importFiles(files, DEMO_IMPORTER, {
    defaultFieldName: 'Harrow Flats',
    onProgress: (done, total) => options.onProgress?.(`Importing demo files: ${done} of ${total}`),
  });
  const imported = outcomes
    .map((o, i) => ({ outcome: o, file: files[i] }))
    .filter((x) => x.outcome.status === 'imported' && x.outcome.testId);
  const report: SeedReport = { outcomes, accepted: [], rejected: [], inReview: [] };
  const planned = new Map<string, { review: NonNullable<DemoManifestEntry['review']>; reason?: string }>();
  const fromManifest = manifest?.some((e) => e.review) ?? false;
  if (fromManifest) {
    for (const { outcome, file } of imported) {
      const entry = manifest!.find((e) => e.file === file.relativePath || e.file === file.name);
      if (entry?.review) planned.set(outcome.testId!, { review: entry.review, reason: entry.reason });
    }
  } else if (imported.length > 0) {
    const summaries = await archive.listTests();
    const gradeOf = new Map(summaries.map((s) => [s.id, s.grade]));
    const ordered = [...imported].sort((a, b) => a.file.name.localeCompare(b.file.name));
    const worst = [...ordered].sort((a, b) => (gradeOf.get(b.outcome.testId!) ?? 'A').localeCompare(gradeOf.get(a.outcome.testId!) ?? 'A'))[0];
    if (ordered.length >= 3) planned.set(worst.outcome.testId!, { review: 'rejected', reason: await rejectionReason(archive, worst.outcome.testId!) });
    let index = 0;
    for (const { outcome } of ordered) {
      if (planned.has(outcome.testId!)) continue;
      if (index % 3 === 0) planned.set(outcome.testId!, { review: 'accepted' });
      else if (index % 3 === 1) planned.set(outcome.testId!, { review: 'in-review' });
      index += 1;
    }
  }
  for (const [testId, plan] of planned) {
    if (plan.review === 'imported') continue;
    if (plan.review === 'rejected') {
      await archive.reject(testId, DEMO_REVIEWER, plan.reason ?? 'Record does not meet the project criteria.');
      report.rejected.push(testId);
      continue;
    }
    await archive.requestReview(testId, DEMO_IMPORTER, 'Picks checked against the daily drilling report.');
    if (plan.review === 'accepted') {
      await archive.signOff(testId, DEMO_REVIEWER, 'Picks and criteria agreed.');
      report.accepted.push(testId);
    } else {
      await archive.comment(testId, DEMO_REVIEWER, 'Looking at the closure picks before signing.');
      report.inReview.push(testId);
    }
  }
  options.onProgress?.('Demo archive ready.');
  return report;
}

async function rejectionReason(archive: ArchiveService, testId: string): Promise<string> {
  const fallback = 'Record does not meet the project criteria; repeat the test at the next opportunity.';
  try {
    const failed = (await archive.getTest(testId)).analysis.quality.criteria.find((c) => c.pass === false);
    return failed ? `Fails a project criterion: ${failed.message}` : fallback;
  } catch {
    return fallback;
  }
}
