import { useEffect, useMemo, useState } from 'react';
import type { UserRow } from '../../archive/api';
import { DEFAULT_LIMITS } from '../../engine/quality/limits';
import { useApp } from '../context';
import { ReasonDialog } from '../components/Dialog';
import { criterionName, criterionNumber } from './test/QualityPanel';

const UNIT_WORDS: Record<string, string> = { '1': '', s: 's', 'Pa/s': 'Pa/s', Pa: 'Pa' };

export function SettingsScreen() {
  const { archive, bridge, user, units, setUnits, notify } = useApp();
  const [users, setUsers] = useState<UserRow[]>([]);
  const [newUser, setNewUser] = useState('');
  const [saved, setSaved] = useState<Record<string, number>>({});
  const [draft, setDraft] = useState<Record<string, string>>({});
  const [asking, setAsking] = useState(false);
  const [regrade, setRegrade] = useState<{ done: number; total: number } | null>(null);
  const [problem, setProblem] = useState<string | null>(null);

  useEffect(() => {
    void archive.listUsers().then(setUsers);
    void archive.getSettings().then((s) => setSaved(s.limits));
  }, [archive]);

  const changed = useMemo(() => {
    const out: Record<string, number> = {};
    for (const [k, text] of Object.entries(draft)) {
      const n = Number(text.replace(',', '.'));
      if (text.trim() !== '' && Number.isFinite(n)) out[k] = n;
    }
    return out;
  }, [draft]);
  const invalid = Object.entries(draft).filter(([, t]) => t.trim() !== '' && !Number.isFinite(Number(t.replace(',', '.'))));

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
              const value = draft[l.key] ?? (saved[l.key] !== undefined ? String(saved[l.key]) : '');
              return (
                <tr key={l.key}>
                  <td><b>{criterionName(criterion)}</b><div className="hint mono">{name}</div></td>
                  <td className="num">{criterionNumber(l.value)} <span className="hint">{UNIT_WORDS[l.unit] ?? l.unit}</span></td>
                  <td className="num"><input type="text" size={8} value={value} placeholder={criterionNumber(l.value)} aria-label={`Project value of ${l.key}`}
                    data-testid={`limit-${l.key}`} onChange={(e) => setDraft((d) => ({ ...d, [l.key]: e.target.value }))} /></td>
                  <td className="hint">{l.rationale}</td>
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
        <p className="hint">The whole archive as one file: tests, raw files, picks and the full review log.</p>
        <div className="row"><button type="button" className="btn" onClick={async () => {
          const bytes = await archive.exportBackup();
          const name = await bridge.saveFile(`stress-ledger-backup-${new Date().toISOString().slice(0, 10)}.slbackup`, bytes, 'application/octet-stream');
          if (name) notify(`Backup saved as ${name}.`);
        }}>Save a backup…</button></div>
      </section>

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
