import { useCallback, useEffect, useMemo, useState } from 'react';
import type { UserRow } from '../../archive/api';
import { isArchiveError } from '../../archive/errors';
import { DEFAULT_LIMITS } from '../../engine/quality/limits';
import { useApp } from '../context';
import { Dialog, ReasonDialog } from '../components/Dialog';
import { formatLimit, formatLimitNumber, limitUnitLabel } from '../format/limitDisplay';
import { messageWords } from '../format/methodWords';
import { limitDraftChanges } from '../state/limitDraft';
import { criterionName } from './test/QualityPanel';

/** Extension of the files "Save a backup…" writes (and "Restore a backup…" opens). */
const BACKUP_EXTENSION = '.slbackup';

export function SettingsScreen() {
  const { archive, bridge, user, units, setUnits, notify } = useApp();
  const [users, setUsers] = useState<UserRow[]>([]);
  const [newUser, setNewUser] = useState('');
  const [saved, setSaved] = useState<Record<string, number>>({});
  const [draft, setDraft] = useState<Record<string, string>>({});
  const [asking, setAsking] = useState(false);
  const [regrade, setRegrade] = useState<{ done: number; total: number } | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [restoreFile, setRestoreFile] = useState<{ name: string; bytes: Uint8Array } | null>(null);
  const [restoring, setRestoring] = useState(false);
  const [backupStatus, setBackupStatus] = useState<{ ok: boolean; text: string } | null>(null);

  const reload = useCallback(async () => {
    const [userRows, settings] = await Promise.all([archive.listUsers(), archive.getSettings()]);
    setUsers(userRows);
    setSaved(settings.limits);
    return settings;
  }, [archive]);

  useEffect(() => { void reload(); }, [reload]);

  // A typed decline rate is in the units shown when it was typed: start again when they change.
  useEffect(() => { setDraft({}); }, [units]);

  const { changes: changed, errors } = useMemo(() => limitDraftChanges(draft, saved, units), [draft, saved, units]);
  const invalid = Object.keys(errors);

  const restore = async () => {
    if (!restoreFile) return;
    setRestoring(true);
    setBackupStatus(null);
    try {
      await archive.restoreBackup(restoreFile.bytes);
      const settings = await reload();
      setDraft({});
      if (settings.unitSystem !== units) setUnits(settings.unitSystem);
      const { total } = await archive.countByState();
      const text = `Backup ${restoreFile.name} restored: the archive now holds ${total} test${total === 1 ? '' : 's'}.`;
      setBackupStatus({ ok: true, text });
      notify(text);
    } catch (e) {
      const message = e instanceof Error ? e.message : String(e);
      const refused = isArchiveError(e) && (e.code === 'bad-backup' || e.code === 'backup-version');
      setBackupStatus({ ok: false, text: refused
        ? `The backup ${restoreFile.name} was refused: ${message} Nothing in the archive was changed.`
        : `The restore of ${restoreFile.name} did not finish: ${message}` });
    } finally {
      setRestoring(false);
      setRestoreFile(null);
    }
  };

  return (
    <div className="page" data-testid="screen-settings">
      <div className="page-head"><div><h1>Settings</h1><p className="sub">Units, quality limits of this project, and the people who work in it.</p></div></div>

      <section className="panel stack" aria-labelledby="units-title">
        <h2 id="units-title">Units</h2>
        <div className="row" role="radiogroup" aria-label="Unit system">
          <label className="row" style={{ gap: 6 }}><input type="radio" name="units" checked={units === 'si'} onChange={() => setUnits('si')} data-testid="settings-units-si" />SI (MPa, m, m³, m³/min, sg, kPa/m)</label>
          <label className="row" style={{ gap: 6 }}><input type="radio" name="units" checked={units === 'oilfield'} onChange={() => setUnits('oilfield')} data-testid="settings-units-oilfield" />Oilfield (psi, ft, bbl, bbl/min, ppg, psi/ft)</label>
        </div>
        <p className="hint">Values are stored in SI; this only changes how they are shown. The choice is kept in the archive.</p>
      </section>

      <section className="panel stack" aria-labelledby="limits-title">
        <div className="row"><h2 id="limits-title" style={{ margin: 0 }}>Quality limits for this project</h2><span className="spacer" />
          <button type="button" className="btn" disabled={regrade !== null} data-testid="regrade"
            onClick={async () => {
              setRegrade({ done: 0, total: 0 });
              try { const n = await archive.regradeAll((done, total) => setRegrade({ done, total })); notify(`Re-graded: ${n} grade${n === 1 ? '' : 's'} changed.`); }
              finally { setRegrade(null); }
            }}>Re-grade every test</button>
          <button type="button" className="btn primary" disabled={Object.keys(changed).length === 0 || invalid.length > 0} onClick={() => setAsking(true)} data-testid="limits-save">Save limits…</button>
        </div>
        {regrade && <div className="progress" role="progressbar" aria-valuenow={regrade.done} aria-valuemax={regrade.total}><div style={{ width: `${regrade.total ? (100 * regrade.done) / regrade.total : 5}%` }} /></div>}
        {problem && <p className="error-text" role="alert">{problem}</p>}
        <table className="plain" data-testid="limits-table">
          <thead><tr><th>Limit</th><th className="num">Default</th><th className="num">This project</th><th>Why this limit</th></tr></thead>
          <tbody>
            {DEFAULT_LIMITS.map((l) => {
              const [criterion, name] = l.key.split('.');
              const value = draft[l.key] ?? (saved[l.key] !== undefined ? formatLimitNumber(l.display, units, saved[l.key]) : '');
              const unit = limitUnitLabel(l.display, units);
              const error = errors[l.key];
              return (
                <tr key={l.key}>
                  <td><b>{criterionName(criterion)}</b><div className="hint mono">{name}</div></td>
                  <td className="num" data-testid={`limit-default-${l.key}`}>{formatLimit(l.display, units, l.value)}</td>
                  <td className="num" style={{ whiteSpace: 'nowrap' }}>
                    <input type="text" size={8} value={value} placeholder={formatLimitNumber(l.display, units, l.value)}
                      aria-label={`Project value of ${l.key}${unit ? ` in ${unit}` : ''}`} aria-invalid={error ? true : undefined}
                      aria-describedby={error ? `limit-error-${l.key}` : undefined}
                      data-testid={`limit-${l.key}`} onChange={(e) => setDraft((d) => ({ ...d, [l.key]: e.target.value }))} />
                    <span className="hint" style={{ display: 'inline-block', minWidth: '4.5em', textAlign: 'left', paddingLeft: 4 }}>{unit}</span>
                    {error && <div className="error-text" style={{ whiteSpace: 'normal' }} id={`limit-error-${l.key}`} data-testid={`limit-error-${l.key}`}>{error}</div>}
                  </td>
                  <td className="hint">{messageWords(l.rationale)}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </section>

      <section className="panel stack" aria-labelledby="users-title">
        <h2 id="users-title">Users</h2>
        <p className="hint">Everyone who has worked in this archive. You are working as <b>{user}</b>.</p>
        <ul data-testid="users-list">{users.map((u) => <li key={u.name}>{u.name} <span className="hint">since {u.createdAt.slice(0, 10)}</span></li>)}</ul>
        <form className="row" onSubmit={async (e) => {
          e.preventDefault();
          try { await archive.addUser(newUser); setNewUser(''); setUsers(await archive.listUsers()); } catch (err) { notify(err instanceof Error ? err.message : String(err)); }
        }}>
          <input type="text" value={newUser} onChange={(e) => setNewUser(e.target.value)} placeholder="New user's name" aria-label="New user's name" data-testid="settings-new-user" />
          <button type="submit" className="btn" disabled={!newUser.trim()}>Add user</button>
        </form>
      </section>

      <section className="panel stack" aria-labelledby="backup-title">
        <h2 id="backup-title">Backup</h2>
        <p className="hint">The whole archive as one file: tests, raw files, picks and the full review log. Restoring a backup replaces the whole archive with it.</p>
        <div className="row">
          <button type="button" className="btn" data-testid="save-backup" onClick={async () => {
            const bytes = await archive.exportBackup();
            const name = await bridge.saveFile(`stress-ledger-backup-${new Date().toISOString().slice(0, 10)}${BACKUP_EXTENSION}`, bytes, 'application/octet-stream');
            if (name) notify(`Backup saved as ${name}.`);
          }}>Save a backup…</button>
          <button type="button" className="btn" data-testid="restore-backup" disabled={restoring} onClick={async () => {
            setBackupStatus(null);
            try {
              const [file] = await bridge.openFiles({ accept: [BACKUP_EXTENSION], multiple: false });
              if (file) setRestoreFile({ name: file.name, bytes: file.bytes });
            } catch (e) {
              setBackupStatus({ ok: false, text: `The file could not be read: ${e instanceof Error ? e.message : String(e)}` });
            }
          }}>Restore a backup…</button>
        </div>
        {backupStatus && (backupStatus.ok
          ? <p role="status" data-testid="backup-status">{backupStatus.text}</p>
          : <p className="error-text" role="alert" data-testid="backup-error">{backupStatus.text}</p>)}
      </section>

      {restoreFile && (
        <Dialog title="Replace the archive with this backup?" testId="restore-dialog" onClose={() => { if (!restoring) setRestoreFile(null); }}>
          <p>The current archive will be replaced by the backup <b>{restoreFile.name}</b>: every test, raw file, pick, user,
            project setting and review-log entry now in this archive is removed and the backup&apos;s take their place.</p>
          <p className="hint">Save a backup of the current archive first if you may need it again. A damaged file is refused and changes nothing.</p>
          <div className="actions">
            <button className="btn" type="button" disabled={restoring} onClick={() => setRestoreFile(null)}>Cancel</button>
            <button className="btn danger" type="button" disabled={restoring} data-testid="restore-confirm" onClick={() => { void restore(); }}>
              {restoring ? 'Restoring…' : 'Replace the archive'}</button>
          </div>
        </Dialog>
      )}

      {asking && (
        <ReasonDialog title="Change the project's quality limits" confirmLabel="Save limits"
          explanation="Grades of every test change with these limits. The change and its reason go into the review log."
          onConfirm={async (reason) => {
            setProblem(null);
            const next = await archive.setLimits({ ...saved, ...changed }, user, reason);
            setSaved(next.limits); setDraft({}); notify('Limits saved. Re-grade to update the archive list.');
          }}
          onClose={() => setAsking(false)} />
      )}
    </div>
  );
}
