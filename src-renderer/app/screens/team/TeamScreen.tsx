import { useCallback, useEffect, useState } from 'react';
import type { ApplyOutcome, TeamConflict, TestSummary } from '../../../archive/api';
import type { SyncStatus } from '../../../archive/journal/sync-status';
import type { TeamSyncState } from '../../../archive/team-sync';
import { isEngineError } from '../../../engine/errors';
import { SafetyNote } from '../../components/Badges';
import { useApp } from '../../context';
import { eventTime } from '../../state/logWords';
import { formatQuantity } from '../../format/units';
import { bundleFileName, conflictKindWords, conflictSideWords, deviceWords, outcomeLines, plainSummary } from '../../state/teamWords';
import { ConflictDialog } from './ConflictDialog';

/** When this device last exchanged a bundle (web build: the only way of syncing). */
const LAST_BUNDLE_KEY = 'stress-ledger.last-bundle-exchange';

function lastBundleExchange(): string | null {
  try { return globalThis.localStorage?.getItem(LAST_BUNDLE_KEY) || null; } catch { return null; }
}
function rememberBundleExchange(iso: string): void {
  try { globalThis.localStorage?.setItem(LAST_BUNDLE_KEY, iso); } catch { /* not kept */ }
}

type ImportResult =
  | { kind: 'applied'; fileName: string; outcome: ApplyOutcome }
  | { kind: 'refused'; fileName: string; message: string };

/**
 * Working as a team without a server: team bundles (both builds), conflicts to decide,
 * the sync status (what is waiting, who changed what) and, in the desktop app, the shared
 * team folder. A screen of its own rather than a part of Settings, because conflicts need
 * a place people come back to, and the import result and sync status are day-to-day work.
 */
