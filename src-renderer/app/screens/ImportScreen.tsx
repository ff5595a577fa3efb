import { useCallback, useEffect, useRef, useState } from 'react';
import type { ImportOutcome } from '../../archive/api';
import type { PickedFile } from '../../bridge/types';
import { isEngineError } from '../../engine/errors';
import { TEST_TYPES, type ColumnMapping, type TestType } from '../../engine/record';
import { useApp } from '../context';
import { displayDigits, formatNumber, formatQuantity, unitLabel } from '../format/units';
import {
  applySavedMapping, columnOverrides, EDITABLE_METADATA, mappingChanged, metadataOverrides, metadataText,
  summariseOutcomes, type BatchSummary, type MetadataEdits,
} from '../state/importBatch';
import type { ImportPreview } from '../workers/engineCalls';
import { takePendingCommand } from '../state/pendingCommand';

type ItemStatus = 'reading' | 'ready' | 'unreadable' | 'importing' | 'imported' | 'duplicate' | 'failed';

interface ImportItem {
  key: string;
  file: PickedFile;
  status: ItemStatus;
  preview?: ImportPreview;
  error?: { message: string; line?: number; column?: number };
  detected: ColumnMapping[];
  columns: ColumnMapping[];
  savedBy?: string;
  remember: boolean;
  edits: MetadataEdits;
  testType: TestType | '';
  outcome?: ImportOutcome;
}

const ROLES: ColumnMapping['role'][] = ['time', 'timestamp', 'pressure', 'rate', 'volume', 'depth', 'other'];
const ROLE_WORDS: Record<ColumnMapping['role'], string> = {
  time: 'Elapsed time', timestamp: 'Clock time', pressure: 'Pressure', rate: 'Pump rate', volume: 'Volume', depth: 'Depth', other: 'Not used',
};
const STATUS_WORDS: Record<ItemStatus, { glyph: string; words: string }> = {
  reading: { glyph: '…', words: 'Reading' }, ready: { glyph: '○', words: 'Ready to import' },
  unreadable: { glyph: '✕', words: 'Cannot be read' }, importing: { glyph: '…', words: 'Importing' },
  imported: { glyph: '✔', words: 'Entered in the archive' }, duplicate: { glyph: '≡', words: 'Already in the archive' },
  failed: { glyph: '✕', words: 'Failed' },
};

/**
 * Words of the import button: only the readable files count as imported; the unreadable ones
 * are named beside them (they are still passed to the archive, so the batch summary reports
 * each with its line and column, and nothing of them is stored).
 */
export function importButtonWords(readable: number, unreadable: number): string {
  const cannot = unreadable > 0 ? ` (${unreadable} cannot be read)` : '';
  if (readable === 0) return unreadable > 0 ? `Nothing readable to import${cannot}` : 'Nothing left to import';
  return `Import ${readable} file${readable === 1 ? '' : 's'}${cannot}`;
}

/** A file is ready when the full read succeeded; otherwise its problem is shown with its place. */
function statusOfPreview(p: ImportPreview): Pick<ImportItem, 'status' | 'error'> {
  if (p.parsed) return { status: 'ready', error: undefined };
  const e = p.parseError;
  return { status: 'unreadable', error: e ? { message: e.message, line: e.line, column: e.column } : { message: 'The file could not be read.' } };
}

function describeError(e: unknown): ImportItem['error'] {
  if (isEngineError(e)) return { message: e.message, line: e.location.line, column: e.location.column };
  return { message: e instanceof Error ? e.message : String(e) };
}

