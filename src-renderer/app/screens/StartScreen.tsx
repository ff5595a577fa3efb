import { useEffect, useState } from 'react';
import type { ArchiveService, UserRow } from '../../archive/api';

/** Choose who is working: every change in the archive is recorded under this name. */
export function StartScreen({ archive, current, onChoose }: { archive: ArchiveService; current: string | null; onChoose: (name: string) => void }) {
  const [users, setUsers] = useState<UserRow[]>([]);
  const [name, setName] = useState('');
  const [error, setError] = useState<string | null>(null);
  useEffect(() => { void archive.listUsers().then(setUsers); }, [archive]);

  const add = async () => {
    setError(null);
    try {
      const row = await archive.addUser(name);
      onChoose(row.name);
    } catch (e) { setError(e instanceof Error ? e.message : String(e)); }
  };

  return (
    <div className="start" data-testid="screen-start">
      <div className="card">
        <h1>Stress Ledger</h1>
        <p className="hint">Archive, quality review and sign-off of borehole pressure tests.</p>
        <h2 style={{ marginTop: 18 }}>Who is working?</h2>
        <p className="hint">Your name is recorded on every pick, review and comment you make.</p>
        {users.length > 0 && (
          <div className="user-list" role="list" aria-label="Known users">
            {users.map((u) => (
              <button key={u.name} type="button" role="listitem" data-testid={`user-${u.name}`} onClick={() => onChoose(u.name)}>
                {u.name}{u.name === current ? '  (current)' : ''}
              </button>
            ))}
          </div>
        )}
        <form className="stack" onSubmit={(e) => { e.preventDefault(); void add(); }}>
          <label className="field">{users.length ? 'Or add a new user' : 'Your name'}
            <input type="text" value={name} onChange={(e) => setName(e.target.value)} placeholder="e.g. Mara Lindqvist" data-testid="new-user-name" autoFocus={users.length === 0} />
          </label>
          {error && <p className="error-text" role="alert">{error}</p>}
          <div className="row"><button className="btn primary" type="submit" disabled={!name.trim()} data-testid="add-user">Continue as this user</button></div>
        </form>
      </div>
    </div>
  );
}