export function TeamScreen() {
  const { archive, bridge, user, units, navigate, notify, teamSync, teamFolder, setTeamFolder } = useApp();
  const [conflicts, setConflicts] = useState<TeamConflict[] | null>(null);
  const [tests, setTests] = useState<Map<string, TestSummary>>(new Map());
  const [status, setStatus] = useState<SyncStatus | null>(null);
  const [syncState, setSyncState] = useState<TeamSyncState | null>(() => teamSync?.state() ?? null);
  const [result, setResult] = useState<ImportResult | null>(null);
  const [busy, setBusy] = useState<'export' | 'import' | 'sync' | null>(null);
  const [deciding, setDeciding] = useState<TeamConflict | null>(null);
  const [lastBundle, setLastBundle] = useState<string | null>(() => lastBundleExchange());
  const folderBridge = bridge.teamFolder;

  useEffect(() => {
    if (!teamSync) return;
    return teamSync.subscribe(setSyncState);
  }, [teamSync]);
  const shownSync = teamSync ? syncState ?? teamSync.state() : null;

  const reachable = shownSync ? shownSync.reachable : null;
  const load = useCallback(async () => {
    const [c, list, s] = await Promise.all([archive.conflicts(), archive.listTests(), archive.syncStatus(user, { folderReachable: reachable })]);
    setConflicts(c);
    setTests(new Map(list.map((t) => [t.id, t])));
    setStatus(s);
  }, [archive, user, reachable]);

  useEffect(() => {
    let alive = true;
    const run = () => { void load().catch((e: unknown) => { if (alive) notify(e instanceof Error ? e.message : String(e)); }); };
    run();
    const off = archive.subscribe(run);
    return () => { alive = false; off(); };
  }, [archive, load, notify]);

  const knownLabel = (id: string): string | null => {
    const t = tests.get(id);
    return t ? `${t.wellName} ${t.type.toUpperCase()}${t.depthTvd !== null ? ` at ${formatQuantity(units, 'depth', t.depthTvd, { digits: 0 })} TVD` : ''}` : null;
  };
  const testLabel = (id: string) => knownLabel(id) ?? `test ${id}`;
  const plain = (summary: string) => plainSummary(summary, knownLabel);

  const exportBundle = async () => {
    setBusy('export');
    try {
      const [bytes, fields] = await Promise.all([archive.exportBundle(user), archive.listFields()]);
      const name = await bridge.saveFile(bundleFileName(fields.map((f) => f.name), new Date()), bytes, 'application/octet-stream');
      if (name) {
        const now = new Date().toISOString();
        rememberBundleExchange(now); setLastBundle(now);
        notify(`Team bundle saved as ${name}.`);
      }
      await load();
    } catch (e) {
      notify(`The team bundle could not be written: ${e instanceof Error ? e.message : String(e)}`);
    } finally { setBusy(null); }
  };

  const importBundle = async () => {
    const files = await bridge.openFiles({ accept: ['slbundle'], multiple: false });
    const file = files[0];
    if (!file) return;
    setBusy('import'); setResult(null);
    try {
      const outcome = await archive.importBundle(file.bytes, file.name);
      const now = new Date().toISOString();
      rememberBundleExchange(now); setLastBundle(now);
      setResult({ kind: 'applied', fileName: file.name, outcome });
      notify(outcome.added ? `Bundle taken in: ${outcome.added} new change${outcome.added === 1 ? '' : 's'}.` : 'Bundle taken in: nothing new.');
    } catch (e) {
      const message = isEngineError(e) && e.code === 'bad-bundle' ? e.message : e instanceof Error ? e.message : String(e);
      setResult({ kind: 'refused', fileName: file.name, message });
    } finally { setBusy(null); }
  };

  const syncNow = async () => {
    if (!teamSync) return;
    setBusy('sync');
    try {
      const s = await teamSync.syncNow();
      notify(s.lastError ? `Sync did not finish: ${s.lastError}` : 'Team folder synced.');
    } finally { setBusy(null); }
  };

  const chooseFolder = async () => {
    if (!folderBridge) return;
    const folder = await folderBridge.chooseTeamFolder();
    if (folder) { setTeamFolder(folder); notify(`Team folder set: ${folder}.`); }
  };

  const waiting = shownSync ? shownSync.waiting : status?.waiting.length ?? 0;
  const lastSync = shownSync ? shownSync.lastSync : lastBundle;

  return (
    <div className="page" data-testid="screen-team">
      <div className="page-head">
        <div>
          <h1>Team</h1>
          <p className="sub">Share the review log with other engineers without a server: team bundles, {folderBridge ? 'the shared team folder, ' : ''}conflicts to decide, and who changed what.</p>
        </div>
      </div>

      <section className="panel stack" aria-labelledby="sync-title" data-testid="sync-status">
        <h2 id="sync-title">Sync status</h2>
        <div className="team-facts">
          <div><span className="hint">Your changes waiting to sync</span><b data-testid="sync-waiting-count">{waiting.toLocaleString('en-US')}</b>
            <span className="hint">{folderBridge && teamFolder ? 'written to the team folder when it can be reached' : 'carried by the next bundle you export'}</span></div>
          <div><span className="hint">Last sync</span><b data-testid="sync-last-sync">{lastSync ? eventTime(lastSync) : 'never'}</b>
            <span className="hint">{shownSync ? 'team folder' : 'last bundle exported or imported here'}</span></div>
          <div><span className="hint">Team folder</span>
            <b data-testid="sync-reachable" data-reachable={reachable === null ? 'unknown' : String(reachable)}>
              {!folderBridge ? 'not used in the browser' : !teamFolder ? 'none chosen' : reachable === null ? 'checking…' : reachable ? 'reachable' : 'cannot be reached'}
            </b>
            <span className="hint">{shownSync?.lastError ? `Last problem: ${shownSync.lastError}` : reachable === false ? 'your changes wait here and nothing is lost' : '\u00a0'}</span></div>
          <div><span className="hint">Open conflicts</span><b data-testid="sync-conflict-count">{conflicts?.length ?? '…'}</b><span className="hint">decided by a person, never guessed</span></div>
        </div>
        {shownSync && shownSync.issues.length > 0 && (
          <div className="notice warn" data-testid="sync-issues">{shownSync.issues.map((i) => <div key={`${i.kind}:${i.message}`}>{i.message}</div>)}</div>
        )}
        <h3>Who changed what, and when</h3>
        <table className="plain" data-testid="sync-people">
          <thead><tr><th>Person</th><th>Computers</th><th className="num">Changes</th><th>Last change</th><th>When</th></tr></thead>
          <tbody>
            {(status?.people ?? []).map((p) => (
              <tr key={p.author} data-testid="sync-person" data-person={p.author}>
                <td><b>{p.author}</b>{p.author === user ? <span className="hint"> (you)</span> : null}</td>
                <td className="hint">{p.devices.map(deviceWords).join(', ')}</td>
                <td className="num">{p.events.toLocaleString('en-US')}</td>
                <td>{plain(p.lastSummary)}</td>
                <td className="hint">{eventTime(p.lastTime)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>

      <section className="panel stack" aria-labelledby="conflicts-title">
        <h2 id="conflicts-title">Conflicts to decide</h2>
        {conflicts === null ? <p className="hint">Loading…</p> : conflicts.length === 0
          ? <p className="hint" data-testid="conflict-none">No open conflicts: every change taken in so far fits with the others.</p>
          : (
            <ul className="conflicts" data-testid="conflict-list">
              {conflicts.map((c) => (
                <li key={c.id} className="conflict" data-testid={`conflict-item-${c.id}`} data-conflict-kind={c.kind}>
                  <div className="row">
                    <b>{testLabel(c.testId)}</b>
                    {c.slot ? <span className="hint">{plain(`the ${c.slot.kind} pick`).replace(/^the /, '')} of cycle {c.slot.cycle}</span> : null}
                    <span className="spacer" />
                    <button type="button" className="btn small" onClick={() => navigate({ screen: 'test', testId: c.testId })}>Open test</button>
                    <button type="button" className="btn small primary" data-testid={`conflict-decide-${c.id}`} onClick={() => setDeciding(c)}>Decide…</button>
                  </div>
                  <p>{conflictKindWords(c.kind)}</p>
                  <div className="conflict-sides">
                    {c.events.map((e) => {
                      const w = conflictSideWords(e);
                      return (
                        <div key={e.id} className="conflict-side" data-testid="conflict-side">
                          <div><b>{w.who}</b> <span className="hint">on {w.where}, {w.when}</span></div>
                          <div>{plain(w.what)}</div>
                        </div>
                      );
                    })}
                  </div>
                </li>
              ))}
            </ul>
          )}
      </section>

      <section className="panel stack" aria-labelledby="bundles-title">
        <h2 id="bundles-title">Team bundles</h2>
        <p className="hint">A bundle is one file with every journal and raw file of this archive, sealed with a SHA-256 checksum. Send it any way you like; importing it on another computer merges it. Importing the same bundle twice changes nothing; a damaged bundle is refused whole.</p>
        <div className="row">
          <button type="button" className="btn primary" data-testid="bundle-export" disabled={busy !== null} onClick={() => void exportBundle()}>Export team bundle…</button>
          <button type="button" className="btn" data-testid="bundle-import" disabled={busy !== null} onClick={() => void importBundle()}>Import team bundle…</button>
          {busy === 'import' && <span className="hint" aria-busy="true">Checking and merging the bundle…</span>}
        </div>
        {result && (
          <div className={`notice${result.kind === 'refused' ? ' bad' : ''}`} role={result.kind === 'refused' ? 'alert' : 'status'}
            data-testid="bundle-import-result" data-result={result.kind}>
            {result.kind === 'refused'
              ? <><b>Bundle refused: nothing was imported.</b> <span data-testid="bundle-refused-message">{result.message}</span></>
              : (
                <>
                  <b>Bundle {result.fileName} taken in.</b>
                  <ul className="outcome">
                    {outcomeLines(result.outcome).map((l) => <li key={l.key} data-testid={`bundle-outcome-${l.key}`} data-tone={l.tone}>{l.text}</li>)}
                  </ul>
                </>
              )}
          </div>
        )}
      </section>

      <section className="panel stack" aria-labelledby="folder-title" data-testid="team-folder">
        <h2 id="folder-title">Shared team folder</h2>
        {!folderBridge
          ? <p data-testid="team-folder-web">The shared team folder is a feature of the desktop app. In the browser, share your work with team bundles (above).</p>
          : (
            <>
              <p className="hint">A folder every engineer can reach (a network drive or a synced folder). Each person and computer adds to its own journal file; nobody overwrites anybody. The folder is not a backup.</p>
              <div className="row">
                <span>Folder: <b className="mono" data-testid="team-folder-path">{teamFolder ?? 'none chosen'}</b></span>
                <span className="spacer" />
                <button type="button" className="btn" data-testid="team-folder-choose" onClick={() => void chooseFolder()}>{teamFolder ? 'Choose another folder…' : 'Choose team folder…'}</button>
                {teamFolder && <button type="button" className="btn" onClick={() => setTeamFolder(null)} data-testid="team-folder-forget">Stop using it</button>}
                <button type="button" className="btn primary" data-testid="team-sync-now" disabled={!teamSync || busy !== null} onClick={() => void syncNow()}>Sync now</button>
              </div>
              {shownSync && <p className="hint">{shownSync.syncing ? 'Syncing…' : `Syncing as ${user} every 15 s and after every change.`}{shownSync.missingRawFiles ? ` ${shownSync.missingRawFiles} raw file(s) not here yet.` : ''}</p>}
            </>
          )}
      </section>

      <SafetyNote />
      {deciding && (
        <ConflictDialog conflict={deciding} testLabel={testLabel(deciding.testId)} plain={plain} onClose={() => setDeciding(null)}
          onDecide={async (keep, reason) => {
            await archive.resolveConflict(deciding.id, keep, user, reason);
            notify('Decision recorded in the review log.');
            await load();
          }} />
      )}
    </div>
  );
}