export function ImportScreen() {
  const { archive, bridge, engine, user, units, navigate } = useApp();
  const [items, setItems] = useState<ImportItem[]>([]);
  const [selectedKey, setSelectedKey] = useState<string | null>(null);
  const [progress, setProgress] = useState<{ done: number; total: number; label: string } | null>(null);
  const [summary, setSummary] = useState<BatchSummary | null>(null);
  const [over, setOver] = useState(false);
  const [busy, setBusy] = useState(false);
  const counter = useRef(0);

  const update = useCallback((key: string, change: Partial<ImportItem> | ((i: ImportItem) => Partial<ImportItem>)) => {
    setItems((list) => list.map((i) => (i.key === key ? { ...i, ...(typeof change === 'function' ? change(i) : change) } : i)));
  }, []);

  const readFiles = useCallback(async (files: PickedFile[]) => {
    if (files.length === 0) return;
    setSummary(null);
    const added: ImportItem[] = files.map((file) => ({
      key: `f${++counter.current}`, file, status: 'reading', detected: [], columns: [], remember: true, edits: {}, testType: '',
    }));
    setItems((list) => [...list.filter((i) => i.status !== 'imported' && i.status !== 'duplicate'), ...added]);
    setSelectedKey((k) => k ?? added[0].key);
    setBusy(true);
    for (let n = 0; n < added.length; n++) {
      const item = added[n];
      setProgress({ done: n, total: added.length, label: `Reading ${item.file.name}` });
      try {
        let preview = await engine.preview(item.file.bytes, item.file.name);
        const saved = await archive.getMapping(preview.table.layout);
        const detected = preview.table.columns;
        let columns = applySavedMapping(detected, saved);
        if (saved && mappingChanged(detected, columns)) {
          preview = await engine.preview(item.file.bytes, item.file.name, { columns: columnOverrides(columns) });
          columns = applySavedMapping(preview.table.columns, saved);
        }
        update(item.key, { ...statusOfPreview(preview), preview, detected, columns, savedBy: saved?.savedBy });
      } catch (e) {
        update(item.key, { status: 'unreadable', error: describeError(e) });
      }
    }
    setProgress(null);
    setBusy(false);
  }, [archive, engine, update]);

  const openFiles = useCallback(async () => readFiles(await bridge.openFiles({ multiple: true })), [bridge, readFiles]);
  const openFolder = useCallback(async () => readFiles(await bridge.openFolder()), [bridge, readFiles]);

  useEffect(() => bridge.onFilesDropped((files) => { void readFiles(files); }), [bridge, readFiles]);
  useEffect(() => {
    const c = takePendingCommand();
    if (c === 'open-files') void openFiles();
    if (c === 'open-folder') void openFolder();
  }, [openFiles, openFolder]);
  useEffect(() => bridge.onMenuCommand((c) => {
    if (c === 'open-files') void openFiles();
    if (c === 'open-folder') void openFolder();
  }), [bridge, openFiles, openFolder]);

  const recheck = async (item: ImportItem) => {
    try {
      const preview = await engine.preview(item.file.bytes, item.file.name, { columns: columnOverrides(item.columns) });
      update(item.key, { preview, ...statusOfPreview(preview) });
    } catch (e) {
      update(item.key, { status: 'unreadable', error: describeError(e) });
    }
  };

  const runImport = async () => {
    const todo = items.filter((i) => i.status === 'ready' || i.status === 'unreadable' || i.status === 'failed');
    if (todo.length === 0) return;
    setBusy(true);
    const outcomes: ImportOutcome[] = [];
    for (let n = 0; n < todo.length; n++) {
      const item = todo[n];
      setProgress({ done: n, total: todo.length, label: `Importing ${item.file.name}` });
      update(item.key, { status: 'importing' });
      const { overrides, problems } = metadataOverrides(item.edits, units, item.testType);
      let outcome: ImportOutcome;
      if (problems.length) {
        outcome = { fileName: item.file.name, status: 'failed', error: { code: 'bad-metadata', message: problems.join(' ') } };
      } else {
        try {
          const edited = item.preview ? mappingChanged(item.detected, item.columns) : false;
          [outcome] = await archive.importFiles([{ name: item.file.name, relativePath: item.file.relativePath, bytes: item.file.bytes }], user, {
            type: item.testType || undefined,
            overrides,
            parseOptions: item.columns.length ? { columns: columnOverrides(item.columns) } : undefined,
          });
          if (outcome.status === 'imported' && item.preview && item.remember && (edited || !item.savedBy)) {
            await archive.saveMapping({ layout: item.preview.table.layout, columns: item.columns, contractor: overrides.contractor ?? item.preview.table.metadata.contractor, savedBy: user });
          }
        } catch (e) {
          outcome = { fileName: item.file.name, status: 'failed', error: { code: 'import', message: e instanceof Error ? e.message : String(e) } };
        }
      }
      outcomes.push(outcome);
      update(item.key, { status: outcome.status, outcome, error: outcome.error ? { message: outcome.error.message, line: outcome.error.line, column: outcome.error.column } : undefined });
    }
    setProgress({ done: todo.length, total: todo.length, label: 'Done' });
    setSummary(summariseOutcomes(outcomes));
    setBusy(false);
    setTimeout(() => setProgress(null), 600);
  };

  const selected = items.find((i) => i.key === selectedKey) ?? null;
  const readable = items.filter((i) => i.status === 'ready').length;
  const unreadable = items.filter((i) => i.status === 'unreadable').length;

  return (
    <div className="page" data-testid="screen-import"
      onDragOver={(e) => { e.preventDefault(); setOver(true); }} onDragLeave={() => setOver(false)} onDrop={() => setOver(false)}>
      <div className="page-head">
        <div><h1>Import</h1><p className="sub">Contractor reports: CSV or text (comma, semicolon or tab), XLSX workbooks, LAS 2.0.</p></div>
      </div>
      <div className={`drop${over ? ' over' : ''}`} data-testid="drop-zone">
        <p><b>Drop files or a folder anywhere on this window</b>, or</p>
        <div className="row" style={{ justifyContent: 'center' }}>
          <button className="btn primary" type="button" onClick={() => void openFiles()} disabled={busy} data-testid="open-files">Open files…</button>
          <button className="btn" type="button" onClick={() => void openFolder()} disabled={busy} data-testid="open-folder">Open a folder…</button>
        </div>
      </div>

      {progress && (
        <div className="panel tight" aria-live="polite" data-testid="import-progress">
          <div className="row"><span>{progress.label}</span><span className="spacer" /><span>{progress.done} of {progress.total}</span></div>
          <div className="progress" role="progressbar" aria-valuemin={0} aria-valuemax={progress.total} aria-valuenow={progress.done}>
            <div style={{ width: `${progress.total ? (100 * progress.done) / progress.total : 0}%` }} />
          </div>
        </div>
      )}

      {summary && (
        <div className={`notice${summary.failed ? ' warn' : ''}`} data-testid="import-summary" role="status">
          <p><b>Batch finished:</b> <span data-testid="summary-entered">{summary.entered}</span> entered,{' '}
            <span data-testid="summary-duplicates">{summary.duplicates}</span> already in the archive (duplicates),{' '}
            <span data-testid="summary-failed">{summary.failed}</span> failed.</p>
          {summary.failures.length > 0 && (
            <table className="plain" data-testid="summary-failures">
              <thead><tr><th>Where</th><th>Why</th></tr></thead>
              <tbody>{summary.failures.map((f) => <tr key={f.fileName + f.where}><td className="mono">{f.where}</td><td>{f.message}</td></tr>)}</tbody>
            </table>
          )}
          <div className="row" style={{ marginTop: 8 }}><button className="btn" type="button" onClick={() => navigate({ screen: 'archive' })}>Go to the archive</button></div>
        </div>
      )}

      {items.length > 0 && (
        <div className="import-layout">
          <div className="panel tight stack">
            <div className="row"><h2 style={{ margin: 0 }}>Files ({items.length})</h2><span className="spacer" />
              <button className="btn primary" type="button" onClick={() => void runImport()} disabled={busy || readable === 0} data-testid="import-run">
                {importButtonWords(readable, unreadable)}
              </button>
            </div>
            <div className="file-list" role="listbox" aria-label="Files">
              {items.map((i) => (
                <button key={i.key} type="button" className="file-item" role="option" aria-selected={i.key === selectedKey}
                  onClick={() => setSelectedKey(i.key)} data-testid="import-file" data-status={i.status}>
                  <span aria-hidden="true">{STATUS_WORDS[i.status].glyph}</span>
                  <span className="name" title={i.file.relativePath}>{i.file.name}</span>
                  <span className="status">{STATUS_WORDS[i.status].words}{i.error?.line !== undefined ? ` · line ${i.error.line}` : ''}</span>
                </button>
              ))}
            </div>
          </div>
          {selected && <FileConfirmation item={selected} units={units} onChange={(c) => update(selected.key, c)} onRecheck={() => void recheck(selected)} />}
        </div>
      )}
    </div>
  );
}

