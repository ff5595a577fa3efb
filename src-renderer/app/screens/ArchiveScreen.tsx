import { useCallback, useDeferredValue, useEffect, useLayoutEffect, useMemo, useRef, useState } from 'react';
import type { TestSummary } from '../../archive/api';
import type { ReviewState } from '../../archive/events';
import { GRADES } from '../../engine/result';
import { TEST_TYPES } from '../../engine/record';
import { useApp } from '../context';
import { ConflictBadge, GradeBadge, StateBadge } from '../components/Badges';
import { STATE_STYLE } from '../charts/style';
import { formatQuantity, equivalentMudDensity, fromDisplay, unitLabel } from '../format/units';
import { countByState, distinctValues, EMPTY_FILTER, filterTests, sortTests, type ListFilter, type ListSort, type SortKey } from '../state/archiveFilter';
import { scrollToRow, visibleRows } from '../state/windowing';
import { takePendingCommand } from '../state/pendingCommand';

const ROW_HEIGHT = 34;
const STATES: ReviewState[] = ['imported', 'in-review', 'accepted', 'rejected'];
const COLUMNS: { key: SortKey; label: string; num?: boolean }[] = [
  { key: 'fieldName', label: 'Field' }, { key: 'wellName', label: 'Well' }, { key: 'type', label: 'Type' },
  { key: 'depthTvd', label: 'TVD', num: true }, { key: 'shmin', label: 'Shmin', num: true }, { key: 'grade', label: 'Grade' },
  { key: 'state', label: 'Review state' }, { key: 'reviewer', label: 'Reviewer' },
];

export function ArchiveScreen() {
  const { archive, bridge, units, navigate } = useApp();
  const search = useRef<HTMLInputElement>(null);
  useEffect(() => {
    if (takePendingCommand() === 'find') search.current?.focus();
    return bridge.onMenuCommand((c) => { if (c === 'find') search.current?.focus(); });
  }, [bridge]);
  const [tests, setTests] = useState<TestSummary[] | null>(null);
  const [filter, setFilter] = useState<ListFilter>(EMPTY_FILTER);
  const [sort, setSort] = useState<ListSort>({ key: 'wellName', descending: false });
  const [selected, setSelected] = useState(0);
  // The TVD inputs keep what was typed; clearing the filters draws them afresh (empty).
  const [tvdInputs, setTvdInputs] = useState(0);
  const filtered = (Object.keys(EMPTY_FILTER) as (keyof ListFilter)[]).some((k) => filter[k] !== EMPTY_FILTER[k]);
  const deferredFilter = useDeferredValue(filter);

  useEffect(() => {
    let alive = true;
    const load = () => { void archive.listTests().then((t) => { if (alive) setTests(t); }); };
    load();
    const off = archive.subscribe(load);
    return () => { alive = false; off(); };
  }, [archive]);

  const all = useMemo(() => tests ?? [], [tests]);
  const loaded = tests !== null;
  const fields = useMemo(() => distinctValues(all, 'fieldName'), [all]);
  const reviewers = useMemo(() => distinctValues(all, 'reviewer'), [all]);
  const withoutState = useMemo(() => filterTests(all, { ...deferredFilter, state: '' }), [all, deferredFilter]);
  const counts = useMemo(() => countByState(withoutState), [withoutState]);
  const shown = useMemo(() => {
    const f = deferredFilter.state ? withoutState.filter((t) => t.state === deferredFilter.state) : withoutState;
    return sortTests(f, sort);
  }, [withoutState, deferredFilter.state, sort]);

  const body = useRef<HTMLDivElement>(null);
  const [scrollTop, setScrollTop] = useState(0);
  const [height, setHeight] = useState(500);
  useLayoutEffect(() => {
    const el = body.current;
    if (!el) return;
    const ro = new ResizeObserver(() => setHeight(el.clientHeight));
    ro.observe(el);
    setHeight(el.clientHeight);
    return () => ro.disconnect();
  }, [loaded]);
  const win = visibleRows(shown.length, ROW_HEIGHT, scrollTop, height);

  const set = <K extends keyof ListFilter>(k: K, v: ListFilter[K]) => { setFilter((f) => ({ ...f, [k]: v })); setSelected(0); };
  const toggleSort = (key: SortKey) => setSort((s) => (s.key === key ? { key, descending: !s.descending } : { key, descending: false }));
  const moveSelection = useCallback((row: number) => {
    const r = Math.max(0, Math.min(shown.length - 1, row));
    setSelected(r);
    const el = body.current;
    if (el) { const top = scrollToRow(r, ROW_HEIGHT, el.scrollTop, el.clientHeight); if (top !== el.scrollTop) el.scrollTop = top; }
  }, [shown.length]);

  return (
    <div className="page" data-testid="screen-archive">
      <div className="page-head">
        <div><h1>Archive</h1><p className="sub">{tests ? `${all.length.toLocaleString('en-US')} tests in the archive` : 'Loading…'}</p></div>
        <div className="spacer" />
        <button className="btn primary" type="button" onClick={() => navigate({ screen: 'import' })}>Import files…</button>
      </div>

      <div className="counts" role="group" aria-label="Review state">
        <button type="button" className="count-chip" aria-pressed={filter.state === ''} onClick={() => set('state', '')} data-testid="count-all">
          All <b>{withoutState.length.toLocaleString('en-US')}</b>
        </button>
        {STATES.map((s) => (
          <button key={s} type="button" className="count-chip" aria-pressed={filter.state === s} onClick={() => set('state', filter.state === s ? '' : s)} data-testid={`count-${s}`}>
            <span aria-hidden="true" style={{ color: STATE_STYLE[s].color }}>{STATE_STYLE[s].glyph}</span>{STATE_STYLE[s].words} <b>{counts[s].toLocaleString('en-US')}</b>
          </button>
        ))}
      </div>

      <div className="filters panel tight">
        <label className="field">Search by well
          <input type="search" ref={search} value={filter.wellSearch} placeholder="Well name" onChange={(e) => set('wellSearch', e.target.value)} data-testid="well-search" />
        </label>
        <label className="field">Field
          <select value={filter.field} onChange={(e) => set('field', e.target.value)} data-testid="filter-field">
            <option value="">Any field</option>{fields.map((f) => <option key={f}>{f}</option>)}
          </select>
        </label>
        <label className="field">Test type
          <select value={filter.type} onChange={(e) => set('type', e.target.value as ListFilter['type'])} data-testid="filter-type">
            <option value="">Any type</option>{TEST_TYPES.map((t) => <option key={t} value={t}>{t.toUpperCase()}</option>)}
          </select>
        </label>
        <label className="field">Grade
          <select value={filter.grade} onChange={(e) => set('grade', e.target.value as ListFilter['grade'])} data-testid="filter-grade">
            <option value="">Any grade</option>{GRADES.map((g) => <option key={g}>{g}</option>)}
          </select>
        </label>
        <label className="field">Review state
          <select value={filter.state} onChange={(e) => set('state', e.target.value as ListFilter['state'])} data-testid="filter-state">
            <option value="">Any state</option>{STATES.map((s) => <option key={s} value={s}>{STATE_STYLE[s].words}</option>)}
          </select>
        </label>
        <label className="field">Reviewer
          <select value={filter.reviewer} onChange={(e) => set('reviewer', e.target.value)} data-testid="filter-reviewer">
            <option value="">Anyone</option>{reviewers.map((r) => <option key={r}>{r}</option>)}
          </select>
        </label>
        <div className="field" role="group" aria-label={`TVD range (${unitLabel(units, 'depth')})`}>
          <span className="hint">TVD ({unitLabel(units, 'depth')})</span>
          <div className="row" style={{ gap: 4, flexWrap: 'nowrap' }} key={tvdInputs}>
            <input type="number" aria-label="TVD from" placeholder="from" min={0} style={{ width: '50%' }} data-testid="filter-tvd-from"
              onChange={(e) => set('tvdFrom', e.target.value === '' ? null : fromDisplay(units, 'depth', Number(e.target.value)))} />
            <input type="number" aria-label="TVD to" placeholder="to" min={0} style={{ width: '50%' }} data-testid="filter-tvd-to"
              onChange={(e) => set('tvdTo', e.target.value === '' ? null : fromDisplay(units, 'depth', Number(e.target.value)))} />
          </div>
        </div>
        <button type="button" className="btn" onClick={() => { setFilter(EMPTY_FILTER); setTvdInputs((n) => n + 1); setSelected(0); }} disabled={!filtered}>Clear</button>
      </div>

      <div className="grid-list" data-testid="test-list" role="grid" aria-label="Tests" aria-rowcount={shown.length + 1}>
        <div className="grid-cols grid-head" role="row" aria-rowindex={1}>
          {COLUMNS.map((c) => (
            <div key={c.key} className={c.num ? 'num' : undefined} role="columnheader"
              aria-sort={sort.key === c.key ? (sort.descending ? 'descending' : 'ascending') : 'none'}>
              <button type="button" onClick={() => toggleSort(c.key)} data-testid={`sort-${c.key}`}>
                {c.label}{c.key === 'depthTvd' ? ` (${unitLabel(units, 'depth')})` : c.key === 'shmin' ? ` (${unitLabel(units, 'pressure')} · EMW)` : ''}
                <span aria-hidden="true">{sort.key === c.key ? (sort.descending ? '▼' : '▲') : ''}</span>
              </button>
            </div>
          ))}
        </div>
        <div className="grid-body" ref={body} tabIndex={0} role="rowgroup" aria-label="Tests, use the arrow keys and Enter"
          aria-activedescendant={shown[selected] ? `test-row-${shown[selected].id}` : undefined}
          data-testid="test-list-body"
          onScroll={(e) => setScrollTop(e.currentTarget.scrollTop)}
          onKeyDown={(e) => {
            if (e.key === 'ArrowDown') { e.preventDefault(); moveSelection(selected + 1); }
            else if (e.key === 'ArrowUp') { e.preventDefault(); moveSelection(selected - 1); }
            else if (e.key === 'PageDown') { e.preventDefault(); moveSelection(selected + Math.floor(height / ROW_HEIGHT)); }
            else if (e.key === 'PageUp') { e.preventDefault(); moveSelection(selected - Math.floor(height / ROW_HEIGHT)); }
            else if (e.key === 'Home') { e.preventDefault(); moveSelection(0); }
            else if (e.key === 'End') { e.preventDefault(); moveSelection(shown.length - 1); }
            else if (e.key === 'Enter' && shown[selected]) navigate({ screen: 'test', testId: shown[selected].id });
          }}>
          {tests !== null && shown.length === 0 && (all.length === 0
            ? <div className="empty">The archive is empty. Choose <b>Import files…</b> to add contractor reports (CSV, XLSX, LAS).</div>
            : <div className="empty">No test matches these filters. <button type="button" className="btn link" onClick={() => { setFilter(EMPTY_FILTER); setTvdInputs((n) => n + 1); }}>Clear the filters</button></div>)}
          <div style={{ height: win.totalHeight, position: 'relative' }}>
            {shown.slice(win.start, win.end).map((t, i) => {
              const row = win.start + i;
              const emw = t.shmin !== null ? equivalentMudDensity(t.shmin, t.depthTvd) : null;
              return (
                <div key={t.id} id={`test-row-${t.id}`} className="grid-row grid-cols" role="row" aria-rowindex={row + 2} aria-selected={row === selected}
                  style={{ top: row * ROW_HEIGHT, height: ROW_HEIGHT }} data-testid="test-row" data-test-id={t.id}
                  onClick={() => { setSelected(row); navigate({ screen: 'test', testId: t.id }); }}>
                  <div role="gridcell">{t.fieldName}</div>
                  <div role="gridcell"><b>{t.wellName}</b></div>
                  <div role="gridcell">{t.type.toUpperCase()}{t.typeInferred ? <span className="hint" title="Type inferred from the record"> *</span> : null}</div>
                  <div role="gridcell" className="num">{formatQuantity(units, 'depth', t.depthTvd, { unit: false })}</div>
                  <div role="gridcell" className="num" title={t.shminKind ? `Shmin ${t.shminKind.replace('-', ' ')}` : undefined}>
                    {t.shmin === null ? '–' : <>{t.shminKind === 'lower-bound' ? '≥ ' : t.shminKind === 'upper-bound' ? '≤ ' : ''}{formatQuantity(units, 'pressure', t.shmin, { unit: false })}
                      {emw !== null && <span className="hint"> · {formatQuantity(units, 'emw', emw)}</span>}</>}
                  </div>
                  <div role="gridcell"><GradeBadge grade={t.grade} /></div>
                  <div role="gridcell"><StateBadge state={t.state} /> <ConflictBadge count={t.openConflicts?.length ?? 0} /></div>
                  <div role="gridcell">{t.reviewer ?? <span className="hint">–</span>}</div>
                </div>
              );
            })}
          </div>
        </div>
      </div>
      <p className="hint">Click a row or press Enter to open a test. Arrow keys move through the list. * type inferred from the record.</p>
    </div>
  );
}