function FileConfirmation({ item, units, onChange, onRecheck }: {
  item: ImportItem; units: ReturnType<typeof useApp>['units'];
  onChange: (c: Partial<ImportItem>) => void; onRecheck: () => void;
}) {
  const p = item.preview;
  const edited = p ? mappingChanged(item.detected, item.columns) : false;
  const locked = item.status === 'imported' || item.status === 'duplicate' || item.status === 'importing';
  return (
    <div className="panel stack" data-testid="file-confirmation">
      <div className="row"><h2 style={{ margin: 0 }}>{item.file.name}</h2><span className="hint">{item.file.relativePath !== item.file.name ? item.file.relativePath : ''}</span></div>
      {item.error && (
        <div className="notice bad" role="alert" data-testid="file-error">
          <b>{item.status === 'failed' ? 'Not imported.' : 'This file cannot be read as it is.'}</b> {item.error.message}
          {(item.error.line !== undefined || item.error.column !== undefined) && (
            <div className="mono">{item.error.line !== undefined ? `line ${item.error.line}` : ''}{item.error.column !== undefined ? `, column ${item.error.column}` : ''}</div>
          )}
        </div>
      )}
      {item.outcome?.status === 'duplicate' && <div className="notice">This file is already in the archive (same content); nothing was added.</div>}
      {p && (
        <>
          <p className="hint">
            {p.table.format === 'delimited' ? `Text table, ${p.table.delimiter === '\t' ? 'tab' : `"${p.table.delimiter ?? ','}"`} separated, decimal ${p.table.decimalMark === ',' ? 'comma' : 'point'}` : p.table.format.toUpperCase()}
            {p.table.sheet ? ` · sheet ${p.table.sheet}` : ''}
            {p.parsed && <>{' · '}{p.parsed.samples.toLocaleString('en-US')} samples over {formatQuantity(units, 'time', p.parsed.duration)}
              {p.parsed.derived.rate ? ' · rate derived from volume' : ''}{p.parsed.derived.volume ? ' · volume integrated from rate' : ''}</>}
          </p>
          {item.savedBy && <div className="notice">Using the column mapping saved for this contractor layout by {item.savedBy}.</div>}
          <h3>Columns: check what each one holds and its unit</h3>
          <table className="plain" data-testid="column-table">
            <thead><tr><th>#</th><th>Header in the file</th><th>Holds</th><th>Unit</th><th>Unit from</th></tr></thead>
            <tbody>
              {item.columns.map((c, n) => (
                <tr key={c.index}>
                  <td>{c.index + 1}</td>
                  <td className="mono">{c.header || <span className="hint">(no header)</span>}</td>
                  <td>
                    <select value={c.role} disabled={locked} aria-label={`What column ${c.index + 1} holds`} data-testid={`column-role-${c.index}`}
                      onChange={(e) => onChange({ columns: item.columns.map((x, k) => (k === n ? { ...x, role: e.target.value as ColumnMapping['role'] } : x)) })}>
                      {ROLES.map((r) => <option key={r} value={r}>{ROLE_WORDS[r]}</option>)}
                    </select>
                  </td>
                  <td>
                    <input type="text" value={c.unit} disabled={locked} size={9} aria-label={`Unit of column ${c.index + 1}`} data-testid={`column-unit-${c.index}`}
                      onChange={(e) => onChange({ columns: item.columns.map((x, k) => (k === n ? { ...x, unit: e.target.value } : x)) })} />
                  </td>
                  <td className="hint">{c.unitStated ? 'the file' : 'assumed'}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <div className="row">
            <button className="btn small" type="button" onClick={onRecheck} disabled={locked || !edited}>Read again with this mapping</button>
            <label className="row" style={{ gap: 6 }}>
              <input type="checkbox" checked={item.remember} disabled={locked} onChange={(e) => onChange({ remember: e.target.checked })} data-testid="remember-mapping" />
              Remember this mapping for files with the same layout
            </label>
          </div>
          <h3>First rows of the file</h3>
          <div style={{ overflowX: 'auto' }}>
            <table className="plain mono" data-testid="first-rows">
              <thead><tr>{p.table.header.map((h, k) => <th key={k}>{h}</th>)}</tr></thead>
              <tbody>{p.table.rows.slice(0, 5).map((r, k) => <tr key={k}>{r.map((c, j) => <td key={j}>{c}</td>)}</tr>)}</tbody>
            </table>
          </div>
          {p.parsed && (
            <>
              <h3>The same rows as they will be stored (converted; shown with extra decimals to check the units)</h3>
              <table className="plain">
                <thead><tr><th className="num">Time (s)</th><th className="num">Pressure at gauge</th><th className="num">Rate</th><th className="num">Volume</th></tr></thead>
                <tbody>{p.parsed.firstRows.map((r, k) => (
                  <tr key={k}><td className="num">{formatNumber(r[0], 1)}</td><td className="num">{formatQuantity(units, 'pressure', r[1], { digits: displayDigits(units, 'pressure') + 2 })}</td>
                    <td className="num">{formatQuantity(units, 'rate', r[2], { digits: displayDigits(units, 'rate') + 1 })}</td><td className="num">{formatQuantity(units, 'volume', r[3], { digits: displayDigits(units, 'volume') + 1 })}</td></tr>
                ))}</tbody>
              </table>
            </>
          )}
          {[...p.table.warnings, ...(p.parsed?.warnings ?? [])].length > 0 && (
            <div className="notice warn"><b>Read with warnings:</b><ul>{[...new Set([...p.table.warnings, ...(p.parsed?.warnings ?? [])])].map((w) => <li key={w}>{w}</li>)}</ul></div>
          )}
        </>
      )}
      <h3>Test details: correct anything the file has wrong or lacks</h3>
      <div className="meta-grid">
        <label className="field">Test type
          <select value={item.testType} disabled={locked} onChange={(e) => onChange({ testType: e.target.value as TestType | '' })} data-testid="meta-testType">
            <option value="">{p?.table.metadata.testType ? `As in the file (${p.table.metadata.testType.toUpperCase()})` : 'Infer from the record'}</option>
            {TEST_TYPES.map((t) => <option key={t} value={t}>{t.toUpperCase()}</option>)}
          </select>
        </label>
        {EDITABLE_METADATA.map((f) => {
          const fromFile = p ? metadataText(p.table.metadata, f.key, f.quantity, units) : '';
          const unit = f.quantity ? unitLabel(units, f.quantity) : '';
          return (
            <label key={f.key} className="field">{f.label}{unit ? ` (${unit})` : ''}
              <input type="text" disabled={locked} value={item.edits[f.key] ?? fromFile} data-testid={`meta-${f.key}`}
                placeholder={fromFile ? undefined : 'not in the file'}
                onChange={(e) => onChange({ edits: { ...item.edits, [f.key]: e.target.value } })} />
            </label>
          );
        })}
      </div>
    </div>
  );
}
